import { describe, expect, it } from 'vitest';
import { polygonArea } from '../../geometry';
import { editOutline, nearestEdge, smoothStretch, startEditing } from './outlineEdits';

const square = [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }];

describe('editing a traced outline', () => {
  it('moves, adds and deletes nodes, and undoes and redoes each step', () => {
    let s = startEditing(square);
    s = editOutline(s, { type: 'moveNode', index: 2, to: { x: 5, y: 5 } });
    s = editOutline(s, { type: 'addNode', after: 0, at: { x: 2, y: -1 } });
    expect(s.points).toEqual([{ x: 0, y: 0 }, { x: 2, y: -1 }, { x: 4, y: 0 }, { x: 5, y: 5 }, { x: 0, y: 4 }]);
    s = editOutline(s, { type: 'deleteNode', index: 1 });
    expect(s.points).toEqual([{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 5, y: 5 }, { x: 0, y: 4 }]);
    s = editOutline(editOutline(s, { type: 'undo' }), { type: 'undo' });
    expect(s.points).toEqual([{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 5, y: 5 }, { x: 0, y: 4 }]);
    s = editOutline(s, { type: 'redo' });
    expect(s.points).toHaveLength(5);
  });

  it('records a whole drag as one step', () => {
    let s = startEditing(square);
    s = editOutline(s, { type: 'moveAll', dx: 1, dy: 0 });
    s = editOutline(s, { type: 'moveAll', dx: 1, dy: 0, continuing: true });
    s = editOutline(s, { type: 'moveAll', dx: 0, dy: 2, continuing: true });
    expect(s.points[0]).toEqual({ x: 2, y: 2 });
    // Moving the whole outline keeps its area (a translation).
    expect(polygonArea(s.points)).toBeCloseTo(16, 12);
    expect(editOutline(s, { type: 'undo' }).points).toEqual(square);
  });

  it('never leaves fewer than three nodes, and resets to the automatic trace', () => {
    let s = startEditing([{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 0, y: 1 }]);
    s = editOutline(s, { type: 'deleteNode', index: 0 });
    expect(s.points).toHaveLength(3);
    s = editOutline(editOutline(s, { type: 'moveNode', index: 1, to: { x: 9, y: 9 } }), { type: 'reset' });
    expect(s.points).toEqual(s.automatic);
  });

  it('smooths a spike in a stretch towards its neighbours and leaves far nodes alone', () => {
    const ring = Array.from({ length: 12 }, (_, i) => ({ x: i, y: 0 })).concat(Array.from({ length: 12 }, (_, i) => ({ x: 11 - i, y: 5 })));
    ring[5] = { x: 5, y: 2 };
    const smoothed = smoothStretch(ring, 5, 2);
    expect(smoothed[5]!.y).toBeCloseTo(1, 12);
    expect(smoothed[9]).toEqual(ring[9]);
  });

  it('finds the edge nearest a tap', () => {
    const hit = nearestEdge(square, { x: 4.2, y: 1 });
    expect(hit.after).toBe(1);
    expect(hit.point).toEqual({ x: 4, y: 1 });
    expect(hit.distance).toBeCloseTo(0.2, 12);
  });
});
