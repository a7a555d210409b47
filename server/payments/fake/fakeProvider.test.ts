import express from 'express';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { localProviderSecrets, stripeClient } from '../provider';
import { startPaymentFake, type PaymentFake } from './fakeProvider';

// The stand-in is checked through the provider's official SDK (stripe 23.1.0): the SDK must parse
// its answers into its own types and map its refusals onto its own error classes, and a webhook the
// stand-in signs must pass the SDK's constructEvent with the same secret.

const secrets = localProviderSecrets();
let fake: PaymentFake;
let stripe: Stripe;
let receiver: Server;
const received: { body: string; signature: string }[] = [];

beforeAll(async () => {
  const app = express();
  app.post('/hook', express.raw({ type: () => true }), (req, res) => {
    received.push({ body: (req.body as Buffer).toString('utf8'), signature: String(req.headers['stripe-signature']) });
    res.json({ received: true });
  });
  receiver = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  fake = await startPaymentFake({ ...secrets, webhookUrl: `http://127.0.0.1:${(receiver.address() as AddressInfo).port}/hook` });
  stripe = stripeClient(secrets.secretKey, fake.url);
});
afterAll(async () => {
  await fake.close();
  await new Promise((resolve) => receiver.close(resolve));
});

const params = (amount = 12_500): Stripe.Checkout.SessionCreateParams => ({
  mode: 'payment',
  success_url: 'http://shop.example/jobs/1?payment={CHECKOUT_SESSION_ID}',
  cancel_url: 'http://shop.example/jobs/1',
  line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: amount, product_data: { name: 'Deposit for Ferncliff Otters #9 jersey' } } }],
  metadata: { jobId: 'job-1' },
  customer_email: 'wren@customers.example',
});

const refusal = async (p: Promise<unknown>) => {
  const err = await p.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(Stripe.errors.StripeError);
  return err as InstanceType<typeof Stripe.errors.StripeError>;
};

describe('the local payment stand-in', () => {
  it('creates and retrieves a Checkout Session in the shape the SDK reads', async () => {
    const session = await stripe.checkout.sessions.create(params());
    expect(session).toMatchObject({ object: 'checkout.session', mode: 'payment', status: 'open', payment_status: 'unpaid', amount_total: 12_500, currency: 'usd', metadata: { jobId: 'job-1' } });
    expect(session.id).toMatch(/^cs_test_[A-Za-z0-9]+$/);
    expect(session.url).toBe(`${fake.url}/pay/${session.id}`);
    expect(session.expires_at - session.created).toBe(24 * 60 * 60);
    expect(await stripe.checkout.sessions.retrieve(session.id)).toEqual(session);
  });

  it('refuses what the provider refuses: an unknown session 404, an unknown parameter, a missing one, a bad key, a tiny amount', async () => {
    const missing = await refusal(stripe.checkout.sessions.retrieve('cs_test_doesNotExist'));
    expect(missing).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(missing).toMatchObject({ statusCode: 404, code: 'resource_missing', message: "No such checkout.session: 'cs_test_doesNotExist'" });

    const unknown = await refusal(stripe.checkout.sessions.create({ ...params(), colour: 'navy' } as Stripe.Checkout.SessionCreateParams));
    expect(unknown).toMatchObject({ statusCode: 400, message: 'Received unknown parameter: colour' });
    const noSuccess = { ...params() } as Partial<Stripe.Checkout.SessionCreateParams>;
    delete noSuccess.success_url;
    expect(await refusal(stripe.checkout.sessions.create(noSuccess as Stripe.Checkout.SessionCreateParams))).toMatchObject({ statusCode: 400, param: 'success_url' });

    const wrongKey = await refusal(stripeClient('sk_test_notTheKey0000', fake.url).checkout.sessions.retrieve('cs_test_x'));
    expect(wrongKey).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect(wrongKey.statusCode).toBe(401);

    expect(await refusal(stripe.checkout.sessions.create(params(49)))).toMatchObject({ statusCode: 400, code: 'amount_too_small' });
  });

  it("shows a phone-sized page with the amount and a Pay button; paying sends one signed checkout.session.completed and redirects to the shop", async () => {
    const session = await stripe.checkout.sessions.create(params(12_500));
    const page = await fetch(session.url!);
    const html = await page.text();
    expect(html).toContain('<meta name="viewport" content="width=device-width, initial-scale=1">');
    expect(html).toContain('$125.00');
    expect(html).toContain('Deposit for Ferncliff Otters #9 jersey');
    expect(html).not.toContain('<script');

    const before = received.length;
    const paid = await fetch(session.url!, { method: 'POST', redirect: 'manual' });
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`http://shop.example/jobs/1?payment=${session.id}`);
    expect(received.length).toBe(before + 1);
    const delivery = received.at(-1)!;
    const event = stripe.webhooks.constructEvent(delivery.body, delivery.signature, secrets.webhookSecret);
    expect(event.type).toBe('checkout.session.completed');
    const completed = event.data.object as Stripe.Checkout.Session;
    expect(completed).toMatchObject({ id: session.id, status: 'complete', payment_status: 'paid', amount_total: 12_500 });
    expect(completed.payment_intent).toMatch(/^pi_/);
    expect(() => stripe.webhooks.constructEvent(delivery.body, delivery.signature, 'whsec_notTheSecret')).toThrow(Stripe.errors.StripeSignatureVerificationError);

    // Pressing Pay again takes nothing more and sends nothing.
    const again = await fetch(session.url!, { method: 'POST', redirect: 'manual' });
    expect(again.status).toBe(409);
    expect(received.length).toBe(before + 1);
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe('complete');
  });

  it('answers a repeated request with the same idempotency key with the first session, and refuses the key with other parameters', async () => {
    // The provider's documented idempotent requests, through the SDK's own `idempotencyKey` option.
    const first = await stripe.checkout.sessions.create(params(8_000), { idempotencyKey: 'deposit-job-1' });
    const again = await stripe.checkout.sessions.create(params(8_000), { idempotencyKey: 'deposit-job-1' });
    expect(again.id).toBe(first.id);
    const other = await stripe.checkout.sessions.create(params(8_000), { idempotencyKey: 'deposit-job-2' });
    expect(other.id).not.toBe(first.id);
    const misuse = await stripe.checkout.sessions.create(params(9_000), { idempotencyKey: 'deposit-job-1' }).catch((e: unknown) => e);
    expect(misuse).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
  });

  it('answers 404 for a payment page that does not exist', async () => {
    expect((await fetch(`${fake.url}/pay/cs_test_nothingHere`)).status).toBe(404);
    expect((await fetch(`${fake.url}/pay/cs_test_nothingHere`, { method: 'POST' })).status).toBe(404);
  });
});
