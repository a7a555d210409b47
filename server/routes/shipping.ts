import { Router, type RequestHandler, type Response } from 'express';
import { pipeline } from 'node:stream/promises';
import { z } from 'zod';
import type { Db } from '../../db/client';
import { arrivalCommentInput, shipmentInput } from '../../features/shipping/schema';
import { currentMember, requireMember } from '../auth';
import { parseOr400 } from '../errors';
import type { Mailer } from '../mail/mailer';
import { addArrivalPhoto, arrivalReport, openArrivalPhotoByLink, openArrivalPhotoForShop, saveArrivalComment, setShowcasePhoto } from '../services/arrival';
import { proofClosed, viewProof } from '../services/proofs';
import { markShipped } from '../services/shipment';
import { jobShipping } from '../services/shipping';
import type { Storage, StoredObject } from '../storage/storage';
import { idParam } from './params';
import { receivePhoto } from './photos';

const staff = requireMember('owner', 'designer', 'front_desk');

async function sendPreview(res: Response, object: StoredObject, cache: string) {
  res.set({ 'Content-Type': 'image/jpeg', 'Content-Length': String(object.bytes), 'Cache-Control': cache, 'X-Content-Type-Options': 'nosniff' });
  // A browser that leaves mid-download is not a server error.
  await pipeline(object.body, res).catch((err: unknown) => {
    if (!res.headersSent) throw err;
  });
}

/** Shipping of one job, for the shop: /api/jobs/:jobId/shipping, /shipment and /arrival. */
export function jobShippingRoutes(db: Db, storage: Storage, mailer: Mailer, publicUrl: string): Router {
  const router = Router({ mergeParams: true });
  const jobIdOf = (params: unknown) => idParam((params as { jobId?: string }).jobId, 'Job');

  router.get('/shipping', staff, async (req, res) => {
    res.json(await jobShipping(db, currentMember(res.locals).shopId, jobIdOf(req.params)));
  });

  router.post('/shipment', staff, async (req, res) => {
    const jobId = jobIdOf(req.params);
    const input = parseOr400(shipmentInput, req.body);
    const member = currentMember(res.locals);
    res.status(201).json(await markShipped(db, mailer, publicUrl, member.shopId, member, jobId, input));
  });

  router.get('/arrival', staff, async (req, res) => {
    res.json(await arrivalReport(db, currentMember(res.locals).shopId, jobIdOf(req.params)));
  });

  router.get('/arrival/photos/:photoId', staff, async (req, res) => {
    const photoId = idParam((req.params as { photoId?: string }).photoId, 'Photo');
    const object = await openArrivalPhotoForShop(db, storage, currentMember(res.locals).shopId, jobIdOf(req.params), photoId);
    await sendPreview(res, object, 'private, max-age=3600');
  });

  router.post('/arrival/photos/:photoId/showcase', staff, async (req, res) => {
    const photoId = idParam((req.params as { photoId?: string }).photoId, 'Photo');
    res.json(await setShowcasePhoto(db, currentMember(res.locals).shopId, jobIdOf(req.params), photoId));
  });

  return router;
}

/** The arrival page's side of a proof link, no sign-in; `limit` is the proof link's throttle. */
export function publicArrivalRoutes(db: Db, storage: Storage, limit: RequestHandler): Router {
  const router = Router();
  const tokenOf = (value: unknown) => {
    if (typeof value !== 'string') throw proofClosed();
    return value;
  };

  router.post('/:token/arrival', limit, async (req, res) => {
    const token = tokenOf(req.params.token);
    const input = parseOr400(arrivalCommentInput, req.body);
    await saveArrivalComment(db, token, input.comment);
    res.json({ proof: await viewProof(db, token) });
  });

  router.post('/:token/arrival/photos', limit, async (req, res) => {
    const token = tokenOf(req.params.token);
    // The link is checked before the body is read, so a closed link never makes the server buffer a photo.
    await viewProof(db, token);
    const file = await receivePhoto(req, res);
    await addArrivalPhoto(db, storage, token, file.buffer);
    res.status(201).json({ proof: await viewProof(db, token) });
  });

  router.get('/:token/arrival/photos/:index', limit, async (req, res) => {
    const index = z.coerce.number().int().min(0).max(10).safeParse(req.params.index);
    if (!index.success) throw proofClosed();
    const object = await openArrivalPhotoByLink(db, storage, tokenOf(req.params.token), index.data);
    await sendPreview(res, object, 'private, no-store');
  });

  return router;
}
