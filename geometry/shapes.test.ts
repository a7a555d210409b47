import { describe, expect, it } from 'vitest';
import { arcSegmentCount, shapeBounds, shapeExactContour, shapePlacedPolygon, shapePolygon } from './shapes';
import { polygonArea, polygonSignedArea } from './polygon';

describe('shapePolygon', () => {
  it('keeps every chord of a circle within the arc tolerance', () => {
    const radius = 2;
    const tolerance = 0.005;
    const ring = shapePolygon({ kind: 'circle', radius }, tolerance);
    // Geometry: a chord subtending angle t strays r (1 - cos(t/2)) from its arc.
    const sagitta = radius * (1 - Math.cos(Math.PI / ring.length));
    expect(sagitta).toBeLessThanOrEqual(tolerance);
    expect(ring.length).toBe(arcSegmentCount(radius, tolerance));
    for (const p of ring) expect(Math.hypot(p.x, p.y)).toBeCloseTo(radius, 12);
  });

  it('approaches the true areas of circle, oval and rounded rectangle from inside', () => {
    const tolerance = 0.001;
    // Geometry: circle pi r^2, ellipse pi a b, rounded rectangle w h - (4 - pi) r^2.
    const cases = [
      [{ kind: 'circle', radius: 2 } as const, Math.PI * 4],
      [{ kind: 'oval', width: 6, height: 4 } as const, Math.PI * 3 * 2],
      [{ kind: 'roundedRectangle', width: 6, height: 4, cornerRadius: 1 } as const, 24 - (4 - Math.PI)],
    ] as const;
    for (const [shape, area] of cases) {
      const ring = shapePolygon(shape, tolerance);
      expect(polygonArea(ring)).toBeLessThanOrEqual(area);
      expect(area - polygonArea(ring)).toBeLessThan(tolerance * 20);
    }
  });

  it('returns every shape clockwise on screen (positive area, y down)', () => {
    const ccwTriangle = [{ x: 0, y: 0 }, { x: 0, y: 2 }, { x: 2, y: 0 }];
    expect(polygonSignedArea(ccwTriangle)).toBeLessThan(0);
    expect(polygonSignedArea(shapePolygon({ kind: 'polygon', points: ccwTriangle }))).toBeGreaterThan(0);
    expect(polygonSignedArea(shapePolygon({ kind: 'regularPolygon', sides: 6, radius: 1 }))).toBeGreaterThan(0);
  });

  it('gives a regular hexagon of radius 1 the area 3 sqrt(3) / 2', () => {
    // Geometry: a regular hexagon is six equilateral triangles of side r.
    expect(polygonArea(shapePolygon({ kind: 'regularPolygon', sides: 6, radius: 1 }))).toBeCloseTo((3 * Math.sqrt(3)) / 2, 12);
  });
});

describe('placing shapes', () => {
  it('turns a 2 x 4 rectangle a quarter turn and moves it to (10, 5)', () => {
    const placement = { center: { x: 10, y: 5 }, rotation: 90 };
    expect(shapeBounds({ kind: 'rectangle', width: 2, height: 4 }, placement)).toEqual({ x: 8, y: 4, w: 4, h: 2 });
    const ring = shapePlacedPolygon({ kind: 'rectangle', width: 2, height: 4 }, placement);
    expect(polygonArea(ring)).toBe(8);
  });
});

describe('shapeExactContour', () => {
  it('keeps circles and ovals as true curves for the cut file', () => {
    expect(shapeExactContour({ kind: 'circle', radius: 2 }, { center: { x: 5, y: 6 }, rotation: 0 })).toEqual({ kind: 'circle', center: { x: 5, y: 6 }, radius: 2 });
    expect(shapeExactContour({ kind: 'oval', width: 6, height: 4 }, { center: { x: 5, y: 6 }, rotation: 30 })).toEqual({
      kind: 'ellipse', center: { x: 5, y: 6 }, radiusX: 3, radiusY: 2, rotation: 30,
    });
  });

  it('draws a rounded rectangle as four quarter arcs joined by four lines', () => {
    const contour = shapeExactContour({ kind: 'roundedRectangle', width: 6, height: 4, cornerRadius: 1 }, { center: { x: 0, y: 0 }, rotation: 0 });
    if (contour.kind !== 'path') throw new Error('expected a path');
    const arcs = contour.segments.filter((s) => s.kind === 'arc');
    const lines = contour.segments.filter((s) => s.kind === 'line');
    expect(arcs).toHaveLength(4);
    expect(lines).toHaveLength(4);
    expect(arcs[0]).toEqual({ kind: 'arc', center: { x: 2, y: -1 }, radius: 1, startAngle: -90, endAngle: 0 });
    const top = lines[3];
    if (top?.kind !== 'line') throw new Error('expected a line');
    expect(top.from.x).toBeCloseTo(-2, 12);
    expect(top.from.y).toBeCloseTo(-2, 12);
    expect(top.to.x).toBeCloseTo(2, 12);
  });
});
