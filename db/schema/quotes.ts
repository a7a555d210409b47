import { sql } from 'drizzle-orm';
import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { quoteStates, type QuoteBasis, type QuoteLine, type QuoteTerms } from '../../features/quotes/schema';
import { jobs } from './jobs';
import { members } from './members';
import { proofs } from './proofs';
import { shops } from './shops';

export const quoteState = pgEnum('quote_state', quoteStates);

/** One version of a job's price, built from its layout and the shop's price list. Amounts in whole cents. */
export const quotes = pgTable(
  'quotes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    jobId: uuid('job_id').notNull().references(() => jobs.id, { onDelete: 'cascade' }),
    /** 1, 2, 3... per job; versions are kept, a new one replaces the last sent. */
    version: integer('version').notNull(),
    state: quoteState('state').notNull().default('draft'),
    lines: jsonb('lines').$type<QuoteLine[]>().notNull(),
    subtotalCents: integer('subtotal_cents').notNull(),
    taxCents: integer('tax_cents').notNull(),
    totalCents: integer('total_cents').notNull(),
    /** The share asked before work starts (the shop's deposit share of the total). */
    depositCents: integer('deposit_cents').notNull(),
    /** The proof it travelled with, when sent. */
    proofId: uuid('proof_id').references(() => proofs.id, { onDelete: 'set null' }),
    /** Currency, markup, tax rate, deposit share and minimum as they stood when it was built; edits recompute with them. */
    terms: jsonb('terms').$type<QuoteTerms>(),
    /** The layout, version and frame it was computed from. */
    basis: jsonb('basis').$type<QuoteBasis>(),
    /** When it went to the customer with a proof. */
    sentAt: timestamp('sent_at', { withTimezone: true }),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    /** The name the customer typed when approving the proof it travelled with. */
    acceptedName: text('accepted_name'),
    createdBy: text('created_by').references(() => members.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('quotes_job_version_idx').on(t.jobId, t.version),
    /** At most one accepted quote per job: it is the price. */
    uniqueIndex('quotes_one_accepted_idx').on(t.jobId).where(sql`${t.state} = 'accepted'`),
    index('quotes_shop_idx').on(t.shopId),
  ],
);

export type QuoteRow = typeof quotes.$inferSelect;
