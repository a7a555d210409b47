import { eq } from 'drizzle-orm';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { PROOF_CLOSED_MESSAGE } from '../../features/proofs/schema';
import { connectDatabase } from '../../db/client';
import { arrivalPhotos, shipments } from '../../db/schema';
import { createApp } from '../app';
import { noisyImage } from '../test/fixtures/images';
import { addMember, createMailHarness, signUpShop, TEST_PUBLIC_URL, testThrottle, type MailHarness } from '../test/harness';

let h: MailHarness;
beforeAll(async () => {
  h = await createMailHarness();
});
afterAll(() => h.close());

// 1 in = 25.4 mm, 1 lb = 0.45359237 kg (NIST Handbook 44, Appendix C).
const MM = 25.4;
const LB = 0.45359237;

const mat = (id: string) => ({ id, name: id, color: '#1D2B4A', coreColor: '#F6F3EA', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } });
const document = {
  schemaVersion: 2,
  outer: { width: 20, height: 16 },
  mats: [mat('top'), mat('under')],
  mountingBoard: { color: '#FFFFFF', cut: false },
  openings: [{ id: 'jersey', shape: { kind: 'rectangle', width: 8, height: 6 }, center: { x: 10, y: 8 }, depth: 1 }],
};
// BX-150 from the default moulding list: face 1.5 in, rabbet 2.5 in, 0.9 lb a foot.
const frame = { mouldingCode: 'BX-150', glazingKind: 'acrylic', shadowboxDepthIn: 2 };

type Shop = Awaited<ReturnType<typeof signUpShop>> & { jobId: string; token: string; customerEmail: string | null };

async function approvedJob(options: { email?: boolean } = {}): Promise<Shop> {
  const shop = await signUpShop(h, 'Gullwing Lane Framers');
  const customerEmail = options.email === false ? null : `wren-${Date.now()}-${Math.random().toString(36).slice(2)}@customers.example`;
  const customer = (await shop.agent.post('/api/customers').send({ name: 'Wren Tallowby', ...(customerEmail ? { email: customerEmail } : {}) })).body.customer;
  const job = (await shop.agent.post('/api/jobs').send({ title: 'Harrowgate Stormpetrels #11 jersey', customerId: customer.id, frame })).body.job;
  await shop.agent.post(`/api/jobs/${job.id}/pieces`).send({ kind: 'garment', label: 'Away jersey', widthIn: 28, heightIn: 30 });
  const layout = (await shop.agent.post(`/api/jobs/${job.id}/layouts`).send({ name: 'Shadowbox', document })).body.layout;
  const sent = await shop.agent.post(`/api/jobs/${job.id}/proofs`).send({ layoutId: layout.id, baseRevision: 1 });
  const token = String(sent.body.link).split('/proof/')[1]!;
  expect((await request(h.app).post(`/api/proofs/${token}/decision`).send({ decision: 'approve', name: 'Wren Tallowby' })).status).toBe(200);
  return { ...shop, jobId: job.id, token, customerEmail };
}

/** The one place a test job is brought to "ready" after approval, following the shop's order of statuses. */
async function readyToShip(shop: Shop) {
  for (const status of ['cutting', 'assembling', 'ready']) {
    expect((await shop.agent.post(`/api/jobs/${shop.jobId}/status`).send({ status })).status).toBe(200);
  }
}

const ship = (shop: Shop, body: object = { carrier: 'Parcel carrier', trackingNumber: '1ZX 4471-09' }) => shop.agent.post(`/api/jobs/${shop.jobId}/shipment`).send(body);
const statusOf = async (shop: Shop) => (await shop.agent.get(`/api/jobs/${shop.jobId}`)).body.job.status;

