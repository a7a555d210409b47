import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Finding } from './findings';
import type { Layout, Mat, Opening } from './layoutSchema';
import { checkLayout } from './checks';
import type { BoardPoint } from './polygon';
import { polygonSelfIntersections } from './selfIntersection';
import { parseLayout } from './layout';
import { MAX_OPENINGS, MAX_OUTER_SIDE_IN } from './layoutSchema';
import { formatLength } from './units';
import { cutOrder } from './cutOrder';

/**
 * Properties against references worked out in the test: whether two true
 * areas meet (circles: centre distance against the sum of the radii;
 * rectangles: overlapping intervals), the true bridge between two circles
 * (centre distance less the radii), and an all-pairs segment test for
 * self-crossing rings.
 */

const T = 0.055; // common practice: 4-ply, 45 degree bevel; each face line lies T outside the sight
const fourPly: Mat = { id: 'm', name: 'm', color: '#1b2a4a', coreColor: '#ffffff', ply: 4, thickness: T, bevelAngle: 45, sheet: { width: 40, height: 60 } };
const layoutOf = (openings: Opening[]): Layout => ({
  schemaVersion: 2, outer: { width: 40, height: 40 }, mats: [fourPly], mountingBoard: { color: '#ffffff', cut: false }, openings,
  checkSettings: { bridgeWarning: 0.5, bridgeError: 0.25, minimumBand: 1 / 16, minimumOverlap: 1 / 8, rabbetAllowance: 1 / 8 },
});
const base = { rotation: 0, depth: 1, clearance: 0, reveals: [] as number[] };

type Piece = { kind: 'circle'; x: number; y: number; r: number } | { kind: 'rect'; x: number; y: number; w: number; h: number };
const piece: fc.Arbitrary<Piece> = fc.oneof(
  fc.record({ kind: fc.constant('circle' as const), x: fc.double({ min: 12, max: 28, noNaN: true }), y: fc.double({ min: 12, max: 28, noNaN: true }), r: fc.double({ min: 0.5, max: 5, noNaN: true }) }),
  fc.record({ kind: fc.constant('rect' as const), x: fc.double({ min: 12, max: 28, noNaN: true }), y: fc.double({ min: 12, max: 28, noNaN: true }), w: fc.double({ min: 0.5, max: 10, noNaN: true }), h: fc.double({ min: 0.5, max: 10, noNaN: true }) }),
);

function opening(id: string, p: Piece): Opening {
  return p.kind === 'circle'
    ? { ...base, id, shape: { kind: 'circle', radius: p.r }, center: { x: p.x, y: p.y } }
    : { ...base, id, shape: { kind: 'rectangle', width: p.w, height: p.h }, center: { x: p.x, y: p.y } };
}

/** Distance between the true face areas (0 when they meet), by closed forms. */
function trueGap(a: Piece, b: Piece): number {
  const grow = (p: Piece): Piece => (p.kind === 'circle' ? { ...p, r: p.r + T } : { ...p, w: p.w + 2 * T, h: p.h + 2 * T });
  const [p, q] = [grow(a), grow(b)];
  const rectGap = (r: Extract<Piece, { kind: 'rect' }>, x: number, y: number) => Math.hypot(Math.max(0, Math.abs(x - r.x) - r.w / 2), Math.max(0, Math.abs(y - r.y) - r.h / 2));
  if (p.kind === 'circle' && q.kind === 'circle') return Math.max(0, Math.hypot(p.x - q.x, p.y - q.y) - p.r - q.r);
  if (p.kind === 'rect' && q.kind === 'rect') return Math.hypot(Math.max(0, Math.abs(p.x - q.x) - (p.w + q.w) / 2), Math.max(0, Math.abs(p.y - q.y) - (p.h + q.h) / 2));
  const [c, r] = p.kind === 'circle' ? [p, q as Extract<Piece, { kind: 'rect' }>] : [q as Extract<Piece, { kind: 'circle' }>, p];
  return Math.max(0, rectGap(r, c.x, c.y) - c.r);
}

const codes = (findings: readonly Finding[], code: Finding['code']) => findings.filter((f) => f.code === code);

