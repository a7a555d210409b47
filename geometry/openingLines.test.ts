import { describe, expect, it } from 'vitest';
import type { Mat, Opening } from './layoutSchema';
import { matBevelRun, openingLines, shapeOffsetExact } from './openingLines';
import type { Box } from './polygon';
import { polygonArea, polygonBounds } from './polygon';

function fourPly(id: string): Mat {
  // Common practice: 4-ply mat board is about 0.050-0.060 in thick; 0.055 in here.
  return { id, name: id, color: '#1b2a4a', coreColor: '#ffffff', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } };
}

function expectBox(actual: Box, expected: Box): void {
  for (const key of ['x', 'y', 'w', 'h'] as const) expect(actual[key]).toBeCloseTo(expected[key], 9);
}

const mats = [fourPly('top'), fourPly('middle'), fourPly('bottom')];

function opening(partial: Partial<Opening> & Pick<Opening, 'shape'>): Opening {
  return { id: 'o', center: { x: 10, y: 10 }, rotation: 0, depth: 1, clearance: 0, reveals: [], ...partial };
}

describe('bevel geometry', () => {
  it('gives a 45 degree bevel a horizontal run equal to the thickness', () => {
    // Trigonometry: run = t tan(45 degrees) = t.
    expect(matBevelRun(fourPly('a'))).toBeCloseTo(0.055, 12);
  });

  it('gives a 60 degree bevel a run of t sqrt(3) and a slanted face of t / cos(a)', () => {
    // Trigonometry: tan 60 = sqrt(3); the slanted face is t / cos(a), 1.414 t at 45 degrees.
    const t = 0.055;
    expect(matBevelRun({ thickness: t, bevelAngle: 60 })).toBeCloseTo(t * Math.sqrt(3), 12);
    const run = matBevelRun({ thickness: t, bevelAngle: 45 });
    expect(Math.hypot(t, run)).toBeCloseTo(t / Math.cos(Math.PI / 4), 12);
    expect(Math.hypot(t, run) / t).toBeCloseTo(1.414, 3);
  });
});

describe('openingLines', () => {
  it('keeps a circle window a family of circles: sight r, face r + b, reveal added between face lines', () => {
    const lines = openingLines(opening({ shape: { kind: 'circle', radius: 2 }, depth: 2, reveals: [0.25] }), mats);
    const [top, lower] = lines.mats;
    // Construction (DESIGN 4): B2 = S, F2 = S + b2, F1 = F2 + r1, B1 = F1 - b1.
    expect(lower?.back.exact).toEqual({ kind: 'circle', radius: 2 });
    expect(lower?.face.exact).toEqual({ kind: 'circle', radius: 2.055 });
    expect(top?.face.exact).toEqual({ kind: 'circle', radius: 2.305 });
    expect(top?.back.exact).toEqual({ kind: 'circle', radius: 2.25 });
    const ring = top?.face.polygons[0] ?? [];
    for (const p of ring) expect(Math.hypot(p.x - 10, p.y - 10)).toBeCloseTo(2.305, 9);
  });

  it('keeps rectangles square-cornered: an 8 x 10 sight under two mats', () => {
    const lines = openingLines(opening({ shape: { kind: 'rectangle', width: 8, height: 10 }, depth: 2, reveals: [0.25] }), mats);
    expect(lines.mats[0]?.face.exact).toEqual({ kind: 'rectangle', width: 8 + 2 * (0.055 + 0.25), height: 10 + 2 * (0.055 + 0.25) });
    expectBox(polygonBounds(lines.mats[0]!.face.polygons[0]!), { x: 5.695, y: 4.695, w: 8.61, h: 10.61 });
  });

  it('shows a 1/4 in reveal under 4-ply as a band of about 0.195 in, and a 1/8 in reveal as about 1/16 in', () => {
    // Common practice (REFERENCES): band = reveal - bevel run; 0.25 - 0.055 = 0.195; 0.125 - 0.055 = 0.07, about 1/16 in.
    const quarter = openingLines(opening({ shape: { kind: 'circle', radius: 2 }, depth: 2, reveals: [0.25] }), mats);
    expect(quarter.mats[0]?.bandBelow).toBeCloseTo(0.195, 12);
    const eighth = openingLines(opening({ shape: { kind: 'circle', radius: 2 }, depth: 2, reveals: [0.125] }), mats);
    expect(eighth.mats[0]?.bandBelow).toBeCloseTo(0.07, 12);
    expect(Math.abs((eighth.mats[0]?.bandBelow ?? 0) - 1 / 16)).toBeLessThan(1 / 64);
  });

  it('grows a rounded rectangle into a rounded rectangle with a larger corner radius', () => {
    const lines = openingLines(opening({ shape: { kind: 'roundedRectangle', width: 6, height: 4, cornerRadius: 0.5 }, depth: 1 }), mats);
    const face = lines.mats[0]?.face.exact;
    if (face?.kind !== 'roundedRectangle') throw new Error('expected a rounded rectangle');
    expect(face.width).toBeCloseTo(6.11, 12);
    expect(face.height).toBeCloseTo(4.11, 12);
    expect(face.cornerRadius).toBeCloseTo(0.555, 12);
  });

  it('leaves ovals without a closed form but within the arc tolerance of the Steiner area', () => {
    const lines = openingLines(opening({ shape: { kind: 'oval', width: 6, height: 4 }, depth: 1 }), mats);
    const face = lines.mats[0]!.face;
    expect(face.exact).toBeNull();
    // Steiner formula: area of an ellipse grown by d is pi a b + P d + pi d^2; perimeter P by Ramanujan's first approximation (quoted from memory).
    const a = 3;
    const b = 2;
    const perimeter = Math.PI * (3 * (a + b) - Math.sqrt((3 * a + b) * (a + 3 * b)));
    const expected = Math.PI * a * b + perimeter * 0.055 + Math.PI * 0.055 ** 2;
    expect(Math.abs(polygonArea(face.polygons[0]!) - expected)).toBeLessThan(0.005 * (perimeter + 1));
  });

  it('turns lines with the opening', () => {
    const lines = openingLines(opening({ shape: { kind: 'rectangle', width: 2, height: 4 }, rotation: 90 }), mats);
    expectBox(polygonBounds(lines.mats[0]!.face.polygons[0]!), { x: 7.945, y: 8.945, w: 4.11, h: 2.11 });
  });
});

describe('shapeOffsetExact', () => {
  it('reports a circle shrunk past its radius as empty', () => {
    // Geometry: a circle of radius r offset inward by d >= r is empty.
    expect(shapeOffsetExact({ kind: 'circle', radius: 1 }, -1)).toBe('empty');
    expect(shapeOffsetExact({ kind: 'circle', radius: 1 }, -0.5)).toEqual({ kind: 'circle', radius: 0.5 });
  });

  it('sharpens a rounded corner once the shrink passes its radius', () => {
    expect(shapeOffsetExact({ kind: 'roundedRectangle', width: 4, height: 4, cornerRadius: 0.25 }, -0.5)).toEqual({
      kind: 'roundedRectangle', width: 3, height: 3, cornerRadius: 0,
    });
  });
});
