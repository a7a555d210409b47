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
// With STORAGE=s3-local this lists the fake `npm start` serves, or starts one on the same folder.
const stored = await storageFromEnv(process.env);
try {
  const started = Date.now();
  const out = await backupDatabase({ databaseUrl, file, storage: stored.storage, storageName: stored.describe });
  process.stdout.write(`database: ${out.file} (${(out.bytes / 1024).toFixed(0)} KB)\nobject list: ${out.objects}\ntook ${Date.now() - started} ms\n`);
  process.stdout.write('Keep the files themselves with the bucket\'s versioning or a copy (README, "Backups").\n');
} finally {
  await stored.close();
}
