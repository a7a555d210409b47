import { describe, expect, it } from 'vitest';
import type { Layout, Mat } from '../../geometry';
import { freshOpeningId, newOpening, openingForPieceOf, outlineFromText } from './newOpenings';

const sheet = { width: 32, height: 40 };
const mat = (id: string): Mat => ({ id, name: id, color: '#1D2B4A', coreColor: '#FFFFFF', ply: 4, thickness: 0.055, bevelAngle: 45, sheet });
const layout: Layout = {
  schemaVersion: 2,
  outer: { width: 30, height: 36 },
  mats: [mat('top'), mat('lower')],
  mountingBoard: { color: '#FFFFFF', cut: false },
  openings: [],
  checkSettings: { bridgeWarning: 0.5, bridgeError: 0.25, minimumBand: 1 / 16, minimumOverlap: 1 / 8, rabbetAllowance: 1 / 8 },
};
const piece = { id: 'p1', label: 'Print', widthIn: 8, heightIn: 10 };

describe('new windows', () => {
  it('a new circle is 4 in across, centred on the layout and cut in the top mat only', () => {
    const circle = newOpening(layout, 'circle');
    expect(circle).toMatchObject({ id: 'circle-1', shape: { kind: 'circle', radius: 2 }, center: { x: 15, y: 18 }, depth: 1, reveals: [] });
  });

  it('fresh ids skip the ones already taken', () => {
    const taken: Layout = { ...layout, openings: [{ ...newOpening(layout, 'oval'), id: 'oval-1' }] };
    expect(freshOpeningId(taken, 'oval')).toBe('oval-2');
    expect(freshOpeningId(taken, 'oval', new Set(['oval-2']))).toBe('oval-3');
  });

  it('a photo window overlaps an 8 x 10 print by 1/4 in all round and goes through two mats', () => {
    const w = openingForPieceOf(layout, { ...piece, kind: 'photo' }, 0.25);
    expect(w).toMatchObject({ shape: { kind: 'rectangle', width: 7.5, height: 9.5 }, clearance: -0.25, depth: 2, reveals: [0.25], pieceSize: { width: 8, height: 10 }, pieceId: 'p1' });
  });

  it('a round patch gets a circle 1/4 in smaller across than the patch', () => {
    const w = openingForPieceOf(layout, { ...piece, kind: 'patch', widthIn: 4, heightIn: 4 }, 0.25);
    expect(w.shape).toEqual({ kind: 'circle', radius: 1.875 });
    expect(w.depth).toBe(1);
  });

  it('a garment window leaves 1/4 in of room around the garment', () => {
    const w = openingForPieceOf(layout, { ...piece, kind: 'garment', widthIn: 16, heightIn: 19 }, 0.25);
    expect(w.shape).toEqual({ kind: 'rectangle', width: 16.5, height: 19.5 });
    expect(w.clearance).toBe(0.25);
  });
});

describe('pasted outlines', () => {
  it('points are moved so their box is centred on the window', () => {
    const read = outlineFromText('{"points": [{"x": 2, "y": 4}, {"x": 6, "y": 4}, {"x": 6, "y": 10}]}');
    expect(read).toEqual({ ok: true, points: [{ x: -2, y: -3 }, { x: 2, y: -3 }, { x: 2, y: 3 }] });
  });

  it('a list of number pairs is read too', () => {
    const read = outlineFromText('[[0, 0], [4, 0], [4, 2], [0, 2]]');
    expect(read.ok && read.points).toEqual([{ x: -2, y: -1 }, { x: 2, y: -1 }, { x: 2, y: 1 }, { x: -2, y: 1 }]);
  });

  it('text that is not JSON is refused with words saying what to paste', () => {
    expect(outlineFromText('0,0 4,0 4,2')).toEqual({ ok: false, error: expect.stringMatching(/not readable JSON/) });
  });

  it('a point that is not a pair of numbers is named by its place in the list', () => {
    expect(outlineFromText('[[0, 0], [4, "x"], [4, 2]]')).toEqual({ ok: false, error: 'Point 2 is not a pair of numbers (inches).' });
  });

  it('fewer than three points, or points on one line, are refused', () => {
    expect(outlineFromText('[[0, 0], [4, 0]]')).toEqual({ ok: false, error: 'An outline needs at least 3 points; this one has 2.' });
    expect(outlineFromText('[[0, 0], [4, 0], [8, 0]]').ok).toBe(false);
  });
});
