import { Router, type RequestHandler } from 'express';
import type pg from 'pg';
import type { Db } from '../../db/client';
import type { ComputePool } from '../compute/computePool';
import { proofDecisionInput, proofSendInput } from '../../features/proofs/schema';
import { currentMember, requireMember } from '../auth';
import { parseOr400 } from '../errors';
import { createThrottle, type ThrottleRules } from '../security/throttle';
import { decideProof, hashProofToken, listProofs, openChangesPhoto, openRow, proofClosed, proofLayout, revokeProof, sendProof, viewProof, type ChangesPhoto } from '../services/proofs';
import { mailProofDecision } from '../services/proofDecisionMail';
import { proofPicturePng } from '../services/proofPicture';
import { receiveOptionalPhoto } from './photos';
import { inspectPhoto, makePreview } from '../storage/photoImage';
import { HttpError } from '../errors';
import type { Mailer } from '../mail/mailer';
import { mailProof, proofRecipient } from '../services/proofMail';
import { idParam } from './params';
import { publicArrivalRoutes } from './shipping';
import { openProofPhoto } from '../services/proofPhotos';
import type { Storage } from '../storage/storage';
import { pipeline } from 'node:stream/promises';
import { z } from 'zod';

const staff = requireMember('owner', 'designer', 'front_desk');
const designers = requireMember('owner', 'designer');

/** A proof link's page and API: per link and per address, generous for a customer, tight for a guesser. */
export const defaultProofThrottleRules: ThrottleRules = {
  perAccount: { points: 60, durationS: 60 },
  perAddress: { points: 120, durationS: 60 },
};

/** Proofs of one job, for the shop: /api/jobs/:jobId/proofs */
export function jobProofRoutes(db: Db, mailer: Mailer, publicUrl: string, storage: Storage, compute?: ComputePool): Router {
  const router = Router({ mergeParams: true });
  const jobIdOf = (params: unknown) => idParam((params as { jobId?: string }).jobId, 'Job');

  router.get('/', staff, async (req, res) => {
    res.json({ proofs: await listProofs(db, currentMember(res.locals).shopId, jobIdOf(req.params)) });
  });

  router.post('/', designers, async (req, res) => {
    const jobId = jobIdOf(req.params);
    const input = parseOr400(proofSendInput, req.body);
    const member = currentMember(res.locals);
    // The address is checked before anything is frozen or sent.
    const recipient = input.emailCustomer ? await proofRecipient(db, member.shopId, jobId) : null;
    const { proof, token } = await sendProof(db, member.shopId, member.id, jobId, input, compute);
    const link = `${publicUrl.replace(/\/$/, '')}/proof/${token}`;
    const picture = recipient ? await designPicture(db, proof.layoutId, proof.versionNumber, recipient.title) : null;
    const mailError = recipient
      ? await mailProof(mailer, { shopId: member.shopId, to: recipient.email, customerName: recipient.customerName, shopName: recipient.shopName, title: recipient.title, message: proof.message, link, expiresAt: proof.expiresAt, picture })
      : null;
    res.status(201).json({ proof, link, emailedTo: recipient && !mailError ? recipient.email : null, mailError });
  });

  router.post('/:proofId/revoke', designers, async (req, res) => {
    const jobId = jobIdOf(req.params);
    const proofId = idParam((req.params as { proofId?: string }).proofId, 'Proof');
    const member = currentMember(res.locals);
    res.json({ proof: await revokeProof(db, member.shopId, member.id, jobId, proofId) });
  });

  router.get('/:proofId/changes-photo', staff, async (req, res) => {
    const proofId = idParam((req.params as { proofId?: string }).proofId, 'Proof');
    const object = await openChangesPhoto(db, storage, currentMember(res.locals).shopId, jobIdOf(req.params), proofId);
    res.set({ 'Content-Type': 'image/jpeg', 'Content-Length': String(object.bytes), 'Cache-Control': 'private, max-age=3600', 'X-Content-Type-Options': 'nosniff' });
    await pipeline(object.body, res).catch((err: unknown) => {
      if (!res.headersSent) throw err;
    });
  });

  return router;
}

