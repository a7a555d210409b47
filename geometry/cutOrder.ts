import type { BoardPoint, Polygon } from './polygon';
import { polygonBounds, polygonContainsPoint, polygonSignedArea } from './polygon';

/** What ordering needs of a path: where the blade enters it and the ring it encloses. */
export interface OrderedPath {
  readonly start: BoardPoint;
  readonly ring: Polygon;
}

const distance = (a: BoardPoint, b: BoardPoint) => Math.hypot(a.x - b.x, a.y - b.y);

export function orderTravel(order: readonly number[], starts: readonly BoardPoint[], origin: BoardPoint, end: BoardPoint): number {
  let at = origin;
  let total = 0;
  for (const i of order) {
    total += distance(at, starts[i]!);
    at = starts[i]!;
  }
  return total + distance(at, end);
}

/** before[b] lists the paths lying inside b's region: they must be cut while b's dropout still holds them. */
function nestingRules(paths: readonly OrderedPath[]): number[][] {
  const area = paths.map((p) => Math.abs(polygonSignedArea(p.ring)));
  const boxes = paths.map((p) => polygonBounds(p.ring));
  const inside = (a: number, b: number) => {
    const i = boxes[a]!;
    const o = boxes[b]!;
    return i.x >= o.x && i.y >= o.y && i.x + i.w <= o.x + o.w && i.y + i.h <= o.y + o.h;
  };
  return paths.map((outer, b) => paths.flatMap((inner, a) => (a !== b && area[a]! < area[b]! && inside(a, b) && polygonContainsPoint(outer.ring, inner.ring[0]!) ? [a] : [])));
}

function orderKeepsNesting(order: readonly number[], before: readonly number[][]): boolean {
  const position = new Int32Array(order.length);
  order.forEach((path, at) => { position[path] = at; });
  return before.every((inside, b) => inside.every((a) => position[a]! < position[b]!));
}

/**
 * Passes of 2-opt at most. Each pass tries every reversal in O(1) (only the
 * two joins at its ends change), so 200 openings cost a few hundred
 * thousand steps; the passes are bounded because a pass that still improves
 * gains little travel and a layout's cut must never cost seconds.
 */
export const TWO_OPT_PASSES = 6;

function nearestNeighbourOrder(starts: readonly BoardPoint[], before: readonly number[][], origin: BoardPoint): number[] {
  const left = new Set(starts.keys());
  const order: number[] = [];
  let at = origin;
  while (left.size > 0) {
    let next = -1;
    let best = Infinity;
    for (const b of left) {
      if (!before[b]!.every((a) => !left.has(a))) continue;
      const d = distance(at, starts[b]!);
      if (d < best) [next, best] = [b, d];
    }
    order.push(next);
    left.delete(next);
    at = starts[next]!;
  }
  return order;
}

/** Reverses order[i..j] when that shortens the tour and keeps the nesting; returns whether it did. */
function tryReversal(order: number[], i: number, j: number, starts: readonly BoardPoint[], origin: BoardPoint, end: BoardPoint, before: readonly number[][]): boolean {
  const prev = i === 0 ? origin : starts[order[i - 1]!]!;
  const next = j === order.length - 1 ? end : starts[order[j + 1]!]!;
  const first = starts[order[i]!]!;
  const last = starts[order[j]!]!;
  const gain = distance(prev, first) + distance(last, next) - distance(prev, last) - distance(first, next);
  if (gain <= 1e-9) return false;
  reverseRange(order, i, j);
  if (before.length === 0 || orderKeepsNesting(order, before)) return true;
  reverseRange(order, i, j);
  return false;
}

function reverseRange(order: number[], i: number, j: number): void {
  for (let a = i, b = j; a < b; a++, b--) [order[a], order[b]] = [order[b]!, order[a]!];
}

/**
 * Nearest neighbour from the origin among paths whose nested paths are
 * done, then at most `TWO_OPT_PASSES` passes of 2-opt reversals that keep
 * the nesting; the drawn order wins if it is shorter still, so reordering
 * never adds travel.
 */
export function cutOrder(paths: readonly OrderedPath[], origin: BoardPoint, end: BoardPoint): number[] {
  const starts = paths.map((p) => p.start);
  const before = nestingRules(paths);
  const order = nearestNeighbourOrder(starts, before, origin);
  // With nothing nested inside anything, every reversal keeps the nesting.
  const nested = before.some((inside) => inside.length > 0) ? before : [];
  for (let pass = 0, improved = true; improved && pass < TWO_OPT_PASSES; pass++) {
    improved = false;
    for (let i = 0; i < order.length - 1; i++) {
      for (let j = i + 1; j < order.length; j++) if (tryReversal(order, i, j, starts, origin, end, nested)) improved = true;
    }
  }
  const drawn = [...paths.keys()];
  return orderTravel(drawn, starts, origin, end) < orderTravel(order, starts, origin, end) && orderKeepsNesting(drawn, before) ? drawn : order;
}
