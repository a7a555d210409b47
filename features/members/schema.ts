import { z } from 'zod';
import { memberRoleSchema, signUpInput } from '../auth/schema';

const role = z.enum(memberRoleSchema.options, { error: 'Choose a role: owner, designer or front desk' });

export const inviteInput = z.object({ email: signUpInput.shape.email, role });
export type InviteInput = z.infer<typeof inviteInput>;

export const roleChangeInput = z.object({ role });
export type RoleChangeInput = z.infer<typeof roleChangeInput>;

/** What a person invited gives to join: the e-mail comes from the invitation. */
export const acceptInvitationInput = z.object({ name: signUpInput.shape.name, password: signUpInput.shape.password });
export type AcceptInvitationInput = z.infer<typeof acceptInvitationInput>;

export const teamMember = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  role: memberRoleSchema,
  joinedAt: z.string(),
});
export type TeamMember = z.infer<typeof teamMember>;
export const teamList = z.object({ members: z.array(teamMember) });

export const invitationSummary = z.object({
  id: z.string().uuid(),
  email: z.string(),
  role: memberRoleSchema,
  /** Only invitations not yet used or withdrawn are listed; an expired one can be sent again. */
  state: z.enum(['waiting', 'expired']),
  expiresAt: z.string(),
  invitedByName: z.string().nullable(),
});
export type InvitationSummary = z.infer<typeof invitationSummary>;
export const invitationList = z.object({ invitations: z.array(invitationSummary) });

/** What the join page shows before someone sets a password. */
export const invitationPreview = z.object({
  shopName: z.string(),
  role: memberRoleSchema,
  email: z.string(),
  expiresAt: z.string(),
});
export type InvitationPreview = z.infer<typeof invitationPreview>;
