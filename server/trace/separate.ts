import { otsuThreshold } from '../../geometry';
import { fitLightField, flatField, lightRow, type LightField } from './lightField';
import type { PlaneImage } from './rectify';

/** How far a pixel's colour is from the board's, scaled so 1 level = 1/200 of the board's brightness. */
export const DIFFERENCE_SCALE = 200;

/**
 * Classes whose mean differences from the board lie closer than this (15 %
 * of the board's colour) are one board with noise on it, not a garment on
 * a board. Without this floor, Otsu's level splits the noise itself and the
 * boundary becomes a mesh of specks.
 */
export const MIN_CONTRAST_LEVELS = 30;

/** Mean level on each side of `t`. */
function classMeans(histogram: Uint32Array, t: number): [number, number] {
  let n0 = 0, s0 = 0, n1 = 0, s1 = 0;
  for (let i = 0; i < histogram.length; i++) {
    if (i <= t) { n0 += histogram[i]!; s0 += i * histogram[i]!; } else { n1 += histogram[i]!; s1 += i * histogram[i]!; }
  }
  return [n0 ? s0 / n0 : 0, n1 ? s1 / n1 : 0];
}

/** The garment's likeness at each pixel (0 = board colour, 255 = far from it) and the Otsu level between them. */
export interface Separation {
  difference: Float32Array;
  threshold: number;
}

/** Median of each channel over the pixels next to the edges of what the photo shows, where the bare board usually is. */
export function edgeColour(plane: PlaneImage): number[] {
  const { width, height, data } = plane.raster;
  const band = Math.max(2, Math.round(Math.min(width, height) * 0.03));
  const histograms = [new Uint32Array(256), new Uint32Array(256), new Uint32Array(256)];
  let count = 0;
  for (let y = 0; y < height; y += 2) {
    let first = -1;
    let last = -1;
    for (let x = 0; x < width; x++) if (plane.inside[y * width + x]) { if (first < 0) first = x; last = x; }
    if (first < 0) continue;
    for (let x = first; x <= last; x += 2) {
      if (x - first >= band && last - x >= band && y >= band && height - 1 - y >= band) continue;
      for (let k = 0; k < 3; k++) histograms[k]![data[(y * width + x) * 3 + k]!]!++;
      count++;
    }
  }
  return histograms.map((h) => {
    let seen = 0;
    for (let level = 0; level < 256; level++) if ((seen += h[level]!) * 2 >= count && count > 0) return level;
    return 128;
  });
}

function differenceFrom(plane: PlaneImage, field: LightField, out: Float32Array): Uint32Array {
  const { width, height, data } = plane.raster;
  const row = new Float64Array(9);
  const histogram = new Uint32Array(256);
  for (let y = 0; y < height; y++) {
    lightRow(field, y, height, row);
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      if (!plane.inside[i]) { out[i] = 0; continue; }
      const nx = (2 * x) / width - 1;
      const r = row[0]! + nx * (row[1]! + nx * row[2]!);
      const g = row[3]! + nx * (row[4]! + nx * row[5]!);
      const b = row[6]! + nx * (row[7]! + nx * row[8]!);
      const dr = data[i * 3]! / (r > 8 ? r : 8) - 1;
      const dg = data[i * 3 + 1]! / (g > 8 ? g : 8) - 1;
      const db = data[i * 3 + 2]! / (b > 8 ? b : 8) - 1;
      const d = Math.sqrt(dr * dr + dg * dg + db * db) * DIFFERENCE_SCALE;
      const level = d < 255 ? d : 255;
      out[i] = level;
      histogram[level | 0]!++;
    }
  }
  return histogram;
}

/**
 * Separates garment from board in two passes. First against one board
 * colour (the tapped one, or the median along the photo's edges); then the
 * board's light is fitted as a smooth surface over what the first pass
 * called board, and every pixel is compared with the board as lit at its
 * own place, which flattens a lamp's falloff before Otsu's threshold.
 */
export function separateGarment(plane: PlaneImage, tappedColour: readonly number[] | null): Separation {
  const difference = new Float32Array(plane.raster.width * plane.raster.height);
  let field = flatField(tappedColour ?? edgeColour(plane));
  let threshold = -1;
  for (let pass = 0; pass < 2; pass++) {
    const histogram = differenceFrom(plane, field, difference);
    threshold = otsuThreshold(histogram);
    if (threshold >= 0) {
      const [board, garment] = classMeans(histogram, threshold);
      if (garment - board < MIN_CONTRAST_LEVELS) threshold = -1;
    }
    if (pass === 1 || threshold < 0) break;
    const cut = threshold;
    const fitted = fitLightField(plane.raster, (i) => plane.inside[i] === 1 && difference[i]! <= cut);
    if (!fitted) break;
    field = fitted;
  }
  return { difference, threshold };
}
