import { and, eq } from 'drizzle-orm';
import type { z } from 'zod';
import type { Db } from '../../db/client';
import { photos, pieces, traceRuns, type TraceRunRow } from '../../db/schema';
import { polygonArea, polygonBounds, polygonSelfIntersections, quadProblem } from '../../geometry';
import { CALIBRATION_MAX_IN, type outlineSave, type TraceRequest, type TraceRun, type traceRequest } from '../../features/trace/schema';
import { HttpError, notFound } from '../errors';
import type { Storage, StoredObject } from '../storage/storage';
import { recordActivity } from './activity';

/** Hands a run to whatever processes trace jobs; the web server never traces itself. */
export interface TraceQueue {
  send(traceId: string): Promise<void>;
  /** Jobs waiting to be taken, for the metrics endpoint. */
  depth?(): Promise<number>;
}

const refuse = (message: string, field: string) => new HttpError(400, 'invalid_input', message, { [field]: message });

/** Refuses calibrations that cannot give a scale before anything is queued or kept. */
function checkCalibration(calibration: z.output<typeof traceRequest>['calibration'], photo: { widthPx: number; heightPx: number }): void {
  const all = calibration.kind === 'rectangle' ? calibration.corners : [calibration.from, calibration.to];
  const margin = 0.5 * Math.max(photo.widthPx, photo.heightPx);
  if (all.some((p) => p.x < -margin || p.y < -margin || p.x > photo.widthPx + margin || p.y > photo.heightPx + margin)) {
    throw refuse('A calibration mark lies far outside the photo; drag it back onto the photo.', 'calibration');
  }
  if (calibration.kind === 'twoPoints') {
    if (Math.hypot(calibration.to.x - calibration.from.x, calibration.to.y - calibration.from.y) < 2) {
      throw refuse('The two points are on top of each other, so they measure nothing. Place them at the two ends of the distance you typed.', 'calibration');
    }
    return;
  }
  const problem = quadProblem(calibration.corners);
  const words: Record<string, string> = {
    'too-small': 'The corner marks are too close together; mark the corners of a larger rectangle.',
    collinear: 'Three of the corner marks lie on one line; drag each mark onto its own corner of the rectangle.',
    crossing: 'The corner marks cross over; place them in order round the rectangle.',
    'not-convex': 'The corner marks do not make a four-sided shape a flat rectangle could; drag each onto a corner.',
    'not-finite': 'Mark all four corners of the rectangle.',
  };
  if (problem) throw refuse(words[problem]!, 'calibration');
}

/** The piece's photo, when both belong to this shop and this job; a 404 otherwise. */
async function findPiecePhoto(db: Db, shopId: string, jobId: string, pieceId: string, photoId: string) {
  const [row] = await db
    .select({ kind: pieces.kind, label: pieces.label, widthPx: photos.widthPx, heightPx: photos.heightPx })
    .from(photos)
    .innerJoin(pieces, eq(photos.pieceId, pieces.id))
    .where(and(eq(photos.shopId, shopId), eq(photos.id, photoId), eq(pieces.id, pieceId), eq(pieces.jobId, jobId)));
  if (!row) throw notFound('Photo of this piece');
  return row;
}

export function traceRunView(row: TraceRunRow): TraceRun {
  return {
    id: row.id,
    pieceId: row.pieceId,
    photoId: row.photoId,
    status: row.status,
    stage: row.stage,
    progress: row.progress,
    attempts: row.attempts,
    message: row.message,
    result: row.result ?? null,
    calibration: row.calibration,
    createdAt: row.createdAt.toISOString(),
  };
}

