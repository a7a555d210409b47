import { contours } from 'd3-contour';
import { polygonArea, polygonBounds, type BoardPoint, type Box } from '../../geometry';
import type { PlaneImage } from './rectify';
import { TraceInputError } from './raster';
import type { Separation } from './separate';

/** A separated garment smaller than this is a speck or a crease, not a garment. */
export const MIN_GARMENT_SQ_IN = 4;

const noGarment = () =>
  new TraceInputError(
    'no_garment',
    'No garment stands out from the board in this photo. Lay it on a plain board of a clearly different colour, tap the bare board to pick its colour, or draw a box round the garment.',
  );

function boxOverlapShare(a: Box, b: Box): number {
  const w = Math.min(a.x + a.w, b.x + b.w) - Math.max(a.x, b.x);
  const h = Math.min(a.y + a.h, b.y + b.h) - Math.max(a.y, b.y);
  if (w <= 0 || h <= 0) return 0;
  return (w * h) / Math.max(a.w * a.h, b.w * b.h);
}

/**
 * The garment's outer boundary in plane pixels (pixel i covers i..i+1). The
 * level line at Otsu's threshold runs through interpolated positions
 * between pixels, so the edge is placed finer than a pixel. Among the
 * separated regions it keeps the largest that is neither the known
 * rectangle itself (a sheet of paper beside the garment) nor a band along
 * the photo's edge; only the outer ring is kept, which fills holes such as
 * printed numbers and drops every speck.
 */
export function garmentRing(plane: PlaneImage, separation: Separation): BoardPoint[] {
  const { width, height } = plane.raster;
  if (separation.threshold < 0) throw noGarment();
  const level = separation.threshold + 0.5;
  const regions = contours().size([width, height]).thresholds([level])(separation.difference as unknown as number[]);
  const rectangleBox = plane.rectangle
    ? {
        x: (plane.rectangle.x - plane.originIn.x) * plane.pxPerIn,
        y: (plane.rectangle.y - plane.originIn.y) * plane.pxPerIn,
        w: plane.rectangle.width * plane.pxPerIn,
        h: plane.rectangle.height * plane.pxPerIn,
      }
    : null;
  const minArea = MIN_GARMENT_SQ_IN * plane.pxPerIn * plane.pxPerIn;
  const margin = 1.5;
  let best: { ring: BoardPoint[]; area: number } | null = null;
  for (const polygon of regions[0]?.coordinates ?? []) {
    const outer = polygon[0];
    if (!outer || outer.length < 4) continue;
    const ring = outer.map(([x, y]) => ({ x: x!, y: y! }));
    const area = polygonArea(ring);
    if (area < minArea || (best && area <= best.area)) continue;
    const box = polygonBounds(ring);
    if (rectangleBox && boxOverlapShare(box, rectangleBox) > 0.85) continue;
    const touchesEdge = box.x <= margin || box.y <= margin || box.x + box.w >= width - margin || box.y + box.h >= height - margin;
    if (touchesEdge && area > 0.5 * width * height) continue;
    best = { ring, area };
  }
  if (!best) throw noGarment();
  return best.ring;
}
