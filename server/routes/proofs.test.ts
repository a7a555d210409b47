import { eq, sql } from 'drizzle-orm';
import { pino } from 'pino';
import request from 'supertest';
import { inject } from 'vitest';
import { afterAll, describe, expect, it } from 'vitest';
import { connectDatabase } from '../../db/client';
import { proofs } from '../../db/schema';
import { createApp } from '../app';
import { noisyImage } from '../test/fixtures/images';
import { addMember, createHarness, signUpShop, TEST_PUBLIC_URL, testThrottle } from '../test/harness';

const h = createHarness();
afterAll(() => h.database.close());

const mat = (id: string, color: string) => ({ id, name: id, color, coreColor: '#F6F3EA', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } });
const document = (openings: unknown[]) => ({
  schemaVersion: 2,
  outer: { width: 20, height: 24 },
  mats: [mat('Harbour navy', '#1D2B4A'), mat('Warm white', '#F3EFE4')],
  mountingBoard: { color: '#FFFFFF', cut: false },
  openings,
});
const rect = (id: string, x: number, y: number, width: number, height: number) => ({ id, shape: { kind: 'rectangle', width, height }, center: { x, y }, depth: 1 });
const cuttable = document([rect('jersey', 10, 12, 8, 10)]);
// Two openings that overlap cannot be cut (the checks' own 'openings-overlap' case).
const overlapping = document([rect('a', 8, 10, 4, 4), rect('b', 10, 10, 4, 2)]);

async function jobWithLayout(doc: unknown = cuttable) {
  const shop = await signUpShop(h, 'Saltmarsh Frame Works');
  const customer = (await shop.agent.post('/api/customers').send({ name: 'Orla Penhallow', email: 'orla@customers.example' })).body.customer;
  const job = (await shop.agent.post('/api/jobs').send({ title: 'Kestrel Bay Dunecrests #7 jersey', customerId: customer.id })).body.job;
  await shop.agent.post(`/api/jobs/${job.id}/pieces`).send({ kind: 'garment', label: 'Home jersey', widthIn: 28, heightIn: 30 });
  const layout = (await shop.agent.post(`/api/jobs/${job.id}/layouts`).send({ name: 'Shadowbox', document: doc })).body.layout;
  return { ...shop, jobId: job.id as string, layoutId: layout.id as string };
}

const tokenOf = (link: string) => link.split('/proof/')[1]!;

async function sentProof(shop: Awaited<ReturnType<typeof jobWithLayout>>, body: Record<string, unknown> = { baseRevision: 1 }) {
  const res = await shop.agent.post(`/api/jobs/${shop.jobId}/proofs`).send({ layoutId: shop.layoutId, message: 'Here is the design, take a look', ...body });
  expect(res.status).toBe(201);
  return { proof: res.body.proof, link: res.body.link as string, token: tokenOf(res.body.link) };
}

const jobStatus = async (shop: { agent: request.Agent; jobId: string }) => (await shop.agent.get(`/api/jobs/${shop.jobId}`)).body.job.status;

