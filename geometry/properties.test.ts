import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { polygonOffset, polygonsArea } from './clip';
import { checkLayout, matBridgeWidths } from './checks';
import type { Layout, Opening } from './layoutSchema';
import { openingLines } from './openingLines';
import type { Polygon } from './polygon';
import { polygonBoundaryDistance, ringsNearestPair } from './polygon';
import { shapePolygon } from './shapes';

const ARC = 0.005;

const convexShape = fc.oneof(
  fc.record({ kind: fc.constant('rectangle' as const), width: fc.double({ min: 0.5, max: 20, noNaN: true }), height: fc.double({ min: 0.5, max: 20, noNaN: true }) }),
  fc.record({ kind: fc.constant('circle' as const), radius: fc.double({ min: 0.5, max: 10, noNaN: true }) }),
  fc.record({ kind: fc.constant('regularPolygon' as const), sides: fc.integer({ min: 3, max: 12 }), radius: fc.double({ min: 0.5, max: 10, noNaN: true }) }),
);

/** A star-shaped ring: simple by construction, convex or not. */
const starRing = fc.array(fc.double({ min: 1, max: 4, noNaN: true }), { minLength: 5, maxLength: 40 }).map((radii): Polygon =>
  radii.map((r, i) => ({ x: r * Math.cos((2 * Math.PI * i) / radii.length), y: r * Math.sin((2 * Math.PI * i) / radii.length) })),
);

describe('offset properties', () => {
  it('offsetting a convex shape out and back in returns it within the arc tolerance', () => {
    fc.assert(
      fc.property(convexShape, fc.double({ min: 0.01, max: 1, noNaN: true }), (shape, d) => {
        const ring = shapePolygon(shape, ARC);
        const back = polygonOffset(polygonOffset([ring], d, 'round', ARC), -d, 'round', ARC);
        expect(back).toHaveLength(1);
        // Each round join strays up to the arc tolerance, plus clipper's 0.0001 in grid, twice.
        for (const p of back[0]!) expect(polygonBoundaryDistance(ring, p)).toBeLessThanOrEqual(2 * ARC + 0.0005);
        expect(Math.abs(polygonsArea(back) - polygonsArea([ring]))).toBeLessThanOrEqual(2 * ARC * 4 * 40 + 0.01);
      }),
      { numRuns: 60 },
    );
  });

  it('an outward offset never shrinks the area', () => {
    fc.assert(
      fc.property(starRing, fc.double({ min: 0.001, max: 1, noNaN: true }), fc.constantFrom('miter' as const, 'round' as const), (ring, d, join) => {
        expect(polygonsArea(polygonOffset([ring], d, join))).toBeGreaterThanOrEqual(polygonsArea([ring]) - 1e-6);
      }),
      { numRuns: 80 },
    );
  });
});

function fourPlyLayout(width: number, height: number, openings: Opening[]): Layout {
  const mat = { id: 'top', name: 'top', color: '#1b2a4a', coreColor: '#ffffff', ply: 4 as const, thickness: 0.055, bevelAngle: 45, sheet: { width: 60, height: 60 } };
  return {
    schemaVersion: 2, outer: { width, height }, mats: [mat], mountingBoard: { color: '#ffffff', cut: false }, openings,
    checkSettings: { bridgeWarning: 0.5, bridgeError: 0.25, minimumBand: 1 / 16, minimumOverlap: 1 / 8, rabbetAllowance: 1 / 8 },
  };
}

const pairOfOpenings = fc.record({
  shapeA: convexShape.filter((s) => s.kind !== 'rectangle' || Math.max(s.width, s.height) < 8),
  radiusB: fc.double({ min: 0.75, max: 3, noNaN: true }),
  gap: fc.double({ min: 0, max: 0.6, noNaN: true }),
  angle: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
});

interface PairCase {
  readonly shapeA: Opening['shape'];
  readonly radiusB: number;
  readonly gap: number;
  readonly angle: number;
}

/**
 * Opening A near the middle of a 60 x 60 board, patch B placed so the
 * shapes' circumscribed circles are `gap` apart; both stay far from the edges.
 */
function pairLayout({ shapeA, radiusB, gap, angle }: PairCase, shift = { x: 0, y: 0 }): Layout {
  const reach = shapeA.kind === 'rectangle' ? Math.hypot(shapeA.width, shapeA.height) / 2 : shapeA.kind === 'circle' || shapeA.kind === 'regularPolygon' ? shapeA.radius : 0;
  const distance = reach + radiusB + 2 * 0.055 + gap;
  const centre = { x: 20 + shift.x, y: 20 + shift.y };
  const a: Opening = { id: 'a', shape: shapeA, center: centre, rotation: 0, depth: 1, clearance: 0, reveals: [] };
  const b: Opening = {
    id: 'b', shape: { kind: 'circle', radius: radiusB }, rotation: 0, depth: 1, clearance: 0, reveals: [],
    center: { x: centre.x + distance * Math.cos(angle), y: centre.y + distance * Math.sin(angle) },
  };
  return fourPlyLayout(60, 60, [a, b]);
}

/** The same layout turned a quarter turn clockwise on screen. */
function layoutTurned(layout: Layout): Layout {
  const { width, height } = layout.outer;
  return {
    ...layout,
    outer: { width: height, height: width },
    openings: layout.openings.map((o) => ({ ...o, center: { x: height - o.center.y, y: o.center.x }, rotation: o.rotation + 90 })),
  };
}

const summary = (layout: Layout) => checkLayout(layout).map((f) => ({ code: f.code, severity: f.severity, measured: f.measured === null ? null : Math.round(f.measured * 1000) }));

describe('check properties', () => {
  it('bridge widths never exceed the distance between the two face-edge lines', () => {
    fc.assert(
      fc.property(pairOfOpenings, (pair) => {
        const layout = pairLayout(pair);
        const faces = layout.openings.map((o) => openingLines(o, layout.mats).mats[0]!.face.polygons);
        const distance = ringsNearestPair(faces[0]!, faces[1]!)!.distance;
        // Lines that touch or cross are an overlap, reported instead of a bridge.
        if (checkLayout(layout).some((f) => f.code === 'openings-overlap')) return;
        // Bridges between the two lines; strips inside one line and bridges to the outer edge measure something else.
        const between = matBridgeWidths(layout).filter((spot) => spot.kind === 'bridge' && spot.edge === null);
        for (const spot of between) expect(spot.measured).toBeLessThanOrEqual(distance + 1e-9);
      }),
      { numRuns: 40 },
    );
  });

  it('findings do not change when the openings move or the layout turns a quarter', () => {
    fc.assert(
      fc.property(pairOfOpenings, fc.integer({ min: 0, max: 40 }), fc.integer({ min: 0, max: 40 }), (pair, dx, dy) => {
        const layout = pairLayout(pair);
        const moved = pairLayout(pair, { x: dx / 4, y: dy / 4 });
        expect(summary(moved)).toEqual(summary(layout));
        expect(summary(layoutTurned(layout))).toEqual(summary(layout));
      }),
      { numRuns: 30 },
    );
  });
});
