import { z } from 'zod';

export const memberRoles = ['owner', 'designer', 'front_desk'] as const;
export const memberRoleSchema = z.enum(memberRoles);
export type MemberRole = z.infer<typeof memberRoleSchema>;

export const roleLabels: Record<MemberRole, string> = {
  owner: 'Owner',
  designer: 'Designer',
  front_desk: 'Front desk',
};

const email = z.string({ error: 'Enter your e-mail address' }).trim().toLowerCase().email('Enter an e-mail address like name@example.com').max(254);
const password = z
  .string({ error: 'Enter a password' })
  .min(10, 'Use at least 10 characters')
  .max(200, 'Use at most 200 characters');

export const signUpInput = z.object({
  shopName: z.string({ error: 'Give the shop a name' }).trim().min(2, 'Give the shop a name').max(120),
  name: z.string({ error: 'Enter your name' }).trim().min(1, 'Enter your name').max(120),
  email,
  password,
});
export type SignUpInput = z.infer<typeof signUpInput>;

export const signInInput = z.object({
  email,
  password: z.string({ error: 'Enter your password' }).min(1, 'Enter your password').max(200),
});
export type SignInInput = z.infer<typeof signInInput>;

export const meResponse = z.object({
  member: z.object({
    id: z.string(),
    name: z.string(),
    email: z.string(),
    role: memberRoleSchema,
  }),
  shop: z.object({ id: z.string(), name: z.string() }),
});
export type Me = z.infer<typeof meResponse>;

export const shopRenameInput = z.object({ name: z.string().trim().min(2, 'Give the shop a name').max(120) });
