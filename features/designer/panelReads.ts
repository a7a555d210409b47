import type { Dispatch } from 'react';
import type { Finding, Layout, LengthRounding, OpeningLines } from '../../geometry';
import type { LayoutDetail } from '../layouts/schema';
import type { ShopSettings } from '../settings/schema';
import type { EditorAction } from './editorState';

export type TabId = 'add' | 'arrange' | 'window' | 'mats' | 'checks' | 'versions';

/** Whether the list is about the layout as it is now: `moving` while an opening is dragged, `checking` until the answer arrives. */
export type ChecksStatus = 'checked' | 'moving' | 'checking';

/**
 * Everything the panels show, gathered once per change that matters to
 * them. While an opening is dragged none of it changes with the pointer
 * (the layouts are from before the drag), so the panels are not drawn
 * again on every move; new findings redraw them when they arrive.
 */
export interface PanelInputs {
  readonly jobId: string;
  readonly layoutId: string;
  readonly versions: LayoutDetail['versions'];
  /** The layout as it was before any drag in progress. */
  readonly settled: Layout;
  /** The layout the lines are for (the same as `settled` unless an opening is being resized). */
  readonly drawn: Layout;
  readonly lines: ReadonlyMap<string, OpeningLines>;
  readonly selection: readonly string[];
  readonly refusal: string | null;
  readonly moving: boolean;
  readonly defaultReveal: number;
  readonly rounding: LengthRounding;
  readonly settings: ShopSettings;
  readonly editable: boolean;
  readonly findings: readonly Finding[];
  readonly checksStatus: ChecksStatus;
  readonly showFinding: (finding: Finding) => void;
  readonly flush: () => Promise<number | null>;
  readonly onConflict: () => void;
  readonly dispatch: Dispatch<EditorAction>;
}

/** What each panel reads of the inputs: a panel is drawn again only when one of its own changes. */
export const PANEL_READS: Record<TabId, readonly (keyof PanelInputs)[]> = {
  add: ['jobId', 'settled', 'defaultReveal', 'rounding', 'dispatch'],
  arrange: ['dispatch', 'selection'],
  window: ['drawn', 'selection', 'refusal', 'moving', 'lines', 'dispatch', 'rounding', 'editable'],
  mats: ['settled', 'selection', 'dispatch', 'settings', 'editable'],
  checks: ['findings', 'checksStatus', 'showFinding'],
  versions: ['layoutId', 'jobId', 'versions', 'editable', 'dispatch', 'findings', 'flush', 'onConflict'],
};

/** Whether the panels `ids` read the same from `a` as from `b` (new findings leave the tools column alone). */
export function samePanelReads(ids: readonly TabId[], a: PanelInputs, b: PanelInputs): boolean {
  return a === b || ids.every((id) => PANEL_READS[id].every((key) => a[key] === b[key]));
}
