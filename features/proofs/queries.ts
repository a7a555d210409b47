import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../api/client';
import { jobQueries } from '../jobs/queries';
import { layoutQueries } from '../layouts/queries';
import { proofSent, proofSummary, type ProofSendInput } from './schema';

const proofList = z.object({ proofs: z.array(proofSummary) });

export const proofQueries = {
  all: ['proofs'] as const,
  job: (jobId: string) =>
    queryOptions({ queryKey: [...proofQueries.all, 'job', jobId], queryFn: () => apiClient.get(`/jobs/${jobId}/proofs`, proofList) }),
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
