import { and, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { pieces } from '../../db/schema';
import type { Finding, Layout, LengthRounding } from '../../geometry';
import { checkLayout } from '../../geometry';
import { HttpError } from '../errors';

/**
 * The checks the server runs itself before a version is frozen and before
 * any cut file or cut sheet is made, so a file never depends on what a
 * browser said. Plain arguments in and findings out: the heavy part,
 * `cuttingFindings`, can run unchanged in a worker thread.
 */

/** What a framer reads on a 422: the findings that block cutting, in plain words. */
export interface BlockingFinding {
  readonly code: string;
  readonly message: string;
  readonly openingIds: readonly string[];
  readonly measured: number | null;
  readonly required: number | null;
}

export interface CuttingCheckInput {
  readonly layout: Layout;
  /** Piece names by opening id, so findings say "opening \"Home jersey\"". */
  readonly openingNames: ReadonlyMap<string, string>;
  readonly rounding: LengthRounding;
}

/** Every finding of the layout; errors block, warnings do not. */
export function cuttingFindings(input: CuttingCheckInput): Finding[] {
  return checkLayout(input.layout, { openingNames: input.openingNames, rounding: input.rounding });
}

export function blockingFindings(findings: readonly Finding[]): BlockingFinding[] {
  return findings
    .filter((f) => f.severity === 'error')
    .map((f) => ({ code: f.code, message: f.message, openingIds: f.openingIds ?? [], measured: f.measured, required: f.required }));
}

/** The job's piece labels by piece id. */
export async function pieceLabels(db: Pick<Db, 'select'>, shopId: string, jobId: string): Promise<Map<string, string>> {
  const rows = await db.select({ id: pieces.id, label: pieces.label }).from(pieces).where(and(eq(pieces.shopId, shopId), eq(pieces.jobId, jobId)));
  return new Map(rows.map((r) => [r.id, r.label]));
}

/** Names of the pieces each opening shows, from the job's pieces. */
export async function openingPieceNames(db: Pick<Db, 'select'>, shopId: string, jobId: string, layout: Layout): Promise<Map<string, string>> {
  return namesOfOpenings(layout, await pieceLabels(db, shopId, jobId));
}

/** Opening id to the label of the piece it shows; pure, so a compute thread can run it. */
export function namesOfOpenings(layout: Layout, labels: ReadonlyMap<string, string>): Map<string, string> {
  const names = new Map<string, string>();
  for (const opening of layout.openings) {
    const label = opening.pieceId ? labels.get(opening.pieceId) : undefined;
    if (label) names.set(opening.id, label);
  }
  return names;
}

/**
 * Throws a 422 listing the findings that make the board impossible to cut
 * (overlaps, crossing outlines, shapes with no area, openings past the
 * edge, thin bridges...); warnings pass.
 */
export function assertCuttable(input: CuttingCheckInput, doing: 'freeze' | 'export'): void {
  assertNothingBlocks(blockingFindings(cuttingFindings(input)), doing);
}

/** The 422 for findings already computed (on a compute thread, say). */
export function assertNothingBlocks(blocking: readonly BlockingFinding[], doing: 'freeze' | 'export'): void {
  if (blocking.length === 0) return;
  const what = doing === 'freeze' ? 'This version cannot be frozen' : 'No cut file was made';
  const count = blocking.length === 1 ? 'one problem' : `${blocking.length} problems`;
  throw new HttpError(422, 'layout_cannot_be_cut', `${what}: the board has ${count} to fix before cutting. ${blocking[0]!.message}`, undefined, { findings: blocking });
}
