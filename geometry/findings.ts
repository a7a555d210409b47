import type { BoardPoint, Box, Polygon } from './polygon';
import { boxExpand, boxesOverlap, pointsAreFinite, polygonArea, polygonBounds, polygonContainsPoint, polygonsBounds, ringsNearestPair } from './polygon';
import { polygonIntersection } from './clip';
import { polygonSelfIntersections } from './selfIntersection';
import type { CheckSettings, Layout, Opening } from './layoutSchema';
import type { OpeningLines } from './openingLines';
import type { BridgeSpot } from './bridges';
import type { Shape } from './shapes';
import { shapePolygon } from './shapes';
import { EPSILON_IN, formatLength } from './units';

/**
 * One thing a framer should look at, with where it is so the canvas can
 * highlight it. Lengths in `measured` and `required` are inches.
 */
export interface Finding {
  readonly code: FindingCode;
  readonly severity: 'error' | 'warning' | 'info';
  readonly message: string;
  readonly at: BoardPoint | Box;
  readonly measured: number | null;
  readonly required: number | null;
  readonly openingIds?: readonly string[];
  /** 0 is the top mat. */
  readonly matIndex?: number;
}

export type FindingCode =
  | 'bridge-narrow'
  | 'band-narrow'
  | 'openings-overlap'
  | 'opening-outside-mat'
  | 'piece-not-covered'
  | 'overlap-small'
  | 'piece-larger-than-opening'
  | 'layout-larger-than-sheet'
  | 'layout-larger-than-rabbet'
  | 'shape-degenerate'
  | 'shape-self-intersecting';

/** Plain words for a length: decimals for precision, the nearest 1/32 for the shop floor. */
export function lengthWords(value: number): string {
  return `${value.toFixed(3)} in (about ${formatLength(value, '1/32')})`;
}

function matWords(matIndex: number): string {
  return `mat ${matIndex + 1}`;
}

function shapeNumbers(shape: Shape): number[] {
  switch (shape.kind) {
    case 'rectangle': case 'oval': return [shape.width, shape.height];
    case 'roundedRectangle': return [shape.width, shape.height, shape.cornerRadius + 1];
    case 'circle': return [shape.radius];
    case 'regularPolygon': return [shape.radius, shape.sides - 2];
    default: return [];
  }
}

/** A shape nothing can be cut from: a clear finding instead of a crash later on. */
export function shapeFinding(opening: Opening): Finding | null {
  const { shape, center } = opening;
  const at = Number.isFinite(center.x) && Number.isFinite(center.y) ? center : { x: 0, y: 0 };
  const base = { at, measured: null, required: null, openingIds: [opening.id] };
  const degenerate = (why: string): Finding => ({ ...base, code: 'shape-degenerate', severity: 'error', message: `Opening "${opening.id}" cannot be cut: ${why}.` });
  if (!Number.isFinite(center.x) || !Number.isFinite(center.y) || !Number.isFinite(opening.rotation)) return degenerate('its position is not a number');
  if (shape.kind !== 'polygon' && shape.kind !== 'outline') {
    const numbers = shapeNumbers(shape);
    if (!numbers.every(Number.isFinite)) return degenerate('a size is not a number');
    return numbers.every((n) => n > 0) ? null : degenerate('a size is zero or negative');
  }
  if (shape.points.length < 3) return degenerate(`its outline has ${shape.points.length} point(s); it needs at least 3`);
  if (!pointsAreFinite(shape.points)) return degenerate('a point of its outline is not a number');
  if (polygonArea(shape.points) < EPSILON_IN) return degenerate('its outline encloses no area');
  const crossing = polygonSelfIntersections(shape.points, 1)[0];
  if (!crossing) return null;
  return {
    ...base,
    code: 'shape-self-intersecting',
    severity: 'error',
    at: { x: center.x + crossing.x, y: center.y + crossing.y },
    message: `The outline of opening "${opening.id}" crosses itself; retrace or edit it near the marked spot.`,
  };
}

