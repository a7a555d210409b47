import { pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { memberRoles } from '../../features/auth/schema';

/** A framing shop: the tenant that owns every other row. */
export const shops = pgTable('shops', {
  id: uuid('id').primaryKey().defaultRandom(),
  /** The shop's trading name, shown in the app and in its e-mails. */
  name: text('name').notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export type Shop = typeof shops.$inferSelect;

export const memberRole = pgEnum('member_role', memberRoles);
