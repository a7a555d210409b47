import { index, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { jobs } from './jobs';
import { members } from './members';
import { shops } from './shops';

export const activityKind = pgEnum('activity_kind', [
  'job_created',
  'job_updated',
  'status_changed',
  'piece_added',
  'piece_removed',
  'photo_added',
  'outline_saved',
  'layout_created',
  'version_frozen',
  'proof_sent',
  'proof_decided',
  'file_exported',
  'payment_recorded',
  'cut_released',
  'quote_built',
  'arrival_noted',
]);

/** Who did what to a job and when; rows are only ever added. */
export const activity = pgTable(
  'activity',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    jobId: uuid('job_id').notNull().references(() => jobs.id, { onDelete: 'cascade' }),
    /** The member who acted; null for the customer or the system. */
    memberId: text('member_id').references(() => members.id, { onDelete: 'set null' }),
    kind: activityKind('kind').notNull(),
    /** Kind-specific facts, e.g. { from, to } for a status change. */
    detail: jsonb('detail').notNull().default({}),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('activity_job_idx').on(t.jobId, t.at)],
);

export type ActivityRow = typeof activity.$inferSelect;