/** Records a run and queues it; a calibration that cannot work is refused first, so nothing is kept. */
export async function requestTrace(db: Db, queue: TraceQueue, scope: { shopId: string; jobId: string; memberId: string }, pieceId: string, input: z.output<typeof traceRequest>): Promise<TraceRun> {
  const photo = await findPiecePhoto(db, scope.shopId, scope.jobId, pieceId, input.photoId);
  if (photo.kind !== 'garment') throw new HttpError(400, 'invalid_input', 'Only garments are traced; other pieces are measured and typed in.');
  checkCalibration(input.calibration, photo);
  const [row] = await db
    .insert(traceRuns)
    .values({ shopId: scope.shopId, pieceId, photoId: input.photoId, calibration: input.calibration, options: { background: input.background ?? null, box: input.box ?? null }, requestedBy: scope.memberId })
    .returning();
  try {
    await queue.send(row!.id);
  } catch (err) {
    await db.delete(traceRuns).where(eq(traceRuns.id, row!.id));
    throw err;
  }
  return traceRunView(row!);
}

export async function getTraceRun(db: Db, shopId: string, traceId: string): Promise<TraceRunRow> {
  const [row] = await db.select().from(traceRuns).where(and(eq(traceRuns.shopId, shopId), eq(traceRuns.id, traceId)));
  if (!row) throw notFound('Trace');
  return row;
}

/** The storage key of a finished trace's squared photo; 404 for another shop's trace or one without a photo. */
export async function traceImageKey(db: Db, shopId: string, traceId: string): Promise<string> {
  const row = await getTraceRun(db, shopId, traceId);
  if (!row.imageKey) throw notFound('Traced photo');
  return row.imageKey;
}

export async function openTraceImage(db: Db, storage: Storage, shopId: string, traceId: string): Promise<StoredObject> {
  const row = await getTraceRun(db, shopId, traceId);
  const object = row.imageKey ? await storage.get(row.imageKey) : null;
  if (!object) throw notFound('Traced photo');
  return object;
}

/**
 * Keeps an edited outline on the garment piece with the trace it came from;
 * the piece's size becomes the outline's box. Until this is called, a new
 * trace leaves the piece's previous outline as it was.
 */
export async function saveOutline(db: Db, scope: { shopId: string; jobId: string; memberId: string }, pieceId: string, input: z.output<typeof outlineSave>) {
  const run = await getTraceRun(db, scope.shopId, input.traceId);
  if (run.pieceId !== pieceId) throw notFound('Trace of this piece');
  if (run.status !== 'done' || !run.result) throw new HttpError(409, 'trace_not_finished', 'This trace has not finished; wait for it, or trace again.');
  const box = polygonBounds(input.points);
  const limit = Math.max(run.result.imageWidthIn, run.result.imageHeightIn) + 2;
  if (box.x < -limit || box.y < -limit || box.x + box.w > 2 * limit || box.y + box.h > 2 * limit || box.w > CALIBRATION_MAX_IN || box.h > CALIBRATION_MAX_IN) {
    throw refuse('The outline reaches far beyond the traced photo; reset it to the automatic trace and edit again.', 'points');
  }
  if (polygonArea(input.points) < 1) throw refuse('The outline encloses less than a square inch; reset it to the automatic trace.', 'points');
  if (polygonSelfIntersections(input.points).length > 0) throw refuse('The outline crosses itself; move the nodes so its edges do not cross.', 'points');
  const outline = { traceId: run.id, photoId: run.photoId, points: input.points, imageWidthIn: run.result.imageWidthIn, imageHeightIn: run.result.imageHeightIn, calibration: run.calibration, savedAt: new Date().toISOString() };
  await db.transaction(async (tx) => {
    const [row] = await tx
      .update(pieces)
      .set({ outline, widthIn: box.w, heightIn: box.h })
      .where(and(eq(pieces.shopId, scope.shopId), eq(pieces.jobId, scope.jobId), eq(pieces.id, pieceId)))
      .returning({ label: pieces.label });
    if (!row) throw notFound('Piece');
    await recordActivity(tx, { shopId: scope.shopId, jobId: scope.jobId, memberId: scope.memberId, kind: 'outline_saved', detail: { pieceId, label: row.label } });
  });
}

export type { TraceRequest };