/** The e-mail's picture of the frozen version; without one (unreadable, or the renderer failed) the e-mail has words only. */
async function designPicture(db: Db, layoutId: string, versionNumber: number, title: string): Promise<Buffer | null> {
  const layout = await proofLayout(db, layoutId, versionNumber);
  if (!layout) return null;
  return proofPicturePng(layout, `The proposed mats for ${title}`).catch(() => null);
}

/** A change request's photo: the same sniffing, size and megapixel rules as a piece's photo, shrunk to the same preview. */
export async function changesPhotoOf(file: Express.Multer.File | null, storage: Storage): Promise<ChangesPhoto | null> {
  if (!file) return null;
  await inspectPhoto(file.buffer);
  return { jpeg: await makePreview(file.buffer), storage };
}

/** Mail settings for telling the shop about a customer's decision. */
export interface DecisionMail {
  mailer: Mailer;
  publicUrl: string;
}

/** A secret link's headers: never sent on as a referrer, never indexed, never cached by a shared cache. */
export const proofPageHeaders: RequestHandler = (_req, res, next) => {
  res.setHeader('Referrer-Policy', 'no-referrer');
  res.setHeader('X-Robots-Tag', 'noindex, nofollow');
  res.setHeader('Cache-Control', 'no-store');
  next();
};

/**
 * Counts one attempt per request on the link (by its hash) and on the address, 429 with Retry-After
 * past either limit. The API and the page count on the same keys, so both share one budget.
 */
export function proofLinkLimit(pool: pg.Pool, rules: ThrottleRules = defaultProofThrottleRules, keyPrefix = ''): RequestHandler {
  const throttle = createThrottle(pool, `${keyPrefix}proof-link`, rules);
  return async (req, _res, next) => {
    try {
      await throttle.attempt(hashProofToken(String(req.params.token ?? '')), req.ip ?? 'unknown');
      next();
    } catch (err) {
      next(err);
    }
  };
}

/** The customer's side, no sign-in: /api/proofs/:token */
export function publicProofRoutes(
  db: Db, storage: Storage, pool: pg.Pool, rules: ThrottleRules = defaultProofThrottleRules, keyPrefix = '', decisionMail?: DecisionMail, compute?: ComputePool,
): Router {
  const router = Router();
  const tokenOf = (value: unknown) => {
    if (typeof value !== 'string') throw proofClosed();
    return value;
  };
  const limit = proofLinkLimit(pool, rules, keyPrefix);

  router.use(proofPageHeaders);

  router.get('/:token', limit, async (req, res) => {
    res.json({ proof: await viewProof(db, tokenOf(req.params.token), compute) });
  });

  router.get('/:token/pieces/:index/photo', limit, async (req, res) => {
    const index = z.coerce.number().int().min(0).max(1000).safeParse(req.params.index);
    if (!index.success) throw proofClosed();
    const object = await openProofPhoto(db, storage, tokenOf(req.params.token), index.data);
    res.set({ 'Content-Type': 'image/jpeg', 'Content-Length': String(object.bytes), 'Cache-Control': 'private, no-store', 'X-Content-Type-Options': 'nosniff' });
    await pipeline(object.body, res).catch((err: unknown) => {
      if (!res.headersSent) throw err;
    });
  });

  router.use(publicArrivalRoutes(db, storage, limit));

  // JSON, or multipart/form-data when a change request carries a photo (field "photo").
  router.post('/:token/decision', limit, async (req, res) => {
    const token = tokenOf(req.params.token);
    let file: Express.Multer.File | null = null;
    if (req.is('multipart/form-data')) {
      // The link is checked before the body is read: nobody makes the server buffer a photo for a closed link.
      await openRow(db, token);
      file = await receiveOptionalPhoto(req, res);
    }
    const input = parseOr400(proofDecisionInput, req.body);
    if (file && input.decision !== 'changes') {
      throw new HttpError(400, 'invalid_input', 'A photo goes only with a request for changes', { photo: 'A photo goes only with a request for changes' });
    }
    const { view, decided } = await decideProof(db, token, input, await changesPhotoOf(file, storage), compute);
    // The customer does not wait on the shop's mail server; a failure is logged and kept in the outbox.
    if (decisionMail) void mailProofDecision(db, decisionMail.mailer, decisionMail.publicUrl, decided, req.log);
    res.json({ proof: view });
  });

  return router;
}
