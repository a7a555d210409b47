import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { payments, quotes } from '../../db/schema';
import { createPaymentsHarness, type PaymentsHarness } from '../test/paymentsHarness';
import { addMember, signUpShop } from '../test/harness';

// Every online payment here goes through the provider's official SDK to the local stand-in,
// and comes back as a webhook signed with the SDK's own generateTestHeaderString; the route
// checks it with the SDK's constructEvent. Amounts are recomputed by hand in each test.

let h: PaymentsHarness;
beforeAll(async () => {
  h = await createPaymentsHarness();
});
afterAll(() => h.close());

// A worked quote: subtotal 444.00, tax 8 % = 35.52, total 479.52, deposit 50 % = 239.76.
const quote = { subtotalCents: 44_400, taxCents: 3_552, totalCents: 47_952, depositCents: 23_976 };

/**
 * A shop, a customer with an e-mail, a job, and the job's accepted quote written straight to the
 * database (the customer accepts quotes on the proof page, outside these tests).
 */
async function jobWithAcceptedQuote(price: { subtotalCents: number; taxCents: number; totalCents: number; depositCents: number } | null = quote) {
  const shop = await signUpShop(h, 'Gullsway & Tarn Framing');
  const email = `hollis-${Date.now()}-${Math.random().toString(36).slice(2, 8)}@customers.example`;
  const customer = (await shop.agent.post('/api/customers').send({ name: 'Hollis Penbarrow', email })).body.customer;
  const job = (await shop.agent.post('/api/jobs').send({ title: 'Saltmarsh Harriers #14 jersey', customerId: customer.id })).body.job;
  if (price) {
    const line = { kind: 'extra' as const, label: 'Framing as quoted', explanation: 'Set up for the payment tests', amountCents: price.subtotalCents };
    await h.database.db.insert(quotes).values({ shopId: shop.shopId, jobId: job.id, version: 1, state: 'accepted', lines: [line], ...price, acceptedAt: new Date(), acceptedName: 'Hollis Penbarrow' });
  }
  return { ...shop, jobId: job.id as string, customerEmail: email };
}

const listOf = async (agent: request.Agent, jobId: string) => (await agent.get(`/api/jobs/${jobId}/payments`)).body;
const sessionIdOf = (url: string) => new URL(url).pathname.split('/').pop()!;
const mailsTo = (to: string) => h.smtp.messages.filter((m) => m.to.includes(to));

/** What the customer does on the provider's page: press Pay. Returns where the page sends them next. */
async function payOnProviderPage(url: string): Promise<string> {
  const page = await fetch(url);
  expect(page.status).toBe(200);
  const paid = await fetch(url, { method: 'POST', redirect: 'manual' });
  expect(paid.status).toBe(303);
  return paid.headers.get('location') ?? '';
}

