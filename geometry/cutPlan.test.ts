import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { CutPath, CutPlan, CutProfile } from './cutPlan';
import { cutPlan, cutSheetFitProblem } from './cutPlan';
import type { CutSegment, PlanPoint } from './cutSegments';
import type { LayoutInput } from './layoutSchema';
import { parseLayout } from './layout';

const T = 0.055; // board thickness; at 45 degrees the bevel run equals it (tan 45 = 1)
const mat = (id: string) => ({ id, name: id, color: '#1b2a4a', coreColor: '#f4f1e8', ply: 4 as const, thickness: T, bevelAngle: 45, sheet: { width: 32, height: 40 } });

function layoutOf(input: Partial<LayoutInput>) {
  const parsed = parseLayout({ schemaVersion: 2, outer: { width: 16, height: 20 }, mats: [mat('top'), mat('lower')], mountingBoard: { color: '#ffffff', cut: false }, openings: [], ...input });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.layout;
}

/** Not symmetric in any axis: a photo left of centre, a patch low right, a small window near the top. */
const lopsided = layoutOf({
  openings: [
    { id: 'photo', shape: { kind: 'rectangle', width: 8, height: 10 }, center: { x: 6, y: 8 }, depth: 2, reveals: [0.25] },
    { id: 'patch', shape: { kind: 'circle', radius: 2 }, center: { x: 12, y: 15 }, depth: 1 },
    { id: 'ticket', shape: { kind: 'roundedRectangle', width: 3, height: 2, cornerRadius: 0.5 }, center: { x: 12.5, y: 3 }, depth: 2, reveals: [0.25] },
  ],
});

const profile = (over: Partial<CutProfile> = {}): CutProfile => ({
  units: 'in', mirrored: false, pathEdge: 'back', origin: 'top-left', arcs: true, chordToleranceIn: 0.005, maxSheetWidthIn: 40, maxSheetHeightIn: 60, ...over,
});

/** Points along a path, arcs sampled every 2 degrees, computed here rather than by the plan. */
function pathPoints(path: CutPath): PlanPoint[] {
  return path.segments.flatMap((s: CutSegment) => {
    if (s.kind === 'line') return [s.from];
    const steps = Math.max(2, Math.ceil(Math.abs(s.sweep) / 2));
    return Array.from({ length: steps }, (_, i) => {
      const a = ((s.startAngle + (s.sweep * i) / steps) * Math.PI) / 180;
      return { x: s.center.x + s.radius * Math.cos(a), y: s.center.y + s.radius * Math.sin(a) };
    });
  });
}

function shoelace(points: readonly PlanPoint[]): number {
  let twice = 0;
  points.forEach((a, i) => {
    const b = points[(i + 1) % points.length]!;
    twice += a.x * b.y - b.x * a.y;
  });
  return twice / 2;
}

/** Where a path turns: segment ends, less the split made to start mid-side. */
function corners(path: CutPath): PlanPoint[] {
  return path.segments.flatMap((s, i) => {
    const next = path.segments[(i + 1) % path.segments.length]!;
    if (s.kind === 'arc' || next.kind === 'arc') return [s.to];
    const turn = (s.to.x - s.from.x) * (next.to.y - next.from.y) - (s.to.y - s.from.y) * (next.to.x - next.from.x);
    return Math.abs(turn) > 1e-9 ? [s.to] : [];
  });
}

function box(points: readonly PlanPoint[]) {
  const xs = points.map((p) => p.x);
  const ys = points.map((p) => p.y);
  return { left: Math.min(...xs), right: Math.max(...xs), top: Math.min(...ys), bottom: Math.max(...ys) };
}

const opening = (plan: CutPlan, board: number, id: string) => plan.boards[board]!.paths.find((p) => p.openingId === id)!;
const origins = ['top-left', 'bottom-left', 'top-right', 'bottom-right'] as const;

