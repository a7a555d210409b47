import { index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { shops } from './shops';

/** Someone a shop frames for. */
export const customers = pgTable(
  'customers',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    email: text('email'),
    phone: text('phone'),
    /** Free-form shipping address as the customer gave it. */
    address: text('address'),
    notes: text('notes'),
    /** Set instead of deleting a customer who has jobs; archived customers leave the lists. */
    archivedAt: timestamp('archived_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('customers_shop_idx').on(t.shopId)],
);

export type Customer = typeof customers.$inferSelect;
