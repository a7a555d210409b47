import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../api/client';
import { pieceQueries } from '../pieces/queries';
import { pieceResponse } from '../pieces/schema';
import { cornerProposal, traceRunResponse, type OutlineSave, type TraceRequest } from './schema';
import { z } from 'zod';

/** The squared, cropped photo a trace made; the outline's inches are measured from its top-left. */
export const traceImageUrl = (traceId: string) => `/api/traces/${traceId}/image`;

const cornersResponse = z.object({ corners: cornerProposal.shape.corners });

export const traceQueries = {
  all: ['traces'] as const,
  /** A run, read again every half second while it waits or runs; the stage is stored on the server, so a reload finds it. */
  run: (traceId: string) =>
    queryOptions({
      queryKey: [...traceQueries.all, 'run', traceId],
      queryFn: () => apiClient.get(`/traces/${traceId}`, traceRunResponse),
      refetchInterval: (query) => {
        const status = query.state.data?.trace.status;
        return status === 'done' || status === 'failed' ? false : 500;
      },
    }),
  corners: (photoId: string) =>
    queryOptions({ queryKey: [...traceQueries.all, 'corners', photoId], queryFn: () => apiClient.get(`/photos/${photoId}/corners`, cornersResponse), staleTime: Infinity, retry: false }),
};

export function useStartTrace(jobId: string, pieceId: string) {
  return useMutation({ mutationFn: (input: TraceRequest) => apiClient.post(`/jobs/${jobId}/pieces/${pieceId}/traces`, input, traceRunResponse) });
}

export function useSaveOutline(jobId: string, pieceId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: OutlineSave) => apiClient.put(`/jobs/${jobId}/pieces/${pieceId}/outline`, input, pieceResponse),
    onSuccess: () => client.invalidateQueries({ queryKey: pieceQueries.job(jobId).queryKey }),
  });
}
