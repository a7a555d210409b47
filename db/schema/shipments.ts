import { sql } from 'drizzle-orm';
import { boolean, index, integer, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { jobs } from './jobs';
import { members } from './members';
import { proofs } from './proofs';
import { shops } from './shops';

/** A job's framed piece on its way: one per job, written when the job is marked shipped. */
export const shipments = pgTable(
  'shipments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    jobId: uuid('job_id').notNull().references(() => jobs.id, { onDelete: 'cascade' }),
    /** The carrier's name as it stood in the shop's settings when shipped. */
    carrier: text('carrier').notNull(),
    trackingNumber: text('tracking_number').notNull(),
    /** The tracking page, made from the carrier's pattern when shipped (a later change of pattern leaves it). */
    trackingUrl: text('tracking_url').notNull(),
    /** The approved proof whose link turns into the arrival page. */
    proofId: uuid('proof_id').references(() => proofs.id, { onDelete: 'set null' }),
    /** SHA-256 (hex) of the arrival link's own secret, e-mailed once; it opens the same proof page as the proof's link. */
    arrivalTokenHash: text('arrival_token_hash').unique(),
    shippedBy: text('shipped_by').references(() => members.id, { onDelete: 'set null' }),
    shippedAt: timestamp('shipped_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('shipments_job_idx').on(t.jobId)],
);
export type ShipmentRow = typeof shipments.$inferSelect;

/** The customer's word on how the frame arrived, left through the approved proof's link. One per job. */
export const arrivalNotes = pgTable(
  'arrival_notes',
  {
    jobId: uuid('job_id').primaryKey().references(() => jobs.id, { onDelete: 'cascade' }),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    /** The link it came through. */
    proofId: uuid('proof_id').notNull().references(() => proofs.id, { onDelete: 'cascade' }),
    comment: text('comment'),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
);

/** A photo the customer took of the frame on arrival; at most three per job, at most one the shop's showcase. */
export const arrivalPhotos = pgTable(
  'arrival_photos',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    jobId: uuid('job_id').notNull().references(() => jobs.id, { onDelete: 'cascade' }),
    proofId: uuid('proof_id').notNull().references(() => proofs.id, { onDelete: 'cascade' }),
    /** Storage key of the original upload. */
    originalKey: text('original_key').notNull(),
    /** Storage key of the resized JPEG preview. */
    previewKey: text('preview_key').notNull(),
    /** Content type detected from the bytes. */
    mimeType: text('mime_type').notNull(),
    bytes: integer('bytes').notNull(),
    /** Chosen by the shop to show off the finished work. */
    showcase: boolean('showcase').notNull().default(false),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('arrival_photos_job_idx').on(t.jobId, t.createdAt), uniqueIndex('arrival_photos_one_showcase_idx').on(t.jobId).where(sql`${t.showcase}`)],
);
