import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { centsFromText, moneyText, paymentStateOf } from './schema';

// US dollars have two decimal places (ISO 4217, minor unit 2), so one dollar is 100 cents.

describe('amounts typed at the counter', () => {
  it('reads what a person types as whole cents, without floating-point slips', () => {
    expect(centsFromText('120')).toBe(12_000);
    expect(centsFromText('120.5')).toBe(12_050);
    expect(centsFromText('0.29')).toBe(29); // 0.29 * 100 is 28.999999999999996 in binary floating point
    expect(centsFromText('1,250.00')).toBe(125_000);
    expect(centsFromText(' $ 80 ')).toBe(8_000);
    expect(centsFromText('.75')).toBe(75);
  });

  it('refuses what is not an amount', () => {
    for (const bad of ['', '.', 'abc', '12.345', '-5', '1e3', '1,25', '12..5', '1.2.3']) expect(centsFromText(bad)).toBeNull();
  });

  it('reads back every amount it writes (Intl.NumberFormat as the reference writer)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 100_000_000 }), (cents) => {
        const written = moneyText(cents, 'usd');
        expect(written).toBe(new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(cents / 100));
        expect(centsFromText(written)).toBe(cents);
      }),
    );
  });
});

describe("a job's money state", () => {
  it('is due with nothing paid, part paid in between, paid at or past the total', () => {
    expect(paymentStateOf(47_952, 0)).toBe('due');
    expect(paymentStateOf(47_952, 23_976)).toBe('part_paid');
    expect(paymentStateOf(47_952, 47_951)).toBe('part_paid');
    expect(paymentStateOf(47_952, 47_952)).toBe('paid');
    expect(paymentStateOf(47_952, 50_000)).toBe('paid');
  });
});
