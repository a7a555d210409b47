import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultShopSettings } from '../../features/settings/schema';
import { noisyImage } from '../test/fixtures/images';
import { createMailHarness, signUpShop, TEST_PUBLIC_URL, type MailHarness } from '../test/harness';

let h: MailHarness;
beforeAll(async () => {
  h = await createMailHarness();
});
afterAll(() => h.close());

const mat = { id: 'top', name: 'Harbour navy', color: '#1D2B4A', coreColor: '#F6F3EA', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } };
const document = { schemaVersion: 2, outer: { width: 16, height: 20 }, mats: [mat], mountingBoard: { color: '#FFFFFF', cut: false }, openings: [{ id: 'o', shape: { kind: 'rectangle', width: 8, height: 10 }, center: { x: 8, y: 10 }, depth: 1 }] };

/** A shop with one job waiting for approval on a sent proof (link only, no e-mail to the customer). */
async function jobAwaitingApproval() {
  const shop = await signUpShop(h, 'Tidewater Mat Room');
  const customer = (await shop.agent.post('/api/customers').send({ name: 'Bartholomew Quince', email: `bq-${Date.now()}@customers.example` })).body.customer;
  const job = (await shop.agent.post('/api/jobs').send({ title: 'Harrowgate Stormbirds #11', customerId: customer.id })).body.job;
  const layout = (await shop.agent.post(`/api/jobs/${job.id}/layouts`).send({ name: 'Shadowbox', document })).body.layout;
  const sent = await shop.agent.post(`/api/jobs/${job.id}/proofs`).send({ layoutId: layout.id, baseRevision: 1 });
  expect(sent.status).toBe(201);
  return { ...shop, jobId: job.id as string, layoutId: layout.id as string, proofId: sent.body.proof.id as string, token: String(sent.body.link).split('/proof/')[1]! };
}

const toShop = (email: string) => h.smtp.messages.filter((m) => m.to.includes(email.toLowerCase()));

describe("the shop's e-mail about a decision", () => {
  it('a change request sends one message to the first owner with the comment and a link to the job; a second answer sends none', async () => {
    const shop = await jobAwaitingApproval();
    const res = await request(h.app).post(`/api/proofs/${shop.token}/decision`).send({ decision: 'changes', comment: 'Please try a <b>green</b> top mat' });
    expect(res.status).toBe(200);
    const mail = await h.smtp.waitFor(shop.email);
    expect(mail.subject).toBe('Changes asked: Harrowgate Stormbirds #11');
    expect(mail.text).toContain('Bartholomew Quince asked for changes to version 1');
    expect(mail.text).toContain('Please try a <b>green</b> top mat');
    expect(mail.text).toContain(`${TEST_PUBLIC_URL}/jobs/${shop.jobId}`);
    expect(mail.html).toContain('Please try a &lt;b&gt;green&lt;/b&gt; top mat');
    expect(mail.html).toContain(`href="${TEST_PUBLIC_URL}/jobs/${shop.jobId}"`);
    expect(mail.html).not.toMatch(/<img/i);
    expect((await request(h.app).post(`/api/proofs/${shop.token}/decision`).send({ decision: 'approve', name: 'B. Quince' })).status).toBe(409);
    await new Promise((resolve) => setTimeout(resolve, 200));
    expect(toShop(shop.email)).toHaveLength(1);
  });

  it('an approval sends one message naming who approved, and no message reaches the customer', async () => {
    const shop = await jobAwaitingApproval();
    const before = h.smtp.messages.length;
    expect((await request(h.app).post(`/api/proofs/${shop.token}/decision`).send({ decision: 'approve', name: 'Bartholomew Quince' })).status).toBe(200);
    const mail = await h.smtp.waitFor(shop.email);
    expect(mail.subject).toBe('Approved: Harrowgate Stormbirds #11');
    expect(mail.text).toContain('signing as "Bartholomew Quince"');
    await new Promise((resolve) => setTimeout(resolve, 200));
    expect(h.smtp.messages.length - before).toBe(1);
  });
});