describe("the job's shipping estimate", () => {
  it('sizes the box from the layout and the moulding and weighs glass and acrylic side by side, as computed by hand', async () => {
    const shop = await approvedJob();
    const res = await shop.agent.get(`/api/jobs/${shop.jobId}/shipping`);
    expect(res.status).toBe(200);
    expect(res.body.missing).toBeNull();
    const [glass, acrylic] = res.body.estimates;
    expect([glass.glazingKind, acrylic.glazingKind]).toEqual(['regular_glass', 'acrylic']);
    // Frame 20 + 2 x 1.5 by 16 + 2 x 1.5 = 23 x 19, 2.5 deep (rabbet deeper than the 2 in shadowbox); 2 in padding each side.
    expect(acrylic.boxRounded).toEqual({ length: 27, width: 23, depth: 7 });
    const areaM2 = (20 * MM / 1000) * (16 * MM / 1000);
    const acrylicLb = (0.118 * MM * 1.19 * areaM2) / LB; // ASTM D792 specific gravity 1.19
    const glassLb = (6.25 * areaM2) / LB; // EN 572-1: 2500 kg/m3 x 2.5 mm
    const rest = 0.2 * (320 / 144) * 2 + 0.2 * (320 / 144) + (78 / 12) * 0.9 + (0.11 * 2 * (27 * 23 + 27 * 6.5 + 23 * 6.5)) / 144;
    expect(acrylic.weights.packed).toBeCloseTo(acrylicLb + rest, 1);
    expect(glass.weights.packed).toBeCloseTo(glassLb + rest, 1);
    // Carriers' published rule, divisor 139: 27 x 23 x 7 / 139 = 31.27, billed 32 lb.
    expect(acrylic.dimensional).toBeCloseTo((27 * 23 * 7) / 139, 2);
    expect(acrylic.billed).toBe(32);
    expect(res.body.chosenGlazing).toBe('acrylic');
    expect(res.body.packing).toMatchObject({ matCount: 2, outerWidthIn: 20, outerHeightIn: 16, pieces: [{ label: 'Away jersey', kind: 'garment' }] });
  });

  it('says in words what is missing when the job has no frame chosen', async () => {
    const shop = await approvedJob();
    await shop.agent.patch(`/api/jobs/${shop.jobId}`).send({ frame: null });
    const res = await shop.agent.get(`/api/jobs/${shop.jobId}/shipping`);
    expect(res.status).toBe(200);
    expect(res.body.estimates).toEqual([]);
    expect(res.body.missing).toMatch(/moulding and glazing/);
  });
});

