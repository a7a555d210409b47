import { contours } from 'd3-contour';
import { otsuThreshold, polygonArea, quadFromRing, quadRefinedByLines, quadInReadingOrder, type BoardPoint, type Quad } from '../../geometry';
import { decodeForTrace } from './decodePhoto';
import { separateGarment } from './separate';

/** Corners are looked for on a copy this many pixels on its long side: a rectangle's corners need little detail. */
export const CORNER_SEARCH_SIDE_PX = 800;
/** A candidate must cover at least this share of the photo to count as the rectangle. */
const MIN_SHARE = 0.01;

/**
 * The four corners of the most prominent four-sided shape in the photo (a
 * sheet of paper, a mat sheet or the mounting board), in pixels of the
 * upright original, top-left first and clockwise; null when nothing in the
 * photo is four-sided. Everything that stands out from the board once its
 * uneven light is flattened (the same separation a trace uses) is a
 * candidate; shapes cut by the photo's edge are skipped.
 */
export async function proposeCorners(photo: Buffer): Promise<BoardPoint[] | null> {
  const working = await decodeForTrace(photo, CORNER_SEARCH_SIDE_PX);
  const { width, height } = working.raster;
  const plane = { raster: working.raster, inside: new Uint8Array(width * height).fill(1), pxPerIn: 1, originIn: { x: 0, y: 0 }, rectangle: null };
  const separation = separateGarment(plane, null);
  if (separation.threshold < 0) return null;
  // A white sheet differs from a beige board far less than a navy jersey does: also split the fainter class by its own Otsu level.
  const histogram = new Uint32Array(256);
  for (const v of separation.difference) histogram[v | 0]!++;
  const faint = otsuThreshold(histogram.subarray(0, separation.threshold + 1));
  const levels = [separation.threshold, ...(faint > 0 ? [faint] : [])];
  const regions = contours().size([width, height]).thresholds(levels.map((t) => t + 0.5))(separation.difference as unknown as number[]);
  let best: { quad: Quad; area: number; ring: BoardPoint[] } | null = null;
  for (const polygon of regions.flatMap((r) => r.coordinates)) {
    const ring = (polygon[0] ?? []).map(([x, y]) => ({ x: x!, y: y! }));
    if (ring.length < 8 || polygonArea(ring) < MIN_SHARE * width * height) continue;
    if (ring.some((p) => p.x <= 1 || p.y <= 1 || p.x >= width - 1 || p.y >= height - 1)) continue;
    const found = quadFromRing(ring);
    if (found && (!best || found.area > best.area)) best = { ...found, ring };
  }
  if (!best) return null;
  return quadInReadingOrder(quadRefinedByLines(best.ring, best.quad)).map((p) => ({ x: p.x / working.scale, y: p.y / working.scale }));
}
