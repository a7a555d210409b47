import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../api/client';
import { shopSettings, type ShopSettings } from './schema';

const settingsBody = z.object({ settings: shopSettings });

export const settingsQueries = {
  all: ['settings'] as const,
  shop: () => queryOptions({ queryKey: [...settingsQueries.all, 'shop'], queryFn: () => apiClient.get('/settings', settingsBody), staleTime: 60_000 }),
};

export function useSaveSettings() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (settings: ShopSettings) => apiClient.put('/settings', settings, settingsBody),
    onSuccess: (data) => client.setQueryData(settingsQueries.shop().queryKey, data),
  });
}
