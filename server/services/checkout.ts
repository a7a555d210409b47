import { and, eq } from 'drizzle-orm';
import { createHash } from 'node:crypto';
import type Stripe from 'stripe';
import { z } from 'zod';
import type { Db } from '../../db/client';
import { customers, jobs, shops } from '../../db/schema';
import { HttpError, notFound } from '../errors';
import type { PaymentsProvider } from '../payments/provider';
import { requireSummary, type ProviderPayment } from './payments';

export const paymentsOff = () =>
  new HttpError(503, 'payments_off', 'Online payments are not set up on this server. Record the payment by hand, or ask the owner to set the payment provider\'s keys.');

/** What the server writes into every session, and reads back from the signed event. */
const sessionMetadata = z.object({
  shopId: z.string().uuid(),
  jobId: z.string().uuid(),
  quoteId: z.string().uuid(),
  purpose: z.enum(['deposit', 'balance']),
});

async function jobFacts(db: Db, shopId: string, jobId: string) {
  const [row] = await db
    .select({ title: jobs.title, email: customers.email, shopName: shops.name })
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(shops, eq(shops.id, jobs.shopId))
    .where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  if (!row) throw notFound('Job');
  return row;
}

/** The provider's refusal or an unreachable provider, in plain words; never a 500. */
function providerFailure(err: unknown): HttpError {
  // The SDK's refusal classes carry their name in `type`; read it so this module needs only the SDK's types.
  const reason = err instanceof Error ? err.message : String(err);
  if ((err as { type?: unknown } | null)?.type === 'StripeInvalidRequestError') {
    return new HttpError(422, 'payment_refused', `The payment provider refused this payment: ${reason}`);
  }
  return new HttpError(502, 'payment_provider_failed', `The payment provider could not be reached (${reason}). Try again in a minute, or record the payment by hand.`);
}

/**
 * Opens the provider's payment page for the deposit or the balance. The amount comes from the
 * accepted quote less what is already paid, never from the request.
 */
export async function startCheckout(db: Db, provider: PaymentsProvider | undefined, shopId: string, jobId: string, purpose: 'deposit' | 'balance', publicUrl: string) {
  const job = await jobFacts(db, shopId, jobId);
  const summary = await requireSummary(db, shopId, jobId, provider?.currency ?? 'usd');
  if (!provider) throw paymentsOff();
  const amountCents = purpose === 'deposit' ? summary.depositDueCents : summary.balanceCents;
  if (amountCents === 0) {
    const words = purpose === 'deposit' ? 'The deposit is already paid; take the balance instead.' : 'This job is paid in full; there is nothing left to take.';
    throw new HttpError(409, 'nothing_due', words);
  }
  const metadata = { shopId, jobId, quoteId: summary.quoteId, purpose };
  const back = `${publicUrl.replace(/\/$/, '')}/jobs/${jobId}`;
  try {
    const params: Stripe.Checkout.SessionCreateParams = {
      mode: 'payment',
      line_items: [
        {
          quantity: 1,
          price_data: { currency: provider.currency, unit_amount: amountCents, product_data: { name: `${purpose === 'deposit' ? 'Deposit' : 'Balance'} for ${job.title}`.slice(0, 250) } },
        },
      ],
      success_url: `${back}?payment={CHECKOUT_SESSION_ID}`,
      cancel_url: back,
      client_reference_id: jobId,
      ...(job.email ? { customer_email: job.email } : {}),
      metadata,
      payment_intent_data: { metadata, description: `${job.shopName}: ${job.title}`.slice(0, 1000) },
    };
    // Pressing "take the deposit" twice (two devices, a double tap, a retry after a slow answer)
    // must open the same payment page, never a second one the customer could also pay. The key
    // names everything the session is made from and what is paid so far, so once a payment
    // lands the next press opens a new page for what is left.
    const idempotencyKey = `checkout-${createHash('sha256').update(JSON.stringify([params, summary.paidCents])).digest('hex')}`;
    const session = await provider.stripe.checkout.sessions.create(params, { idempotencyKey });
    if (!session.url) throw new Error('the provider returned no payment page');
    return { url: session.url, amountCents, purpose };
  } catch (err) {
    throw providerFailure(err);
  }
}

/**
 * The payment a verified checkout.session.completed (or async_payment_succeeded) event reports,
 * or null when the event is not a paid session of ours (other events, unpaid sessions, foreign metadata).
 */
export function paymentFromEvent(event: Stripe.Event): ProviderPayment | null {
  if (event.type !== 'checkout.session.completed' && event.type !== 'checkout.session.async_payment_succeeded') return null;
  const session = event.data.object;
  if (session.payment_status !== 'paid' || session.amount_total === null || session.amount_total <= 0) return null;
  const meta = sessionMetadata.safeParse(session.metadata ?? {});
  if (!meta.success) return null;
  const intent = session.payment_intent;
  return {
    ...meta.data,
    amountCents: session.amount_total,
    currency: session.currency ?? 'usd',
    checkoutSessionId: session.id,
    paymentIntentId: typeof intent === 'string' ? intent : (intent?.id ?? null),
    eventId: event.id,
  };
}
