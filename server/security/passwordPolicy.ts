import { zxcvbn, zxcvbnOptions } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import { demoShop } from '../../db/demoShop';
import { HttpError } from '../errors';

// zxcvbn's common-word dictionaries (passwords, names, frequent words) and keyboard
// layouts, from @zxcvbn-ts/language-common; loaded once, on the server only.
zxcvbnOptions.setOptions({ dictionary: { ...common.dictionary }, graphs: common.adjacencyGraphs });

/** zxcvbn's scale: 3 means "safely unguessable" (more than 10^8 guesses, its authors' threshold for online attacks and slow hashes). */
export const MIN_PASSWORD_SCORE = 3;
/** Fewer different characters than this is a repeat such as "aaaaaaaaaa" or "abababab". */
export const MIN_DISTINCT_CHARACTERS = 5;
// The estimate grows with length; the first 64 characters decide, and longer passwords are strong on length alone.
const SCORED_LENGTH = 64;

/** What the person typed elsewhere in the form; a password built from it is refused. */
export interface PasswordContext {
  email: string;
  name?: string;
  shopName?: string;
}

/** Why `password` is refused, in plain words, or null when it may be used. */
export function passwordProblem(password: string, context: PasswordContext): string | null {
  const lower = password.trim().toLowerCase();
  const email = context.email.trim().toLowerCase();
  const localPart = email.split('@')[0] ?? '';
  if (lower === email || lower.includes(email) || lower === localPart) return 'Do not use your e-mail address as the password';
  if (new Set(password).size < MIN_DISTINCT_CHARACTERS) {
    return 'Use more different characters; a password of a few characters repeated is guessed at once';
  }
  if (lower === demoShop.password) return 'This is the published demo password; choose your own';
  const inputs = [email, localPart, context.name, context.shopName, demoShop.password].filter((v): v is string => Boolean(v));
  const result = zxcvbn(password.slice(0, SCORED_LENGTH), inputs);
  if (result.score < MIN_PASSWORD_SCORE) {
    return 'This password is too common or too easy to guess; a few unrelated words make a strong one';
  }
  return null;
}

/** Throws a 400 naming `field` when the password is refused. */
export function requireStrongPassword(password: string, context: PasswordContext, field = 'password'): void {
  const problem = passwordProblem(password, context);
  if (problem) throw new HttpError(400, 'weak_password', problem, { [field]: problem });
}
