import { describe, expect, it } from 'vitest';
import { polygonDifference, polygonIntersection, polygonOffset, polygonsArea, polygonUnion } from './clip';
import { shapePolygon } from './shapes';

const rectangle8x10 = shapePolygon({ kind: 'rectangle', width: 8, height: 10 });

describe('polygonOffset against closed forms', () => {
  it('grows an 8 x 10 rectangle by 1/4 in with round corners to 89.19635 sq in', () => {
    // Steiner formula (Encyclopedia of Mathematics, mixed volumes): A + P d + pi d^2 = 80 + 9 + pi/16.
    const grown = polygonOffset([rectangle8x10], 0.25, 'round', 0.005);
    const expected = 80 + 36 * 0.25 + Math.PI * 0.25 ** 2;
    expect(expected).toBeCloseTo(89.19635, 5);
    // Chords inside the corner arcs lose at most the arc tolerance times the arc length (2 pi d).
    expect(Math.abs(polygonsArea(grown) - expected)).toBeLessThanOrEqual(0.005 * 2 * Math.PI * 0.25);
  });

  it('grows it with mitred corners to 8.5 x 10.5 = 89.25 sq in', () => {
    // Plain arithmetic: (8 + 2 x 1/4)(10 + 2 x 1/4).
    expect(polygonsArea(polygonOffset([rectangle8x10], 0.25, 'miter'))).toBeCloseTo(89.25, 6);
  });

  it('grows a circle of radius r to r + d, shrinks it to r - d, and empties it when d >= r', () => {
    const circle = shapePolygon({ kind: 'circle', radius: 2 }, 0.001);
    const within = 0.005 + 0.0002;
    const radii = (rings: ReturnType<typeof polygonOffset>) => rings.flat().map((p) => Math.hypot(p.x, p.y));
    for (const r of radii(polygonOffset([circle], 0.5, 'round'))) expect(Math.abs(r - 2.5)).toBeLessThanOrEqual(within);
    for (const r of radii(polygonOffset([circle], -0.5, 'round'))) expect(Math.abs(r - 1.5)).toBeLessThanOrEqual(within);
    expect(polygonOffset([circle], -2, 'round')).toEqual([]);
    expect(polygonOffset([circle], -2.5, 'round')).toEqual([]);
  });
});

describe('booleans', () => {
  const a = [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }];
  const b = [{ x: 2, y: 2 }, { x: 6, y: 2 }, { x: 6, y: 6 }, { x: 2, y: 6 }];

  it('adds up two overlapping 4 in squares to 16 + 16 - 4', () => {
    expect(polygonsArea(polygonUnion([a, b]))).toBeCloseTo(28, 8);
    expect(polygonsArea(polygonIntersection([a], [b]))).toBeCloseTo(4, 8);
    expect(polygonsArea(polygonDifference([a], [b]))).toBeCloseTo(12, 8);
  });

  it('counts a hole negative', () => {
    const frame = polygonDifference([[{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 10 }, { x: 0, y: 10 }]], [b]);
    expect(polygonsArea(frame)).toBeCloseTo(100 - 16, 8);
  });
});