describe('check properties', () => {
  it('any two openings whose true areas meet get an overlap finding, and a pair clearly apart gets none', () => {
    fc.assert(
      fc.property(piece, piece, (a, b) => {
        const gap = trueGap(a, b);
        const overlaps = codes(checkLayout(layoutOf([opening('a', a), opening('b', b)])), 'openings-overlap');
        if (gap === 0) expect(overlaps).toHaveLength(1);
        if (gap > 0.001) expect(overlaps).toHaveLength(0);
      }),
      { numRuns: 150 },
    );
  }, 60_000);

  it('a reported bridge between two circles is never wider than the true one and within 0.001 in of it', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 4, noNaN: true }), fc.double({ min: 0.5, max: 4, noNaN: true }),
        fc.double({ min: 0.01, max: 0.48, noNaN: true }), fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
        (r1, r2, width, angle) => {
          const d = r1 + r2 + 2 * T + width;
          const a = { kind: 'circle', x: 20, y: 20, r: r1 } as const;
          const b = { kind: 'circle', x: 20 + d * Math.cos(angle), y: 20 + d * Math.sin(angle), r: r2 } as const;
          const bridges = codes(checkLayout(layoutOf([opening('a', a), opening('b', b)])), 'bridge-narrow');
          expect(bridges).toHaveLength(1);
          expect(bridges[0]!.measured!).toBeLessThanOrEqual(width + 1e-9);
          expect(bridges[0]!.measured!).toBeGreaterThan(width - 0.001);
        },
      ),
      { numRuns: 60 },
    );
  }, 60_000);

  it('gives the same findings after moving the layout and turning it a quarter', () => {
    fc.assert(
      fc.property(piece, piece, fc.double({ min: -5, max: 5, noNaN: true }), fc.double({ min: -5, max: 5, noNaN: true }), (a, b, dx, dy) => {
        const measured = (openings: Opening[]) =>
          checkLayout(layoutOf(openings)).map((f) => ({ key: `${f.code}:${f.severity}`, measured: f.measured ?? 0 })).sort((p, q) => p.key.localeCompare(q.key) || p.measured - q.measured);
        // Same findings; lengths agree within the clipper grid and the measuring tolerance (0.001 in).
        const same = (got: ReturnType<typeof measured>, want: ReturnType<typeof measured>) => {
          expect(got.map((f) => f.key)).toEqual(want.map((f) => f.key));
          got.forEach((f, i) => expect(Math.abs(f.measured - want[i]!.measured)).toBeLessThanOrEqual(0.001));
        };
        const plain = measured([opening('a', a), opening('b', b)]);
        const moved = (p: Piece): Piece => ({ ...p, x: p.x + dx, y: p.y + dy });
        // A quarter turn about (20, 20): (x, y) -> (40 - y, x) keeps the board 40 x 40; rectangles swap sides.
        const turned = (p: Piece): Piece => (p.kind === 'circle' ? { ...p, x: 40 - p.y, y: p.x } : { ...p, x: 40 - p.y, y: p.x, w: p.h, h: p.w });
        same(measured([opening('a', moved(a)), opening('b', moved(b))]), plain);
        same(measured([opening('a', turned(a)), opening('b', turned(b))]), plain);
      }),
      { numRuns: 60 },
    );
  }, 60_000);
});

/** Every pair of non-neighbouring segments, the plain way. */
function crossesBruteForce(ring: readonly BoardPoint[]): boolean {
  const n = ring.length;
  const orient = (a: BoardPoint, b: BoardPoint, c: BoardPoint) => Math.sign((b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x));
  for (let i = 0; i < n; i++) {
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue;
      const [a, b, c, d] = [ring[i]!, ring[(i + 1) % n]!, ring[j]!, ring[(j + 1) % n]!];
      if (orient(a, b, c) * orient(a, b, d) < 0 && orient(c, d, a) * orient(c, d, b) < 0) return true;
    }
  }
  return false;
}

describe('self-crossing by sweep line', () => {
  it('agrees with the all-pairs test on random rings', () => {
    const point = fc.record({ x: fc.integer({ min: 0, max: 40 }), y: fc.integer({ min: 0, max: 40 }) }).map((p) => ({ x: p.x + 0.137 * (p.y % 3), y: p.y + 0.071 * (p.x % 5) }));
    fc.assert(
      fc.property(fc.array(point, { minLength: 4, maxLength: 24 }), (ring) => {
        // Proper crossings are what both must find; touching or collinear rings are left to the fixtures.
        const brute = crossesBruteForce(ring);
        if (brute) expect(polygonSelfIntersections(ring)).toHaveLength(1);
      }),
      { numRuns: 500 },
    );
  });

  it('finds nothing in simple star-shaped rings and finds the crossing of a bow tie', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 1, max: 4, noNaN: true }), { minLength: 5, maxLength: 200 }), (radii) => {
        const ring = radii.map((r, i) => ({ x: r * Math.cos((2 * Math.PI * i) / radii.length), y: r * Math.sin((2 * Math.PI * i) / radii.length) }));
        expect(polygonSelfIntersections(ring)).toEqual([]);
      }),
      { numRuns: 100 },
    );
    const [crossing] = polygonSelfIntersections([{ x: 0, y: 0 }, { x: 4, y: 4 }, { x: 4, y: 0 }, { x: 0, y: 4 }]);
    expect(crossing).toEqual({ x: 2, y: 2 });
  });
});

