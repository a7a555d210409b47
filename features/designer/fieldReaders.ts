import { lengthUnitOf, parseLength, type LengthRounding, type LengthUnit } from '../../geometry';
import type { FieldRead } from './MeasureField';

/** A length in inches, a bare number being in `unit`, optionally with a lower bound and words for why. */
export function lengthReader(unit: LengthUnit, min?: { value: number; inclusive: boolean; words: string }) {
  return (text: string): FieldRead => {
    const parsed = parseLength(text, unit);
    if (!parsed.ok) return { ok: false, error: parsed.error };
    if (min && (min.inclusive ? parsed.value < min.value : parsed.value <= min.value)) return { ok: false, error: min.words };
    return { ok: true, value: parsed.value };
  };
}

/** The designer's length readers for a shop: a bare number means the shop's own unit. */
export function lengthReaders(rounding: LengthRounding) {
  const unit = lengthUnitOf(rounding);
  return {
    positiveLength: lengthReader(unit, { value: 0, inclusive: false, words: 'Must be more than 0.' }),
    nonNegativeLength: lengthReader(unit, { value: 0, inclusive: true, words: 'Cannot be less than 0.' }),
    anyLength: lengthReader(unit),
  };
}

/** A turn in degrees, e.g. `15` or `-7.5`. */
export function degreesReader(text: string): FieldRead {
  const value = Number(text.replace(/°|deg(rees)?/gi, '').trim());
  return text.trim() !== '' && Number.isFinite(value) ? { ok: true, value } : { ok: false, error: 'Type a number of degrees, such as 15 or -7.5.' };
}

/** A whole number within limits, e.g. the sides of a polygon. */
export function wholeReader(min: number, max: number) {
  return (text: string): FieldRead => {
    const value = Number(text.trim());
    return Number.isInteger(value) && value >= min && value <= max ? { ok: true, value } : { ok: false, error: `Type a whole number from ${min} to ${max}.` };
  };
}
