/**
 * How the app's code reaches the API, without any schema library: the request
 * (JSON, or multipart for files), and a failed answer turned into an ApiError
 * with the server's code, message and named fields. `client.ts` checks each
 * answer against its shared schema on top of this; the pages before sign-in,
 * which load no schema library, use it directly.
 */
import { currentPageDrawing } from './pageDrawing';

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

/** What a failed answer's body says (`{ error: { code, message, fields? } }`), or null when it has another shape. */
function errorFromBody(status: number, payload: unknown): ApiError | null {
  const error = (payload as { error?: unknown } | null)?.error as { code?: unknown; message?: unknown; fields?: unknown } | undefined;
  if (!error || typeof error.code !== 'string' || typeof error.message !== 'string') return null;
  const fields: Record<string, string> = {};
  if (error.fields && typeof error.fields === 'object') {
    for (const [name, text] of Object.entries(error.fields)) if (typeof text === 'string') fields[name] = text;
  }
  return new ApiError(status, error.code, error.message, fields, payload);
}

export type ApiMethod = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

/** Sends one request to the API and returns its status and JSON answer; a failure throws an ApiError in the server's words. */
export async function callApi(method: ApiMethod, path: string, body?: unknown): Promise<{ status: number; payload: unknown }> {
  let response: Response;
  // Multipart bodies go as they are: the browser writes their Content-Type with its boundary.
  const multipart = body instanceof FormData;
  // Drawing a page on the server, the reads go to the server's own address as the visitor.
  const drawing = currentPageDrawing();
  const headers: Record<string, string> = body === undefined || multipart ? {} : { 'Content-Type': 'application/json' };
  if (drawing) headers.Cookie = drawing.cookie;
  try {
    response = await fetch(`${drawing?.apiOrigin ?? ''}/api${path}`, {
      method,
      credentials: 'same-origin',
      headers,
      body: body === undefined ? undefined : multipart ? body : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'offline', 'Matwright could not reach its server. Check the connection and try again.');
  }
  const payload: unknown = await response.json().catch(() => null);
  if (!response.ok) throw errorFromBody(response.status, payload) ?? new ApiError(response.status, 'unexpected', `The server answered ${response.status}`);
  return { status: response.status, payload };
}
