import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../api/client';
import { authQueries } from '../auth/queries';
import type { MemberRole } from '../auth/schema';
import { outboxQueries } from '../outbox/queries';
import {
  invitationList,
  invitationSummary,
  teamList,
  teamMember,
  type InviteInput,
} from './schema';

const ok = z.object({ ok: z.literal(true) });

export const memberQueries = {
  all: ['members'] as const,
  team: () => queryOptions({ queryKey: [...memberQueries.all, 'team'], queryFn: () => apiClient.get('/members', teamList) }),
  invitations: () =>
    queryOptions({ queryKey: [...memberQueries.all, 'invitations'], queryFn: () => apiClient.get('/members/invitations', invitationList) }),
};

function useInvalidate() {
  const client = useQueryClient();
  // Your own role may have changed too, and a failed or sent mail shows in the outbox.
  return () => Promise.all([memberQueries.all, outboxQueries.all, authQueries.all].map((queryKey) => client.invalidateQueries({ queryKey })));
}

export function useInvite() {
  const onSettled = useInvalidate();
  // A failed send is still listed in the outbox, so refresh it either way.
  return useMutation({ mutationFn: (input: InviteInput) => apiClient.post('/members/invitations', input, z.object({ invitation: invitationSummary })), onSettled });
}

export function useRevokeInvitation() {
  const onSuccess = useInvalidate();
  return useMutation({ mutationFn: (id: string) => apiClient.delete(`/members/invitations/${id}`, ok), onSuccess });
}

export function useChangeRole() {
  const onSuccess = useInvalidate();
  return useMutation({
    mutationFn: ({ id, role }: { id: string; role: MemberRole }) => apiClient.patch(`/members/${id}`, { role }, z.object({ member: teamMember })),
    onSuccess,
  });
}

export function useRemoveMember() {
  const onSuccess = useInvalidate();
  return useMutation({ mutationFn: (id: string) => apiClient.delete(`/members/${id}`, ok), onSuccess });
}

