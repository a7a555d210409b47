import { formatLength, type LengthRounding } from '../../geometry/units';

/** One side for a size line: `8`, `4 1/8` or `216 mm`; inch marks are dropped because the line ends in "in". */
function sideText(value: number, rounding: LengthRounding): string {
  return formatLength(value, rounding).replace(/"$/, '');
}

/** A piece's size as a framer says it: `8 x 10 in`, `4 1/8 x 5 in`, or `216 x 279 mm`. */
export function pieceSizeText(widthIn: number, heightIn: number, rounding: LengthRounding = '1/16'): string {
  if (rounding === '0.5mm') return `${sideText(widthIn, rounding).replace(/ mm$/, '')} x ${sideText(heightIn, rounding)}`;
  return `${sideText(widthIn, rounding)} x ${sideText(heightIn, rounding)} in`;
}

/** A size typed back into the form, so editing starts from what the list shows. */
export function sideInputText(value: number, rounding: LengthRounding = '1/16'): string {
  return sideText(value, rounding === '0.5mm' ? '1/16' : rounding);
}
