import type { Db } from '../../db/client';
import { cutApprovalText, type CutApproval, type CutFileQuery } from '../../features/exports/schema';
import type { CutterProfile, ShopSettings } from '../../features/settings/schema';
import { cutPlan, cutPlanDxf, cutPlanSvg, cutSheetFitProblem, cutSheetHtml, parseLayout, type CutPlan, type Layout } from '../../geometry';
import { HttpError } from '../errors';
import { recordActivity } from './activity';
import { getJob } from './jobs';
import { getLayout, getVersion } from './layouts';
import { getShopSettings } from './settings';
import { requireCutApproval } from './cutApproval';
import { assertCuttable, openingPieceNames } from './layoutChecks';

export interface ExportedFile {
  readonly body: string;
  readonly contentType: string;
  readonly filename: string;
}

interface FrozenSource {
  readonly layout: Layout;
  /** Piece names by opening id, for findings and the cut sheet. */
  readonly openingNames: ReadonlyMap<string, string>;
  readonly layoutName: string;
  readonly jobId: string;
  readonly jobTitle: string;
  readonly settings: ShopSettings;
  /** Why this version may be cut, printed on the cut sheet. */
  readonly approval: CutApproval;
}

/** A frozen version only: a file must match what was approved, never the draft being edited. */
async function frozenSource(db: Db, shopId: string, layoutId: string, number: number): Promise<FrozenSource> {
  const { layout: summary } = await getLayout(db, shopId, layoutId);
  const version = await getVersion(db, shopId, layoutId, number);
  // Stored JSON is re-read, never trusted: the file is computed here from a layout that passes the schema.
  const parsed = parseLayout(version.document);
  if (!parsed.ok) throw new HttpError(422, 'unreadable_layout', `Version ${number} of this layout cannot be read, so no file was made: ${parsed.issues[0]?.message ?? ''}`);
  const [job, settings, openingNames] = await Promise.all([
    getJob(db, shopId, summary.jobId), getShopSettings(db, shopId), openingPieceNames(db, shopId, summary.jobId, parsed.layout),
  ]);
  // Checked again here: a version frozen before a check existed must not reach a blade either.
  assertCuttable({ layout: parsed.layout, openingNames, rounding: settings.rounding }, 'export');
  // Only what the customer approved (or an owner released, with a reason) reaches a blade.
  const approval = await requireCutApproval(db, shopId, layoutId, number);
  return { layout: parsed.layout, openingNames, layoutName: summary.name, jobId: summary.jobId, jobTitle: String(job.title), settings, approval };
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

/** The plan, or a 422 when the cutter could not take it: nothing half-right is ever written. */
function checkedPlan(layout: Layout, profile: CutterProfile): CutPlan {
  const misfit = cutSheetFitProblem(layout, profile);
  if (misfit) throw new HttpError(422, 'sheet_too_large', misfit);
  const plan = cutPlan(layout, profile);
  if (plan.problems.length > 0) throw new HttpError(422, 'cannot_cut', plan.problems.join(' '));
  return plan;
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

function chosenBoards(plan: CutPlan, profile: CutterProfile, mat: string): { indexes: number[]; suffix: string } {
  const count = plan.boards.length;
  if (mat === 'all') {
    if (profile.filePerMat && count > 1) {
      throw new HttpError(400, 'invalid_input', `The cutter profile "${profile.name}" takes one file per mat`, { mat: `Choose one mat, 1 to ${count}` });
    }
    return { indexes: plan.boards.map((_, i) => i), suffix: 'all-mats' };
  }
  const index = Number(mat) - 1;
  const board = plan.boards[index];
  if (!board) throw new HttpError(400, 'invalid_input', `This layout has ${count} boards to cut`, { mat: `Choose a mat from 1 to ${count}, or all` });
  return { indexes: [index], suffix: board.board === 'mat' ? `mat${index + 1}` : 'mounting' };
}

export async function exportCutFile(db: Db, shopId: string, memberId: string, layoutId: string, number: number, query: CutFileQuery): Promise<ExportedFile> {
  const source = await frozenSource(db, shopId, layoutId, number);
  const profile = chosenProfile(source.settings, query.profile);
  const plan = checkedPlan(source.layout, profile);
  const { indexes, suffix } = chosenBoards(plan, profile, query.mat);
  const title = `${source.jobTitle} · ${source.layoutName} v${number}`;
  const body = query.format === 'svg' ? cutPlanSvg(plan, { boards: indexes, title }) : cutPlanDxf(plan, { boards: indexes });
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

export async function cutSheetPage(db: Db, shopId: string, memberId: string, layoutId: string, number: number, profileId: string | undefined): Promise<ExportedFile> {
  const source = await frozenSource(db, shopId, layoutId, number);
  const profile = source.settings.cutterProfiles.length === 0 && profileId === undefined ? null : chosenProfile(source.settings, profileId);
  const body = cutSheetHtml({
    layout: source.layout,
    jobTitle: source.jobTitle,
    layoutName: source.layoutName,
    version: number,
    date: new Date().toISOString().slice(0, 10),
    rounding: source.settings.rounding,
    pathEdge: profile?.pathEdge ?? 'back',
    profile,
    openingNames: source.openingNames,
    approvalNote: cutApprovalText(source.approval),
  });
  await recordActivity(db, {
    shopId, jobId: source.jobId, memberId, kind: 'file_exported',
    detail: { format: 'cut-sheet', layoutId, version: number, mat: 'all', profile: profile?.id ?? null },
  });
  return { body, contentType: 'text/html; charset=utf-8', filename: `${fileSlug(source.jobTitle)}-v${number}-cut-sheet.html` };
}
