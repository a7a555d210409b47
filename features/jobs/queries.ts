import { infiniteQueryOptions, queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../api/client';
import { activityList } from './activitySchema';
import { jobListPath } from './listRequest';
import { job, jobList, type JobInput, type JobListQuery, type JobStatus, type JobUpdate } from './schema';

export const jobQueries = {
  all: ['jobs'] as const,
  list: (filters: JobListQuery = {}) =>
    infiniteQueryOptions({
      queryKey: [...jobQueries.all, 'list', filters],
      queryFn: ({ pageParam }) => apiClient.get(jobListPath(filters, pageParam), jobList),
      initialPageParam: 0,
      getNextPageParam: (_last, pages) => {
        const seen = pages.reduce((n, p) => n + p.jobs.length, 0);
        // Only the first page carries the count; later pages skip it.
        return seen < (pages[0]?.total ?? 0) ? seen : undefined;
      },
    }),
  detail: (id: string) =>
    queryOptions({ queryKey: [...jobQueries.all, 'detail', id], queryFn: () => apiClient.get(`/jobs/${id}`, z.object({ job })) }),
  activity: (id: string) =>
    queryOptions({ queryKey: [...jobQueries.all, 'activity', id], queryFn: () => apiClient.get(`/jobs/${id}/activity`, activityList) }),
};

export function useCreateJob() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: JobInput) => apiClient.post('/jobs', input, z.object({ job })),
    onSuccess: () => client.invalidateQueries({ queryKey: jobQueries.all }),
  });
}

export function useUpdateJob(id: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: JobUpdate) => apiClient.patch(`/jobs/${id}`, input, z.object({ job })),
    onSuccess: () => client.invalidateQueries({ queryKey: jobQueries.all }),
  });
}

export function useChangeJobStatus(id: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: { status: JobStatus; note?: string }) => apiClient.post(`/jobs/${id}/status`, input, z.object({ job })),
    onSuccess: () => client.invalidateQueries({ queryKey: jobQueries.all }),
  });
}
