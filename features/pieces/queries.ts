import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../api/client';
import { jobQueries } from '../jobs/queries';
import { photoResponse, pieceList, pieceResponse, type PieceInput, type PiecePatch } from './schema';

export const pieceQueries = {
  all: ['pieces'] as const,
  job: (jobId: string) =>
    queryOptions({ queryKey: [...pieceQueries.all, 'job', jobId], queryFn: () => apiClient.get(`/jobs/${jobId}/pieces`, pieceList) }),
};

/** Where the browser fetches a stored photo; the session cookie goes along, so only the shop sees it. */
export const photoUrl = (photoId: string, variant: 'preview' | 'original' = 'preview') => `/api/photos/${photoId}/${variant}`;

/** Every piece change shows in the job's pieces and its activity log. */
function useInvalidateJob(jobId: string) {
  const client = useQueryClient();
  return () =>
    Promise.all([
      client.invalidateQueries({ queryKey: pieceQueries.job(jobId).queryKey }),
      client.invalidateQueries({ queryKey: jobQueries.activity(jobId).queryKey }),
    ]);
}

export function useCreatePiece(jobId: string) {
  const invalidate = useInvalidateJob(jobId);
  return useMutation({
    mutationFn: (input: PieceInput) => apiClient.post(`/jobs/${jobId}/pieces`, input, pieceResponse),
    onSuccess: invalidate,
  });
}

export function useUpdatePiece(jobId: string) {
  const invalidate = useInvalidateJob(jobId);
  return useMutation({
    mutationFn: ({ pieceId, changes }: { pieceId: string; changes: PiecePatch }) =>
      apiClient.patch(`/jobs/${jobId}/pieces/${pieceId}`, changes, pieceResponse),
    onSuccess: invalidate,
  });
}

export function useDeletePiece(jobId: string) {
  const invalidate = useInvalidateJob(jobId);
  return useMutation({
    mutationFn: (pieceId: string) => apiClient.delete(`/jobs/${jobId}/pieces/${pieceId}`, z.null()),
    onSuccess: invalidate,
  });
}

export function useUploadPhoto(jobId: string, pieceId: string) {
  const invalidate = useInvalidateJob(jobId);
  return useMutation({
    mutationFn: (form: FormData) => apiClient.upload(`/jobs/${jobId}/pieces/${pieceId}/photos`, form, photoResponse),
    onSuccess: invalidate,
  });
}

export function useDeletePhoto(jobId: string) {
  const invalidate = useInvalidateJob(jobId);
  return useMutation({
    mutationFn: (photoId: string) => apiClient.delete(`/photos/${photoId}`, z.null()),
    onSuccess: invalidate,
  });
}
