import type { LengthRounding } from '../../geometry';
import { inchesFromMillimetres } from '../../geometry/units';

/** The shop's rounding as a length in inches: the step sizes and positions land on, and arrows nudge by. */
export function roundingStep(rounding: LengthRounding): number {
  switch (rounding) {
    case '1/8': return 1 / 8;
    case '1/16': return 1 / 16;
    case '1/32': return 1 / 32;
    case '0.5mm': return inchesFromMillimetres(0.5);
  }
}
