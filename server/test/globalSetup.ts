import pg from 'pg';
import type { TestProject } from 'vitest/node';
import { connectDatabase, migrateDatabase } from '../../db/client';
// @ts-expect-error plain ESM script without types; it runs before node_modules exists
import { ensurePostgres } from '../../scripts/postgres.mjs';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

function withDatabase(url: string, name: string): string {
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
}

/** A fresh database for this run, migrated, dropped again when the run ends. */
export default async function setup(project: TestProject) {
  const adminUrl: string = process.env.MATWRIGHT_ADMIN_URL ?? (ensurePostgres('matwright') as { url: string }).url;
  const name = `matwright_test_${Date.now()}_${process.pid}`;
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  await admin.query(`CREATE DATABASE "${name}"`);
  await admin.end();

  const url = withDatabase(adminUrl, name);
  const database = connectDatabase(url);
  await migrateDatabase(database.pool);
  await database.close();
  project.provide('databaseUrl', url);

  return async () => {
    const client = new pg.Client({ connectionString: adminUrl });
    await client.connect();
    await client.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
    await client.end();
  };
}
