import { index, integer, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { storedProofStates } from '../../features/proofs/schema';
import { jobs } from './jobs';
import { layouts } from './layouts';
import { members } from './members';
import { shops } from './shops';

/** Where a proof stands; "expired" is read from expires_at, never stored. */
export const proofState = pgEnum('proof_state', storedProofStates);

/** One frozen version sent to the customer through a secret link. */
export const proofs = pgTable(
  'proofs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    jobId: uuid('job_id').notNull().references(() => jobs.id, { onDelete: 'cascade' }),
    layoutId: uuid('layout_id').notNull().references(() => layouts.id, { onDelete: 'cascade' }),
    /** The frozen version shown; versions never change, so the customer sees exactly what will be cut. */
    versionNumber: integer('version_number').notNull(),
    /** SHA-256 (hex) of the link's secret; the secret itself is never stored. */
    tokenHash: text('token_hash').notNull().unique(),
    state: proofState('state').notNull().default('sent'),
    /** The shop's note to the customer. */
    message: text('message'),
    sentBy: text('sent_by').references(() => members.id, { onDelete: 'set null' }),
    sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow(),
    /** After this the link answers like a revoked one. */
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    /** First time the customer's page loaded it. */
    openedAt: timestamp('opened_at', { withTimezone: true }),
    decidedAt: timestamp('decided_at', { withTimezone: true }),
    /** The name the customer typed to approve. */
    approvedName: text('approved_name'),
    /** What the customer asked to change. */
    changesComment: text('changes_comment'),
    /** Storage key of the JPEG the customer sent with a change request (a sketch or note), made like a piece photo's preview. */
    changesPhotoKey: text('changes_photo_key'),
    /** When it was revoked or replaced. */
    closedAt: timestamp('closed_at', { withTimezone: true }),
  },
  (t) => [index('proofs_job_idx').on(t.jobId, t.sentAt)],
);

export type ProofRow = typeof proofs.$inferSelect;
