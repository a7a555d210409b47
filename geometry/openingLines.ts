import type { Polygon } from './polygon';
import type { Shape } from './shapes';
import { ARC_TOLERANCE_IN, shapeJoin, shapePolygon } from './shapes';
import type { Mat, Opening } from './layoutSchema';
import { garmentWindowSteps, polygonOffsetStaged } from './garment';
import { workDone, type WorkSteps } from './workSteps';
import type { Placement } from './transform2d';
import { transformFromPlacement, transformPolygon } from './transform2d';

/**
 * One cut line of an opening. `exact` is the line as a shape in the
 * opening's own frame when the offset has a closed form (a circle grown by d
 * is a circle of radius r + d), so a cut file can keep true arcs; it is null
 * for ovals, polygons whose corners were squared and traced outlines.
 * `polygons` are on the board, outer rings clockwise on screen; empty when
 * the line has shrunk away.
 */
export interface CutLine {
  readonly exact: Shape | null;
  readonly polygons: readonly Polygon[];
}

export interface MatCut {
  /** 0 is the top mat. */
  readonly matIndex: number;
  /** Horizontal width of the bevel: thickness * tan(angle). */
  readonly bevelRun: number;
  /** Where the bevel meets the mat's face (the edge seen from the front). */
  readonly face: CutLine;
  /** How far the face line lies outside the sight shape: the bevel run of the lowest mat plus the reveals up to this one. */
  readonly faceGrowth: number;
  /** Where the bevel meets the mat's back. */
  readonly back: CutLine;
  /** Reveal of the mat below, between face-edge lines; null on the lowest mat cut. */
  readonly revealBelow: number | null;
  /** Coloured band of the mat below that shows: reveal minus this mat's bevel run. */
  readonly bandBelow: number | null;
}

export interface OpeningLines {
  readonly openingId: string;
  /** The sight line: what of the piece shows, the back edge of the lowest mat cut. */
  readonly sight: CutLine;
  /** Top mat first, one per mat the opening cuts. */
  readonly mats: readonly MatCut[];
}

export interface OpeningLinesOptions {
  readonly arcTolerance?: number;
  /** Thin traced outlines before offsetting; off only to measure what it saves. */
  readonly simplifyOutlines?: boolean;
}

export function matBevelRun(mat: Pick<Mat, 'thickness' | 'bevelAngle'>): number {
  return mat.thickness * Math.tan((mat.bevelAngle * Math.PI) / 180);
}

/** Closed-form offset of a shape, 'empty' when it shrinks away, null when there is none. */
export function shapeOffsetExact(shape: Shape, delta: number): Shape | 'empty' | null {
  switch (shape.kind) {
    case 'rectangle':
      return grownBox(shape.width, shape.height, delta, (width, height) => ({ kind: 'rectangle', width, height }));
    case 'roundedRectangle':
      // Inside the corner radius a rounded corner shrinks to a sharp one: still exact.
      return grownBox(shape.width, shape.height, delta, (width, height) => ({
        kind: 'roundedRectangle', width, height, cornerRadius: Math.max(0, shape.cornerRadius + delta),
      }));
    case 'circle':
      return shape.radius + delta > 0 ? { kind: 'circle', radius: shape.radius + delta } : 'empty';
    case 'regularPolygon': {
      const apothem = shape.radius * Math.cos(Math.PI / shape.sides) + delta;
      return apothem > 0 ? { kind: 'regularPolygon', sides: shape.sides, radius: apothem / Math.cos(Math.PI / shape.sides) } : 'empty';
    }
    default:
      return null;
  }
}

function grownBox(width: number, height: number, delta: number, make: (w: number, h: number) => Shape): Shape | 'empty' {
  const w = width + 2 * delta;
  const h = height + 2 * delta;
  return w > 0 && h > 0 ? make(w, h) : 'empty';
}

