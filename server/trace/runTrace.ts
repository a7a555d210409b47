import sharp from 'sharp';
import { homographyApply, polygonArea, polygonBounds, type BoardPoint } from '../../geometry';
import type { Calibration, TraceResult } from '../../features/trace/schema';
import { decodeForTrace, type WorkingPhoto } from './decodePhoto';
import { garmentRing } from './garmentRing';
import { graphCutInBox, type GraphCutMask, type PixelBox } from './graphCut';
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

const NOTHING_IN_BOX =
  'No garment was found inside the box. Draw the box round the whole garment with a little bare board on every side, or lay the garment on a board of a more different colour.';

type PhotoBox = NonNullable<TraceInput['box']>;

/** The framer's box (upright photo pixels) seen on the plane: a quadrilateral there, so its bounds in plane inches. */
function boxOnPlane(calibration: Calibration, box: PhotoBox): PlaneRegion {
  const { transform } = photoToPlane(calibration);
  const b = polygonBounds(
    [
      { x: box.x, y: box.y },
      { x: box.x + box.width, y: box.y },
      { x: box.x + box.width, y: box.y + box.height },
      { x: box.x, y: box.y + box.height },
    ].map((p) => homographyApply(transform, p)),
  );
  return { x0: b.x, y0: b.y, x1: b.x + b.w, y1: b.y + b.h };
}

/** Squares (part of) the photo and finds the garment's ring in it by its difference from the board (Otsu's level). */
function findGarment(working: WorkingPhoto, input: TraceInput, maxSide: number, region?: PlaneRegion): { plane: PlaneImage; ring: BoardPoint[] } {
  const plane = rectifyPhoto(working.raster, working.scale, input.calibration, maxSide, region);
  const tapped = input.background ? colourAround(plane, photoPointToPlanePx(input.calibration, plane, input.background)) : null;
  return { plane, ring: garmentRing(plane, separateGarment(plane, tapped)) };
}

/**
 * Squares the part of the photo round the framer's box and separates the
 * garment inside it by a graph cut, for garments whose colour is too close
 * to the board's for one threshold. The cut runs on a shrunk copy; its
 * ring is scaled back to the squared photo's pixels.
 */
async function findGarmentInBox(working: WorkingPhoto, input: TraceInput, box: PhotoBox): Promise<{ plane: PlaneImage; ring: BoardPoint[] }> {
  const onPlane = boxOnPlane(input.calibration, box);
  const region = { x0: onPlane.x0 - CROP_MARGIN_IN, y0: onPlane.y0 - CROP_MARGIN_IN, x1: onPlane.x1 + CROP_MARGIN_IN, y1: onPlane.y1 + CROP_MARGIN_IN };
  const plane = rectifyPhoto(working.raster, working.scale, input.calibration, PLANE_MAX_SIDE_PX, region);
  const k = plane.pxPerIn;
  const boxPx = { x: (onPlane.x0 - plane.originIn.x) * k, y: (onPlane.y0 - plane.originIn.y) * k, w: (onPlane.x1 - onPlane.x0) * k, h: (onPlane.y1 - onPlane.y0) * k };
  const cut = await graphCutInBox(plane, boxPx);
  const tapped = input.background ? colourAround(plane, photoPointToPlanePx(input.calibration, plane, input.background)) : null;
  try {
    return { plane, ring: ringOfGraphCut(plane, cut, boxPx, tapped) };
  } catch (err) {
    if (err instanceof TraceInputError) throw new TraceInputError('no_garment', NOTHING_IN_BOX);
    throw err;
  }
}

/**
 * The graph cut decides which region is the garment. Where the garment
 * also stands clearly apart from the board's colour, Otsu's level inside
 * the box places its edge, finer than the shrunk grid and without the soft
 * shadow a graph cut takes in; otherwise the cut's own edge is used.
 */
function ringOfGraphCut(plane: PlaneImage, cut: GraphCutMask, boxPx: PixelBox, tapped: number[] | null): BoardPoint[] {
  const { width, height } = plane.raster;
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) if (x < boxPx.x || y < boxPx.y || x > boxPx.x + boxPx.w || y > boxPx.y + boxPx.h) plane.inside[y * width + x] = 0;
  }
  const separation = separateGarment(plane, tapped);
  if (separation.threshold < 0) {
    const shrunk: PlaneImage = { ...plane, raster: { width: cut.width, height: cut.height, data: new Uint8Array(0) }, inside: new Uint8Array(0), pxPerIn: plane.pxPerIn * cut.scale };
    return garmentRing(shrunk, { difference: Float32Array.from(cut.mask), threshold: 127 }).map((p) => ({ x: p.x / cut.scale, y: p.y / cut.scale }));
  }
  const near = dilateMask(cut, 2);
  for (let y = 0; y < height; y++) {
    const row = Math.min(cut.height - 1, Math.floor(y * cut.scale)) * cut.width;
    for (let x = 0; x < width; x++) if (!near[row + Math.min(cut.width - 1, Math.floor(x * cut.scale))]) separation.difference[y * width + x] = 0;
  }
  return garmentRing(plane, separation);
}

/** The cut's garment grown by `radius` shrunk pixels, so Otsu's edge is not clipped by the coarser grid. */
function dilateMask(cut: GraphCutMask, radius: number): Uint8Array {
  const { width, height, mask } = cut;
  const rows = new Uint8Array(mask.length);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      let on = 0;
      for (let d = -radius; d <= radius && !on; d++) on = mask[y * width + Math.min(width - 1, Math.max(0, x + d))]!;
      rows[y * width + x] = on;
    }
  }
  const out = new Uint8Array(mask.length);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      let on = 0;
      for (let d = -radius; d <= radius && !on; d++) on = rows[Math.min(height - 1, Math.max(0, y + d)) * width + x]!;
      out[y * width + x] = on;
    }
  }
  return out;
}

/** Without a box: a first look at low resolution finds the garment, then only that part is squared again at full detail. */
function findGarmentByContrast(working: WorkingPhoto, input: TraceInput, progress: TraceProgress): { plane: PlaneImage; ring: BoardPoint[] } {
  const overview = findGarment(working, input, OVERVIEW_SIDE_PX);
  progress('separating', 0.5);
  return findGarment(working, input, PLANE_MAX_SIDE_PX, garmentRegion(overview.plane, overview.ring));
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
 * of the kept, cropped photo. With a rough box from the framer the
 * garment is separated inside it by a graph cut; without one, by its
 * contrast with the board.
 */
export async function traceGarment(input: TraceInput, progress: TraceProgress = () => {}): Promise<TraceOutput> {
  progress('reading', 0.05);
  const working = await decodeForTrace(input.photo, DECODE_LONG_SIDE_PX);
  progress('rectifying', 0.3);
  if (input.box) progress('separating', 0.4);
  const { plane, ring } = input.box ? await findGarmentInBox(working, input, input.box) : findGarmentByContrast(working, input, progress);
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