describe('marking a job shipped', () => {
  it('records carrier and tracking, moves the job to shipped and sends exactly one e-mail with the tracking and arrival links', async () => {
    const shop = await approvedJob();
    await readyToShip(shop);
    const res = await ship(shop);
    expect(res.status).toBe(201);
    expect(res.body.shipment).toMatchObject({ carrier: 'Parcel carrier', trackingNumber: '1ZX 4471-09', trackingUrl: 'https://parcels.example/track?number=1ZX%204471-09' });
    expect(res.body.emailedTo).toBe(shop.customerEmail);
    expect(await statusOf(shop)).toBe('shipped');
    const mail = await h.smtp.waitFor(shop.customerEmail!);
    expect(h.smtp.messages.filter((m) => m.to.includes(shop.customerEmail!))).toHaveLength(1);
    expect(mail.subject).toBe('Gullwing Lane Framers: Harrowgate Stormpetrels #11 jersey is on its way');
    expect(mail.text).toContain('https://parcels.example/track?number=1ZX%204471-09');
    const arrival = mail.text.match(/^http:\/\/matwright\.test\/proof\/([A-Za-z0-9_-]{43})$/m);
    expect(arrival).not.toBeNull();
    expect(mail.text).toContain('never a glass cleaner');
    expect(mail.text).toMatch(/anchors rated for at least [\d.]+ lb together \(twice its weight\)/);
    expect(mail.html).toContain('href="https://parcels.example/track?number=1ZX%204471-09"');
    expect(mail.html).not.toMatch(/<img/i);
    // The arrival link is a secret of its own: stored only as its hash, opening the approved proof's page.
    const [row] = await h.database.db.select().from(shipments).where(eq(shipments.jobId, shop.jobId));
    expect(row!.arrivalTokenHash).toBe((await import('node:crypto')).createHash('sha256').update(arrival![1]!).digest('hex'));
    const view = await request(h.app).get(`/api/proofs/${arrival![1]}`);
    expect(view.status).toBe(200);
    expect(view.body.proof.arrival).toEqual({ comment: null, photos: [], maxPhotos: 3 });

    const again = await ship(shop, { carrier: 'Parcel carrier', trackingNumber: 'SECOND1' });
    expect(again.status).toBe(409);
    expect(h.smtp.messages.filter((m) => m.to.includes(shop.customerEmail!))).toHaveLength(1);
  });

  it('refuses an unknown carrier, a bad tracking number and a customer without an address (400), recording nothing', async () => {
    const shop = await approvedJob({ email: false });
    await readyToShip(shop);
    const unknown = await ship(shop, { carrier: 'Nobody Express', trackingNumber: 'ABC123' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields.carrier).toBeTruthy();
    const bad = await ship(shop, { carrier: 'Parcel carrier', trackingNumber: 'abc<script>' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.trackingNumber).toBe('Letters, digits, spaces and dashes only');
    const noAddress = await ship(shop);
    expect(noAddress.status).toBe(400);
    expect(noAddress.body.error.fields.emailCustomer).toContain('no e-mail address');
    expect(await statusOf(shop)).toBe('ready');
    expect(await h.database.db.select().from(shipments).where(eq(shipments.jobId, shop.jobId))).toEqual([]);
    // Without e-mail it ships, and no message about it goes out. (The shop's own e-mail about the
    // customer's approval may still be arriving at the fake, so messages are matched by their tracking number.)
    const tracking = `NOMAIL-${Date.now()}`;
    expect((await ship(shop, { carrier: 'parcel CARRIER', trackingNumber: tracking, emailCustomer: false })).status).toBe(201);
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(h.smtp.messages.filter((m) => `${m.subject}\n${m.text}`.includes(tracking))).toEqual([]);
  });

  it('front desk may ship; another shop gets 404 and learns nothing', async () => {
    const shop = await approvedJob();
    await readyToShip(shop);
    const other = await signUpShop(h, 'Brackenfold Frames');
    expect((await other.agent.get(`/api/jobs/${shop.jobId}/shipping`)).status).toBe(404);
    expect((await other.agent.post(`/api/jobs/${shop.jobId}/shipment`).send({ carrier: 'Parcel carrier', trackingNumber: 'X1' })).status).toBe(404);
    const desk = await addMember(h, shop.shopId, 'front_desk');
    expect((await desk.post(`/api/jobs/${shop.jobId}/shipment`).send({ carrier: 'Parcel carrier', trackingNumber: 'DESK1', emailCustomer: false })).status).toBe(201);
    expect((await request(h.app).get(`/api/jobs/${shop.jobId}/shipping`)).status).toBe(401);
  });
});

describe('how it arrived, through the proof link', () => {
  it('stays closed before shipping, then takes a comment and up to three photos that the shop sees and can showcase', async () => {
    const shop = await approvedJob();
    const early = await request(h.app).post(`/api/proofs/${shop.token}/arrival`).send({ comment: 'Too soon' });
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe('arrival_not_open');
    expect((await request(h.app).get(`/api/proofs/${shop.token}`)).body.proof.arrival).toBeNull();
    await readyToShip(shop);
    expect((await ship(shop, { carrier: 'Parcel carrier', trackingNumber: 'ARR1', emailCustomer: false })).status).toBe(201);

    const comment = await request(h.app).post(`/api/proofs/${shop.token}/arrival`).send({ comment: 'Arrived safe, looks great on the wall' });
    expect(comment.status).toBe(200);
    const view = comment.body.proof;
    expect(Object.keys(view.arrival).sort()).toEqual(['comment', 'maxPhotos', 'photos']);
    expect(view.arrival.comment).toBe('Arrived safe, looks great on the wall');
    const control = await request(h.app).post(`/api/proofs/${shop.token}/arrival`).send({ comment: 'bell\u0007' });
    expect(control.status).toBe(400);
    expect(control.body.error.fields.comment).toBeTruthy();

    const notImage = await request(h.app).post(`/api/proofs/${shop.token}/arrival/photos`).attach('photo', Buffer.from('plain text, not a photo'), { filename: 'note.jpg', contentType: 'image/jpeg' });
    expect(notImage.status).toBe(415);
    for (let i = 0; i < 3; i += 1) {
      const up = await request(h.app).post(`/api/proofs/${shop.token}/arrival/photos`).attach('photo', await noisyImage(60, 40, 'jpeg'), { filename: `wall-${i}.jpg`, contentType: 'image/jpeg' });
      expect(up.status).toBe(201);
      expect(up.body.proof.arrival.photos).toHaveLength(i + 1);
      for (const p of up.body.proof.arrival.photos) expect(Object.keys(p)).toEqual(['url']);
    }
    const fourth = await request(h.app).post(`/api/proofs/${shop.token}/arrival/photos`).attach('photo', await noisyImage(60, 40, 'jpeg'), { filename: 'more.jpg', contentType: 'image/jpeg' });
    expect(fourth.status).toBe(409);
    expect(await h.database.db.select().from(arrivalPhotos).where(eq(arrivalPhotos.jobId, shop.jobId))).toHaveLength(3);
    const byLink = await request(h.app).get(`/api/proofs/${shop.token}/arrival/photos/0`);
    expect(byLink.status).toBe(200);
    // A JPEG starts with the SOI marker FF D8 (ITU T.81).
    expect([...(byLink.body as Buffer).subarray(0, 2)]).toEqual([0xff, 0xd8]);

    const report = (await shop.agent.get(`/api/jobs/${shop.jobId}/arrival`)).body;
    expect(report.comment).toBe('Arrived safe, looks great on the wall');
    expect(report.photos).toHaveLength(3);
    const image = await shop.agent.get(report.photos[1].url);
    expect(image.status).toBe(200);
    expect(image.headers['content-type']).toBe('image/jpeg');
    const first = await shop.agent.post(`/api/jobs/${shop.jobId}/arrival/photos/${report.photos[0].id}/showcase`);
    expect(first.body.photos.map((p: { showcase: boolean }) => p.showcase)).toEqual([true, false, false]);
    const second = await shop.agent.post(`/api/jobs/${shop.jobId}/arrival/photos/${report.photos[2].id}/showcase`);
    expect(second.body.photos.map((p: { showcase: boolean }) => p.showcase)).toEqual([false, false, true]);
    const other = await signUpShop(h, 'Thistledown Framing');
    expect((await other.agent.post(`/api/jobs/${shop.jobId}/arrival/photos/${report.photos[0].id}/showcase`)).status).toBe(404);
    expect((await other.agent.get(report.photos[0].url)).status).toBe(404);
    const activity = (await shop.agent.get(`/api/jobs/${shop.jobId}/activity`)).body.activity as { kind: string; memberName: string | null }[];
    expect(activity.filter((a) => a.kind === 'arrival_noted').every((a) => a.memberName === null)).toBe(true);
  });

  it('a made-up link gets the same closed answer as for the proof itself', async () => {
    const madeUp = 'B'.repeat(43);
    const res = await request(h.app).post(`/api/proofs/${madeUp}/arrival`).send({ comment: 'hello' });
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: { code: 'proof_closed', message: PROOF_CLOSED_MESSAGE, requestId: expect.any(String) } });
    expect((await request(h.app).get(`/api/proofs/${madeUp}/arrival/photos/0`)).status).toBe(404);
  });
});

