import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createMailHarness, signUpShop, type MailHarness } from '../test/harness';

let h: MailHarness;
beforeAll(async () => {
  h = await createMailHarness();
});
afterAll(() => h.close());

const mat = { id: 'top', name: 'Harbour navy', color: '#1D2B4A', coreColor: '#F6F3EA', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } };
const document = { schemaVersion: 2, outer: { width: 16, height: 20 }, mats: [mat], mountingBoard: { color: '#FFFFFF', cut: false }, openings: [{ id: 'o', shape: { kind: 'rectangle', width: 8, height: 10 }, center: { x: 8, y: 10 }, depth: 1 }] };

async function job(email: string | undefined) {
  const shop = await signUpShop(h, 'Fennick & Daughters Framing');
  const customer = (await shop.agent.post('/api/customers').send({ name: 'Ingrid Sallow', ...(email ? { email } : {}) })).body.customer;
  const j = (await shop.agent.post('/api/jobs').send({ title: 'Ravensholm Quillbacks #3', customerId: customer.id })).body.job;
  const layout = (await shop.agent.post(`/api/jobs/${j.id}/layouts`).send({ name: 'Shadowbox', document })).body.layout;
  return { ...shop, jobId: j.id as string, layoutId: layout.id as string };
}

describe("the proof's e-mail", () => {
  it('goes once to the customer with the link in text and HTML, the shop name escaped, and the design as an inline PNG (cid), nothing remote', async () => {
    const to = `ingrid-${Date.now()}@customers.example`;
    const shop = await job(to);
    const res = await shop.agent.post(`/api/jobs/${shop.jobId}/proofs`).send({ layoutId: shop.layoutId, baseRevision: 1, message: 'Two mats, navy on top', emailCustomer: true });
    expect(res.status).toBe(201);
    expect(res.body.emailedTo).toBe(to);
    expect(res.body.mailError).toBeNull();
    const mail = await h.smtp.waitFor(to);
    expect(h.smtp.messages.filter((m) => m.to.includes(to))).toHaveLength(1);
    expect(mail.subject).toBe('Fennick & Daughters Framing: your design for Ravensholm Quillbacks #3 is ready to approve');
    expect(mail.text).toContain(res.body.link);
    expect(mail.text).toMatch(/^http:\/\/matwright\.test\/proof\/[A-Za-z0-9_-]{43}$/m);
    expect(mail.text).toContain('Two mats, navy on top');
    expect(mail.html).toContain(`href="${res.body.link}"`);
    expect(mail.html).toContain('Fennick &amp; Daughters Framing');
    // The one image is named by Content-ID (RFC 2392) and travels inside the message; nothing is fetched and nothing tracks.
    const sources = [...(mail.html ?? '').matchAll(/<img[^>]*src="([^"]*)"/gi)].map((m) => m[1]);
    expect(sources).toEqual(['cid:design@matwright']);
    expect(mail.html).not.toMatch(/https?:\/\/[^"]*\.(png|gif|jpe?g)/i);
    expect(mail.attachments).toHaveLength(1);
    const picture = mail.attachments[0]!;
    expect(picture).toMatchObject({ cid: 'design@matwright', contentType: 'image/png', contentDisposition: 'inline' });
    // sharp decodes the attachment's header: a real PNG of the 16 x 20 in design, long side 720 px.
    const meta = await sharp(picture.content).metadata();
    expect(meta).toMatchObject({ format: 'png', width: 576, height: 720 });
    // The top mat's colour fills the picture's corner (the layout's border).
    const { data } = await sharp(picture.content).extract({ left: 20, top: 20, width: 1, height: 1 }).removeAlpha().raw().toBuffer({ resolveWithObject: true });
    expect([...data]).toEqual([0x1d, 0x2b, 0x4a]);
    expect(mail.text).toContain('A picture of the proposed mats is attached.');
  });

  it('refuses with the field named when the customer has no e-mail, and sends nothing', async () => {
    const shop = await job(undefined);
    const before = h.smtp.messages.length;
    const res = await shop.agent.post(`/api/jobs/${shop.jobId}/proofs`).send({ layoutId: shop.layoutId, baseRevision: 1, emailCustomer: true });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.emailCustomer).toContain('no e-mail address');
    expect((await shop.agent.get(`/api/jobs/${shop.jobId}/proofs`)).body.proofs).toEqual([]);
    expect(h.smtp.messages.length).toBe(before);
  });
});
