import { and, desc, eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { jobs, members, payments, quotes, type PaymentRow } from '../../db/schema';
import { moneyText, paymentStateOf, type ManualPaymentInput, type PaymentSummary } from '../../features/payments/schema';
import { HttpError, notFound } from '../errors';
import { recordActivity } from './activity';

/** Drizzle's query builder: the pool or an open transaction. */
type Reader = Pick<Db, 'select'>;
type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

export const noAcceptedQuote = () =>
  new HttpError(
    409,
    'no_accepted_quote',
    'This job has no accepted quote yet, so there is no price to take payment against. Send a quote with the proof; once the customer accepts it, the deposit and the balance can be taken.',
  );

/** The job's accepted quote (the price), or null. */
async function acceptedQuote(db: Reader, shopId: string, jobId: string) {
  const [quote] = await db
    .select({ id: quotes.id, version: quotes.version, totalCents: quotes.totalCents, depositCents: quotes.depositCents })
    .from(quotes)
    .where(and(eq(quotes.shopId, shopId), eq(quotes.jobId, jobId), eq(quotes.state, 'accepted')));
  return quote ?? null;
}

async function paidSoFar(db: Reader, shopId: string, jobId: string): Promise<number> {
  const [row] = await db
    .select({ paid: sql<string>`coalesce(sum(${payments.amountCents}), 0)` })
    .from(payments)
    .where(and(eq(payments.shopId, shopId), eq(payments.jobId, jobId)));
  return Number(row?.paid ?? 0);
}

/**
 * Where the job's money stands, computed here from the accepted quote and the payments recorded:
 * deposit due = the quote's deposit less what is paid, balance = the total less what is paid,
 * neither below zero. Null while no quote is accepted.
 */
export async function paymentSummary(db: Reader, shopId: string, jobId: string, currency: string): Promise<PaymentSummary | null> {
  const quote = await acceptedQuote(db, shopId, jobId);
  if (!quote) return null;
  const paidCents = await paidSoFar(db, shopId, jobId);
  return {
    quoteId: quote.id,
    quoteVersion: quote.version,
    currency,
    totalCents: quote.totalCents,
    depositCents: quote.depositCents,
    paidCents,
    balanceCents: Math.max(0, quote.totalCents - paidCents),
    depositDueCents: Math.max(0, quote.depositCents - paidCents),
    overpaidCents: Math.max(0, paidCents - quote.totalCents),
    state: paymentStateOf(quote.totalCents, paidCents),
  };
}

/** The job's summary, or the 409 that says a quote must be accepted first. */
export async function requireSummary(db: Reader, shopId: string, jobId: string, currency: string): Promise<PaymentSummary> {
  const summary = await paymentSummary(db, shopId, jobId, currency);
  if (!summary) throw noAcceptedQuote();
  return summary;
}

/** Locks the job's row for the rest of the transaction, so two payments cannot both pass the balance check. */
async function lockJob(tx: Tx, shopId: string, jobId: string) {
  const [job] = await tx.select({ id: jobs.id }).from(jobs).where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId))).for('update');
  if (!job) throw notFound('Job');
}

export async function listPayments(db: Db, shopId: string, jobId: string) {
  const rows = await db
    .select({
      id: payments.id,
      kind: payments.kind,
      method: payments.method,
      amountCents: payments.amountCents,
      currency: payments.currency,
      note: payments.note,
      checkoutSessionId: payments.checkoutSessionId,
      recordedByName: members.name,
      at: payments.at,
    })
    .from(payments)
    .leftJoin(members, eq(members.id, payments.recordedBy))
    .where(and(eq(payments.shopId, shopId), eq(payments.jobId, jobId)))
    .orderBy(desc(payments.at))
    .limit(500);
  return rows.map((r) => ({ ...r, recordedByName: r.recordedByName ?? null, at: r.at.toISOString() }));
}

export function paymentView(row: PaymentRow, recordedByName: string | null) {
  return {
    id: row.id,
    kind: row.kind,
    method: row.method,
    amountCents: row.amountCents,
    currency: row.currency,
    note: row.note,
    checkoutSessionId: row.checkoutSessionId,
    recordedByName,
    at: row.at.toISOString(),
  };
}

/**
 * Cash, a cheque or a card taken in the shop, recorded by the front desk with who and when.
 * More than the balance is refused and nothing is recorded.
 */
export async function recordManualPayment(db: Db, shopId: string, member: { id: string; name: string }, jobId: string, input: ManualPaymentInput, currency: string) {
  return db.transaction(async (tx) => {
    await lockJob(tx, shopId, jobId);
    const summary = await requireSummary(tx, shopId, jobId, currency);
    if (input.amountCents > summary.balanceCents) {
      const left = moneyText(summary.balanceCents, currency);
      const message =
        summary.balanceCents === 0
          ? 'This job is already paid in full; nothing was recorded.'
          : `That is more than the ${left} still owed on this job; nothing was recorded. Take ${left} or less.`;
      throw new HttpError(409, 'more_than_balance', message, { amountCents: message });
    }
    const [row] = await tx
      .insert(payments)
      .values({ shopId, jobId, quoteId: summary.quoteId, kind: 'manual', method: input.method, amountCents: input.amountCents, currency, note: input.note ?? null, recordedBy: member.id })
      .returning();
    await recordActivity(tx, { shopId, jobId, memberId: member.id, kind: 'payment_recorded', detail: { amountCents: input.amountCents, currency, method: input.method, kind: 'manual' } });
    return { payment: paymentView(row!, member.name), summary: (await paymentSummary(tx, shopId, jobId, currency))! };
  });
}

/** One online payment as the provider's signed event reports it. */
export interface ProviderPayment {
  shopId: string;
  jobId: string;
  quoteId: string;
  purpose: 'deposit' | 'balance';
  amountCents: number;
  currency: string;
  checkoutSessionId: string;
  paymentIntentId: string | null;
  eventId: string;
}

/**
 * Records an online payment once: the event id and the session id are unique, so a second
 * delivery (or a second event for the same session) inserts nothing and returns null.
 * The money was taken, so it is recorded even when it goes past the balance (shown as overpaid).
 */
export async function recordProviderPayment(db: Db, p: ProviderPayment) {
  return db.transaction(async (tx) => {
    await lockJob(tx, p.shopId, p.jobId);
    const [quote] = await tx.select({ id: quotes.id }).from(quotes).where(and(eq(quotes.shopId, p.shopId), eq(quotes.jobId, p.jobId), eq(quotes.id, p.quoteId)));
    const [row] = await tx
      .insert(payments)
      .values({
        shopId: p.shopId,
        jobId: p.jobId,
        quoteId: quote?.id ?? null,
        kind: p.purpose,
        method: 'card_online',
        amountCents: p.amountCents,
        currency: p.currency,
        checkoutSessionId: p.checkoutSessionId,
        paymentIntentId: p.paymentIntentId,
        providerEventId: p.eventId,
        recordedBy: null,
      })
      .onConflictDoNothing()
      .returning();
    if (!row) return null;
    await recordActivity(tx, { shopId: p.shopId, jobId: p.jobId, memberId: null, kind: 'payment_recorded', detail: { amountCents: p.amountCents, currency: p.currency, method: 'card_online', kind: p.purpose } });
    return row;
  });
}
