import { index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { members } from './members';
import { memberRole, shops } from './shops';

/** An owner's invitation for someone to join the shop with a role; the link carries a secret whose hash is kept. */
export const invitations = pgTable(
  'invitations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: memberRole('role').notNull(),
    /** SHA-256 of the secret in the link, hex; the secret itself is only ever in the e-mail. */
    tokenHash: text('token_hash').notNull().unique(),
    invitedBy: text('invited_by').references(() => members.id, { onDelete: 'set null' }),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('invitations_shop_idx').on(t.shopId)],
);

export type Invitation = typeof invitations.$inferSelect;
