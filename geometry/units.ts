/**
 * Lengths as a framer types and reads them. Every length inside the geometry
 * is a number of inches; millimetres and centimetres exist only at the edges
 * (typing and display).
 */

/** A length in inches. The brand keeps pixels and millimetres from sneaking in. */
export type Inches = number & { readonly __unit: 'inches' };

export type LengthUnit = 'in' | 'mm' | 'cm';
export type LengthRounding = '1/8' | '1/16' | '1/32' | '0.5mm';

export type LengthParseResult =
  | { readonly ok: true; readonly value: Inches }
  | { readonly ok: false; readonly error: string };

/** Exact by definition of the international inch (1959). */
export const MILLIMETRES_PER_INCH = 25.4;

/**
 * One tolerance for comparing lengths: one clipper unit (0.0001 in), far below
 * what a blade can cut, far above floating-point noise on a 40 in board.
 */
export const EPSILON_IN = 0.0001 as Inches;

export function inches(value: number): Inches {
  return value as Inches;
}

export function inchesFromMillimetres(mm: number): Inches {
  return (mm / MILLIMETRES_PER_INCH) as Inches;
}

export function millimetresFromInches(value: number): number {
  return value * MILLIMETRES_PER_INCH;
}

export function isCloseTo(a: number, b: number, tolerance: number = EPSILON_IN): boolean {
  return Math.abs(a - b) <= tolerance;
}

/** Rounds half away from zero so -1/16 and 1/16 round symmetrically. */
export function roundToStep(value: number, step: number): number {
  if (!(step > 0)) throw new RangeError(`roundToStep needs a positive step, got ${step}`);
  const steps = Math.round(Math.abs(value) / step);
  const rounded = Math.sign(value) * steps * step;
  return rounded === 0 ? 0 : rounded;
}

const UNIT_WORDS: Record<string, LengthUnit> = {
  '"': 'in', '”': 'in', '″': 'in', in: 'in', inch: 'in', inches: 'in',
  mm: 'mm', millimetre: 'mm', millimetres: 'mm', millimeter: 'mm', millimeters: 'mm',
  cm: 'cm', centimetre: 'cm', centimetres: 'cm', centimeter: 'cm', centimeters: 'cm',
};

const INCHES_PER_UNIT: Record<LengthUnit, number> = {
  in: 1,
  mm: 1 / MILLIMETRES_PER_INCH,
  cm: 10 / MILLIMETRES_PER_INCH,
};

// sign, then "3", "3.25", ".5", "3 1/4", "3-1/4" or "1/2", then an optional unit word.
const LENGTH_PATTERN =
  /^([-+])?\s*(?:(\d+)(?:\s+|\s*-\s*)(\d+)\s*\/\s*(\d+)|(\d+)\s*\/\s*(\d+)|(\d+(?:\.\d*)?|\.\d+))\s*([^\d\s./-].*)?$/;

/** The unit a bare number means in a shop that shows lengths to this rounding. */
export function lengthUnitOf(rounding: LengthRounding): LengthUnit {
  return rounding === '0.5mm' ? 'mm' : 'in';
}

/** Unicode's single-character fractions (½, ¾, ⅛...) as numerator and denominator. */
const VULGAR_FRACTIONS: Record<string, readonly [number, number]> = {
  '½': [1, 2], '⅓': [1, 3], '⅔': [2, 3], '¼': [1, 4], '¾': [3, 4], '⅕': [1, 5], '⅖': [2, 5], '⅗': [3, 5], '⅘': [4, 5],
  '⅙': [1, 6], '⅚': [5, 6], '⅐': [1, 7], '⅛': [1, 8], '⅜': [3, 8], '⅝': [5, 8], '⅞': [7, 8], '⅑': [1, 9], '⅒': [1, 10],
};

