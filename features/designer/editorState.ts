import type { AlignEdge, Axis, BoardPoint, Box, Layout, Mat, Opening } from '../../geometry';
import { openingsAlign, openingsBounds, openingsCentre, openingsDistribute, openingsMirror } from '../../geometry/arrange';
import { MAX_MATS, MAX_OPENINGS } from '../../geometry/layoutSchema';
import type { Edit } from './layoutEdits';
import { openingAdded, openingLimitWords } from './layoutEdits';
import {
  matAdded, matChanged, matMoved, matRemoved, openingPatched, openingsDuplicated, openingsMoved, openingsQuarterTurned, openingsRemoved,
  openingsTurned, outerResized,
} from './layoutEdits';
import type { HandleName } from './openingShapes';
import { openingResized } from './openingShapes';
import type { SnapGuide, SnapTargets } from './snapping';
import { snapMove, snapTargets } from './snapping';

/**
 * The designer's editing state: the layout document, the selection, the
 * undo and redo stacks and the gesture in progress. `editorReducer` is pure:
 * an action in, a new state out. Every change of the document is one undo
 * step; a whole drag is one step however many moves it had.
 */

/** Enough for a working session; older steps fall off the bottom. */
export const HISTORY_LIMIT = 200;

type Gesture =
  | { readonly kind: 'move'; readonly before: Layout; readonly ids: readonly string[]; readonly start: BoardPoint; readonly box: Box; readonly reference: BoardPoint; readonly targets: SnapTargets }
  | { readonly kind: 'resize'; readonly before: Layout; readonly id: string; readonly handle: HandleName; readonly opening: Opening };

/** One undo step: the document and what was chosen in it, so undo and redo bring the choice back too. */
export interface EditorSnapshot {
  readonly layout: Layout;
  readonly selection: readonly string[];
}

export interface EditorState {
  readonly layout: Layout;
  readonly selection: readonly string[];
  readonly past: readonly EditorSnapshot[];
  readonly future: readonly EditorSnapshot[];
  readonly gesture: Gesture | null;
  /** Lines the dragged opening lined up with, drawn while dragging. */
  readonly guides: readonly SnapGuide[];
  /** The shop's rounding step in inches: sizes and positions land on it. */
  readonly step: number;
  /** Reveal given to each lower mat when an opening is made deeper. */
  readonly defaultReveal: number;
  /** Why the last change was refused, in plain words; cleared by the next change. */
  readonly refusal: string | null;
}

export type EditorAction =
  | { type: 'load'; layout: Layout }
  /** Another document replaces the one being edited (someone else's save, an older version); undo brings the edited one back. */
  | { type: 'replace'; layout: Layout }
  | { type: 'configure'; step: number; defaultReveal: number }
  | { type: 'select'; ids: readonly string[] }
  | { type: 'toggleSelect'; id: string }
  | { type: 'add'; opening: Opening }
  | { type: 'patch'; id: string; changes: Partial<Omit<Opening, 'id'>> }
  | { type: 'moveStart'; ids: readonly string[]; at: BoardPoint }
  | { type: 'resizeStart'; id: string; handle: HandleName }
  /** `tolerance` is how close (inches) an edge must come to a line to jump to it; 0 turns snapping to lines off. */
  | { type: 'gestureMove'; at: BoardPoint; tolerance: number }
  /** A move worked out on a copy of this state (the canvas's own, while dragging): its layout and guides are taken as they are. */
  | { type: 'gestureMoved'; layout: Layout; guides: readonly SnapGuide[] }
  | { type: 'gestureEnd' }
  | { type: 'gestureCancel' }
  /** Moves the selection by whole rounding steps, or whole inches when `inches` is set. */
  | { type: 'nudge'; dx: number; dy: number; inches?: boolean }
  | { type: 'turn'; degrees: number }
  | { type: 'quarterTurnGroup'; clockwise: boolean }
  | { type: 'align'; edge: AlignEdge }
  | { type: 'distribute'; axis: Axis }
  | { type: 'mirrorPair' }
  | { type: 'centreGroup'; bottomWeight: number }
  | { type: 'duplicate' }
  | { type: 'remove' }
  | { type: 'resizeOuter'; width: number; height: number }
  | { type: 'addMat'; mat: Mat }
  | { type: 'removeMat'; index: number }
  | { type: 'moveMat'; index: number; by: -1 | 1 }
  | { type: 'changeMat'; index: number; changes: Partial<Omit<Mat, 'id'>> }
  | { type: 'undo' }
  | { type: 'redo' };

export function createEditorState(layout: Layout, step: number, defaultReveal: number): EditorState {
  return { layout, selection: [], past: [], future: [], gesture: null, guides: [], step, defaultReveal, refusal: null };
}

