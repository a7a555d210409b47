import { connectDatabase, migrateDatabase } from '../db/client';
import { seedDemoShop } from '../db/seed';
import { createApp } from './app';
import { hashPassword } from './auth';
import { loadEnv } from './env';
import { createLogger } from './logger';
import { loadMailEnv } from './mail/mailEnv';
import { startMail } from './mail/startMail';

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
  const app = createApp({ db: database.db, logger, webDir: env.WEB_DIR, mailer: mail.mailer, publicUrl: mailEnv.PUBLIC_URL });
  const server = app.listen(env.PORT, env.HOST, () => {
    logger.info(`Matwright is serving on http://${env.HOST}:${env.PORT}`);
  });
  const stop = () => {
    server.close(() => void Promise.all([mail.close(), database.close()]).then(() => process.exit(0)));
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err) => {
  process.stderr.write(`${err instanceof Error ? err.stack ?? err.message : String(err)}\n`);
  process.exit(1);
});
