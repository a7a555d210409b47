import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { connectDatabase, migrateDatabase } from '../../db/client';
import { seedDemoShop } from '../../db/seed';
import { hashPassword } from '../auth';
import { localFolderStorage } from '../storage/localFolderStorage';
import { backupDatabase, DATA_SCHEMAS, missingObjects, objectListFile, restoreDatabase, userTables, type ObjectList } from './backup';

const baseUrl = inject('databaseUrl');
const tag = `${Date.now()}_${process.pid}`;
const names = { source: `matwright_backup_src_${tag}`, target: `matwright_backup_dst_${tag}` };
const urlOf = (name: string) => Object.assign(new URL(baseUrl), { pathname: `/${name}` }).toString();
const folder = await fs.mkdtemp(path.join(os.tmpdir(), 'matwright-backup-'));

async function admin<T>(work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: baseUrl });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

beforeAll(async () => {
  await admin(async (c) => {
    await c.query(`create database "${names.source}"`);
    await c.query(`create database "${names.target}"`);
  });
  const source = connectDatabase(urlOf(names.source));
  await migrateDatabase(source.pool);
  await seedDemoShop(source.db, hashPassword);
  await source.close();
}, 60000);

afterAll(async () => {
  await admin(async (c) => {
    for (const name of Object.values(names)) await c.query(`drop database if exists "${name}" with (force)`);
  });
  await fs.rm(folder, { recursive: true, force: true });
});

/** Rows of every table in the data schemas, counted by the database itself. */
async function rowCounts(url: string): Promise<Record<string, number>> {
  const tables = await userTables(url);
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  const counts: Record<string, number> = {};
  for (const table of tables) {
    const [schema, name] = table.split('.');
    counts[table] = Number((await client.query(`select count(*) as n from "${schema}"."${name}"`)).rows[0].n);
  }
  await client.end();
  return counts;
}

/** Every layout draft and frozen version, as Postgres returns the JSON, keyed by id. */
async function layoutDocuments(url: string) {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  const drafts = await client.query('select id, draft_revision, draft, draft_outlines from layouts order by id');
  const versions = await client.query('select id, layout_id, number, document from layout_versions order by id');
  const photos = await client.query('select id, original_key, preview_key from photos order by id');
  await client.end();
  return { drafts: drafts.rows, versions: versions.rows, photos: photos.rows };
}

describe('backup and restore', () => {
  it('a restored database has every row count and every layout document of the demo shop equal', async () => {
    const storage = localFolderStorage(path.join(folder, 'storage'));
    await storage.put('photos/demo/one.original.jpg', Buffer.from('jpeg'), 'image/jpeg');
    const file = path.join(folder, 'demo.dump');
    const out = await backupDatabase({ databaseUrl: urlOf(names.source), file, storage, storageName: 'test folder' });
    // pg_dump's custom format starts with the magic "PGDMP" (PostgreSQL docs, pg_dump -Fc).
    expect((await fs.readFile(file)).subarray(0, 5).toString()).toBe('PGDMP');
    const list = JSON.parse(await fs.readFile(out.objects!, 'utf8')) as ObjectList;
    expect(out.objects).toBe(objectListFile(file));
    expect(list.objects).toEqual([{ key: 'photos/demo/one.original.jpg', bytes: 4 }]);

    expect(await userTables(urlOf(names.target))).toEqual([]);
    await restoreDatabase({ databaseUrl: urlOf(names.target), file });
    const before = await rowCounts(urlOf(names.source));
    const after = await rowCounts(urlOf(names.target));
    expect(Object.keys(before).length).toBeGreaterThan(10);
    expect(before['public.layouts']).toBeGreaterThan(0);
    expect(before['public.jobs']).toBeGreaterThan(0);
    expect(after).toEqual(before);
    const documents = await layoutDocuments(urlOf(names.source));
    expect(documents.drafts.length).toBeGreaterThan(0);
    expect(await layoutDocuments(urlOf(names.target))).toEqual(documents);
    expect(await missingObjects(urlOf(names.target), list)).toEqual([]);
  }, 60000);

  it('refuses to restore into a database that already has tables, and changes nothing there', async () => {
    const before = await rowCounts(urlOf(names.source));
    const file = path.join(folder, 'again.dump');
    await backupDatabase({ databaseUrl: urlOf(names.source), file });
    await expect(restoreDatabase({ databaseUrl: urlOf(names.source), file })).rejects.toThrow(/already has \d+ tables/);
    expect(await rowCounts(urlOf(names.source))).toEqual(before);
    expect(DATA_SCHEMAS).toContain('public');
  }, 60000);

  it('names the photo files a restored row points at that the object list lacks', async () => {
    const client = new pg.Client({ connectionString: urlOf(names.target) });
    await client.connect();
    const piece = (await client.query('select id, shop_id from pieces limit 1')).rows[0];
    await client.query(
      `insert into photos (shop_id, piece_id, original_key, preview_key, mime_type, bytes, width_px, height_px)
       values ($1, $2, 'photos/demo/gone.original.jpg', 'photos/demo/gone.preview.jpg', 'image/jpeg', 4, 1, 1)`,
      [piece.shop_id, piece.id],
    );
    await client.end();
    const list: ObjectList = { createdAt: '', storage: '', count: 1, totalBytes: 4, objects: [{ key: 'photos/demo/gone.original.jpg', bytes: 4 }] };
    expect(await missingObjects(urlOf(names.target), list)).toEqual(['photos/demo/gone.preview.jpg']);
  });
});
