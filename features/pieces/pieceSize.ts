import { formatLength, millimetresFromInches, type LengthRounding } from '../../geometry/units';

/** One side for a size line: `8`, `4 1/8` or `216 mm`; inch marks are dropped because the line ends in "in". */
function sideText(value: number, rounding: LengthRounding): string {
  return formatLength(value, rounding).replace(/"$/, '');
}

/** A piece's size as a framer says it: `8 x 10 in`, `4 1/8 x 5 in`, or `216 x 279 mm`. */
export function pieceSizeText(widthIn: number, heightIn: number, rounding: LengthRounding = '1/16'): string {
  if (rounding === '0.5mm') return `${sideText(widthIn, rounding).replace(/ mm$/, '')} x ${sideText(heightIn, rounding)}`;
  return `${sideText(widthIn, rounding)} x ${sideText(heightIn, rounding)} in`;
}

/**
 * A size typed back into the form in the shop's unit, so editing starts from
 * what the list shows. It carries its unit (`3 1/4"`, `82.6 mm`) so it reads
 * the same whatever a bare number means; millimetres keep a tenth.
 */
export function sideInputText(value: number, rounding: LengthRounding = '1/16'): string {
  if (rounding === '0.5mm') return `${Number(millimetresFromInches(value).toFixed(1))} mm`;
  return formatLength(value, rounding);
}
