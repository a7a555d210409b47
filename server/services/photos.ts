import { and, eq } from 'drizzle-orm';
import { randomUUID } from 'node:crypto';
import type { Db } from '../../db/client';
import { photos, pieces } from '../../db/schema';
import { notFound } from '../errors';
import { inspectPhoto, makePreview } from '../storage/photoImage';
import type { Storage, StoredObject } from '../storage/storage';
import { recordActivity } from './activity';

export interface NewPhoto {
  shopId: string;
  jobId: string;
  pieceId: string;
  memberId: string;
  bytes: Buffer;
  originalName: string | null;
}

export type PhotoVariant = 'preview' | 'original';

/** The columns a photo is described by in API answers. */
export const photoSummaryColumns = {
  id: photos.id,
  mimeType: photos.mimeType,
  widthPx: photos.widthPx,
  heightPx: photos.heightPx,
  bytes: photos.bytes,
  originalName: photos.originalName,
  createdAt: photos.createdAt,
};

/** Removes files whether or not each one exists; one failure does not stop the rest. */
export async function removeStoredFiles(storage: Storage, keys: string[]): Promise<void> {
  await Promise.allSettled(keys.map((key) => storage.delete(key)));
}

/** The piece's label, or a 404 when it is not this shop's piece on this job. */
export async function findPieceLabel(db: Db, shopId: string, jobId: string, pieceId: string): Promise<string> {
  const [row] = await db
    .select({ label: pieces.label })
    .from(pieces)
    .where(and(eq(pieces.shopId, shopId), eq(pieces.jobId, jobId), eq(pieces.id, pieceId)));
  if (!row) throw notFound('Piece');
  return row.label;
}

/** Keeps only what is safe to show back: no path, no control characters, a sane length. */
function cleanName(name: string | null): string | null {
  if (!name) return null;
  const base = name.split(/[\\/]/).pop() ?? '';
  const cleaned = base.replace(/[\p{Cc}\p{Cf}]/gu, '').trim().slice(0, 200);
  return cleaned || null;
}

/**
 * Checks the upload by content, makes its preview, stores both files, then
 * records the row. Any failure after the first file is written removes what
 * was written, so a refused or broken upload leaves nothing behind.
 */
export async function addPhoto(db: Db, storage: Storage, upload: NewPhoto) {
  const label = await findPieceLabel(db, upload.shopId, upload.jobId, upload.pieceId);
  const image = await inspectPhoto(upload.bytes);
  const preview = await makePreview(upload.bytes);

  const id = randomUUID();
  const originalKey = `photos/${upload.shopId}/${id}.original.${image.extension}`;
  const previewKey = `photos/${upload.shopId}/${id}.preview.jpg`;
  try {
    await storage.put(originalKey, upload.bytes, image.mimeType);
    await storage.put(previewKey, preview, 'image/jpeg');
    const [row] = await db.transaction(async (tx) => {
      const inserted = await tx
        .insert(photos)
        .values({
          id,
          shopId: upload.shopId,
          pieceId: upload.pieceId,
          originalKey,
          previewKey,
          mimeType: image.mimeType,
          bytes: upload.bytes.length,
          widthPx: image.widthPx,
          heightPx: image.heightPx,
          originalName: cleanName(upload.originalName),
          uploadedBy: upload.memberId,
        })
        .returning(photoSummaryColumns);
      await recordActivity(tx, {
        shopId: upload.shopId,
        jobId: upload.jobId,
        memberId: upload.memberId,
        kind: 'photo_added',
        detail: { pieceId: upload.pieceId, photoId: id, label },
      });
      return inserted;
    });
    return { ...row!, createdAt: row!.createdAt.toISOString() };
  } catch (err) {
    await removeStoredFiles(storage, [originalKey, previewKey]);
    throw err;
  }
}

/** Where one of the shop's photo files is stored and the type to serve it as; 404 for anyone else's. */
export async function findPhotoFile(db: Db, shopId: string, photoId: string, variant: PhotoVariant): Promise<{ key: string; contentType: string }> {
  const [row] = await db
    .select({ originalKey: photos.originalKey, previewKey: photos.previewKey, mimeType: photos.mimeType })
    .from(photos)
    .where(and(eq(photos.shopId, shopId), eq(photos.id, photoId)));
  if (!row) throw notFound('Photo');
  return variant === 'preview' ? { key: row.previewKey, contentType: 'image/jpeg' } : { key: row.originalKey, contentType: row.mimeType };
}

/** One of the shop's photo files with the type to serve it as; 404 for anyone else's. */
export async function openPhoto(
  db: Db,
  storage: Storage,
  shopId: string,
  photoId: string,
  variant: PhotoVariant,
): Promise<{ contentType: string; object: StoredObject }> {
  const file = await findPhotoFile(db, shopId, photoId, variant);
  const object = await storage.get(file.key);
  if (!object) throw notFound('Photo file');
  return { contentType: file.contentType, object };
}

/** Removes the row first, then both files: a file left by a crash is harmless, a row without files is not. */
export async function deletePhoto(db: Db, storage: Storage, shopId: string, photoId: string): Promise<void> {
  const [row] = await db
    .delete(photos)
    .where(and(eq(photos.shopId, shopId), eq(photos.id, photoId)))
    .returning({ originalKey: photos.originalKey, previewKey: photos.previewKey });
  if (!row) throw notFound('Photo');
  await removeStoredFiles(storage, [row.originalKey, row.previewKey]);
}
