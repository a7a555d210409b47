import type { BoardPoint, Box, Polygon } from './polygon';
import { boxExpand, boxIntersection, boxPolygon, boxesOverlap, polygonBounds, polygonSignedArea, ringsNearestPair, segmentPointDistance } from './polygon';
import { polygonDifference, polygonIntersection, polygonOffset, polygonUnion } from './clip';
import type { Size } from './layoutSchema';

/**
 * Bridge widths: the board left between openings of one mat, or between an
 * opening and the outer edge, measured on face-edge lines (what the blade
 * leaves on the front of the mat). A morphological opening of the board by
 * a disc of radius w/2 (shrink by w/2, grow back by w/2) removes exactly the
 * board narrower than w; what it removes are the slivers, and each sliver is
 * then measured directly between the lines on either side of it.
 */

/** Board slivers smaller than this are rounding dust, not bridges. */
export const SLIVER_MIN_AREA_SQ_IN = 0.01;

/** How close a sliver must come to a line to count as touching it. */
const TOUCH_TOLERANCE_IN = 0.003;

/** A face-edge line of one opening in one mat. */
export interface FaceRings {
  readonly openingId: string;
  /** The line as chords, for the board's morphology. */
  readonly polygons: readonly Polygon[];
  /** The line as polygons enclosing the true curve (`shapeGrownEnclosure`), for measuring widths; the chords where they are exact. */
  readonly measure: readonly Polygon[];
  readonly box: Box;
  /** A drawn polygon or traced outline, whose own line may leave strips of board inside it; convex shapes cannot. */
  readonly concave: boolean;
}

export type OuterEdge = 'top' | 'right' | 'bottom' | 'left';

export interface BridgeSpot {
  /** Board between two lines (or a line and the edge), or a strip of board reaching into one opening. */
  readonly kind: 'bridge' | 'strip';
  readonly matIndex: number;
  /** Two openings, or one opening and the outer edge. */
  readonly openingIds: readonly string[];
  readonly edge: OuterEdge | null;
  /** Narrowest board width found, inches. */
  readonly measured: number;
  /** Middle of the narrowest spot. */
  readonly at: BoardPoint;
  /** Length of a strip, inches; null for a bridge. */
  readonly length: number | null;
}

/** A place where two lines (or a line and the edge) come close enough to need a look. */
export interface BridgeZone {
  readonly key: string;
  readonly window: Box;
  /** The whole box of one concave line, searched for strips of board inside it. */
  readonly self: boolean;
}

export function faceRings(openingId: string, polygons: readonly Polygon[], measure: readonly Polygon[] = polygons, concave = false): FaceRings | null {
  const box = polygons.length === 0 ? null : [...polygons, ...measure].map(polygonBounds).reduce((a, b) => boxUnionSafe(a, b));
  return box ? { openingId, polygons, measure, box, concave } : null;
}

function boxUnionSafe(a: Box, b: Box): Box {
  const x = Math.min(a.x, b.x);
  const y = Math.min(a.y, b.y);
  return { x, y, w: Math.max(a.x + a.w, b.x + b.w) - x, h: Math.max(a.y + a.h, b.y + b.h) - y };
}

function edgeStrip(outer: Size, edge: OuterEdge, width: number): Box {
  switch (edge) {
    case 'top': return { x: 0, y: 0, w: outer.width, h: width };
    case 'bottom': return { x: 0, y: outer.height - width, w: outer.width, h: width };
    case 'left': return { x: 0, y: 0, w: width, h: outer.height };
    case 'right': return { x: outer.width - width, y: 0, w: width, h: outer.height };
  }
}

const EDGES: readonly OuterEdge[] = ['top', 'right', 'bottom', 'left'];

/**
 * Zones worth an opening test: pairs of lines whose boxes come within the
 * probe width, and lines within it of an edge. Everything else is wider than
 * the probe by construction, so the expensive morphology only runs here.
 */
