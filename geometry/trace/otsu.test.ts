import { describe, expect, it } from 'vitest';
import { otsuThreshold } from './otsu';

/**
 * Otsu (1979), eq. (18): the threshold k* maximises the between-class
 * variance sigma_B^2(k) = w0 w1 (mu1 - mu0)^2, where class C0 holds levels
 * 0..k and C1 the rest. Computed here by brute force: for every k, the class
 * weights and means are summed afresh from the histogram.
 */
function otsuByDefinition(hist: number[]): number {
  const total = hist.reduce((s, v) => s + v, 0);
  let best = -1;
  let bestVariance = -1;
  for (let k = 0; k < hist.length - 1; k++) {
    const c0 = hist.slice(0, k + 1);
    const c1 = hist.slice(k + 1);
    const n0 = c0.reduce((s, v) => s + v, 0);
    const n1 = c1.reduce((s, v) => s + v, 0);
    if (n0 === 0 || n1 === 0) continue;
    const mu0 = c0.reduce((s, v, i) => s + i * v, 0) / n0;
    const mu1 = c1.reduce((s, v, i) => s + (i + k + 1) * v, 0) / n1;
    const variance = (n0 / total) * (n1 / total) * (mu1 - mu0) ** 2;
    if (variance > bestVariance + 1e-9) {
      bestVariance = variance;
      best = k;
    }
  }
  return best;
}

/** Within-class variance, which Otsu shows is minimised by the same k (sigma_W^2 + sigma_B^2 = sigma_T^2). */
function withinClassVariance(hist: number[], k: number): number {
  const total = hist.reduce((s, v) => s + v, 0);
  const part = (from: number, to: number) => {
    let n = 0;
    let m = 0;
    for (let i = from; i < to; i++) {
      n += hist[i]!;
      m += i * hist[i]!;
    }
    m /= n;
    let v = 0;
    for (let i = from; i < to; i++) v += hist[i]! * (i - m) ** 2;
    return v / total;
  };
  return part(0, k + 1) + part(k + 1, hist.length);
}

function bimodal(m0: number, s0: number, n0: number, m1: number, s1: number, n1: number): number[] {
  return Array.from({ length: 256 }, (_, i) =>
    Math.round(n0 * Math.exp(-(((i - m0) / s0) ** 2) / 2) + n1 * Math.exp(-(((i - m1) / s1) ** 2) / 2)),
  );
}

describe("Otsu's threshold", () => {
  it.each([
    ['dark garment on a light board', bimodal(60, 12, 4000, 190, 20, 9000)],
    ['unequal spreads and weights', bimodal(40, 5, 20000, 150, 40, 1500)],
    ['close modes', bimodal(100, 15, 5000, 140, 15, 5000)],
  ])('equals the maximum between-class variance level: %s', (_name, hist) => {
    const t = otsuThreshold(hist);
    expect(t).toBe(otsuByDefinition(hist));
    for (const k of [t - 3, t - 1, t + 1, t + 3]) expect(withinClassVariance(hist, t)).toBeLessThanOrEqual(withinClassVariance(hist, k) + 1e-9);
  });

  it('lies between the two modes of a clearly bimodal histogram', () => {
    const t = otsuThreshold(bimodal(60, 10, 5000, 200, 10, 5000));
    expect(t).toBeGreaterThan(100);
    expect(t).toBeLessThan(160);
  });

  it('has nothing to separate in a one-level histogram', () => {
    const hist = new Array(256).fill(0);
    hist[77] = 1000;
    expect(otsuThreshold(hist)).toBe(-1);
  });
});
