import type { BoardPoint, Polygon } from './polygon';
import { polygonBounds } from './polygon';

/**
 * Finds places where a ring crosses itself. Traced outlines reach 20 000
 * points, so segments are bucketed in a uniform grid (about one segment per
 * cell) and only segments sharing a cell are compared: close to linear time
 * instead of the quadratic all-pairs test.
 */
export function polygonSelfIntersections(polygon: Polygon, limit = 1): BoardPoint[] {
  const n = polygon.length;
  if (n < 4) return [];
  const grid = segmentGrid(polygon);
  const found: BoardPoint[] = [];
  for (const cell of grid.cells.values()) {
    for (let p = 0; p < cell.length; p++) {
      for (let q = p + 1; q < cell.length; q++) {
        const crossing = segmentPairCrossing(polygon, cell[p]!, cell[q]!);
        if (crossing && !found.some((f) => f.x === crossing.x && f.y === crossing.y)) {
          found.push(crossing);
          if (found.length >= limit) return found;
        }
      }
    }
  }
  return found;
}

export function polygonIsSimple(polygon: Polygon): boolean {
  return polygonSelfIntersections(polygon, 1).length === 0;
}

interface SegmentGrid {
  readonly cells: Map<number, number[]>;
}

function segmentGrid(polygon: Polygon): SegmentGrid {
  const box = polygonBounds(polygon);
  const n = polygon.length;
  const side = Math.max(1, Math.ceil(Math.sqrt(n)));
  const cellW = box.w / side || 1;
  const cellH = box.h / side || 1;
  const cells = new Map<number, number[]>();
  for (let i = 0; i < n; i++) {
    const a = polygon[i]!;
    const b = polygon[(i + 1) % n]!;
    const x0 = Math.min(side - 1, Math.floor((Math.min(a.x, b.x) - box.x) / cellW));
    const x1 = Math.min(side - 1, Math.floor((Math.max(a.x, b.x) - box.x) / cellW));
    const y0 = Math.min(side - 1, Math.floor((Math.min(a.y, b.y) - box.y) / cellH));
    const y1 = Math.min(side - 1, Math.floor((Math.max(a.y, b.y) - box.y) / cellH));
    for (let cx = x0; cx <= x1; cx++) {
      for (let cy = y0; cy <= y1; cy++) {
        const key = cy * side + cx;
        const list = cells.get(key);
        if (list) list.push(i);
        else cells.set(key, [i]);
      }
    }
  }
  return { cells };
}

/** Crossing of segments i and j (i < j) of the ring, ignoring the shared end of neighbours. */
function segmentPairCrossing(polygon: Polygon, i: number, j: number): BoardPoint | null {
  const n = polygon.length;
  const neighbours = j === i + 1 || (i === 0 && j === n - 1);
  const a = polygon[i]!;
  const b = polygon[(i + 1) % n]!;
  const c = polygon[j]!;
  const d = polygon[(j + 1) % n]!;
  const rx = b.x - a.x;
  const ry = b.y - a.y;
  const sx = d.x - c.x;
  const sy = d.y - c.y;
  const denominator = rx * sy - ry * sx;
  if (denominator === 0) return neighbours ? null : collinearOverlap(a, b, c, d);
  const t = ((c.x - a.x) * sy - (c.y - a.y) * sx) / denominator;
  const u = ((c.x - a.x) * ry - (c.y - a.y) * rx) / denominator;
  if (t < 0 || t > 1 || u < 0 || u > 1) return null;
  if (neighbours) return null;
  return { x: a.x + t * rx, y: a.y + t * ry };
}

/** Two segments on one line that share more than a point fold the ring back on itself. */
function collinearOverlap(a: BoardPoint, b: BoardPoint, c: BoardPoint, d: BoardPoint): BoardPoint | null {
  const cross = (c.x - a.x) * (b.y - a.y) - (c.y - a.y) * (b.x - a.x);
  if (cross !== 0) return null;
  const alongX = Math.abs(b.x - a.x) >= Math.abs(b.y - a.y);
  const key = (p: BoardPoint) => (alongX ? p.x : p.y);
  const lo = Math.max(Math.min(key(a), key(b)), Math.min(key(c), key(d)));
  const hi = Math.min(Math.max(key(a), key(b)), Math.max(key(c), key(d)));
  if (hi <= lo) return null;
  return alongX ? { x: lo, y: a.y + ((lo - a.x) / (b.x - a.x)) * (b.y - a.y) } : { x: a.x + ((lo - a.y) / (b.y - a.y)) * (b.x - a.x), y: lo };
}
