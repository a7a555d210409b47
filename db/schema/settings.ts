import { jsonb, pgTable, timestamp, uuid } from 'drizzle-orm/pg-core';
import { shops } from './shops';

/** One row per shop: its settings document (features/settings/schema.ts validates it). */
export const shopSettings = pgTable('shop_settings', {
  shopId: uuid('shop_id').primaryKey().references(() => shops.id, { onDelete: 'cascade' }),
  settings: jsonb('settings').notNull(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
});
