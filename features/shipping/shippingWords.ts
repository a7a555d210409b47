import type { ShippingEstimateView, ShippingUnitsName } from './schema';

export const lengthUnit = (units: ShippingUnitsName) => (units === 'in/lb' ? 'in' : 'cm');
export const weightUnit = (units: ShippingUnitsName) => (units === 'in/lb' ? 'lb' : 'kg');

/** "27 x 23 x 7 in" from the sides carriers measure (rounded up). */
export function boxWords(e: ShippingEstimateView, units: ShippingUnitsName): string {
  const b = e.boxRounded;
  return `${b.length} x ${b.width} x ${b.depth} ${lengthUnit(units)}`;
}

export const weightWords = (value: number, units: ShippingUnitsName) => `${value.toFixed(1)} ${weightUnit(units)}`;

/** The hanging caution with its figures: two hangers, anchors rated for twice the weight on the wall. */
export function hangingWords(e: ShippingEstimateView, units: ShippingUnitsName): string {
  return `On the wall it weighs about ${weightWords(e.hanging, units)} (packed weight less the box). Hang it from two hangers into studs, or into anchors rated together for at least ${weightWords(2 * e.hanging, units)} (twice the weight). Follow local building codes and licensed practice.`;
}
