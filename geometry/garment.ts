import type { BoardPoint, Polygon } from './polygon';
import { polygonWithWinding } from './polygon';
import { polygonOffset } from './clip';
import { ARC_TOLERANCE_IN } from './shapes';
import { workDone, type WorkSteps } from './workSteps';

/** Traced outlines are thinned to within this distance before any offset. */
export const OUTLINE_SIMPLIFY_TOLERANCE_IN = 0.002;

/**
 * Notches in a garment window narrower than twice this radius are filled and
 * spikes thinner than it are trimmed: a bevel blade cannot follow them and
 * they would only weaken the board.
 */
export const GARMENT_SMOOTHING_RADIUS_IN = 1 / 16;

/**
 * Ramer–Douglas–Peucker on a closed ring: keeps the points needed for the
 * ring to stay within `tolerance` of the original. Iterative, because a
 * 20 000 point trace would overflow a recursive version's stack in the worst
 * case.
 */
export function polygonSimplify(ring: Polygon, tolerance: number): Polygon {
  const n = ring.length;
  if (n <= 4) return ring;
  const far = farthestIndex(ring, 0);
  const keep = new Uint8Array(n);
  keep[0] = 1;
  keep[far] = 1;
  const stack: Array<[number, number]> = [[0, far], [far, n]];
  while (stack.length > 0) {
    const [start, end] = stack.pop()!;
    const worst = farthestFromChord(ring, start, end, tolerance);
    if (worst >= 0) {
      keep[worst] = 1;
      stack.push([start, worst], [worst, end]);
    }
  }
  const kept = ring.filter((_, i) => keep[i] === 1);
  return kept.length >= 3 ? kept : ring;
}

/** Index of the point between start and end farthest from their chord, if beyond tolerance; arithmetic inlined because this loop runs over every traced point. */
function farthestFromChord(ring: Polygon, start: number, end: number, tolerance: number): number {
  const n = ring.length;
  const a = ring[start % n]!;
  const b = ring[end % n]!;
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const lengthSquared = dx * dx + dy * dy;
  let worst = -1;
  let worstSquared = tolerance * tolerance;
  for (let i = start + 1; i < end; i++) {
    const p = ring[i]!;
    let t = lengthSquared === 0 ? 0 : ((p.x - a.x) * dx + (p.y - a.y) * dy) / lengthSquared;
    t = t < 0 ? 0 : t > 1 ? 1 : t;
    const ex = a.x + t * dx - p.x;
    const ey = a.y + t * dy - p.y;
    const squared = ex * ex + ey * ey;
    if (squared > worstSquared) {
      worst = i;
      worstSquared = squared;
    }
  }
  return worst;
}

function farthestIndex(ring: Polygon, from: number): number {
  const origin = ring[from]!;
  let best = from;
  let bestDistance = -1;
  ring.forEach((p, i) => {
    const distance = (p.x - origin.x) ** 2 + (p.y - origin.y) ** 2;
    if (distance > bestDistance) {
      best = i;
      bestDistance = distance;
    }
  });
  return best;
}

/**
 * Drops points while every point skipped since the last kept one stays
 * within `tolerance` of the chord from that point to the next: a linear pass
 * in practice (runs between kept points are short), cheap enough to run
 * after every offset, unlike the global search of `polygonSimplify`.
 */
export function polygonThin(ring: Polygon, tolerance: number): Polygon {
  if (ring.length <= 4) return ring;
  const kept: BoardPoint[] = [ring[0]!];
  let anchor = 0;
  for (let i = 1; i < ring.length; i++) {
    const next = ring[(i + 1) % ring.length]!;
    // A run is cut after MAX_THIN_RUN points, so 50 000 points on one straight line stay linear work.
    if (i - anchor >= MAX_THIN_RUN || !runFitsChord(ring, anchor, i, next, tolerance)) {
      kept.push(ring[i]!);
      anchor = i;
    }
  }
  return kept.length >= 3 ? kept : ring;
}

function runFitsChord(ring: Polygon, anchor: number, last: number, next: BoardPoint, tolerance: number): boolean {
  const a = ring[anchor]!;
  const dx = next.x - a.x;
  const dy = next.y - a.y;
  const length = Math.hypot(dx, dy);
  if (length === 0) return false;
  for (let j = anchor + 1; j <= last; j++) {
    const p = ring[j]!;
    const along = (p.x - a.x) * dx + (p.y - a.y) * dy;
    if (along < 0 || along > length * length) return false;
    if (Math.abs((p.x - a.x) * dy - (p.y - a.y) * dx) / length > tolerance) return false;
  }
  return true;
}

