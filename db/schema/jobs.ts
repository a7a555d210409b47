import { sql } from 'drizzle-orm';
import { date, index, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { jobStatuses } from '../../features/jobs/schema';
import type { FrameChoice } from '../../features/settings/materials';
import { customers } from './customers';
import { shops } from './shops';

/** Where a job stands in the shop's pipeline, in the order work moves (the list is shared with the screens). */
export const jobStatus = pgEnum('job_status', jobStatuses);

/** One framing order for one customer. */
export const jobs = pgTable(
  'jobs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    customerId: uuid('customer_id').notNull().references(() => customers.id, { onDelete: 'restrict' }),
    title: text('title').notNull(),
    /** The date promised to the customer, no time of day. */
    dueDate: date('due_date', { mode: 'string' }),
    notes: text('notes'),
  /** Moulding, glazing and shadowbox depth; null until chosen. */
  frame: jsonb('frame').$type<FrameChoice>(),
    status: jobStatus('status').notNull().default('taken_in'),
    /** When the status last changed; the activity log keeps who and from what. */
    statusChangedAt: timestamp('status_changed_at', { withTimezone: true }).notNull().defaultNow(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('jobs_shop_status_idx').on(t.shopId, t.status),
    index('jobs_customer_idx').on(t.customerId),
    /** The jobs list's default order (due date, undated last, then newest): its first page reads in index order. */
    index('jobs_shop_due_order_idx').on(t.shopId, sql`(${t.dueDate} is null)`, t.dueDate, t.createdAt.desc().nullsFirst(), t.id),
    /** Trigram indexes (pg_trgm) serve the list's "contains" search on title and notes at any size. */
    index('jobs_title_trgm_idx').using('gin', t.title.op('gin_trgm_ops')),
    index('jobs_notes_trgm_idx').using('gin', t.notes.op('gin_trgm_ops')),
  ],
);

export type Job = typeof jobs.$inferSelect;
