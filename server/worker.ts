import http from 'node:http';
import { connectDatabase, migrateDatabase } from '../db/client';
import { loadEnv } from './env';
import { createLogger } from './logger';
import { bearerMatches, createMetrics } from './observability/metrics';
import { storageFromEnv } from './storage/storageFromEnv';
import { startTracing } from './trace/startTracing';
import { queueTimingFromEnv } from './trace/traceJobs';

/** A worker's own GET /metrics (job durations, queue depth), behind the same token as the web's. */
function serveWorkerMetrics(port: number, token: string | undefined, queueDepth: () => Promise<number>): http.Server {
  const metrics = createMetrics({ token, queueDepth });
  return http.createServer((req, res) => {
    if (!token || req.url !== '/metrics') return void res.writeHead(404).end();
    if (!bearerMatches(req.headers.authorization, token)) return void res.writeHead(401, { 'WWW-Authenticate': 'Bearer realm="metrics"' }).end();
    void metrics.registry.metrics().then((text) => res.writeHead(200, { 'Content-Type': metrics.registry.contentType }).end(text));
  }).listen(port, '127.0.0.1');
}

/**
 * A background worker on its own: takes garment-trace jobs from the queue in
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
  const stored = await storageFromEnv();
  const tracing = await startTracing({ db: database.db, databaseUrl: env.DATABASE_URL, storage: stored.storage, logger, worker: true, queue: queueTimingFromEnv() });
  const metricsServer = env.WORKER_METRICS_PORT ? serveWorkerMetrics(env.WORKER_METRICS_PORT, env.METRICS_TOKEN, () => tracing.queue.depth?.() ?? Promise.resolve(0)) : null;
  logger.info({ storage: stored.describe }, 'worker is waiting for jobs');
  process.stdout.write('  Matwright worker is waiting for jobs\n');
  let stopping = false;
  // SIGTERM: take no new job; the running one finishes within SHUTDOWN_TIMEOUT_MS or is handed back to the queue.
  const stop = (signal: string) => {
    if (stopping) process.exit(1);
    stopping = true;
    logger.info({ signal }, 'worker shutting down: finishing or handing back its job');
    metricsServer?.close();
    void tracing
      .stop(env.SHUTDOWN_TIMEOUT_MS)
      .then(() => Promise.all([stored.close(), database.close()]))
      .then(() => process.exit(0), (err: unknown) => (logger.error({ err }, 'worker shutdown failed'), process.exit(1)));
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

main().catch((err) => {
  process.stderr.write(`${err instanceof Error ? err.stack ?? err.message : String(err)}\n`);
  process.exit(1);
});
