import { z } from 'zod';
import { optionalTextField } from '../text/schema';

/** What a payment is for: the deposit or the balance (both paid online), or one taken by hand at the counter. */
export const paymentKinds = ['deposit', 'balance', 'manual'] as const;
export type PaymentKind = (typeof paymentKinds)[number];

/** How the money came in. Only card_online comes from the payment provider, through its signed webhook. */
export const paymentMethods = ['card_online', 'cash', 'cheque', 'card_in_shop'] as const;
export type PaymentMethod = (typeof paymentMethods)[number];

/** The methods the front desk may record by hand. */
export const manualPaymentMethods = ['cash', 'cheque', 'card_in_shop'] as const;

export const paymentMethodLabels: Record<PaymentMethod, string> = {
  card_online: 'Card, online',
  cash: 'Cash',
  cheque: 'Cheque',
  card_in_shop: 'Card, in the shop',
};

export const paymentKindLabels: Record<PaymentKind, string> = {
  deposit: 'Deposit',
  balance: 'Balance',
  manual: 'Taken at the counter',
};

/** Where a job's money stands against its accepted quote. */
export const paymentStates = ['due', 'part_paid', 'paid'] as const;
export type PaymentState = (typeof paymentStates)[number];
export const paymentStateLabels: Record<PaymentState, string> = { due: 'Due', part_paid: 'Part paid', paid: 'Paid' };

/** The largest single payment the shop can record, in cents (1 000 000.00). */
export const MAX_PAYMENT_CENTS = 100_000_000;
export const MAX_PAYMENT_NOTE = 500;

/** What the shop asks the provider to take online. The amount is never the client's: the server computes it. */
export const checkoutInput = z.object({
  purpose: z.enum(['deposit', 'balance'], { error: 'Choose the deposit or the balance' }),
});
export type CheckoutInput = z.infer<typeof checkoutInput>;

export const manualPaymentInput = z.object({
  method: z.enum(manualPaymentMethods, { error: 'Choose cash, cheque or card in the shop' }),
  amountCents: z
    .number({ error: 'Type the amount received' })
    .int('Amounts are whole cents')
    .min(1, 'The amount must be more than zero')
    .max(MAX_PAYMENT_CENTS, 'Amounts are at most 1 000 000.00'),
  /** A cheque number, a receipt number, or who handed it over. */
  note: optionalTextField({ max: MAX_PAYMENT_NOTE }),
});
export type ManualPaymentInput = z.input<typeof manualPaymentInput>;

export const payment = z.object({
  id: z.string().uuid(),
  kind: z.enum(paymentKinds),
  method: z.enum(paymentMethods),
  amountCents: z.number().int(),
  currency: z.string(),
  note: z.string().nullable(),
  /** The member who recorded it; null when the provider's webhook did. */
  recordedByName: z.string().nullable(),
  /** The provider's checkout session for an online payment, so the job page knows when its payment has landed. */
  checkoutSessionId: z.string().nullable(),
  at: z.string(),
});
export type Payment = z.infer<typeof payment>;

export const paymentSummary = z.object({
  quoteId: z.string().uuid(),
  quoteVersion: z.number().int(),
  currency: z.string(),
  totalCents: z.number().int(),
  depositCents: z.number().int(),
  paidCents: z.number().int(),
  /** What is left of the total, never below zero. */
  balanceCents: z.number().int(),
  /** What is left of the deposit, never below zero. */
  depositDueCents: z.number().int(),
  /** Paid beyond the total (two online payments crossing), to be refunded by the shop. */
  overpaidCents: z.number().int(),
  state: z.enum(paymentStates),
});
export type PaymentSummary = z.infer<typeof paymentSummary>;

export const paymentList = z.object({
  payments: z.array(payment),
  /** Null while the job has no accepted quote: there is nothing to take payment for yet. */
  summary: paymentSummary.nullable(),
  /** Whether this server can take payments online (the provider's keys, or the local stand-in). */
  onlineEnabled: z.boolean(),
});
export type PaymentList = z.infer<typeof paymentList>;

export const checkoutStarted = z.object({ url: z.string().url(), amountCents: z.number().int(), purpose: z.enum(['deposit', 'balance']) });

export const manualPaymentRecorded = z.object({ payment, summary: paymentSummary, mailError: z.string().nullable(), emailedTo: z.string().nullable() });

/** A job's money state from what it costs and what came in. */
export function paymentStateOf(totalCents: number, paidCents: number): PaymentState {
  if (paidCents >= totalCents) return 'paid';
  return paidCents > 0 ? 'part_paid' : 'due';
}

/**
 * Money in whole cents, typed and shown the way a shop writes it. Only currencies with two
 * decimal places (ISO 4217 minor unit 2) are offered, so 1 unit is always 100 cents.
 */
export const paymentCurrencies = ['usd', 'cad', 'eur', 'gbp', 'aud', 'nzd', 'chf'] as const;
export type PaymentCurrency = (typeof paymentCurrencies)[number];

/** "$1,234.50" for 123450 cents in usd. */
export function moneyText(cents: number, currency: string): string {
  return new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);
}

// Digits with an optional thousands comma grouping and at most two decimals: 1234, 1,234.5, .75
const MONEY_TYPED = /^(?:\d{1,3}(?:,\d{3})+|\d+)?(?:\.\d{1,2})?$/;

/**
 * Cents from what a person typed ("120", "120.5", "1,250.00", "$ 80"), or null when it is not an
 * amount. Works on the digits as text, so 0.29 is 29 cents exactly (no floating-point rounding).
 */
export function centsFromText(typed: string): number | null {
  const text = typed.trim().replace(/^[$£€]\s*/, '');
  if (text === '' || text === '.' || !MONEY_TYPED.test(text)) return null;
  const [whole = '', fraction = ''] = text.replace(/,/g, '').split('.');
  const cents = Number(whole || '0') * 100 + Number(fraction.padEnd(2, '0') || '0');
  return Number.isSafeInteger(cents) ? cents : null;
}