describe('cut plan', () => {
  it('cuts every mat top first, each mat its own openings and then its outer edge last', () => {
    const plan = cutPlan(lopsided, profile());
    expect(plan.boards.map((b) => b.label)).toEqual(['MAT1', 'MAT2']);
    expect(new Set(plan.boards[0]!.paths.map((p) => p.openingId))).toEqual(new Set(['photo', 'patch', 'ticket', null]));
    expect(new Set(plan.boards[1]!.paths.map((p) => p.openingId))).toEqual(new Set(['photo', 'ticket', null]));
    for (const board of plan.boards) {
      expect(board.paths.at(-1)!.operation).toBe('outer');
      expect(board.paths.at(-1)!.bevel).toBe(false);
      expect(board.paths.slice(0, -1).every((p) => p.operation === 'opening' && p.bevel)).toBe(true);
    }
  });

  it('follows the back-edge or face-edge line the profile names, sized from the sight edge and the bevel run', () => {
    // Lowest mat (2): back edge = the 8 in wide sight, face edge one bevel run wider each side.
    // Mat 1: face edge a 1/4 in reveal outside mat 2's face edge, back edge one bevel run inside that.
    const widths = { back: { lower: 8, top: 8 + 0.5 }, face: { lower: 8 + 2 * T, top: 8 + 2 * T + 0.5 } };
    for (const pathEdge of ['back', 'face'] as const) {
      const plan = cutPlan(lopsided, profile({ pathEdge }));
      const width = (m: number) => {
        const b = box(pathPoints(opening(plan, m, 'photo')));
        return b.right - b.left;
      };
      expect(width(0)).toBeCloseTo(widths[pathEdge].top, 9);
      expect(width(1)).toBeCloseTo(widths[pathEdge].lower, 9);
    }
  });

  it('runs every window clockwise and the outer edge counterclockwise as seen from the face, in every origin corner, mirrored or not', () => {
    for (const origin of origins) {
      for (const mirrored of [false, true]) {
        const plan = cutPlan(lopsided, profile({ origin, mirrored }));
        // Each flipped axis turns the frame over: mirroring and a right-hand origin flip x, a bottom origin flips y.
        const flips = (mirrored ? 1 : 0) + (origin.endsWith('right') ? 1 : 0) + (origin.startsWith('bottom') ? 1 : 0);
        const faceSign = flips % 2 === 0 ? 1 : -1;
        for (const board of plan.boards) {
          for (const path of board.paths) {
            const clockwiseSeenFromFace = shoelace(pathPoints(path)) * faceSign > 0;
            expect(clockwiseSeenFromFace, `${origin} mirrored=${mirrored} ${path.openingId}`).toBe(path.operation === 'opening');
          }
        }
      }
    }
  });

  it('mirrored for face-down cutting maps every x to width - x and keeps y', () => {
    const up = cutPlan(lopsided, profile());
    const down = cutPlan(lopsided, profile({ mirrored: true }));
    for (const [m, board] of up.boards.entries()) {
      for (const path of board.paths) {
        const other = down.boards[m]!.paths.find((p) => p.openingId === path.openingId)!;
        const a = box(pathPoints(path));
        const b = box(pathPoints(other));
        expect(b.left).toBeCloseTo(16 - a.right, 9);
        expect(b.right).toBeCloseTo(16 - a.left, 9);
        expect([b.top, b.bottom]).toEqual([a.top, a.bottom].map((v) => expect.closeTo(v, 9)));
        const key = (p: PlanPoint) => `${p.x.toFixed(6)},${p.y.toFixed(6)}`;
        expect(new Set(corners(other).map(key))).toEqual(new Set(corners(path).map((p) => key({ x: 16 - p.x, y: p.y }))));
      }
    }
  });

  it('a bottom-left origin turns y up (y = height - y) and millimetres are 25.4 to the inch', () => {
    const inches = cutPlan(lopsided, profile());
    const mm = cutPlan(lopsided, profile({ units: 'mm', origin: 'bottom-left' }));
    expect([mm.width, mm.height]).toEqual([16 * 25.4, 20 * 25.4]);
    const a = opening(inches, 0, 'patch').segments[0]!;
    const b = opening(mm, 0, 'patch').segments[0]!;
    if (a.kind !== 'arc' || b.kind !== 'arc') throw new Error('the patch should be a true arc');
    expect(b.center.x).toBeCloseTo(12 * 25.4, 9);
    expect(b.center.y).toBeCloseTo((20 - 15) * 25.4, 9);
    expect(b.radius).toBeCloseTo(2 * 25.4, 9);
    expect(Math.abs(b.sweep)).toBe(360);
  });

  it('starts a window in the middle of its longest straight side and a circle at its top as seen from the face', () => {
    const plan = cutPlan(lopsided, profile());
    const photo = opening(plan, 1, 'photo');
    // 8 x 10 sight centred at (6, 8): the long sides are x = 2 and x = 10, y from 3 to 13; the left one is nearer the origin.
    expect(photo.start.x).toBeCloseTo(2, 9);
    expect(photo.start.y).toBeCloseTo(8, 9);
    const patch = opening(plan, 0, 'patch');
    // Mat 1 is the lowest mat the patch cuts: its back edge is the 2 in sight circle.
    expect(patch.start.x).toBeCloseTo(12, 9);
    expect(patch.start.y).toBeCloseTo(13, 9);
  });

  it('keeps circles as one true arc when arcs are allowed and turns them into chords within the tolerance when not', () => {
    const arcs = opening(cutPlan(lopsided, profile()), 0, 'patch');
    expect(arcs.segments).toHaveLength(1);
    const tolerance = 0.001;
    const chords = opening(cutPlan(lopsided, profile({ arcs: false, chordToleranceIn: tolerance })), 0, 'patch');
    expect(chords.segments.every((s) => s.kind === 'line')).toBe(true);
    expect(chords.start.x).toBeCloseTo(12, 9);
    expect(chords.start.y).toBeCloseTo(13, 9);
    for (const s of chords.segments) {
      expect(Math.hypot(s.from.x - 12, s.from.y - 15)).toBeCloseTo(2, 9);
      const mid = { x: (s.from.x + s.to.x) / 2, y: (s.from.y + s.to.y) / 2 };
      expect(2 - Math.hypot(mid.x - 12, mid.y - 15)).toBeLessThanOrEqual(tolerance + 1e-12);
    }
    const ticket = opening(cutPlan(lopsided, profile({ arcs: false })), 0, 'ticket');
    expect(ticket.segments.every((s) => s.kind === 'line')).toBe(true);
  });

  it('cuts an opening that lies inside another opening of the same mat before the one around it', () => {
    const nested = layoutOf({
      mats: [mat('only')],
      openings: [
        { id: 'ring', shape: { kind: 'circle', radius: 6 }, center: { x: 8, y: 10 }, depth: 1 },
        { id: 'inner', shape: { kind: 'rectangle', width: 2, height: 2 }, center: { x: 8, y: 10 }, depth: 1 },
      ],
    });
    const order = cutPlan(nested, profile()).boards[0]!.paths.map((p) => p.openingId);
    expect(order).toEqual(['inner', 'ring', null]);
  });

  it('reports an opening that shrinks away instead of leaving it out silently', () => {
    // An 8-ply top mat's bevel runs further than the 4-ply mat's below it, so its back edge lies inside the sight.
    const tiny = layoutOf({ mats: [{ ...mat('heavy'), thickness: 0.12 }, mat('lower')], openings: [{ id: 'pin', shape: { kind: 'circle', radius: 0.01 }, center: { x: 8, y: 10 }, depth: 2, reveals: [0] }] });
    const plan = cutPlan(tiny, profile({ pathEdge: 'back' }));
    expect(plan.problems.join(' ')).toMatch(/"pin" shrinks away on mat 1/);
  });

  it('refuses a layout larger than the largest sheet the cutter takes', () => {
    expect(cutSheetFitProblem(lopsided, profile({ maxSheetWidthIn: 15 }))).toMatch(/16 x 20 in.*up to 15 x 60 in/);
    expect(cutSheetFitProblem(lopsided, profile({ maxSheetWidthIn: 16, maxSheetHeightIn: 20 }))).toBeNull();
  });
});

