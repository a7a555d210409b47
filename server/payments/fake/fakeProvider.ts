import express, { type Request, type Response } from 'express';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import Stripe from 'stripe';
import { checkoutPage, closedPage, deliveryFailedPage, notFoundPage } from './checkoutPage';
import { invalidRequest, sessionCreateParams } from './sessionParams';
import { createSessionStore, eventFor, type FakeEvent, type FakeSession } from './sessionStore';

export interface PaymentFakeOptions {
  /** The key the SDK must present (Bearer); others are refused with 401 as the provider does. */
  secretKey: string;
  /** Signs each webhook, like the endpoint secret (whsec_...) of the provider's dashboard. */
  webhookSecret: string;
  /** Where webhooks go (the app's /api/payments/webhook); set later with setWebhookUrl when unknown yet. */
  webhookUrl?: string;
  /** Keep the process alive for the fake alone? Off for tests and scripts. */
  unref?: boolean;
}

export interface DeliveryResult {
  ok: boolean;
  status: number;
  reason: string;
}

export interface PaymentFake {
  /** http://127.0.0.1:PORT, for the SDK's host/port/protocol options. */
  url: string;
  /** Every event made so far, oldest first (checkout.session.completed for each payment). */
  events: readonly FakeEvent[];
  setWebhookUrl(url: string): void;
  session(id: string): FakeSession | undefined;
  /** What the page's Pay button does: completes the session and sends the signed webhook once. */
  pay(sessionId: string): Promise<{ event: FakeEvent; delivery: DeliveryResult } | null>;
  /** Sends an event again with a fresh signature, as the provider's retries do. */
  redeliver(eventId: string): Promise<DeliveryResult>;
  close(): Promise<void>;
}

// Events carry the API version the SDK was built for, as the provider stamps the account's version.
const API_VERSION = Stripe.API_VERSION;
const DELIVERY_TIMEOUT_MS = 10_000;
/** Events kept in memory at most, oldest dropped first. */
const KEEP_EVENTS = 1000;

const providerError = (res: Response, status: number, error: { type: string; message: string; code?: string; param?: string }) =>
  res.status(status).json({ error });

/**
 * A local stand-in for the payment provider's Checkout API, for development and tests: the
 * official SDK talks to it over HTTP (create and retrieve a Checkout Session), its page takes a
 * pretend payment, and it sends the same signed checkout.session.completed webhook the provider
 * sends. Listens on 127.0.0.1 at a free port; nothing leaves the machine.
 */
