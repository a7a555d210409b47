import { describe, expect, it } from 'vitest';
import type { Finding } from './findings';
import type { Layout, Mat, Opening } from './layoutSchema';
import { checkLayout } from './checks';
import { openingLines } from './openingLines';
import { shapeGrownEnclosure, MEASURE_TOLERANCE_IN } from './enclosure';
import type { BoardPoint, Polygon } from './polygon';

/**
 * Checks measured against outside references: closed-form distances
 * (circle to circle = centre distance less the radii; circle to a line;
 * an ellipse to a line by its support function sqrt(a^2 cos^2 + b^2 sin^2)),
 * and a brute-force distance over densely sampled lines worked out here.
 */

// Common practice: 4-ply board about 0.055 in thick, cut at 45 degrees, so each face line lies 0.055 in outside the sight.
const T = 0.055;
const fourPly = (id: string): Mat => ({ id, name: id, color: '#1b2a4a', coreColor: '#ffffff', ply: 4, thickness: T, bevelAngle: 45, sheet: { width: 40, height: 60 } });

function layoutOf(openings: Opening[], outer = { width: 30, height: 24 }, mats = 2): Layout {
  return {
    schemaVersion: 2, outer, mats: Array.from({ length: mats }, (_, i) => fourPly(`m${i}`)), mountingBoard: { color: '#ffffff', cut: false }, openings,
    checkSettings: { bridgeWarning: 0.5, bridgeError: 0.25, minimumBand: 1 / 16, minimumOverlap: 1 / 8, rabbetAllowance: 1 / 8 },
  };
}

const base = { rotation: 0, depth: 1, clearance: 0, reveals: [] as number[] };
const circle = (id: string, x: number, y: number, radius = 2): Opening => ({ ...base, id, shape: { kind: 'circle', radius }, center: { x, y } });
const rect = (id: string, x: number, y: number, width: number, height: number, rotation = 0): Opening => ({ ...base, id, rotation, shape: { kind: 'rectangle', width, height }, center: { x, y } });
const oval = (id: string, x: number, y: number, width: number, height: number, rotation = 0): Opening => ({ ...base, id, rotation, shape: { kind: 'oval', width, height }, center: { x, y } });

const of = (findings: readonly Finding[], code: Finding['code']) => findings.filter((f) => f.code === code);

describe('overlaps by area', () => {
  const cases: [string, Opening[]][] = [
    // No corner of either lies inside the other in the next two; only their areas cross.
    ['a 4 x 2 rectangle straddling the side of a 4 x 4', [rect('square', 10, 10, 4, 4), rect('bar', 12, 10, 4, 2)]],
    ['a plus made of a 10 x 1 and a 1 x 10', [rect('across', 15, 12, 10, 1), rect('down', 15, 12, 1, 10)]],
    ['a long bar turned 30 degrees across an 8 x 10 photo opening', [rect('photo', 12, 12, 8, 10), rect('bar', 12, 12, 16, 0.75, 30)]],
    ['a circle reaching 0.01 in into a rectangle', [rect('photo', 8, 12, 8, 10), circle('patch', 12 + 2 + 2 * T - 0.01, 12)]],
  ];
  for (const [name, openings] of cases) {
    it(`finds ${name}, once, with no bridge for the same pair`, () => {
      const findings = checkLayout(layoutOf(openings));
      expect(of(findings, 'openings-overlap')).toHaveLength(1);
      expect(of(findings, 'openings-overlap')[0]!.openingIds).toEqual(expect.arrayContaining(openings.map((o) => o.id)));
      expect(of(findings, 'bridge-narrow').filter((f) => f.openingIds?.length === 2)).toEqual([]);
    });
  }

  it('marks the overlap at the box the two areas share', () => {
    // 4 x 4 at (10, 10) grows to x 7.945..12.055; the 4 x 2 bar at (12, 10) to x 9.945..14.055, y 8.945..11.055.
    const [overlap] = of(checkLayout(layoutOf([rect('square', 10, 10, 4, 4), rect('bar', 12, 10, 4, 2)])), 'openings-overlap');
    expect(overlap!.at).toMatchObject({ x: expect.closeTo(9.945, 3), y: expect.closeTo(8.945, 3), w: expect.closeTo(2.11, 3), h: expect.closeTo(2.11, 3) });
  });

  it('calls two lines that only touch an overlap too', () => {
    // Face lines of two r = 2 circles touch when the centres are 2 x 2.055 apart.
    expect(of(checkLayout(layoutOf([circle('a', 8, 10), circle('b', 8 + 4.11, 10)])), 'openings-overlap')).toHaveLength(1);
  });
});

