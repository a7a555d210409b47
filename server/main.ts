import { connectDatabase, migrateDatabase } from '../db/client';
import { seedDemoShop } from '../db/seed';
import { createApp } from './app';
import { createComputePool } from './compute/computePool';
import { createPageDrawer } from './pages/pageDrawer';
import { hashPassword } from './auth';
import { accountsWithDemoPassword, demoBanner } from './demoAccounts';
import { loadEnv, type Env } from './env';
import { createLogger } from './logger';
import { loadMailEnv } from './mail/mailEnv';
import { startMail } from './mail/startMail';
import { loadPaymentsConfig, paymentsOff } from './payments/paymentsEnv';
import { stopGracefullyOnSignals } from './shutdown';
import { storageFromEnv } from './storage/storageFromEnv';
import { startTracing } from './trace/startTracing';
import { queueTimingFromEnv } from './trace/traceJobs';

function connect(env: Env, logger: ReturnType<typeof createLogger>) {
  return connectDatabase(env.DATABASE_URL, {
    timeouts: { connectMs: env.DB_CONNECT_TIMEOUT_MS, statementMs: env.DB_STATEMENT_TIMEOUT_MS },
    // An idle connection dropped by a Postgres restart: the pool forgets it and opens a new one when needed.
    onIdleError: (err) => logger.warn({ err }, 'a database connection was lost; it is replaced on the next request'),
  });
}

/** The demo shop only where people try things out; production refuses to run with its published password. */
async function prepareAccounts(env: Env, database: ReturnType<typeof connectDatabase>, logger: ReturnType<typeof createLogger>) {
  if (env.NODE_ENV === 'production') {
    const open = await accountsWithDemoPassword(database.db);
    if (open.length > 0) {
      throw new Error(
        `Refusing to start in production: ${open.join(', ')} still sign${open.length === 1 ? 's' : ''} in with the published demo password. ` +
          'Change the password or remove the demo shop first.',
      );
    }
    return;
  }
  if (env.SEED_DEMO === '1') {
    const demo = await seedDemoShop(database.db, hashPassword);
    if (demo) logger.info({ email: demo.email }, 'seeded the demo shop');
  }
}

/** Where this process can reach itself: a wildcard listen address is reached on loopback. */
const webhookHost = (host: string) => (host === '0.0.0.0' || host === '::' ? '127.0.0.1' : host.includes(':') ? `[${host}]` : host);

async function main() {
  const env = loadEnv();
  const mailEnv = loadMailEnv();
  const paymentsConfig = loadPaymentsConfig();
  const logger = createLogger(env.LOG_LEVEL);
  const database = connect(env, logger);
  await migrateDatabase(database.pool);
  await prepareAccounts(env, database, logger);
  const mail = await startMail(database.db, mailEnv, logger);
  const stored = await storageFromEnv();
  const storage = stored.storage;
  logger.info(`photos and files are kept in the ${stored.describe}`);
  let draining = false;
  // The provider's SDK is loaded only when online payments are on; the local stand-in sends its webhooks straight to this process.
  const webhookUrl = `http://${webhookHost(env.HOST)}:${env.PORT}/api/payments/webhook`;
  const payments = paymentsConfig.mode === 'off' ? paymentsOff(logger) : await (await import('./payments/provider')).startPayments(paymentsConfig, webhookUrl, logger);
  // TRACE_WORKER=0 leaves tracing to separate `npm run worker` processes.
  const tracing = await startTracing({ db: database.db, databaseUrl: env.DATABASE_URL, storage, logger, worker: process.env.TRACE_WORKER !== '0', queue: queueTimingFromEnv() });
  // Cut files, cut sheets, checks and large layouts run here, off the event loop (COMPUTE_* settings).
  const compute = createComputePool({ keepWarm: true });
  // Signed-in pages drawn with their data on a thread of their own, reading this server's API as the visitor.
  const pageDrawer = createPageDrawer({
    webDir: env.WEB_DIR,
    bundle: env.PAGES_BUNDLE,
    apiOrigin: `http://${webhookHost(env.HOST)}:${env.PORT}`,
    logger,
  });
  const app = createApp({
    compute,
    pageDrawer,
    db: database.db,
    logger,
    webDir: env.WEB_DIR,
    mailer: mail.mailer,
    publicUrl: env.publicUrl,
    throttle: { minPerAddress: env.AUTH_LIMIT_PER_ADDRESS },
    storage,
    tracing,
    payments: payments.provider,
    paymentCurrency: paymentsConfig.currency,
    metricsToken: env.METRICS_TOKEN,
    draining: () => draining,
  });
  const server = app.listen(env.PORT, env.HOST, () => {
    logger.info(`Matwright is serving on http://${env.HOST}:${env.PORT}`);
    void demoBanner(database.db)
      .then((lines) => process.stdout.write(`\n  Matwright: http://${env.HOST}:${env.PORT}\n${lines}\n`))
      .catch((err: unknown) => logger.warn({ err }, 'could not list the demo accounts'));
  });
  stopGracefullyOnSignals(server, {
    logger,
    startDraining: () => (draining = true),
    drainDelayMs: env.SHUTDOWN_DRAIN_MS,
    timeoutMs: env.SHUTDOWN_TIMEOUT_MS,
    // The queue first (an in-process worker finishes or hands back its job), then the image and compute threads, mail, payments, storage, pool.
    closeResources: async () => {
      await tracing.stop(env.SHUTDOWN_TIMEOUT_MS);
      await compute.close();
      await pageDrawer?.close();
      await Promise.all([mail.close(), payments.close(), stored.close()]);
      await database.close();
    },
  });
}

main().catch((err) => {
  process.stderr.write(`${err instanceof Error ? err.stack ?? err.message : String(err)}\n`);
  process.exit(1);
});
