import type { Db } from '../../db/client';
import { cutApprovalText, type CutApproval, type CutFileQuery } from '../../features/exports/schema';
import type { CutterProfile, ShopSettings } from '../../features/settings/schema';
import type { ComputePool } from '../compute/computePool';
import type { ComputeResults, ComputeTask } from '../compute/computeTask';
import type { FrozenDrawing } from '../compute/cutFiles';
import { frozenFileKey, type FrozenFileCache } from './frozenFileCache';
import { HttpError } from '../errors';
import { recordActivity } from './activity';
import { frozenDocument, frozenVersionHeading } from './layouts';
import { getShopSettings } from './settings';
import { requireCutApproval } from './cutApproval';
import { pieceLabels } from './layoutChecks';

export interface ExportedFile {
  readonly body: string;
  readonly contentType: string;
  readonly filename: string;
}

interface FrozenSource {
  /** The frozen version's row: with the inputs below, it fixes the file made from it. */
  readonly versionId: string;
  /** Everything the compute thread needs but the document, which is read only when a file must be made. */
  readonly drawing: Omit<FrozenDrawing, 'document'>;
  readonly layoutName: string;
  readonly jobId: string;
  readonly jobTitle: string;
  readonly settings: ShopSettings;
  /** Why this version may be cut, printed on the cut sheet. */
  readonly approval: CutApproval;
}

/** A frozen version only: a file must match what was approved, never the draft being edited. */
async function frozenSource(db: Db, shopId: string, layoutId: string, number: number): Promise<FrozenSource> {
  const { versionId, layoutName, jobId, jobTitle } = await frozenVersionHeading(db, shopId, layoutId, number);
  const [settings, labels] = await Promise.all([getShopSettings(db, shopId), pieceLabels(db, shopId, jobId)]);
  const drawing = { versionNumber: number, pieceLabels: [...labels], rounding: settings.rounding };
  // Only what the customer approved (or an owner released, with a reason) reaches a blade.
  const approval = await requireCutApproval(db, shopId, layoutId, number);
  return { approval, versionId, drawing, layoutName, jobId, jobTitle, settings };
}

/**
 * The file made from the frozen version with these inputs: kept from an earlier
 * request when there is one, else made on a compute thread from the stored JSON
 * as it is (the thread reads and checks it again, off the event loop).
 */
function madeFile<K extends 'cutFile' | 'cutSheet'>(
  db: Db, compute: ComputePool, files: FrozenFileCache, kind: K, versionId: string,
  input: Omit<Extract<ComputeTask, { kind: K }>['input'], 'document'>,
): Promise<ComputeResults[K]> {
  return files.obtain(frozenFileKey(versionId, { kind, input }), async () => {
    const document = await frozenDocument(db, versionId);
    return compute.run({ kind, input: { ...input, document } } as Extract<ComputeTask, { kind: K }>);
  });
}

function chosenProfile(settings: ShopSettings, id: string | undefined): CutterProfile {
  const profiles = settings.cutterProfiles;
  if (profiles.length === 0) {
    throw new HttpError(400, 'invalid_input', 'The shop has no cutter profile yet; an owner can add one in settings', { profile: 'No cutter profiles are set up' });
  }
  const profile = id === undefined ? profiles[0] : profiles.find((p) => p.id === id);
  if (!profile) throw new HttpError(400, 'invalid_input', `There is no cutter profile "${id}"`, { profile: 'Choose one of the shop\'s cutter profiles' });
  return profile;
}

/** ASCII-only file name part: "Tidewater Brackenwings #44" becomes "tidewater-brackenwings-44". */
export function fileSlug(text: string): string {
  const slug = text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/, '');
  return slug || 'layout';
}

export async function exportCutFile(
  db: Db, compute: ComputePool, files: FrozenFileCache, shopId: string, memberId: string, layoutId: string, number: number, query: CutFileQuery,
): Promise<ExportedFile> {
  const source = await frozenSource(db, shopId, layoutId, number);
  const profile = chosenProfile(source.settings, query.profile);
  const title = `${source.jobTitle} · ${source.layoutName} v${number}`;
  const { body, suffix } = await madeFile(db, compute, files, 'cutFile', source.versionId, {
    ...source.drawing, profile, format: query.format, mat: query.mat, title,
  });
  await recordActivity(db, {
    shopId, jobId: source.jobId, memberId, kind: 'file_exported',
    detail: { format: query.format, layoutId, version: number, mat: query.mat, profile: profile.id },
  });
  return {
    body,
    contentType: query.format === 'svg' ? 'image/svg+xml; charset=utf-8' : 'application/dxf',
    filename: `${fileSlug(source.jobTitle)}-v${number}-${suffix}.${query.format}`,
  };
}

export async function cutSheetPage(
  db: Db, compute: ComputePool, files: FrozenFileCache, shopId: string, memberId: string, layoutId: string, number: number, profileId: string | undefined,
): Promise<ExportedFile> {
  const source = await frozenSource(db, shopId, layoutId, number);
  const profile = source.settings.cutterProfiles.length === 0 && profileId === undefined ? null : chosenProfile(source.settings, profileId);
  const { body } = await madeFile(db, compute, files, 'cutSheet', source.versionId, {
    ...source.drawing, profile, jobTitle: source.jobTitle, layoutName: source.layoutName, version: number, date: new Date().toISOString().slice(0, 10),
    approvalNote: cutApprovalText(source.approval),
  });
  await recordActivity(db, {
    shopId, jobId: source.jobId, memberId, kind: 'file_exported',
    detail: { format: 'cut-sheet', layoutId, version: number, mat: 'all', profile: profile?.id ?? null },
  });
  return { body, contentType: 'text/html; charset=utf-8', filename: `${fileSlug(source.jobTitle)}-v${number}-cut-sheet.html` };
}
