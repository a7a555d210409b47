import type { BoardPoint, Box, Opening } from '../../geometry';
import { polygonBounds } from '../../geometry/polygon';
import { shapePolygon } from '../../geometry/shapes';
import { pointRotate } from '../../geometry/transform2d';
import { roundToStep } from '../../geometry/units';

/**
 * Sizes and resize handles of an opening's shape in its own frame (centred,
 * unturned). The same handle positions serve the canvas and the editor.
 */

export type Shape = Opening['shape'];
export type HandleName = 'nw' | 'n' | 'ne' | 'e' | 'se' | 's' | 'sw' | 'w';

/** Unit direction of each handle from the centre in the opening's own frame. */
const HANDLE_DIRECTIONS: Record<HandleName, { ux: -1 | 0 | 1; uy: -1 | 0 | 1 }> = {
  nw: { ux: -1, uy: -1 }, n: { ux: 0, uy: -1 }, ne: { ux: 1, uy: -1 }, e: { ux: 1, uy: 0 },
  se: { ux: 1, uy: 1 }, s: { ux: 0, uy: 1 }, sw: { ux: -1, uy: 1 }, w: { ux: -1, uy: 0 },
};

export const HANDLE_NAMES = Object.keys(HANDLE_DIRECTIONS) as HandleName[];

/** Bounds of the shape in its own frame. */
export function shapeLocalBox(shape: Shape): Box {
  switch (shape.kind) {
    case 'rectangle': case 'roundedRectangle': case 'oval':
      return { x: -shape.width / 2, y: -shape.height / 2, w: shape.width, h: shape.height };
    case 'circle':
      return { x: -shape.radius, y: -shape.radius, w: 2 * shape.radius, h: 2 * shape.radius };
    default:
      return polygonBounds(shapePolygon(shape));
  }
}

/** Traced outlines keep the garment's true size; their opening grows with the clearance instead. */
export function shapeResizable(shape: Shape): boolean {
  return shape.kind !== 'outline';
}

/** Handle positions on the board for the opening's current shape, placement and turn. */
export function openingHandles(opening: Opening): { name: HandleName; at: BoardPoint }[] {
  if (!shapeResizable(opening.shape)) return [];
  const box = shapeLocalBox(opening.shape);
  const cx = box.x + box.w / 2;
  const cy = box.y + box.h / 2;
  return HANDLE_NAMES.filter((name) => isCornerOnly(opening.shape) ? name.length === 2 : true).map((name) => {
    const { ux, uy } = HANDLE_DIRECTIONS[name];
    const local = { x: cx + (ux * box.w) / 2, y: cy + (uy * box.h) / 2 };
    const turned = pointRotate(local, { x: 0, y: 0 }, opening.rotation);
    return { name, at: { x: opening.center.x + turned.x, y: opening.center.y + turned.y } };
  });
}

/** Round shapes keep their proportions, so only the corners resize them. */
function isCornerOnly(shape: Shape): boolean {
  return shape.kind === 'circle' || shape.kind === 'regularPolygon';
}

/** Stretches points about their box centre, which stays where it was. */
function scaledPoints(points: readonly BoardPoint[], sx: number, sy: number, box: Box): BoardPoint[] {
  const cx = box.x + box.w / 2;
  const cy = box.y + box.h / 2;
  return points.map((p) => ({ x: cx + (p.x - cx) * sx, y: cy + (p.y - cy) * sy }));
}

/**
 * The opening after dragging `handle` to `point` (board inches): the opposite
 * side stays put, the new size lands on the rounding step and never goes
 * below one step.
 */
export function openingResized(opening: Opening, handle: HandleName, point: BoardPoint, step: number): Opening {
  const { shape } = opening;
  if (!shapeResizable(shape)) return opening;
  const local = pointRotate({ x: point.x - opening.center.x, y: point.y - opening.center.y }, { x: 0, y: 0 }, -opening.rotation);
  const box = shapeLocalBox(shape);
  const { ux, uy } = HANDLE_DIRECTIONS[handle];
  if (isCornerOnly(shape)) {
    const across = Math.max(step, roundToStep(2 * Math.max(Math.abs(local.x), Math.abs(local.y)), step));
    const ratio = across / Math.max(box.w, box.h);
    if (shape.kind === 'circle') return { ...opening, shape: { kind: 'circle', radius: across / 2 } };
    if (shape.kind === 'regularPolygon') return { ...opening, shape: { ...shape, radius: shape.radius * ratio } };
  }
  const sideOf = (u: number, value: number, low: number, size: number) => {
    if (u === 0) return { size, shift: 0 };
    const anchor = u > 0 ? low : low + size;
    const next = Math.max(step, roundToStep(Math.abs(value - anchor), step));
    return { size: next, shift: (u * (next - size)) / 2 };
  };
  const across = sideOf(ux, local.x, box.x, box.w);
  const down = sideOf(uy, local.y, box.y, box.h);
  const moved = pointRotate({ x: across.shift, y: down.shift }, { x: 0, y: 0 }, opening.rotation);
  const center = { x: opening.center.x + moved.x, y: opening.center.y + moved.y };
  return { ...opening, center, shape: shapeWithSize(shape, across.size, down.size, box) };
}

/** The shape stretched to `width` x `height` (its own frame). */
export function shapeWithSize(shape: Shape, width: number, height: number, box: Box = shapeLocalBox(shape)): Shape {
  switch (shape.kind) {
    case 'rectangle': case 'oval': return { ...shape, width, height };
    case 'roundedRectangle': return { ...shape, width, height, cornerRadius: Math.min(shape.cornerRadius, width / 2, height / 2) };
    case 'circle': return { kind: 'circle', radius: Math.min(width, height) / 2 };
    case 'regularPolygon': return { ...shape, radius: (shape.radius * Math.min(width, height)) / Math.max(box.w, box.h) };
    case 'polygon': case 'outline':
      return { ...shape, points: scaledPoints(shape.points, width / box.w, height / box.h, box) };
  }
}
