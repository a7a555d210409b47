import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import path from 'node:path';
import pg from 'pg';
import * as schema from './schema';

export type Db = NodePgDatabase<typeof schema>;

export interface Database {
  db: Db;
  pool: pg.Pool;
  close(): Promise<void>;
}

export function connectDatabase(url: string): Database {
  const pool = new pg.Pool({ connectionString: url, max: 10 });
  const db = drizzle(pool, { schema, casing: 'snake_case' });
  return { db, pool, close: () => pool.end() };
}

export const migrationsFolder = path.resolve(process.env.MIGRATIONS_DIR ?? path.join(process.cwd(), 'migrations'));

/** Applies every migration drizzle-kit generated that the database has not seen. */
export async function migrateDatabase(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder });
}
