import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import type { z } from 'zod';
import type { Db } from '../../db/client';
import { jobs, layouts, layoutVersions, members, proofs, shipments, shops, type ProofRow } from '../../db/schema';
import { PROOF_CLOSED_MESSAGE, type ProofState, type proofDecisionInput, type proofSendInput, type PublicProofView } from '../../features/proofs/schema';
import { jobStatusLabels, type JobStatus } from '../../features/jobs/schema';
import { glazingKindLabels, isGlass } from '../../features/settings/materials';
import { proofSendableStatuses } from '../../features/jobs/statusRules';
import { createLayoutEngine, matStackPaths, parseLayout, type Layout, type MatLayerPaths } from '../../geometry';
import { HttpError, notFound } from '../errors';
import { recordActivity } from './activity';
import { assertJob, freezeVersion } from './layouts';
import type { ComputePool } from '../compute/computePool';
import { publicArrivalView } from './arrival';
import { proofPieces } from './proofPhotos';
import { acceptQuoteOfProof, publicQuoteOf, sendQuoteWithProof } from './quotes';
import { getShopSettings } from './settings';
import type { Storage } from '../storage/storage';
import type { ProofDecided } from './proofDecisionMail';

const DAY_MS = 24 * 60 * 60 * 1000;
const undecided = ['sent', 'opened'] as const;
/** A newer proof closes these: undecided links, and links whose customer asked for changes (their answer stays on the row). */
const replaceable = ['sent', 'opened', 'changes_asked'] as const;

/** 256 random bits, URL-safe: far past guessing. */
export const newProofToken = () => randomBytes(32).toString('base64url');
export const hashProofToken = (token: string) => createHash('sha256').update(token, 'utf8').digest('hex');

/** The one answer for every link that is not open, so nobody learns which links exist. */
export const proofClosed = () => new HttpError(404, 'proof_closed', PROOF_CLOSED_MESSAGE);

/** The state a person sees: an undecided proof past its date has expired. */
export function effectiveState(row: Pick<ProofRow, 'state' | 'expiresAt'>, now = new Date()): ProofState {
  if ((row.state === 'sent' || row.state === 'opened') && row.expiresAt.getTime() <= now.getTime()) return 'expired';
  return row.state;
}

const isoOrNull = (d: Date | null) => (d ? d.toISOString() : null);

export async function listProofs(db: Db, shopId: string, jobId: string) {
  await assertJob(db, shopId, jobId);
  const rows = await db
    .select({ proof: proofs, layoutName: layouts.name, sentByName: members.name })
    .from(proofs)
    .innerJoin(layouts, eq(layouts.id, proofs.layoutId))
    .leftJoin(members, eq(members.id, proofs.sentBy))
    .where(and(eq(proofs.shopId, shopId), eq(proofs.jobId, jobId)))
    .orderBy(desc(proofs.sentAt));
  return rows.map(({ proof: p, layoutName, sentByName }) => ({
    id: p.id,
    layoutId: p.layoutId,
    layoutName,
    versionNumber: p.versionNumber,
    state: effectiveState(p),
    message: p.message,
    sentAt: p.sentAt.toISOString(),
    sentByName,
    expiresAt: p.expiresAt.toISOString(),
    openedAt: isoOrNull(p.openedAt),
    decidedAt: isoOrNull(p.decidedAt),
    approvedName: p.approvedName,
    changesComment: p.changesComment,
    changesPhotoUrl: p.changesPhotoKey ? `/api/jobs/${jobId}/proofs/${p.id}/changes-photo` : null,
  }));
}

/** The version to send: the named frozen one, or the draft frozen now (which refuses error findings with 422). */
async function versionToSend(db: Db, shopId: string, memberId: string, jobId: string, input: z.output<typeof proofSendInput>, compute?: ComputePool) {
  const layout = await db.query.layouts.findFirst({
    where: and(eq(layouts.shopId, shopId), eq(layouts.id, input.layoutId), eq(layouts.jobId, jobId)),
    columns: { id: true },
  });
  if (!layout) throw new HttpError(400, 'invalid_input', "Choose one of this job's layouts", { layoutId: 'No such layout on this job' });
  if (input.versionNumber === undefined) {
    const { number } = await freezeVersion(db, shopId, memberId, layout.id, input.baseRevision!, 'Sent for approval', compute);
    return number;
  }
  const version = await db.query.layoutVersions.findFirst({
    where: and(eq(layoutVersions.layoutId, layout.id), eq(layoutVersions.number, input.versionNumber)),
    columns: { number: true },
  });
  if (!version) throw new HttpError(400, 'invalid_input', 'That version does not exist', { versionNumber: 'No such version' });
  return version.number;
}

