/** The roles a member of a shop can have, and their names on screen. No zod here: the join page uses it before sign-in. */
export const memberRoles = ['owner', 'designer', 'front_desk'] as const;
export type MemberRole = (typeof memberRoles)[number];

export const roleLabels: Record<MemberRole, string> = {
  owner: 'Owner',
  designer: 'Designer',
  front_desk: 'Front desk',
};
