import type { z } from 'zod';
import { ApiError, callApi, type ApiMethod } from './apiError';

export { ApiError } from './apiError';

async function request<T extends z.ZodType>(method: ApiMethod, path: string, schema: T, body?: unknown): Promise<z.infer<T>> {
  const { status, payload } = await callApi(method, path, body);
  const parsed = schema.safeParse(payload);
  if (!parsed.success) throw new ApiError(status, 'bad_response', 'The server sent an answer this app cannot read');
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
