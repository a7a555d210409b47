/**
 * Text pieces the writers share. Numbers are rounded to a millionth of an
 * inch or a ten-thousandth of a millimetre, far below what a blade can show,
 * and never written in exponent form, which some cutters cannot read.
 */

const DECIMALS = { in: 6, mm: 4 } as const;

/** Past this no cut file makes sense and `toFixed` would switch to exponent form; the layout schema keeps far below it. */
const LARGEST_WRITTEN = 1e9;

export function numberText(value: number, units: 'in' | 'mm'): string {
  if (!(Math.abs(value) < LARGEST_WRITTEN)) throw new RangeError(`A cut file cannot hold the number ${value}`);
  const text = value.toFixed(DECIMALS[units]).replace(/\.?0+$/, '');
  return text === '-0' ? '0' : text;
}

/** Rounds like numberText but keeps a number, for writers that format numbers themselves. */
export function numberRounded(value: number, units: 'in' | 'mm'): number {
  return Number(numberText(value, units));
}

const MARKUP: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes text for HTML or XML content and attribute values. */
export function markupEscape(text: string): string {
  return text.replace(/[&<>"']/g, (c) => MARKUP[c]!);
}
