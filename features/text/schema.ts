import { z } from 'zod';

// C0 controls (NUL, bell, escape...), DEL and the C1 block. Line breaks and tabs are
// allowed only where a field is multi-line. Postgres refuses NUL in text outright,
// and the others hide text or rewrite a terminal when a log or export is read.
const CONTROL_IN_LINE = /[\u0000-\u001F\u007F-\u009F]/;
const CONTROL_IN_TEXT = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/;

export const CONTROL_CHARACTER_MESSAGE = 'Remove the control character (an invisible character such as NUL) from this text';

/** True when `value` holds a character no text field accepts (`multiline` allows line breaks and tabs). */
export function hasControlCharacter(value: string, multiline = false): boolean {
  return (multiline ? CONTROL_IN_TEXT : CONTROL_IN_LINE).test(value);
}

export interface TextFieldOptions {
  /** Longest accepted text after trimming. */
  max: number;
  /** Shortest accepted text after trimming; with `required` it defaults to 1. */
  min?: number;
  /** The message when the text is missing or shorter than `min`. */
  required?: string;
  /** The message when no text was sent at all, for fields whose blank case another check words better. */
  missing?: string;
  /** Notes and addresses keep their line breaks and tabs. */
  multiline?: boolean;
  /** The message when the text is longer than `max`. */
  tooLong?: string;
}

/**
 * The one way a schema takes text from a person: trimmed, refused with the
 * field named (a 400 through parseOr400) when it holds a control character or
 * breaks the length limits.
 */
export function textField(options: TextFieldOptions) {
  const min = options.min ?? (options.required ? 1 : 0);
  let field = z
    .string(options.required || options.missing ? { error: options.required ?? options.missing } : undefined)
    .refine((v) => !hasControlCharacter(v, options.multiline), CONTROL_CHARACTER_MESSAGE)
    .trim()
    .max(options.max, options.tooLong ?? `Use at most ${options.max} characters`);
  if (min > 0) field = field.min(min, options.required ?? `Use at least ${min} characters`);
  return field;
}

/** Optional text: missing, null and blank all become null. */
export function optionalTextField(options: Omit<TextFieldOptions, 'required' | 'min' | 'missing'>) {
  return textField(options)
    .transform((v) => (v === '' ? null : v))
    .nullish()
    .transform((v) => v ?? null);
}

/** Text that is kept exactly as typed (passwords): never trimmed, but still free of control characters. */
export function secretField(options: { min?: number; max: number; required: string; tooShort?: string }) {
  return z
    .string({ error: options.required })
    .refine((v) => !hasControlCharacter(v), CONTROL_CHARACTER_MESSAGE)
    .min(options.min ?? 1, options.tooShort ?? options.required)
    .max(options.max, `Use at most ${options.max} characters`);
}

/**
 * Where the first control character sits in a JSON value (a string or an object
 * key, line breaks allowed), as a path such as ["mats", 0, "name"]; null when there is none.
 */
export function findControlCharacter(value: unknown, path: (string | number)[] = []): (string | number)[] | null {
  // One path array, grown and shrunk on the way, copied only when something is found:
  // a 2 000-point outline then costs no array per point.
  const at = [...path];
  return controlCharacterAt(value, at) ? at : null;
}

/** Whether `value` holds a control character; `at` is left pointing at the first one. */
function controlCharacterAt(value: unknown, at: (string | number)[]): boolean {
  if (typeof value === 'string') return hasControlCharacter(value, true);
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      at.push(i);
      if (controlCharacterAt(value[i], at)) return true;
      at.pop();
    }
    return false;
  }
  if (value && typeof value === 'object') {
    for (const key in value) {
      if (!Object.prototype.hasOwnProperty.call(value, key)) continue;
      at.push(key);
      if (hasControlCharacter(key, true) || controlCharacterAt((value as Record<string, unknown>)[key], at)) return true;
      at.pop();
    }
  }
  return false;
}

/** A JSON document (a layout) whose every string is free of control characters; the 400 names the place. */
export function plainTextDocument<T extends z.ZodType>(schema: T) {
  return schema.superRefine((value, ctx) => {
    const at = findControlCharacter(value);
    if (at) ctx.addIssue({ code: 'custom', message: CONTROL_CHARACTER_MESSAGE, path: at });
  });
}
