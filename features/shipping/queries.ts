import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../api/client';
import { jobQueries } from '../jobs/queries';
import { arrivalReport, jobShipping, shipmentResult, type ShipmentInput } from './schema';

export const shippingQueries = {
  all: ['shipping'] as const,
  job: (jobId: string) => queryOptions({ queryKey: [...shippingQueries.all, 'job', jobId], queryFn: () => apiClient.get(`/jobs/${jobId}/shipping`, jobShipping) }),
  arrival: (jobId: string) => queryOptions({ queryKey: [...shippingQueries.all, 'arrival', jobId], queryFn: () => apiClient.get(`/jobs/${jobId}/arrival`, arrivalReport) }),
};

/** Marks the job shipped; the job, its status and activity are read again. */
export function useMarkShipped(jobId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: ShipmentInput) => apiClient.post(`/jobs/${jobId}/shipment`, input, shipmentResult),
    onSuccess: () => Promise.all([client.invalidateQueries({ queryKey: shippingQueries.all }), client.invalidateQueries({ queryKey: jobQueries.all })]),
  });
}

export function useSetShowcase(jobId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (photoId: string) => apiClient.post(`/jobs/${jobId}/arrival/photos/${photoId}/showcase`, {}, arrivalReport),
    onSuccess: (report) => client.setQueryData(shippingQueries.arrival(jobId).queryKey, report),
  });
}
