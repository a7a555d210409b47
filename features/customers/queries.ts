import { infiniteQueryOptions, queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../api/client';
import { customer, customerList, type CustomerInput, type CustomerOrder, type CustomerUpdate } from './schema';

const PAGE = 30;

function listPath(q: string, includeArchived: boolean, order: CustomerOrder, limit: number, offset: number): string {
  const params = new URLSearchParams({ ...(q ? { q } : {}), includeArchived: String(includeArchived), order, limit: String(limit), offset: String(offset) });
  if (offset > 0) params.set('count', 'none');
  return `/customers?${params.toString()}`;
}

export const customerQueries = {
  all: ['customers'] as const,
  list: (q = '', includeArchived = false, order: CustomerOrder = 'name') =>
    queryOptions({
      queryKey: [...customerQueries.all, 'list', q, includeArchived, order],
      queryFn: () => apiClient.get(listPath(q, includeArchived, order, PAGE, 0), customerList),
    }),
  /** The customers screen: pages of 30, "Show more" fetches the next. */
  pages: (q = '', includeArchived = false) =>
    infiniteQueryOptions({
      queryKey: [...customerQueries.all, 'pages', q, includeArchived],
      queryFn: ({ pageParam }) => apiClient.get(listPath(q, includeArchived, 'name', PAGE, pageParam), customerList),
      initialPageParam: 0,
      getNextPageParam: (_last, pages) => {
        const seen = pages.reduce((n, p) => n + p.customers.length, 0);
        return seen < (pages[0]?.total ?? 0) ? seen : undefined;
      },
    }),
  detail: (id: string) =>
    queryOptions({ queryKey: [...customerQueries.all, 'detail', id], queryFn: () => apiClient.get(`/customers/${id}`, z.object({ customer })) }),
};

export function useCreateCustomer() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: CustomerInput) => apiClient.post('/customers', input, z.object({ customer })),
    onSuccess: () => client.invalidateQueries({ queryKey: customerQueries.all }),
  });
}

export function useUpdateCustomer(id: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: CustomerUpdate) => apiClient.patch(`/customers/${id}`, input, z.object({ customer })),
    onSuccess: () => client.invalidateQueries({ queryKey: customerQueries.all }),
  });
}

export function useDeleteCustomer(id: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: () => apiClient.delete(`/customers/${id}`, z.null()),
    // Mark the lists stale without refetching now: refetching the deleted
    // customer's own page would replace it with "not found" before the screen
    // can move on to the list.
    onSuccess: () => client.invalidateQueries({ queryKey: customerQueries.all, refetchType: 'none' }),
  });
}