describe('cut order', () => {
  const distance = (a: PlanPoint, b: PlanPoint) => Math.hypot(a.x - b.x, a.y - b.y);
  const travelThrough = (starts: readonly PlanPoint[]) => starts.reduce((sum, p, i) => sum + distance(i === 0 ? { x: 0, y: 0 } : starts[i - 1]!, p), 0);

  it('never travels further than cutting the openings in the order they were drawn, and reports the travel it plans', () => {
    // Circles on a grid of 2 in cells, radius under 1 in, so no two overlap.
    const circles = fc.uniqueArray(fc.record({ cell: fc.integer({ min: 0, max: 79 }), radius: fc.double({ min: 0.2, max: 0.8, noNaN: true }) }), { minLength: 1, maxLength: 12, selector: (c) => c.cell });
    fc.assert(
      fc.property(circles, fc.constantFrom(...origins), (list, origin) => {
        const layout = layoutOf({
          mats: [mat('only')],
          openings: list.map((c, i) => ({ id: `c${i}`, shape: { kind: 'circle' as const, radius: c.radius }, center: { x: 1 + 2 * (c.cell % 8), y: 1 + 2 * Math.floor(c.cell / 8) }, depth: 1 })),
        });
        const board = cutPlan(layout, profile({ origin })).boards[0]!;
        const outer = board.paths.at(-1)!;
        const byId = new Map(board.paths.map((p) => [p.openingId, p.start]));
        const drawn = [...list.map((_, i) => byId.get(`c${i}`)!), outer.start];
        const planned = board.paths.map((p) => p.start);
        expect(board.travel).toBeCloseTo(travelThrough(planned), 9);
        expect(board.travel).toBeLessThanOrEqual(travelThrough(drawn) + 1e-9);
      }),
      { numRuns: 150 },
    );
  });
});