describe('sending a proof', () => {
  it('freezes the draft, makes a link on the public address and moves the job to waiting for approval', async () => {
    const shop = await jobWithLayout();
    const { proof, link } = await sentProof(shop);
    expect(link.startsWith(`${TEST_PUBLIC_URL}/proof/`)).toBe(true);
    expect(proof.versionNumber).toBe(1);
    expect(proof.state).toBe('sent');
    // Default expiry: 30 days after sending.
    expect(Date.parse(proof.expiresAt) - Date.parse(proof.sentAt)).toBe(30 * 24 * 3600 * 1000);
    expect(await jobStatus(shop)).toBe('awaiting_approval');
    const activity = (await shop.agent.get(`/api/jobs/${shop.jobId}/activity`)).body.activity as { kind: string }[];
    expect(activity.map((a) => a.kind)).toEqual(expect.arrayContaining(['proof_sent', 'version_frozen']));
  });

  it('refuses a layout with error findings (422) and sends nothing', async () => {
    const shop = await jobWithLayout(overlapping);
    const res = await shop.agent.post(`/api/jobs/${shop.jobId}/proofs`).send({ layoutId: shop.layoutId, baseRevision: 1 });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('layout_cannot_be_cut');
    expect((await shop.agent.get(`/api/jobs/${shop.jobId}/proofs`)).body.proofs).toEqual([]);
  });

  it('names the fields of a bad request (400) and lets front desk read but not send', async () => {
    const shop = await jobWithLayout();
    const bad = await shop.agent.post(`/api/jobs/${shop.jobId}/proofs`).send({ layoutId: 'nope', expiresInDays: 400 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['layoutId', 'expiresInDays']));
    const desk = await addMember(h, shop.shopId, 'front_desk');
    expect((await desk.post(`/api/jobs/${shop.jobId}/proofs`).send({ layoutId: shop.layoutId, baseRevision: 1 })).status).toBe(403);
    expect((await desk.get(`/api/jobs/${shop.jobId}/proofs`)).status).toBe(200);
  });

  it('stores only a SHA-256 hash of the link, never the secret itself', async () => {
    const shop = await jobWithLayout();
    const { proof, token } = await sentProof(shop);
    // 32 random bytes in base64url: 43 characters, 256 bits.
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    const [row] = await h.database.db.select().from(proofs).where(eq(proofs.id, proof.id));
    const expected = (await import('node:crypto')).createHash('sha256').update(token).digest('hex');
    expect(row!.tokenHash).toBe(expected);
    const whole = await h.database.db.execute(sql`select row_to_json(p)::text as j from proofs p where id = ${proof.id}`);
    expect(String(whole.rows[0]!.j)).not.toContain(token);
  });
});

/** Every key the customer's page may receive, level by level; anything else is a leak. */
const allowed = {
  top: ['stage', 'shop', 'jobTitle', 'message', 'state', 'expiresAt', 'decidedAt', 'approvedName', 'changesComment', 'changesPhotoSent', 'layout', 'drawing', 'pieces', 'frame', 'quote', 'arrival'],
  shop: ['name', 'email'],
  piece: ['id', 'label', 'kind', 'widthIn', 'heightIn', 'photo'],
  photo: ['url', 'widthIn', 'heightIn', 'traced'],
  quote: ['version', 'state', 'currency', 'lines', 'subtotalCents', 'taxRatePercent', 'taxCents', 'totalCents', 'depositSharePercent', 'depositCents'],
  quoteLine: ['label', 'explanation', 'amountCents'],
};

/** Bounds of each ring ("M x y L x y ... Z") of SVG path data. */
function ringBounds(d: string) {
  return d.split('Z').filter(Boolean).map((ring) => {
    const numbers = ring.replace(/[MLHV]/g, ' ').trim().split(/\s+/).map(Number);
    const xs = numbers.filter((_, i) => i % 2 === 0);
    const ys = numbers.filter((_, i) => i % 2 === 1);
    const low = (v: number[]) => v.reduce((a, b) => (b < a ? b : a), Infinity);
    const high = (v: number[]) => v.reduce((a, b) => (b > a ? b : a), -Infinity);
    return { left: low(xs), top: low(ys), right: high(xs), bottom: high(ys) };
  });
}

/**
 * The picture sent with the proof of `cuttable` (one 8 x 10 opening centred at 10, 12, cut in the top
 * mat only): the board's outline, then the hole. Its back edge is the opening itself; its face edge is
 * wider on each side by the bevel's run, thickness x tan(bevel angle) (common practice for a bevelled mat).
 */
function expectDrawingOfCuttable(drawing: { face: string; back: string }[]) {
  expect(drawing).toHaveLength(2);
  const run = 0.055 * Math.tan((45 * Math.PI) / 180);
  const [, backHole] = ringBounds(drawing[0]!.back);
  const [outer, faceHole] = ringBounds(drawing[0]!.face);
  expect(drawing[0]!.face.startsWith('M0 0H20V24H0Z')).toBe(true);
  expect(outer).toBeDefined();
  expect(backHole!.left).toBeCloseTo(6, 3);
  expect(backHole!.top).toBeCloseTo(7, 3);
  expect(backHole!.right).toBeCloseTo(14, 3);
  expect(backHole!.bottom).toBeCloseTo(17, 3);
  expect(faceHole!.left).toBeCloseTo(6 - run, 3);
  expect(faceHole!.right).toBeCloseTo(14 + run, 3);
  // The lower mat is not cut by this opening: its outline only.
  expect(drawing[1]).toEqual({ face: 'M0 0H20V24H0Z', back: 'M0 0H20V24H0Z' });
}

