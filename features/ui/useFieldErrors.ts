import type { z } from 'zod';
import { ApiError } from '../api/apiError';

/**
 * Field messages for a form: the zod schema's own complaints before sending,
 * then whatever the server named. One source of words for both.
 */
export function localFieldErrors(schema: z.ZodType, values: unknown): Record<string, string> {
  const parsed = schema.safeParse(values);
  if (parsed.success) return {};
  const fields: Record<string, string> = {};
  for (const issue of parsed.error.issues) fields[issue.path.join('.') || '_'] ??= issue.message;
  return fields;
}

export function serverFieldErrors(error: unknown): Record<string, string> {
  return error instanceof ApiError ? error.fields : {};
}

export function errorMessage(error: unknown): string | undefined {
  if (!error) return undefined;
  return error instanceof Error ? error.message : 'Something went wrong';
}
