import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../api/client';
import { jobQueries } from '../jobs/queries';
import { layoutQueries } from '../layouts/queries';
import { proofSent, proofSummary, publicProofView, type ProofDecisionInput, type ProofSendInput } from './schema';

const proofList = z.object({ proofs: z.array(proofSummary) });
const publicAnswer = z.object({ proof: publicProofView });

export const proofQueries = {
  all: ['proofs'] as const,
  job: (jobId: string) =>
    queryOptions({ queryKey: [...proofQueries.all, 'job', jobId], queryFn: () => apiClient.get(`/jobs/${jobId}/proofs`, proofList) }),
  link: (token: string) =>
    queryOptions({
      queryKey: [...proofQueries.all, 'link', token],
      queryFn: () => apiClient.get(`/proofs/${encodeURIComponent(token)}`, publicAnswer),
      // A closed link stays closed: no retries against the attempt limit.
      retry: false,
    }),
};

/** After a change on the job's proofs, the job, its status, activity and layouts (a new frozen version) are fresh again. */
function useRefreshJob(jobId: string) {
  const client = useQueryClient();
  return () =>
    Promise.all([
      client.invalidateQueries({ queryKey: proofQueries.job(jobId).queryKey }),
      client.invalidateQueries({ queryKey: jobQueries.all }),
      client.invalidateQueries({ queryKey: layoutQueries.all }),
      // A draft quote travels with a sent proof.
      client.invalidateQueries({ queryKey: ['quotes'] }),
    ]);
}

export function useSendProof(jobId: string) {
  const refresh = useRefreshJob(jobId);
  return useMutation({ mutationFn: (input: ProofSendInput) => apiClient.post(`/jobs/${jobId}/proofs`, input, proofSent), onSuccess: refresh });
}

export function useRevokeProof(jobId: string) {
  const refresh = useRefreshJob(jobId);
  return useMutation({
    mutationFn: (proofId: string) => apiClient.post(`/jobs/${jobId}/proofs/${proofId}/revoke`, {}, z.object({ proof: proofSummary })),
    onSuccess: refresh,
  });
}

export function useDecideProof(token: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: ProofDecisionInput) => apiClient.post(`/proofs/${encodeURIComponent(token)}/decision`, input, publicAnswer),
    onSuccess: (answer) => client.setQueryData(proofQueries.link(token).queryKey, answer),
  });
}
