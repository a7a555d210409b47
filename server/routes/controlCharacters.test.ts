import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createMailHarness, signUpShop, testPassword, uniqueEmail, type MailHarness } from '../test/harness';

// Every text a person can send, each with a NUL (U+0000) inside: Postgres refuses
// NUL in text, so before the shared text field helper each of these was a 500.
const NUL = 'a\u0000b';

let h: MailHarness;
let agent: ReturnType<typeof request.agent>;
let ids: { customer: string; job: string; piece: string; layout: string; revision: number; document: Record<string, unknown> };
let settings: Record<string, unknown>;

beforeAll(async () => {
  h = await createMailHarness();
  const shop = await signUpShop(h, 'Tidewater Mill Frames');
  agent = shop.agent;
  const customer = (await agent.post('/api/customers').send({ name: 'Wren Aldous' })).body.customer;
  const job = (await agent.post('/api/jobs').send({ title: 'Kelpies away shirt', customerId: customer.id })).body.job;
  const piece = (await agent.post(`/api/jobs/${job.id}/pieces`).send({ kind: 'garment', label: 'Shirt', widthIn: 20, heightIn: 28 })).body.piece;
  const layout = (await agent.post(`/api/jobs/${job.id}/layouts`).send({ name: 'Shirt and photo' })).body.layout;
  ids = { customer: customer.id, job: job.id, piece: piece.id, layout: layout.id, revision: layout.draftRevision, document: layout.draft };
  settings = (await agent.get('/api/settings')).body.settings;
});
afterAll(() => h.close());

type Case = { what: string; send: () => request.Test; field: string };

const withMatName = () => {
  const document = structuredClone(ids.document) as { mats: { name: string }[] };
  document.mats[0]!.name = NUL;
  return document;
};
const settingsWith = (edit: (s: Record<string, any>) => void) => {
  const copy = structuredClone(settings) as Record<string, any>;
  edit(copy);
  return copy;
};

const cases: Case[] = [
  { what: 'sign-up shop name', field: 'shopName', send: () => request(h.app).post('/api/auth/sign-up').send({ shopName: NUL, name: 'N', email: uniqueEmail('nul'), password: testPassword }) },
  { what: 'sign-up name', field: 'name', send: () => request(h.app).post('/api/auth/sign-up').send({ shopName: 'Shop', name: NUL, email: uniqueEmail('nul'), password: testPassword }) },
  { what: 'sign-up e-mail', field: 'email', send: () => request(h.app).post('/api/auth/sign-up').send({ shopName: 'Shop', name: 'N', email: `x${NUL}@tests.example`, password: testPassword }) },
  { what: 'sign-up password', field: 'password', send: () => request(h.app).post('/api/auth/sign-up').send({ shopName: 'Shop', name: 'N', email: uniqueEmail('nul'), password: `${testPassword}\u0000` }) },
  { what: 'sign-in password', field: 'password', send: () => request(h.app).post('/api/auth/sign-in').send({ email: uniqueEmail('nul'), password: NUL }) },
  { what: 'shop name', field: 'name', send: () => agent.patch('/api/shop').send({ name: `Tide${NUL}` }) },
  { what: 'customer name', field: 'name', send: () => agent.post('/api/customers').send({ name: NUL }) },
  { what: 'customer phone', field: 'phone', send: () => agent.post('/api/customers').send({ name: 'Wren', phone: NUL }) },
  { what: 'customer address', field: 'address', send: () => agent.post('/api/customers').send({ name: 'Wren', address: NUL }) },
  { what: 'customer notes', field: 'notes', send: () => agent.patch(`/api/customers/${ids.customer}`).send({ notes: NUL }) },
  { what: 'customer search', field: 'q', send: () => agent.get('/api/customers').query({ q: NUL }) },
  { what: 'job title', field: 'title', send: () => agent.post('/api/jobs').send({ title: NUL, customerId: ids.customer }) },
  { what: 'job notes', field: 'notes', send: () => agent.patch(`/api/jobs/${ids.job}`).send({ notes: NUL }) },
  { what: 'job status note', field: 'note', send: () => agent.post(`/api/jobs/${ids.job}/status`).send({ status: 'designing', note: NUL }) },
  { what: 'job search', field: 'q', send: () => agent.get('/api/jobs').query({ q: NUL }) },
  { what: 'piece label', field: 'label', send: () => agent.post(`/api/jobs/${ids.job}/pieces`).send({ kind: 'photo', label: NUL, widthIn: 8, heightIn: 10 }) },
  { what: 'piece notes', field: 'notes', send: () => agent.patch(`/api/jobs/${ids.job}/pieces/${ids.piece}`).send({ notes: NUL }) },
  { what: 'layout name', field: 'name', send: () => agent.post(`/api/jobs/${ids.job}/layouts`).send({ name: NUL }) },
  { what: 'mat name in a draft', field: 'document.mats.0.name', send: () => agent.put(`/api/layouts/${ids.layout}/draft`).send({ document: withMatName(), baseRevision: ids.revision }) },
  { what: 'version note', field: 'note', send: () => agent.post(`/api/layouts/${ids.layout}/versions`).send({ baseRevision: ids.revision, note: NUL }) },
  { what: 'stock board name', field: 'stock.0.name', send: () => agent.put('/api/settings').send(settingsWith((s) => (s.stock[0].name = NUL))) },
  { what: 'sheet size name', field: 'sheets.0.name', send: () => agent.put('/api/settings').send(settingsWith((s) => (s.sheets[0].name = NUL))) },
  { what: 'cutter profile name', field: 'cutterProfiles.0.name', send: () => agent.put('/api/settings').send(settingsWith((s) => (s.cutterProfiles[0].name = NUL))) },
  { what: 'invitation e-mail', field: 'email', send: () => agent.post('/api/members/invitations').send({ email: `x${NUL}@tests.example`, role: 'designer' }) },
  { what: 'name given when joining', field: 'name', send: () => request(h.app).post(`/api/invitations/${'J'.repeat(43)}/accept`).send({ name: NUL, password: testPassword }) },
  { what: 'new password', field: 'newPassword', send: () => agent.post('/api/auth/password').send({ currentPassword: testPassword, newPassword: `plum orchard${NUL}` }) },
  { what: 'cut-file profile query', field: 'profile', send: () => agent.get(`/api/layouts/${ids.layout}/versions/1/export`).query({ format: 'svg', profile: NUL }) },
];

describe('control characters in text', () => {
  it.each(cases)('a NUL in the $what is a 400 naming $field', async ({ send, field }) => {
    const res = await send();
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it('other control characters are refused too; line breaks stay allowed in notes, and text is trimmed', async () => {
    for (const control of ['\u0007', '\u001b[2J', '\u007f', '\u0085']) {
      const res = await agent.post('/api/customers').send({ name: `Wren${control}` });
      expect(res.status).toBe(400);
    }
    const kept = await agent.post('/api/customers').send({ name: '  Wren Aldous  ', notes: 'Line one\nLine two\twith a tab' });
    expect(kept.status).toBe(201);
    expect(kept.body.customer.name).toBe('Wren Aldous');
    expect(kept.body.customer.notes).toBe('Line one\nLine two\twith a tab');
  });
});
