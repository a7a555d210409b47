import express, { Router, type RequestHandler } from 'express';
import type { Logger } from 'pino';
import type Stripe from 'stripe';
import type { Db } from '../../db/client';
import { checkoutInput, manualPaymentInput } from '../../features/payments/schema';
import { currentMember, requireMember } from '../auth';
import { HttpError, parseOr400 } from '../errors';
import type { Mailer } from '../mail/mailer';
import type { PaymentsProvider } from '../payments/provider';
import { createThrottle, type ThrottleRules } from '../security/throttle';
import { paymentFromEvent, startCheckout } from '../services/checkout';
import { getJob } from '../services/jobs';
import { sendReceipt } from '../services/paymentMail';
import { listPayments, paymentSummary, recordManualPayment, recordProviderPayment } from '../services/payments';
import { idParam } from './params';

const staff = requireMember('owner', 'designer', 'front_desk');
/** Money is the front desk's and the owner's; designers see the panel but take nothing. */
const cashiers = requireMember('owner', 'front_desk');

export interface PaymentRouteDeps {
  db: Db;
  mailer: Mailer;
  logger: Logger;
  publicUrl: string;
  /** The provider's SDK and secrets; without it online payments answer 503 and manual ones still work. */
  provider?: PaymentsProvider;
  /** The shop's currency when no provider is set. */
  currency: string;
}

/** A job's payments, for the shop: /api/jobs/:jobId/payments */
export function jobPaymentRoutes(deps: PaymentRouteDeps): Router {
  const { db } = deps;
  const router = Router({ mergeParams: true });
  const jobIdOf = (params: unknown) => idParam((params as { jobId?: string }).jobId, 'Job');

  router.get('/', staff, async (req, res) => {
    const jobId = jobIdOf(req.params);
    const shopId = currentMember(res.locals).shopId;
    await getJob(db, shopId, jobId);
    const [payments, summary] = await Promise.all([listPayments(db, shopId, jobId), paymentSummary(db, shopId, jobId, deps.currency)]);
    res.json({ payments, summary, onlineEnabled: deps.provider !== undefined });
  });

  // Only the purpose is read: an amount in the body is never looked at.
  router.post('/checkout', cashiers, async (req, res) => {
    const jobId = jobIdOf(req.params);
    const { purpose } = parseOr400(checkoutInput, req.body);
    const member = currentMember(res.locals);
    res.status(201).json(await startCheckout(db, deps.provider, member.shopId, jobId, purpose, deps.publicUrl));
  });

  router.post('/manual', cashiers, async (req, res) => {
    const jobId = jobIdOf(req.params);
    const input = parseOr400(manualPaymentInput, req.body);
    const member = currentMember(res.locals);
    const recorded = await recordManualPayment(db, member.shopId, member, jobId, input, deps.currency);
    const mail = await sendReceipt(db, deps.mailer, {
      shopId: member.shopId,
      jobId,
      amountCents: input.amountCents,
      method: input.method,
      at: new Date(recorded.payment.at),
      summary: recorded.summary,
    });
    res.status(201).json({ ...recorded, ...mail });
  });

  return router;
}

/** Deliveries from the provider: generous for its retries, tight for anyone guessing. */
export const defaultWebhookThrottleRules: ThrottleRules = {
  perAccount: { points: 600, durationS: 60 },
  perAddress: { points: 300, durationS: 60 },
};

/**
 * The provider's webhook: /api/payments/webhook, public but throttled, mounted before the JSON
 * parser because the signature covers the exact bytes sent. A bad signature is a 400 and records
 * nothing; the same event twice is recorded once (its id is unique in the payments table).
 */
export function paymentWebhookRoutes(deps: PaymentRouteDeps & { rules?: ThrottleRules; keyPrefix?: string }): Router {
  const router = Router();
  const throttle = createThrottle(deps.db.$client, `${deps.keyPrefix ?? ''}payment-webhook`, deps.rules ?? defaultWebhookThrottleRules);
  const limit: RequestHandler = async (req, _res, next) => {
    try {
      await throttle.attempt('all-deliveries', req.ip ?? 'unknown');
      next();
    } catch (err) {
      next(err);
    }
  };

  router.post('/webhook', limit, express.raw({ type: () => true, limit: '512kb' }), async (req, res) => {
    if (!deps.provider) throw new HttpError(503, 'payments_off', 'Online payments are not set up on this server.');
    const event = verifiedEvent(deps.provider, req.body, req.headers['stripe-signature']);
    const payment = paymentFromEvent(event);
    if (!payment) return void res.json({ received: true, recorded: false });
    const row = await recordProviderPayment(deps.db, payment).catch((err: unknown) => {
      // A paid session for a job that is gone: acknowledge it so the provider stops retrying, and say so in the log.
      if (err instanceof HttpError && err.status === 404) return 'gone' as const;
      throw err;
    });
    if (row === 'gone') {
      deps.logger.error({ eventId: event.id, jobId: payment.jobId }, 'a payment arrived for a job that no longer exists; refund it from the provider\'s dashboard');
      return void res.json({ received: true, recorded: false });
    }
    res.json({ received: true, recorded: row !== null });
    // The receipt goes after the answer, so the provider is never kept waiting on the mail server.
    if (row) void mailReceipt(deps, row).catch((err: unknown) => deps.logger.warn({ err, paymentId: row.id }, 'the payment receipt could not be sent'));
  });
  return router;
}

/** The event, only when the signature over these exact bytes is good; otherwise a 400 and nothing else happens. */
function verifiedEvent(provider: PaymentsProvider, body: unknown, header: string | string[] | undefined): Stripe.Event {
  const signature = Array.isArray(header) ? header[0] : header;
  if (!Buffer.isBuffer(body) || !signature) throw new HttpError(400, 'bad_signature', 'The webhook has no signature; nothing was recorded.');
  try {
    return provider.stripe.webhooks.constructEvent(body, signature, provider.webhookSecret);
  } catch {
    throw new HttpError(400, 'bad_signature', 'The webhook signature does not match; nothing was recorded.');
  }
}

async function mailReceipt(deps: PaymentRouteDeps, row: { id: string; shopId: string; jobId: string; amountCents: number; at: Date }) {
  const summary = await paymentSummary(deps.db, row.shopId, row.jobId, deps.provider?.currency ?? deps.currency);
  if (!summary) return;
  const sent = await sendReceipt(deps.db, deps.mailer, { shopId: row.shopId, jobId: row.jobId, amountCents: row.amountCents, method: 'card_online', at: row.at, summary });
  if (sent.mailError) deps.logger.warn({ paymentId: row.id, reason: sent.mailError }, 'the payment receipt could not be sent');
}