describe("the customer's link, without signing in", () => {
  it('returns only the allow-listed fields of that proof, the shop owner as the only e-mail, and no-referrer, noindex headers', async () => {
    const shop = await jobWithLayout();
    const { token } = await sentProof(shop);
    const res = await request(h.app).get(`/api/proofs/${token}`);
    expect(res.status).toBe(200);
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    expect(res.headers['x-robots-tag']).toContain('noindex');
    const view = res.body.proof;
    expect(Object.keys(res.body)).toEqual(['proof']);
    expect(Object.keys(view).sort()).toEqual([...allowed.top].sort());
    expect(Object.keys(view.shop).sort()).toEqual([...allowed.shop].sort());
    expect(view.shop).toEqual({ name: 'Saltmarsh Frame Works', email: shop.email });
    expect(view.pieces).toEqual([{ id: expect.any(String), label: 'Home jersey', kind: 'garment', widthIn: 28, heightIn: 30, photo: null }]);
    for (const piece of view.pieces) expect(Object.keys(piece).sort()).toEqual([...allowed.piece].sort());
    expect(view.jobTitle).toBe('Kestrel Bay Dunecrests #7 jersey');
    expect(view.stage).toBe('proof');
    expect(view.changesPhotoSent).toBe(false);
    expect(view.state).toBe('opened');
    // The arrival part stays empty until the approved job is shipped (server/routes/shipping.test.ts).
    expect(view.arrival).toBeNull();
    expect(view.layout.outer).toEqual({ width: 20, height: 24 });
    // No frame chosen on this job yet.
    expect(view.frame).toBeNull();
    expectDrawingOfCuttable(view.drawing);
    const text = JSON.stringify(res.body);
    // No internal ids and no customer's e-mail anywhere in the answer.
    for (const secret of [shop.jobId, shop.layoutId, shop.shopId, 'orla@customers.example']) expect(text).not.toContain(secret);
    expect((await shop.agent.get(`/api/jobs/${shop.jobId}/proofs`)).body.proofs[0].state).toBe('opened');
  });

  it("shows the job's frame in words with its outside size, and nothing else of the shop's price list", async () => {
    const shop = await jobWithLayout();
    await shop.agent.patch(`/api/jobs/${shop.jobId}`).send({ frame: { mouldingCode: 'FL-075', glazingKind: 'uv_glass', shadowboxDepthIn: 0 } });
    const { token } = await sentProof(shop);
    const view = (await request(h.app).get(`/api/proofs/${token}`)).body.proof;
    // FL-075 has a 0.75 in face: 20 + 2 x 0.75 = 21.5 and 24 + 1.5 = 25.5 outside (face width on each side, common practice).
    expect(view.frame).toEqual({ moulding: 'Flat, brushed silver', faceWidthIn: 0.75, glazing: 'UV-filtering glass', isGlass: true, shadowboxDepthIn: 0, outerWidthIn: 21.5, outerHeightIn: 25.5 });
    expect(JSON.stringify(view)).not.toContain('FL-075');
    expect(JSON.stringify(view)).not.toContain('pricePerFoot');
  });

  it('shows the quote that travels with the proof through allow-listed fields only: no ids, notes, computed amounts or who built it', async () => {
    const shop = await jobWithLayout();
    const built = await shop.agent.post(`/api/jobs/${shop.jobId}/quotes`).send({ layoutId: shop.layoutId });
    expect(built.status).toBe(201);
    const quote = built.body.quote;
    const edited = await shop.agent
      .patch(`/api/jobs/${shop.jobId}/quotes/${quote.id}`)
      .send({ extras: [{ label: 'Hanging wire', amountCents: 400 }], adjustments: [{ line: 0, amountCents: 2000, note: 'internal: loyal customer discount' }] });
    expect(edited.status).toBe(200);
    const { token } = await sentProof(shop);
    const view = (await request(h.app).get(`/api/proofs/${token}`)).body.proof.quote;
    expect(Object.keys(view).sort()).toEqual([...allowed.quote].sort());
    for (const line of view.lines) expect(Object.keys(line).sort()).toEqual([...allowed.quoteLine].sort());
    expect(view.totalCents).toBe(edited.body.quote.totalCents);
    const text = JSON.stringify(view);
    for (const secret of [quote.id, shop.layoutId, 'internal: loyal customer discount', 'Ada Test']) expect(text).not.toContain(secret);
  });

  it('made-up, revoked, replaced and expired links all give the same 404 and no layout', async () => {
    const shop = await jobWithLayout();
    const revoked = await sentProof(shop);
    const revoke = await shop.agent.post(`/api/jobs/${shop.jobId}/proofs/${revoked.proof.id}/revoke`);
    expect(revoke.status).toBe(200);
    expect(revoke.body.proof.state).toBe('revoked');
    const replaced = await sentProof(shop, { versionNumber: 1 });
    const current = await sentProof(shop, { versionNumber: 1 });
    const expired = await sentProof(shop, { versionNumber: 1 });
    await h.database.db.update(proofs).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(proofs.id, expired.proof.id));
    const states = (await shop.agent.get(`/api/jobs/${shop.jobId}/proofs`)).body.proofs.map((p: { id: string; state: string }) => [p.id, p.state]);
    expect(Object.fromEntries(states)).toMatchObject({ [revoked.proof.id]: 'revoked', [replaced.proof.id]: 'replaced', [current.proof.id]: 'replaced', [expired.proof.id]: 'expired' });
    const madeUp = 'A'.repeat(43);
    const answers = [];
    // Each answer carries its own request id (it says nothing about the link); the rest must be identical.
    const withoutRequestId = (body: { error: { requestId?: string } }) => {
      expect(body.error.requestId).toEqual(expect.any(String));
      const { requestId: _id, ...error } = body.error;
      return { ...body, error };
    };
    for (const token of [madeUp, revoked.token, replaced.token, expired.token, 'short']) {
      const res = await request(h.app).get(`/api/proofs/${token}`);
      answers.push({ status: res.status, body: withoutRequestId(res.body) });
      const post = await request(h.app).post(`/api/proofs/${token}/decision`).send({ decision: 'approve', name: 'Orla Penhallow' });
      answers.push({ status: post.status, body: withoutRequestId(post.body) });
    }
    expect(answers[0]).toEqual({ status: 404, body: { error: { code: 'proof_closed', message: 'This proof is closed' } } });
    for (const answer of answers) expect(answer).toEqual(answers[0]);
  });
});