describe('layout limits', () => {
  const doc = (over: Record<string, unknown>) => ({
    schemaVersion: 2, outer: { width: 20, height: 16 }, mats: [fourPly], mountingBoard: { color: '#ffffff', cut: false }, openings: [], ...over,
  });
  const paths = (input: unknown) => {
    const parsed = parseLayout(input);
    return parsed.ok ? [] : parsed.issues.map((i) => i.path);
  };

  it('refuses what no shop can cut, naming the field', () => {
    expect(paths(doc({ outer: { width: MAX_OUTER_SIDE_IN + 1, height: 16 } }))).toContain('outer.width');
    expect(paths(doc({ openings: [{ id: 'a', shape: { kind: 'circle', radius: 1e308 }, center: { x: 5, y: 5 }, depth: 1 }] }))).toContain('openings.0.shape.radius');
    expect(paths(doc({ openings: [{ id: 'a', shape: { kind: 'circle', radius: 1 }, center: { x: 1e6, y: 5 }, depth: 1 }] }))).toContain('openings.0.center.x');
    expect(paths(doc({ openings: [{ id: 'a', shape: { kind: 'circle', radius: 1 }, center: { x: 60, y: 5 }, depth: 1 }] }))).toContain('openings.0.center');
    expect(paths(doc({ openings: [{ id: 'a', shape: { kind: 'circle', radius: 1 }, center: { x: 5, y: 5 }, depth: 2, reveals: [2] }] }))).toContain('openings.0.reveals.0');
    expect(paths(doc({ mats: Array.from({ length: 13 }, (_, i) => ({ ...fourPly, id: `m${i}` })) }))).toContain('mats');
    const many = Array.from({ length: MAX_OPENINGS + 1 }, (_, i) => ({ id: `o${i}`, shape: { kind: 'circle', radius: 0.1 }, center: { x: 5, y: 5 }, depth: 1 }));
    expect(paths(doc({ openings: many }))).toContain('openings');
    const outline = Array.from({ length: 50_001 }, (_, i) => ({ x: Math.cos(i), y: Math.sin(i) }));
    expect(paths(doc({ openings: [{ id: 'a', shape: { kind: 'outline', points: outline }, center: { x: 5, y: 5 }, depth: 1 }] }))).toContain('openings.0.shape.points');
  });

  it('makes repeated ids unique in one pass', () => {
    const openings = Array.from({ length: MAX_OPENINGS }, (_, i) => ({ id: i === 1 ? 'patch-2' : 'patch', shape: { kind: 'circle', radius: 0.1 }, center: { x: 1 + (i % 15), y: 1 + Math.floor(i / 15) }, depth: 1 }));
    const parsed = parseLayout(doc({ openings }));
    if (!parsed.ok) throw new Error('valid');
    const ids = parsed.layout.openings.map((o) => o.id);
    expect(new Set(ids).size).toBe(MAX_OPENINGS);
    expect(ids.slice(0, 3)).toEqual(['patch', 'patch-2', 'patch-3']);
  });

  it('formats a length of 1e308 without running out of stack or writing an exponent', () => {
    expect(formatLength(1e308, '1/16')).not.toMatch(/e\+/);
    expect(formatLength(123.4375, '1/16')).toBe('123 7/16"');
  });

  it('orders 200 openings in a bounded number of passes, every opening once, no longer than the drawn order', () => {
    const paths = Array.from({ length: 200 }, (_, i) => {
      const x = 1 + (i % 20) * 2;
      const y = 1 + Math.floor(i / 20) * 3;
      return { start: { x, y }, ring: [{ x, y }, { x: x + 1, y }, { x: x + 1, y: y + 2 }, { x, y: y + 2 }] };
    });
    const order = cutOrder(paths, { x: 0, y: 0 }, { x: 0, y: 0 });
    expect([...order].sort((a, b) => a - b)).toEqual(paths.map((_, i) => i));
  });
});
