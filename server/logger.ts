import { pino, type DestinationStream, type Logger } from 'pino';

/** Header and field paths whose values never reach a log line. */
export const REDACTED_PATHS = [
  'req.headers.cookie',
  'req.headers.authorization',
  'res.headers["set-cookie"]',
  '*.password',
  '*.passwordHash',
  '*.currentPassword',
  '*.newPassword',
];

const serializers = {
  req: safeRequest,
  err: safeError,
};

/** The server's logger; `destination` lets a test read exactly what would be written. */
export function createLogger(level: string, destination?: DestinationStream): Logger {
  const options = { level, redact: { paths: REDACTED_PATHS, censor: '[redacted]' }, serializers };
  return destination ? pino(options, destination) : pino(options);
}

/** Serializers pino-http should use, so request lines are as careful as the rest. */
export const httpLogSerializers = serializers;

// Path segments that carry a secret: the one after these words, and any long opaque token.
const SECRET_AFTER = new Set(['join', 'invitations', 'proofs', 'reset']);
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const OPAQUE_TOKEN = /^[A-Za-z0-9_-]{32,}$/;
const SECRET_QUERY_KEYS = /token|secret|key|code|password|signature|sig/i;

function secretSegment(segment: string, previous: string | undefined): boolean {
  if (segment === '' || UUID.test(segment)) return false;
  if (previous !== undefined && SECRET_AFTER.has(previous) && segment !== 'accept') return true;
  return OPAQUE_TOKEN.test(segment);
}

/** A request path with invitation secrets and other tokens replaced, e.g. /join/[secret]. */
export function redactUrl(url: string | undefined): string | undefined {
  if (!url) return url;
  const [pathPart, queryPart] = splitOnce(url, '?');
  const segments = pathPart.split('/');
  const safePath = segments.map((s, i) => (secretSegment(s, segments[i - 1]) ? '[secret]' : s)).join('/');
  if (queryPart === undefined) return safePath;
  const params = new URLSearchParams(queryPart);
  for (const key of [...params.keys()]) if (SECRET_QUERY_KEYS.test(key)) params.set(key, '[secret]');
  return `${safePath}?${params.toString()}`;
}

function splitOnce(text: string, separator: string): [string, string | undefined] {
  const at = text.indexOf(separator);
  return at < 0 ? [text, undefined] : [text.slice(0, at), text.slice(at + 1)];
}

interface SerializedRequest {
  id?: unknown;
  method?: string;
  url?: string;
  headers?: Record<string, unknown>;
  remoteAddress?: string;
}

/** Method, safe URL, address and user agent; never cookies, authorisation, params or query objects. */
function safeRequest(req: SerializedRequest) {
  return {
    id: req.id,
    method: req.method,
    url: redactUrl(req.url),
    remoteAddress: req.remoteAddress,
    userAgent: req.headers?.['user-agent'],
  };
}

// Postgres fields that name where an error happened without the values involved.
const SAFE_DB_FIELDS = ['code', 'severity', 'routine', 'table', 'column', 'constraint', 'schema'] as const;

/** Drops the "params: ..." part Drizzle appends to a failed statement, and quoted values Postgres echoes. */
export function scrubMessage(text: string | undefined): string | undefined {
  if (!text) return text;
  return text
    .replace(/\nparams: [\s\S]*?(?=\n\s+at |$)/, '\nparams: [redacted]')
    .replace(/(: )"(?:[^"\\]|\\.)*"/g, '$1"[redacted]"');
}

/**
 * An error as it may be logged: type, message and stack without statement
 * parameters, the SQL text (placeholders only), Postgres' own codes, and its
 * cause the same way. Postgres' `detail` (which repeats a row's values) is left out.
 */
export function safeError(err: unknown, depth = 0): unknown {
  if (!err || typeof err !== 'object') return err;
  const e = err as Record<string, unknown> & { message?: string; stack?: string; cause?: unknown };
  const out: Record<string, unknown> = {
    type: e.constructor?.name ?? 'Error',
    message: scrubMessage(e.message),
    stack: scrubMessage(e.stack),
  };
  if (typeof e.query === 'string') out.query = e.query;
  for (const key of SAFE_DB_FIELDS) if (e[key] !== undefined) out[key] = e[key];
  if (e.cause && depth < 3) out.cause = safeError(e.cause, depth + 1);
  return out;
}
