import { and, asc, eq, inArray } from 'drizzle-orm';
import type { z } from 'zod';
import type { pieceInput, piecePatch } from '../../features/pieces/schema';
import type { Db } from '../../db/client';
import { jobs, photos, pieces } from '../../db/schema';
import { notFound } from '../errors';
import type { Storage } from '../storage/storage';
import { recordActivity } from './activity';
import { photoSummaryColumns, removeStoredFiles } from './photos';

type PieceValues = z.output<typeof pieceInput>;
type PieceChanges = z.output<typeof piecePatch>;

/** Where a piece lives and who is acting on it. */
export interface PieceScope {
  shopId: string;
  jobId: string;
}

const pieceColumns = {
  id: pieces.id,
  jobId: pieces.jobId,
  kind: pieces.kind,
  label: pieces.label,
  widthIn: pieces.widthIn,
  heightIn: pieces.heightIn,
  notes: pieces.notes,
  outline: pieces.outline,
  createdAt: pieces.createdAt,
};

const photoColumns = { ...photoSummaryColumns, pieceId: photos.pieceId };

/** A job of another shop is reported exactly like a job that does not exist. */
export async function assertJobInShop(db: Db, shopId: string, jobId: string): Promise<void> {
  const [row] = await db.select({ id: jobs.id }).from(jobs).where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  if (!row) throw notFound('Job');
}

async function attachPhotos<T extends { id: string; createdAt: Date }>(db: Db, shopId: string, rows: T[]) {
  const ids = rows.map((r) => r.id);
  const photoRows = ids.length
    ? await db.select(photoColumns).from(photos).where(and(eq(photos.shopId, shopId), inArray(photos.pieceId, ids))).orderBy(asc(photos.createdAt))
    : [];
  return rows.map((row) => ({
    ...row,
    createdAt: row.createdAt.toISOString(),
    photos: photoRows
      .filter((p) => p.pieceId === row.id)
      .map(({ pieceId: _pieceId, ...p }) => ({ ...p, createdAt: p.createdAt.toISOString() })),
  }));
}

/** The job's pieces in the order they were added, each with its photos. */
export async function listPieces(db: Db, scope: PieceScope) {
  await assertJobInShop(db, scope.shopId, scope.jobId);
  const rows = await db
    .select(pieceColumns)
    .from(pieces)
    .where(and(eq(pieces.shopId, scope.shopId), eq(pieces.jobId, scope.jobId)))
    .orderBy(asc(pieces.createdAt), asc(pieces.id));
  return attachPhotos(db, scope.shopId, rows);
}

export async function getPiece(db: Db, scope: PieceScope, pieceId: string) {
  const [row] = await db
    .select(pieceColumns)
    .from(pieces)
    .where(and(eq(pieces.shopId, scope.shopId), eq(pieces.jobId, scope.jobId), eq(pieces.id, pieceId)));
  if (!row) throw notFound('Piece');
  const [withPhotos] = await attachPhotos(db, scope.shopId, [row]);
  return withPhotos!;
}

export async function createPiece(db: Db, scope: PieceScope, memberId: string, values: PieceValues) {
  await assertJobInShop(db, scope.shopId, scope.jobId);
  const id = await db.transaction(async (tx) => {
    const [row] = await tx.insert(pieces).values({ ...values, ...scope }).returning({ id: pieces.id });
    await recordActivity(tx, { ...scope, memberId, kind: 'piece_added', detail: { pieceId: row!.id, kind: values.kind, label: values.label } });
    return row!.id;
  });
  return getPiece(db, scope, id);
}

export async function updatePiece(db: Db, scope: PieceScope, pieceId: string, changes: PieceChanges) {
  const [row] = await db
    .update(pieces)
    .set(changes)
    .where(and(eq(pieces.shopId, scope.shopId), eq(pieces.jobId, scope.jobId), eq(pieces.id, pieceId)))
    .returning({ id: pieces.id });
  if (!row) throw notFound('Piece');
  return getPiece(db, scope, pieceId);
}

/**
 * Removes the piece and its photos. A layout that placed this piece keeps its
 * opening and the size it had; only the link to the piece goes stale. Files
 * are removed after the rows, so a failed commit never loses a photo that is
 * still listed.
 */
export async function deletePiece(db: Db, storage: Storage, scope: PieceScope, pieceId: string, memberId: string) {
  const keys = await db.transaction(async (tx) => {
    const stored = await tx
      .select({ originalKey: photos.originalKey, previewKey: photos.previewKey })
      .from(photos)
      .where(and(eq(photos.shopId, scope.shopId), eq(photos.pieceId, pieceId)));
    const [gone] = await tx
      .delete(pieces)
      .where(and(eq(pieces.shopId, scope.shopId), eq(pieces.jobId, scope.jobId), eq(pieces.id, pieceId)))
      .returning({ label: pieces.label, kind: pieces.kind });
    if (!gone) throw notFound('Piece');
    await recordActivity(tx, { ...scope, memberId, kind: 'piece_removed', detail: { pieceId, kind: gone.kind, label: gone.label } });
    return stored.flatMap((p) => [p.originalKey, p.previewKey]);
  });
  await removeStoredFiles(storage, keys);
}
