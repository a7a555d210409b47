import { z } from 'zod';

/**
 * Where a quote stands. A job keeps every version of its quote; at most one is accepted,
 * and the accepted one is the price the deposit and the balance are computed from.
 */
export const quoteStates = ['draft', 'sent', 'accepted', 'replaced'] as const;
export type QuoteState = (typeof quoteStates)[number];

/** Amounts are whole cents of the shop's currency, never floating-point money. */
export const cents = z.number().int('Amounts are whole cents').min(0, 'Amounts cannot be negative').max(100_000_000, 'Amounts are at most 1 000 000.00');

/** One line of a quote, with the arithmetic that produced it in plain words. */
export const quoteLine = z.object({
  /** What the line is for: mat board, glazing, moulding, spacers, mounting, labour, fitting, extra, minimum charge. */
  kind: z.enum(['mat', 'glazing', 'moulding', 'spacer', 'mounting', 'labour', 'fitting', 'extra', 'minimum']),
  label: z.string().min(1).max(200),
  /** How it was computed, e.g. "Glazing, acrylic: 32 x 40 in = 8.89 sq ft x 14.50". */
  explanation: z.string().max(400),
  amountCents: cents,
});
export type QuoteLine = z.infer<typeof quoteLine>;
