import { sql } from 'drizzle-orm';
import { check, index, integer, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { paymentKinds, paymentMethods } from '../../features/payments/schema';
import { jobs } from './jobs';
import { members } from './members';
import { quotes } from './quotes';
import { shops } from './shops';

export const paymentKind = pgEnum('payment_kind', paymentKinds);
export const paymentMethod = pgEnum('payment_method', paymentMethods);

/**
 * Money received for a job, only ever added. Online payments are written from the provider's
 * signed webhook (recorded_by null); the front desk records cash, cheques and card in the shop.
 */
export const payments = pgTable(
  'payments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    jobId: uuid('job_id').notNull().references(() => jobs.id, { onDelete: 'cascade' }),
    /** The accepted quote the amount was computed from. */
    quoteId: uuid('quote_id').references(() => quotes.id, { onDelete: 'set null' }),
    kind: paymentKind('kind').notNull(),
    method: paymentMethod('method').notNull(),
    /** Whole cents received, always more than zero. */
    amountCents: integer('amount_cents').notNull(),
    /** ISO 4217 code in lower case, as the provider writes it (usd). */
    currency: text('currency').notNull(),
    /** The provider's checkout session (cs_...); one payment per session. */
    checkoutSessionId: text('checkout_session_id'),
    /** The provider's payment intent (pi_...), for refunds and disputes in its dashboard. */
    paymentIntentId: text('payment_intent_id'),
    /** The webhook event (evt_...) that recorded it; a second delivery of the same event changes nothing. */
    providerEventId: text('provider_event_id'),
    /** A cheque or receipt number, or who handed it over. */
    note: text('note'),
    /** The member who recorded it by hand; null when the provider's webhook did. */
    recordedBy: text('recorded_by').references(() => members.id, { onDelete: 'set null' }),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('payments_job_idx').on(t.jobId, t.at),
    uniqueIndex('payments_event_idx').on(t.providerEventId),
    uniqueIndex('payments_session_idx').on(t.checkoutSessionId),
    check('payments_amount_positive', sql`${t.amountCents} > 0`),
  ],
);

export type PaymentRow = typeof payments.$inferSelect;
