import { and, count, desc, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { mailMessages, type MailMessage } from '../../db/schema';
import type { MemberRole } from '../../features/auth/schema';
import type { OutboxItem, OutboxMessage, OutboxPage, OutboxQuery } from '../../features/outbox/schema';
import { notFound } from '../errors';

/**
 * An invitation e-mail carries a working sign-up link for its role; a designer
 * reading an owner's invitation could otherwise join as that owner. Only owners,
 * who may invite anyone anyway, read these bodies.
 */
const ownersOnlyPurposes = new Set(['invitation']);
const withheldNote = 'This message carries a sign-up link, so only owners can read it.';

const item = (m: MailMessage): OutboxItem => ({
  id: m.id,
  toAddress: m.toAddress,
  subject: m.subject,
  purpose: m.purpose,
  sentAt: m.sentAt.toISOString(),
  error: m.error,
});

/** The shop's sent mail, newest first. */
export async function listOutbox(db: Db, shopId: string, page: OutboxQuery): Promise<OutboxPage> {
  const [rows, [total]] = await Promise.all([
    db.select().from(mailMessages).where(eq(mailMessages.shopId, shopId)).orderBy(desc(mailMessages.sentAt), desc(mailMessages.id)).limit(page.limit).offset(page.offset),
    db.select({ n: count() }).from(mailMessages).where(eq(mailMessages.shopId, shopId)),
  ]);
  return { messages: rows.map(item), total: total?.n ?? 0, limit: page.limit, offset: page.offset };
}

export async function readOutboxMessage(db: Db, shopId: string, id: string, readerRole: MemberRole): Promise<OutboxMessage> {
  const m = await db.query.mailMessages.findFirst({ where: and(eq(mailMessages.id, id), eq(mailMessages.shopId, shopId)) });
  if (!m) throw notFound('Message');
  const withheld = ownersOnlyPurposes.has(m.purpose) && readerRole !== 'owner';
  return {
    ...item(m),
    textBody: withheld ? withheldNote : m.textBody,
    htmlBody: withheld ? null : m.htmlBody,
    messageId: m.messageId,
    withheld,
  };
}
