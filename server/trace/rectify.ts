import {
  homographyApply,
  homographyCompose,
  homographyFromQuads,
  homographyInvert,
  homographyScale,
  orientedSize,
  polygonBounds,
  quadInReadingOrder,
  quadProblem,
  type Homography,
  type Quad,
} from '../../geometry';
import { CALIBRATION_MAX_IN, type Calibration } from '../../features/trace/schema';
import { TraceInputError, type RgbRaster } from './raster';

/** The photo squared onto the garment's plane: `pxPerIn` pixels per inch, its top-left at `originIn` in plane inches. */
export interface PlaneImage {
  raster: RgbRaster;
  /** 1 where the pixel came from inside the photo, 0 where the plane runs past its edges. */
  inside: Uint8Array;
  pxPerIn: number;
  originIn: { x: number; y: number };
  /** The known rectangle in plane inches, or null for a two-point calibration. */
  rectangle: { x: number; y: number; width: number; height: number } | null;
}

const quadWords: Record<string, string> = {
  'not-finite': 'The rectangle needs four corner marks.',
  'too-small': 'The corner marks are too close together; mark the corners of a larger rectangle.',
  collinear: 'Three of the corner marks lie on one line; drag each mark onto its own corner of the rectangle.',
  crossing: 'The corner marks cross over; go round the rectangle in order (top left, top right, bottom right, bottom left).',
  'not-convex': 'The corner marks do not form a rectangle seen from above; drag each onto a corner of the rectangle.',
};

