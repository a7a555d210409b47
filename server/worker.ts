import { connectDatabase, migrateDatabase } from '../db/client';
import { loadEnv } from './env';
import { createLogger } from './logger';
import { DEFAULT_STORAGE_DIR, localFolderStorage } from './storage/localFolderStorage';
import { startTracing } from './trace/startTracing';
import { queueTimingFromEnv } from './trace/traceJobs';

/**
 * A tracing worker on its own: takes garment-trace jobs from the queue in
 * the shared database and writes results to the shared storage. Run as many
 * as the machines allow; a job whose worker dies is handed to another.
 */
async function main() {
  const env = loadEnv();
  const logger = createLogger(env.LOG_LEVEL);
  const database = connectDatabase(env.DATABASE_URL, {
    timeouts: { connectMs: env.DB_CONNECT_TIMEOUT_MS, statementMs: env.DB_STATEMENT_TIMEOUT_MS },
    onIdleError: (err) => logger.warn({ err }, 'a database connection was lost; it is replaced on the next query'),
  });
  await migrateDatabase(database.pool);
  const storage = localFolderStorage(env.STORAGE_DIR || DEFAULT_STORAGE_DIR);
  const tracing = await startTracing({ db: database.db, databaseUrl: env.DATABASE_URL, storage, logger, worker: true, queue: queueTimingFromEnv() });
  logger.info('tracing worker is waiting for jobs');
  process.stdout.write('  Matwright tracing worker is waiting for jobs\n');
  const stop = () => void tracing.stop().then(() => database.close()).then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err) => {
  process.stderr.write(`${err instanceof Error ? err.stack ?? err.message : String(err)}\n`);
  process.exit(1);
});
