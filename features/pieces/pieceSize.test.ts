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

  it('a size written back into the form reads as the same length whatever a bare number means', () => {
    for (const value of [8, 4.125, 22.5, 30.25, 0.0625]) {
      expect(parseLength(sideInputText(value), 'in')).toEqual({ ok: true, value });
      expect(parseLength(sideInputText(value), 'mm')).toEqual({ ok: true, value });
    }
  });

  it('a millimetre shop edits sizes in millimetres to a tenth', () => {
    // 8 1/2 in = 215.9 mm (NIST Handbook 44, Appendix C: 1 in = 25.4 mm exactly).
    expect(sideInputText(8.5, '0.5mm')).toBe('215.9 mm');
    const parsed = parseLength(sideInputText(8.5, '0.5mm'), 'mm');
    expect(parsed.ok && parsed.value).toBeCloseTo(8.5, 12);
  });
});
