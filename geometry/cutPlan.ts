import type { Layout } from './layoutSchema';
import type { BoardPoint, Polygon } from './polygon';
import { polygonSignedArea } from './polygon';
import { shapeExactContour } from './shapes';
import type { CutSegment, PlanPoint } from './cutSegments';
import { angleWrap, arcSegment, segmentFromExact, segmentsAsChords, segmentsBounds, segmentsFromStart, segmentsReversed, segmentsSignedArea } from './cutSegments';
import { cutOrder, orderTravel } from './cutOrder';
import type { OpeningLines } from './openingLines';
import { openingLines } from './openingLines';
import { MILLIMETRES_PER_INCH } from './units';
import { findingWords } from './findingWords';
import { shapeFinding } from './shapeChecks';

/**
 * The cutter's work for a layout: per board, the paths the blade follows in
 * the order it follows them, in the cutter profile's units and frame.
 *
 * Winding, as seen from the face of the board: a window's path runs
 * clockwise, so the window is on the right of the blade's travel and the
 * bevel falls into it; an island left standing inside a window runs
 * counterclockwise for the same reason; the outer edge, a straight cut, runs
 * counterclockwise so the waste is on the right there too. A board cut face
 * down is seen by the cutter from the back, where every path runs the other
 * way: mirroring (x -> width - x) does exactly that, so the bevel still falls
 * into the window.
 *
 * Frame: the origin sits at the profile's corner and both axes point into the
 * sheet, so a bottom-left origin has y up (y' = height - y) and a right-hand
 * origin has x running leftwards. Arc angles are degrees from +x towards +y
 * of that frame; `sweep` is signed the same way (positive: the angle grows).
 */

export type CutOrigin = 'top-left' | 'bottom-left' | 'top-right' | 'bottom-right';

/** What the plan needs of a cutter profile; the shop settings' profiles fit it. */
export interface CutProfile {
  readonly units: 'in' | 'mm';
  readonly mirrored: boolean;
  readonly pathEdge: 'face' | 'back';
  readonly origin: CutOrigin;
  readonly arcs: boolean;
  /**
   * The cutter decides the direction of a full circle itself (it reads a
   * DXF CIRCLE, which has no direction of its own). Off by default: circles
   * are then written as two half arcs running the way the profile cuts.
   */
  readonly cutterChoosesCircleDirection?: boolean;
  readonly chordToleranceIn: number;
  readonly maxSheetWidthIn: number;
  readonly maxSheetHeightIn: number;
}

export interface CutPath {
  readonly operation: 'opening' | 'outer';
  /** The opening cut; null for the outer edge. */
  readonly openingId: string | null;
  /** Bevelled cut (windows) or straight cut (outer edge). */
  readonly bevel: boolean;
  /** Where the dropout lies: inside for a window, outside for an island and the outer edge. */
  readonly wasteSide: 'inside' | 'outside';
  readonly start: PlanPoint;
  /** Closed: the first segment leaves `start` and the last one returns to it. */
  readonly segments: readonly CutSegment[];
}

export interface BoardPlan {
  readonly board: 'mat' | 'mountingBoard';
  /** 0 is the top mat; the mounting board comes after the last mat. */
  readonly index: number;
  /** Layer and file prefix: MAT1, MAT2, ... or MOUNTING. */
  readonly label: string;
  readonly name: string;
  /** In cut order; the outer edge is always last. */
  readonly paths: readonly CutPath[];
  /** Pen-up distance from the origin through every path's start, in plan units. */
  readonly travel: number;
}

export interface CutFrame {
  readonly origin: CutOrigin;
  readonly mirrored: boolean;
  /** -1 where the plan axis runs against the face view's (x right, y down). */
  readonly xSign: 1 | -1;
  readonly ySign: 1 | -1;
  /** Plan units per inch. */
  readonly scale: number;
}

export interface CutPlan {
  readonly units: 'in' | 'mm';
  /** The sheet (the layout's outer edge) in plan units. */
  readonly width: number;
  readonly height: number;
  readonly frame: CutFrame;
  readonly pathEdge: 'face' | 'back';
  /** Full circles may be written without a direction (DXF CIRCLE). */
  readonly circlesWithoutDirection: boolean;
  readonly boards: readonly BoardPlan[];
  /** Cuts that could not be made, in plain words; a plan with any is not fit to cut. */
  readonly problems: readonly string[];
}

