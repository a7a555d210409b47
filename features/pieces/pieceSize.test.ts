import { describe, expect, it } from 'vitest';
import { parseLength } from '../../geometry/units';
import { pieceSizeText, sideInputText } from './pieceSize';

describe('piece size text', () => {
  it('shows whole and fractional inches without inch marks, ending in "in"', () => {
    expect(pieceSizeText(8, 10)).toBe('8 x 10 in');
    expect(pieceSizeText(4.125, 5)).toBe('4 1/8 x 5 in');
    expect(pieceSizeText(3.3125, 0.5)).toBe('3 5/16 x 1/2 in');
  });

  it('shows millimetres once at the end when the shop works in millimetres', () => {
    expect(pieceSizeText(216 / 25.4, 279 / 25.4, '0.5mm')).toBe('216 x 279 mm');
  });

  it('a size written back into the form reads as the same length', () => {
    for (const value of [8, 4.125, 22.5, 30.25, 0.0625]) {
      const parsed = parseLength(sideInputText(value), 'in');
      expect(parsed).toEqual({ ok: true, value });
    }
  });
});
