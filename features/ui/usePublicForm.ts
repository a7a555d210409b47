import { useEffect, useState } from 'react';
import { ApiError } from '../api/apiError';
import { focusFirstInvalid } from './focusFirstInvalid';

/**
 * The forms shown before sign-in (sign in, set up a shop, join a shop). They
 * load with the first page, so they carry no schema library and no query
 * cache: the server checks what is typed against the shared schemas and names
 * each field it refuses, in the same words the signed-in forms use, and those
 * messages show beside the fields here.
 */

/** A form's typed text, the server's message per field, its other refusal, and one `submit`. */
export function usePublicForm<V extends { [K in keyof V]: string }>(initial: V, send: (values: V) => Promise<unknown>, done: () => void) {
  const [values, setValues] = useState(initial);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [failure, setFailure] = useState<Error | null>(null);
  const [busy, setBusy] = useState(false);
  const [refusals, setRefusals] = useState(0);
  const set = (key: keyof V) => (text: string) => setValues((v) => ({ ...v, [key]: text }));

  // After the messages are on screen, so the fields carry aria-invalid.
  useEffect(() => {
    if (refusals > 0) focusFirstInvalid();
  }, [refusals]);

  const submit = () => {
    if (busy) return;
    setBusy(true);
    setFailure(null);
    send(values).then(
      () => {
        setFields({});
        done();
      },
      (error: unknown) => {
        const named = error instanceof ApiError ? error.fields : {};
        setFields(named);
        setFailure(error instanceof Error ? error : new Error('Something went wrong'));
        if (Object.keys(named).length > 0) setRefusals((n) => n + 1);
        setBusy(false);
      },
    );
  };

  const hasFieldErrors = Object.keys(fields).length > 0;
  return { values, set, fields, hasFieldErrors, failure, busy, submit };
}
