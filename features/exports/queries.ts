import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../api/client';
import { jobQueries } from '../jobs/queries';
import { cutApprovalBody } from './schema';

const approvalPath = (layoutId: string, number: number) => `/layouts/${encodeURIComponent(layoutId)}/versions/${number}`;

export const cutApprovalQueries = {
  all: ['cut-approval'] as const,
  version: (layoutId: string, number: number) =>
    queryOptions({
      queryKey: [...cutApprovalQueries.all, layoutId, number],
      queryFn: () => apiClient.get(`${approvalPath(layoutId, number)}/approval`, cutApprovalBody),
    }),
};

/** An owner releases a version for cutting without the customer's approval, with a reason. */
export function useReleaseForCutting(layoutId: string, number: number, jobId: string | undefined) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (reason: string) => apiClient.post(`${approvalPath(layoutId, number)}/release`, { reason }, cutApprovalBody),
    onSuccess: async (data) => {
      client.setQueryData(cutApprovalQueries.version(layoutId, number).queryKey, data);
      if (jobId) await client.invalidateQueries({ queryKey: jobQueries.activity(jobId).queryKey });
    },
  });
}
