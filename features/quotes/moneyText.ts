/** The largest amount a field takes, as the `cents` schema: 1 000 000.00. */
export const MAX_MONEY_CENTS = 100_000_000;

export type MoneyParse = { ok: true; cents: number } | { ok: false; message: string };

/**
 * An amount typed by a person ("12.5", "1,250.00", "$38") into whole cents, without
 * floating-point money: the digits are read as text. Negative amounts are refused.
 */
export function parseMoney(text: string): MoneyParse {
  const cleaned = text.trim().replace(/^[$€£]\s*/, '').replace(/,(?=\d{3}(\D|$))/g, '');
  if (cleaned === '') return { ok: false, message: 'Type an amount' };
  if (cleaned.startsWith('-')) return { ok: false, message: 'Amounts cannot be negative' };
  const match = /^(\d{1,9})(?:\.(\d{0,2}))?$/.exec(cleaned) ?? /^()\.(\d{1,2})$/.exec(cleaned);
  if (!match) return { ok: false, message: 'Type an amount such as 12.50 (at most two decimals)' };
  const whole = match[1] === '' ? 0 : Number(match[1]);
  const fraction = Number((match[2] ?? '').padEnd(2, '0'));
  const cents = whole * 100 + fraction;
  if (cents > MAX_MONEY_CENTS) return { ok: false, message: 'Amounts are at most 1 000 000.00' };
  return { ok: true, cents };
}

/** A percentage typed by a person: "8.25", "8.25 %". */
export function parsePercent(text: string, max: number): { ok: true; value: number } | { ok: false; message: string } {
  const cleaned = text.trim().replace(/\s*%$/, '');
  if (!/^\d{1,3}(\.\d{1,3})?$/.test(cleaned)) return { ok: false, message: 'Type a percentage such as 8.25' };
  const value = Number(cleaned);
  if (value > max) return { ok: false, message: `At most ${max} %` };
  return { ok: true, value };
}
