import type { BoardPoint, Box, Polygon } from './polygon';
import { boxExpand, boxIntersection, boxesOverlap, numbersMax, numbersMin, polygonContainsPoint, polygonsBounds, ringsNearestPair } from './polygon';
import { polygonIntersection, polygonsArea } from './clip';
import type { CheckSettings, Layout, Opening } from './layoutSchema';
import type { OpeningLines } from './openingLines';
import type { BridgeSpot } from './bridges';
import type { FindingWords } from './findingWords';
import { capitalised, matWords } from './findingWords';
import { shapePolygon } from './shapes';
import { EPSILON_IN } from './units';

export { shapeFinding } from './shapeChecks';

/**
 * One thing a framer should look at, with where it is so the canvas can
 * highlight it. Lengths in `measured` and `required` are inches, exact; the
 * message rounds them the shop's way.
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
  | 'strip-narrow'
  | 'band-narrow'
  | 'openings-overlap'
  | 'opening-outside-mat'
  | 'piece-not-covered'
  | 'overlap-small'
  | 'piece-larger-than-opening'
  | 'layout-larger-than-sheet'
  | 'layout-larger-than-rabbet'
  | 'shape-degenerate'
  | 'shape-too-detailed'
  | 'shape-self-intersecting';

/** Two face lines this close count as touching: one clipper unit. */
export const OVERLAP_TOUCH_IN = EPSILON_IN;

function edgeWords(edge: string): string {
  return `the ${edge} edge`;
}

export function bridgeFinding(spot: BridgeSpot, settings: CheckSettings, words: FindingWords): Finding | null {
  if (spot.measured >= settings.bridgeWarning - EPSILON_IN) return null;
  const severity = spot.measured < settings.bridgeError - EPSILON_IN ? 'error' : 'warning';
  const required = severity === 'error' ? settings.bridgeError : settings.bridgeWarning;
  const risk = severity === 'error' ? 'it will likely tear' : 'it may tear or warp';
  const base = { severity, at: spot.at, measured: spot.measured, required, openingIds: spot.openingIds, matIndex: spot.matIndex } as const;
  const width = words.length(spot.measured);
  if (spot.kind === 'strip') {
    return {
      ...base, code: 'strip-narrow',
      message: `A strip of board about ${width} wide and ${words.length(spot.length ?? 0)} long reaches into ${words.opening(spot.openingIds[0]!)} in ${matWords(spot.matIndex)}; ${risk}. Keep it at least ${words.length(required)} wide, or join the two sides of the opening.`,
    };
  }
  const between = spot.edge ? `${words.opening(spot.openingIds[0]!)} and ${edgeWords(spot.edge)}` : `${words.opening(spot.openingIds[0]!)} and ${words.opening(spot.openingIds[1]!)}`;
  return {
    ...base, code: 'bridge-narrow',
    message: `The board between ${between} in ${matWords(spot.matIndex)} is only ${width} wide; ${risk}. Keep at least ${words.length(required)}.`,
  };
}

export function bandFindings(lines: OpeningLines, settings: CheckSettings, words: FindingWords): Finding[] {
  const findings: Finding[] = [];
  for (const cut of lines.mats) {
    if (cut.bandBelow === null || cut.bandBelow >= settings.minimumBand - EPSILON_IN) continue;
    const box = polygonsBounds(cut.face.polygons) ?? { x: 0, y: 0, w: 0, h: 0 };
    const shows = cut.bandBelow <= 0 ? 'does not show at all' : `shows only ${words.length(cut.bandBelow)}`;
    findings.push({
      code: 'band-narrow', severity: 'warning', at: box, measured: cut.bandBelow, required: settings.minimumBand,
      openingIds: [lines.openingId], matIndex: cut.matIndex + 1,
      message: `In ${words.opening(lines.openingId)}, ${matWords(cut.matIndex + 1)} ${shows} of colour, because the bevel of ${matWords(cut.matIndex)} covers ${words.length(cut.bevelRun)} of its reveal. Widen the reveal.`,
    });
  }
  return findings;
}

export function outsideFinding(lines: OpeningLines, layout: Layout, words: FindingWords, measure?: readonly Polygon[]): Finding | null {
  const top = lines.mats[0];
  if (!top) return null;
  const { width, height } = layout.outer;
  const rings = measure ?? top.face.polygons;
  const outside = rings.flat().filter((p) => p.x < -EPSILON_IN || p.y < -EPSILON_IN || p.x > width + EPSILON_IN || p.y > height + EPSILON_IN);
  if (outside.length === 0) return null;
  const reach = numbersMax(outside.map((p) => Math.max(-p.x, -p.y, p.x - width, p.y - height)));
  return {
    code: 'opening-outside-mat', severity: 'error', at: polygonsBounds([outside])!, measured: -reach, required: 0, openingIds: [lines.openingId], matIndex: 0,
    message: `${capitalised(words.opening(lines.openingId))} runs ${words.length(reach)} past the outer edge of the mat.`,
  };
}

/** An opening's top face line for the overlap test: the rings enclosing its true curve. */
export interface OverlapFace {
  readonly openingId: string;
  readonly rings: readonly Polygon[];
  readonly box: Box;
}

