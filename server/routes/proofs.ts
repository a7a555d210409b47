import { Router, type RequestHandler } from 'express';
import type pg from 'pg';
import type { Db } from '../../db/client';
import type { ComputePool } from '../compute/computePool';
import { proofDecisionInput, proofSendInput } from '../../features/proofs/schema';
import { currentMember, requireMember } from '../auth';
import { parseOr400 } from '../errors';
import { createThrottle, type ThrottleRules } from '../security/throttle';
import { decideProof, hashProofToken, listProofs, proofClosed, revokeProof, sendProof, viewProof } from '../services/proofs';
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
export function jobProofRoutes(db: Db, mailer: Mailer, publicUrl: string, compute?: ComputePool): Router {
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
    const mailError = recipient
      ? await mailProof(mailer, { shopId: member.shopId, to: recipient.email, customerName: recipient.customerName, shopName: recipient.shopName, title: recipient.title, message: proof.message, link, expiresAt: proof.expiresAt })
      : null;
    res.status(201).json({ proof, link, emailedTo: recipient && !mailError ? recipient.email : null, mailError });
  });

  router.post('/:proofId/revoke', designers, async (req, res) => {
    const jobId = jobIdOf(req.params);
    const proofId = idParam((req.params as { proofId?: string }).proofId, 'Proof');
    const member = currentMember(res.locals);
    res.json({ proof: await revokeProof(db, member.shopId, member.id, jobId, proofId) });
  });

  return router;
}

/** A secret link's headers: never sent on as a referrer, never indexed, never cached by a shared cache. */
export const proofPageHeaders: RequestHandler = (_req, res, next) => {
  res.setHeader('Referrer-Policy', 'no-referrer');
  res.setHeader('X-Robots-Tag', 'noindex, nofollow');
  res.setHeader('Cache-Control', 'no-store');
  next();
};

/** The customer's side, no sign-in: /api/proofs/:token */
export function publicProofRoutes(
  db: Db, storage: Storage, pool: pg.Pool, rules: ThrottleRules = defaultProofThrottleRules, keyPrefix = '', compute?: ComputePool,
): Router {
  const router = Router();
  const throttle = createThrottle(pool, `${keyPrefix}proof-link`, rules);
  const tokenOf = (value: unknown) => {
    if (typeof value !== 'string') throw proofClosed();
    return value;
  };
  const limit: RequestHandler = async (req, _res, next) => {
    try {
      await throttle.attempt(hashProofToken(String(req.params.token ?? '')), req.ip ?? 'unknown');
      next();
    } catch (err) {
      next(err);
    }
  };

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

  router.post('/:token/decision', limit, async (req, res) => {
    const token = tokenOf(req.params.token);
    const input = parseOr400(proofDecisionInput, req.body);
    res.json({ proof: await decideProof(db, token, input, compute) });
  });

  return router;
}
