import { doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import type { Calibration, TraceResult } from '../../features/trace/schema';
import { traceStages, traceStatuses } from '../../features/trace/schema';
import { members } from './members';
import { photos, pieces } from './pieces';
import { shops } from './shops';

export const traceStatus = pgEnum('trace_status', traceStatuses);
export const traceStage = pgEnum('trace_stage', traceStages);

/**
 * One request to trace a garment from a photo. The job queue carries only
 * the id; the stage and progress live here so any web process can report
 * them, and a reload finds the run again.
 */
export const traceRuns = pgTable(
  'trace_runs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    pieceId: uuid('piece_id').notNull().references(() => pieces.id, { onDelete: 'cascade' }),
    photoId: uuid('photo_id').notNull().references(() => photos.id, { onDelete: 'cascade' }),
    status: traceStatus('status').notNull().default('queued'),
    stage: traceStage('stage').notNull().default('waiting'),
    /** 0 to 1, within the whole run. */
    progress: doublePrecision('progress').notNull().default(0),
    /** How many times a worker has started this run; above 1 after a crash or a retry. */
    attempts: integer('attempts').notNull().default(0),
    /** The rectangle corners and size, or two points and a distance, in pixels of the upright photo. */
    calibration: jsonb('calibration').$type<Calibration>().notNull(),
    /** A tapped background point and a rough box around the garment, when given. */
    options: jsonb('options').$type<{ background?: { x: number; y: number } | null; box?: { x: number; y: number; width: number; height: number } | null }>().notNull(),
    /** The automatic outline in inches from the top-left of the rectified image. */
    result: jsonb('result').$type<TraceResult>(),
    /** Storage key of the rectified photo, cropped round the garment, as JPEG. */
    imageKey: text('image_key'),
    /** A plain-words reason when the run failed. */
    message: text('message'),
    requestedBy: text('requested_by').references(() => members.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('trace_runs_piece_idx').on(t.pieceId)],
);

export type TraceRunRow = typeof traceRuns.$inferSelect;
