import type { CutFileQuery } from '../../features/exports/schema';
import type { CutterProfile } from '../../features/settings/schema';
import { cutPlan, cutPlanDxf, cutPlanSvg, cutSheetFitProblem, cutSheetHtml, parseLayout, type CutPlan, type Layout, type LengthRounding } from '../../geometry';
import { HttpError } from '../errors';
import { assertCuttable, namesOfOpenings } from '../services/layoutChecks';

/**
 * The CPU-heavy half of a cut file or cut sheet: the checks again, the cut
 * plan and the writer. Plain data in, text out, no database: it runs on a
 * compute thread (computeTask.ts), never on the web server's event loop.
 */

export interface FrozenDrawing {
  /** The stored document of the frozen version, parsed again here (never trusted as stored). */
  readonly document: unknown;
  readonly versionNumber: number;
  /** The job's piece labels by piece id, as [id, label] pairs (they cross a thread boundary). */
  readonly pieceLabels: ReadonlyArray<readonly [string, string]>;
  readonly rounding: LengthRounding;
}

interface ReadDrawing {
  readonly layout: Layout;
  readonly openingNames: ReadonlyMap<string, string>;
}

export interface CutFileInput extends FrozenDrawing {
  readonly profile: CutterProfile;
  readonly format: CutFileQuery['format'];
  readonly mat: CutFileQuery['mat'];
  readonly title: string;
}

export interface CutSheetInput extends FrozenDrawing {
  readonly profile: CutterProfile | null;
  readonly jobTitle: string;
  readonly layoutName: string;
  readonly version: number;
  readonly date: string;
  /** Who approved the version for cutting, in plain words. */
  readonly approvalNote?: string;
}

/** The plan, or a 422 when the cutter could not take it: nothing half-right is ever written. */
function checkedPlan(layout: Layout, profile: CutterProfile): CutPlan {
  const misfit = cutSheetFitProblem(layout, profile);
  if (misfit) throw new HttpError(422, 'sheet_too_large', misfit);
  const plan = cutPlan(layout, profile);
  if (plan.problems.length > 0) throw new HttpError(422, 'cannot_cut', plan.problems.join(' '));
  return plan;
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

/**
 * The version read again and checked again: a version frozen before a check
 * existed must not reach a blade either.
 */
function cuttableDrawing(input: FrozenDrawing): ReadDrawing {
  const parsed = parseLayout(input.document);
  if (!parsed.ok) {
    throw new HttpError(422, 'unreadable_layout', `Version ${input.versionNumber} of this layout cannot be read, so no file was made: ${parsed.issues[0]?.message ?? ''}`);
  }
  const openingNames = namesOfOpenings(parsed.layout, new Map(input.pieceLabels));
  assertCuttable({ layout: parsed.layout, openingNames, rounding: input.rounding }, 'export');
  return { layout: parsed.layout, openingNames };
}

export function makeCutFile(input: CutFileInput): { body: string; suffix: string } {
  const { layout } = cuttableDrawing(input);
  const plan = checkedPlan(layout, input.profile);
  const { indexes, suffix } = chosenBoards(plan, input.profile, input.mat);
  const body = input.format === 'svg' ? cutPlanSvg(plan, { boards: indexes, title: input.title }) : cutPlanDxf(plan, { boards: indexes });
  return { body, suffix };
}

export function makeCutSheet(input: CutSheetInput): { body: string } {
  const { layout, openingNames } = cuttableDrawing(input);
  const body = cutSheetHtml({
    layout,
    jobTitle: input.jobTitle,
    layoutName: input.layoutName,
    version: input.version,
    date: input.date,
    rounding: input.rounding,
    pathEdge: input.profile?.pathEdge ?? 'back',
    profile: input.profile,
    openingNames,
    approvalNote: input.approvalNote,
  });
  return { body };
}
