import { execFile } from 'node:child_process';
import fs from 'node:fs';
import fsp from 'node:fs/promises';
import path from 'node:path';
import { promisify } from 'node:util';
import pg from 'pg';
import type { Storage } from '../storage/storage';

const run = promisify(execFile);

/** Schemas a Matwright database keeps data in: the app's tables, drizzle's migration log, pg-boss's queue. */
export const DATA_SCHEMAS = ['public', 'drizzle', 'jobqueue'];

/**
 * Debian's client tools for the newest installed server (pg_dump must be at
 * least the server's version), falling back to the ones on PATH.
 */
export function pgTool(name: 'pg_dump' | 'pg_restore'): string {
  const base = '/usr/lib/postgresql';
  const versions = fs.existsSync(base) ? fs.readdirSync(base).filter((v) => fs.existsSync(path.join(base, v, 'bin', name))) : [];
  versions.sort((a, b) => Number(b) - Number(a));
  return versions[0] ? path.join(base, versions[0], 'bin', name) : name;
}

export interface ObjectList {
  createdAt: string;
  storage: string;
  count: number;
  totalBytes: number;
  objects: { key: string; bytes: number }[];
}

/** The file holding a backup's object list, beside the dump. */
export const objectListFile = (dumpFile: string) => dumpFile.replace(/\.dump$/, '') + '.objects.json';

/**
 * Writes a pg_dump custom-format archive of the whole database (restorable
 * table by table with pg_restore) and, beside it, the storage's object list:
 * which photo and trace files the rows point at, with their sizes. The files
 * themselves are kept by the bucket's own versioning or copy (see README).
 */
export async function backupDatabase(options: { databaseUrl: string; file: string; storage?: Storage; storageName?: string }): Promise<{ file: string; objects: string | null; bytes: number }> {
  await fsp.mkdir(path.dirname(path.resolve(options.file)), { recursive: true });
  await run(pgTool('pg_dump'), ['--format=custom', '--no-owner', '--no-privileges', '--file', options.file, '--dbname', options.databaseUrl], { maxBuffer: 16 * 1024 * 1024 });
  const bytes = (await fsp.stat(options.file)).size;
  if (!options.storage) return { file: options.file, objects: null, bytes };
  const objects = await options.storage.list();
  const list: ObjectList = {
    createdAt: new Date().toISOString(),
    storage: options.storageName ?? 'storage',
    count: objects.length,
    totalBytes: objects.reduce((sum, o) => sum + o.bytes, 0),
    objects,
  };
  const objectsFile = objectListFile(options.file);
  await fsp.writeFile(objectsFile, JSON.stringify(list, null, 1));
  return { file: options.file, objects: objectsFile, bytes };
}

/** Tables in the data schemas; an empty database has none. */
export async function userTables(databaseUrl: string): Promise<string[]> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const res = await client.query<{ name: string }>(
      `select table_schema || '.' || table_name as name from information_schema.tables
        where table_type = 'BASE TABLE' and table_schema = any($1) order by 1`,
      [DATA_SCHEMAS],
    );
    return res.rows.map((r) => r.name);
  } finally {
    await client.end();
  }
}

/** Restores a dump into an empty database; refuses one that already has tables, so nothing is overwritten. */
export async function restoreDatabase(options: { databaseUrl: string; file: string }): Promise<void> {
  if (!fs.existsSync(options.file)) throw new Error(`No backup file at ${options.file}`);
  const existing = await userTables(options.databaseUrl);
  if (existing.length > 0) {
    throw new Error(`Refusing to restore: the target database already has ${existing.length} tables (${existing.slice(0, 3).join(', ')}...). Restore into an empty database.`);
  }
  await run(pgTool('pg_restore'), ['--no-owner', '--no-privileges', '--exit-on-error', '--single-transaction', '--dbname', options.databaseUrl, options.file], { maxBuffer: 16 * 1024 * 1024 });
}

/** Storage keys the restored rows point at that the backup's object list does not hold. */
export async function missingObjects(databaseUrl: string, list: ObjectList): Promise<string[]> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const res = await client.query<{ key: string }>(
      `select original_key as key from photos union select preview_key from photos
        union select image_key from trace_runs where image_key is not null`,
    );
    const held = new Set(list.objects.map((o) => o.key));
    return res.rows.map((r) => r.key).filter((key) => !held.has(key));
  } finally {
    await client.end();
  }
}
