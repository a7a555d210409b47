import type { Layout } from '../../geometry';
import type { EditorState } from './editorState';

/** Openings being dragged and how far they have gone since the drag began, in board inches. */
export interface MovingShift {
  readonly ids: readonly string[];
  readonly dx: number;
  readonly dy: number;
}

/** The layout the mats are drawn from: while openings are dragged, the layout from before, with the dragged ones shifted over it. */
export function drawnLayout(state: EditorState): Layout {
  return state.gesture?.kind === 'move' ? state.gesture.before : state.layout;
}

/** How far the dragged openings have gone since the drag began, or null when nothing is dragged. */
export function movingShift(state: EditorState): MovingShift | null {
  const g = state.gesture;
  if (g?.kind !== 'move') return null;
  const id = g.ids[0];
  const before = g.before.openings.find((o) => o.id === id);
  const now = state.layout.openings.find((o) => o.id === id);
  if (!before || !now) return null;
  return { ids: g.ids, dx: now.center.x - before.center.x, dy: now.center.y - before.center.y };
}

/** `next`, or `previous` when it says the same: a move that lands on the same rounding step changes nothing drawn. */
export function sameShiftKept(previous: MovingShift | null, next: MovingShift | null): MovingShift | null {
  if (!previous || !next) return next;
  return previous.ids === next.ids && previous.dx === next.dx && previous.dy === next.dy ? previous : next;
}

/** The SVG transform of a shift: for every dragged opening, or only when `id` is one of them. */
export function shiftTransform(shift: MovingShift | null, id?: string): string | undefined {
  if (!shift || (id !== undefined && !shift.ids.includes(id))) return undefined;
  return `translate(${shift.dx} ${shift.dy})`;
}
