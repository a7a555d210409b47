import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { Layout } from '../../geometry';
import { ApiError, apiClient } from '../api/client';
import { jobQueries } from '../jobs/queries';
import { rememberOutlineNames, withOutlinesByName, type OutlineNames } from './outlineNames';
import { layoutDetail, layoutSummary, versionDetail } from './schema';

const layoutList = z.object({ layouts: z.array(layoutSummary) });
const draftSaved = z.object({ draftRevision: z.number().int(), repairs: z.array(z.string()), outlineRefs: z.record(z.string(), z.string()).default({}) });
const versionFrozen = z.object({ number: z.number().int() });

export const layoutQueries = {
  all: ['layouts'] as const,
  job: (jobId: string) =>
    queryOptions({ queryKey: [...layoutQueries.all, 'job', jobId], queryFn: () => apiClient.get(`/jobs/${jobId}/layouts`, layoutList) }),
  detail: (id: string) =>
    queryOptions({ queryKey: [...layoutQueries.all, 'detail', id], queryFn: () => apiClient.get(`/layouts/${id}`, layoutDetail) }),
  version: (id: string, number: number) =>
    queryOptions({
      queryKey: [...layoutQueries.all, 'detail', id, 'version', number],
      queryFn: () => apiClient.get(`/layouts/${id}/versions/${number}`, versionDetail),
      // A frozen version never changes.
      staleTime: Infinity,
    }),
};

export function useCreateLayout(jobId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => apiClient.post(`/jobs/${jobId}/layouts`, { name }, layoutDetail),
    onSuccess: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: layoutQueries.job(jobId).queryKey }),
        client.invalidateQueries({ queryKey: jobQueries.activity(jobId).queryKey }),
      ]),
  });
}

/**
 * Saves a draft; a 409 ApiError means someone else saved since `baseRevision`.
 * Outlines the server already holds go by name (`names`); should it no longer
 * hold one, the save is sent once more with every point, and the names it
 * answers are noted for the next save.
 */
export async function saveDraft(id: string, layout: Layout, baseRevision: number, names: OutlineNames = new WeakMap()) {
  const put = (document: unknown) => apiClient.put(`/layouts/${id}/draft`, { document, baseRevision }, draftSaved);
  const saved = await put(withOutlinesByName(layout, names)).catch((error: unknown) => {
    if (error instanceof ApiError && error.code === 'outline_unknown') return put(layout);
    throw error;
  });
  rememberOutlineNames(names, layout, saved.outlineRefs);
  return saved;
}

export function useFreezeVersion(id: string, jobId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: { baseRevision: number; note?: string }) => apiClient.post(`/layouts/${id}/versions`, input, versionFrozen),
    onSuccess: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: layoutQueries.detail(id).queryKey }),
        client.invalidateQueries({ queryKey: layoutQueries.job(jobId).queryKey }),
        client.invalidateQueries({ queryKey: jobQueries.activity(jobId).queryKey }),
      ]),
  });
}
