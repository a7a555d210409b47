import { MAX_OUTER_SIDE_IN, MAX_REVEAL_IN } from '../../geometry/layoutSchema';
import { lengthUnitOf, parseLength, type LengthRounding, type LengthUnit } from '../../geometry/units';
import type { FieldRead } from './MeasureField';

interface Bound {
  readonly value: number;
  readonly inclusive: boolean;
  readonly words: string;
}

/** A length in inches, a bare number being in `unit`, optionally with bounds and words for why. */
export function lengthReader(unit: LengthUnit, min?: Bound, max?: Bound) {
  return (text: string): FieldRead => {
    const parsed = parseLength(text, unit);
    if (!parsed.ok) return { ok: false, error: parsed.error };
    if (min && (min.inclusive ? parsed.value < min.value : parsed.value <= min.value)) return { ok: false, error: min.words };
    if (max && (max.inclusive ? parsed.value > max.value : parsed.value >= max.value)) return { ok: false, error: max.words };
    return { ok: true, value: parsed.value };
  };
}

/** The layout's limits, as the schema enforces them, in the words shown beside the fields. */
export const outerSideLimit = `Up to ${MAX_OUTER_SIDE_IN} in a side.`;
export const revealLimit = `Under ${MAX_REVEAL_IN} in.`;

/** The designer's length readers for a shop: a bare number means the shop's own unit. */
export function lengthReaders(rounding: LengthRounding) {
  const unit = lengthUnitOf(rounding);
  return {
    positiveLength: lengthReader(unit, { value: 0, inclusive: false, words: 'Must be more than 0.' }),
    nonNegativeLength: lengthReader(unit, { value: 0, inclusive: true, words: 'Cannot be less than 0.' }),
    anyLength: lengthReader(unit),
    outerSideLength: lengthReader(
      unit,
      { value: 0, inclusive: false, words: 'Must be more than 0.' },
      { value: MAX_OUTER_SIDE_IN, inclusive: true, words: `At most ${MAX_OUTER_SIDE_IN} in a side: no shop cuts a larger board.` },
    ),
    revealLength: lengthReader(
      unit,
      { value: 0, inclusive: true, words: 'Cannot be less than 0.' },
      { value: MAX_REVEAL_IN, inclusive: false, words: `A reveal must be under ${MAX_REVEAL_IN} in.` },
    ),
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