export function bridgeZones(outer: Size, faces: readonly FaceRings[], probe: number): BridgeZone[] {
  const zones: BridgeZone[] = [];
  faces.forEach((a, i) => {
    for (const b of faces.slice(i + 1)) {
      const window = boxIntersection(boxExpand(a.box, probe), boxExpand(b.box, probe));
      if (window) zones.push({ key: `${a.openingId}|${b.openingId}`, window, self: false });
    }
    for (const edge of EDGES) {
      const window = boxIntersection(boxExpand(a.box, probe), edgeStrip(outer, edge, probe));
      if (window) zones.push({ key: `${a.openingId}|@${edge}`, window, self: false });
    }
    if (a.concave) zones.push({ key: `${a.openingId}|self`, window: a.box, self: true });
  });
  return zones;
}

/**
 * Board slivers inside `window`. The board is rebuilt only within the window
 * grown by the probe width: a disc of radius w/2 that covers a point of the
 * window lies inside that margin, so the result there is exactly what the
 * whole board would give.
 */
export function boardSlivers(outer: Size, faces: readonly FaceRings[], window: Box, probe: number): Polygon[] {
  const outerBox: Box = { x: 0, y: 0, w: outer.width, h: outer.height };
  const inner = boxIntersection(boxExpand(window, probe), outerBox);
  const context = boxIntersection(boxExpand(window, 2 * probe + 0.01), outerBox);
  if (!inner || !context) return [];
  const nearby = faces.filter((f) => boxesOverlap(f.box, context)).flatMap((f) => f.polygons);
  const board = polygonDifference([boxPolygon(context)], polygonUnion(nearby));
  const opened = polygonOffset(polygonOffset(board, -probe / 2, 'round'), probe / 2, 'round');
  const removed = polygonIntersection(polygonDifference(board, opened), [boxPolygon(inner)]);
  return removed.filter((ring) => polygonSignedArea(ring) >= SLIVER_MIN_AREA_SQ_IN);
}

function ringTouchesFace(ring: Polygon, face: FaceRings, box: Box): boolean {
  if (!boxesOverlap(boxExpand(box, TOUCH_TOLERANCE_IN), face.box)) return false;
  const nearest = ringsNearestPair([ring], face.polygons, boxExpand(box, TOUCH_TOLERANCE_IN));
  return nearest !== null && nearest.distance <= TOUCH_TOLERANCE_IN;
}

function edgeDistance(outer: Size, edge: OuterEdge, p: BoardPoint): number {
  return edge === 'top' ? p.y : edge === 'bottom' ? outer.height - p.y : edge === 'left' ? p.x : outer.width - p.x;
}

function edgeFoot(outer: Size, edge: OuterEdge, p: BoardPoint): BoardPoint {
  return edge === 'top' ? { x: p.x, y: 0 } : edge === 'bottom' ? { x: p.x, y: outer.height } : edge === 'left' ? { x: 0, y: p.y } : { x: outer.width, y: p.y };
}

/**
 * Nearest approach of a line to an edge: the distance to a straight edge is
 * least at a vertex. The spot is the middle of all vertices that are about
 * as near, so a side running parallel to the edge is marked at its middle.
 */
function faceEdgeSpot(outer: Size, face: FaceRings, edge: OuterEdge, window: Box): { measured: number; at: BoardPoint } | null {
  const inWindow = (p: BoardPoint) => p.x >= window.x && p.x <= window.x + window.w && p.y >= window.y && p.y <= window.y + window.h;
  let measured = Infinity;
  for (const ring of face.measure) for (const p of ring) if (inWindow(p)) measured = Math.min(measured, edgeDistance(outer, edge, p));
  if (measured === Infinity) return null;
  let sumX = 0;
  let sumY = 0;
  let count = 0;
  for (const ring of face.measure) {
    for (const p of ring) {
      if (!inWindow(p) || edgeDistance(outer, edge, p) > measured + 0.001) continue;
      sumX += p.x;
      sumY += p.y;
      count++;
    }
  }
  const mean = { x: sumX / count, y: sumY / count };
  const foot = edgeFoot(outer, edge, mean);
  return { measured, at: { x: (mean.x + foot.x) / 2, y: (mean.y + foot.y) / 2 } };
}

