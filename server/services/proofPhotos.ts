import { and, asc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { photos, pieces } from '../../db/schema';
import type { PublicProofView } from '../../features/proofs/schema';
import { polygonBounds } from '../../geometry';
import type { Storage, StoredObject } from '../storage/storage';
import { openRow, proofClosed } from './proofs';
import { openTraceImage } from './traces';

const MAX_PIECES = 200;

async function jobPieces(db: Db, jobId: string) {
  const rows = await db.select().from(pieces).where(eq(pieces.jobId, jobId)).orderBy(asc(pieces.createdAt), asc(pieces.id)).limit(MAX_PIECES);
  const ids = rows.map((p) => p.id);
  const photoRows = ids.length
    ? await db.select({ pieceId: photos.pieceId, previewKey: photos.previewKey }).from(photos).where(inArray(photos.pieceId, ids)).orderBy(asc(photos.createdAt))
    : [];
  const newest = new Map<string, string>();
  for (const p of photoRows) newest.set(p.pieceId, p.previewKey);
  return rows.map((piece) => ({ piece, previewKey: newest.get(piece.id) ?? null }));
}

/**
 * The job's pieces as the customer's page needs them: words, sizes, and a photo
 * address scoped to the link (the n-th piece of this proof), never a photo id.
 * The piece id is given only because the layout's openings name their piece by it.
 */
export async function proofPieces(db: Db, jobId: string, token: string): Promise<PublicProofView['pieces']> {
  const list = await jobPieces(db, jobId);
  return list.map(({ piece, previewKey }, index) => {
    const url = `/api/proofs/${token}/pieces/${index}/photo`;
    const outline = piece.outline;
    let photo: PublicProofView['pieces'][number]['photo'] = null;
    if (outline) {
      const box = polygonBounds(outline.points);
      photo = { url, widthIn: outline.imageWidthIn, heightIn: outline.imageHeightIn, traced: { centreX: box.x + box.w / 2, centreY: box.y + box.h / 2 } };
    } else if (previewKey) {
      photo = { url, widthIn: piece.widthIn, heightIn: piece.heightIn, traced: null };
    }
    return { id: piece.id, label: piece.label, kind: piece.kind, widthIn: piece.widthIn, heightIn: piece.heightIn, photo };
  });
}

/** The photo of the n-th piece of an open proof: the traced garment's squared photo, or the newest photo's preview. */
export async function openProofPhoto(db: Db, storage: Storage, token: string, index: number): Promise<StoredObject> {
  const row = await openRow(db, token);
  const entry = (await jobPieces(db, row.jobId))[index];
  if (!entry) throw proofClosed();
  if (entry.piece.outline) return openTraceImage(db, storage, row.shopId, entry.piece.outline.traceId);
  const object = entry.previewKey ? await storage.get(entry.previewKey) : null;
  if (!object) throw proofClosed();
  return object;
}
