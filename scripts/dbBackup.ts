// `npm run db:backup [FILE]`: a pg_dump custom-format file of the database and
// the storage's object list beside it. DATABASE_URL and STORAGE as for `npm start`;
// without DATABASE_URL, this checkout's own Postgres.
import path from 'node:path';
import { backupDatabase } from '../server/backup/backup';
import { storageFromEnv } from '../server/storage/storageFromEnv';
// @ts-expect-error plain ESM script without types
import { ensurePostgres } from './postgres.mjs';

const stamp = new Date().toISOString().replace(/[-:]/g, '').replace(/\..*/, '').replace('T', '-');
const file = path.resolve(process.argv[2] ?? `backups/matwright-${stamp}.dump`);
const databaseUrl = process.env.DATABASE_URL ?? (ensurePostgres('matwright') as { url: string }).url;
// A local S3 fake may already be serving for `npm start`; this one only lists, on a free port.
const stored = await storageFromEnv({ ...process.env, S3_LOCAL_PORT: '0' });
try {
  const started = Date.now();
  const out = await backupDatabase({ databaseUrl, file, storage: stored.storage, storageName: stored.describe });
  process.stdout.write(`database: ${out.file} (${(out.bytes / 1024).toFixed(0)} KB)\nobject list: ${out.objects}\ntook ${Date.now() - started} ms\n`);
  process.stdout.write('Keep the files themselves with the bucket\'s versioning or a copy (README, "Backups").\n');
} finally {
  await stored.close();
}
