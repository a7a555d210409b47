import { index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { shops } from './shops';

/** Every message the shop sent, as handed to the mail server, for the outbox screen. */
export const mailMessages = pgTable(
  'mail_messages',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: uuid('shop_id').notNull().references(() => shops.id, { onDelete: 'cascade' }),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull(),
    textBody: text('text_body').notNull(),
    htmlBody: text('html_body'),
    /** What the message was for, e.g. invitation or proof. */
    purpose: text('purpose').notNull(),
    /** Message-ID the SMTP server accepted, or null when sending failed. */
    messageId: text('message_id'),
    error: text('error'),
    sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('mail_messages_shop_idx').on(t.shopId, t.sentAt)],
);

export type MailMessage = typeof mailMessages.$inferSelect;