/** Sends a proof: older open or answered-with-changes proofs of the job are replaced and the job waits for approval. Returns the secret once. */
export async function sendProof(db: Db, shopId: string, memberId: string, jobId: string, input: z.output<typeof proofSendInput>, compute?: ComputePool) {
  const job = await db.query.jobs.findFirst({ where: and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)), columns: { id: true, status: true } });
  if (!job) throw notFound('Job');
  if (!proofSendableStatuses.includes(job.status)) {
    throw new HttpError(409, 'status_move_refused', `This job is ${jobStatusLabels[job.status].toLowerCase()}; a proof is sent while the design is still open, before cutting starts`);
  }
  const versionNumber = await versionToSend(db, shopId, memberId, jobId, input, compute);
  const expiresInDays = input.expiresInDays ?? (await getShopSettings(db, shopId)).proofExpiryDays;
  const token = newProofToken();
  const now = new Date();
  const id = await db.transaction(async (tx) => {
    await tx
      .update(proofs)
      .set({ state: 'replaced', closedAt: now })
      .where(and(eq(proofs.shopId, shopId), eq(proofs.jobId, jobId), inArray(proofs.state, [...replaceable])));
    const [row] = await tx
      .insert(proofs)
      .values({
        shopId, jobId, layoutId: input.layoutId, versionNumber, tokenHash: hashProofToken(token),
        message: input.message ?? null, sentBy: memberId, sentAt: now, expiresAt: new Date(now.getTime() + expiresInDays * DAY_MS),
      })
      .returning({ id: proofs.id });
    await recordActivity(tx, { shopId, jobId, memberId, kind: 'proof_sent', detail: { proofId: row!.id, layoutId: input.layoutId, number: versionNumber } });
    await sendQuoteWithProof(tx, shopId, jobId, row!.id, now);
    await moveJob(tx, { shopId, jobId, memberId, to: 'awaiting_approval', from: proofSendableStatuses });
    return row!.id;
  });
  const proof = (await listProofs(db, shopId, jobId)).find((p) => p.id === id)!;
  return { proof, token };
}

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/**
 * Moves the job's status by itself (a proof sent or decided) when it stands at one of `from`, and logs it;
 * `memberId` null means the customer moved it. A job the shop has since moved elsewhere stays where it is.
 */
async function moveJob(tx: Tx, move: { shopId: string; jobId: string; memberId: string | null; to: JobStatus; from: readonly JobStatus[]; note?: string }) {
  const [current] = await tx.select({ status: jobs.status }).from(jobs).where(and(eq(jobs.shopId, move.shopId), eq(jobs.id, move.jobId))).for('update');
  if (!current || current.status === move.to || !move.from.includes(current.status)) return;
  const now = new Date();
  await tx.update(jobs).set({ status: move.to, statusChangedAt: now, updatedAt: now }).where(eq(jobs.id, move.jobId));
  const detail = { from: current.status, to: move.to, ...(move.note ? { note: move.note } : {}) };
  await recordActivity(tx, { shopId: move.shopId, jobId: move.jobId, memberId: move.memberId, kind: 'status_changed', detail });
}

/** Closes every undecided link of a job (the job was cancelled); a customer opening one sees it closed. */
export async function closeOpenProofs(tx: Pick<Db, 'update'>, shopId: string, jobId: string, now: Date) {
  await tx
    .update(proofs)
    .set({ state: 'revoked', closedAt: now })
    .where(and(eq(proofs.shopId, shopId), eq(proofs.jobId, jobId), inArray(proofs.state, [...undecided])));
}

export async function revokeProof(db: Db, shopId: string, memberId: string, jobId: string, proofId: string) {
  const [row] = await db
    .update(proofs)
    .set({ state: 'revoked', closedAt: new Date() })
    .where(and(eq(proofs.shopId, shopId), eq(proofs.jobId, jobId), eq(proofs.id, proofId), inArray(proofs.state, [...undecided])))
    .returning({ id: proofs.id });
  if (!row) {
    const exists = (await listProofs(db, shopId, jobId)).find((p) => p.id === proofId);
    if (!exists) throw notFound('Proof');
    throw new HttpError(409, 'proof_not_open', `This proof is ${exists.state.replace('_', ' ')} and can no longer be revoked`);
  }
  await recordActivity(db, { shopId, jobId, memberId, kind: 'proof_decided', detail: { proofId, decision: 'revoked', number: (await listProofs(db, shopId, jobId)).find((p) => p.id === proofId)?.versionNumber } });
  return (await listProofs(db, shopId, jobId)).find((p) => p.id === proofId)!;
}

