import { inArray } from 'drizzle-orm';
import { connectDatabase, migrateDatabase, type Db } from '../db/client';
import { members } from '../db/schema';
import { demoShop, seedDemoShop } from '../db/seed';
import { createApp } from './app';
import { hashPassword } from './auth';
import { loadEnv } from './env';
import { createLogger } from './logger';
import { loadMailEnv } from './mail/mailEnv';
import { startMail } from './mail/startMail';
import { DEFAULT_STORAGE_DIR, localFolderStorage } from './storage/localFolderStorage';
import { startTracing } from './trace/startTracing';
import { queueTimingFromEnv } from './trace/traceJobs';

/** The demo sign-ins, printed while the demo accounts still exist. */
async function demoBanner(db: Db): Promise<string> {
  const emails: string[] = demoShop.members.map((m) => m.email);
  const present = await db.select({ email: members.email }).from(members).where(inArray(members.email, emails));
  if (present.length === 0) return '';
  const rows = demoShop.members.filter((m) => present.some((p) => p.email === m.email));
  return rows.map((m) => `  demo ${m.role.replace('_', ' ')}: ${m.email} / ${demoShop.password}\n`).join('');
}

async function main() {
  const env = loadEnv();
  const mailEnv = loadMailEnv();
  const logger = createLogger(env.LOG_LEVEL);
  const database = connectDatabase(env.DATABASE_URL);
  await migrateDatabase(database.db);
  if (env.SEED_DEMO === '1') {
    const demo = await seedDemoShop(database.db, hashPassword);
    if (demo) logger.info({ email: demo.email }, 'seeded the demo shop');
  }
  const mail = await startMail(database.db, mailEnv, logger);
  const storage = localFolderStorage(env.STORAGE_DIR || DEFAULT_STORAGE_DIR);
  // TRACE_WORKER=0 leaves tracing to separate `npm run worker` processes.
  const tracing = await startTracing({ db: database.db, databaseUrl: env.DATABASE_URL, storage, logger, worker: process.env.TRACE_WORKER !== '0', queue: queueTimingFromEnv() });
  const app = createApp({ db: database.db, logger, webDir: env.WEB_DIR, mailer: mail.mailer, publicUrl: mailEnv.PUBLIC_URL, storage, tracing });
  const server = app.listen(env.PORT, env.HOST, () => {
    logger.info(`Matwright is serving on http://${env.HOST}:${env.PORT}`);
    void demoBanner(database.db).then((lines) => process.stdout.write(`\n  Matwright: http://${env.HOST}:${env.PORT}\n${lines}\n`));
  });
  const stop = () => {
    server.close(() => void tracing.stop().then(() => Promise.all([mail.close(), database.close()])).then(() => process.exit(0)));
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err) => {
  process.stderr.write(`${err instanceof Error ? err.stack ?? err.message : String(err)}\n`);
  process.exit(1);
});
