import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../api/client';
import { quoteView, type QuoteBuildInput, type QuoteEditInput } from './schema';

const quoteList = z.object({ quotes: z.array(quoteView) });
const oneQuote = z.object({ quote: quoteView });

export const quoteQueries = {
  all: ['quotes'] as const,
  job: (jobId: string) => queryOptions({ queryKey: [...quoteQueries.all, 'job', jobId], queryFn: () => apiClient.get(`/jobs/${jobId}/quotes`, quoteList) }),
};

export function useBuildQuote(jobId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: QuoteBuildInput) => apiClient.post(`/jobs/${jobId}/quotes`, input, oneQuote),
    onSuccess: () => client.invalidateQueries({ queryKey: quoteQueries.job(jobId).queryKey }),
  });
}

export function useEditQuote(jobId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ quoteId, input }: { quoteId: string; input: QuoteEditInput }) => apiClient.patch(`/jobs/${jobId}/quotes/${quoteId}`, input, oneQuote),
    onSuccess: () => client.invalidateQueries({ queryKey: quoteQueries.job(jobId).queryKey }),
  });
}
