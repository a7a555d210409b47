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
  (t) => [
    index('customers_shop_idx').on(t.shopId),
    /** The customers list in name order, one page at a time. */
    index('customers_shop_name_idx').on(t.shopId, t.name, t.id),
    /** Trigram indexes (pg_trgm) serve "contains" searches on name and e-mail, here and in the jobs list. */
    index('customers_name_trgm_idx').using('gin', t.name.op('gin_trgm_ops')),
    index('customers_email_trgm_idx').using('gin', t.email.op('gin_trgm_ops')),
  ],
);

export type Customer = typeof customers.$inferSelect;
