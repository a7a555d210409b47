import { describe, expect, it } from 'vitest';
import { garmentWindow, polygonSimplify, polygonThin } from './garment';
import { polygonBoundaryDistance, polygonContainsPoint, polygonArea } from './polygon';
import { polygonsArea } from './clip';

function wavyCircle(count: number, radius: number, wave: number): { x: number; y: number }[] {
  return Array.from({ length: count }, (_, i) => {
    const t = (2 * Math.PI * i) / count;
    const r = radius + wave * Math.sin(9 * t);
    return { x: r * Math.cos(t), y: r * Math.sin(t) };
  });
}

describe('polygonSimplify', () => {
  it('thins a 20 000 point trace while every original point stays within the tolerance', () => {
    const trace = wavyCircle(20_000, 5, 0.2);
    const thinned = polygonSimplify(trace, 0.002);
    expect(thinned.length).toBeLessThan(2_000);
    for (let i = 0; i < trace.length; i += 7) expect(polygonBoundaryDistance(thinned, trace[i]!)).toBeLessThanOrEqual(0.002 + 1e-12);
  });

  it('keeps a square as it is', () => {
    const square = [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 1, y: 1 }, { x: 0, y: 1 }];
    expect(polygonSimplify(square, 0.01)).toEqual(square);
  });
});

describe('polygonThin', () => {
  it('drops points on a straight edge and keeps every dropped point within the tolerance', () => {
    const edge = [...Array.from({ length: 11 }, (_, i) => ({ x: i, y: 0 })), { x: 10, y: 5 }, { x: 0, y: 5 }];
    expect(polygonThin(edge, 0.0005)).toEqual([{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 5 }, { x: 0, y: 5 }]);
    const circle = wavyCircle(3_000, 3, 0);
    const thin = polygonThin(circle, 0.0005);
    for (const p of circle) expect(polygonBoundaryDistance(thin, p)).toBeLessThanOrEqual(0.0005 + 1e-12);
  });
});

describe('garmentWindow', () => {
  it('surrounds the outline by the clearance', () => {
    const outline = wavyCircle(2_000, 5, 0.2);
    const [window, ...rest] = garmentWindow(outline, 0.25);
    expect(rest).toEqual([]);
    for (let i = 0; i < outline.length; i += 5) {
      const p = outline[i]!;
      expect(polygonContainsPoint(window!, p)).toBe(true);
      // The clearance is met within the simplification (0.002 in) and arc (0.005 in) tolerances.
      expect(polygonBoundaryDistance(window!, p)).toBeGreaterThanOrEqual(0.25 - 0.007);
    }
  });

  it('fills a notch narrower than twice the smoothing radius', () => {
    // A 6 x 6 square with a 0.05 in wide, 2 in deep slot cut into its top edge.
    const slotted = [
      { x: -3, y: -3 }, { x: -0.025, y: -3 }, { x: -0.025, y: -1 }, { x: 0.025, y: -1 }, { x: 0.025, y: -3 },
      { x: 3, y: -3 }, { x: 3, y: 3 }, { x: -3, y: 3 },
    ];
    const window = garmentWindow(slotted, 0, { smoothingRadius: 1 / 16 });
    // Closing by 1/16 in fills the 0.05 in slot: the area is that of the full square, less the rounded corners' trim.
    expect(polygonsArea(window)).toBeGreaterThan(36 - 0.01);
    expect(polygonsArea(window)).toBeLessThanOrEqual(polygonArea([{ x: -3, y: -3 }, { x: 3, y: -3 }, { x: 3, y: 3 }, { x: -3, y: 3 }]) + 1e-9);
  });
});
