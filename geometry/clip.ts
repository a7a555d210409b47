import ClipperLib from 'clipper-lib';
import type { Polygon } from './polygon';
import { polygonContainsPoint, polygonSignedArea } from './polygon';
import { ARC_TOLERANCE_IN } from './shapes';

/**
 * Offsets and booleans through clipper-lib, which works on integers: one unit
 * is 0.0001 in, so a 60 in board spans 600 000 units, far inside its range,
 * and rounding stays well below anything a blade can show.
 */
export const CLIPPER_SCALE = 10_000;

export type JoinStyle = 'miter' | 'round';

/**
 * Mitre corners may reach at most this many times the offset from the
 * original corner; sharper spikes are squared off, which a blade cannot cut
 * cleanly anyway. Right angles need only 1.414.
 */
const MITER_LIMIT = 4;

function toPaths(polygons: readonly Polygon[]): ClipperLib.Paths {
  return polygons.map((ring) => ring.map((p) => ({ X: Math.round(p.x * CLIPPER_SCALE), Y: Math.round(p.y * CLIPPER_SCALE) })));
}

function fromPaths(paths: ClipperLib.Paths): Polygon[] {
  return paths
    .filter((path) => path.length >= 3)
    .map((path) => path.map((p) => ({ x: p.X / CLIPPER_SCALE, y: p.Y / CLIPPER_SCALE })));
}

/**
 * Grows (delta > 0) or shrinks (delta < 0) closed rings by `delta` inches.
 * Outer rings must run clockwise on screen and holes the other way, as
 * clipper-lib returns them. Round joins stay within `arcTolerance` of the
 * true arc.
 */
export function polygonOffset(
  polygons: readonly Polygon[],
  delta: number,
  join: JoinStyle,
  arcTolerance: number = ARC_TOLERANCE_IN,
): Polygon[] {
  if (delta === 0) return polygons.map((ring) => [...ring]);
  const offset = new ClipperLib.ClipperOffset(MITER_LIMIT, arcTolerance * CLIPPER_SCALE);
  offset.AddPaths(toPaths(polygons), join === 'miter' ? ClipperLib.JoinType.jtMiter : ClipperLib.JoinType.jtRound, ClipperLib.EndType.etClosedPolygon);
  const solution: ClipperLib.Paths = [];
  offset.Execute(solution, delta * CLIPPER_SCALE);
  return fromPaths(solution);
}

function booleanOperation(clipType: ClipperLib.ClipType, subject: readonly Polygon[], clip: readonly Polygon[]): Polygon[] {
  const clipper = new ClipperLib.Clipper();
  clipper.AddPaths(toPaths(subject), ClipperLib.PolyType.ptSubject, true);
  clipper.AddPaths(toPaths(clip), ClipperLib.PolyType.ptClip, true);
  const solution: ClipperLib.Paths = [];
  clipper.Execute(clipType, solution, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
  return fromPaths(solution);
}

/** Everything covered by any ring; also cleans up a ring that crosses itself. */
export function polygonUnion(polygons: readonly Polygon[]): Polygon[] {
  return booleanOperation(ClipperLib.ClipType.ctUnion, polygons, []);
}

export function polygonDifference(subject: readonly Polygon[], clip: readonly Polygon[]): Polygon[] {
  return booleanOperation(ClipperLib.ClipType.ctDifference, subject, clip);
}

export function polygonIntersection(subject: readonly Polygon[], clip: readonly Polygon[]): Polygon[] {
  return booleanOperation(ClipperLib.ClipType.ctIntersection, subject, clip);
}

/** Area of a clipper result: outer rings count positive, holes negative. */
export function polygonsArea(polygons: readonly Polygon[]): number {
  return polygons.reduce((sum, ring) => sum + polygonSignedArea(ring), 0);
}

/** Splits a clipper result into regions, each an outer ring with the holes inside it. */
export function polygonRegions(polygons: readonly Polygon[]): Polygon[][] {
  const outers = polygons.filter((ring) => polygonSignedArea(ring) > 0);
  const holes = polygons.filter((ring) => polygonSignedArea(ring) < 0);
  const regions: Polygon[][] = outers.map((outer) => [outer]);
  for (const hole of holes) {
    // The smallest outer ring around the hole owns it (islands may sit inside holes).
    const owners = regions.filter(([outer]) => polygonContainsPoint(outer!, hole[0]!));
    owners.sort((a, b) => polygonSignedArea(a[0]!) - polygonSignedArea(b[0]!));
    owners[0]?.push(hole);
  }
  return regions;
}
