import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { Logger } from 'pino';
import { z } from 'zod';
import type { ErrorBody } from '../features/api/errors';
import { DB_RETRY_AFTER_S, isDatabaseUnavailable } from './databaseErrors';
import { redactUrl } from './logger';
import { requestIdOf } from './requestIds';

/** An error a route means to send: status, a stable code, and words for a person. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    /** More top-level keys for the body beside `error`, e.g. the newer draft on a 409. */
    readonly extra?: Record<string, unknown>,
    /** Sent as Retry-After, in seconds, on a 429 or 503. */
    readonly retryAfterS?: number,
  ) {
    super(message);
  }
}

export const notFound = (what: string) => new HttpError(404, 'not_found', `${what} was not found`);

/** Turns zod issues into `{ "field.path": "message" }`, the first message per field. */
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.join('.') || '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

/** Parses `value` with `schema` or throws a 400 naming each bad field. */
export function parseOr400<T extends z.ZodType>(schema: T, value: unknown): z.infer<T> {
  const parsed = schema.safeParse(value);
  if (parsed.success) return parsed.data;
  const fields = fieldErrors(parsed.error);
  const names = Object.keys(fields).join(', ');
  throw new HttpError(400, 'invalid_input', `Some fields need attention: ${names}`, fields);
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, 'no_such_route', `There is no API route ${req.method} ${req.path}`));
};

export function errorHandler(rootLogger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    // The request's own logger carries its id on every line; the root one only before pino-http ran.
    const logger: Logger = (req as { log?: Logger }).log ?? rootLogger;
    const requestId = requestIdOf(req);
    let status = 500;
    let body: ErrorBody & Record<string, unknown> = { error: { code: 'internal', message: 'Something went wrong on our side; the error was logged.' } };
    if (err instanceof HttpError) {
      status = err.status;
      body = { ...err.extra, error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } };
      if (err.retryAfterS !== undefined) res.setHeader('Retry-After', String(err.retryAfterS));
    } else if (isDatabaseUnavailable(err)) {
      logger.warn({ err, url: redactUrl(req.originalUrl) }, 'the database is unavailable');
      res.setHeader('Retry-After', String(DB_RETRY_AFTER_S));
      res.status(503).json({ error: { code: 'db_unavailable', message: 'The database is not answering right now; try again in a few seconds.', requestId } });
      return;
    } else if (err?.type === 'entity.parse.failed') {
      status = 400;
      body = { error: { code: 'invalid_json', message: 'The request body is not valid JSON' } };
    } else if (err?.type === 'entity.too.large') {
      status = 413;
      body = { error: { code: 'too_large', message: 'The request body is too large' } };
    }
    if (status >= 500) logger.error({ err, url: redactUrl(req.originalUrl) }, 'request failed');
    res.status(status).json({ ...body, error: { ...body.error, ...(requestId ? { requestId } : {}) } });
  };
}
