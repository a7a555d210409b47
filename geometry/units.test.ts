import { describe, expect, it } from 'vitest';
import { EPSILON_IN, formatLength, inchesFromMillimetres, isCloseTo, lengthUnitOf, millimetresFromInches, parseLength, roundToStep } from './units';

function valueOf(text: string, unit: 'in' | 'mm' | 'cm' = 'in'): number {
  const result = parseLength(text, unit);
  if (!result.ok) throw new Error(result.error);
  return result.value;
}

describe('parseLength', () => {
  it.each([
    ['3 1/4', 3.25],
    ['3-1/4"', 3.25],
    ['3.25', 3.25],
    ['3.25 in', 3.25],
    ['1/2', 0.5],
    ['-1/4', -0.25],
    ['7 1/2 inches', 7.5],
    ['.75', 0.75],
  ])('reads %s as %f in', (text, inches) => {
    expect(valueOf(text)).toBeCloseTo(inches, 12);
  });

  it('reads millimetres and centimetres at 25.4 mm to the inch', () => {
    // NIST Handbook 44, Appendix C: 1 in = 25.4 mm exactly.
    expect(valueOf('82.5mm')).toBeCloseTo(82.5 / 25.4, 12);
    expect(valueOf('8.25 cm')).toBeCloseTo(82.5 / 25.4, 12);
    expect(valueOf('25.4 mm')).toBeCloseTo(1, 12);
  });

  it('uses the default unit when none is typed', () => {
    // NIST Handbook 44, Appendix C: 1 in = 25.4 mm exactly.
    expect(valueOf('210', 'mm')).toBeCloseTo(210 / 25.4, 12);
    expect(valueOf('3 1/4', 'in')).toBe(3.25);
  });

  it('reads Unicode vulgar fractions as the fraction they name', () => {
    // The Unicode Standard, Number Forms block (U+2150-U+215E) and Latin-1 (U+00BC-U+00BE):
    // each character's numeric value is the fraction written on it.
    const named: [string, number][] = [
      ['\u00BD', 1 / 2], ['\u00BC', 1 / 4], ['\u00BE', 3 / 4], ['\u2153', 1 / 3], ['\u2154', 2 / 3], ['\u2155', 1 / 5],
      ['\u2156', 2 / 5], ['\u2157', 3 / 5], ['\u2158', 4 / 5], ['\u2159', 1 / 6], ['\u215A', 5 / 6], ['\u2150', 1 / 7],
      ['\u215B', 1 / 8], ['\u215C', 3 / 8], ['\u215D', 5 / 8], ['\u215E', 7 / 8], ['\u2151', 1 / 9], ['\u2152', 1 / 10],
    ];
    for (const [character, fraction] of named) {
      expect(valueOf(`4${character}`)).toBeCloseTo(4 + fraction, 12);
      expect(valueOf(`${character}"`)).toBeCloseTo(fraction, 12);
    }
    expect(valueOf('4 \u00BD in')).toBe(4.5);
    expect(valueOf('-\u00BC')).toBe(-0.25);
    // U+2044 FRACTION SLASH between digits reads like the solidus.
    expect(valueOf('3\u20444')).toBe(0.75);
    // 4 1/2 in = 114.3 mm (NIST Handbook 44, Appendix C: 1 in = 25.4 mm exactly).
    expect(valueOf('4\u00BD', 'mm')).toBeCloseTo(4.5 / 25.4, 12);
  });

  it('refuses numbers in computer notation rather than reading "e3" as a unit', () => {
    for (const text of ['1e3', '1E3', '2.5e-1 in', '1e3mm', '.5e2']) {
      const result = parseLength(text, 'in');
      expect(result.ok).toBe(false);
      if (!result.ok) {
        expect(result.error).toContain('computer notation');
        expect(result.error).not.toContain('unit');
      }
    }
  });

  it('a bare number is in the unit the shop works in', () => {
    expect(lengthUnitOf('0.5mm')).toBe('mm');
    expect(lengthUnitOf('1/16')).toBe('in');
    // 83 mm = 83 / 25.4 in (NIST Handbook 44, Appendix C), not 83 in.
    expect(valueOf('83', lengthUnitOf('0.5mm'))).toBeCloseTo(83 / 25.4, 12);
    expect(valueOf('3 1/4', lengthUnitOf('1/8'))).toBe(3.25);
    // A typed unit always wins over the shop's.
    expect(valueOf('2"', lengthUnitOf('0.5mm'))).toBe(2);
  });

  it('names what it could not read', () => {
    const unknownUnit = parseLength('3 ft', 'in');
    expect(unknownUnit).toEqual({ ok: false, error: expect.stringContaining('"ft"') });
    const zero = parseLength('1/0', 'in');
    expect(zero).toEqual({ ok: false, error: expect.stringContaining('zero bottom number') });
    const garbage = parseLength('about three', 'in');
    expect(garbage).toEqual({ ok: false, error: expect.stringContaining('"about three"') });
    expect(parseLength('  ', 'in').ok).toBe(false);
  });
});

describe('formatLength', () => {
  it.each([
    [7.5, '1/8', '7 1/2"'],
    [3.3125, '1/16', '3 5/16"'],
    [3.3, '1/16', '3 5/16"'],
    [8, '1/32', '8"'],
    [-0.25, '1/16', '-1/4"'],
    [0.0625, '1/8', '1/8"'],
  ] as const)('shows %f in to %s as %s', (value, rounding, text) => {
    expect(formatLength(value, rounding)).toBe(text);
  });

  it('shows millimetres to the half millimetre', () => {
    // NIST Handbook 44: 1 in = 25.4 mm, so 3.248 in = 82.4992 mm, shown as 82.5 mm.
    expect(formatLength(3.248, '0.5mm')).toBe('82.5 mm');
    // ISO 216: A4 is 210 mm wide.
    expect(formatLength(210 / 25.4, '0.5mm')).toBe('210 mm');
  });
});

describe('conversions and tolerance', () => {
  it('converts both ways at exactly 25.4 mm per inch', () => {
    // NIST Handbook 44, Appendix C.
    expect(millimetresFromInches(1)).toBe(25.4);
    expect(inchesFromMillimetres(254)).toBe(10);
  });

  it('rounds to a step half away from zero', () => {
    expect(roundToStep(0.03125, 1 / 16)).toBe(0.0625);
    expect(roundToStep(-0.03125, 1 / 16)).toBe(-0.0625);
    expect(roundToStep(2.96, 0.125)).toBe(3);
    expect(() => roundToStep(1, 0)).toThrow(/positive step/);
  });

  it('compares lengths within one clipper unit', () => {
    expect(EPSILON_IN).toBe(0.0001);
    expect(isCloseTo(1, 1 + 0.00005)).toBe(true);
    expect(isCloseTo(1, 1.001)).toBe(false);
  });
});
