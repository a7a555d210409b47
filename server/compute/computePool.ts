import os from 'node:os';
import { Piscina } from 'piscina';
import { HttpError } from '../errors';
import computeTask, { type ComputeReply, type ComputeResults, type ComputeTask } from './computeTask';

/**
 * Threads for the CPU-heavy work of the API (cut files, cut sheets, the
 * checks at freeze and at export, parsing large layout documents), so the
 * event loop keeps answering every other request meanwhile. Each task has a
 * time budget and each thread a heap limit; past either, the framer reads
 * plain words (422) and the thread is replaced. A full queue is a 503.
 */

export interface ComputeLimits {
  /** How long one task may run (queue wait included) before it is stopped. */
  readonly budgetMs: number;
  /** Heap of each thread; a document that needs more fails its own task, not the server. */
  readonly heapMb: number;
  readonly threads: number;
  /** Tasks waiting for a thread before new ones are turned away with 503. */
  readonly maxQueue: number;
  /** Keep one thread loaded at all times (the server), rather than starting threads on demand (tests). */
  readonly keepWarm: boolean;
}

export const defaultComputeLimits: ComputeLimits = {
  budgetMs: Number(process.env.COMPUTE_BUDGET_MS) || 20_000,
  heapMb: Number(process.env.COMPUTE_HEAP_MB) || 256,
  threads: Number(process.env.COMPUTE_THREADS) || Math.max(1, Math.min(4, os.availableParallelism())),
  maxQueue: Number(process.env.COMPUTE_MAX_QUEUE) || 500,
  keepWarm: false,
};

export interface ComputePool {
  run<K extends ComputeTask['kind']>(task: Extract<ComputeTask, { kind: K }>): Promise<ComputeResults[K]>;
  /** Lets running tasks finish (up to `graceMs`), then stops every thread. Safe to call twice. */
  close(graceMs?: number): Promise<void>;
  readonly limits: ComputeLimits;
}

const seconds = (ms: number) => (ms >= 1000 ? `${Math.round(ms / 1000)} seconds` : `${ms} ms`);

/** A thread's failure, in words a framer can act on. */
function failureAsHttp(err: unknown, limits: ComputeLimits): unknown {
  const name = (err as { name?: string }).name;
  const code = (err as { code?: string }).code;
  const message = err instanceof Error ? err.message : String(err);
  if (name === 'AbortError' || name === 'TimeoutError') {
    return new HttpError(
      422, 'took_too_long',
      `This took longer than the ${seconds(limits.budgetMs)} allowed, so it was stopped and nothing was made. ` +
        'Traced outlines with fewer points, or fewer openings per board, make it quicker.',
    );
  }
  if (code === 'ERR_WORKER_OUT_OF_MEMORY' || /out of memory/i.test(message)) {
    return new HttpError(
      422, 'too_large',
      `This layout needs more than the ${limits.heapMb} MB of working memory allowed for one task, so nothing was made. ` +
        'Traced outlines with fewer points make it smaller.',
    );
  }
  if (/queue is at limit|queue is full/i.test(message) || /terminated|destroyed|closed/i.test(message)) {
    return new HttpError(503, 'busy', 'The server is busy making other files; try again in a few seconds.', undefined, undefined, 5);
  }
  return err; // a fault of ours: logged as a 500 by the error handler
}

function resultOf<K extends ComputeTask['kind']>(reply: ComputeReply): ComputeResults[K] {
  if (!reply.ok) {
    const { status, code, message, fields, extra } = reply.error;
    throw new HttpError(status, code, message, fields, extra);
  }
  return reply.value as ComputeResults[K];
}

/**
 * The same tasks run in the calling thread, with no budget: for tests and
 * scripts that build an app of their own. The server (main.ts) always runs
 * a pool of threads.
 */
export function inlineCompute(): ComputePool {
  let closed = false;
  return {
    limits: defaultComputeLimits,
    async run<K extends ComputeTask['kind']>(task: Extract<ComputeTask, { kind: K }>) {
      if (closed) throw new HttpError(503, 'shutting_down', 'The server is restarting; try again in a few seconds.', undefined, undefined, 5);
      return resultOf<K>(computeTask(task));
    },
    async close() {
      closed = true;
    },
  };
}

export function createComputePool(overrides: Partial<ComputeLimits> = {}): ComputePool {
  const limits = { ...defaultComputeLimits, ...overrides };
  const pool = new Piscina({
    filename: new URL('./computeThread.mjs', import.meta.url).href,
    minThreads: limits.keepWarm ? 1 : 0,
    maxThreads: limits.threads,
    maxQueue: limits.maxQueue,
    idleTimeout: 60_000,
    resourceLimits: { maxOldGenerationSizeMb: limits.heapMb },
  });
  // A thread that fails outside a task (it could not load, say) must not take the server down:
  // the task that was waiting on it fails instead.
  pool.on('error', () => undefined);
  let closing: Promise<void> | null = null;
  // A kept-warm pool loads the geometry on its first thread now; tasks wait for that
  // before their budget starts, so a slow start is never blamed on a framer's layout.
  const loaded = limits.keepWarm ? pool.run({ kind: 'warm' }).then(() => undefined, () => undefined) : Promise.resolve();

  async function run<K extends ComputeTask['kind']>(task: Extract<ComputeTask, { kind: K }>): Promise<ComputeResults[K]> {
    if (closing) throw new HttpError(503, 'shutting_down', 'The server is restarting; try again in a few seconds.', undefined, undefined, 5);
    await loaded;
    let reply: ComputeReply;
    try {
      reply = (await pool.run(task, { signal: AbortSignal.timeout(limits.budgetMs) })) as ComputeReply;
    } catch (err) {
      throw failureAsHttp(err, limits);
    }
    return resultOf<K>(reply);
  }

  function close(graceMs = 10_000): Promise<void> {
    closing ??= Promise.race([
      pool.close(),
      new Promise<void>((resolve) => setTimeout(resolve, graceMs).unref()),
    ]).then(() => pool.destroy());
    return closing;
  }

  return { run, close, limits };
}
