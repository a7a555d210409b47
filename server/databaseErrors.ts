/** Seconds a client is asked to wait before trying again while the database is away. */
export const DB_RETRY_AFTER_S = 5;

// SQLSTATE classes and codes that mean "Postgres is not there right now", not "this request is wrong":
// 08 connection exceptions, 57P01-57P03 shutdown / crash / starting up, 53300 too many connections,
// 57014 a statement cancelled by statement_timeout.
const UNAVAILABLE_CODES = new Set(['57P01', '57P02', '57P03', '53300', '57014']);
const NETWORK_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENETUNREACH', 'ENOTFOUND', 'EAI_AGAIN']);
const DRIVER_MESSAGES = [
  'Connection terminated',
  'timeout exceeded when trying to connect',
  'Query read timeout',
  'Client has encountered a connection error and is not queryable',
  'Connection ended unexpectedly',
];

function unavailableHere(e: { code?: unknown; message?: unknown }): boolean {
  const code = typeof e.code === 'string' ? e.code : '';
  if (code.startsWith('08') || UNAVAILABLE_CODES.has(code) || NETWORK_CODES.has(code)) return true;
  const message = typeof e.message === 'string' ? e.message : '';
  return DRIVER_MESSAGES.some((m) => message.includes(m));
}

/**
 * True when `err` (or what it wraps: Drizzle's query error, an AggregateError of
 * connection attempts) says the database cannot be reached or did not answer in time.
 */
export function isDatabaseUnavailable(err: unknown, depth = 0): boolean {
  if (!err || typeof err !== 'object' || depth > 4) return false;
  const e = err as { code?: unknown; message?: unknown; cause?: unknown; errors?: unknown };
  if (unavailableHere(e)) return true;
  if (Array.isArray(e.errors) && e.errors.some((inner) => isDatabaseUnavailable(inner, depth + 1))) return true;
  return isDatabaseUnavailable(e.cause, depth + 1);
}
