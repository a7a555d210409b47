import sharp from 'sharp';
import { homographyApply, polygonArea, polygonBounds, type BoardPoint } from '../../geometry';
import type { Calibration, TraceResult } from '../../features/trace/schema';
import { decodeForTrace, type WorkingPhoto } from './decodePhoto';
import { garmentRing } from './garmentRing';
import { TraceInputError, type TraceProgress } from './raster';
import { photoToPlane, rectifyPhoto, type PlaneImage, type PlaneRegion } from './rectify';
import { separateGarment } from './separate';
import { smoothOutline } from './smoothOutline';

/** The photo is shrunk to this long side before anything else: ample detail for 1/16 in on a garment. */
export const DECODE_LONG_SIDE_PX = 2000;
/** The first look at the squared photo, to find where the garment lies, is this many pixels on its long side. */
export const OVERVIEW_SIDE_PX = 800;
/** The squared photo round the garment is at most this many pixels on its long side. */
export const PLANE_MAX_SIDE_PX = 2000;
/** Room left round the garment in the kept photo. */
export const CROP_MARGIN_IN = 1;

export interface TraceInput {
  photo: Buffer;
  calibration: Calibration;
  background?: { x: number; y: number } | null;
  box?: { x: number; y: number; width: number; height: number } | null;
}

export interface TraceOutput {
  result: TraceResult;
  /** The squared photo cropped round the garment, JPEG, at `result.imageWidthIn` by `result.imageHeightIn`. */
  image: Buffer;
  pxPerIn: number;
  /** Where the kept photo's top-left lies in the plane of the calibration (inches from the rectangle's first corner). */
  originIn: BoardPoint;
}

/** Where a point of the upright photo falls in the squared image's pixels. */
function photoPointToPlanePx(calibration: Calibration, plane: PlaneImage, p: BoardPoint): BoardPoint {
  const q = homographyApply(photoToPlane(calibration).transform, p);
  return { x: (q.x - plane.originIn.x) * plane.pxPerIn, y: (q.y - plane.originIn.y) * plane.pxPerIn };
}

function colourAround(plane: PlaneImage, at: BoardPoint): number[] | null {
  const { width, height, data } = plane.raster;
  const sums = [0, 0, 0];
  let n = 0;
  for (let y = Math.round(at.y) - 2; y <= Math.round(at.y) + 2; y++) {
    for (let x = Math.round(at.x) - 2; x <= Math.round(at.x) + 2; x++) {
      if (x < 0 || y < 0 || x >= width || y >= height || !plane.inside[y * width + x]) continue;
      for (let k = 0; k < 3; k++) sums[k]! += data[(y * width + x) * 3 + k]!;
      n++;
    }
  }
  return n > 0 ? sums.map((s) => s / n) : null;
}

/** Pixels outside the framer's rough box are treated as photo edge: nothing there can be garment. */
function keepInsideBox(plane: PlaneImage, calibration: Calibration, box: NonNullable<TraceInput['box']>): void {
  const corners = [
    { x: box.x, y: box.y },
    { x: box.x + box.width, y: box.y },
    { x: box.x + box.width, y: box.y + box.height },
    { x: box.x, y: box.y + box.height },
  ].map((p) => photoPointToPlanePx(calibration, plane, p));
  const b = polygonBounds(corners);
  const { width, height } = plane.raster;
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) if (x < b.x || y < b.y || x > b.x + b.w || y > b.y + b.h) plane.inside[y * width + x] = 0;
  }
}

/** Squares (part of) the photo, limits it to the framer's box, and finds the garment's ring in it. */
function findGarment(working: WorkingPhoto, input: TraceInput, maxSide: number, region?: PlaneRegion): { plane: PlaneImage; ring: BoardPoint[] } {
  const plane = rectifyPhoto(working.raster, working.scale, input.calibration, maxSide, region);
  const tapped = input.background ? colourAround(plane, photoPointToPlanePx(input.calibration, plane, input.background)) : null;
  if (input.box) keepInsideBox(plane, input.calibration, input.box);
  return { plane, ring: garmentRing(plane, separateGarment(plane, tapped)) };
}

/** The ring's box in plane inches, grown by the crop margin. */
function garmentRegion(plane: PlaneImage, ring: BoardPoint[]): PlaneRegion {
  const box = polygonBounds(ring);
  const k = 1 / plane.pxPerIn;
  return {
    x0: plane.originIn.x + box.x * k - CROP_MARGIN_IN,
    y0: plane.originIn.y + box.y * k - CROP_MARGIN_IN,
    x1: plane.originIn.x + (box.x + box.w) * k + CROP_MARGIN_IN,
    y1: plane.originIn.y + (box.y + box.h) * k + CROP_MARGIN_IN,
  };
}

/**
 * Traces a garment end to end: decode and shrink, square the photo to the
 * rectangle (or scale it by two points), separate garment from board, take
 * its outer boundary, smooth it and express it in inches from the top-left
 * of the kept, cropped photo. A first look at low resolution finds where
 * the garment lies; only that part is squared again at full detail.
 */
export async function traceGarment(input: TraceInput, progress: TraceProgress = () => {}): Promise<TraceOutput> {
  progress('reading', 0.05);
  const working = await decodeForTrace(input.photo, DECODE_LONG_SIDE_PX);
  progress('rectifying', 0.3);
  const overview = findGarment(working, input, OVERVIEW_SIDE_PX);
  progress('separating', 0.5);
  const { plane, ring } = findGarment(working, input, PLANE_MAX_SIDE_PX, garmentRegion(overview.plane, overview.ring));
  progress('outlining', 0.75);
  const points = smoothOutline(ring, plane.pxPerIn, { x: 0, y: 0 });
  if (points.length < 3) throw new TraceInputError('no_garment', 'The garment’s outline came out empty; try a photo with more contrast.');
  const image = await sharp(Buffer.from(plane.raster.data.buffer, plane.raster.data.byteOffset, plane.raster.data.byteLength), {
    raw: { width: plane.raster.width, height: plane.raster.height, channels: 3 },
  })
    .jpeg({ quality: 85 })
    .toBuffer();
  return {
    result: {
      points,
      imageWidthIn: plane.raster.width / plane.pxPerIn,
      imageHeightIn: plane.raster.height / plane.pxPerIn,
      areaSqIn: polygonArea(points),
    },
    image,
    pxPerIn: plane.pxPerIn,
    originIn: plane.originIn,
  };
}
