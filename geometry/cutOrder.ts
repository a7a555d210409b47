import type { BoardPoint, Polygon } from './polygon';
import { polygonContainsPoint, polygonSignedArea } from './polygon';

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
  return paths.map((outer, b) => paths.flatMap((inner, a) => (a !== b && area[a]! < area[b]! && polygonContainsPoint(outer.ring, inner.ring[0]!) ? [a] : [])));
}

function orderKeepsNesting(order: readonly number[], before: readonly number[][]): boolean {
  const position = new Map(order.map((path, at) => [path, at]));
  return before.every((inside, b) => inside.every((a) => position.get(a)! < position.get(b)!));
}

/**
 * Nearest neighbour from the origin among paths whose nested paths are
 * done, then 2-opt reversals that keep the nesting; the drawn order wins
 * if it is shorter still, so reordering never adds travel.
 */
export function cutOrder(paths: readonly OrderedPath[], origin: BoardPoint, end: BoardPoint): number[] {
  const starts = paths.map((p) => p.start);
  const before = nestingRules(paths);
  const left = new Set(paths.keys());
  const order: number[] = [];
  let at = origin;
  while (left.size > 0) {
    const ready = [...left].filter((b) => before[b]!.every((a) => !left.has(a)));
    const next = ready.reduce((best, i) => (distance(at, starts[i]!) < distance(at, starts[best]!) ? i : best));
    order.push(next);
    left.delete(next);
    at = starts[next]!;
  }
  let best = order;
  let bestTravel = orderTravel(best, starts, origin, end);
  for (let improved = true; improved; ) {
    improved = false;
    for (let i = 0; i < best.length - 1; i++) {
      for (let j = i + 1; j < best.length; j++) {
        const candidate = [...best.slice(0, i), ...best.slice(i, j + 1).reverse(), ...best.slice(j + 1)];
        const travel = orderTravel(candidate, starts, origin, end);
        if (travel < bestTravel - 1e-9 && orderKeepsNesting(candidate, before)) [best, bestTravel, improved] = [candidate, travel, true];
      }
    }
  }
  const drawn = [...paths.keys()];
  return orderTravel(drawn, starts, origin, end) < bestTravel && orderKeepsNesting(drawn, before) ? drawn : best;
}