/**
 * Two openings overlap when the areas inside their top face lines (where
 * every opening's lines are largest) share any area, or their lines touch
 * within `OVERLAP_TOUCH_IN`. The rings enclose the true curves, so any two
 * true areas that meet are found; the finding is marked at the box of what
 * they share.
 */
export function overlapFinding(a: OverlapFace, b: OverlapFace, words: FindingWords): Finding | null {
  if (!boxesOverlap(boxExpand(a.box, OVERLAP_TOUCH_IN), b.box)) return null;
  const common = polygonIntersection(a.rings, b.rings);
  const area = polygonsArea(common);
  let at: Box | null = area > 0 ? polygonsBounds(common) : null;
  if (!at) {
    const window = boxIntersection(boxExpand(a.box, OVERLAP_TOUCH_IN), boxExpand(b.box, OVERLAP_TOUCH_IN));
    const nearest = window ? ringsNearestPair(a.rings, b.rings, window) : null;
    if (!nearest || nearest.distance > OVERLAP_TOUCH_IN) return null;
    at = { x: nearest.middle.x, y: nearest.middle.y, w: 0, h: 0 };
  }
  const depth = Math.min(at.w, at.h);
  return {
    code: 'openings-overlap', severity: 'error', at, measured: -depth, required: 0, openingIds: [a.openingId, b.openingId], matIndex: 0,
    message: `${capitalised(words.opening(a.openingId))} and ${words.opening(b.openingId)} ${area > 0 ? 'overlap' : 'touch'}, leaving no board between them. Move them apart.`,
  };
}

export function pieceFinding(opening: Opening, settings: CheckSettings, words: FindingWords): Finding | null {
  if (!opening.pieceSize || opening.shape.kind === 'outline') return null;
  const halfW = opening.pieceSize.width / 2;
  const halfH = opening.pieceSize.height / 2;
  const sight: Polygon = shapePolygon(opening.shape);
  const at = boxExpand({ x: opening.center.x, y: opening.center.y, w: 0, h: 0 }, Math.max(halfW, halfH));
  const ids = [opening.id];
  const name = words.opening(opening.id);
  if (opening.clearance >= 0) {
    const corners = [{ x: -halfW, y: -halfH }, { x: halfW, y: -halfH }, { x: halfW, y: halfH }, { x: -halfW, y: halfH }];
    if (corners.every((c) => polygonContainsPoint(sight, c))) return null;
    return {
      code: 'piece-larger-than-opening', severity: 'warning', at, measured: null, required: null, openingIds: ids,
      message: `The piece in ${name} is larger than the opening, so the mat will cover part of it although a gap was asked for.`,
    };
  }
  const overlap = numbersMin(sight.map((p) => Math.min(halfW - Math.abs(p.x), halfH - Math.abs(p.y))));
  if (overlap < -EPSILON_IN) {
    return {
      code: 'piece-not-covered', severity: 'error', at, measured: overlap, required: settings.minimumOverlap, openingIds: ids,
      message: `${capitalised(name)} is larger than its piece by ${words.length(-overlap)}, so the mat cannot hold the piece's edge. Make the opening smaller than the piece.`,
    };
  }
  if (overlap >= settings.minimumOverlap - EPSILON_IN) return null;
  return {
    code: 'overlap-small', severity: 'warning', at, measured: overlap, required: settings.minimumOverlap, openingIds: ids,
    message: `The mat overlaps the piece in ${name} by only ${words.length(overlap)}; at least ${words.length(settings.minimumOverlap)} holds it securely.`,
  };
}

export function sizeFindings(layout: Layout, words: FindingWords): Finding[] {
  const { outer, frameRabbet, checkSettings } = layout;
  const at: Box = { x: 0, y: 0, w: outer.width, h: outer.height };
  const size = (w: number, h: number) => `${words.length(w)} x ${words.length(h)}`;
  const findings: Finding[] = [];
  layout.mats.forEach((mat, matIndex) => {
    const fits = (outer.width <= mat.sheet.width + EPSILON_IN && outer.height <= mat.sheet.height + EPSILON_IN) ||
      (outer.width <= mat.sheet.height + EPSILON_IN && outer.height <= mat.sheet.width + EPSILON_IN);
    if (fits) return;
    findings.push({
      code: 'layout-larger-than-sheet', severity: 'error', at, measured: Math.max(outer.width, outer.height), required: Math.max(mat.sheet.width, mat.sheet.height), matIndex,
      message: `The layout (${size(outer.width, outer.height)}) does not fit the ${size(mat.sheet.width, mat.sheet.height)} sheet of ${matWords(matIndex)} "${mat.name}".`,
    });
  });
  if (frameRabbet) {
    const maxW = frameRabbet.width - checkSettings.rabbetAllowance;
    const maxH = frameRabbet.height - checkSettings.rabbetAllowance;
    const excess = Math.max(outer.width - maxW, outer.height - maxH);
    if (excess > EPSILON_IN) {
      findings.push({
        code: 'layout-larger-than-rabbet', severity: 'error', at, measured: excess, required: 0,
        message: `The mats are ${words.length(excess)} too large for the frame: cut them at most ${size(maxW, maxH)}, the rabbet less ${words.length(checkSettings.rabbetAllowance)}.`,
      });
    }
  }
  return findings;
}
