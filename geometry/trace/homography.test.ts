import { describe, expect, it } from 'vitest';
import type { BoardPoint } from '../polygon';
import { homographyApply, homographyFromQuads, homographyInvert, type Quad } from './homography';

/**
 * Reference: the normalised direct linear transform of Hartley and Zisserman,
 * "Multiple View Geometry in Computer Vision", 2nd ed., Algorithm 4.2:
 * normalise each point set (centroid at the origin, mean distance sqrt 2),
 * stack two rows per correspondence into A (2n x 9), take h as the singular
 * vector of A with the smallest singular value (here the eigenvector of A^T A
 * with the smallest eigenvalue, by cyclic Jacobi rotations), then undo the
 * normalisation. Written here independently of the code under test.
 */
function jacobiSmallestEigenvector(m: number[][]): number[] {
  const n = m.length;
  const a = m.map((row) => [...row]);
  const v: number[][] = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0;
    for (let p = 0; p < n; p++) for (let q = p + 1; q < n; q++) off += a[p]![q]! ** 2;
    if (off < 1e-30) break;
    for (let p = 0; p < n; p++) {
      for (let q = p + 1; q < n; q++) {
        if (Math.abs(a[p]![q]!) < 1e-300) continue;
        const theta = (a[q]![q]! - a[p]![p]!) / (2 * a[p]![q]!);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k]![p]!;
          const akq = a[k]![q]!;
          a[k]![p] = c * akp - s * akq;
          a[k]![q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p]![k]!;
          const aqk = a[q]![k]!;
          a[p]![k] = c * apk - s * aqk;
          a[q]![k] = s * apk + c * aqk;
        }
        for (let k = 0; k < n; k++) {
          const vkp = v[k]![p]!;
          const vkq = v[k]![q]!;
          v[k]![p] = c * vkp - s * vkq;
          v[k]![q] = s * vkp + c * vkq;
        }
      }
    }
  }
  let smallest = 0;
  for (let i = 1; i < n; i++) if (a[i]![i]! < a[smallest]![smallest]!) smallest = i;
  return v.map((row) => row[smallest]!);
}

type M3 = number[][];
const mul = (a: M3, b: M3): M3 => a.map((row) => b[0]!.map((_, j) => row.reduce((s, x, k) => s + x * b[k]![j]!, 0)));

function normaliser(points: BoardPoint[]): M3 {
  const cx = points.reduce((s, p) => s + p.x, 0) / points.length;
  const cy = points.reduce((s, p) => s + p.y, 0) / points.length;
  const mean = points.reduce((s, p) => s + Math.hypot(p.x - cx, p.y - cy), 0) / points.length;
  const k = Math.SQRT2 / mean;
  return [[k, 0, -k * cx], [0, k, -k * cy], [0, 0, 1]];
}

function inverseSimilarity(t: M3): M3 {
  const k = t[0]![0]!;
  return [[1 / k, 0, -t[0]![2]! / k], [0, 1 / k, -t[1]![2]! / k], [0, 0, 1]];
}

const apply = (m: M3, p: BoardPoint): BoardPoint => {
  const w = m[2]![0]! * p.x + m[2]![1]! * p.y + m[2]![2]!;
  return { x: (m[0]![0]! * p.x + m[0]![1]! * p.y + m[0]![2]!) / w, y: (m[1]![0]! * p.x + m[1]![1]! * p.y + m[1]![2]!) / w };
};

function dlt(source: BoardPoint[], target: BoardPoint[]): M3 {
  const ts = normaliser(source);
  const tt = normaliser(target);
  const rows: number[][] = [];
  source.forEach((p, i) => {
    const { x, y } = apply(ts, p);
    const { x: u, y: v } = apply(tt, target[i]!);
    rows.push([0, 0, 0, -x, -y, -1, v * x, v * y, v]);
    rows.push([x, y, 1, 0, 0, 0, -u * x, -u * y, -u]);
  });
  const ata = Array.from({ length: 9 }, (_, i) => Array.from({ length: 9 }, (_, j) => rows.reduce((s, r) => s + r[i]! * r[j]!, 0)));
  const h = jacobiSmallestEigenvector(ata);
  const hn: M3 = [h.slice(0, 3), h.slice(3, 6), h.slice(6, 9)];
  return mul(inverseSimilarity(tt), mul(hn, ts));
}

// A Letter sheet (8.5 x 11 in, ANSI/ASME Y14.1) photographed about 15 degrees off square, in pixels of a 4000 x 3000 photo.
const photographed: Quad = [{ x: 1210, y: 702 }, { x: 2610, y: 771 }, { x: 2745, y: 2490 }, { x: 1090, y: 2412 }];
const flat: Quad = [{ x: 0, y: 0 }, { x: 8.5, y: 0 }, { x: 8.5, y: 11 }, { x: 0, y: 11 }];
const further: BoardPoint[] = [{ x: 0, y: 0 }, { x: 3999, y: 2999 }, { x: 2000, y: 1500 }, { x: 150, y: 2900 }, { x: 3700, y: 120 }, { x: 1800, y: 900 }];

describe('homography from four corners', () => {
  it('sends the four corners where they belong', () => {
    const h = homographyFromQuads(photographed, flat)!;
    photographed.forEach((p, i) => {
      const q = homographyApply(h, p);
      expect(q.x).toBeCloseTo(flat[i]!.x, 9);
      expect(q.y).toBeCloseTo(flat[i]!.y, 9);
    });
  });

  it('agrees with the normalised DLT (Hartley and Zisserman, Algorithm 4.2) within 1e-6 on further points', () => {
    const h = homographyFromQuads(photographed, flat)!;
    const reference = dlt([...photographed], [...flat]);
    for (const p of [...photographed, ...further]) {
      const ours = homographyApply(h, p);
      const theirs = apply(reference, p);
      expect(Math.abs(ours.x - theirs.x)).toBeLessThan(1e-6);
      expect(Math.abs(ours.y - theirs.y)).toBeLessThan(1e-6);
    }
  });

  it('agrees with the DLT for a strong tilt in the other direction, and inverts back to the photo', () => {
    const steep: Quad = [{ x: 300, y: 200 }, { x: 3500, y: 650 }, { x: 3300, y: 2300 }, { x: 700, y: 2800 }];
    const target: Quad = [{ x: 0, y: 0 }, { x: 40, y: 0 }, { x: 40, y: 32 }, { x: 0, y: 32 }];
    const h = homographyFromQuads(steep, target)!;
    const reference = dlt([...steep], [...target]);
    const back = homographyInvert(h)!;
    for (const p of further) {
      const ours = homographyApply(h, p);
      const theirs = apply(reference, p);
      expect(Math.abs(ours.x - theirs.x)).toBeLessThan(1e-6);
      expect(Math.abs(ours.y - theirs.y)).toBeLessThan(1e-6);
      const round = homographyApply(back, ours);
      expect(Math.abs(round.x - p.x)).toBeLessThan(1e-6);
      expect(Math.abs(round.y - p.y)).toBeLessThan(1e-6);
    }
  });

  it('refuses corners with three on one line', () => {
    const collinear: Quad = [{ x: 0, y: 0 }, { x: 100, y: 0 }, { x: 200, y: 0 }, { x: 0, y: 100 }];
    expect(homographyFromQuads(collinear, flat)).toBeNull();
  });
});
