import { z } from 'zod';
import { textField } from '../text/schema';

/**
 * Where a quote stands. A job keeps every version of its quote; at most one is accepted,
 * and the accepted one is the price the deposit and the balance are computed from.
 */
export const quoteStates = ['draft', 'sent', 'accepted', 'replaced'] as const;
export type QuoteState = (typeof quoteStates)[number];

/** Amounts are whole cents of the shop's currency, never floating-point money. */
export const cents = z.number().int('Amounts are whole cents').min(0, 'Amounts cannot be negative').max(100_000_000, 'Amounts are at most 1 000 000.00');

export const quoteLineKinds = ['mat', 'glazing', 'moulding', 'spacer', 'mounting', 'labour', 'fitting', 'extra', 'markup', 'minimum'] as const;
/** Lines computed from the other lines, never edited by hand. */
export const derivedLineKinds = ['markup', 'minimum'] as const;

/** One line of a quote, with the arithmetic that produced it in plain words. */
export const quoteLine = z.object({
  /** What the line is for: mat board, glazing, moulding, spacers, mounting, labour, fitting, extra, markup on materials, minimum charge. */
  kind: z.enum(quoteLineKinds),
  label: z.string().min(1).max(200),
  /** How it was computed, e.g. "Glazing, acrylic: 32 x 40 in = 8.89 sq ft x 14.50". */
  explanation: z.string().max(400),
  amountCents: cents,
  /** What the price list gave, when the framer changed the amount. */
  computedCents: cents.optional(),
  /** Why the framer changed the amount. */
  note: z.string().max(200).optional(),
});
export type QuoteLine = z.infer<typeof quoteLine>;

/** Limits of what a framer adds by hand. */
export const MAX_QUOTE_EXTRAS = 30;
export const MAX_QUOTE_LINES = 120;

/** The rates a quote was built with, kept so an edit recomputes it the same way. */
export const quoteTerms = z.object({
  currency: z.string(),
  markupPercent: z.number(),
  taxRatePercent: z.number(),
  depositSharePercent: z.number(),
  minimumChargeCents: z.number().int(),
});
export type QuoteTerms = z.infer<typeof quoteTerms>;

/** What the quote was computed from. */
export const quoteBasis = z.object({
  layoutId: z.string(),
  layoutName: z.string(),
  /** The frozen version, or null for the working draft. */
  versionNumber: z.number().int().nullable(),
  draftRevision: z.number().int().nullable(),
  /** The frame chosen on the job at the time, in words, or null for mats only. */
  frame: z.string().nullable(),
});
export type QuoteBasis = z.infer<typeof quoteBasis>;

/** A line typed by the framer: a label and an amount. */
export const quoteExtraInput = z.object({
  label: textField({ max: 120, required: 'Say what the extra is for' }),
  amountCents: cents,
});

/** Building a quote: from a layout's draft, or from one of its frozen versions. */
export const quoteBuildInput = z.object({
  layoutId: z.string({ error: 'Choose a layout' }).uuid('Choose a layout'),
  versionNumber: z.number().int().min(1).max(100_000).optional(),
  extras: z.array(quoteExtraInput).max(MAX_QUOTE_EXTRAS, `At most ${MAX_QUOTE_EXTRAS} extras`).default([]),
});
export type QuoteBuildInput = z.input<typeof quoteBuildInput>;

/** A changed amount on one computed line (by its position among the lines), with the reason. */
export const quoteAdjustmentInput = z.object({
  line: z.number().int().min(0).max(MAX_QUOTE_LINES),
  amountCents: cents,
  note: textField({ max: 200, required: 'Say why the amount changed' }),
});

/** Editing a draft: the full list of extras and of changed amounts (an amount left out goes back to the price list's). */
export const quoteEditInput = z.object({
  extras: z.array(quoteExtraInput).max(MAX_QUOTE_EXTRAS, `At most ${MAX_QUOTE_EXTRAS} extras`),
  adjustments: z.array(quoteAdjustmentInput).max(MAX_QUOTE_LINES),
});
export type QuoteEditInput = z.input<typeof quoteEditInput>;

/** A quote as the shop sees it. */
export const quoteView = z.object({
  id: z.string(),
  jobId: z.string(),
  version: z.number().int(),
  state: z.enum(quoteStates),
  lines: z.array(quoteLine),
  subtotalCents: z.number().int(),
  taxCents: z.number().int(),
  totalCents: z.number().int(),
  depositCents: z.number().int(),
  terms: quoteTerms,
  basis: quoteBasis,
  proofId: z.string().nullable(),
  sentAt: z.string().nullable(),
  acceptedAt: z.string().nullable(),
  acceptedName: z.string().nullable(),
  createdAt: z.string(),
  createdByName: z.string().nullable(),
});
export type QuoteView = z.infer<typeof quoteView>;

/** What the customer sees of the quote beside the proof: the lines in words and the sums. */
export const publicQuoteView = z
  .object({
    version: z.number().int(),
    state: z.enum(['sent', 'accepted', 'replaced']),
    currency: z.string(),
    lines: z.array(z.object({ label: z.string(), explanation: z.string(), amountCents: z.number().int() }).strict()),
    subtotalCents: z.number().int(),
    taxRatePercent: z.number(),
    taxCents: z.number().int(),
    totalCents: z.number().int(),
    depositSharePercent: z.number(),
    depositCents: z.number().int(),
  })
  .strict();
export type PublicQuoteView = z.infer<typeof publicQuoteView>;

/** Money for people: 1234 cents -> "12.34". */
export const centsText = (amount: number) => `${amount < 0 ? '-' : ''}${Math.floor(Math.abs(amount) / 100)}.${String(Math.abs(amount) % 100).padStart(2, '0')}`;

/** Money for people in the currency's own sign, as the payments panel and receipts write it: "$12.34". */
export { moneyText } from '../payments/schema';
