import { doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { pieceKinds } from '../../features/pieces/schema';
import type { PieceOutline } from '../../features/trace/schema';
import { jobs } from './jobs';
import { members } from './members';
import { shops } from './shops';

export const pieceKind = pgEnum('piece_kind', pieceKinds);

/** A physical item of a job, with its real size. */
export const pieces = pgTable(
  'pieces',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    jobId: uuid('job_id').notNull().references(() => jobs.id, { onDelete: 'cascade' }),
    kind: pieceKind('kind').notNull(),
    /** A short name a framer recognises: "home jersey", "team photo". */
    label: text('label').notNull(),
    /** Real width in inches (what was typed, in any unit, converted). */
    widthIn: doublePrecision('width_in').notNull(),
    heightIn: doublePrecision('height_in').notNull(),
    notes: text('notes'),
    /** A garment's saved outline in inches, with the trace, photo and calibration it came from; null until one is saved. */
    outline: jsonb('outline').$type<PieceOutline>(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('pieces_job_idx').on(t.jobId)],
);

export type Piece = typeof pieces.$inferSelect;

/** An uploaded photograph of a piece; the files live in storage under these keys. */
export const photos = pgTable(
  'photos',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    pieceId: uuid('piece_id').notNull().references(() => pieces.id, { onDelete: 'cascade' }),
    /** Storage key of the original upload. */
    originalKey: text('original_key').notNull(),
    /** Storage key of the resized JPEG preview. */
    previewKey: text('preview_key').notNull(),
    /** Content type detected from the bytes, not from the name. */
    mimeType: text('mime_type').notNull(),
    bytes: integer('bytes').notNull(),
    widthPx: integer('width_px').notNull(),
    heightPx: integer('height_px').notNull(),
    originalName: text('original_name'),
    uploadedBy: text('uploaded_by').references(() => members.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('photos_piece_idx').on(t.pieceId)],
);

export type Photo = typeof photos.$inferSelect;
