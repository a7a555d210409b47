import type { BoardPoint, Polygon } from './polygon';
import { SweepStatus } from './sweepStatus';

/**
 * Finds where a ring crosses or touches itself with a sweep line
 * (Shamos and Hoyos, 1976): segments enter and leave a balanced ordered set
 * as a vertical line sweeps across, and only neighbours in that set are
 * tested. The first crossing to the left is always found before the sweep
 * passes it, so the test stops there: O(n log n) for any ring, a spiky star
 * of 50 000 points included, where testing segments that share a grid cell
 * grows with the square of the spikes meeting in the middle.
 *
 * The sweep runs in a frame turned by an arbitrary angle so that no segment
 * of a drawn or traced ring is vertical; whether two segments meet is
 * decided on the original coordinates.
 */
export function polygonSelfIntersections(polygon: Polygon, limit = 1): BoardPoint[] {
  const ring = withoutRepeatedPoints(polygon);
  if (ring.length < 4 || limit < 1) return [];
  const crossing = firstCrossing(ring);
  return crossing ? [crossing] : [];
}

export function polygonIsSimple(polygon: Polygon): boolean {
  return polygonSelfIntersections(polygon, 1).length === 0;
}

function withoutRepeatedPoints(polygon: Polygon): Polygon {
  const kept = polygon.filter((p, i) => {
    const q = polygon[(i + 1) % polygon.length]!;
    return p.x !== q.x || p.y !== q.y;
  });
  return kept.length === polygon.length ? polygon : kept;
}

/** cos and sin of the sweep frame's turn: no meaning beyond being unlike any angle a person draws. */
const TURN_COS = Math.cos(0.6180339887);
const TURN_SIN = Math.sin(0.6180339887);

interface SweepSegments {
  /** Per segment, left end then right end in the turned frame. */
  readonly ax: Float64Array;
  readonly ay: Float64Array;
  readonly bx: Float64Array;
  readonly by: Float64Array;
}

function sweepSegments(ring: Polygon): SweepSegments {
  const n = ring.length;
  const segments = { ax: new Float64Array(n), ay: new Float64Array(n), bx: new Float64Array(n), by: new Float64Array(n) };
  for (let i = 0; i < n; i++) {
    const p = ring[i]!;
    const q = ring[(i + 1) % n]!;
    let x1 = p.x * TURN_COS - p.y * TURN_SIN;
    let y1 = p.x * TURN_SIN + p.y * TURN_COS;
    let x2 = q.x * TURN_COS - q.y * TURN_SIN;
    let y2 = q.x * TURN_SIN + q.y * TURN_COS;
    if (x2 < x1 || (x2 === x1 && y2 < y1)) [x1, y1, x2, y2] = [x2, y2, x1, y1];
    segments.ax[i] = x1;
    segments.ay[i] = y1;
    segments.bx[i] = x2;
    segments.by[i] = y2;
  }
  return segments;
}

function sweepY(s: SweepSegments, i: number, x: number): number {
  if (x === s.ax[i]) return s.ay[i]!;
  if (x === s.bx[i]) return s.by[i]!;
  const dx = s.bx[i]! - s.ax[i]!;
  return dx === 0 ? s.ay[i]! : s.ay[i]! + ((s.by[i]! - s.ay[i]!) * (x - s.ax[i]!)) / dx;
}

function sweepSlope(s: SweepSegments, i: number): number {
  const dx = s.bx[i]! - s.ax[i]!;
  return dx === 0 ? Infinity : (s.by[i]! - s.ay[i]!) / dx;
}

/** Events sorted by x: a segment enters at its left end and leaves at its right end; entries first at one x. */
function sweepEvents(s: SweepSegments): number[] {
  const n = s.ax.length;
  const events = Array.from({ length: 2 * n }, (_, k) => k);
  const x = (k: number) => (k < n ? s.ax[k]! : s.bx[k - n]!);
  return events.sort((a, b) => x(a) - x(b) || (a < n ? 0 : 1) - (b < n ? 0 : 1) || a - b);
}

function firstCrossing(ring: Polygon): BoardPoint | null {
  const s = sweepSegments(ring);
  const n = ring.length;
  let x = 0;
  // Segments leaving one point are ordered by where they go next: by slope.
  const status = new SweepStatus((i, j) => sweepY(s, i, x) - sweepY(s, j, x) || sweepSlope(s, i) - sweepSlope(s, j) || i - j);
  const test = (i: number | null, j: number | null) => (i === null || j === null ? null : segmentPairCrossing(ring, Math.min(i, j), Math.max(i, j)));
  for (const event of sweepEvents(s)) {
    const entering = event < n;
    const segment = entering ? event : event - n;
    x = entering ? s.ax[segment]! : s.bx[segment]!;
    if (entering) {
      status.insert(segment);
      const found = test(status.previous(segment), segment) ?? test(segment, status.next(segment));
      if (found) return found;
    } else {
      const above = status.previous(segment);
      const below = status.next(segment);
      status.remove(segment);
      const found = test(above, below);
      if (found) return found;
    }
  }
  return null;
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