/** A path in face-view board inches with the ring used for nesting. */
interface BoardPath {
  readonly openingId: string | null;
  readonly wasteSide: 'inside' | 'outside';
  readonly segments: readonly CutSegment[];
  readonly ring: Polygon;
}

const TINY_IN = 1e-9;

export function cutFrame(profile: Pick<CutProfile, 'origin' | 'mirrored' | 'units'>): CutFrame {
  const right = profile.origin.endsWith('right');
  return {
    origin: profile.origin,
    mirrored: profile.mirrored,
    xSign: profile.mirrored !== right ? -1 : 1,
    ySign: profile.origin.startsWith('bottom') ? -1 : 1,
    scale: profile.units === 'mm' ? MILLIMETRES_PER_INCH : 1,
  };
}

/** Checks the sheet against the cutter before anything is written. */
export function cutSheetFitProblem(layout: Pick<Layout, 'outer'>, profile: CutProfile): string | null {
  const { width, height } = layout.outer;
  if (width <= profile.maxSheetWidthIn && height <= profile.maxSheetHeightIn) return null;
  return (
    `The layout is ${width} x ${height} in but this cutter takes sheets up to ` +
    `${profile.maxSheetWidthIn} x ${profile.maxSheetHeightIn} in; choose another cutter profile or a smaller outer size.`
  );
}

interface PathSource {
  readonly openingId: string | null;
  readonly wasteSide: BoardPath['wasteSide'];
  readonly segments: readonly CutSegment[];
  readonly ring: Polygon;
}

/** Winding, then the start, then chords (so a chorded circle still starts at its top). */
function boardPath(source: PathSource, origin: BoardPoint, chordTolerance: number | null): BoardPath {
  const kept = source.segments.filter((s) => s.kind === 'arc' || Math.hypot(s.to.x - s.from.x, s.to.y - s.from.y) > TINY_IN);
  const wantClockwise = source.wasteSide === 'inside' && source.openingId !== null;
  const oriented = segmentsSignedArea(kept) > 0 === wantClockwise ? kept : segmentsReversed(kept);
  const started = segmentsFromStart(oriented, origin);
  return { ...source, segments: chordTolerance === null ? started : segmentsAsChords(started, chordTolerance) };
}

type LinesOf = ReadonlyMap<string, OpeningLines>;

function openingPaths(layout: Layout, lines: LinesOf, matIndex: number, profile: CutProfile, origin: BoardPoint, problems: string[]): BoardPath[] {
  return layout.openings.flatMap((opening) => {
    const cut = lines.get(opening.id)?.mats[matIndex];
    if (!cut) return [];
    const line = profile.pathEdge === 'face' ? cut.face : cut.back;
    if (line.polygons.length === 0) {
      problems.push(`Opening "${opening.id}" shrinks away on mat ${matIndex + 1}; widen it before cutting.`);
      return [];
    }
    const exact = line.exact ? shapeExactContour(line.exact, { center: opening.center, rotation: opening.rotation }) : null;
    if (exact && exact.kind !== 'ellipse') {
      const segments = exact.kind === 'circle' ? [arcSegment(exact.center, exact.radius, 270, 360)] : exact.segments.map(segmentFromExact);
      const ring = line.polygons[0]!;
      return [boardPath({ openingId: opening.id, wasteSide: 'inside', segments, ring }, origin, profile.arcs ? null : profile.chordToleranceIn)];
    }
    return line.polygons.map((ring) => {
      const segments: CutSegment[] = ring.map((from, i) => ({ kind: 'line', from, to: ring[(i + 1) % ring.length]! }));
      return boardPath({ openingId: opening.id, wasteSide: polygonSignedArea(ring) > 0 ? 'inside' : 'outside', segments, ring }, origin, null);
    });
  });
}

function outerPath(layout: Layout, origin: BoardPoint): BoardPath {
  const { width: w, height: h } = layout.outer;
  const ring = [{ x: 0, y: 0 }, { x: w, y: 0 }, { x: w, y: h }, { x: 0, y: h }];
  const segments: CutSegment[] = ring.map((from, i) => ({ kind: 'line', from, to: ring[(i + 1) % 4]! }));
  return boardPath({ openingId: null, wasteSide: 'outside', segments, ring }, origin, null);
}