/** Records a new document as one undo step; the same document is no step at all. */
function commit(state: EditorState, layout: Layout, selection: readonly string[] = state.selection): EditorState {
  if (layout === state.layout) return { ...state, selection, refusal: null };
  const past = [...state.past, snapshotOf(state)].slice(-HISTORY_LIMIT);
  const kept = selection.filter((id) => layout.openings.some((o) => o.id === id));
  return { ...state, layout, past, future: [], selection: kept, refusal: null };
}

function commitEdit(state: EditorState, edit: Edit, selection: readonly string[] = state.selection): EditorState {
  return edit.ok ? commit(state, edit.layout, selection) : { ...state, refusal: edit.error };
}

function selected(state: EditorState): readonly string[] {
  return state.selection.filter((id) => state.layout.openings.some((o) => o.id === id));
}

/** Applies a group function to the selection, or to every opening when nothing is selected. */
function onGroup(state: EditorState, change: (openings: readonly Opening[], ids: readonly string[]) => Opening[]): EditorState {
  const ids = selected(state).length > 0 ? selected(state) : state.layout.openings.map((o) => o.id);
  return commit(state, { ...state.layout, openings: change(state.layout.openings, ids) });
}

function startMove(state: EditorState, ids: readonly string[], at: BoardPoint): EditorState {
  const moving = state.layout.openings.filter((o) => ids.includes(o.id));
  const box = openingsBounds(moving);
  if (!box || !moving[0]) return state;
  const targets = snapTargets(state.layout.openings, ids, state.layout.outer);
  const gesture: Gesture = { kind: 'move', before: state.layout, ids, start: at, box, reference: moving[0].center, targets };
  return { ...state, gesture, selection: ids, guides: [], refusal: null };
}

function gestureMove(state: EditorState, at: BoardPoint, tolerance: number): EditorState {
  const g = state.gesture;
  if (!g) return state;
  if (g.kind === 'resize') {
    const resized = openingResized(g.opening, g.handle, at, state.step);
    return { ...state, layout: { ...g.before, openings: g.before.openings.map((o) => (o.id === g.id ? resized : o)) } };
  }
  const raw = { x: at.x - g.start.x, y: at.y - g.start.y };
  const { delta, guides } = snapMove({ box: g.box, reference: g.reference, delta: raw, targets: g.targets, step: state.step, tolerance });
  return { ...state, layout: openingsMoved(g.before, g.ids, delta.x, delta.y), guides };
}

/** Ends a drag or resize as one undo step, or as none when nothing moved. */
function gestureEnd(state: EditorState): EditorState {
  const g = state.gesture;
  if (!g) return state;
  const ended = { ...state, gesture: null, guides: [] };
  if (sameOpenings(g.before, state.layout)) return { ...ended, layout: g.before };
  return commit({ ...ended, layout: g.before }, state.layout);
}

function sameOpenings(a: Layout, b: Layout): boolean {
  if (a.openings.length !== b.openings.length) return false;
  return a.openings.every((o, i) => {
    const p = b.openings[i]!;
    if (p === o) return true;
    const sameShape = p.shape === o.shape || JSON.stringify(p.shape) === JSON.stringify(o.shape);
    return sameShape && p.center.x === o.center.x && p.center.y === o.center.y;
  });
}

function snapshotOf(state: EditorState): EditorSnapshot {
  return { layout: state.layout, selection: state.selection };
}

/**
 * The selection after moving to `snapshot`: what is chosen now where it still
 * exists (an undone move keeps its window chosen), otherwise what was chosen
 * then (an undone removal brings its window back chosen).
 */
function selectionAt(state: EditorState, snapshot: EditorSnapshot): readonly string[] {
  const exists = (id: string) => snapshot.layout.openings.some((o) => o.id === id);
  const kept = state.selection.filter(exists);
  return kept.length > 0 ? kept : snapshot.selection.filter(exists);
}

function undo(state: EditorState): EditorState {
  const previous = state.past[state.past.length - 1];
  if (!previous || state.gesture) return state;
  const selection = selectionAt(state, previous);
  return { ...state, layout: previous.layout, selection, past: state.past.slice(0, -1), future: [snapshotOf(state), ...state.future], refusal: null };
}

function redo(state: EditorState): EditorState {
  const next = state.future[0];
  if (!next || state.gesture) return state;
  const selection = selectionAt(state, next);
  return { ...state, layout: next.layout, selection, past: [...state.past, snapshotOf(state)], future: state.future.slice(1), refusal: null };
}