/**
 * The row a link opens, or the one closed answer. The lookup is by hash (an index
 * probe that reveals nothing of the secret's prefix), and the hashes are compared
 * again in constant time.
 */
export async function openRow(db: Db | Tx, token: string, lock = false): Promise<ProofRow> {
  if (token.length < 20 || token.length > 100) throw proofClosed();
  const hash = hashProofToken(token);
  const query = db.select().from(proofs).where(eq(proofs.tokenHash, hash));
  let [row] = lock ? await query.for('update') : await query;
  let stored = row?.tokenHash;
  if (!row) ({ row, stored } = await rowByArrivalSecret(db, hash, lock));
  if (!row || !stored || !timingSafeEqual(Buffer.from(stored, 'hex'), Buffer.from(hash, 'hex'))) throw proofClosed();
  const state = effectiveState(row);
  if (state === 'revoked' || state === 'replaced' || state === 'expired') throw proofClosed();
  return row;
}

/** The shipped notice's own secret opens the same proof as the proof's link (the arrival page). */
async function rowByArrivalSecret(db: Db | Tx, hash: string, lock: boolean): Promise<{ row?: ProofRow; stored?: string }> {
  const query = db
    .select({ proof: proofs, stored: shipments.arrivalTokenHash })
    .from(shipments)
    .innerJoin(proofs, eq(proofs.id, shipments.proofId))
    .where(eq(shipments.arrivalTokenHash, hash));
  const [found] = lock ? await query.for('update', { of: proofs }) : await query;
  return { row: found?.proof, stored: found?.stored ?? undefined };
}

/** Who the customer may write to: the shop's first owner's address stands for the shop. */
export async function shopContact(db: Db, shopId: string) {
  const [shop] = await db.select({ name: shops.name }).from(shops).where(eq(shops.id, shopId));
  const [owner] = await db
    .select({ email: members.email })
    .from(members)
    .where(and(eq(members.shopId, shopId), eq(members.role, 'owner')))
    .orderBy(asc(members.createdAt))
    .limit(1);
  return { name: shop?.name ?? '', email: owner?.email ?? null };
}

/** The picture's path data, on a compute thread when there is one; a picture that cannot be drawn is left out, not an error. */
async function proofDrawing(layout: Layout, compute?: ComputePool): Promise<MatLayerPaths[] | null> {
  try {
    return compute ? await compute.run({ kind: 'matStack', layout }) : matStackPaths(layout, createLayoutEngine().lines(layout));
  } catch {
    return null;
  }
}

/** The allow-listed view of an open proof; the first view marks it opened. */
export async function viewProof(db: Db, token: string, compute?: ComputePool): Promise<PublicProofView> {
  let row = await openRow(db, token);
  if (row.state === 'sent') {
    const [opened] = await db.update(proofs).set({ state: 'opened', openedAt: new Date() }).where(and(eq(proofs.id, row.id), eq(proofs.state, 'sent'))).returning();
    if (opened) row = opened;
  }
  const [job] = await db.select({ title: jobs.title }).from(jobs).where(eq(jobs.id, row.jobId));
  const [version] = await db
    .select({ document: layoutVersions.document })
    .from(layoutVersions)
    .where(and(eq(layoutVersions.layoutId, row.layoutId), eq(layoutVersions.number, row.versionNumber)));
  const parsed = parseLayout(version?.document);
  const drawing = parsed.ok ? await proofDrawing(parsed.layout, compute) : null;
  return {
    stage: 'proof',
    shop: await shopContact(db, row.shopId),
    jobTitle: job?.title ?? '',
    message: row.message,
    state: row.state as PublicProofView['state'],
    expiresAt: row.expiresAt.toISOString(),
    decidedAt: isoOrNull(row.decidedAt),
    approvedName: row.approvedName,
    changesComment: row.changesComment,
    changesPhotoSent: row.changesPhotoKey !== null,
    layout: parsed.ok ? parsed.layout : version?.document,
    drawing,
    pieces: await proofPieces(db, row.jobId, token),
    frame: parsed.ok ? await publicFrame(db, row.shopId, row.jobId, parsed.layout) : null,
    quote: await publicQuoteOf(db, row.id),
    arrival: await publicArrivalView(db, row, token),
  };
}

/**
 * The job's frame in the customer's words. The outside size is the mats' outer size plus the
 * moulding's face on each side (the same reckoning as the shipping box); null until the shop
 * has chosen a moulding that is still in its list.
 */