/** Longest run of points `polygonThin` replaces by one chord. */
const MAX_THIN_RUN = 256;

/** Rings with more points than this are offset in growing steps (`polygonOffsetStaged`). */
export const STAGED_OFFSET_POINTS = 2000;

/** The first step of a staged offset, inches; each later step doubles. */
const FIRST_STAGE_IN = 0.0005;

/**
 * Offsets a dense ring in steps of 0.0005, 0.001, 0.002 ... inches. Round
 * offsets compose (a disc of radius a swept by one of radius b is one of
 * radius a + b), so the result is the same as one offset, but each step
 * only meets the neighbours within its own small distance: the spikes of a
 * 50 000-point star merge in the first steps instead of making clipper
 * intersect every spike with hundreds of others, which grows with the
 * square of the points. Mitre offsets compose the same way wherever the
 * mitre limit does not square a corner off.
 */
export function polygonOffsetStaged(rings: readonly Polygon[], delta: number, join: 'miter' | 'round', arcTolerance: number = ARC_TOLERANCE_IN): Polygon[] {
  const points = rings.reduce((sum, ring) => sum + ring.length, 0);
  const thin = (result: Polygon[]) => (join === 'round' ? result.map((ring) => polygonThin(ring, arcTolerance / 10)) : result);
  if (points <= STAGED_OFFSET_POINTS || Math.abs(delta) <= FIRST_STAGE_IN) return thin(polygonOffset(rings, delta, join, arcTolerance));
  let current: Polygon[] = [...rings];
  let remaining = Math.abs(delta);
  for (let step = FIRST_STAGE_IN; remaining > 0 && current.length > 0; step *= 2) {
    const d = Math.min(step, remaining);
    current = thin(polygonOffset(current, Math.sign(delta) * d, join, arcTolerance));
    remaining -= d;
  }
  return current;
}

/** Clipper's round joins add points on every bend; this drops those within a tenth of the arc tolerance. */
export function polygonOffsetThinned(rings: readonly Polygon[], delta: number, arcTolerance: number = ARC_TOLERANCE_IN): Polygon[] {
  return polygonOffsetStaged(rings, delta, 'round', arcTolerance);
}

export interface GarmentWindowOptions {
  readonly simplifyTolerance?: number;
  readonly smoothingRadius?: number;
  readonly arcTolerance?: number;
}

/**
 * The sight shape of a garment window: the traced outline thinned, grown by
 * the clearance (round joins), then closed and opened by the smoothing
 * radius. Grows compose (offsetting by a and then b equals offsetting by
 * a + b), so the clearance and the first smoothing step run as one offset
 * and the two shrinks as one: three offsets in all.
 */
export function garmentWindow(outline: readonly BoardPoint[], clearance: number, options: GarmentWindowOptions = {}): Polygon[] {
  return workDone(garmentWindowSteps(outline, clearance, options));
}

/** `garmentWindow`, yielding after each offset. */
export function* garmentWindowSteps(outline: readonly BoardPoint[], clearance: number, options: GarmentWindowOptions = {}): WorkSteps<Polygon[]> {
  const tolerance = options.simplifyTolerance ?? OUTLINE_SIMPLIFY_TOLERANCE_IN;
  const s = options.smoothingRadius ?? GARMENT_SMOOTHING_RADIUS_IN;
  const arc = options.arcTolerance ?? ARC_TOLERANCE_IN;
  // Douglas-Peucker keeps fewer points but can cost n^2 on a hostile trace; beyond that size the linear thinning runs.
  const simplify = (ring: Polygon) => (ring.length <= STAGED_OFFSET_POINTS ? polygonSimplify(ring, tolerance) : polygonThin(ring, tolerance));
  const ring = polygonWithWinding(tolerance > 0 ? simplify(outline) : outline, 'clockwise');
  // The checks refuse traces that cross themselves, so the ring is simple here.
  const clean = [ring];
  const grow = (rings: readonly Polygon[], delta: number) => polygonOffsetThinned(rings, delta, arc);
  if (s <= 0) return grow(clean, clearance);
  let grown: Polygon[];
  if (clearance >= 0) grown = grow(clean, clearance + s);
  else {
    const cleared = grow(clean, clearance);
    yield;
    grown = grow(cleared, s);
  }
  yield;
  const shrunk = grow(grown, -2 * s);
  yield;
  return grow(shrunk, s);
}
