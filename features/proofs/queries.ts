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

/** A file the customer picked, as a multipart part (a File on the web, a { uri, name, type } on a phone). */
export interface PickedPhoto {
  part: Blob;
  name: string;
}

/** Sends the decision as JSON, or as multipart/form-data when a change request carries a photo. */
function sendDecision(token: string, input: ProofDecisionInput, photo: PickedPhoto | null) {
  const path = `/proofs/${encodeURIComponent(token)}/decision`;
  if (!photo || input.decision !== 'changes') return apiClient.post(path, input, publicAnswer);
  const form = new FormData();
  form.append('decision', input.decision);
  form.append('comment', input.comment);
  form.append('photo', photo.part, photo.name);
  return apiClient.upload(path, form, publicAnswer);
}

export function useDecideProof(token: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ input, photo = null }: { input: ProofDecisionInput; photo?: PickedPhoto | null }) => sendDecision(token, input, photo),
    onSuccess: (answer) => client.setQueryData(proofQueries.link(token).queryKey, answer),
  });
}
