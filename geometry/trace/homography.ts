import type { BoardPoint } from '../polygon';

/**
 * A plane projective transform as a row-major 3x3 matrix
 * `[h11, h12, h13, h21, h22, h23, h31, h32, h33]`, mapping (x, y) to
 * ((h11 x + h12 y + h13) / w, (h21 x + h22 y + h23) / w) with
 * w = h31 x + h32 y + h33. Normalised so h33 = 1.
 */
export type Homography = readonly [number, number, number, number, number, number, number, number, number];

export type Quad = readonly [BoardPoint, BoardPoint, BoardPoint, BoardPoint];

/** Solves A x = b for a small dense system by Gaussian elimination with partial pivoting; null when singular. */
export function solveLinearSystem(matrix: readonly (readonly number[])[], rhs: readonly number[]): number[] | null {
  const n = rhs.length;
  const a = matrix.map((row, i) => [...row, rhs[i]!]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(a[r]![col]!) > Math.abs(a[pivot]![col]!)) pivot = r;
    if (Math.abs(a[pivot]![col]!) < 1e-12) return null;
    [a[col], a[pivot]] = [a[pivot]!, a[col]!];
    const p = a[col]!;
    for (let r = col + 1; r < n; r++) {
      const row = a[r]!;
      const f = row[col]! / p[col]!;
      if (f !== 0) for (let c = col; c <= n; c++) row[c]! -= f * p[c]!;
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = a[r]![n]!;
    for (let c = r + 1; c < n; c++) s -= a[r]![c]! * x[c]!;
    x[r] = s / a[r]![r]!;
  }
  return x;
}

/** Moves points so their centroid is at the origin and their mean distance from it is sqrt 2 (Hartley's normalisation); returns the similarity used. */
function normalising(points: readonly BoardPoint[]): Homography {
  const cx = points.reduce((s, p) => s + p.x, 0) / points.length;
  const cy = points.reduce((s, p) => s + p.y, 0) / points.length;
  const mean = points.reduce((s, p) => s + Math.hypot(p.x - cx, p.y - cy), 0) / points.length;
  const k = mean > 0 ? Math.SQRT2 / mean : 1;
  return [k, 0, -k * cx, 0, k, -k * cy, 0, 0, 1];
}

/**
 * The homography taking each of four source points to its destination, from
 * the 8x8 linear system with h33 = 1, solved on normalised coordinates for
 * stability with pixel-sized numbers. Null when three points of either set
 * lie on one line (no unique transform).
 */
export function homographyFromQuads(source: Quad, target: Quad): Homography | null {
  const ns = normalising(source);
  const nt = normalising(target);
  const s = source.map((p) => homographyApply(ns, p));
  const t = target.map((p) => homographyApply(nt, p));
  if (hasThreeOnALine(s) || hasThreeOnALine(t)) return null;
  const rows: number[][] = [];
  const rhs: number[] = [];
  for (let i = 0; i < 4; i++) {
    const { x, y } = s[i]!;
    const { x: u, y: v } = t[i]!;
    rows.push([x, y, 1, 0, 0, 0, -u * x, -u * y]);
    rhs.push(u);
    rows.push([0, 0, 0, x, y, 1, -v * x, -v * y]);
    rhs.push(v);
  }
  const h = solveLinearSystem(rows, rhs);
  if (!h || !h.every(Number.isFinite)) return null;
  const core: Homography = [h[0]!, h[1]!, h[2]!, h[3]!, h[4]!, h[5]!, h[6]!, h[7]!, 1];
  const inverseTarget = homographyInvert(nt);
  if (!inverseTarget) return null;
  return homographyCompose(inverseTarget, homographyCompose(core, ns));
}

/** On normalised points (mean distance sqrt 2): any triple enclosing next to no area. */
function hasThreeOnALine(points: readonly BoardPoint[]): boolean {
  for (let skip = 0; skip < 4; skip++) {
    const [a, b, c] = points.filter((_, i) => i !== skip) as [BoardPoint, BoardPoint, BoardPoint];
    if (Math.abs((b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x)) < 1e-6) return true;
  }
  return false;
}

/** Where the transform sends a point; non-finite coordinates for points on the vanishing line. */
export function homographyApply(h: Homography, p: BoardPoint): BoardPoint {
  const w = h[6] * p.x + h[7] * p.y + h[8];
  return { x: (h[0] * p.x + h[1] * p.y + h[2]) / w, y: (h[3] * p.x + h[4] * p.y + h[5]) / w };
}

/** `a` after `b`: the transform that applies b first, then a. */
export function homographyCompose(a: Homography, b: Homography): Homography {
  const m = new Array<number>(9);
  for (let r = 0; r < 3; r++) {
    for (let c = 0; c < 3; c++) m[r * 3 + c] = a[r * 3]! * b[c]! + a[r * 3 + 1]! * b[3 + c]! + a[r * 3 + 2]! * b[6 + c]!;
  }
  return homographyNormalise(m);
}

function homographyNormalise(m: readonly number[]): Homography {
  const k = Math.abs(m[8]!) > 1e-12 ? m[8]! : 1;
  return m.map((v) => v / k) as unknown as Homography;
}

/** The inverse transform by the adjugate; null when the matrix is singular. */
export function homographyInvert(h: Homography): Homography | null {
  const [a, b, c, d, e, f, g, k, l] = h;
  const A = e * l - f * k;
  const B = -(d * l - f * g);
  const C = d * k - e * g;
  const det = a * A + b * B + c * C;
  if (!Number.isFinite(det) || Math.abs(det) < 1e-15) return null;
  const adj = [A, -(b * l - c * k), b * f - c * e, B, a * l - c * g, -(a * f - c * d), C, -(a * k - b * g), a * e - b * d];
  return homographyNormalise(adj.map((v) => v / det));
}

/** The scale-only transform for a two-point calibration: `inchesPerPixel` in both directions. */
export function homographyScale(inchesPerPixel: number): Homography {
  return [inchesPerPixel, 0, 0, 0, inchesPerPixel, 0, 0, 0, 1];
}