export function bridgeFinding(spot: BridgeSpot, settings: CheckSettings): Finding | null {
  if (spot.measured >= settings.bridgeWarning - EPSILON_IN) return null;
  const severity = spot.measured < settings.bridgeError - EPSILON_IN ? 'error' : 'warning';
  const required = severity === 'error' ? settings.bridgeError : settings.bridgeWarning;
  const between = spot.edge ? `opening "${spot.openingIds[0]}" and the ${spot.edge} edge` : `openings "${spot.openingIds[0]}" and "${spot.openingIds[1]}"`;
  const risk = severity === 'error' ? 'it will likely tear' : 'it may tear or warp';
  return {
    code: 'bridge-narrow', severity, at: spot.at, measured: spot.measured, required, openingIds: spot.openingIds, matIndex: spot.matIndex,
    message: `The board between ${between} in ${matWords(spot.matIndex)} is only ${lengthWords(spot.measured)} wide; ${risk}. Keep at least ${lengthWords(required)}.`,
  };
}

export function bandFindings(lines: OpeningLines, settings: CheckSettings): Finding[] {
  const findings: Finding[] = [];
  for (const cut of lines.mats) {
    if (cut.bandBelow === null || cut.bandBelow >= settings.minimumBand - EPSILON_IN) continue;
    const box = polygonsBounds(cut.face.polygons) ?? { x: 0, y: 0, w: 0, h: 0 };
    const shows = cut.bandBelow <= 0 ? 'does not show at all' : `shows only ${lengthWords(cut.bandBelow)}`;
    findings.push({
      code: 'band-narrow', severity: 'warning', at: box, measured: cut.bandBelow, required: settings.minimumBand,
      openingIds: [lines.openingId], matIndex: cut.matIndex + 1,
      message: `In opening "${lines.openingId}", ${matWords(cut.matIndex + 1)} ${shows} of colour, because the bevel of ${matWords(cut.matIndex)} covers ${lengthWords(cut.bevelRun)} of its reveal. Widen the reveal.`,
    });
  }
  return findings;
}

export function outsideFinding(lines: OpeningLines, layout: Layout): Finding | null {
  const top = lines.mats[0];
  if (!top) return null;
  const { width, height } = layout.outer;
  const outside = top.face.polygons.flat().filter((p) => p.x < -EPSILON_IN || p.y < -EPSILON_IN || p.x > width + EPSILON_IN || p.y > height + EPSILON_IN);
  if (outside.length === 0) return null;
  const reach = Math.max(...outside.map((p) => Math.max(-p.x, -p.y, p.x - width, p.y - height)));
  return {
    code: 'opening-outside-mat', severity: 'error', at: polygonBounds(outside), measured: -reach, required: 0, openingIds: [lines.openingId], matIndex: 0,
    message: `Opening "${lines.openingId}" runs ${lengthWords(reach)} past the outer edge of the mat.`,
  };
}

/** Overlap of two openings' face lines in the top mat, where every opening's lines are largest. */
export function overlapFinding(a: OpeningLines, b: OpeningLines): Finding | null {
  const ringsA = a.mats[0]?.face.polygons ?? [];
  const ringsB = b.mats[0]?.face.polygons ?? [];
  const boxA = polygonsBounds(ringsA);
  const boxB = polygonsBounds(ringsB);
  if (!boxA || !boxB || !boxesOverlap(boxA, boxB)) return null;
  const nearest = ringsNearestPair(ringsA, ringsB);
  if (!nearest) return null;
  const contained = polygonContainsPoint(ringsA[0] ?? [], ringsB[0]?.[0] ?? { x: NaN, y: NaN }) || polygonContainsPoint(ringsB[0] ?? [], ringsA[0]?.[0] ?? { x: NaN, y: NaN });
  if (nearest.distance > EPSILON_IN && !contained) return null;
  const common = polygonIntersection(ringsA, ringsB);
  const box = polygonsBounds(common);
  if (!box || common.reduce((sum, ring) => sum + polygonArea(ring), 0) < EPSILON_IN) return null;
  return {
    code: 'openings-overlap', severity: 'error', at: box, measured: -Math.min(box.w, box.h), required: 0, openingIds: [a.openingId, b.openingId], matIndex: 0,
    message: `Openings "${a.openingId}" and "${b.openingId}" overlap, leaving no board between them. Move them apart.`,
  };
}