function nudge(state: EditorState, dx: number, dy: number, inches: boolean): EditorState {
  const ids = selected(state);
  if (ids.length === 0) return state;
  const unit = inches ? 1 : state.step;
  return commit(state, openingsMoved(state.layout, ids, dx * unit, dy * unit));
}

function mirrorPair(state: EditorState): EditorState {
  const ids = selected(state);
  if (ids.length !== 2) return { ...state, refusal: 'Choose exactly two openings to mirror: the first chosen stays, the second becomes its mirror image.' };
  return commit(state, { ...state.layout, openings: openingsMirror(state.layout.openings, ids[0]!, ids[1]!, state.layout.outer) });
}

export function editorReducer(state: EditorState, action: EditorAction): EditorState {
  switch (action.type) {
    case 'load': return createEditorState(action.layout, state.step, state.defaultReveal);
    case 'replace': return commit({ ...state, gesture: null, guides: [] }, action.layout, []);
    case 'configure': return { ...state, step: action.step, defaultReveal: action.defaultReveal };
    case 'select': return { ...state, selection: action.ids.filter((id) => state.layout.openings.some((o) => o.id === id)) };
    case 'toggleSelect': {
      const on = state.selection.includes(action.id);
      return { ...state, selection: on ? state.selection.filter((id) => id !== action.id) : [...state.selection, action.id] };
    }
    case 'add': return commitEdit(state, openingAdded(state.layout, action.opening), [action.opening.id]);
    case 'patch': return commitEdit(state, openingPatched(state.layout, action.id, action.changes, state.defaultReveal));
    case 'moveStart': return state.gesture ? state : startMove(state, action.ids, action.at);
    case 'resizeStart': {
      const opening = state.layout.openings.find((o) => o.id === action.id);
      if (!opening || state.gesture) return state;
      return { ...state, selection: [action.id], gesture: { kind: 'resize', before: state.layout, id: action.id, handle: action.handle, opening } };
    }
    case 'gestureMove': return gestureMove(state, action.at, action.tolerance);
    case 'gestureMoved': return state.gesture ? { ...state, layout: action.layout, guides: action.guides } : state;
    case 'gestureEnd': return gestureEnd(state);
    case 'gestureCancel': return state.gesture ? { ...state, layout: state.gesture.before, gesture: null, guides: [] } : state;
    case 'nudge': return nudge(state, action.dx, action.dy, action.inches ?? false);
    case 'turn': return selected(state).length === 0 ? state : commit(state, openingsTurned(state.layout, selected(state), action.degrees));
    case 'quarterTurnGroup': return commit(state, openingsQuarterTurned(state.layout, selected(state), action.clockwise));
    case 'align': return onGroup(state, (openings, ids) => openingsAlign(openings, ids, action.edge));
    case 'distribute': return onGroup(state, (openings, ids) => openingsDistribute(openings, ids, action.axis));
    case 'mirrorPair': return mirrorPair(state);
    case 'centreGroup': return onGroup(state, (openings, ids) => centredGroup(openings, ids, state.layout, action.bottomWeight));
    case 'duplicate': {
      const copied = openingsDuplicated(state.layout, selected(state));
      if (copied.layout.openings.length > MAX_OPENINGS) return { ...state, refusal: openingLimitWords };
      return copied.ids.length === 0 ? state : commit(state, copied.layout, copied.ids);
    }
    case 'remove': return selected(state).length === 0 ? state : commit(state, openingsRemoved(state.layout, selected(state)), []);
    case 'resizeOuter': return commitEdit(state, outerResized(state.layout, action.width, action.height));
    case 'addMat': return state.layout.mats.length >= MAX_MATS ? { ...state, refusal: `A stack may have at most ${MAX_MATS} mats.` } : commit(state, matAdded(state.layout, action.mat));
    case 'removeMat': return commitEdit(state, matRemoved(state.layout, action.index));
    case 'moveMat': return commit(state, matMoved(state.layout, action.index, action.by));
    case 'changeMat': return commit(state, matChanged(state.layout, action.index, action.changes));
    case 'undo': return undo(state);
    case 'redo': return redo(state);
  }
}

function centredGroup(openings: readonly Opening[], ids: readonly string[], layout: Layout, bottomWeight: number): Opening[] {
  const moved = new Map(openingsCentre(openings.filter((o) => ids.includes(o.id)), layout.outer, bottomWeight).map((o) => [o.id, o]));
  return openings.map((o) => moved.get(o.id) ?? o);
}

export function canUndo(state: EditorState): boolean {
  return state.past.length > 0 && !state.gesture;
}

export function canRedo(state: EditorState): boolean {
  return state.future.length > 0 && !state.gesture;
}
