import type { BoardPoint } from '../polygon';
import type { Quad } from './homography';

/** Rectangles framers keep at the counter, with where each size comes from. */
export const referenceRectangles = [
  { id: 'sheet-32x40', label: 'Mat sheet 32 x 40 in', widthIn: 32, heightIn: 40, source: 'common practice' },
  { id: 'sheet-40x60', label: 'Oversize sheet 40 x 60 in', widthIn: 40, heightIn: 60, source: 'common practice' },
  { id: 'letter', label: 'Letter paper 8.5 x 11 in', widthIn: 8.5, heightIn: 11, source: 'ANSI/ASME Y14.1' },
  { id: 'a4', label: 'A4 paper 210 x 297 mm', widthIn: 210 / 25.4, heightIn: 297 / 25.4, source: 'ISO 216' },
] as const;

/** Corner marks closer than this many pixels to a line through two others make no usable rectangle. */
export const MIN_CORNER_SPREAD_PX = 8;

export type QuadProblem = 'not-finite' | 'too-small' | 'collinear' | 'crossing' | 'not-convex';

function cross(o: BoardPoint, a: BoardPoint, b: BoardPoint): number {
  return (a.x - o.x) * (b.y - o.y) - (a.y - o.y) * (b.x - o.x);
}

/**
 * Why four marked corners (in order round the rectangle) cannot be used, or
 * null when they can: every corner must stand clear of the line through its
 * neighbours, the sides must not cross, and the shape must be convex (a flat
 * rectangle seen in perspective always is).
 */
export function quadProblem(quad: readonly BoardPoint[]): QuadProblem | null {
  if (quad.length !== 4 || !quad.every((p) => Number.isFinite(p.x) && Number.isFinite(p.y))) return 'not-finite';
  const turns = quad.map((p, i) => cross(quad[(i + 3) % 4]!, p, quad[(i + 1) % 4]!));
  for (let i = 0; i < 4; i++) {
    const a = quad[(i + 3) % 4]!;
    const b = quad[(i + 1) % 4]!;
    const base = Math.hypot(b.x - a.x, b.y - a.y);
    if (base < MIN_CORNER_SPREAD_PX) return 'too-small';
    if (Math.abs(turns[i]!) / base < MIN_CORNER_SPREAD_PX) return 'collinear';
  }
  const positive = turns.filter((t) => t > 0).length;
  if (positive === 4 || positive === 0) return null;
  if (positive === 2 && turns[0]! * turns[2]! > 0) return 'crossing';
  return positive === 2 ? 'crossing' : 'not-convex';
}

/** Corners put in the order top-left, top-right, bottom-right, bottom-left as seen on screen (y down). */
export function quadInReadingOrder(quad: Quad): Quad {
  const cx = quad.reduce((s, p) => s + p.x, 0) / 4;
  const cy = quad.reduce((s, p) => s + p.y, 0) / 4;
  const byAngle = [...quad].sort((a, b) => Math.atan2(a.y - cy, a.x - cx) - Math.atan2(b.y - cy, b.x - cx));
  let start = 0;
  byAngle.forEach((p, i) => {
    if (p.x + p.y < byAngle[start]!.x + byAngle[start]!.y) start = i;
  });
  return [0, 1, 2, 3].map((k) => byAngle[(start + k) % 4]!) as unknown as Quad;
}

/** The rectangle's sides matched to the marked corners: the longer known side goes with the longer marked pair of sides. */
export function orientedSize(quad: Quad, widthIn: number, heightIn: number): { widthIn: number; heightIn: number } {
  const d = (a: BoardPoint, b: BoardPoint) => Math.hypot(b.x - a.x, b.y - a.y);
  const across = d(quad[0], quad[1]) + d(quad[3], quad[2]);
  const down = d(quad[1], quad[2]) + d(quad[0], quad[3]);
  const long = Math.max(widthIn, heightIn);
  const short = Math.min(widthIn, heightIn);
  return across >= down ? { widthIn: long, heightIn: short } : { widthIn: short, heightIn: long };
}