/**
 * Whether a line comes within `probe` of itself somewhere other than round a
 * corner: two of its segments that near, yet more than three probes apart
 * along the line. Only then can a strip of board lie inside it, so the
 * costly morphology of the whole opening runs only for those lines (two
 * legs of a garment), not for every traced jersey. Segments are bucketed in
 * a grid of probe-sized cells; a crowded cell answers yes rather than
 * compare everything in it.
 */
export function faceNearsItself(polygons: readonly Polygon[], probe: number): boolean {
  for (const ring of polygons) if (ringNearsItself(ring, probe)) return true;
  return false;
}

const CROWDED_CELL = 64;

function ringNearsItself(ring: Polygon, probe: number): boolean {
  const n = ring.length;
  const along = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) along[i + 1] = along[i]! + Math.hypot(ring[(i + 1) % n]!.x - ring[i]!.x, ring[(i + 1) % n]!.y - ring[i]!.y);
  const perimeter = along[n]!;
  // Cells keyed by one number: x and y cell indexes stay far below 2^20 on any board the schema allows.
  const cellKey = (cx: number, cy: number) => (cx + (1 << 20)) * (1 << 21) + (cy + (1 << 20));
  const cells = new Map<number, number[]>();
  for (let i = 0; i < n; i++) {
    const a = ring[i]!;
    const b = ring[(i + 1) % n]!;
    for (let cx = Math.floor(Math.min(a.x, b.x) / probe); cx <= Math.floor(Math.max(a.x, b.x) / probe); cx++) {
      for (let cy = Math.floor(Math.min(a.y, b.y) / probe); cy <= Math.floor(Math.max(a.y, b.y) / probe); cy++) {
        const key = cellKey(cx, cy);
        const list = cells.get(key);
        if (list) list.push(i);
        else cells.set(key, [i]);
      }
    }
  }
  for (const [key, list] of cells) {
    const cx = Math.floor(key / (1 << 21)) - (1 << 20);
    const cy = (key % (1 << 21)) - (1 << 20);
    const near: number[] = [];
    for (let dx = -1; dx <= 1; dx++) for (let dy = -1; dy <= 1; dy++) for (const j of cells.get(cellKey(cx + dx, cy + dy)) ?? []) near.push(j);
    if (near.length > 9 * CROWDED_CELL) return true;
    for (const i of list) {
      for (const j of near) {
        const apart = Math.abs(along[i]! - along[j]!);
        if (Math.min(apart, perimeter - apart) <= 3 * probe) continue;
        if (segmentsDistance(ring[i]!, ring[(i + 1) % n]!, ring[j]!, ring[(j + 1) % n]!) < probe) return true;
      }
    }
  }
  return false;
}

function segmentsDistance(a: BoardPoint, b: BoardPoint, c: BoardPoint, d: BoardPoint): number {
  return Math.min(segmentPointDistance(a, b, c), segmentPointDistance(a, b, d), segmentPointDistance(c, d, a), segmentPointDistance(c, d, b));
}

/** Measures the lines on either side of one sliver, pair by pair; a sliver touching one line alone may be a strip. */
export function sliverBridges(outer: Size, faces: readonly FaceRings[], sliver: Polygon, probe: number, matIndex: number): BridgeSpot[] {
  const box = polygonBounds(sliver);
  const reach = boxExpand(box, probe);
  const touching = faces.filter((f) => ringTouchesFace(sliver, f, box));
  const edges = EDGES.filter((edge) => sliver.some((p) => edgeDistance(outer, edge, p) <= TOUCH_TOLERANCE_IN));
  if (touching.length === 1 && edges.length === 0) {
    const strip = sliverStrip(sliver, touching[0]!.openingId, matIndex, probe);
    return strip ? [strip] : [];
  }
  const spots: BridgeSpot[] = [];
  touching.forEach((a, i) => {
    for (const b of touching.slice(i + 1)) {
      const nearest = ringsNearestPair(a.measure, b.measure, reach);
      if (!nearest) continue;
      spots.push({ kind: 'bridge', matIndex, openingIds: [a.openingId, b.openingId].sort(), edge: null, measured: nearest.distance, at: nearest.middle, length: null });
    }
    for (const edge of edges) {
      const spot = faceEdgeSpot(outer, a, edge, reach);
      if (spot) spots.push({ kind: 'bridge', matIndex, openingIds: [a.openingId], edge, ...spot, length: null });
    }
  });
  return spots;
}

