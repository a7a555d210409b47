/**
 * Otsu's threshold (Otsu 1979, "A threshold selection method from gray-level
 * histograms"): the level t that maximises the between-class variance
 * w0 w1 (m0 - m1)^2 when levels <= t form one class and the rest the other.
 * One pass over the histogram with running sums; ties keep the lowest level.
 * Returns -1 when the histogram holds a single level (nothing to separate).
 */
export function otsuThreshold(histogram: ArrayLike<number>): number {
  const levels = histogram.length;
  let total = 0;
  let sumAll = 0;
  for (let i = 0; i < levels; i++) {
    total += histogram[i]!;
    sumAll += i * histogram[i]!;
  }
  if (total <= 0) return -1;
  let weightBelow = 0;
  let sumBelow = 0;
  let best = -1;
  let bestVariance = 0;
  for (let t = 0; t < levels - 1; t++) {
    weightBelow += histogram[t]!;
    sumBelow += t * histogram[t]!;
    const weightAbove = total - weightBelow;
    if (weightBelow === 0 || weightAbove === 0) continue;
    const meanBelow = sumBelow / weightBelow;
    const meanAbove = (sumAll - sumBelow) / weightAbove;
    const variance = (weightBelow / total) * (weightAbove / total) * (meanBelow - meanAbove) ** 2;
    if (variance > bestVariance * (1 + 1e-12)) {
      bestVariance = variance;
      best = t;
    }
  }
  return best;
}
