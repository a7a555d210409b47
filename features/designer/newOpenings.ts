import type { BoardPoint, Layout, Opening } from '../../geometry';
import { MAX_OUTLINE_POINTS } from '../../geometry/layoutSchema';
import { polygonBounds } from '../../geometry/polygon';
import { openingForPiece } from '../../geometry/sizing';
import type { Piece, PieceKind } from '../pieces/schema';

/** Opening shapes a framer can add from the tools, each with a plain name. */
export const newShapeKinds = ['rectangle', 'roundedRectangle', 'oval', 'circle', 'regularPolygon'] as const;
export type NewShapeKind = (typeof newShapeKinds)[number];

export const shapeLabels: Record<Opening['shape']['kind'], string> = {
  rectangle: 'Rectangle',
  roundedRectangle: 'Rounded rectangle',
  oval: 'Oval',
  circle: 'Circle',
  regularPolygon: 'Even-sided polygon',
  polygon: 'Free polygon',
  outline: 'Traced outline',
};

/** A fresh id such as "circle-3" that no opening in the layout has yet. */
export function freshOpeningId(layout: Layout, base: string, taken: ReadonlySet<string> = new Set()): string {
  const used = new Set([...layout.openings.map((o) => o.id), ...taken]);
  let n = 1;
  while (used.has(`${base}-${n}`)) n++;
  return `${base}-${n}`;
}

function defaultShape(kind: NewShapeKind): Opening['shape'] {
  switch (kind) {
    case 'rectangle': return { kind, width: 8, height: 10 };
    case 'roundedRectangle': return { kind, width: 8, height: 10, cornerRadius: 1 };
    case 'oval': return { kind, width: 8, height: 10 };
    case 'circle': return { kind, radius: 2 };
    case 'regularPolygon': return { kind, sides: 6, radius: 2.5 };
  }
}

function centre(layout: Layout): BoardPoint {
  return { x: layout.outer.width / 2, y: layout.outer.height / 2 };
}

/** An opening of a plain shape in the middle of the layout, cut in the top mat. */
export function newOpening(layout: Layout, kind: NewShapeKind): Opening {
  return { id: freshOpeningId(layout, kind), shape: defaultShape(kind), center: centre(layout), rotation: 0, depth: 1, clearance: 0, reveals: [] };
}

/**
 * Common practice for how an opening meets each kind of piece: the mat
 * overlaps a photo by 1/4 in and a patch, plaque or card by 1/8 in, and
 * leaves 1/4 in of room around a garment.
 */
export const pieceClearance: Record<PieceKind, number> = {
  photo: -0.25,
  patch: -0.125,
  plaque: -0.125,
  card: -0.125,
  other: -0.125,
  garment: 0.25,
};

/** A garment's saved outline as opening points, centred on the outline's box like a pasted outline. */
function centredOutline(outline: NonNullable<Piece['outline']>): BoardPoint[] {
  const box = polygonBounds(outline.points);
  return outline.points.map((p) => ({ x: p.x - box.x - box.w / 2, y: p.y - box.y - box.h / 2 }));
}

/**
 * An opening sized for one of the job's pieces; a photo or a garment goes
 * through two mats where there are two. A garment with a saved outline gets
 * an opening that follows the outline at the garment's clearance.
 */
export function openingForPieceOf(layout: Layout, piece: Pick<Piece, 'id' | 'kind' | 'label' | 'widthIn' | 'heightIn'> & { outline?: Piece['outline'] }, defaultReveal: number): Opening {
  const clearance = pieceClearance[piece.kind];
  if (piece.kind === 'garment' && piece.outline) {
    const traced = outlineOpening(layout, centredOutline(piece.outline), defaultReveal);
    return { ...traced, id: freshOpeningId(layout, 'garment'), pieceId: piece.id, pieceSize: { width: piece.widthIn, height: piece.heightIn }, clearance };
  }
  const pieceSize = { width: piece.widthIn, height: piece.heightIn };
  const sight = openingForPiece(pieceSize, -clearance);
  const round = piece.kind === 'patch' && Math.abs(sight.width - sight.height) < 1e-6;
  const shape: Opening['shape'] = round ? { kind: 'circle', radius: sight.width / 2 } : { kind: 'rectangle', width: sight.width, height: sight.height };
  const depth = piece.kind === 'photo' || piece.kind === 'garment' ? Math.min(2, layout.mats.length) : 1;
  return {
    id: freshOpeningId(layout, piece.kind),
    shape,
    center: centre(layout),
    rotation: 0,
    pieceId: piece.id,
    pieceSize,
    depth,
    clearance,
    reveals: Array.from({ length: depth - 1 }, () => defaultReveal),
  };
}

type OutlineRead = { ok: true; points: BoardPoint[] } | { ok: false; error: string };

function pointFrom(value: unknown): BoardPoint | null {
  if (Array.isArray(value) && value.length === 2) {
    const [x, y] = value as unknown[];
    return typeof x === 'number' && typeof y === 'number' && Number.isFinite(x) && Number.isFinite(y) ? { x, y } : null;
  }
  if (typeof value === 'object' && value !== null) {
    const { x, y } = value as { x?: unknown; y?: unknown };
    return typeof x === 'number' && typeof y === 'number' && Number.isFinite(x) && Number.isFinite(y) ? { x, y } : null;
  }
  return null;
}

/**
 * Reads a pasted outline: JSON of points in inches, either a list
 * (`[{"x":1,"y":2}, ...]` or `[[1,2], ...]`) or an object with a `points`
 * list. The points are moved so their box is centred on the opening.
 */
export function outlineFromText(text: string): OutlineRead {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    return { ok: false, error: 'The outline is not readable JSON; paste a list of points such as [{"x": 0, "y": 0}, ...].' };
  }
  const list = Array.isArray(data) ? data : typeof data === 'object' && data !== null ? (data as { points?: unknown }).points : undefined;
  if (!Array.isArray(list)) return { ok: false, error: 'No list of points was found; use a list, or an object with "points".' };
  if (list.length > MAX_OUTLINE_POINTS) return { ok: false, error: `An outline may have at most ${MAX_OUTLINE_POINTS} points; this one has ${list.length}. Trace it again more coarsely.` };
  const points: BoardPoint[] = [];
  for (const [i, value] of list.entries()) {
    const p = pointFrom(value);
    if (!p) return { ok: false, error: `Point ${i + 1} is not a pair of numbers (inches).` };
    points.push(p);
  }
  if (points.length < 3) return { ok: false, error: `An outline needs at least 3 points; this one has ${points.length}.` };
  const box = polygonBounds(points);
  if (box.w <= 0 || box.h <= 0) return { ok: false, error: 'The points lie on one line, so they enclose nothing.' };
  const cx = box.x + box.w / 2;
  const cy = box.y + box.h / 2;
  return { ok: true, points: points.map((p) => ({ x: p.x - cx, y: p.y - cy })) };
}

/** A traced-outline opening in the middle of the layout, with a little room around the garment. */
export function outlineOpening(layout: Layout, points: readonly BoardPoint[], defaultReveal: number): Opening {
  const depth = Math.min(2, layout.mats.length);
  return {
    id: freshOpeningId(layout, 'outline'),
    shape: { kind: 'outline', points: [...points] },
    center: centre(layout),
    rotation: 0,
    depth,
    clearance: pieceClearance.garment,
    reveals: Array.from({ length: depth - 1 }, () => defaultReveal),
  };
}