describe('bridges on the true curves', () => {
  const bridge = (findings: readonly Finding[]) => of(findings, 'bridge-narrow');

  it('reads a true 0.245 in bridge between two 4 in circles as an error, within 0.001 in and never wider', () => {
    const trueWidth = 0.245;
    const [b] = bridge(checkLayout(layoutOf([circle('a', 8, 10), circle('b', 8 + 4.11 + trueWidth, 10)])));
    expect(b!.severity).toBe('error');
    expect(b!.measured!).toBeLessThanOrEqual(trueWidth);
    expect(b!.measured!).toBeGreaterThan(trueWidth - 0.001);
  });

  it('finds a true 0.495 in bridge between circles lined up at 37 degrees', () => {
    const gap = 4.11 + 0.495;
    const angle = (37 * Math.PI) / 180;
    const [b] = bridge(checkLayout(layoutOf([circle('a', 8, 8), circle('b', 8 + gap * Math.cos(angle), 8 + gap * Math.sin(angle))])));
    expect(b!.severity).toBe('warning');
    expect(b!.measured!).toBeLessThanOrEqual(0.495);
    expect(b!.measured!).toBeGreaterThan(0.494);
  });

  it('measures a circle 0.200 in from the outer edge as at most 0.200 (distance from a circle to a line: centre distance less radius)', () => {
    // Face radius 2.055; centre 2.255 from the left edge.
    const [b] = bridge(checkLayout(layoutOf([circle('a', 2.255, 12)])));
    expect(b!.message).toMatch(/left edge/);
    expect(b!.measured!).toBeLessThanOrEqual(0.2);
    expect(b!.measured!).toBeGreaterThan(0.199);
  });

  it('measures an oval turned 20 degrees beside a rectangle by the ellipse support function', () => {
    // Face line = ellipse (a 3, b 2) grown by T: its reach along x is sqrt(a^2 cos^2 t + b^2 sin^2 t) + T, t = 20 degrees.
    const t = (20 * Math.PI) / 180;
    const reach = Math.sqrt(9 * Math.cos(t) ** 2 + 4 * Math.sin(t) ** 2) + T;
    const rectLeft = 10 + reach + 0.3; // the rectangle's face line starts here
    const width = 4;
    const findings = checkLayout(layoutOf([oval('oval', 10, 12, 6, 4, 20), rect('card', rectLeft + T + (width - 2 * T) / 2 - T + T, 12, width - 2 * T, 8)]));
    const [b] = bridge(findings);
    expect(b!.measured!).toBeLessThanOrEqual(0.3 + 1e-9);
    expect(b!.measured!).toBeGreaterThan(0.299);
  });

  it('measures a garment outline beside a circle within 0.001 in of a brute-force distance on the cut line', () => {
    const garment: Opening = { ...base, id: 'jersey', clearance: 0.25, shape: { kind: 'outline', points: tShirt() }, center: { x: 12, y: 11 } };
    const patchCentre = { x: 12 + 7.26, y: 11 + 6 };
    const findings = checkLayout(layoutOf([garment, circle('patch', patchCentre.x, patchCentre.y, 1.5)], { width: 30, height: 26 }));
    const face = openingLines(garment, layoutOf([]).mats).mats[0]!.face.polygons;
    const expected = sampledDistance(face, patchCentre) - (1.5 + T);
    const [b] = bridge(findings);
    expect(expected).toBeLessThan(0.5);
    expect(b!.measured!).toBeLessThanOrEqual(expected + 1e-9);
    expect(b!.measured!).toBeGreaterThan(expected - 0.001);
  });

  it('encloses every curve: tangent polygons stay outside the true circle and ellipse by at most the tolerance', () => {
    const circleRing = shapeGrownEnclosure({ kind: 'circle', radius: 2 }, T, { center: { x: 0, y: 0 }, rotation: 0 })!;
    for (const p of circleRing) expect(Math.hypot(p.x, p.y) - 2.055).toBeGreaterThanOrEqual(-1e-12);
    for (const p of circleRing) expect(Math.hypot(p.x, p.y) - 2.055).toBeLessThanOrEqual(MEASURE_TOLERANCE_IN + 1e-9);
    const ellipse = shapeGrownEnclosure({ kind: 'oval', width: 20, height: 2 }, 0, { center: { x: 0, y: 0 }, rotation: 0 })!;
    // Outside the ellipse: x^2/a^2 + y^2/b^2 >= 1 at every corner.
    for (const p of ellipse) expect(p.x ** 2 / 100 + p.y ** 2).toBeGreaterThanOrEqual(1 - 1e-12);
  });
});