/**
 * A strip is board left inside one opening's own line (between two legs of
 * a garment, in a deep notch) that is more than this many times as long as
 * it is wide; shorter slivers are the corners of the line (an armpit) and
 * stay silent.
 */
export const STRIP_LENGTH_RATIO = 3;

/**
 * Width and length of a sliver read as a strip: the width is the diameter
 * of the largest disc that fits inside it (found by shrinking the sliver
 * until it vanishes, to 0.0005 in), the length its area over that width.
 * A strip between two legs of a garment is as wide as the gap; the corner a
 * disc cannot reach in an armpit is a curved triangle whose largest disc is
 * small but whose area is smaller still, so it reads short.
 */
export function sliverStripSize(sliver: Polygon, probe: number): { width: number; length: number } {
  let inside = 0;
  let outside = probe / 2 + 0.01;
  while (outside - inside > 0.00025) {
    const r = (inside + outside) / 2;
    if (polygonOffset([sliver], -r, 'round').length > 0) inside = r;
    else outside = r;
  }
  const width = 2 * inside;
  return { width, length: width > 0 ? Math.abs(polygonSignedArea(sliver)) / width : 0 };
}

function sliverStrip(sliver: Polygon, openingId: string, matIndex: number, probe: number): BridgeSpot | null {
  const { width, length } = sliverStripSize(sliver, probe);
  if (length <= STRIP_LENGTH_RATIO * width) return null;
  const box = polygonBounds(sliver);
  return { kind: 'strip', matIndex, openingIds: [openingId], edge: null, measured: width, at: { x: box.x + box.w / 2, y: box.y + box.h / 2 }, length };
}

export function bridgeSpotKey(spot: BridgeSpot): string {
  return `${spot.kind}|${spot.matIndex}|${spot.openingIds.join('|')}|${spot.edge ?? ''}`;
}

/** Keeps the narrowest spot for each pair of lines. */
export function bridgeSpotsNarrowest(spots: readonly BridgeSpot[]): BridgeSpot[] {
  const byKey = new Map<string, BridgeSpot>();
  for (const spot of spots) {
    const key = bridgeSpotKey(spot);
    const known = byKey.get(key);
    if (!known || spot.measured < known.measured) byKey.set(key, spot);
  }
  return [...byKey.values()].sort((a, b) => a.measured - b.measured);
}

/**
 * Whether any line near a zone comes within the probe width of another (or
 * of the edge): if not, the zone cannot hold a narrow bridge and the
 * morphology is skipped.
 */
export function zoneIsNarrow(outer: Size, faces: readonly FaceRings[], window: Box, probe: number): boolean {
  const reach = boxExpand(window, probe);
  const near = faces.filter((f) => boxesOverlap(f.box, reach));
  for (let i = 0; i < near.length; i++) {
    for (const edge of EDGES) {
      const spot = faceEdgeSpot(outer, near[i]!, edge, reach);
      if (spot && spot.measured < probe) return true;
    }
    for (let j = i + 1; j < near.length; j++) {
      const nearest = ringsNearestPair(near[i]!.polygons, near[j]!.polygons, reach);
      if (nearest && nearest.distance < probe) return true;
    }
  }
  return false;
}

/** All bridges of one mat narrower than the probe width. */
export function matBridgeSpots(outer: Size, faces: readonly FaceRings[], probe: number, matIndex: number): BridgeSpot[] {
  const zones = bridgeZones(outer, faces, probe).filter((zone) => zone.self || zoneIsNarrow(outer, faces, zone.window, probe));
  const spots = zones.flatMap((zone) =>
    boardSlivers(outer, faces, zone.window, probe).flatMap((sliver) => sliverBridges(outer, faces, sliver, probe, matIndex)),
  );
  return bridgeSpotsNarrowest(spots);
}
