import { describe, expect, it } from 'vitest';
import { centsText } from './schema';
import { parseMoney, parsePercent } from './moneyText';

describe('amounts typed by a person', () => {
  it('reads dollars and cents as text, never through floating point', () => {
    // 0.1 + 0.2 style slips: 19.99 must be 1999 cents exactly, 1,250.5 is 125050.
    expect(parseMoney('19.99')).toEqual({ ok: true, cents: 1999 });
    expect(parseMoney('$1,250.5')).toEqual({ ok: true, cents: 125050 });
    expect(parseMoney('38')).toEqual({ ok: true, cents: 3800 });
    expect(parseMoney('.5')).toEqual({ ok: true, cents: 50 });
  });

  it('refuses negative, three-decimal and oversized amounts in words', () => {
    expect(parseMoney('-5')).toEqual({ ok: false, message: 'Amounts cannot be negative' });
    expect(parseMoney('1.005').ok).toBe(false);
    expect(parseMoney('1000000.01')).toEqual({ ok: false, message: 'Amounts are at most 1 000 000.00' });
    expect(parseMoney('twelve').ok).toBe(false);
  });

  it('shows cents back as the same text it reads', () => {
    for (const cents of [0, 1, 99, 100, 1999, 125050]) expect(parseMoney(centsText(cents))).toEqual({ ok: true, cents });
  });

  it('reads percentages up to a limit', () => {
    expect(parsePercent('8.25 %', 50)).toEqual({ ok: true, value: 8.25 });
    expect(parsePercent('51', 50)).toEqual({ ok: false, message: 'At most 50 %' });
    expect(parsePercent('-1', 50).ok).toBe(false);
  });
});
