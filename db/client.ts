import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import path from 'node:path';
import pg from 'pg';
import * as schema from './schema';

/** The Drizzle handle; `$client` is its pool, for libraries that speak to pg directly (the attempt limiter). */
export type Db = NodePgDatabase<typeof schema> & { $client: pg.Pool };

export interface Database {
  db: Db;
  pool: pg.Pool;
  close(): Promise<void>;
}

/** How long the server waits on Postgres before it answers 503 instead of hanging. */
export interface DatabaseTimeouts {
  /** Opening a connection: when Postgres is down, a refused or silent connect gives up after this. */
  connectMs: number;
  /** One statement: Postgres cancels it after this, and the client stops waiting a second later. */
  statementMs: number;
}

export const DEFAULT_DB_TIMEOUTS: DatabaseTimeouts = { connectMs: 2000, statementMs: 5000 };

export interface ConnectOptions {
  timeouts?: Partial<DatabaseTimeouts>;
  /**
   * Called when an idle connection dies (Postgres restarted or the network dropped).
   * Without a listener pg's pool re-throws the error and the process ends.
   */
  onIdleError?: (err: Error) => void;
}

export function connectDatabase(url: string, options: ConnectOptions = {}): Database {
  const timeouts = { ...DEFAULT_DB_TIMEOUTS, ...options.timeouts };
  const pool = new pg.Pool({
    connectionString: url,
    max: 10,
    connectionTimeoutMillis: timeouts.connectMs,
    statement_timeout: timeouts.statementMs,
    // A statement whose server vanished without a word still ends, a little after Postgres would have cancelled it.
    query_timeout: timeouts.statementMs + 1000,
    idleTimeoutMillis: 30_000,
  });
  pool.on('error', (err) => options.onIdleError?.(err));
  const db = drizzle(pool, { schema, casing: 'snake_case' });
  return { db, pool, close: () => pool.end() };
}

export const migrationsFolder = path.resolve(process.env.MIGRATIONS_DIR ?? path.join(process.cwd(), 'migrations'));

/** Any 64-bit number works as long as every Matwright process uses the same one ("matwright" in ASCII). */
export const MIGRATION_LOCK_KEY = 0x6d617477726967n;

/**
 * Applies every migration drizzle-kit generated that the database has not seen,
 * holding a Postgres advisory lock so that two processes starting together
 * migrate one after the other instead of both creating the same tables.
 */
export async function migrateDatabase(pool: pg.Pool): Promise<void> {
  const client = await pool.connect();
  try {
    await client.query('SELECT pg_advisory_lock($1)', [MIGRATION_LOCK_KEY.toString()]);
    try {
      await migrate(drizzle(client, { schema, casing: 'snake_case' }), { migrationsFolder });
    } finally {
      await client.query('SELECT pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY.toString()]);
    }
  } finally {
    client.release();
  }
}
