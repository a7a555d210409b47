import paper from 'paper';
import { polygonSimplify, polygonWithWinding, type BoardPoint } from '../../geometry';
import { MAX_OUTLINE_POINTS } from '../../features/trace/schema';

/** After smoothing, points are thinned while the outline stays within this of the smoothed curve. */
export const SIMPLIFY_TOLERANCE_IN = 0.005;
/** Curves fitted through the traced points stray at most this far from them. */
export const SMOOTH_TOLERANCE_IN = 0.02;
/** The smoothed curves are turned back into points no further than this from the curve. */
export const FLATTEN_TOLERANCE_IN = 0.005;
/** Traced points are respaced this far apart before fitting: dense enough for the fit's tangents, a fraction of the work of every pixel step. */
export const FIT_SPACING_IN = 0.04;
/** A turn sharper than this between two straight runs is a corner of the garment (a sleeve's tip, the collar notch) and stays one. */
export const CORNER_TURN_DEG = 35;

let paperReady = false;
function ensurePaper(): void {
  if (paperReady) return;
  paper.setup(new paper.Size(1, 1));
  paperReady = true;
}

function denser(a: BoardPoint, b: BoardPoint, spacing: number, out: BoardPoint[]): void {
  const steps = Math.max(1, Math.round(Math.hypot(b.x - a.x, b.y - a.y) / spacing));
  for (let k = 0; k < steps; k++) out.push({ x: a.x + ((b.x - a.x) * k) / steps, y: a.y + ((b.y - a.y) * k) / steps });
}

/** Indexes of the thinned ring's points where it turns sharply between two sides at least `minSide` long. */
function cornerIndexes(thin: readonly BoardPoint[], minSide: number): number[] {
  const cosLimit = Math.cos((CORNER_TURN_DEG * Math.PI) / 180);
  const found: number[] = [];
  thin.forEach((p, i) => {
    const a = thin[(i + thin.length - 1) % thin.length]!;
    const b = thin[(i + 1) % thin.length]!;
    const la = Math.hypot(p.x - a.x, p.y - a.y);
    const lb = Math.hypot(b.x - p.x, b.y - p.y);
    if (la < minSide || lb < minSide) return;
    if (((p.x - a.x) * (b.x - p.x) + (p.y - a.y) * (b.y - p.y)) / (la * lb) < cosLimit) found.push(i);
  });
  return found;
}

/** Fits paper's cubic curves through the points (open or closed) and flattens them back to points. */
function fitted(points: BoardPoint[], closed: boolean, pxPerIn: number): BoardPoint[] {
  const path = new paper.Path({ segments: points.map((p) => [p.x, p.y]), closed, insert: false });
  // paper compares its fitting error with squared distances.
  path.simplify((SMOOTH_TOLERANCE_IN * pxPerIn) ** 2);
  path.flatten(FLATTEN_TOLERANCE_IN * pxPerIn);
  return path.segments.map((s) => ({ x: s.point.x, y: s.point.y }));
}

/**
 * From a traced ring in plane pixels to an outline in inches. The ring is
 * thinned within half a pixel (dropping the stair steps of pixels), split at
 * its sharp corners, and each stretch between corners is respaced and fitted
 * with paper's cubic curves, so edges come out smooth while a sleeve's tip
 * or the collar notch stays sharp. The result is flattened, thinned with
 * Ramer-Douglas-Peucker, scaled to inches and moved so `offsetIn` is the
 * origin. Outer rings run clockwise on screen.
 */
export function smoothOutline(ring: readonly BoardPoint[], pxPerIn: number, offsetIn: BoardPoint): BoardPoint[] {
  ensurePaper();
  const spacing = FIT_SPACING_IN * pxPerIn;
  const thin = polygonSimplify(ring, 0.5);
  const corners = cornerIndexes(thin, 2);
  const smooth: BoardPoint[] = [];
  if (corners.length === 0) {
    const dense: BoardPoint[] = [];
    thin.forEach((a, i) => denser(a, thin[(i + 1) % thin.length]!, spacing, dense));
    smooth.push(...fitted(dense, true, pxPerIn));
  } else {
    corners.forEach((start, k) => {
      const end = corners[(k + 1) % corners.length]!;
      const stretch: BoardPoint[] = [];
      for (let i = start; i !== end; i = (i + 1) % thin.length) denser(thin[i]!, thin[(i + 1) % thin.length]!, spacing, stretch);
      stretch.push(thin[end]!);
      smooth.push(...fitted(stretch, false, pxPerIn).slice(0, -1));
    });
  }
  let tolerance = SIMPLIFY_TOLERANCE_IN * pxPerIn;
  let points = polygonSimplify(smooth, tolerance);
  while (points.length > MAX_OUTLINE_POINTS) points = polygonSimplify(smooth, (tolerance *= 2));
  return [...polygonWithWinding(points.map((p) => ({ x: p.x / pxPerIn - offsetIn.x, y: p.y / pxPerIn - offsetIn.y })), 'clockwise')];
}