describe('deposits and balances through the provider', () => {
  it('a deposit paid on the provider page moves the job to part paid with the balance left, then the balance pays it off', async () => {
    const shop = await jobWithAcceptedQuote();
    expect((await listOf(shop.agent, shop.jobId)).summary).toMatchObject({ state: 'due', paidCents: 0, balanceCents: 47_952, depositDueCents: 23_976 });

    const started = await shop.agent.post(`/api/jobs/${shop.jobId}/payments/checkout`).send({ purpose: 'deposit' });
    expect(started.status).toBe(201);
    expect(started.body.amountCents).toBe(23_976);
    expect(started.body.url.startsWith(`${h.fake.url}/pay/cs_test_`)).toBe(true);
    // The session as the provider's API reports it, read back through the SDK.
    const session = await h.provider.stripe.checkout.sessions.retrieve(sessionIdOf(started.body.url));
    expect(session).toMatchObject({ amount_total: 23_976, currency: 'usd', status: 'open', customer_email: shop.customerEmail, metadata: { jobId: shop.jobId, purpose: 'deposit' } });

    const back = await payOnProviderPage(started.body.url);
    expect(back).toBe(`http://matwright.test/jobs/${shop.jobId}?payment=${session.id}`);
    const afterDeposit = await listOf(shop.agent, shop.jobId);
    // 479.52 - 239.76 = 239.76 left, by hand.
    expect(afterDeposit.summary).toMatchObject({ state: 'part_paid', paidCents: 23_976, balanceCents: 47_952 - 23_976, depositDueCents: 0 });
    expect(afterDeposit.payments).toHaveLength(1);
    expect(afterDeposit.payments[0]).toMatchObject({ kind: 'deposit', method: 'card_online', amountCents: 23_976, recordedByName: null });
    const [row] = await h.database.db.select().from(payments).where(eq(payments.jobId, shop.jobId));
    expect(row!.checkoutSessionId).toBe(session.id);
    expect(row!.paymentIntentId).toMatch(/^pi_/);
    expect(row!.providerEventId).toMatch(/^evt_/);

    const deposit = await shop.agent.post(`/api/jobs/${shop.jobId}/payments/checkout`).send({ purpose: 'deposit' });
    expect(deposit.status).toBe(409);
    expect(deposit.body.error.message).toBe('The deposit is already paid; take the balance instead.');

    const balance = await shop.agent.post(`/api/jobs/${shop.jobId}/payments/checkout`).send({ purpose: 'balance' });
    expect(balance.body.amountCents).toBe(23_976);
    await payOnProviderPage(balance.body.url);
    expect((await listOf(shop.agent, shop.jobId)).summary).toMatchObject({ state: 'paid', paidCents: 47_952, balanceCents: 0 });
    const refused = await shop.agent.post(`/api/jobs/${shop.jobId}/payments/checkout`).send({ purpose: 'balance' });
    expect(refused.status).toBe(409);
  });

  it('opens one payment page however often the deposit is asked for, and a new one once a payment has landed', async () => {
    const shop = await jobWithAcceptedQuote();
    const asked = await Promise.all([1, 2, 3].map(() => shop.agent.post(`/api/jobs/${shop.jobId}/payments/checkout`).send({ purpose: 'deposit' })));
    expect(asked.map((r) => r.status)).toEqual([201, 201, 201]);
    const urls = new Set(asked.map((r) => r.body.url));
    expect(urls.size).toBe(1);
    await payOnProviderPage(asked[0]!.body.url);
    // Paying the same page again is not possible, so the deposit is taken once.
    const again = await fetch(asked[0]!.body.url, { method: 'POST', redirect: 'manual' });
    expect(again.status).not.toBe(303);
    expect((await listOf(shop.agent, shop.jobId)).payments).toHaveLength(1);
    const balance = await shop.agent.post(`/api/jobs/${shop.jobId}/payments/checkout`).send({ purpose: 'balance' });
    expect(balance.status).toBe(201);
    expect(urls.has(balance.body.url)).toBe(false);
  });

  it('takes the amount from the accepted quote and ignores an amount the client sends', async () => {
    const shop = await jobWithAcceptedQuote();
    const res = await shop.agent
      .post(`/api/jobs/${shop.jobId}/payments/checkout`)
      .send({ purpose: 'deposit', amountCents: 1, amount: 1, unit_amount: 50, depositCents: 100 });
    expect(res.status).toBe(201);
    expect(res.body.amountCents).toBe(23_976);
    const session = await h.provider.stripe.checkout.sessions.retrieve(sessionIdOf(res.body.url));
    expect(session.amount_total).toBe(23_976);
  });

  it("passes on the provider's refusal in plain words (its smallest charge is 0.50) and records nothing", async () => {
    const shop = await jobWithAcceptedQuote({ subtotalCents: 40, taxCents: 0, totalCents: 40, depositCents: 20 });
    const res = await shop.agent.post(`/api/jobs/${shop.jobId}/payments/checkout`).send({ purpose: 'deposit' });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('payment_refused');
    expect(res.body.error.message).toContain('must add up to at least 0.50');
    expect((await listOf(shop.agent, shop.jobId)).payments).toEqual([]);
  });

  it('says in plain words that a job without an accepted quote has nothing to take, and records nothing', async () => {
    const shop = await jobWithAcceptedQuote(null);
    const online = await shop.agent.post(`/api/jobs/${shop.jobId}/payments/checkout`).send({ purpose: 'deposit' });
    expect(online.status).toBe(409);
    expect(online.body.error.code).toBe('no_accepted_quote');
    expect(online.body.error.message).toMatch(/^This job has no accepted quote yet/);
    const manual = await shop.agent.post(`/api/jobs/${shop.jobId}/payments/manual`).send({ method: 'cash', amountCents: 1000 });
    expect(manual.status).toBe(409);
    expect(await listOf(shop.agent, shop.jobId)).toEqual({ payments: [], summary: null, onlineEnabled: true });
  });
});

