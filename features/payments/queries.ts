import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../api/client';
import { jobQueries } from '../jobs/queries';
import { checkoutStarted, manualPaymentRecorded, paymentList, type CheckoutInput, type ManualPaymentInput } from './schema';

export const paymentQueries = {
  all: ['payments'] as const,
  /** `returnedFrom`: the provider's session id when the browser has just come back from its page. */
  job: (jobId: string, returnedFrom?: string) =>
    queryOptions({
      queryKey: [...paymentQueries.all, 'job', jobId],
      queryFn: () => apiClient.get(`/jobs/${jobId}/payments`, paymentList),
      // The webhook may land a moment after the browser comes back: look again every 2 s, for a minute at most.
      refetchInterval: (query) => {
        const landed = query.state.data?.payments.some((p) => p.checkoutSessionId === returnedFrom);
        return returnedFrom && !landed && query.state.dataUpdateCount < 30 ? 2000 : false;
      },
    }),
};

/** Opens the provider's page for the deposit or the balance; the server decides the amount. */
export function useStartCheckout(jobId: string) {
  return useMutation({ mutationFn: (input: CheckoutInput) => apiClient.post(`/jobs/${jobId}/payments/checkout`, input, checkoutStarted) });
}

export function useRecordManualPayment(jobId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: ManualPaymentInput) => apiClient.post(`/jobs/${jobId}/payments/manual`, input, manualPaymentRecorded),
    onSuccess: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: paymentQueries.job(jobId).queryKey }),
        client.invalidateQueries({ queryKey: jobQueries.activity(jobId).queryKey }),
      ]),
  });
}
