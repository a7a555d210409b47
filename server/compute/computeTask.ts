import { createLayoutEngine, matStackPaths, parseLayout, type BoardPoint, type Layout, type LayoutParseResult, type LengthRounding, type MatLayerPaths } from '../../geometry';
import { HttpError } from '../errors';
import { blockingFindings, cuttingFindings, namesOfOpenings, type BlockingFinding } from '../services/layoutChecks';
import { splitDraft, type StoredDraft } from '../services/draftOutlines';
import { readDraftSaveText, type DraftSaveRead } from './draftSave';
import { makeCutFile, makeCutSheet, type CutFileInput, type CutSheetInput } from './cutFiles';

/**
 * What a compute thread does: pure functions over plain data, so the web
 * server's event loop only moves bytes. A framer's mistake found here (an
 * HttpError) crosses back as data and is thrown again on the main thread.
 */

export type ComputeTask =
  | { readonly kind: 'warm' }
  | { readonly kind: 'parseLayout'; readonly document: unknown }
  /** A new layout's document: parsed, repaired and split for storage. */
  | { readonly kind: 'newDraft'; readonly document: unknown }
  /** A draft save's request body as text: parsed, validated and split for storage; `lists` are the outlines it keeps by name. */
  | { readonly kind: 'draftSave'; readonly text: string; readonly lists: ReadonlyArray<readonly [string, readonly BoardPoint[]]> }
  /** The draft about to be frozen: read again, and the findings that would block cutting. */
  | { readonly kind: 'freezeChecks'; readonly document: unknown; readonly pieceLabels: ReadonlyArray<readonly [string, string]>; readonly rounding: LengthRounding }
  | { readonly kind: 'cutFile'; readonly input: CutFileInput }
  | { readonly kind: 'cutSheet'; readonly input: CutSheetInput }
  /** The customer's picture of a frozen layout: path data per mat, so the proof page needs no geometry code. */
  | { readonly kind: 'matStack'; readonly layout: Layout }
  /** Busy-waits: lets the tests see a task that overruns its time budget. */
  | { readonly kind: 'spin'; readonly ms: number };

export interface ComputeResults {
  warm: null;
  parseLayout: LayoutParseResult;
  draftSave: DraftSaveRead;
  newDraft: { ok: true; stored: StoredDraft } | { ok: false; parsed: LayoutParseResult };
  freezeChecks: { parsed: LayoutParseResult; blocking: BlockingFinding[] };
  cutFile: { body: string; suffix: string };
  cutSheet: { body: string };
  spin: null;
  matStack: MatLayerPaths[];
}

export interface SentHttpError {
  readonly status: number;
  readonly code: string;
  readonly message: string;
  readonly fields?: Record<string, string>;
  readonly extra?: Record<string, unknown>;
}

export type ComputeReply<T = unknown> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly error: SentHttpError };

function freezeChecks(document: unknown, labels: ReadonlyMap<string, string>, rounding: LengthRounding): ComputeResults['freezeChecks'] {
  const parsed = parseLayout(document);
  if (!parsed.ok) return { parsed, blocking: [] };
  const openingNames = namesOfOpenings(parsed.layout, labels);
  return { parsed, blocking: blockingFindings(cuttingFindings({ layout: parsed.layout, openingNames, rounding })) };
}

function perform(task: ComputeTask): unknown {
  switch (task.kind) {
    case 'warm':
      return null;
    case 'parseLayout':
      return parseLayout(task.document);
    case 'newDraft': {
      const parsed = parseLayout(task.document);
      return parsed.ok ? { ok: true, stored: splitDraft(parsed.layout) } : { ok: false, parsed };
    }
    case 'draftSave':
      return readDraftSaveText(task.text, new Map(task.lists));
    case 'freezeChecks':
      return freezeChecks(task.document, new Map(task.pieceLabels), task.rounding);
    case 'cutFile':
      return makeCutFile(task.input);
    case 'cutSheet':
      return makeCutSheet(task.input);
    case 'matStack':
      return matStackPaths(task.layout, createLayoutEngine().lines(task.layout));
    case 'spin': {
      const until = Date.now() + task.ms;
      while (Date.now() < until) {
        // Busy on purpose.
      }
      return null;
    }
  }
}

export default function computeTask(task: ComputeTask): ComputeReply {
  try {
    return { ok: true, value: perform(task) };
  } catch (err) {
    if (err instanceof HttpError) {
      return { ok: false, error: { status: err.status, code: err.code, message: err.message, fields: err.fields, extra: err.extra } };
    }
    throw err;
  }
}
