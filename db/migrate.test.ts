import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { connectDatabase, migrateDatabase, migrationsFolder } from './client';

const name = `matwright_migrate_${Date.now()}`;
const adminUrl = inject('databaseUrl');

async function admin(statement: string) {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  await client.query(statement);
  await client.end();
}

afterAll(() => admin(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`));

describe('migrations at start-up', () => {
  it('two processes migrating one empty database at once both succeed, and each migration is applied once', async () => {
    await admin(`CREATE DATABASE "${name}"`);
    const url = new URL(adminUrl);
    url.pathname = `/${name}`;
    // Two pools are two sessions, as two server processes would be.
    const first = connectDatabase(url.toString());
    const second = connectDatabase(url.toString());
    try {
      const results = await Promise.allSettled([migrateDatabase(first.pool), migrateDatabase(second.pool)]);
      expect(results.map((r) => r.status)).toEqual(['fulfilled', 'fulfilled']);
      const journal = JSON.parse(fs.readFileSync(path.join(migrationsFolder, 'meta', '_journal.json'), 'utf8')) as { entries: unknown[] };
      const applied = await first.pool.query('select count(*)::int as n from drizzle.__drizzle_migrations');
      expect(applied.rows[0].n).toBe(journal.entries.length);
    } finally {
      await Promise.all([first.close(), second.close()]);
    }
  });
});