/** A box on the plane in inches. */
export interface PlaneRegion {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/** The transform from upright photo pixels to plane inches, and the rectangle it was fixed by. */
export function photoToPlane(calibration: Calibration): { transform: Homography; rectangle: PlaneImage['rectangle']; pxPerInAtRectangle: number } {
  if (calibration.kind === 'twoPoints') {
    const px = Math.hypot(calibration.to.x - calibration.from.x, calibration.to.y - calibration.from.y);
    if (!(px >= 2)) throw new TraceInputError('bad_calibration', 'The two calibration points are on top of each other; place them at the two ends of the distance you typed.');
    return { transform: homographyScale(calibration.distanceIn / px), rectangle: null, pxPerInAtRectangle: px / calibration.distanceIn };
  }
  const problem = quadProblem(calibration.corners);
  if (problem) throw new TraceInputError('bad_calibration', quadWords[problem]!);
  const corners = quadInReadingOrder(calibration.corners as unknown as Quad);
  const size = orientedSize(corners, calibration.widthIn, calibration.heightIn);
  const target: Quad = [{ x: 0, y: 0 }, { x: size.widthIn, y: 0 }, { x: size.widthIn, y: size.heightIn }, { x: 0, y: size.heightIn }];
  const transform = homographyFromQuads(corners, target);
  if (!transform) throw new TraceInputError('bad_calibration', quadWords.collinear!);
  const perimeterPx = corners.reduce((s, p, i) => s + Math.hypot(corners[(i + 1) % 4]!.x - p.x, corners[(i + 1) % 4]!.y - p.y), 0);
  return { transform, rectangle: { x: 0, y: 0, width: size.widthIn, height: size.heightIn }, pxPerInAtRectangle: perimeterPx / (2 * (size.widthIn + size.heightIn)) };
}

/** The part of the plane the photo shows, kept within CALIBRATION_MAX_IN around the rectangle when the photo reaches towards the horizon. */
function planeExtent(transform: Homography, width: number, height: number, centre: { x: number; y: number }): PlaneRegion {
  const half = CALIBRATION_MAX_IN / 2;
  const limit = { x0: centre.x - half, y0: centre.y - half, x1: centre.x + half, y1: centre.y + half };
  const corners = [{ x: 0, y: 0 }, { x: width, y: 0 }, { x: width, y: height }, { x: 0, y: height }];
  const behind = corners.some((p) => transform[6] * p.x + transform[7] * p.y + transform[8] <= 1e-9 * Math.abs(transform[8]));
  if (behind) return limit;
  const seen = polygonBounds(corners.map((p) => homographyApply(transform, p)));
  return {
    x0: Math.max(limit.x0, seen.x),
    y0: Math.max(limit.y0, seen.y),
    x1: Math.min(limit.x1, seen.x + seen.w),
    y1: Math.min(limit.y1, seen.y + seen.h),
  };
}

/**
 * Resamples the working photo onto the plane, bilinear, at most `maxSide`
 * pixels on the long side and never finer than the photo's own detail at
 * the rectangle. Each row walks the inverse transform's numerators and
 * denominator by constant steps, so the loop does one division per pixel.
 */
export function rectifyPhoto(photo: RgbRaster, photoScale: number, calibration: Calibration, maxSide: number, region?: PlaneRegion): PlaneImage {
  const { transform, rectangle, pxPerInAtRectangle } = photoToPlane(calibration);
  const workToPlane = homographyCompose(transform, homographyScale(1 / photoScale));
  const centre = rectangle ? { x: rectangle.width / 2, y: rectangle.height / 2 } : homographyApply(workToPlane, { x: photo.width / 2, y: photo.height / 2 });
  const seen = planeExtent(workToPlane, photo.width, photo.height, centre);
  const extent = region
    ? { x0: Math.max(seen.x0, region.x0), y0: Math.max(seen.y0, region.y0), x1: Math.min(seen.x1, region.x1), y1: Math.min(seen.y1, region.y1) }
    : seen;
  const spanX = extent.x1 - extent.x0;
  const spanY = extent.y1 - extent.y0;
  if (!(spanX > 0.5 && spanY > 0.5)) throw new TraceInputError('bad_calibration', 'The calibration makes the photo smaller than half an inch; check the size you typed.');
  const pxPerIn = Math.min(maxSide / spanX, maxSide / spanY, pxPerInAtRectangle * photoScale);
  const width = Math.max(1, Math.round(spanX * pxPerIn));
  const height = Math.max(1, Math.round(spanY * pxPerIn));
  const planeToWork = homographyInvert(workToPlane);
  if (!planeToWork) throw new TraceInputError('bad_calibration', quadWords.collinear!);
  const outputToWork = homographyCompose(planeToWork, [1 / pxPerIn, 0, extent.x0 + 0.5 / pxPerIn, 0, 1 / pxPerIn, extent.y0 + 0.5 / pxPerIn, 0, 0, 1]);
  const data = new Uint8Array(width * height * 3);
  const inside = new Uint8Array(width * height);
  sampleBilinear(photo, outputToWork, width, height, data, inside);
  return { raster: { width, height, data }, inside, pxPerIn, originIn: { x: extent.x0, y: extent.y0 }, rectangle };
}

function sampleBilinear(photo: RgbRaster, h: Homography, width: number, height: number, out: Uint8Array, inside: Uint8Array): void {
  const src = photo.data;
  const sw = photo.width;
  const maxX = photo.width - 1;
  const maxY = photo.height - 1;
  for (let v = 0; v < height; v++) {
    let nx = h[1] * v + h[2];
    let ny = h[4] * v + h[5];
    let nw = h[7] * v + h[8];
    for (let u = 0; u < width; u++, nx += h[0], ny += h[3], nw += h[6]) {
      const x = nx / nw - 0.5;
      const y = ny / nw - 0.5;
      if (!(x >= 0 && y >= 0 && x <= maxX && y <= maxY)) continue;
      const x0 = x | 0;
      const y0 = y | 0;
      const fx = x - x0;
      const fy = y - y0;
      const x1 = x0 < maxX ? x0 + 1 : x0;
      const y1 = y0 < maxY ? y0 + 1 : y0;
      const a = (y0 * sw + x0) * 3;
      const b = (y0 * sw + x1) * 3;
      const c = (y1 * sw + x0) * 3;
      const d = (y1 * sw + x1) * 3;
      const o = (v * width + u) * 3;
      for (let k = 0; k < 3; k++) {
        const top = src[a + k]! + (src[b + k]! - src[a + k]!) * fx;
        const bottom = src[c + k]! + (src[d + k]! - src[c + k]!) * fx;
        out[o + k] = top + (bottom - top) * fy + 0.5;
      }
      inside[v * width + u] = 1;
    }
  }
}
