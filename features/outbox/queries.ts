import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../api/client';
import { outboxMessage, outboxPage } from './schema';

export const OUTBOX_PAGE_SIZE = 20;

export const outboxQueries = {
  all: ['outbox'] as const,
  page: (offset: number) =>
    queryOptions({
      queryKey: [...outboxQueries.all, 'page', offset],
      queryFn: () => apiClient.get(`/outbox?limit=${OUTBOX_PAGE_SIZE}&offset=${offset}`, outboxPage),
      placeholderData: keepPreviousData,
    }),
  message: (id: string) =>
    queryOptions({ queryKey: [...outboxQueries.all, 'message', id], queryFn: () => apiClient.get(`/outbox/${id}`, z.object({ message: outboxMessage })) }),
};