/** "4½" becomes "4 1/2" and the fraction slash "3⁄4" becomes "3/4", so one pattern reads them all. */
function withPlainFractions(text: string): string {
  return text
    .replace(/[½⅓⅔¼¾⅕⅖⅗⅘⅙⅚⅐⅛⅜⅝⅞⅑⅒]/g, (c) => ` ${VULGAR_FRACTIONS[c]![0]}/${VULGAR_FRACTIONS[c]![1]}`)
    .replace(/\u2044/g, '/')
    .trim();
}

// A number in computer notation ("1e3", "2.5E-1"): not how a length is written on a work order.
const EXPONENT_PATTERN = /^[-+]?\s*(?:\d+(?:\.\d*)?|\.\d+)\s*e\s*[-+]?\d/i;

/** Reads "3 1/4", "3-1/4\"", "4½", "3.25 in", "1/2", "82.5mm", "8.25 cm" or "-1/4"; a bare number is in `defaultUnit`. */
export function parseLength(text: string, defaultUnit: LengthUnit = 'in'): LengthParseResult {
  const trimmed = withPlainFractions(text);
  if (trimmed === '') return { ok: false, error: 'Nothing was entered; type a length such as 3 1/4 or 82.5 mm.' };
  if (EXPONENT_PATTERN.test(trimmed)) {
    return { ok: false, error: `"${text.trim()}" is a number in computer notation; write the length out, such as 1000 mm.` };
  }
  const match = LENGTH_PATTERN.exec(trimmed);
  if (!match) return { ok: false, error: `"${trimmed}" could not be read as a length; try 3 1/4, 3.25 in or 82.5 mm.` };
  const [, sign, whole, mixedTop, mixedBottom, top, bottom, decimal, unitText] = match;
  const unitWord = unitText?.trim().toLowerCase();
  const unit = unitWord === undefined ? defaultUnit : UNIT_WORDS[unitWord];
  if (unit === undefined) return { ok: false, error: `The unit "${unitText?.trim()}" is not known; use in, ", mm or cm.` };
  const numerator = Number(mixedTop ?? top ?? 0);
  const denominator = Number(mixedBottom ?? bottom ?? 1);
  if (denominator === 0) return { ok: false, error: `The fraction ${numerator}/0 has a zero bottom number.` };
  const magnitude = Number(whole ?? decimal ?? 0) + numerator / denominator;
  const signed = sign === '-' ? -magnitude : magnitude;
  return { ok: true, value: (signed * INCHES_PER_UNIT[unit]) as Inches };
}

/** Euclid's algorithm as a loop: its depth never depends on the numbers given. */
function greatestCommonDivisor(a: number, b: number): number {
  let x = a;
  let y = b;
  for (let guard = 0; y !== 0 && guard < 64; guard++) [x, y] = [y, x % y];
  return x;
}

/** Beyond this a length is not a shop's; it is shown in plain decimals, never as a fraction or in exponent form. */
const LARGEST_FRACTION_IN = 1e6;

function fractionText(value: number, denominator: number): string {
  if (Math.abs(value) > LARGEST_FRACTION_IN) return `${BigInt(Math.trunc(value)).toString()}"`;
  const sixteenths = Math.round(Math.abs(value) * denominator);
  const whole = Math.floor(sixteenths / denominator);
  const remainder = sixteenths % denominator;
  const sign = value < 0 && sixteenths !== 0 ? '-' : '';
  if (remainder === 0) return `${sign}${whole}"`;
  const divisor = greatestCommonDivisor(remainder, denominator);
  const fraction = `${remainder / divisor}/${denominator / divisor}`;
  return whole === 0 ? `${sign}${fraction}"` : `${sign}${whole} ${fraction}"`;
}

/** Shows a length the way the shop reads it: `7 1/2"`, `3 5/16"` or `82.5 mm`. */
export function formatLength(value: number, rounding: LengthRounding): string {
  if (!Number.isFinite(value)) return '—';
  if (rounding === '0.5mm') {
    const mm = roundToStep(millimetresFromInches(value), 0.5);
    return `${Number.isInteger(mm) ? mm.toFixed(0) : mm.toFixed(1)} mm`;
  }
  const denominator = Number(rounding.slice(2));
  return fractionText(value, denominator);
}
