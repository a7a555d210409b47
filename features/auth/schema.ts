import { z } from 'zod';
import { secretField, textField } from '../text/schema';

import { memberRoles } from './roles';

export { memberRoles, roleLabels, type MemberRole } from './roles';
export const memberRoleSchema = z.enum(memberRoles);

// A blank address gets the format message, which tells what to type.
export const emailField = textField({ max: 254, missing: 'Enter your e-mail address' })
  .toLowerCase()
  .email('Enter an e-mail address like name@example.com');
const email = emailField;
/** A new password: at least 10 characters; the server also refuses common and guessable ones. */
export const newPasswordField = secretField({ min: 10, max: 200, required: 'Enter a password', tooShort: 'Use at least 10 characters' });
const password = newPasswordField;

export const signUpInput = z.object({
  shopName: textField({ min: 2, max: 120, required: 'Give the shop a name' }),
  name: textField({ max: 120, required: 'Enter your name' }),
  email,
  password,
});
export type SignUpInput = z.infer<typeof signUpInput>;

export const signInInput = z.object({
  email,
  password: secretField({ max: 200, required: 'Enter your password' }),
});
export type SignInInput = z.infer<typeof signInInput>;

/** A signed-in member replacing their password; every other session of theirs ends. */
export const passwordChangeInput = z.object({
  currentPassword: secretField({ max: 200, required: 'Enter your current password' }),
  newPassword: newPasswordField,
});
export type PasswordChangeInput = z.infer<typeof passwordChangeInput>;

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

export const shopRenameInput = z.object({ name: textField({ min: 2, max: 120, required: 'Give the shop a name' }) });
