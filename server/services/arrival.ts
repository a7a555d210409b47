import { and, asc, count, desc, eq } from 'drizzle-orm';
import { randomUUID } from 'node:crypto';
import type { Db } from '../../db/client';
import { arrivalNotes, arrivalPhotos, jobs, proofs, type ProofRow } from '../../db/schema';
import type { PublicProofView } from '../../features/proofs/schema';
import { MAX_ARRIVAL_PHOTOS, type ArrivalReport } from '../../features/shipping/schema';
import { HttpError, notFound } from '../errors';
import { inspectPhoto, makePreview } from '../storage/photoImage';
import type { Storage, StoredObject } from '../storage/storage';
import { recordActivity } from './activity';
import { removeStoredFiles } from './photos';
import { openRow, proofClosed } from './proofs';

type Reader = Pick<Db, 'select'>;

const notOpen = () => new HttpError(409, 'arrival_not_open', 'This page opens for notes and photos once the frame has been shipped');

/** The arrival page is open on the job's latest approved proof once the job is shipped. */
async function arrivalIsOpen(db: Reader, row: ProofRow): Promise<boolean> {
  if (row.state !== 'approved') return false;
  const [job] = await db.select({ status: jobs.status }).from(jobs).where(eq(jobs.id, row.jobId));
  if (job?.status !== 'shipped') return false;
  const [latest] = await db
    .select({ id: proofs.id })
    .from(proofs)
    .where(and(eq(proofs.jobId, row.jobId), eq(proofs.state, 'approved')))
    .orderBy(desc(proofs.decidedAt))
    .limit(1);
  return latest?.id === row.id;
}

async function jobArrivalPhotos(db: Reader, jobId: string) {
  return db.select().from(arrivalPhotos).where(eq(arrivalPhotos.jobId, jobId)).orderBy(asc(arrivalPhotos.createdAt), asc(arrivalPhotos.id)).limit(MAX_ARRIVAL_PHOTOS);
}

/** The customer's side of the arrival page: their comment and their photos through the link; null while it is not open. */
export async function publicArrivalView(db: Db, row: ProofRow, token: string): Promise<PublicProofView['arrival']> {
  if (!(await arrivalIsOpen(db, row))) return null;
  const [note] = await db.select({ comment: arrivalNotes.comment }).from(arrivalNotes).where(eq(arrivalNotes.jobId, row.jobId));
  const photos = await jobArrivalPhotos(db, row.jobId);
  return { comment: note?.comment ?? null, photos: photos.map((_, i) => ({ url: `/api/proofs/${token}/arrival/photos/${i}` })), maxPhotos: MAX_ARRIVAL_PHOTOS };
}

async function openArrival(db: Db, token: string): Promise<ProofRow> {
  const row = await openRow(db, token);
  if (!(await arrivalIsOpen(db, row))) throw notOpen();
  return row;
}

/** The customer's comment on arrival; a second one replaces the first. */
export async function saveArrivalComment(db: Db, token: string, comment: string | null): Promise<void> {
  const row = await openArrival(db, token);
  await db.transaction(async (tx) => {
    const now = new Date();
    await tx
      .insert(arrivalNotes)
      .values({ jobId: row.jobId, shopId: row.shopId, proofId: row.id, comment, updatedAt: now })
      .onConflictDoUpdate({ target: arrivalNotes.jobId, set: { comment, proofId: row.id, updatedAt: now } });
    await recordActivity(tx, { shopId: row.shopId, jobId: row.jobId, memberId: null, kind: 'arrival_noted', detail: { proofId: row.id, ...(comment ? { comment } : {}) } });
  });
}

/**
 * A photo of the frame as it arrived, checked like a piece's photo. The count is taken
 * under a lock on the proof, so two uploads at once cannot pass the limit together.
 */
