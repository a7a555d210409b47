/**
 * Plain polygons on the board: inches, origin at the top-left of the outer
 * edge, y down. A polygon is a closed ring of points without a repeated last
 * point. Outer boundaries run clockwise on screen (positive shoelace area with
 * y down, the same orientation clipper-lib returns); holes run the other way.
 */

/** A point on the board, in inches, y down. */
export interface BoardPoint {
  readonly x: number;
  readonly y: number;
}

export type Polygon = readonly BoardPoint[];

/** An axis-aligned box in board inches: x, y is the top-left corner. */
export interface Box {
  readonly x: number;
  readonly y: number;
  readonly w: number;
  readonly h: number;
}

export type Winding = 'clockwise' | 'counterclockwise';

/** Shoelace area; positive when the ring runs clockwise on screen (y down). */
export function polygonSignedArea(polygon: Polygon): number {
  let twice = 0;
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i++) {
    const a = polygon[j]!;
    const b = polygon[i]!;
    twice += a.x * b.y - b.x * a.y;
  }
  return twice / 2;
}

export function polygonArea(polygon: Polygon): number {
  return Math.abs(polygonSignedArea(polygon));
}

export function polygonPerimeter(polygon: Polygon): number {
  let length = 0;
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i++) {
    length += Math.hypot(polygon[i]!.x - polygon[j]!.x, polygon[i]!.y - polygon[j]!.y);
  }
  return length;
}

export function polygonWinding(polygon: Polygon): Winding {
  return polygonSignedArea(polygon) >= 0 ? 'clockwise' : 'counterclockwise';
}

/** Returns the ring running the asked way, reversing a copy when needed. */
export function polygonWithWinding(polygon: Polygon, winding: Winding): Polygon {
  return polygonWinding(polygon) === winding ? polygon : [...polygon].reverse();
}

export function polygonBounds(polygon: Polygon): Box {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const p of polygon) {
    if (p.x < minX) minX = p.x;
    if (p.y < minY) minY = p.y;
    if (p.x > maxX) maxX = p.x;
    if (p.y > maxY) maxY = p.y;
  }
  return { x: minX, y: minY, w: maxX - minX, h: maxY - minY };
}

export function polygonsBounds(polygons: readonly Polygon[]): Box | null {
  const boxes = polygons.filter((p) => p.length > 0).map(polygonBounds);
  return boxes.length === 0 ? null : boxes.reduce(boxUnion);
}

export function boxUnion(a: Box, b: Box): Box {
  const x = Math.min(a.x, b.x);
  const y = Math.min(a.y, b.y);
  return { x, y, w: Math.max(a.x + a.w, b.x + b.w) - x, h: Math.max(a.y + a.h, b.y + b.h) - y };
}

export function boxExpand(box: Box, margin: number): Box {
  return { x: box.x - margin, y: box.y - margin, w: box.w + 2 * margin, h: box.h + 2 * margin };
}

export function boxIntersection(a: Box, b: Box): Box | null {
  const x = Math.max(a.x, b.x);
  const y = Math.max(a.y, b.y);
  const w = Math.min(a.x + a.w, b.x + b.w) - x;
  const h = Math.min(a.y + a.h, b.y + b.h) - y;
  return w < 0 || h < 0 ? null : { x, y, w, h };
}

export function boxesOverlap(a: Box, b: Box): boolean {
  return boxIntersection(a, b) !== null;
}

export function boxPolygon(box: Box): Polygon {
  const { x, y, w, h } = box;
  return [{ x, y }, { x: x + w, y }, { x: x + w, y: y + h }, { x, y: y + h }];
}

/** Even-odd ray casting; points exactly on an edge may fall either way. */
export function polygonContainsPoint(polygon: Polygon, point: BoardPoint): boolean {
  let inside = false;
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i++) {
    const a = polygon[i]!;
    const b = polygon[j]!;
    if (a.y > point.y !== b.y > point.y) {
      const crossX = a.x + ((point.y - a.y) * (b.x - a.x)) / (b.y - a.y);
      if (point.x < crossX) inside = !inside;
    }
  }
  return inside;
}

/** The point of segment ab nearest to p. */
export function segmentNearestPoint(a: BoardPoint, b: BoardPoint, p: BoardPoint): BoardPoint {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const lengthSquared = dx * dx + dy * dy;
  const t = lengthSquared === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / lengthSquared));
  return { x: a.x + t * dx, y: a.y + t * dy };
}

export function segmentPointDistance(a: BoardPoint, b: BoardPoint, p: BoardPoint): number {
  const q = segmentNearestPoint(a, b, p);
  return Math.hypot(p.x - q.x, p.y - q.y);
}

/** Distance from a point to the ring itself, inside or out. */
export function polygonBoundaryDistance(polygon: Polygon, point: BoardPoint): number {
  let best = Infinity;
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i++) {
    best = Math.min(best, segmentPointDistance(polygon[j]!, polygon[i]!, point));
  }
  return best;
}

/** Distance from a point to the filled polygon: zero inside, as a region distance is. */
export function polygonPointDistance(polygon: Polygon, point: BoardPoint): number {
  return polygonContainsPoint(polygon, point) ? 0 : polygonBoundaryDistance(polygon, point);
}

export interface NearestPair {
  readonly distance: number;
  readonly a: BoardPoint;
  readonly b: BoardPoint;
  /**
   * Middle of the narrow stretch: the mean of the midpoints of every pair
   * within `slack` of the nearest. Two parallel edges are equally near along
   * their whole overlap, and the middle of it is the spot worth showing.
   */
  readonly middle: BoardPoint;
}

