import { useEffect, useState } from 'react';
import type { z } from 'zod';
import { focusFirstInvalid } from './focusFirstInvalid';
import { localFieldErrors, serverFieldErrors } from './useFieldErrors';

/**
 * What every form here needs: the typed text, a message per field, and one
 * `submit` that checks the shared schema before anything is sent. The server's
 * named fields come back beside the same inputs, so both speak in one voice,
 * and each refusal moves focus to the first field named.
 */
export function useSchemaForm<S extends z.ZodType, V extends { [K in keyof V]: string }>(schema: S, initial: V) {
  const [values, setValues] = useState(initial);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [refusals, setRefusals] = useState(0);
  const set = (key: keyof V) => (text: string) => setValues((v) => ({ ...v, [key]: text }));

  // After the messages are on screen, so the fields carry aria-invalid.
  useEffect(() => {
    if (refusals > 0) focusFirstInvalid();
  }, [refusals]);

  const refuse = (next: Record<string, string>) => {
    setFields(next);
    if (Object.keys(next).length > 0) setRefusals((n) => n + 1);
  };

  /** Calls `send` with the parsed input, or shows each field's message and sends nothing. */
  const submit = (send: (input: z.output<S>, onError: (error: unknown) => void) => void) => {
    const parsed = schema.safeParse(values);
    if (!parsed.success) {
      refuse(localFieldErrors(schema, values));
      return;
    }
    setFields({});
    send(parsed.data, (error) => refuse(serverFieldErrors(error)));
  };

  const hasFieldErrors = Object.keys(fields).length > 0;
  return { values, setValues, set, fields, hasFieldErrors, submit };
}
