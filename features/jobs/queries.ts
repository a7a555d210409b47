import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../api/client';
import { job, jobList, type JobInput } from './schema';

export const jobQueries = {
  all: ['jobs'] as const,
  list: () => queryOptions({ queryKey: [...jobQueries.all, 'list'], queryFn: () => apiClient.get('/jobs', jobList) }),
  detail: (id: string) =>
    queryOptions({ queryKey: [...jobQueries.all, 'detail', id], queryFn: () => apiClient.get(`/jobs/${id}`, z.object({ job })) }),
};

export function useCreateJob() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: JobInput) => apiClient.post('/jobs', input, z.object({ job })),
    onSuccess: () => client.invalidateQueries({ queryKey: jobQueries.all }),
  });
}