describe('attempt limits on the arrival page', () => {
  it('counts arrival notes against the proof link and answers 429 with Retry-After past the limit', async () => {
    const database = connectDatabase(inject('databaseUrl'));
    const app = createApp({
      db: database.db,
      logger: pino({ level: 'silent' }),
      publicUrl: TEST_PUBLIC_URL,
      throttle: { ...testThrottle, keyPrefix: `arrival-${Date.now()}-` },
      proofThrottle: { perAccount: { points: 3, durationS: 60 }, perAddress: { points: 1000, durationS: 60 } },
    });
    try {
      const shop = await approvedJob();
      await readyToShip(shop);
      expect((await ship(shop, { carrier: 'Parcel carrier', trackingNumber: 'LIM1', emailCustomer: false })).status).toBe(201);
      const codes = [];
      for (let i = 0; i < 4; i += 1) codes.push((await request(app).post(`/api/proofs/${shop.token}/arrival`).send({ comment: `note ${i}` })).status);
      expect(codes).toEqual([200, 200, 200, 429]);
      const refused = await request(app).post(`/api/proofs/${shop.token}/arrival/photos`).attach('photo', await noisyImage(20, 20, 'jpeg'), { filename: 'a.jpg', contentType: 'image/jpeg' });
      expect(refused.status).toBe(429);
      expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    } finally {
      await database.close();
    }
  });
});
