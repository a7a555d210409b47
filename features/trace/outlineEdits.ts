import type { BoardPoint } from '../../geometry';
import { MAX_OUTLINE_POINTS } from './schema';

/** The outline being edited, with the automatic trace to go back to and the steps to undo and redo. */
export interface OutlineEditState {
  automatic: readonly BoardPoint[];
  points: readonly BoardPoint[];
  past: (readonly BoardPoint[])[];
  future: (readonly BoardPoint[])[];
}

export type OutlineEdit =
  | { type: 'moveNode'; index: number; to: BoardPoint; /** Part of a drag already recorded for undo. */ continuing?: boolean }
  | { type: 'addNode'; after: number; at: BoardPoint }
  | { type: 'deleteNode'; index: number }
  | { type: 'smooth'; index: number; reach: number }
  | { type: 'moveAll'; dx: number; dy: number; continuing?: boolean }
  | { type: 'reset' }
  | { type: 'undo' }
  | { type: 'redo' };

/** Undo keeps this many steps; older ones are dropped. */
export const UNDO_DEPTH = 100;

export function startEditing(automatic: readonly BoardPoint[]): OutlineEditState {
  return { automatic, points: automatic, past: [], future: [] };
}

function record(state: OutlineEditState, points: readonly BoardPoint[], continuing = false): OutlineEditState {
  if (continuing) return { ...state, points };
  return { ...state, points, past: [...state.past, state.points].slice(-UNDO_DEPTH), future: [] };
}

/**
 * Each point within `reach` nodes of `index` moves towards the middle of its
 * neighbours (one pass of Laplacian smoothing, weighted to fade towards the
 * ends of the stretch), which takes the wobble out of a stretch without
 * moving the rest of the outline.
 */
export function smoothStretch(points: readonly BoardPoint[], index: number, reach: number): BoardPoint[] {
  const n = points.length;
  const out = [...points];
  for (let k = -reach; k <= reach; k++) {
    const i = (((index + k) % n) + n) % n;
    const before = points[(i + n - 1) % n]!;
    const after = points[(i + 1) % n]!;
    const weight = 0.5 * (1 - Math.abs(k) / (reach + 1));
    const p = points[i]!;
    out[i] = { x: p.x + weight * ((before.x + after.x) / 2 - p.x), y: p.y + weight * ((before.y + after.y) / 2 - p.y) };
  }
  return out;
}

/** Applies one edit; edits that would leave fewer than 3 or more than MAX_OUTLINE_POINTS points are ignored. */
export function editOutline(state: OutlineEditState, edit: OutlineEdit): OutlineEditState {
  const n = state.points.length;
  switch (edit.type) {
    case 'moveNode':
      if (edit.index < 0 || edit.index >= n) return state;
      return record(state, state.points.map((p, i) => (i === edit.index ? edit.to : p)), edit.continuing);
    case 'addNode':
      if (n >= MAX_OUTLINE_POINTS || edit.after < 0 || edit.after >= n) return state;
      return record(state, [...state.points.slice(0, edit.after + 1), edit.at, ...state.points.slice(edit.after + 1)]);
    case 'deleteNode':
      if (n <= 3 || edit.index < 0 || edit.index >= n) return state;
      return record(state, state.points.filter((_, i) => i !== edit.index));
    case 'smooth':
      return record(state, smoothStretch(state.points, edit.index, Math.min(edit.reach, Math.floor((n - 1) / 2))));
    case 'moveAll':
      return record(state, state.points.map((p) => ({ x: p.x + edit.dx, y: p.y + edit.dy })), edit.continuing);
    case 'reset':
      return record(state, state.automatic);
    case 'undo': {
      const previous = state.past.at(-1);
      if (!previous) return state;
      return { ...state, points: previous, past: state.past.slice(0, -1), future: [state.points, ...state.future] };
    }
    case 'redo': {
      const next = state.future[0];
      if (!next) return state;
      return { ...state, points: next, past: [...state.past, state.points], future: state.future.slice(1) };
    }
  }
}

/** The index of the edge (i to i+1) nearest a point, and the nearest spot on it, for adding a node where the framer taps. */
export function nearestEdge(points: readonly BoardPoint[], at: BoardPoint): { after: number; point: BoardPoint; distance: number } {
  let best = { after: 0, point: points[0]!, distance: Infinity };
  points.forEach((a, i) => {
    const b = points[(i + 1) % points.length]!;
    const dx = b.x - a.x;
    const dy = b.y - a.y;
    const length2 = dx * dx + dy * dy;
    const t = length2 === 0 ? 0 : Math.max(0, Math.min(1, ((at.x - a.x) * dx + (at.y - a.y) * dy) / length2));
    const point = { x: a.x + t * dx, y: a.y + t * dy };
    const distance = Math.hypot(point.x - at.x, point.y - at.y);
    if (distance < best.distance) best = { after: i, point, distance };
  });
  return best;
}
