import { eq } from 'drizzle-orm';
import { inject, describe, expect, it, afterAll } from 'vitest';
import pg from 'pg';
import { checkLayout, parseLayout } from '../geometry';
import { jobStatuses } from '../features/jobs/schema';
import { connectDatabase, migrateDatabase } from './client';
import { layouts, pieces, jobs, customers, shops } from './schema';
import { hashPassword } from '../server/auth';
import { joinDraft } from '../server/services/draftOutlines';
import { seedDemoShop } from './seed';

const seedDbName = `matwright_seed_${Date.now()}`;

async function admin(statement: string) {
  const client = new pg.Client({ connectionString: inject('databaseUrl') });
  await client.connect();
  await client.query(statement);
  await client.end();
}

/** Seeding needs an empty database, so this test makes its own beside the shared one. */
async function freshDatabase(): Promise<string> {
  await admin(`CREATE DATABASE "${seedDbName}"`);
  const url = new URL(inject('databaseUrl'));
  url.pathname = `/${seedDbName}`;
  return url.toString();
}

describe('demo seed', () => {
  let close: () => Promise<void> = async () => {};
  afterAll(async () => {
    await close();
    await admin(`DROP DATABASE IF EXISTS "${seedDbName}" WITH (FORCE)`);
  });

  it('fills an empty database once: a dozen customers and jobs in every status, pieces with sizes, a valid layout', async () => {
    const database = connectDatabase(await freshDatabase());
    close = database.close;
    await migrateDatabase(database.pool);
    const first = await seedDemoShop(database.db, hashPassword);
    expect(first?.email).toBe('owner@tallowmere.example');
    expect(await seedDemoShop(database.db, hashPassword)).toBeNull();

    const db = database.db;
    expect(await db.$count(shops)).toBe(1);
    expect(await db.$count(customers)).toBe(12);
    const statuses = new Set((await db.select({ s: jobs.status }).from(jobs)).map((r) => r.s));
    expect([...statuses].sort()).toEqual([...jobStatuses].sort());
    const sizes = await db.select({ w: pieces.widthIn, h: pieces.heightIn }).from(pieces);
    expect(sizes).toContainEqual({ w: 10, h: 8 });

    const [layout] = await db.select().from(layouts).where(eq(layouts.name, 'Jersey, two patches, photo and plaque'));
    const parsed = parseLayout(joinDraft(layout!.draft, layout!.draftOutlines));
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    expect(parsed.layout.openings).toHaveLength(5);
    const errors = checkLayout(parsed.layout).filter((f) => f.severity === 'error');
    expect(errors).toEqual([]);
  });
});
