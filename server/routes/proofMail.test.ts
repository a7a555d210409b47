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
  it('goes once to the customer with the link in text and HTML, the shop name escaped, and no remote images', async () => {
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
    expect(mail.html).not.toMatch(/<img/i);
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
