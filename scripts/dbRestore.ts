// `npm run db:restore FILE`: restores a `npm run db:backup` file into an empty
// database (DATABASE_URL, or this checkout's own Postgres database named by
// RESTORE_DATABASE, default "matwright", created when missing), then checks
// every photo and trace file the rows name against the backup's object list.
import fs from 'node:fs';
import pg from 'pg';
import { missingObjects, objectListFile, restoreDatabase, type ObjectList } from '../server/backup/backup';
// @ts-expect-error plain ESM script without types
import { ensurePostgres } from './postgres.mjs';

const file = process.argv[2];
if (!file) {
  process.stderr.write('Usage: npm run db:restore FILE   (a .dump written by npm run db:backup)\n');
  process.exit(2);
}

/** This checkout's Postgres, with the target database created when it does not exist yet. */
async function localTarget(name: string): Promise<string> {
  const admin = (ensurePostgres('matwright') as { url: string }).url;
  const client = new pg.Client({ connectionString: admin });
  await client.connect();
  const found = await client.query('select 1 from pg_database where datname = $1', [name]);
  if (found.rowCount === 0) await client.query(`create database "${name.replace(/"/g, '')}"`);
  await client.end();
  const url = new URL(admin);
  url.pathname = `/${name}`;
  return url.toString();
}

const databaseUrl = process.env.DATABASE_URL ?? (await localTarget(process.env.RESTORE_DATABASE ?? 'matwright'));
const started = Date.now();
try {
  await restoreDatabase({ databaseUrl, file });
} catch (err) {
  process.stderr.write(`${err instanceof Error ? err.message : String(err)}\n`);
  process.exit(1);
}
process.stdout.write(`restored ${file} in ${Date.now() - started} ms\n`);
const listFile = objectListFile(file);
if (fs.existsSync(listFile)) {
  const list = JSON.parse(fs.readFileSync(listFile, 'utf8')) as ObjectList;
  const missing = await missingObjects(databaseUrl, list);
  process.stdout.write(`${list.count} stored objects were listed at backup time; ${missing.length} referenced by rows are not among them\n`);
  for (const key of missing.slice(0, 20)) process.stdout.write(`  missing: ${key}\n`);
}
