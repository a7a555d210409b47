import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
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

/** The shop's rounding for showing lengths; 1/16 in until the settings have loaded. */
export function useShopRounding() {
  const settings = useQuery(settingsQueries.shop());
  return settings.data?.settings.rounding ?? '1/16';
}
