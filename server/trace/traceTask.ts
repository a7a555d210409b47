import type { MessagePort } from 'node:worker_threads';
import type { Calibration, TraceResult } from '../../features/trace/schema';
import { heicToJpeg } from './decodePhoto';
import { proposeCorners } from './proposeCorners';
import { TraceInputError } from './raster';
import { traceGarment } from './runTrace';

/** Work handed to a tracing thread. Photos travel as bytes; nothing here touches the database. */
export type ImageTask =
  | {
      kind: 'trace';
      photo: Uint8Array;
      calibration: Calibration;
      background?: { x: number; y: number } | null;
      box?: { x: number; y: number; width: number; height: number } | null;
      /** Receives `{ stage, progress }` as the trace goes. */
      progressPort?: MessagePort;
    }
  | { kind: 'corners'; photo: Uint8Array }
  /** A phone's HEIC photo turned into JPEG, for uploads sharp's build cannot decode. */
  | { kind: 'heicToJpeg'; photo: Uint8Array }
  /** Loads the tracing code into the thread before the first real job needs it. */
  | { kind: 'warm' };

/** A framer's mistake comes back as data, because an Error loses its class between threads. */
export type ImageTaskResult =
  | { ok: true; kind: 'trace'; result: TraceResult; image: Uint8Array; pxPerIn: number }
  | { ok: true; kind: 'corners'; corners: { x: number; y: number }[] | null }
  | { ok: true; kind: 'warm' }
  | { ok: true; kind: 'heicToJpeg'; jpeg: Uint8Array }
  | { ok: false; code: TraceInputError['code']; message: string };

/** The entry a worker thread runs: one task, its answer, and its peak memory left to the pool. */
export default async function runImageTask(task: ImageTask): Promise<ImageTaskResult> {
  if (task.kind === 'warm') return { ok: true, kind: 'warm' };
  const photo = Buffer.from(task.photo.buffer, task.photo.byteOffset, task.photo.byteLength);
  try {
    if (task.kind === 'corners') return { ok: true, kind: 'corners', corners: await proposeCorners(photo) };
    if (task.kind === 'heicToJpeg') return { ok: true, kind: 'heicToJpeg', jpeg: new Uint8Array(await heicToJpeg(photo)) };
    const port = task.progressPort;
    const out = await traceGarment({ photo, calibration: task.calibration, background: task.background, box: task.box }, (stage, progress) =>
      port?.postMessage({ stage, progress }),
    );
    port?.close();
    return { ok: true, kind: 'trace', result: out.result, image: new Uint8Array(out.image), pxPerIn: out.pxPerIn };
  } catch (err) {
    if (err instanceof TraceInputError) return { ok: false, code: err.code, message: err.message };
    throw err;
  }
}
