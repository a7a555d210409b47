import type { BoardPoint, Box, Polygon } from '../../geometry';

/**
 * Board inches to screen pixels, in one place. The canvas draws in board
 * inches inside one group transformed by `viewGroupTransform`, so panning
 * and zooming never rebuild a path; pointer events come back through
 * `screenToBoard`.
 */

/** A point on the canvas in CSS pixels from its top-left corner. */
export interface ScreenPoint {
  readonly sx: number;
  readonly sy: number;
}

export interface ViewTransform {
  /** Pixels per inch. */
  readonly scale: number;
  /** Screen position of the board's origin (top-left of the outer edge). */
  readonly originX: number;
  readonly originY: number;
}

export interface Viewport {
  readonly width: number;
  readonly height: number;
}

/** Closer than a 1/64 in per pixel is beyond anything a blade can hold; further than a whole sheet per finger is useless. */
export const MIN_SCALE = 2;
export const MAX_SCALE = 400;

const FIT_MARGIN_PX = 16;

export function boardToScreen(view: ViewTransform, p: BoardPoint): ScreenPoint {
  return { sx: view.originX + p.x * view.scale, sy: view.originY + p.y * view.scale };
}

export function screenToBoard(view: ViewTransform, s: ScreenPoint): BoardPoint {
  return { x: (s.sx - view.originX) / view.scale, y: (s.sy - view.originY) / view.scale };
}

/** A screen distance in inches at the current zoom, e.g. how far a finger may miss a handle. */
export function screenLengthInches(view: ViewTransform, pixels: number): number {
  return pixels / view.scale;
}

/** The transform that shows `box` whole and centred in the viewport. */
export function viewFitting(box: Box, viewport: Viewport, margin = FIT_MARGIN_PX): ViewTransform {
  const usableW = Math.max(1, viewport.width - 2 * margin);
  const usableH = Math.max(1, viewport.height - 2 * margin);
  const scale = clampScale(Math.min(usableW / Math.max(box.w, 1e-3), usableH / Math.max(box.h, 1e-3)));
  return {
    scale,
    originX: viewport.width / 2 - (box.x + box.w / 2) * scale,
    originY: viewport.height / 2 - (box.y + box.h / 2) * scale,
  };
}

function clampScale(scale: number): number {
  return Math.min(MAX_SCALE, Math.max(MIN_SCALE, scale));
}

/** Zooms by `factor` keeping the board point under `about` where it is on screen. */
export function viewZoomed(view: ViewTransform, factor: number, about: ScreenPoint): ViewTransform {
  const scale = clampScale(view.scale * factor);
  const board = screenToBoard(view, about);
  return { scale, originX: about.sx - board.x * scale, originY: about.sy - board.y * scale };
}

export function viewPanned(view: ViewTransform, dx: number, dy: number): ViewTransform {
  return { ...view, originX: view.originX + dx, originY: view.originY + dy };
}

/** The SVG transform of the group that holds everything drawn in board inches. */
export function viewGroupTransform(view: ViewTransform): string {
  return `translate(${view.originX} ${view.originY}) scale(${view.scale})`;
}

function ringPath(ring: Polygon): string {
  if (ring.length === 0) return '';
  let d = `M${ring[0]!.x.toFixed(4)} ${ring[0]!.y.toFixed(4)}`;
  for (let i = 1; i < ring.length; i++) d += `L${ring[i]!.x.toFixed(4)} ${ring[i]!.y.toFixed(4)}`;
  return `${d}Z`;
}

// Path strings of unchanged lines are reused between frames: the engine hands
// back the same polygon arrays for every opening that did not move.
const pathCache = new WeakMap<readonly Polygon[], string>();

/** SVG path data, in board inches, for a set of rings. */
export function polygonsPath(polygons: readonly Polygon[]): string {
  let d = pathCache.get(polygons);
  if (d === undefined) {
    d = polygons.map(ringPath).join('');
    pathCache.set(polygons, d);
  }
  return d;
}

export function boxPath(box: Box): string {
  return `M${box.x} ${box.y}H${box.x + box.w}V${box.y + box.h}H${box.x}Z`;
}
