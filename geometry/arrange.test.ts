import { describe, expect, it } from 'vitest';
import type { Opening } from './layoutSchema';
import { lengthSnap, openingBounds, openingsAlign, openingsCentre, openingsDistribute, openingsMirror, openingSnap } from './arrange';

function rect(id: string, x: number, y: number, width: number, height: number): Opening {
  return { id, shape: { kind: 'rectangle', width, height }, center: { x, y }, rotation: 0, depth: 1, clearance: 0, reveals: [] };
}

describe('arranging openings', () => {
  it('centres a group and weights the bottom border', () => {
    // Common practice: on a 3 in border the bottom is about 1/2 in wider.
    const [photo] = openingsCentre([rect('photo', 2, 2, 8, 10)], { width: 14, height: 16.5 }, 0.5);
    const box = openingBounds(photo!);
    expect(box.x).toBe(3);
    expect(box.y).toBe(3);
    expect(16.5 - (box.y + box.h)).toBe(3.5);
  });

  it('aligns tops and centres', () => {
    const openings = [rect('a', 3, 5, 2, 2), rect('b', 8, 9, 2, 4)];
    const top = openingsAlign(openings, ['a', 'b'], 'top');
    expect(top.map((o) => openingBounds(o).y)).toEqual([4, 4]);
    const middle = openingsAlign(openings, ['a', 'b'], 'centerX');
    expect(middle.map((o) => o.center.x)).toEqual([5.5, 5.5]);
  });

  it('spaces three openings with equal gaps', () => {
    const openings = [rect('a', 1, 5, 2, 2), rect('b', 4, 5, 2, 2), rect('c', 11, 5, 2, 2)];
    const spaced = openingsDistribute(openings, ['a', 'b', 'c'], 'horizontal');
    expect(spaced.map((o) => o.center.x)).toEqual([1, 6, 11]);
  });

  it('mirrors an outline about the vertical centre line', () => {
    const left: Opening = { ...rect('left', 4, 6, 1, 1), rotation: 15, shape: { kind: 'polygon', points: [{ x: -1, y: 0 }, { x: 1, y: -1 }, { x: 1, y: 1 }] } };
    const [, right] = openingsMirror([left, rect('right', 0, 0, 1, 1)], 'left', 'right', { width: 20, height: 12 });
    expect(right?.center).toEqual({ x: 16, y: 6 });
    expect(right?.rotation).toBe(-15);
    expect(right?.shape).toEqual({ kind: 'polygon', points: [{ x: 1, y: 0 }, { x: -1, y: -1 }, { x: -1, y: 1 }] });
  });

  it('snaps to the shop fraction', () => {
    expect(lengthSnap(3.3, 1 / 16)).toBe(3.3125);
    expect(openingSnap(rect('a', 1.03, 2.97, 1, 1), 1 / 8).center).toEqual({ x: 1, y: 3 });
  });
});
