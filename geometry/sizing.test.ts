import { describe, expect, it } from 'vitest';
import { mouldingLength, openingForPiece, outerFromRabbet, piecePreset, unitedInches } from './sizing';

describe('sizing', () => {
  it('opens an 8 x 10 photo overlapped 1/4 in per side to 7.5 x 9.5', () => {
    // Common practice: a mat overlaps a print 1/8-1/4 in per side.
    expect(openingForPiece({ width: 8, height: 10 }, 0.25)).toEqual({ width: 7.5, height: 9.5 });
  });

  it('cuts the package 1/8 in under the rabbet', () => {
    // Common practice: rabbet allowance 1/8 in.
    expect(outerFromRabbet({ width: 16, height: 20 })).toEqual({ width: 15.875, height: 19.875 });
  });

  it('orders moulding as the perimeter plus eight widths', () => {
    // Supplier worked examples; common practice: 16 x 20 with 1.5 in moulding = 72 + 12.
    expect(mouldingLength({ width: 16, height: 20 }, 1.5)).toBe(84);
  });

  it('counts an 8 x 10 as 18 united inches', () => {
    // Common practice: united inches = width + height.
    expect(unitedInches({ width: 8, height: 10 })).toBe(18);
  });

  it('knows the paper and photo sizes', () => {
    // ISO 216: A4 is 210 x 297 mm; NIST Handbook 44: 25.4 mm to the inch.
    expect(piecePreset('iso-a4')?.size).toEqual({ width: 210 / 25.4, height: 297 / 25.4 });
    expect(piecePreset('iso-a3')?.size).toEqual({ width: 297 / 25.4, height: 420 / 25.4 });
    expect(piecePreset('iso-a5')?.size).toEqual({ width: 148 / 25.4, height: 210 / 25.4 });
    // ANSI/ASME Y14.1: Letter 8.5 x 11, Legal 8.5 x 14, Tabloid 11 x 17 in.
    expect(piecePreset('ansi-letter')?.size).toEqual({ width: 8.5, height: 11 });
    expect(piecePreset('ansi-legal')?.size).toEqual({ width: 8.5, height: 14 });
    expect(piecePreset('ansi-tabloid')?.size).toEqual({ width: 11, height: 17 });
    // Common practice: nominal photo print sizes.
    expect(piecePreset('photo-8x10')?.size).toEqual({ width: 8, height: 10 });
    expect(piecePreset('photo-4x6')?.size).toEqual({ width: 4, height: 6 });
  });
});