describe("the provider's webhook", () => {
  /** A paid session whose event the app has not received yet (its delivery went nowhere). */
  async function paidButUndelivered() {
    const shop = await jobWithAcceptedQuote();
    const started = await shop.agent.post(`/api/jobs/${shop.jobId}/payments/checkout`).send({ purpose: 'deposit' });
    h.fake.setWebhookUrl('http://127.0.0.1:9/nothing-listens-here');
    const paid = await h.fake.pay(sessionIdOf(started.body.url));
    h.fake.setWebhookUrl(`${h.appUrl}/api/payments/webhook`);
    expect(paid!.delivery.ok).toBe(false);
    return { shop, event: paid!.event };
  }

  const post = (payload: string, signature?: string) => {
    const req = request(h.app).post('/api/payments/webhook').set('Content-Type', 'application/json');
    return (signature ? req.set('Stripe-Signature', signature) : req).send(payload);
  };

  it('refuses a bad signature, a tampered body, a stale timestamp and no signature with 400, and changes nothing', async () => {
    const { shop, event } = await paidButUndelivered();
    const payload = JSON.stringify(event);
    const sign = (body: string, secret: string, timestamp?: number) => h.provider.stripe.webhooks.generateTestHeaderString({ payload: body, secret, timestamp });
    const mailsBefore = mailsTo(shop.customerEmail).length;

    const wrongSecret = await post(payload, sign(payload, 'whsec_someoneElsesSecret'));
    const tampered = await post(payload.replace('"amount_total":23976', '"amount_total":99'), sign(payload, h.provider.webhookSecret));
    // The SDK's default tolerance is 300 s; ten minutes old is refused.
    const stale = await post(payload, sign(payload, h.provider.webhookSecret, Math.floor(Date.now() / 1000) - 600));
    const unsigned = await post(payload);
    for (const res of [wrongSecret, tampered, stale, unsigned]) {
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('bad_signature');
    }
    expect(payload).toContain('"amount_total":23976');
    expect(await listOf(shop.agent, shop.jobId)).toMatchObject({ payments: [], summary: { state: 'due', paidCents: 0 } });
    expect(mailsTo(shop.customerEmail).length).toBe(mailsBefore);

    // The same event, properly signed, is then recorded.
    expect((await h.fake.redeliver(event.id)).status).toBe(200);
    expect((await listOf(shop.agent, shop.jobId)).summary.paidCents).toBe(23_976);
  });

  it('applies the same event twice only once, and a second event for the same session not at all', async () => {
    const { shop, event } = await paidButUndelivered();
    const first = await h.fake.redeliver(event.id);
    const second = await h.fake.redeliver(event.id);
    expect([first.status, second.status]).toEqual([200, 200]);
    // Another event id for the same paid session (the provider's async success after the completion).
    const again = JSON.stringify({ ...event, id: `${event.id}x`, type: 'checkout.session.async_payment_succeeded' });
    const res = await post(again, h.provider.stripe.webhooks.generateTestHeaderString({ payload: again, secret: h.provider.webhookSecret }));
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ received: true, recorded: false });

    const list = await listOf(shop.agent, shop.jobId);
    expect(list.payments).toHaveLength(1);
    expect(list.summary.paidCents).toBe(23_976);
    await h.smtp.waitFor(shop.customerEmail);
    await new Promise((r) => setTimeout(r, 300));
    expect(mailsTo(shop.customerEmail)).toHaveLength(1);
  });

  it("acknowledges events that are not a paid session of this app's without recording anything", async () => {
    const shop = await jobWithAcceptedQuote();
    const other = JSON.stringify({ id: 'evt_other1', object: 'event', type: 'customer.created', data: { object: { id: 'cus_1', object: 'customer' } } });
    const res = await post(other, h.provider.stripe.webhooks.generateTestHeaderString({ payload: other, secret: h.provider.webhookSecret }));
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ received: true, recorded: false });
    expect((await listOf(shop.agent, shop.jobId)).payments).toEqual([]);
  });
});

