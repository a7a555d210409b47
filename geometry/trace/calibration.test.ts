import { describe, expect, it } from 'vitest';
import { orientedSize, quadInReadingOrder, quadProblem, referenceRectangles } from './calibration';
import { quadFromRing } from './dominantQuad';
import type { Quad } from './homography';

describe('reference rectangles', () => {
  it('use the published sizes', () => {
    const a4 = referenceRectangles.find((r) => r.id === 'a4')!;
    // ISO 216: A4 is 210 x 297 mm; 1 in = 25.4 mm (NIST Handbook 44, Appendix C).
    expect(a4.widthIn * 25.4).toBeCloseTo(210, 9);
    expect(a4.heightIn * 25.4).toBeCloseTo(297, 9);
    // ANSI/ASME Y14.1: Letter is 8.5 x 11 in.
    const letter = referenceRectangles.find((r) => r.id === 'letter')!;
    expect([letter.widthIn, letter.heightIn]).toEqual([8.5, 11]);
  });
});

describe('marked corners', () => {
  const square: Quad = [{ x: 100, y: 100 }, { x: 500, y: 120 }, { x: 520, y: 600 }, { x: 90, y: 580 }];
  it('accepts a convex quadrilateral in either direction', () => {
    expect(quadProblem(square)).toBeNull();
    expect(quadProblem([...square].reverse())).toBeNull();
  });
  it('names corners whose sides cross', () => {
    expect(quadProblem([square[0], square[2], square[1], square[3]])).toBe('crossing');
  });
  it('names three corners on a line', () => {
    expect(quadProblem([{ x: 0, y: 0 }, { x: 200, y: 0 }, { x: 400, y: 0 }, { x: 200, y: 300 }])).toBe('collinear');
  });
  it('names a concave shape', () => {
    expect(quadProblem([{ x: 0, y: 0 }, { x: 400, y: 0 }, { x: 100, y: 100 }, { x: 0, y: 400 }])).toBe('not-convex');
  });
  it('puts shuffled corners in reading order and pairs the long side with the long marks', () => {
    const ordered = quadInReadingOrder([square[2], square[0], square[3], square[1]]);
    expect(ordered).toEqual(square);
    expect(orientedSize(ordered, 11, 8.5)).toEqual({ widthIn: 8.5, heightIn: 11 });
  });
});

describe('dominant quadrilateral of a ring', () => {
  it('finds the corners of a rectangle outline traced with many points', () => {
    const ring = [];
    const corners = [{ x: 10, y: 20 }, { x: 310, y: 40 }, { x: 300, y: 420 }, { x: 0, y: 400 }];
    for (let i = 0; i < 4; i++) {
      const a = corners[i]!;
      const b = corners[(i + 1) % 4]!;
      for (let k = 0; k < 50; k++) ring.push({ x: a.x + ((b.x - a.x) * k) / 50, y: a.y + ((b.y - a.y) * k) / 50 });
    }
    const found = quadFromRing(ring)!;
    const sorted = (q: readonly { x: number; y: number }[]) => [...q].map((p) => `${Math.round(p.x)},${Math.round(p.y)}`).sort();
    expect(sorted(found.quad)).toEqual(sorted(corners));
  });
  it('does not call a circle four-sided', () => {
    const ring = Array.from({ length: 200 }, (_, i) => ({ x: 100 * Math.cos((i / 200) * 2 * Math.PI), y: 100 * Math.sin((i / 200) * 2 * Math.PI) }));
    expect(quadFromRing(ring)).toBeNull();
  });
});
