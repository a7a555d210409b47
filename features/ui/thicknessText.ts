import { lengthUnitOf, millimetresFromInches, type LengthRounding } from '../../geometry/units';

/** A board's thickness as the maker gives it (a decimal, not a fraction), in the shop's unit: `0.055 in` or `1.4 mm`. */
export function thicknessText(inches: number, rounding: LengthRounding): string {
  return lengthUnitOf(rounding) === 'mm' ? `${Number(millimetresFromInches(inches).toFixed(2))} mm` : `${Number(inches.toFixed(4))} in`;
}
