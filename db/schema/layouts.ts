import { index, integer, jsonb, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { jobs } from './jobs';
import { members } from './members';
import { shops } from './shops';

/** A mat design for a job: one working draft plus frozen numbered versions. */
export const layouts = pgTable(
  'layouts',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    jobId: uuid('job_id').notNull().references(() => jobs.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    /**
     * The working layout document (geometry's Layout, validated by parseLayout on
     * every write), its outlines and polygons as `{ kind, pointsRef }`: their
     * points sit in `draftOutlines` (server/services/draftOutlines.ts).
     */
    draft: jsonb('draft').notNull(),
    /** The draft's point lists by name; a save that keeps them leaves this column as it was. */
    draftOutlines: jsonb('draft_outlines').notNull().default({}),
    /** Goes up by one on every draft save; a save must name the revision it started from. */
    draftRevision: integer('draft_revision').notNull().default(1),
    /** The frozen version the draft was started from, if any. */
    draftBasedOnVersion: integer('draft_based_on_version'),
    updatedBy: text('updated_by').references(() => members.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('layouts_job_idx').on(t.jobId)],
);

export type LayoutRow = typeof layouts.$inferSelect;

/** A frozen copy of a draft; never updated or deleted (a database trigger enforces it). */
export const layoutVersions = pgTable(
  'layout_versions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    layoutId: uuid('layout_id').notNull().references(() => layouts.id, { onDelete: 'cascade' }),
    /** 1, 2, 3... per layout. */
    number: integer('number').notNull(),
    document: jsonb('document').notNull(),
    /** Why it was frozen, in the framer's words ("sent for approval"). */
    note: text('note'),
    frozenBy: text('frozen_by').references(() => members.id, { onDelete: 'set null' }),
    frozenAt: timestamp('frozen_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique('layout_versions_number_uq').on(t.layoutId, t.number)],
);

export type LayoutVersionRow = typeof layoutVersions.$inferSelect;
