import { eq, sql } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { invitations, members } from '../../db/schema';
import { addMember, createMailHarness, signUpShop, testPassword, uniqueEmail, type MailHarness } from '../test/harness';

let h: MailHarness;
beforeAll(async () => {
  h = await createMailHarness();
});
afterAll(() => h.close());

type Agent = ReturnType<typeof request.agent>;

/** Invites `email` as `role` and returns the secret read from the e-mail the fake received. */
async function invite(owner: Agent, email: string, role = 'designer') {
  const res = await owner.post('/api/members/invitations').send({ email, role });
  if (res.status !== 201) throw new Error(`invite failed: ${res.status} ${JSON.stringify(res.body)}`);
  const mail = await h.smtp.waitFor(email);
  const secret = /\/join\/([A-Za-z0-9_-]{43})/.exec(mail.text)?.[1];
  if (!secret) throw new Error(`no join link in: ${mail.text}`);
  return { id: res.body.invitation.id as string, secret, mail };
}

async function memberId(email: string) {
  const row = await h.database.db.query.members.findFirst({ where: eq(members.email, email) });
  return row!.id;
}

describe('the team list', () => {
  it('every role sees the members of its own shop and none of another shop', async () => {
    const shop = await signUpShop(h, 'Wrenfield Frames');
    const other = await signUpShop(h, 'Other Shop');
    for (const agent of [shop.agent, await addMember(h, shop.shopId, 'designer'), await addMember(h, shop.shopId, 'front_desk')]) {
      const res = await agent.get('/api/members');
      expect(res.status).toBe(200);
      expect(res.body.members.map((m: { role: string }) => m.role).sort()).toEqual(['designer', 'front_desk', 'owner']);
      expect(res.body.members.map((m: { email: string }) => m.email)).not.toContain(other.email);
    }
  });

  it('a visitor who is not signed in gets 401', async () => {
    expect((await request(h.app).get('/api/members')).status).toBe(401);
  });
});

