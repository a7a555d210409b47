import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';

/** The header a request's id travels in, both ways. */
export const REQUEST_ID_HEADER = 'X-Request-Id';

// An id a load balancer or proxy already gave the request is kept when it is plainly safe to log.
const SAFE_ID = /^[A-Za-z0-9._:-]{8,80}$/;

/**
 * pino-http's id for each request: the incoming X-Request-Id when a load
 * balancer set a safe one, otherwise a fresh UUID. It is sent back on the
 * response, logged on every line about the request, and put in error bodies,
 * so a framer's "it said request 5f3c..." finds the log lines on any process.
 */
export function requestIdFor(req: IncomingMessage, res: ServerResponse): string {
  const given = req.headers[REQUEST_ID_HEADER.toLowerCase()];
  const id = typeof given === 'string' && SAFE_ID.test(given) ? given : randomUUID();
  res.setHeader(REQUEST_ID_HEADER, id);
  return id;
}

/** The id pino-http gave this request, for error bodies. */
export function requestIdOf(req: IncomingMessage): string | undefined {
  const id = (req as IncomingMessage & { id?: unknown }).id;
  return typeof id === 'string' ? id : undefined;
}
