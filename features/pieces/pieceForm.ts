import { z } from 'zod';
import { parseLength, type LengthUnit } from '../../geometry/units';
import { optionalNotes, pieceInput, pieceSide } from './schema';

const typedLength = (name: string, unit: LengthUnit) =>
  z.string().transform((text, ctx) => {
    const parsed = parseLength(text, unit);
    if (!parsed.ok) {
      ctx.addIssue({ code: 'custom', message: parsed.error });
      return z.NEVER;
    }
    return parsed.value as number;
  }).pipe(pieceSide(name));

/**
 * The piece form as typed: sizes as text such as `8 1/2`, `3-1/4"`, `4½` or
 * `216mm`, a bare number being in the shop's unit. Keys match the API's so the
 * server's field errors land beside the same inputs.
 */
export function pieceForm(unit: LengthUnit) {
  return z.object({
    kind: pieceInput.shape.kind,
    label: pieceInput.shape.label,
    widthIn: typedLength('Width', unit),
    heightIn: typedLength('Height', unit),
    notes: optionalNotes,
  });
}
export type PieceFormValues = z.input<ReturnType<typeof pieceForm>>;