describe('strips of board inside one opening', () => {
  it('finds the 0.29 in strip left between two legs 1.4 in apart through three mats, and only in the top mat', () => {
    // Top face line = outline grown by the bevel run and two 1/4 in reveals: 0.055 + 0.5 = 0.555 each side; 1.4 - 1.11 = 0.29.
    const legs: Opening = { ...base, id: 'shorts', depth: 3, reveals: [0.25, 0.25], shape: { kind: 'outline', points: twoLegs(1.4) }, center: { x: 15, y: 12 } };
    const findings = checkLayout(layoutOf([legs], { width: 30, height: 24 }, 3));
    const strips = of(findings, 'strip-narrow');
    expect(strips).toHaveLength(1);
    expect(strips[0]).toMatchObject({ severity: 'warning', matIndex: 0, openingIds: ['shorts'] });
    expect(strips[0]!.measured!).toBeCloseTo(0.29, 1);
    expect(Math.abs(strips[0]!.measured! - 0.29)).toBeLessThan(0.02);
    expect(strips[0]!.message).toMatch(/strip of board about 5\/16" wide/);
  });

  it('keeps quiet about the short corners of a T-shirt outline (armpits)', () => {
    const shirt: Opening = { ...base, id: 'shirt', clearance: 0.25, depth: 2, reveals: [0.25], shape: { kind: 'outline', points: tShirt() }, center: { x: 15, y: 12 } };
    expect(of(checkLayout(layoutOf([shirt])), 'strip-narrow')).toEqual([]);
  });
});

/** An invented T-shirt outline, 16 in across the sleeves, square armpits. */
function tShirt(): BoardPoint[] {
  return [
    { x: -2, y: -8 }, { x: 2, y: -8 }, { x: 8, y: -6 }, { x: 8, y: -2 }, { x: 5, y: -2 },
    { x: 5, y: 8 }, { x: -5, y: 8 }, { x: -5, y: -2 }, { x: -8, y: -2 }, { x: -8, y: -6 },
  ];
}

/** Shorts: a 10 in wide waist band and two legs 6 in long, `gap` apart. */
function twoLegs(gap: number): BoardPoint[] {
  const g = gap / 2;
  return [
    { x: -5, y: -6 }, { x: 5, y: -6 }, { x: 5, y: 6 }, { x: g, y: 6 }, { x: g, y: 0 },
    { x: -g, y: 0 }, { x: -g, y: 6 }, { x: -5, y: 6 },
  ];
}

/** Least distance from p to the rings, sampling every segment every 0.0005 in. */
function sampledDistance(rings: readonly Polygon[], p: BoardPoint): number {
  let best = Infinity;
  for (const ring of rings) {
    ring.forEach((a, i) => {
      const b = ring[(i + 1) % ring.length]!;
      const steps = Math.max(1, Math.ceil(Math.hypot(b.x - a.x, b.y - a.y) / 0.0005));
      for (let k = 0; k <= steps; k++) best = Math.min(best, Math.hypot(a.x + ((b.x - a.x) * k) / steps - p.x, a.y + ((b.y - a.y) * k) / steps - p.y));
    });
  }
  return best;
}