describe("the pieces' photos through the link", () => {
  it('serve the newest photo of a piece without signing in, only while the link is open, with no photo id in the address', async () => {
    const shop = await jobWithLayout();
    const piece = (await shop.agent.get(`/api/jobs/${shop.jobId}/pieces`)).body.pieces[0];
    const upload = await shop.agent
      .post(`/api/jobs/${shop.jobId}/pieces/${piece.id}/photos`)
      .attach('photo', await noisyImage(60, 40, 'png'), { filename: 'jersey.png', contentType: 'image/png' });
    expect(upload.status).toBe(201);
    const { token, proof } = await sentProof(shop);
    const view = (await request(h.app).get(`/api/proofs/${token}`)).body.proof;
    const photo = view.pieces[0].photo;
    expect(Object.keys(photo).sort()).toEqual([...allowed.photo].sort());
    expect(photo).toEqual({ url: `/api/proofs/${token}/pieces/0/photo`, widthIn: 28, heightIn: 30, traced: null });
    expect(JSON.stringify(view)).not.toContain(upload.body.photo.id);
    const image = await request(h.app).get(photo.url);
    expect(image.status).toBe(200);
    expect(image.headers['content-type']).toBe('image/jpeg');
    // A JPEG starts with the SOI marker FF D8 (ITU T.81).
    expect([...(image.body as Buffer).subarray(0, 2)]).toEqual([0xff, 0xd8]);
    expect((await request(h.app).get(`/api/proofs/${token}/pieces/1/photo`)).status).toBe(404);
    await shop.agent.post(`/api/jobs/${shop.jobId}/proofs/${proof.id}/revoke`);
    const closed = await request(h.app).get(photo.url);
    expect(closed.status).toBe(404);
    expect(closed.body.error.code).toBe('proof_closed');
  });
});