export function pieceFinding(opening: Opening, settings: CheckSettings): Finding | null {
  if (!opening.pieceSize || opening.shape.kind === 'outline') return null;
  const halfW = opening.pieceSize.width / 2;
  const halfH = opening.pieceSize.height / 2;
  const sight: Polygon = shapePolygon(opening.shape);
  const at = boxExpand({ x: opening.center.x, y: opening.center.y, w: 0, h: 0 }, Math.max(halfW, halfH));
  const ids = [opening.id];
  if (opening.clearance >= 0) {
    const corners = [{ x: -halfW, y: -halfH }, { x: halfW, y: -halfH }, { x: halfW, y: halfH }, { x: -halfW, y: halfH }];
    if (corners.every((c) => polygonContainsPoint(sight, c))) return null;
    return {
      code: 'piece-larger-than-opening', severity: 'warning', at, measured: null, required: null, openingIds: ids,
      message: `The piece in opening "${opening.id}" is larger than the opening, so the mat will cover part of it although a gap was asked for.`,
    };
  }
  const overlap = Math.min(...sight.map((p) => Math.min(halfW - Math.abs(p.x), halfH - Math.abs(p.y))));
  if (overlap < -EPSILON_IN) {
    return {
      code: 'piece-not-covered', severity: 'error', at, measured: overlap, required: settings.minimumOverlap, openingIds: ids,
      message: `Opening "${opening.id}" is larger than its piece by ${lengthWords(-overlap)}, so the mat cannot hold the piece's edge. Make the opening smaller than the piece.`,
    };
  }
  if (overlap >= settings.minimumOverlap - EPSILON_IN) return null;
  return {
    code: 'overlap-small', severity: 'warning', at, measured: overlap, required: settings.minimumOverlap, openingIds: ids,
    message: `The mat overlaps the piece in opening "${opening.id}" by only ${lengthWords(overlap)}; at least ${lengthWords(settings.minimumOverlap)} holds it securely.`,
  };
}

export function sizeFindings(layout: Layout): Finding[] {
  const { outer, frameRabbet, checkSettings } = layout;
  const at: Box = { x: 0, y: 0, w: outer.width, h: outer.height };
  const findings: Finding[] = [];
  layout.mats.forEach((mat, matIndex) => {
    const fits = (outer.width <= mat.sheet.width + EPSILON_IN && outer.height <= mat.sheet.height + EPSILON_IN) ||
      (outer.width <= mat.sheet.height + EPSILON_IN && outer.height <= mat.sheet.width + EPSILON_IN);
    if (fits) return;
    findings.push({
      code: 'layout-larger-than-sheet', severity: 'error', at, measured: Math.max(outer.width, outer.height), required: Math.max(mat.sheet.width, mat.sheet.height), matIndex,
      message: `The layout (${outer.width} x ${outer.height} in) does not fit the ${mat.sheet.width} x ${mat.sheet.height} in sheet of ${matWords(matIndex)} "${mat.name}".`,
    });
  });
  if (frameRabbet) {
    const maxW = frameRabbet.width - checkSettings.rabbetAllowance;
    const maxH = frameRabbet.height - checkSettings.rabbetAllowance;
    const excess = Math.max(outer.width - maxW, outer.height - maxH);
    if (excess > EPSILON_IN) {
      findings.push({
        code: 'layout-larger-than-rabbet', severity: 'error', at, measured: excess, required: 0,
        message: `The mats are ${lengthWords(excess)} too large for the frame: cut them at most ${maxW} x ${maxH} in, the rabbet less ${lengthWords(checkSettings.rabbetAllowance)}.`,
      });
    }
  }
  return findings;
}
