import { z } from 'zod';
import { parseLength } from '../../geometry/units';
import { optionalNotes, pieceInput, pieceSide } from './schema';

const typedLength = (name: string) =>
  z.string().transform((text, ctx) => {
    const parsed = parseLength(text, 'in');
    if (!parsed.ok) {
      ctx.addIssue({ code: 'custom', message: parsed.error });
      return z.NEVER;
    }
    return parsed.value as number;
  }).pipe(pieceSide(name));

/**
 * The piece form as typed: sizes as text such as `8 1/2`, `3-1/4"` or `216mm`.
 * Keys match the API's so the server's field errors land beside the same inputs.
 */
export const pieceForm = z.object({
  kind: pieceInput.shape.kind,
  label: pieceInput.shape.label,
  widthIn: typedLength('Width'),
  heightIn: typedLength('Height'),
  notes: optionalNotes,
});
export type PieceFormValues = z.input<typeof pieceForm>;
