import { and, eq } from 'drizzle-orm';
import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import type { Db } from '../../db/client';
import { photos, traceRuns } from '../../db/schema';
import type { TraceStage } from '../../features/trace/schema';
import type { TraceQueue } from '../services/traces';
import type { Storage } from '../storage/storage';
import { jobDuration } from '../observability/jobMetrics';
import type { ImagePool } from './imagePool';

export const TRACE_QUEUE = 'garment-trace';

export interface JobQueueOptions {
  /** A job whose worker has not answered in this long (a crashed process) is handed to another worker. */
  expireInSeconds?: number;
  /** How often expired jobs are looked for. */
  maintenanceIntervalSeconds?: number;
  /** Attempts after the first, for failures that are not the framer's mistake. */
  retryLimit?: number;
}

/** Lets a test shorten how long a dead worker's job waits before another worker takes it. */
export function queueTimingFromEnv(): JobQueueOptions {
  const expire = Number(process.env.TRACE_EXPIRE_SECONDS);
  const maintenance = Number(process.env.TRACE_MAINTENANCE_SECONDS);
  return {
    ...(expire >= 1 ? { expireInSeconds: expire } : {}),
    ...(maintenance >= 1 ? { maintenanceIntervalSeconds: maintenance } : {}),
  };
}

/** Starts pg-boss in its own schema of the app's database and makes sure the tracing queue exists. */
export async function startJobQueue(databaseUrl: string, logger: Logger, options: JobQueueOptions = {}): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: databaseUrl,
    schema: 'jobqueue',
    max: 4,
    maintenanceIntervalSeconds: options.maintenanceIntervalSeconds ?? 15,
    monitorStateIntervalSeconds: 60,
  });
  boss.on('error', (err) => logger.error({ err }, 'job queue error'));
  await boss.start();
  await boss.createQueue(TRACE_QUEUE, {
    name: TRACE_QUEUE,
    retryLimit: options.retryLimit ?? 2,
    retryDelay: 1,
    expireInSeconds: options.expireInSeconds ?? 90,
  });
  return boss;
}

/** The web side of the queue: sends a run's id, and nudges an in-process worker so it need not wait for its next poll. */
export function traceQueueOf(boss: PgBoss, nudge?: () => void): TraceQueue {
  return {
    async send(traceId) {
      await boss.send(TRACE_QUEUE, { traceId });
      nudge?.();
    },
    depth: () => boss.getQueueSize(TRACE_QUEUE),
  };
}

interface WorkerDeps {
  boss: PgBoss;
  db: Db;
  storage: Storage;
  pool: ImagePool;
  logger: Logger;
}

const setRun = (db: Db, traceId: string, values: Partial<typeof traceRuns.$inferInsert>) =>
  db.update(traceRuns).set({ ...values, updatedAt: new Date() }).where(eq(traceRuns.id, traceId));

/**
 * Writes progress at most every 150 ms, so a fast trace does not queue a
 * write per stage, and only while the run is still running: a message that
 * arrives after the thread's answer must not overwrite the final stage.
 */
function progressWriter(db: Db, traceId: string) {
  let last = 0;
  let closed = false;
  let pending: Promise<unknown> = Promise.resolve();
  return {
    report(stage: TraceStage, progress: number) {
      const now = Date.now();
      if (closed || (now - last < 150 && progress < 0.7)) return;
      last = now;
      pending = pending
        .then(() => db.update(traceRuns).set({ stage, progress, updatedAt: new Date() }).where(and(eq(traceRuns.id, traceId), eq(traceRuns.status, 'running'))))
        .catch(() => {});
    },
    settle() {
      closed = true;
      return pending;
    },
  };
}

/** One run, start to end. Runs that already finished (a retry after a lost acknowledgement) are left alone. */
export async function processTrace(deps: Omit<WorkerDeps, 'boss'>, traceId: string, finalAttempt: boolean): Promise<void> {
  const [run] = await deps.db.select().from(traceRuns).where(eq(traceRuns.id, traceId));
  if (!run || run.status === 'done' || run.status === 'failed') return;
  await setRun(deps.db, traceId, { status: 'running', stage: 'reading', progress: 0.02, attempts: run.attempts + 1, message: null });
  const started = Date.now();
  const timer = jobDuration.startTimer({ queue: TRACE_QUEUE });
  deps.logger.info({ traceId, attempt: run.attempts + 1 }, 'trace started');
  try {
    const [photo] = await deps.db.select({ key: photos.originalKey }).from(photos).where(eq(photos.id, run.photoId));
    const stored = photo ? await deps.storage.get(photo.key) : null;
    if (!stored) {
      timer({ outcome: 'refused' });
      return void (await setRun(deps.db, traceId, { status: 'failed', stage: 'finished', message: 'The photo is no longer stored; upload it again.' }));
    }
    const chunks: Buffer[] = [];
    for await (const chunk of stored.body) chunks.push(chunk as Buffer);
    const bytes = Buffer.concat(chunks);
    const progress = progressWriter(deps.db, traceId);
    const outcome = await deps.pool.trace({ photo: new Uint8Array(bytes), calibration: run.calibration, background: run.options.background, box: run.options.box }, progress.report);
    await progress.settle();
    if (!outcome.ok) {
      timer({ outcome: 'refused' });
      return void (await setRun(deps.db, traceId, { status: 'failed', stage: 'finished', progress: 1, message: outcome.message }));
    }
    if (outcome.kind !== 'trace') throw new Error('A tracing thread answered a different task');
    await setRun(deps.db, traceId, { stage: 'saving', progress: 0.9 });
    const imageKey = `traces/${run.shopId}/${traceId}.jpg`;
    await deps.storage.put(imageKey, Buffer.from(outcome.image), 'image/jpeg');
    await setRun(deps.db, traceId, { status: 'done', stage: 'finished', progress: 1, result: outcome.result, imageKey });
    timer({ outcome: 'done' });
    deps.logger.info({ traceId, ms: Date.now() - started }, 'trace finished');
  } catch (err) {
    timer({ outcome: 'error' });
    deps.logger.error({ err, traceId }, 'trace failed');
    await setRun(deps.db, traceId, finalAttempt
      ? { status: 'failed', stage: 'finished', message: 'Tracing failed on the server after several tries. Try again, or try a smaller photo.' }
      : { status: 'queued', stage: 'waiting', message: 'Tracing stopped unexpectedly; it will be tried again.' });
    throw err;
  }
}

/** Takes tracing jobs from the queue one at a time and runs them on the image threads. Returns the worker's id. */
export async function startTraceWorker(deps: WorkerDeps): Promise<string> {
  return deps.boss.work<{ traceId: string }>(TRACE_QUEUE, { batchSize: 1, pollingIntervalSeconds: 1, includeMetadata: true }, async ([job]) => {
    if (!job) return;
    await processTrace(deps, job.data.traceId, job.retryCount >= job.retryLimit);
  });
}
