/** Any failed API call: the server's code and message, and the fields it named. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
    /** The whole error body, for answers that carry more than the message (the findings of a 422). */
    readonly body: unknown = null,
  ) {
    super(message);
  }
}

/** What a failed answer's body says, read without a schema: `{ error: { code, message, fields? } }`, or null. */
export function errorFromBody(status: number, payload: unknown): ApiError | null {
  const error = (payload as { error?: unknown } | null)?.error as { code?: unknown; message?: unknown; fields?: unknown } | undefined;
  if (!error || typeof error.code !== 'string' || typeof error.message !== 'string') return null;
  const fields: Record<string, string> = {};
  if (error.fields && typeof error.fields === 'object') {
    for (const [name, text] of Object.entries(error.fields)) if (typeof text === 'string') fields[name] = text;
  }
  return new ApiError(status, error.code, error.message, fields, payload);
}

export const OFFLINE_MESSAGE = 'Matwright could not reach its server. Check the connection and try again.';