describe("the customer's decision", () => {
  it('asking for changes sends the job back to designing with the comment, and cannot be answered again (409)', async () => {
    const shop = await jobWithLayout();
    const { token, proof } = await sentProof(shop);
    const blank = await request(h.app).post(`/api/proofs/${token}/decision`).send({ decision: 'changes', comment: '   ' });
    expect(blank.status).toBe(400);
    expect(blank.body.error.fields.comment).toBe('Say what should change');
    const res = await request(h.app).post(`/api/proofs/${token}/decision`).send({ decision: 'changes', comment: 'Make the top mat dark green please' });
    expect(res.status).toBe(200);
    expect(res.body.proof).toMatchObject({ state: 'changes_asked', changesComment: 'Make the top mat dark green please' });
    expect(await jobStatus(shop)).toBe('designing');
    const again = await request(h.app).post(`/api/proofs/${token}/decision`).send({ decision: 'approve', name: 'Orla Penhallow' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_decided');
    const activity = (await shop.agent.get(`/api/jobs/${shop.jobId}/activity`)).body.activity as { kind: string; memberName: string | null; detail: Record<string, unknown> }[];
    const decided = activity.find((a) => a.kind === 'proof_decided')!;
    expect(decided).toMatchObject({ memberName: null, detail: { proofId: proof.id, decision: 'changes_asked', comment: 'Make the top mat dark green please' } });
    const moved = activity.find((a) => a.kind === 'status_changed' && a.detail.to === 'designing')!;
    expect(String(moved.detail.note)).toContain('Make the top mat dark green please');
  });

  it('approving with a typed name moves the job to approved; the page then shows the decision', async () => {
    const shop = await jobWithLayout();
    const { token } = await sentProof(shop);
    const res = await request(h.app).post(`/api/proofs/${token}/decision`).send({ decision: 'approve', name: 'Orla Penhallow' });
    expect(res.status).toBe(200);
    expect(await jobStatus(shop)).toBe('approved');
    const view = (await request(h.app).get(`/api/proofs/${token}`)).body.proof;
    expect(view).toMatchObject({ state: 'approved', approvedName: 'Orla Penhallow' });
    expect((await request(h.app).post(`/api/proofs/${token}/decision`).send({ decision: 'changes', comment: 'Wait' })).status).toBe(409);
    const revoke = await shop.agent.post(`/api/jobs/${shop.jobId}/proofs/${(await shop.agent.get(`/api/jobs/${shop.jobId}/proofs`)).body.proofs[0].id}/revoke`);
    expect(revoke.status).toBe(409);
  });
});

describe('attempt limits on a proof link', () => {
  it('answers 429 with Retry-After past the per-link limit', async () => {
    const database = connectDatabase(inject('databaseUrl'));
    const app = createApp({
      db: database.db,
      logger: pino({ level: 'silent' }),
      publicUrl: TEST_PUBLIC_URL,
      throttle: { ...testThrottle, keyPrefix: `proofs-${Date.now()}-` },
      proofThrottle: { perAccount: { points: 3, durationS: 60 }, perAddress: { points: 1000, durationS: 60 } },
    });
    try {
      const shop = await jobWithLayout();
      const { token } = await sentProof(shop);
      const codes = [];
      for (let i = 0; i < 4; i += 1) codes.push((await request(app).get(`/api/proofs/${token}`)).status);
      expect(codes).toEqual([200, 200, 200, 429]);
      const refused = await request(app).get(`/api/proofs/${token}`);
      expect(refused.status).toBe(429);
      expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    } finally {
      await database.close();
    }
  });
});
