import type { BoardPoint, Polygon } from '../polygon';
import { polygonArea } from '../polygon';
import type { Quad } from './homography';

/** Andrew's monotone chain; the hull of a ring, O(n log n). */
export function convexHull(points: Polygon): BoardPoint[] {
  const sorted = [...points].sort((a, b) => a.x - b.x || a.y - b.y);
  if (sorted.length < 3) return sorted;
  const turn = (o: BoardPoint, a: BoardPoint, b: BoardPoint) => (a.x - o.x) * (b.y - o.y) - (a.y - o.y) * (b.x - o.x);
  const half = (list: BoardPoint[]) => {
    const out: BoardPoint[] = [];
    for (const p of list) {
      while (out.length >= 2 && turn(out[out.length - 2]!, out[out.length - 1]!, p) <= 0) out.pop();
      out.push(p);
    }
    out.pop();
    return out;
  };
  return [...half(sorted), ...half(sorted.reverse())];
}

/** Hulls are thinned to this many vertices before the quadratic search, so a long ring costs little. */
const HULL_SAMPLE = 64;

/**
 * The four hull vertices enclosing the most area. For each pair of opposite
 * corners (i, k) the best third and fourth corners are found by a moving
 * pointer on each side, so the search is O(h^2) on a hull thinned to
 * HULL_SAMPLE vertices.
 */
export function largestInscribedQuad(hull: readonly BoardPoint[]): Quad | null {
  const step = Math.max(1, Math.ceil(hull.length / HULL_SAMPLE));
  const h = hull.filter((_, i) => i % step === 0);
  const n = h.length;
  if (n < 4) return null;
  const tri = (a: BoardPoint, b: BoardPoint, c: BoardPoint) => Math.abs((b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x)) / 2;
  let best: { area: number; idx: [number, number, number, number] } | null = null;
  for (let i = 0; i < n; i++) {
    let j = (i + 1) % n;
    let l = (i + 3) % n;
    for (let k = i + 2; k < n && (k + 1) % n !== i; k++) {
      if (j >= k) j = i + 1;
      while (j + 1 < k && tri(h[i]!, h[j + 1]!, h[k]!) >= tri(h[i]!, h[j]!, h[k]!)) j++;
      if (l <= k) l = k + 1;
      while ((l + 1) % n !== i && l + 1 < n + i && tri(h[k]!, h[(l + 1) % n]!, h[i]!) >= tri(h[k]!, h[l % n]!, h[i]!)) l++;
      const area = tri(h[i]!, h[j]!, h[k]!) + tri(h[k]!, h[l % n]!, h[i]!);
      if (!best || area > best.area) best = { area, idx: [i, j, k, l % n] };
    }
  }
  return best ? (best.idx.map((v) => h[v]!) as unknown as Quad) : null;
}

/** A ring counts as four-sided when a quadrilateral through its hull covers at least this share of it and it fills the quadrilateral. */
export const QUAD_FIT_SHARE = 0.95;

/** The ring's best-fitting quadrilateral and how well it fits (ring area / quad area), or null when the ring is not four-sided. */
export function quadFromRing(ring: Polygon): { quad: Quad; area: number } | null {
  const hull = convexHull(ring);
  const quad = largestInscribedQuad(hull);
  if (!quad) return null;
  const quadArea = polygonArea(quad);
  const ringArea = polygonArea(ring);
  const hullArea = polygonArea(hull);
  if (quadArea <= 0 || quadArea / hullArea < QUAD_FIT_SHARE || ringArea / hullArea < QUAD_FIT_SHARE) return null;
  return { quad, area: quadArea };
}
