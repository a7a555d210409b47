import { pgTable, text, timestamp, unique, uuid, integer } from 'drizzle-orm/pg-core';
import { layouts } from './layouts';
import { members } from './members';
import { shops } from './shops';

/**
 * An owner's release of a frozen version for cutting without the customer's approval on a proof
 * (approved in person, a rush job). The reason is printed on the version's cut sheet.
 */
export const cutReleases = pgTable(
  'cut_releases',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    layoutId: uuid('layout_id').notNull().references(() => layouts.id, { onDelete: 'cascade' }),
    versionNumber: integer('version_number').notNull(),
    reason: text('reason').notNull(),
    releasedBy: text('released_by').references(() => members.id, { onDelete: 'set null' }),
    releasedAt: timestamp('released_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique('cut_releases_version_uq').on(t.layoutId, t.versionNumber)],
);
