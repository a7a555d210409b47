import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../api/client';
import { authQueries } from '../auth/queries';
import type { MemberRole } from '../auth/schema';
import { outboxQueries } from '../outbox/queries';
import {
  invitationList,
  invitationPreview,
  invitationSummary,
  teamList,
  teamMember,
  type AcceptInvitationInput,
  type InviteInput,
} from './schema';

const ok = z.object({ ok: z.literal(true) });

export const memberQueries = {
  all: ['members'] as const,
  team: () => queryOptions({ queryKey: [...memberQueries.all, 'team'], queryFn: () => apiClient.get('/members', teamList) }),
  invitations: () =>
    queryOptions({ queryKey: [...memberQueries.all, 'invitations'], queryFn: () => apiClient.get('/members/invitations', invitationList) }),
  /** The join page's look at an invitation; a dead link is an answer, not something to retry. */
  preview: (secret: string) =>
    queryOptions({
      queryKey: ['invitation', secret],
      queryFn: () => apiClient.get(`/invitations/${secret}`, z.object({ invitation: invitationPreview })),
      retry: false,
    }),
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

export function useAcceptInvitation(secret: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: AcceptInvitationInput) => apiClient.post(`/invitations/${secret}/accept`, input, ok),
    // A new member is signed in now: nothing cached for whoever used this browser before applies.
    onSuccess: () => client.clear(),
  });
}
