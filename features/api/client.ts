import type { z } from 'zod';
import { ApiError, OFFLINE_MESSAGE } from './apiError';
import { errorBody } from './errors';

export { ApiError } from './apiError';

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

async function request<T extends z.ZodType>(method: Method, path: string, schema: T, body?: unknown): Promise<z.infer<T>> {
  let response: Response;
  // Multipart bodies go as they are: the browser writes their Content-Type with its boundary.
  const multipart = body instanceof FormData;
  try {
    response = await fetch(`/api${path}`, {
      method,
      credentials: 'same-origin',
      headers: body === undefined || multipart ? {} : { 'Content-Type': 'application/json' },
      body: body === undefined ? undefined : multipart ? body : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'offline', OFFLINE_MESSAGE);
  }
  const payload: unknown = await response.json().catch(() => null);
  if (!response.ok) {
    const parsed = errorBody.safeParse(payload);
    if (parsed.success) throw new ApiError(response.status, parsed.data.error.code, parsed.data.error.message, parsed.data.error.fields, payload);
    throw new ApiError(response.status, 'unexpected', `The server answered ${response.status}`);
  }
  const parsed = schema.safeParse(payload);
  if (!parsed.success) throw new ApiError(response.status, 'bad_response', 'The server sent an answer this app cannot read');
  return parsed.data;
}

/** The one way screens reach the API; every answer is checked against its shared schema. */
export const apiClient = {
  get: <T extends z.ZodType>(path: string, schema: T) => request('GET', path, schema),
  post: <T extends z.ZodType>(path: string, body: unknown, schema: T) => request('POST', path, schema, body),
  patch: <T extends z.ZodType>(path: string, body: unknown, schema: T) => request('PATCH', path, schema, body),
  put: <T extends z.ZodType>(path: string, body: unknown, schema: T) => request('PUT', path, schema, body),
  delete: <T extends z.ZodType>(path: string, schema: T) => request('DELETE', path, schema),
  /** POSTs files as multipart/form-data, e.g. a photo under the field name the route reads. */
  upload: <T extends z.ZodType>(path: string, formData: FormData, schema: T) => request('POST', path, schema, formData),
};
