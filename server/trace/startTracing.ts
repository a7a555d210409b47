import type { Logger } from 'pino';
import type { Db } from '../../db/client';
import type { TracingDeps } from '../routes/traces';
import type { Storage } from '../storage/storage';
import { createImagePool, type ImagePool } from './imagePool';
import { startJobQueue, startTraceWorker, traceQueueOf, type JobQueueOptions } from './traceJobs';

export interface Tracing extends TracingDeps {
  /**
   * Stops taking jobs; a job running here gets `timeoutMs` to finish, after which
   * pg-boss marks it failed-for-retry so another worker takes it (the hand-back).
   */
  stop(timeoutMs?: number): Promise<void>;
}

/**
 * The queue, the image threads and, when `worker` is set, a worker taking
 * tracing jobs in this process. Web processes without a worker still send
 * jobs; any process running `npm run worker` against the same database
 * takes them.
 */
export async function startTracing(options: { db: Db; databaseUrl: string; storage: Storage; logger: Logger; worker: boolean; queue?: JobQueueOptions; pool?: ImagePool }): Promise<Tracing> {
  const boss = await startJobQueue(options.databaseUrl, options.logger, options.queue);
  // One pool per process: image threads load sharp's native library, which is best kept alive for the process's life.
  const ownPool = !options.pool;
  const pool = options.pool ?? createImagePool();
  let workerId: string | null = null;
  await pool.ready();
  if (options.worker) workerId = await startTraceWorker({ boss, db: options.db, storage: options.storage, pool, logger: options.logger });
  const nudge = workerId ? () => boss.notifyWorker(workerId!) : undefined;
  return {
    queue: traceQueueOf(boss, nudge),
    pool,
    async stop(timeoutMs = 5000) {
      await boss.stop({ graceful: true, wait: true, timeout: timeoutMs });
      if (ownPool) await pool.close();
    },
  };
}