describe('a change request with a photo of a sketch', () => {
  it('stores the photo as a JPEG preview the shop can open on the job, and the customer page only says one was sent', async () => {
    const shop = await jobAwaitingApproval();
    const sketch = await noisyImage(900, 600, 'png');
    const res = await request(h.app)
      .post(`/api/proofs/${shop.token}/decision`)
      .field('decision', 'changes')
      .field('comment', 'Like my drawing: two openings side by side')
      .attach('photo', sketch, { filename: 'sketch.png', contentType: 'image/png' });
    expect(res.status).toBe(200);
    expect(res.body.proof).toMatchObject({ state: 'changes_asked', changesPhotoSent: true, changesComment: 'Like my drawing: two openings side by side' });
    expect(JSON.stringify(res.body)).not.toContain('changes.jpg');
    const proof = (await shop.agent.get(`/api/jobs/${shop.jobId}/proofs`)).body.proofs[0];
    expect(proof.changesPhotoUrl).toBe(`/api/jobs/${shop.jobId}/proofs/${shop.proofId}/changes-photo`);
    const photo = await shop.agent.get(proof.changesPhotoUrl);
    expect(photo.status).toBe(200);
    expect(photo.headers['content-type']).toBe('image/jpeg');
    // JPEG starts with the SOI marker FF D8 (ITU T.81).
    expect([...(photo.body as Buffer).subarray(0, 2)]).toEqual([0xff, 0xd8]);
    expect((await request(h.app).get(proof.changesPhotoUrl)).status).toBe(401);
    const mail = await h.smtp.waitFor(shop.email);
    expect(mail.text).toContain('They attached a photo of a sketch or note');
  });

  it('refuses a file that is not a photo (415) and keeps the proof open; a photo with an approval is a 400', async () => {
    const shop = await jobAwaitingApproval();
    const text = await request(h.app)
      .post(`/api/proofs/${shop.token}/decision`)
      .field('decision', 'changes')
      .field('comment', 'See attached')
      .attach('photo', Buffer.from('not an image at all, just words'), { filename: 'note.jpg', contentType: 'image/jpeg' });
    expect(text.status).toBe(415);
    expect(text.body.error.code).toBe('unsupported_type');
    const approve = await request(h.app)
      .post(`/api/proofs/${shop.token}/decision`)
      .field('decision', 'approve')
      .field('name', 'Bartholomew Quince')
      .attach('photo', await noisyImage(40, 40, 'png'), { filename: 'a.png', contentType: 'image/png' });
    expect(approve.status).toBe(400);
    expect(approve.body.error.fields.photo).toContain('only with a request for changes');
    expect((await request(h.app).get(`/api/proofs/${shop.token}`)).body.proof.state).toBe('opened');
    expect(toShop(shop.email)).toHaveLength(0);
  });

  it('a made-up link answers a photo upload exactly as any closed link does, before reading the photo', async () => {
    const res = await request(h.app)
      .post(`/api/proofs/${'Z'.repeat(43)}/decision`)
      .field('decision', 'changes')
      .field('comment', 'x')
      .attach('photo', await noisyImage(40, 40, 'png'), { filename: 'a.png', contentType: 'image/png' });
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: { code: 'proof_closed', message: 'This proof is closed', requestId: expect.any(String) } });
  });
});

describe('a newer proof after a change request', () => {
  it("closes the old link with the one closed answer, keeping the customer's comment on the shop's list", async () => {
    const shop = await jobAwaitingApproval();
    expect((await request(h.app).post(`/api/proofs/${shop.token}/decision`).send({ decision: 'changes', comment: 'Wider border please' })).status).toBe(200);
    expect((await request(h.app).get(`/api/proofs/${shop.token}`)).body.proof.state).toBe('changes_asked');
    const newer = await shop.agent.post(`/api/jobs/${shop.jobId}/proofs`).send({ layoutId: shop.layoutId, versionNumber: 1 });
    expect(newer.status).toBe(201);
    const old = await request(h.app).get(`/api/proofs/${shop.token}`);
    expect(old.status).toBe(404);
    expect(old.body).toEqual({ error: { code: 'proof_closed', message: 'This proof is closed', requestId: expect.any(String) } });
    const list = (await shop.agent.get(`/api/jobs/${shop.jobId}/proofs`)).body.proofs;
    expect(list.map((p: { state: string }) => p.state)).toEqual(['sent', 'replaced']);
    expect(list[1].changesComment).toBe('Wider border please');
  });
});

describe("the shop's default link expiry", () => {
  it('applies when the sender does not choose, and a sender may still choose; outside 1-90 days is refused with the field named', async () => {
    const shop = await signUpShop(h, 'Larchmont Framers');
    expect((await shop.agent.get('/api/settings')).body.settings.proofExpiryDays).toBe(30);
    for (const days of [0, 91, 2.5]) {
      const bad = await shop.agent.put('/api/settings').send({ ...defaultShopSettings, proofExpiryDays: days });
      expect(bad.status).toBe(400);
      expect(Object.keys(bad.body.error.fields)).toContain('proofExpiryDays');
    }
    expect((await shop.agent.put('/api/settings').send({ ...defaultShopSettings, proofExpiryDays: 7 })).status).toBe(200);
    const customer = (await shop.agent.post('/api/customers').send({ name: 'Wilhelmina Oduya' })).body.customer;
    const job = (await shop.agent.post('/api/jobs').send({ title: 'Fenwick Larks #2', customerId: customer.id })).body.job;
    const layout = (await shop.agent.post(`/api/jobs/${job.id}/layouts`).send({ name: 'Shadowbox', document })).body.layout;
    const day = 24 * 3600 * 1000;
    const byDefault = (await shop.agent.post(`/api/jobs/${job.id}/proofs`).send({ layoutId: layout.id, baseRevision: 1 })).body.proof;
    expect(Date.parse(byDefault.expiresAt) - Date.parse(byDefault.sentAt)).toBe(7 * day);
    const chosen = (await shop.agent.post(`/api/jobs/${job.id}/proofs`).send({ layoutId: layout.id, versionNumber: 1, expiresInDays: 45 })).body.proof;
    expect(Date.parse(chosen.expiresAt) - Date.parse(chosen.sentAt)).toBe(45 * day);
  });
});