/**
 * Nearest points of two sets of segments (each given as rings). Between
 * non-crossing segments the minimum is always at an endpoint of one of them,
 * so endpoint-to-segment distances suffice. `window` limits the search to
 * segments touching that box, which keeps bridge measurement local.
 */
export function ringsNearestPair(ringsA: readonly Polygon[], ringsB: readonly Polygon[], window?: Box, slack = 0.001): NearestPair | null {
  const pointsA = ringPoints(ringsA, window);
  const pointsB = ringPoints(ringsB, window);
  const segmentsA = ringSegments(ringsA, window);
  const segmentsB = ringSegments(ringsB, window);
  if (segmentsA.length === 0 || segmentsB.length === 0) return null;
  // First pass finds the least distance without allocating; most calls need only that.
  let best = Infinity;
  for (const p of pointsA) for (const [u, v] of segmentsB) best = Math.min(best, pointSegmentDistance(p, u, v));
  for (const p of pointsB) for (const [u, v] of segmentsA) best = Math.min(best, pointSegmentDistance(p, u, v));
  const near = { sumX: 0, sumY: 0, count: 0, a: null as BoardPoint | null, b: null as BoardPoint | null };
  const collect = (p: BoardPoint, segments: readonly Segment[], pointIsA: boolean) => {
    for (const [u, v] of segments) {
      const distance = pointSegmentDistance(p, u, v);
      if (distance > best + slack) continue;
      const q = segmentNearestPoint(u, v, p);
      near.sumX += p.x + q.x;
      near.sumY += p.y + q.y;
      near.count++;
      if (distance === best && !near.a) Object.assign(near, pointIsA ? { a: p, b: q } : { a: q, b: p });
    }
  };
  for (const p of pointsA) collect(p, segmentsB, true);
  for (const p of pointsB) collect(p, segmentsA, false);
  if (!near.a || !near.b) return null;
  return { distance: best, a: near.a, b: near.b, middle: { x: near.sumX / (2 * near.count), y: near.sumY / (2 * near.count) } };
}

/** Endpoints of the segments touching the window (each vertex once). */
function ringPoints(rings: readonly Polygon[], window?: Box): BoardPoint[] {
  const points: BoardPoint[] = [];
  for (const ring of rings) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const a = ring[j]!;
      const b = ring[i]!;
      const next = ring[(i + 1) % ring.length]!;
      if (!window || segmentTouchesBox(a, b, window) || segmentTouchesBox(b, next, window)) points.push(b);
    }
  }
  return points;
}

/** Distance from p to segment ab, inlined arithmetic for the inner loops of bridge measurement. */
function pointSegmentDistance(p: BoardPoint, a: BoardPoint, b: BoardPoint): number {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const lengthSquared = dx * dx + dy * dy;
  let t = lengthSquared === 0 ? 0 : ((p.x - a.x) * dx + (p.y - a.y) * dy) / lengthSquared;
  t = t < 0 ? 0 : t > 1 ? 1 : t;
  return Math.hypot(a.x + t * dx - p.x, a.y + t * dy - p.y);
}

type Segment = readonly [BoardPoint, BoardPoint];

function ringSegments(rings: readonly Polygon[], window?: Box): Segment[] {
  const segments: Segment[] = [];
  for (const ring of rings) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const a = ring[j]!;
      const b = ring[i]!;
      if (window && !segmentTouchesBox(a, b, window)) continue;
      segments.push([a, b]);
    }
  }
  return segments;
}

function segmentTouchesBox(a: BoardPoint, b: BoardPoint, box: Box): boolean {
  return (
    Math.max(a.x, b.x) >= box.x &&
    Math.min(a.x, b.x) <= box.x + box.w &&
    Math.max(a.y, b.y) >= box.y &&
    Math.min(a.y, b.y) <= box.y + box.h
  );
}

export function pointsAreFinite(points: Polygon): boolean {
  return points.every((p) => Number.isFinite(p.x) && Number.isFinite(p.y));
}

export function polygonTranslate(polygon: Polygon, dx: number, dy: number): Polygon {
  return polygon.map((p) => ({ x: p.x + dx, y: p.y + dy }));
}

/**
 * Total turning of a ring in full turns: the sum of the absolute angles the
 * path turns through at its corners, divided by 2 pi. A simple convex ring
 * turns once; each spike or tooth adds about one more. A straight line
 * meets a ring at most about twice per turn, which bounds the work of every
 * sweep over it (clipper's included).
 */
export function polygonTurns(polygon: Polygon): number {
  const n = polygon.length;
  let total = 0;
  for (let i = 0; i < n; i++) {
    const a = polygon[(i + n - 1) % n]!;
    const b = polygon[i]!;
    const c = polygon[(i + 1) % n]!;
    const ux = b.x - a.x;
    const uy = b.y - a.y;
    const vx = c.x - b.x;
    const vy = c.y - b.y;
    total += Math.abs(Math.atan2(ux * vy - uy * vx, ux * vx + uy * vy));
  }
  return total / (2 * Math.PI);
}

/** Largest of many numbers without spreading them into a call (which overflows the stack past about 100 000). */
export function numbersMax(values: Iterable<number>): number {
  let best = -Infinity;
  for (const v of values) if (v > best) best = v;
  return best;
}

export function numbersMin(values: Iterable<number>): number {
  let best = Infinity;
  for (const v of values) if (v < best) best = v;
  return best;
}