export async function addArrivalPhoto(db: Db, storage: Storage, token: string, bytes: Buffer): Promise<void> {
  const open = await openArrival(db, token);
  const image = await inspectPhoto(bytes);
  const preview = await makePreview(bytes);
  const id = randomUUID();
  const originalKey = `arrival/${open.shopId}/${id}.original.${image.extension}`;
  const previewKey = `arrival/${open.shopId}/${id}.preview.jpg`;
  try {
    await storage.put(originalKey, bytes, image.mimeType);
    await storage.put(previewKey, preview, 'image/jpeg');
    await db.transaction(async (tx) => {
      const row = await openRow(tx, token, true);
      const [n] = await tx.select({ n: count() }).from(arrivalPhotos).where(eq(arrivalPhotos.jobId, row.jobId));
      if ((n?.n ?? 0) >= MAX_ARRIVAL_PHOTOS) throw new HttpError(409, 'too_many_photos', `Up to ${MAX_ARRIVAL_PHOTOS} photos; thank you for those already sent`);
      await tx.insert(arrivalPhotos).values({ id, shopId: row.shopId, jobId: row.jobId, proofId: row.id, originalKey, previewKey, mimeType: image.mimeType, bytes: bytes.length });
      await recordActivity(tx, { shopId: row.shopId, jobId: row.jobId, memberId: null, kind: 'arrival_noted', detail: { proofId: row.id, photo: true } });
    });
  } catch (err) {
    await removeStoredFiles(storage, [originalKey, previewKey]);
    throw err;
  }
}

/** The n-th arrival photo's preview through the link. */
export async function openArrivalPhotoByLink(db: Db, storage: Storage, token: string, index: number): Promise<StoredObject> {
  const row = await openArrival(db, token);
  const photo = (await jobArrivalPhotos(db, row.jobId))[index];
  const object = photo ? await storage.get(photo.previewKey) : null;
  if (!object) throw proofClosed();
  return object;
}

/** What the shop sees on the job. */
export async function arrivalReport(db: Db, shopId: string, jobId: string): Promise<ArrivalReport> {
  const [job] = await db.select({ id: jobs.id }).from(jobs).where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  if (!job) throw notFound('Job');
  const [note] = await db.select().from(arrivalNotes).where(and(eq(arrivalNotes.shopId, shopId), eq(arrivalNotes.jobId, jobId)));
  const photos = await jobArrivalPhotos(db, jobId);
  return {
    comment: note?.comment ?? null,
    commentedAt: note ? note.updatedAt.toISOString() : null,
    photos: photos.map((p) => ({ id: p.id, url: `/api/jobs/${jobId}/arrival/photos/${p.id}`, showcase: p.showcase, createdAt: p.createdAt.toISOString() })),
  };
}

async function shopArrivalPhoto(db: Db, shopId: string, jobId: string, photoId: string) {
  const [row] = await db
    .select()
    .from(arrivalPhotos)
    .where(and(eq(arrivalPhotos.shopId, shopId), eq(arrivalPhotos.jobId, jobId), eq(arrivalPhotos.id, photoId)));
  if (!row) throw notFound('Photo');
  return row;
}

export async function openArrivalPhotoForShop(db: Db, storage: Storage, shopId: string, jobId: string, photoId: string): Promise<StoredObject> {
  const row = await shopArrivalPhoto(db, shopId, jobId, photoId);
  const object = await storage.get(row.previewKey);
  if (!object) throw notFound('Photo file');
  return object;
}

/** Makes one arrival photo the job's showcase; the one before it stops being it. */
export async function setShowcasePhoto(db: Db, shopId: string, jobId: string, photoId: string): Promise<ArrivalReport> {
  await shopArrivalPhoto(db, shopId, jobId, photoId);
  await db.transaction(async (tx) => {
    await tx.update(arrivalPhotos).set({ showcase: false }).where(and(eq(arrivalPhotos.jobId, jobId), eq(arrivalPhotos.showcase, true)));
    await tx.update(arrivalPhotos).set({ showcase: true }).where(eq(arrivalPhotos.id, photoId));
  });
  return arrivalReport(db, shopId, jobId);
}
