import type { BoardPoint } from './polygon';
import { numbersMax, numbersMin } from './polygon';
import type { ExactSegment } from './shapes';
import { arcSegmentCount } from './shapes';

/**
 * Closed cut paths as lines and true arcs. Angles are degrees from +x
 * towards +y of whatever frame the points are in; `sweep` is signed the same
 * way (positive: the angle grows), so the helpers work alike on face-view
 * inches (y down) and on a cutter's frame.
 */

/** A point in the plan's frame and units. */
export interface PlanPoint {
  readonly x: number;
  readonly y: number;
}

export type CutSegment =
  | { readonly kind: 'line'; readonly from: PlanPoint; readonly to: PlanPoint }
  | {
      readonly kind: 'arc';
      readonly from: PlanPoint;
      readonly to: PlanPoint;
      readonly center: PlanPoint;
      readonly radius: number;
      /** Degrees in [0, 360). */
      readonly startAngle: number;
      /** Degrees in [0, 360); equals startAngle + sweep, wrapped. */
      readonly endAngle: number;
      /** Signed degrees; 360 or -360 for a full circle. */
      readonly sweep: number;
    };

export const angleWrap = (degrees: number) => ((degrees % 360) + 360) % 360;

export function arcSegment(center: BoardPoint, radius: number, startAngle: number, sweep: number): CutSegment {
  const at = (deg: number) => ({ x: center.x + radius * Math.cos((deg * Math.PI) / 180), y: center.y + radius * Math.sin((deg * Math.PI) / 180) });
  return { kind: 'arc', from: at(startAngle), to: at(startAngle + sweep), center, radius, startAngle: angleWrap(startAngle), endAngle: angleWrap(startAngle + sweep), sweep };
}

export function segmentFromExact(segment: ExactSegment): CutSegment {
  if (segment.kind === 'line') return segment;
  return arcSegment(segment.center, segment.radius, segment.startAngle, angleWrap(segment.endAngle - segment.startAngle) || 360);
}

/** Replaces arcs by chords that stray at most `tolerance` from them. */
export function segmentsAsChords(segments: readonly CutSegment[], tolerance: number): CutSegment[] {
  return segments.flatMap((s): CutSegment[] => {
    if (s.kind === 'line') return [s];
    const count = Math.max(1, Math.ceil((arcSegmentCount(s.radius, tolerance) * Math.abs(s.sweep)) / 360));
    const points = Array.from({ length: count + 1 }, (_, i) => {
      if (i === 0) return s.from;
      if (i === count) return s.to;
      const deg = ((s.startAngle + (s.sweep * i) / count) * Math.PI) / 180;
      return { x: s.center.x + s.radius * Math.cos(deg), y: s.center.y + s.radius * Math.sin(deg) };
    });
    return points.slice(1).map((to, i) => ({ kind: 'line', from: points[i]!, to }));
  });
}

export function segmentsReversed(segments: readonly CutSegment[]): CutSegment[] {
  return [...segments].reverse().map((s) => (s.kind === 'line' ? { kind: 'line', from: s.to, to: s.from } : arcSegment(s.center, s.radius, s.startAngle + s.sweep, -s.sweep)));
}

/** Signed area of the path, positive when clockwise seen from the face (y down), arcs included. */
export function segmentsSignedArea(segments: readonly CutSegment[]): number {
  let twice = 0;
  for (const s of segments) {
    twice += s.from.x * s.to.y - s.to.x * s.from.y;
    if (s.kind === 'arc') {
      const theta = (Math.abs(s.sweep) * Math.PI) / 180;
      twice += Math.sign(s.sweep) * s.radius * s.radius * (theta - Math.sin(theta));
    }
  }
  return twice / 2;
}

/**
 * Starts the path in the middle of its longest straight stretch (ties: the
 * one nearest the cutter's origin), where a blade's entry mark hides best;
 * a circle starts at its top as seen from the face.
 */
export function segmentsFromStart(segments: readonly CutSegment[], origin: BoardPoint): CutSegment[] {
  const lines = segments.map((s, i) => ({ s, i, length: Math.hypot(s.to.x - s.from.x, s.to.y - s.from.y) })).filter((l) => l.s.kind === 'line');
  if (lines.length === 0) {
    const only = segments[0];
    if (segments.length === 1 && only?.kind === 'arc') return [arcSegment(only.center, only.radius, 270, only.sweep)];
    return [...segments];
  }
  const longest = numbersMax(lines.map((l) => l.length));
  const mid = (s: CutSegment) => ({ x: (s.from.x + s.to.x) / 2, y: (s.from.y + s.to.y) / 2 });
  const gap = (s: CutSegment) => Math.hypot(mid(s).x - origin.x, mid(s).y - origin.y);
  const [best] = lines.filter((l) => l.length >= longest - 1e-7).sort((a, b) => gap(a.s) - gap(b.s) || a.i - b.i);
  const { s, i } = best!;
  const m = mid(s);
  return [{ kind: 'line', from: m, to: s.to }, ...segments.slice(i + 1), ...segments.slice(0, i), { kind: 'line', from: s.from, to: m }];
}

/** Bounding box of a closed path, arcs by their true extremes. */
export function segmentsBounds(segments: readonly CutSegment[]): { x: number; y: number; w: number; h: number } {
  const xs: number[] = [];
  const ys: number[] = [];
  for (const s of segments) {
    xs.push(s.from.x, s.to.x);
    ys.push(s.from.y, s.to.y);
    if (s.kind !== 'arc') continue;
    for (const axis of [0, 90, 180, 270]) {
      const into = angleWrap(s.sweep > 0 ? axis - s.startAngle : s.startAngle - axis);
      if (into <= Math.abs(s.sweep) + 1e-9) {
        xs.push(s.center.x + s.radius * Math.round(Math.cos((axis * Math.PI) / 180)));
        ys.push(s.center.y + s.radius * Math.round(Math.sin((axis * Math.PI) / 180)));
      }
    }
  }
  const x = numbersMin(xs);
  const y = numbersMin(ys);
  return { x, y, w: numbersMax(xs) - x, h: numbersMax(ys) - y };
}