function lineOffset(line: CutLine, delta: number, join: 'miter' | 'round', arcTolerance: number): CutLine {
  if (line.exact) {
    const exact = shapeOffsetExact(line.exact, delta);
    if (exact === 'empty') return { exact: null, polygons: [] };
    if (exact) return { exact, polygons: [shapePolygon(exact, arcTolerance)] };
  }
  const thinned = polygonOffsetStaged(line.polygons, delta, join, arcTolerance);
  const single = thinned.length === 1 && join === 'miter' ? thinned[0]! : null;
  return { exact: single ? { kind: 'polygon', points: single } : null, polygons: thinned };
}

function* sightLine(opening: Opening, options: OpeningLinesOptions): WorkSteps<CutLine> {
  const arcTolerance = options.arcTolerance ?? ARC_TOLERANCE_IN;
  const { shape } = opening;
  if (shape.kind === 'outline') {
    const simplifyTolerance = options.simplifyOutlines === false ? 0 : undefined;
    return { exact: null, polygons: yield* garmentWindowSteps(shape.points, opening.clearance, { arcTolerance, simplifyTolerance }) };
  }
  const exact = shape.kind === 'oval' ? null : shape;
  return { exact, polygons: [shapePolygon(shape, arcTolerance)] };
}

/**
 * The lines of an opening in its own frame (centred, unturned): the same for
 * every position, so a dragged opening only needs `openingLinesPlaced`.
 * Lowest mat first: B_n = S, F_n = S + b_n; then upwards F_k = F_(k+1) + r_k
 * and B_k = F_k - b_k.
 */
export function openingLinesLocal(opening: Opening, mats: readonly Mat[], options: OpeningLinesOptions = {}): OpeningLines {
  return workDone(openingLinesLocalSteps(opening, mats, options));
}

/** `openingLinesLocal`, yielding after each offset (for a caller that spreads the work over several tasks). */
export function* openingLinesLocalSteps(opening: Opening, mats: readonly Mat[], options: OpeningLinesOptions = {}): WorkSteps<OpeningLines> {
  const arcTolerance = options.arcTolerance ?? ARC_TOLERANCE_IN;
  const join = shapeJoin(opening.shape);
  const depth = Math.min(opening.depth, mats.length);
  const sight = yield* sightLine(opening, options);
  const cuts: MatCut[] = [];
  let below: CutLine = sight;
  let growth = 0;
  for (let k = depth - 1; k >= 0; k--) {
    const bevelRun = matBevelRun(mats[k]!);
    const isLowest = k === depth - 1;
    const reveal = isLowest ? null : (opening.reveals[k] ?? 0);
    yield;
    const face = isLowest ? lineOffset(sight, bevelRun, join, arcTolerance) : lineOffset(below, reveal ?? 0, join, arcTolerance);
    if (!isLowest) yield;
    const back = isLowest ? sight : lineOffset(face, -bevelRun, join, arcTolerance);
    growth += isLowest ? bevelRun : (reveal ?? 0);
    cuts.unshift({ matIndex: k, bevelRun, face, faceGrowth: growth, back, revealBelow: reveal, bandBelow: reveal === null ? null : reveal - bevelRun });
    below = face;
  }
  return { openingId: opening.id, sight, mats: cuts };
}

function linePlaced(line: CutLine, placement: Placement): CutLine {
  const transform = transformFromPlacement(placement);
  return { exact: line.exact, polygons: line.polygons.map((ring) => transformPolygon(transform, ring)) };
}

/** Moves lines computed in the opening's frame onto the board. */
export function openingLinesPlaced(local: OpeningLines, placement: Placement): OpeningLines {
  return {
    openingId: local.openingId,
    sight: linePlaced(local.sight, placement),
    mats: local.mats.map((cut) => ({ ...cut, face: linePlaced(cut.face, placement), back: linePlaced(cut.back, placement) })),
  };
}

/** Every cut line of one opening, on the board. */
export function openingLines(opening: Opening, mats: readonly Mat[], options: OpeningLinesOptions = {}): OpeningLines {
  return openingLinesPlaced(openingLinesLocal(opening, mats, options), { center: opening.center, rotation: opening.rotation });
}
