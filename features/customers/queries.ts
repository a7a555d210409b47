import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../api/client';
import { customer, customerList, type CustomerInput } from './schema';

export const customerQueries = {
  all: ['customers'] as const,
  list: (q = '') =>
    queryOptions({
      queryKey: [...customerQueries.all, 'list', q],
      queryFn: () => apiClient.get(`/customers${q ? `?q=${encodeURIComponent(q)}` : ''}`, customerList),
    }),
};

export function useCreateCustomer() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: CustomerInput) => apiClient.post('/customers', input, z.object({ customer })),
    onSuccess: () => client.invalidateQueries({ queryKey: customerQueries.all }),
  });
}
