import { solveLinearSystem } from '../../geometry';
import type { RgbRaster } from './raster';

/** Per channel, c0 + c1 x + c2 y + c3 x^2 + c4 xy + c5 y^2 over coordinates scaled to -1..1. */
export type LightField = [number[], number[], number[]];

/** Every this many pixels in each direction feeds the fit: ample for six coefficients and 16 times cheaper. */
const SAMPLE_STEP = 4;

/**
 * Fits a smooth surface to each colour channel over the pixels marked as
 * background: the board's colour as the light falls on it, brighter near
 * the lamp, darker at the far edge. Least squares through the 6x6 normal
 * equations. Null when too few background pixels remain to fit.
 */
export function fitLightField(raster: RgbRaster, isBackground: (index: number) => boolean): LightField | null {
  const { width, height, data } = raster;
  const ata = Array.from({ length: 6 }, () => new Array<number>(6).fill(0));
  const atb = [new Array<number>(6).fill(0), new Array<number>(6).fill(0), new Array<number>(6).fill(0)];
  const terms = new Array<number>(6);
  let count = 0;
  for (let y = 0; y < height; y += SAMPLE_STEP) {
    const ny = (2 * y) / height - 1;
    for (let x = 0; x < width; x += SAMPLE_STEP) {
      const i = y * width + x;
      if (!isBackground(i)) continue;
      const nx = (2 * x) / width - 1;
      terms[0] = 1; terms[1] = nx; terms[2] = ny; terms[3] = nx * nx; terms[4] = nx * ny; terms[5] = ny * ny;
      for (let r = 0; r < 6; r++) {
        for (let c = r; c < 6; c++) ata[r]![c]! += terms[r]! * terms[c]!;
        for (let k = 0; k < 3; k++) atb[k]![r]! += terms[r]! * data[i * 3 + k]!;
      }
      count++;
    }
  }
  if (count < 50) return null;
  for (let r = 0; r < 6; r++) for (let c = 0; c < r; c++) ata[r]![c] = ata[c]![r]!;
  const fits = atb.map((b) => solveLinearSystem(ata, b));
  return fits.every((f) => f !== null) ? (fits as LightField) : null;
}

/**
 * The fitted board colour along one row as a quadratic in x for each
 * channel, `out[3k..3k+2]` = (a, b, c) with colour = a + b nx + c nx^2, so
 * the per-pixel work is two multiply-adds.
 */
export function lightRow(field: LightField, y: number, height: number, out: Float64Array): void {
  const ny = (2 * y) / height - 1;
  for (let k = 0; k < 3; k++) {
    const c = field[k]!;
    out[3 * k] = c[0]! + c[2]! * ny + c[5]! * ny * ny;
    out[3 * k + 1] = c[1]! + c[4]! * ny;
    out[3 * k + 2] = c[3]!;
  }
}

/** A flat field of one colour, for the first pass before any background is known. */
export function flatField(colour: readonly number[]): LightField {
  return [0, 1, 2].map((k) => [colour[k]!, 0, 0, 0, 0, 0]) as LightField;
}
