import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import type { TraceStage } from '../../features/trace/schema';
import type { ImageTask, ImageTaskResult } from './traceTask';

/** A trace that runs longer than this is stopped; its thread is replaced. */
export const IMAGE_TASK_TIMEOUT_MS = 60_000;
/** Each tracing thread's JavaScript heap is held to this; a photo that needs more fails that task, not the server. */
export const IMAGE_THREAD_HEAP_MB = 512;

/** Threads that decode and trace photos, away from the web server's event loop. */
export interface ImagePool {
  trace(task: Omit<Extract<ImageTask, { kind: 'trace' }>, 'kind' | 'progressPort'>, onProgress: (stage: TraceStage, progress: number) => void): Promise<ImageTaskResult>;
  corners(photo: Uint8Array): Promise<ImageTaskResult>;
  heicToJpeg(photo: Uint8Array): Promise<ImageTaskResult>;
  /** Resolves once a thread has loaded the tracing code. */
  ready(): Promise<void>;
  close(): Promise<void>;
}

export function createImagePool(threads = Number(process.env.TRACE_THREADS) || 1): ImagePool {
  const pool = new Piscina({
    filename: new URL('./traceThread.mjs', import.meta.url).href,
    minThreads: 1,
    maxThreads: threads,
    idleTimeout: 5 * 60_000,
    resourceLimits: { maxOldGenerationSizeMb: IMAGE_THREAD_HEAP_MB },
  });
  const run = (task: ImageTask, transfer: Transferable[] = []) =>
    pool.run(task, { transferList: transfer as never, signal: AbortSignal.timeout(IMAGE_TASK_TIMEOUT_MS) }) as Promise<ImageTaskResult>;
  // The first thread loads the tracing code now, not when the first photo waits for it.
  const warm = run({ kind: 'warm' }).catch(() => undefined);
  return {
    async trace(task, onProgress) {
      const channel = new MessageChannel();
      channel.port1.on('message', (m: { stage: TraceStage; progress: number }) => onProgress(m.stage, m.progress));
      try {
        return await run({ ...task, kind: 'trace', progressPort: channel.port2 }, [channel.port2 as unknown as Transferable]);
      } finally {
        channel.port1.close();
      }
    },
    corners: (photo) => run({ kind: 'corners', photo }),
    heicToJpeg: (photo) => run({ kind: 'heicToJpeg', photo }),
    ready: () => warm.then(() => undefined),
    close: () => pool.destroy(),
  };
}