export async function startPaymentFake(options: PaymentFakeOptions): Promise<PaymentFake> {
  const store = createSessionStore();
  const events: FakeEvent[] = [];
  const signer = new Stripe(options.secretKey, { telemetry: false });
  let webhookUrl = options.webhookUrl;
  let base = '';

  const deliver = async (event: FakeEvent): Promise<DeliveryResult> => {
    if (!webhookUrl) return { ok: false, status: 0, reason: 'no webhook address is set' };
    const payload = JSON.stringify(event, null, 2);
    const signature = signer.webhooks.generateTestHeaderString({ payload, secret: options.webhookSecret });
    try {
      const res = await fetch(webhookUrl, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json; charset=utf-8', 'Stripe-Signature': signature, 'User-Agent': 'Matwright-Payment-Fake/1.0' },
        body: payload,
        signal: AbortSignal.timeout(DELIVERY_TIMEOUT_MS),
      });
      await res.arrayBuffer();
      return { ok: res.ok, status: res.status, reason: res.ok ? 'delivered' : `it answered ${res.status}` };
    } catch (err) {
      return { ok: false, status: 0, reason: err instanceof Error ? err.message : String(err) };
    }
  };

  const pay = async (sessionId: string) => {
    if (!store.complete(sessionId)) return null;
    const event = eventFor(store.get(sessionId)!, 'checkout.session.completed', API_VERSION);
    events.push(event);
    if (events.length > KEEP_EVENTS) events.shift();
    return { event, delivery: await deliver(event) };
  };

  const app = express();
  app.disable('x-powered-by');
  app.use('/v1', apiRoutes(store, options.secretKey, () => base));
  app.use('/pay', pageRoutes(store, pay, events, deliver));
  app.use((req, res) => providerError(res, 404, { type: 'invalid_request_error', message: `Unrecognized request URL (${req.method}: ${req.path}).` }));

  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
    s.once('error', reject);
  });
  if (options.unref) server.unref();
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

  return {
    url: base,
    events,
    setWebhookUrl: (url) => void (webhookUrl = url),
    session: (id) => store.get(id),
    pay,
    async redeliver(eventId) {
      const event = events.find((e) => e.id === eventId);
      if (!event) return { ok: false, status: 404, reason: `no event ${eventId}` };
      return deliver(event);
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/** The provider's REST API: the SDK's form-encoded requests, its JSON answers and its error shapes. */
function apiRoutes(store: ReturnType<typeof createSessionStore>, secretKey: string, base: () => string) {
  const router = express.Router();
  const replays = idempotentReplays();
  router.use((req, res, next) => {
    const key = /^Bearer (.+)$/.exec(req.headers.authorization ?? '')?.[1];
    if (key !== secretKey) {
      const shown = key ? `${key.slice(0, 8)}${'*'.repeat(Math.max(0, key.length - 12))}${key.slice(-4)}` : '';
      const message = key ? `Invalid API Key provided: ${shown}` : 'You did not provide an API key.';
      return providerError(res, 401, { type: 'invalid_request_error', message });
    }
    next();
  });
  router.use(express.urlencoded({ extended: true, limit: '100kb', parameterLimit: 1000 }));

  router.post('/checkout/sessions', (req: Request, res: Response) => {
    const parsed = sessionCreateParams.safeParse(req.body ?? {});
    if (!parsed.success) return providerError(res, 400, invalidRequest(parsed.error));
    const currencies = new Set(parsed.data.line_items.map((l) => l.price_data.currency));
    if (currencies.size > 1) return providerError(res, 400, { type: 'invalid_request_error', message: 'All line items must use the same currency.', param: 'line_items' });
    const total = parsed.data.line_items.reduce((sum, l) => sum + l.quantity * l.price_data.unit_amount, 0);
    // The provider's smallest charge is about 0.50 in the major currencies.
    if (total < 50) return providerError(res, 400, { type: 'invalid_request_error', code: 'amount_too_small', message: 'The Checkout Session\'s total amount due must add up to at least 0.50.', param: 'line_items' });
    const key = req.headers['idempotency-key'];
    const sameRequest = typeof key === 'string' ? replays.lookup(key, req.body) : null;
    if (sameRequest === 'different') {
      return providerError(res, 400, { type: 'idempotency_error', message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.` });
    }
    if (sameRequest) return res.json(sameRequest);
    const session = store.create(parsed.data, base());
    if (typeof key === 'string') replays.save(key, req.body, session);
    res.json(session);
  });

  router.get('/checkout/sessions/:id', (req, res) => {
    const session = store.get(String(req.params.id));
    if (!session) {
      return providerError(res, 404, { type: 'invalid_request_error', code: 'resource_missing', param: 'session', message: `No such checkout.session: '${req.params.id}'` });
    }
    res.json(session);
  });
  return router;
}

/** The page a customer pays on, and the button's POST. */
function pageRoutes(
  store: ReturnType<typeof createSessionStore>,
  pay: (id: string) => Promise<{ event: FakeEvent; delivery: DeliveryResult } | null>,
  events: FakeEvent[],
  deliver: (event: FakeEvent) => Promise<DeliveryResult>,
) {
  const router = express.Router();
  router.use((_req, res, next) => {
    res.set({ 'Content-Security-Policy': "default-src 'none'; style-src 'unsafe-inline'; img-src 'self'; base-uri 'none'; frame-ancestors 'none'", 'Cache-Control': 'no-store', 'Referrer-Policy': 'no-referrer' });
    next();
  });
  const successUrl = (s: FakeSession) => s.success_url.replace('{CHECKOUT_SESSION_ID}', encodeURIComponent(s.id));

  router.get('/:id', (req, res) => {
    const session = store.get(req.params.id);
    if (!session) return res.status(404).type('html').send(notFoundPage());
    res.type('html').send(session.status === 'open' ? checkoutPage(session, store.lines(session.id)) : closedPage(session, successUrl(session)));
  });

  router.post('/:id', async (req, res) => {
    const session = store.get(req.params.id);
    if (!session) return res.status(404).type('html').send(notFoundPage());
    const paid = session.status === 'open' ? await pay(session.id) : null;
    const now = store.get(session.id)!;
    if (!paid) return res.status(409).type('html').send(closedPage(now, successUrl(now)));
    if (!paid.delivery.ok) return res.status(502).type('html').send(deliveryFailedPage(now, successUrl(now), paid.delivery.reason));
    res.redirect(303, successUrl(now));
  });

  router.post('/:id/notify', async (req, res) => {
    const session = store.get(req.params.id);
    const event = [...events].reverse().find((e) => e.data.object.id === req.params.id);
    if (!session || !event) return res.status(404).type('html').send(notFoundPage());
    const delivery = await deliver(event);
    if (!delivery.ok) return res.status(502).type('html').send(deliveryFailedPage(session, successUrl(session), delivery.reason));
    res.redirect(303, successUrl(session));
  });
  return router;
}

/**
 * The provider's idempotent requests: a POST repeated with the same Idempotency-Key and the same
 * parameters gets the first answer again (nothing new is made); the same key with other parameters
 * is refused. Keys are kept for 24 hours, as the provider documents.
 */
function idempotentReplays() {
  const KEEP_MS = 24 * 60 * 60 * 1000;
  const MAX_KEYS = 10_000;
  const seen = new Map<string, { body: string; answer: unknown; at: number }>();
  return {
    lookup(key: string, body: unknown): unknown | 'different' | null {
      const entry = seen.get(key);
      if (!entry || Date.now() - entry.at > KEEP_MS) return null;
      return entry.body === JSON.stringify(body) ? entry.answer : 'different';
    },
    save(key: string, body: unknown, answer: unknown) {
      seen.set(key, { body: JSON.stringify(body), answer, at: Date.now() });
      if (seen.size > MAX_KEYS) seen.delete(seen.keys().next().value!);
    },
  };
}