async function publicFrame(db: Db, shopId: string, jobId: string, layout: Layout): Promise<PublicProofView['frame']> {
  const [job] = await db.select({ frame: jobs.frame }).from(jobs).where(eq(jobs.id, jobId));
  if (!job?.frame) return null;
  const { mouldingCode, glazingKind, shadowboxDepthIn } = job.frame;
  const moulding = (await getShopSettings(db, shopId)).mouldings.find((m) => m.code === mouldingCode);
  if (!moulding) return null;
  return {
    moulding: moulding.name,
    faceWidthIn: moulding.faceWidthIn,
    glazing: glazingKindLabels[glazingKind],
    isGlass: isGlass(glazingKind),
    shadowboxDepthIn,
    outerWidthIn: layout.outer.width + 2 * moulding.faceWidthIn,
    outerHeightIn: layout.outer.height + 2 * moulding.faceWidthIn,
  };
}

/** A change request's photo, already checked and shrunk like a piece photo's preview. */
export interface ChangesPhoto {
  jpeg: Buffer;
  storage: Storage;
}

/**
 * The customer's one decision; a second one is refused with 409. The job moves
 * by itself. A change request's photo is stored under the proof before the row
 * is written, and removed again when the decision does not go through.
 */
export async function decideProof(
  db: Db, token: string, input: z.output<typeof proofDecisionInput>, photo: ChangesPhoto | null = null, compute?: ComputePool,
): Promise<{ view: PublicProofView; decided: ProofDecided }> {
  const decided = await db.transaction(async (tx) => {
    const row = await openRow(tx, token, true);
    if (row.state === 'approved' || row.state === 'changes_asked') {
      throw new HttpError(409, 'already_decided', 'This proof has already been answered; ask the shop if something has changed');
    }
    const approve = input.decision === 'approve';
    const photoKey = !approve && photo ? `proofs/${row.shopId}/${row.id}.changes.jpg` : null;
    if (photoKey) await photo!.storage.put(photoKey, photo!.jpeg, 'image/jpeg');
    try {
      await recordDecision(tx, row, input, photoKey);
    } catch (err) {
      if (photoKey) await photo!.storage.delete(photoKey).catch(() => undefined);
      throw err;
    }
    const words = input.decision === 'approve' ? input.name : input.comment;
    return { shopId: row.shopId, jobId: row.jobId, versionNumber: row.versionNumber, decision: approve ? 'approved' : 'changes_asked', words, withPhoto: photoKey !== null } satisfies ProofDecided;
  });
  return { view: await viewProof(db, token, compute), decided };
}

async function recordDecision(tx: Tx, row: ProofRow, input: z.output<typeof proofDecisionInput>, photoKey: string | null) {
  const now = new Date();
  const approve = input.decision === 'approve';
  await tx
    .update(proofs)
    .set({ state: approve ? 'approved' : 'changes_asked', decidedAt: now, approvedName: approve ? input.name : null, changesComment: approve ? null : input.comment, changesPhotoKey: photoKey })
    .where(eq(proofs.id, row.id));
  const detail = approve
    ? { proofId: row.id, decision: 'approved', name: input.name }
    : { proofId: row.id, decision: 'changes_asked', comment: input.comment, withPhoto: photoKey !== null };
  await recordActivity(tx, { shopId: row.shopId, jobId: row.jobId, memberId: null, kind: 'proof_decided', detail: { ...detail, number: row.versionNumber } });
  if (approve) await acceptQuoteOfProof(tx, row.jobId, row.id, input.name, now);
  const job = { shopId: row.shopId, jobId: row.jobId, memberId: null };
  if (approve) await moveJob(tx, { ...job, to: 'approved', from: ['taken_in', 'designing', 'awaiting_approval'], note: `Approved by ${input.name} on the proof` });
  else await moveJob(tx, { ...job, to: 'designing', from: ['taken_in', 'awaiting_approval', 'approved'], note: `Customer asked for changes: ${input.comment}` });
}

/** The photo a customer sent with a change request, for the shop; 404 for another shop's proof or none. */
export async function openChangesPhoto(db: Db, storage: Storage, shopId: string, jobId: string, proofId: string) {
  const [row] = await db
    .select({ key: proofs.changesPhotoKey })
    .from(proofs)
    .where(and(eq(proofs.shopId, shopId), eq(proofs.jobId, jobId), eq(proofs.id, proofId)));
  const object = row?.key ? await storage.get(row.key) : null;
  if (!object) throw notFound('Photo');
  return object;
}

/** The frozen layout a proof shows, for its e-mail picture; null when it cannot be read. */
export async function proofLayout(db: Db, layoutId: string, versionNumber: number) {
  const [version] = await db
    .select({ document: layoutVersions.document })
    .from(layoutVersions)
    .where(and(eq(layoutVersions.layoutId, layoutId), eq(layoutVersions.number, versionNumber)));
  const parsed = parseLayout(version?.document);
  return parsed.ok ? parsed.layout : null;
}