describe('payments taken by hand', () => {
  it('records cash with who and when, refuses more than the balance with nothing recorded, and pays off to the cent', async () => {
    const shop = await jobWithAcceptedQuote({ subtotalCents: 10_000, taxCents: 0, totalCents: 10_000, depositCents: 5_000 });
    const desk = await addMember(h, shop.shopId, 'front_desk');
    const cash = await desk.post(`/api/jobs/${shop.jobId}/payments/manual`).send({ method: 'cash', amountCents: 4_000, note: 'Counted twice' });
    expect(cash.status).toBe(201);
    expect(cash.body.payment).toMatchObject({ kind: 'manual', method: 'cash', amountCents: 4_000, note: 'Counted twice', recordedByName: 'Test front_desk' });
    expect(Math.abs(Date.parse(cash.body.payment.at) - Date.now())).toBeLessThan(60_000);
    expect(cash.body.summary).toMatchObject({ state: 'part_paid', balanceCents: 6_000 });
    expect(cash.body.emailedTo).toBe(shop.customerEmail);

    const mailsBefore = mailsTo(shop.customerEmail).length;
    const over = await desk.post(`/api/jobs/${shop.jobId}/payments/manual`).send({ method: 'cheque', amountCents: 6_001 });
    expect(over.status).toBe(409);
    expect(over.body.error.message).toBe('That is more than the $60.00 still owed on this job; nothing was recorded. Take $60.00 or less.');
    expect((await listOf(shop.agent, shop.jobId)).payments).toHaveLength(1);
    expect(mailsTo(shop.customerEmail).length).toBe(mailsBefore);

    const rest = await desk.post(`/api/jobs/${shop.jobId}/payments/manual`).send({ method: 'card_in_shop', amountCents: 6_000 });
    expect(rest.body.summary).toMatchObject({ state: 'paid', paidCents: 10_000, balanceCents: 0 });
    const more = await shop.agent.post(`/api/jobs/${shop.jobId}/payments/manual`).send({ method: 'cash', amountCents: 1 });
    expect(more.status).toBe(409);
    expect(more.body.error.message).toBe('This job is already paid in full; nothing was recorded.');
  });

  it('refuses a zero, negative, fractional or card-online amount and an unknown method with the field named', async () => {
    const shop = await jobWithAcceptedQuote();
    const bodies = [
      [{ method: 'cash', amountCents: 0 }, 'amountCents'],
      [{ method: 'cash', amountCents: -500 }, 'amountCents'],
      [{ method: 'cash', amountCents: 10.5 }, 'amountCents'],
      [{ method: 'card_online', amountCents: 500 }, 'method'],
      [{ method: 'barter', amountCents: 500 }, 'method'],
      [{ method: 'cash', amountCents: 500, note: 'tab\u0007bell' }, 'note'],
    ] as const;
    for (const [body, field] of bodies) {
      const res = await shop.agent.post(`/api/jobs/${shop.jobId}/payments/manual`).send(body);
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields)).toContain(field);
    }
    expect((await listOf(shop.agent, shop.jobId)).payments).toEqual([]);
  });
});

describe('the receipt', () => {
  it('goes once per payment to the customer, in text and HTML, with the amount and what remains', async () => {
    const shop = await jobWithAcceptedQuote();
    const res = await shop.agent.post(`/api/jobs/${shop.jobId}/payments/manual`).send({ method: 'cheque', amountCents: 10_000, note: 'Cheque 0042' });
    expect(res.status).toBe(201);
    // The SMTP fake parses what it receives with mailparser's simpleParser.
    const mail = await h.smtp.waitFor(shop.customerEmail);
    expect(mail.subject).toBe('Gullsway & Tarn Framing: receipt for $100.00, Saltmarsh Harriers #14 jersey');
    expect(mail.text).toContain('Gullsway & Tarn Framing received $100.00 (cheque) on ');
    // 479.52 - 100.00 = 379.52, by hand.
    expect(mail.text).toContain('You have now paid $100.00 of $479.52. Still to pay: $379.52.');
    expect(mail.html).toContain('Gullsway &amp; Tarn Framing received $100.00');
    expect(mail.html).toContain('Still to pay: $379.52.');
    expect(mail.html).not.toMatch(/<img|<a /i);
    expect(mailsTo(shop.customerEmail)).toHaveLength(1);
  });
});
