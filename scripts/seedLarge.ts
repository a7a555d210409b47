/**
 * `npm run seed:large`: the demo shop with 10 000 more jobs and 2 000 more
 * customers of invented data, in this checkout's development database (or
 * DATABASE_URL), to try the lists at a busy shop's size.
 *
 *   npm run seed:large                 (JOBS=... CUSTOMERS=... to change the counts)
 */
import { connectDatabase, migrateDatabase } from '../db/client';
import { demoShop, seedDemoShop } from '../db/seed';
import { seedLargeShop } from '../db/seedLarge';
import { hashPassword } from '../server/auth';
// @ts-expect-error plain Node module without types
import { ensurePostgres } from './postgres.mjs';

const { url } = ensurePostgres('matwright') as { url: string };
const database = connectDatabase(url);
try {
  await migrateDatabase(database.pool);
  await seedDemoShop(database.db, hashPassword);
  const started = performance.now();
  const seeded = await seedLargeShop(database.db, demoShop.members[0].email, {
    jobs: Number(process.env.JOBS) || undefined,
    customers: Number(process.env.CUSTOMERS) || undefined,
  });
  process.stdout.write(`added ${seeded.jobs} jobs and ${seeded.customers} customers to the demo shop in ${((performance.now() - started) / 1000).toFixed(1)} s\n`);
} finally {
  await database.close();
}