describe('inviting', () => {
  it('an owner invites by e-mail; the message names the shop and role and links to /join/<secret>', async () => {
    const { agent } = await signUpShop(h, 'Brindle & Oak Framing');
    const email = uniqueEmail('invitee');
    // A forged Host header must not become the link's host: links start with the configured public URL.
    const res = await agent
      .post('/api/members/invitations')
      .set('Host', 'evil.example')
      .send({ email: email.toUpperCase(), role: 'front_desk' });
    expect(res.status).toBe(201);
    expect(res.body.invitation).toMatchObject({ email, role: 'front_desk', state: 'waiting', invitedByName: 'Ada Test' });
    const days = (Date.parse(res.body.invitation.expiresAt) - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(6.99);
    expect(days).toBeLessThanOrEqual(7);

    const mail = await h.smtp.waitFor(email);
    expect(mail.subject).toBe('Ada Test invited you to Brindle & Oak Framing on Matwright');
    expect(mail.text).toContain('as front desk');
    expect(mail.text).toMatch(/^http:\/\/matwright\.test\/join\/[A-Za-z0-9_-]{43}$/m);
    expect(mail.text).not.toContain('evil.example');
    expect(mail.html).not.toContain('evil.example');
    expect(mail.html).toContain('Brindle &amp; Oak Framing');
  });

  it('only the hash of the secret is stored', async () => {
    const { agent } = await signUpShop(h);
    const { id, secret } = await invite(agent, uniqueEmail('hashed'));
    const row = await h.database.db.query.invitations.findFirst({ where: eq(invitations.id, id) });
    const expected = (await h.database.db.execute<{ h: string }>(sql`select encode(sha256(${secret}::bytea), 'hex') as h`)).rows[0]!.h;
    expect(row!.tokenHash).toBe(expected);
    expect(JSON.stringify(row)).not.toContain(secret);
  });

  it('names typed by people are escaped in the HTML body', async () => {
    const { agent } = await signUpShop(h, '<b>Bold</b> "Frames"');
    const { mail } = await invite(agent, uniqueEmail('escape'));
    expect(mail.html).toContain('&lt;b&gt;Bold&lt;/b&gt; &quot;Frames&quot;');
    expect(mail.html).not.toContain('<b>Bold</b>');
  });

  it('designers and front desk may not invite, list or withdraw invitations', async () => {
    const shop = await signUpShop(h);
    const { id } = await invite(shop.agent, uniqueEmail('kept'));
    for (const role of ['designer', 'front_desk'] as const) {
      const agent = await addMember(h, shop.shopId, role);
      expect((await agent.post('/api/members/invitations').send({ email: uniqueEmail('x'), role: 'owner' })).status).toBe(403);
      expect((await agent.get('/api/members/invitations')).status).toBe(403);
      expect((await agent.delete(`/api/members/invitations/${id}`)).status).toBe(403);
    }
  });

  it('a malformed invitation gets 400 naming e-mail and role', async () => {
    const { agent } = await signUpShop(h);
    const res = await agent.post('/api/members/invitations').send({ email: 'nope', role: 'boss' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'role']);
  });

  it('an e-mail that already has an account is refused with 409 on the e-mail field', async () => {
    const { agent } = await signUpShop(h);
    const existing = await signUpShop(h, 'Elsewhere Frames');
    const res = await agent.post('/api/members/invitations').send({ email: existing.email, role: 'designer' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.email).toBe('This e-mail already has an account');
  });

  it('inviting the same address again replaces the earlier invitation and its link', async () => {
    const { agent } = await signUpShop(h);
    const email = uniqueEmail('twice');
    const first = await invite(agent, email);
    await agent.post('/api/members/invitations').send({ email, role: 'owner' }).expect(201);
    const list = await agent.get('/api/members/invitations');
    expect(list.body.invitations).toHaveLength(1);
    expect(list.body.invitations[0]).toMatchObject({ email, role: 'owner' });
    expect((await request(h.app).get(`/api/invitations/${first.secret}`)).body.error.code).toBe('invitation_revoked');
  });

  it('withdrawing an invitation stops its link; another shop cannot see or withdraw it', async () => {
    const shop = await signUpShop(h);
    const other = await signUpShop(h);
    const { id, secret } = await invite(shop.agent, uniqueEmail('withdrawn'));
    expect((await other.agent.delete(`/api/members/invitations/${id}`)).status).toBe(404);
    expect((await other.agent.get('/api/members/invitations')).body.invitations).toEqual([]);
    expect((await shop.agent.delete('/api/members/invitations/not-a-uuid')).status).toBe(404);
    expect((await shop.agent.delete(`/api/members/invitations/${id}`)).status).toBe(200);
    expect((await shop.agent.get('/api/members/invitations')).body.invitations).toEqual([]);
    const preview = await request(h.app).get(`/api/invitations/${secret}`);
    expect(preview.status).toBe(410);
    expect(preview.body.error.message).toMatch(/withdrawn/);
  });
});

describe('joining through the link', () => {
  it('the link from the e-mail shows the shop, role and e-mail, then signs the new member in', async () => {
    const shop = await signUpShop(h, 'Gallowglass Framing');
    const email = uniqueEmail('joiner');
    const { secret } = await invite(shop.agent, email, 'designer');

    const preview = await request(h.app).get(`/api/invitations/${secret}`);
    expect(preview.status).toBe(200);
    expect(preview.body.invitation).toMatchObject({ shopName: 'Gallowglass Framing', role: 'designer', email });

    const joiner = request.agent(h.app);
    const res = await joiner.post(`/api/invitations/${secret}/accept`).send({ name: 'Noor Ellery', password: testPassword });
    expect(res.status).toBe(201);
    const me = await joiner.get('/api/auth/me');
    expect(me.body.member).toMatchObject({ name: 'Noor Ellery', email, role: 'designer' });
    expect(me.body.shop).toEqual({ id: shop.shopId, name: 'Gallowglass Framing' });
    expect((await shop.agent.get('/api/members/invitations')).body.invitations).toEqual([]);
  });

  it('a link works once: the second use gets 410', async () => {
    const { agent } = await signUpShop(h);
    const { secret } = await invite(agent, uniqueEmail('once'));
    await request(h.app).post(`/api/invitations/${secret}/accept`).send({ name: 'First', password: testPassword }).expect(201);
    const again = await request(h.app).post(`/api/invitations/${secret}/accept`).send({ name: 'Second', password: testPassword });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('invitation_used');
  });

  it('an expired link gets 410 and creates nobody', async () => {
    const { agent } = await signUpShop(h);
    const email = uniqueEmail('late');
    const { id, secret } = await invite(agent, email);
    await h.database.db.update(invitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitations.id, id));
    expect((await request(h.app).get(`/api/invitations/${secret}`)).body.error.code).toBe('invitation_expired');
    const res = await request(h.app).post(`/api/invitations/${secret}/accept`).send({ name: 'Late', password: testPassword });
    expect(res.status).toBe(410);
    expect(await h.database.db.query.members.findFirst({ where: eq(members.email, email) })).toBeUndefined();
    expect((await agent.get('/api/members/invitations')).body.invitations[0]).toMatchObject({ id, state: 'expired' });
  });

  it('an unknown or malformed link gets 404', async () => {
    expect((await request(h.app).get(`/api/invitations/${'A'.repeat(43)}`)).status).toBe(404);
    expect((await request(h.app).get('/api/invitations/short')).status).toBe(404);
  });

  it('a malformed join form gets 400 naming name and password, and the link still works', async () => {
    const { agent } = await signUpShop(h);
    const { secret } = await invite(agent, uniqueEmail('form'));
    const res = await request(h.app).post(`/api/invitations/${secret}/accept`).send({ name: '', password: 'short' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['name', 'password']);
    expect((await request(h.app).get(`/api/invitations/${secret}`)).status).toBe(200);
  });

  it('when the address got an account meanwhile, joining is refused with 409', async () => {
    const { agent } = await signUpShop(h);
    const email = uniqueEmail('meanwhile');
    const { secret } = await invite(agent, email);
    await request(h.app).post('/api/auth/sign-up').send({ shopName: 'Own Shop', name: 'Quick', email, password: testPassword }).expect(201);
    const res = await request(h.app).post(`/api/invitations/${secret}/accept`).send({ name: 'Slow', password: testPassword });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('email_taken');
  });
});

describe('changing roles and removing members', () => {
  it('an owner changes a member role; designers and front desk get 403', async () => {
    const shop = await signUpShop(h);
    const designer = await addMember(h, shop.shopId, 'designer');
    const desk = await addMember(h, shop.shopId, 'front_desk');
    const deskId = (await desk.get('/api/auth/me')).body.member.id;
    expect((await designer.patch(`/api/members/${deskId}`).send({ role: 'owner' })).status).toBe(403);
    expect((await desk.patch(`/api/members/${deskId}`).send({ role: 'owner' })).status).toBe(403);
    expect((await designer.delete(`/api/members/${deskId}`)).status).toBe(403);
    const res = await shop.agent.patch(`/api/members/${deskId}`).send({ role: 'designer' });
    expect(res.status).toBe(200);
    expect(res.body.member).toMatchObject({ id: deskId, role: 'designer' });
    expect((await desk.get('/api/auth/me')).body.member.role).toBe('designer');
  });

  it('a bad role gets 400 naming role; a member of another shop or a bad id gets 404', async () => {
    const shop = await signUpShop(h);
    const other = await signUpShop(h);
    const otherOwnerId = await memberId(other.email);
    expect((await shop.agent.patch(`/api/members/${otherOwnerId}`).send({ role: 'designer' })).status).toBe(404);
    expect((await shop.agent.delete(`/api/members/${otherOwnerId}`)).status).toBe(404);
    expect((await shop.agent.patch('/api/members/NOT%20AN%20ID').send({ role: 'designer' })).status).toBe(404);
    const bad = await shop.agent.patch(`/api/members/${await memberId(shop.email)}`).send({ role: 'manager' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['role']);
    expect((await other.agent.get('/api/auth/me')).body.member.role).toBe('owner');
  });

  it('the last owner cannot be demoted or removed, not even by themselves', async () => {
    const shop = await signUpShop(h);
    const ownerId = await memberId(shop.email);
    const demote = await shop.agent.patch(`/api/members/${ownerId}`).send({ role: 'designer' });
    expect(demote.status).toBe(409);
    expect(demote.body.error).toMatchObject({ code: 'last_owner', message: expect.stringMatching(/at least one owner/) });
    expect((await shop.agent.delete(`/api/members/${ownerId}`)).status).toBe(409);
    expect((await shop.agent.get('/api/auth/me')).body.member.role).toBe('owner');
  });

  it('with a second owner, an owner may step down and the other one stays', async () => {
    const shop = await signUpShop(h);
    const second = await addMember(h, shop.shopId, 'owner');
    const ownerId = await memberId(shop.email);
    expect((await shop.agent.patch(`/api/members/${ownerId}`).send({ role: 'designer' })).status).toBe(200);
    const secondId = (await second.get('/api/auth/me')).body.member.id;
    expect((await second.delete(`/api/members/${secondId}`)).status).toBe(409);
  });

  it('removing a member ends their sessions at once', async () => {
    const shop = await signUpShop(h);
    const designer = await addMember(h, shop.shopId, 'designer');
    const id = (await designer.get('/api/auth/me')).body.member.id;
    expect((await shop.agent.delete(`/api/members/${id}`)).status).toBe(200);
    expect((await designer.get('/api/auth/me')).status).toBe(401);
    const team = await shop.agent.get('/api/members');
    expect(team.body.members.map((m: { id: string }) => m.id)).not.toContain(id);
  });
});
