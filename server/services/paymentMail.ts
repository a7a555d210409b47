import { and, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { customers, jobs, shops } from '../../db/schema';
import { moneyText, paymentMethodLabels, type PaymentMethod, type PaymentSummary } from '../../features/payments/schema';
import { escapeHtml } from '../mail/escapeHtml';
import type { Mailer } from '../mail/mailer';

export interface ReceiptFacts {
  shopId: string;
  to: string;
  customerName: string;
  shopName: string;
  title: string;
  amountCents: number;
  method: PaymentMethod;
  at: Date;
  summary: PaymentSummary;
}

const dateWords = (at: Date) => new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeZone: 'UTC' }).format(at);

/** What remains after this payment, in one sentence. */
function remainingWords(s: PaymentSummary): string {
  const m = (c: number) => moneyText(c, s.currency);
  if (s.overpaidCents > 0) return `You have now paid ${m(s.paidCents)}, which is ${m(s.overpaidCents)} more than the total of ${m(s.totalCents)}; the shop will refund the difference.`;
  if (s.balanceCents === 0) return `You have now paid the full ${m(s.totalCents)}. Nothing remains to pay.`;
  return `You have now paid ${m(s.paidCents)} of ${m(s.totalCents)}. Still to pay: ${m(s.balanceCents)}.`;
}

/** The receipt in plain text and HTML with the same words; no images, no links to follow. */
export function receiptMail(f: ReceiptFacts) {
  const amount = moneyText(f.amountCents, f.summary.currency);
  const method = paymentMethodLabels[f.method].toLowerCase();
  const subject = `${f.shopName}: receipt for ${amount}, ${f.title}`;
  const received = `${f.shopName} received ${amount} (${method}) on ${dateWords(f.at)} for ${f.title}.`;
  const remaining = remainingWords(f.summary);
  const text = [`Hello ${f.customerName},`, '', received, remaining, '', 'Thank you.', f.shopName].join('\n');
  const html = [
    `<p>Hello ${escapeHtml(f.customerName)},</p>`,
    `<p>${escapeHtml(received)}</p>`,
    `<p>${escapeHtml(remaining)}</p>`,
    `<p>Thank you.<br>${escapeHtml(f.shopName)}</p>`,
  ].join('\n');
  return { shopId: f.shopId, to: f.to, subject, text, html, purpose: 'payment receipt' };
}

/** The customer's address and the names the receipt uses; null when the customer has no e-mail. */
export async function receiptRecipient(db: Db, shopId: string, jobId: string) {
  const [row] = await db
    .select({ email: customers.email, customerName: customers.name, title: jobs.title, shopName: shops.name })
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(shops, eq(shops.id, jobs.shopId))
    .where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  return row?.email ? { ...row, email: row.email } : null;
}

/**
 * Sends one receipt for one recorded payment. The payment stands whatever happens to the mail:
 * a failure comes back in words (the outbox keeps the failed message), and no address means no mail.
 */
export async function sendReceipt(db: Db, mailer: Mailer, facts: Omit<ReceiptFacts, 'to' | 'customerName' | 'shopName' | 'title'> & { jobId: string }) {
  const recipient = await receiptRecipient(db, facts.shopId, facts.jobId);
  if (!recipient) return { emailedTo: null, mailError: null };
  try {
    await mailer.send(receiptMail({ ...facts, to: recipient.email, customerName: recipient.customerName, shopName: recipient.shopName, title: recipient.title }));
    return { emailedTo: recipient.email, mailError: null };
  } catch (err) {
    return { emailedTo: null, mailError: err instanceof Error ? err.message : String(err) };
  }
}