/** Face-view inches to the plan's frame and units. */
export function cutPointToPlan(p: BoardPoint, frame: CutFrame, outer: { width: number; height: number }): PlanPoint {
  const x = frame.xSign === 1 ? p.x : outer.width - p.x;
  const y = frame.ySign === 1 ? p.y : outer.height - p.y;
  return { x: x * frame.scale, y: y * frame.scale };
}

function segmentToPlan(s: CutSegment, frame: CutFrame, outer: { width: number; height: number }): CutSegment {
  const from = cutPointToPlan(s.from, frame, outer);
  const to = cutPointToPlan(s.to, frame, outer);
  if (s.kind === 'line') return { kind: 'line', from, to };
  // A flipped axis mirrors every angle and turns the sweep around.
  const turn = (deg: number) => (frame.xSign === -1 ? 180 - deg : deg) * frame.ySign;
  const sweep = s.sweep * frame.xSign * frame.ySign;
  const startAngle = angleWrap(turn(s.startAngle));
  return { kind: 'arc', from, to, center: cutPointToPlan(s.center, frame, outer), radius: s.radius * frame.scale, startAngle, endAngle: angleWrap(startAngle + sweep), sweep };
}

interface PlanContext {
  readonly layout: Layout;
  readonly lines: LinesOf;
  readonly profile: CutProfile;
  readonly frame: CutFrame;
  readonly problems: string[];
}

function boardPlan({ layout, lines, profile, frame, problems }: PlanContext, board: BoardPlan['board'], index: number): BoardPlan {
  const origin = { x: frame.xSign === 1 ? 0 : layout.outer.width, y: frame.ySign === 1 ? 0 : layout.outer.height };
  const openings = board === 'mat' ? openingPaths(layout, lines, index, profile, origin, problems) : [];
  const outer = outerPath(layout, origin);
  const end = outer.segments[0]!.from;
  const ordered = [...cutOrder(openings.map((p) => ({ start: p.segments[0]!.from, ring: p.ring })), origin, end).map((i) => openings[i]!), outer];
  const toPlan = (p: BoardPath): CutPath => {
    const segments = p.segments.map((s) => segmentToPlan(s, frame, layout.outer));
    return { operation: p.openingId === null ? 'outer' : 'opening', openingId: p.openingId, bevel: p.openingId !== null, wasteSide: p.wasteSide, start: segments[0]!.from, segments };
  };
  const starts = ordered.map((p) => p.segments[0]!.from);
  const travel = orderTravel(starts.slice(0, -1).map((_, i) => i), starts, origin, end) * frame.scale;
  const mat = layout.mats[index];
  return {
    board,
    index,
    label: board === 'mat' ? `MAT${index + 1}` : 'MOUNTING',
    name: mat?.name ?? 'Mounting board',
    paths: ordered.map(toPlan),
    travel,
  };
}

/** The whole cut plan: every mat top first, then the mounting board when the layout asks for it to be cut. */
export function cutPlan(layout: Layout, profile: CutProfile): CutPlan {
  const frame = cutFrame(profile);
  const problems: string[] = [];
  // Each opening's lines once for all mats: a traced outline is the costly part. A shape that cannot be cut is never offset.
  const words = findingWords(layout);
  const cuttable = layout.openings.filter((o) => {
    const problem = shapeFinding(o, words);
    if (problem) problems.push(problem.message);
    return !problem;
  });
  const lines = new Map(cuttable.map((o) => [o.id, openingLines(o, layout.mats, { arcTolerance: profile.chordToleranceIn })]));
  const context = { layout, lines, profile, frame, problems };
  const boards = layout.mats.map((_, i) => boardPlan(context, 'mat', i));
  if (layout.mountingBoard.cut) boards.push(boardPlan(context, 'mountingBoard', layout.mats.length));
  return {
    units: profile.units,
    width: layout.outer.width * frame.scale,
    height: layout.outer.height * frame.scale,
    frame,
    pathEdge: profile.pathEdge,
    circlesWithoutDirection: profile.cutterChoosesCircleDirection === true,
    boards,
    problems,
  };
}

/** Bounding box of a path in plan units, arcs by their true extremes. */
export function cutPathBounds(path: CutPath): { x: number; y: number; w: number; h: number } {
  return segmentsBounds(path.segments);
}
