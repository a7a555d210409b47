import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../api/client';
import { meResponse, type PasswordChangeInput } from './schema';

const ok = z.object({ ok: z.literal(true) });

export const authQueries = {
  all: ['auth'] as const,
  me: () => queryOptions({ queryKey: [...authQueries.all, 'me'], queryFn: () => apiClient.get('/auth/me', meResponse), retry: false }),
};

/** After any change of who is signed in, forget everything cached for the previous member. */
function useAfterSessionChange() {
  const client = useQueryClient();
  return () => {
    client.clear();
  };
}

export function useSignOut() {
  const reset = useAfterSessionChange();
  return useMutation({ mutationFn: () => apiClient.post('/auth/sign-out', {}, ok), onSuccess: reset });
}

/** Ends every session of the signed-in member, this browser's too. */
export function useSignOutEverywhere() {
  const reset = useAfterSessionChange();
  return useMutation({ mutationFn: () => apiClient.post('/auth/sign-out-everywhere', {}, ok), onSuccess: reset });
}

/** Replaces the password; the server ends every other session of this member. */
export function useChangePassword() {
  return useMutation({ mutationFn: (input: PasswordChangeInput) => apiClient.post('/auth/password', input, ok) });
}
