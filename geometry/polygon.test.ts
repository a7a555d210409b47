import { describe, expect, it } from 'vitest';
import { polygonArea, polygonBounds, polygonContainsPoint, polygonPerimeter, polygonPointDistance, polygonSignedArea, polygonWinding, polygonWithWinding, ringsNearestPair } from './polygon';
import { polygonIsSimple, polygonSelfIntersections } from './selfIntersection';

const square = [{ x: 3, y: 0 }, { x: 5, y: 0 }, { x: 5, y: 5 }, { x: 3, y: 5 }];

describe('polygon measures', () => {
  it('gives a 2 x 5 rectangle area 10 and perimeter 14', () => {
    expect(polygonArea(square)).toBe(10);
    expect(polygonPerimeter(square)).toBe(14);
    expect(polygonBounds(square)).toEqual({ x: 3, y: 0, w: 2, h: 5 });
  });

  it('calls a ring running right along the top clockwise on screen, with positive area (y down)', () => {
    expect(polygonSignedArea(square)).toBe(10);
    expect(polygonWinding(square)).toBe('clockwise');
    const reversed = polygonWithWinding(square, 'counterclockwise');
    expect(polygonSignedArea(reversed)).toBe(-10);
  });

  it('measures the distance from a point to a polygon as the shapely documentation does', () => {
    // Shapely documentation, object.distance: Point(0, 0) to the square (3,0)-(5,5) is 3.0.
    expect(polygonPointDistance(square, { x: 0, y: 0 })).toBe(3);
    expect(polygonPointDistance(square, { x: 4, y: 2 })).toBe(0);
    expect(polygonContainsPoint(square, { x: 4, y: 2 })).toBe(true);
    expect(polygonContainsPoint(square, { x: 6, y: 2 })).toBe(false);
  });

  it('finds the middle of the narrow stretch between two parallel edges', () => {
    const left = [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 1, y: 4 }, { x: 0, y: 4 }];
    const right = [{ x: 1.5, y: 0 }, { x: 2.5, y: 0 }, { x: 2.5, y: 4 }, { x: 1.5, y: 4 }];
    const nearest = ringsNearestPair([left], [right]);
    expect(nearest?.distance).toBe(0.5);
    expect(nearest?.middle).toEqual({ x: 1.25, y: 2 });
  });
});

describe('polygonSelfIntersections', () => {
  it('finds where a figure eight crosses itself', () => {
    // The segments (-4,-2)-(2,1.5) and (2,-1.5)-(-4,2) meet at (-4/7, 0) (solving the two line equations).
    const eight = [{ x: -4, y: -2 }, { x: 2, y: 1.5 }, { x: 2, y: -1.5 }, { x: -4, y: 2 }];
    const [crossing] = polygonSelfIntersections(eight);
    expect(crossing?.x).toBeCloseTo(-4 / 7, 12);
    expect(crossing?.y).toBeCloseTo(0, 12);
  });

  it('passes a simple ring, including a 20 000 point circle', () => {
    const circle = Array.from({ length: 20_000 }, (_, i) => ({ x: Math.cos((2 * Math.PI * i) / 20_000), y: Math.sin((2 * Math.PI * i) / 20_000) }));
    expect(polygonIsSimple(square)).toBe(true);
    expect(polygonIsSimple(circle)).toBe(true);
  });

  it('flags an edge that doubles back along itself', () => {
    const folded = [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 3 }];
    expect(polygonIsSimple(folded)).toBe(false);
  });
});
