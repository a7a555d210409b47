import { Router } from 'express';
import type { Db } from '../../db/client';
import { outlineSave, traceRequest } from '../../features/trace/schema';
import { currentMember, requireMember } from '../auth';
import { HttpError, parseOr400 } from '../errors';
import { findPieceLabel, openPhoto } from '../services/photos';
import { getPiece } from '../services/pieces';
import { getTraceRun, requestTrace, traceImageKey, saveOutline, traceRunView, type TraceQueue } from '../services/traces';
import { sendStoredFile } from '../storage/sendStoredFile';
import type { ImagePool } from '../trace/imagePool';
import type { Storage, StoredObject } from '../storage/storage';
import { idParam } from './params';

/** What the web server needs to offer tracing: a queue to send runs to, and image threads for quick looks such as finding corners. */
export interface TracingDeps {
  queue: TraceQueue;
  pool: ImagePool;
}

const notRunning = () => new HttpError(503, 'tracing_unavailable', 'Tracing is not running on this server. Start it with npm start or npm run worker.');

async function readAll(object: StoredObject): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of object.body) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

/** Tracing a garment: proposing corners, queueing a run, reading its progress and photo, saving the outline on the piece. */
export function traceRoutes(db: Db, storage: Storage, tracing: TracingDeps | undefined): Router {
  const router = Router();
  const tracers = requireMember('owner', 'designer');
  const staff = requireMember('owner', 'designer', 'front_desk');

  router.get('/photos/:photoId/corners', tracers, async (req, res) => {
    const photoId = idParam(req.params.photoId, 'Photo');
    // Another shop's photo is a 404 whether or not tracing runs here.
    const { object } = await openPhoto(db, storage, currentMember(res.locals).shopId, photoId, 'original');
    if (!tracing) {
      object.body.destroy();
      throw notRunning();
    }
    const outcome = await tracing.pool.corners(new Uint8Array(await readAll(object)));
    if (!outcome.ok) throw new HttpError(415, outcome.code, outcome.message);
    res.json({ corners: outcome.kind === 'corners' ? outcome.corners : null });
  });

  router.post('/jobs/:jobId/pieces/:pieceId/traces', tracers, async (req, res) => {
    const member = currentMember(res.locals);
    const jobId = idParam(req.params.jobId, 'Job');
    const pieceId = idParam(req.params.pieceId, 'Piece');
    await findPieceLabel(db, member.shopId, jobId, pieceId);
    if (!tracing) throw notRunning();
    const input = parseOr400(traceRequest, req.body);
    const trace = await requestTrace(db, tracing.queue, { shopId: member.shopId, jobId, memberId: member.id }, pieceId, input);
    res.status(202).json({ trace });
  });

  router.get('/traces/:traceId', staff, async (req, res) => {
    const row = await getTraceRun(db, currentMember(res.locals).shopId, idParam(req.params.traceId, 'Trace'));
    res.set('Cache-Control', 'no-store');
    res.json({ trace: traceRunView(row) });
  });

  router.get('/traces/:traceId/image', staff, async (req, res) => {
    const key = await traceImageKey(db, currentMember(res.locals).shopId, idParam(req.params.traceId, 'Trace'));
    await sendStoredFile(res, storage, { key, contentType: 'image/jpeg', what: 'Traced photo' });
  });

  router.put('/jobs/:jobId/pieces/:pieceId/outline', tracers, async (req, res) => {
    const member = currentMember(res.locals);
    const jobId = idParam(req.params.jobId, 'Job');
    const pieceId = idParam(req.params.pieceId, 'Piece');
    const input = parseOr400(outlineSave, req.body);
    await saveOutline(db, { shopId: member.shopId, jobId, memberId: member.id }, pieceId, input);
    res.json({ piece: await getPiece(db, { shopId: member.shopId, jobId }, pieceId) });
  });

  return router;
}
