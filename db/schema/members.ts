import { index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { memberRole, shops } from './shops';

/** A person who signs in; every member belongs to exactly one shop. */
export const members = pgTable(
  'members',
  {
    id: text('id').primaryKey(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    /** Lower-cased sign-in address, unique across the whole service. */
    email: text('email').notNull().unique(),
    name: text('name').notNull(),
    role: memberRole('role').notNull(),
    /** argon2id hash in PHC string form. */
    passwordHash: text('password_hash').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('members_shop_idx').on(t.shopId)],
);

export type Member = typeof members.$inferSelect;

/** lucia's session rows: one per signed-in browser. */
export const sessions = pgTable('sessions', {
  id: text('id').primaryKey(),
  userId: text('user_id').notNull().references(() => members.id, { onDelete: 'cascade' }),
  expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
  /** When the person signed in; the session ends a fixed time after this however active it stays. */
  signedInAt: timestamp('signed_in_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
});
