import { bigint, integer, pgTable, varchar } from 'drizzle-orm/pg-core';

/**
 * Attempt counters for sign-in, sign-up, joining and password changes, shared by
 * every server process. The columns are the ones rate-limiter-flexible's Postgres
 * store reads and writes; it is created here so the store never races to create it.
 */
export const rateLimits = pgTable('rate_limits', {
  /** "<limiter>:<hashed account or address>". */
  key: varchar('key', { length: 255 }).primaryKey(),
  /** Attempts counted in the current window. */
  points: integer('points').notNull().default(0),
  /** When the window ends, in milliseconds since 1970; null never ends. */
  expire: bigint('expire', { mode: 'number' }),
});
