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

/** The total-least-squares line through points: a point on it and its unit direction. */
function fitLine(points: readonly BoardPoint[]): { at: BoardPoint; dir: BoardPoint } | null {
  if (points.length < 2) return null;
  const cx = points.reduce((s, p) => s + p.x, 0) / points.length;
  const cy = points.reduce((s, p) => s + p.y, 0) / points.length;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (const p of points) {
    sxx += (p.x - cx) ** 2;
    sxy += (p.x - cx) * (p.y - cy);
    syy += (p.y - cy) ** 2;
  }
  const angle = 0.5 * Math.atan2(2 * sxy, sxx - syy);
  return { at: { x: cx, y: cy }, dir: { x: Math.cos(angle), y: Math.sin(angle) } };
}

function lineCrossing(a: { at: BoardPoint; dir: BoardPoint }, b: { at: BoardPoint; dir: BoardPoint }): BoardPoint | null {
  const det = a.dir.x * b.dir.y - a.dir.y * b.dir.x;
  if (Math.abs(det) < 1e-9) return null;
  const t = ((b.at.x - a.at.x) * b.dir.y - (b.at.y - a.at.y) * b.dir.x) / det;
  return { x: a.at.x + t * a.dir.x, y: a.at.y + t * a.dir.y };
}

/**
 * Sharper corners for a quadrilateral found on a traced ring: a straight
 * line is fitted to the ring's points along the middle 80 % of each side
 * (away from the rounded corners), and neighbouring lines are intersected.
 * Falls back to the given corner where a side has too few points.
 */
export function quadRefinedByLines(ring: Polygon, quad: Quad): Quad {
  const lines = quad.map((a, i) => {
    const b = quad[(i + 1) % 4]!;
    const length = Math.hypot(b.x - a.x, b.y - a.y);
    const near = ring.filter((p) => {
      const t = ((p.x - a.x) * (b.x - a.x) + (p.y - a.y) * (b.y - a.y)) / (length * length);
      const off = Math.abs((p.x - a.x) * (b.y - a.y) - (p.y - a.y) * (b.x - a.x)) / length;
      return t > 0.1 && t < 0.9 && off < Math.max(2, 0.02 * length);
    });
    return near.length >= 5 ? fitLine(near) : null;
  });
  return quad.map((corner, i) => {
    const before = lines[(i + 3) % 4];
    const after = lines[i];
    const crossing = before && after ? lineCrossing(before, after) : null;
    return crossing && Math.hypot(crossing.x - corner.x, crossing.y - corner.y) < 0.05 * Math.sqrt(polygonArea(quad)) ? crossing : corner;
  }) as unknown as Quad;
}
