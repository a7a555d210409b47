import { eq, sql } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { members, sessions } from '../../db/schema';
import { demoShop } from '../../db/seed';
import { createHarness, signUpShop, testPassword, uniqueEmail } from '../test/harness';

const h = createHarness();
afterAll(() => h.database.close());

const signUp = (email: string, password: string) =>
  request(h.app).post('/api/auth/sign-up').send({ shopName: 'Merrow Lane Frames', name: 'Quill Test', email, password });

async function secondBrowser(email: string, password = testPassword) {
  const agent = request.agent(h.app);
  expect((await agent.post('/api/auth/sign-in').send({ email, password })).status).toBe(200);
  return agent;
}

describe('password rules', () => {
  // Each refused password was accepted before these rules; zxcvbn's common-password list knows "password12".
  it.each([
    ['ten repeats of one letter', 'aaaaaaaaaa', /different characters/],
    ['ten spaces', '          ', /different characters/],
    ['a common password', 'password12', /too common/],
    ['a keyboard row', 'qwertyuiop', /too common/],
    ['the published demo password', demoShop.password, /demo password/],
  ])('sign-up refuses %s with 400 naming the password field', async (_what, password, message) => {
    const res = await signUp(uniqueEmail('weak'), password);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('weak_password');
    expect(res.body.error.fields.password).toMatch(message);
  });

  it('sign-up refuses the e-mail address itself, in any case', async () => {
    const email = uniqueEmail('self');
    const res = await signUp(email, email.toUpperCase());
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/e-mail/);
  });

  it('a passphrase of unrelated words is accepted', async () => {
    expect((await signUp(uniqueEmail('strong'), testPassword)).status).toBe(201);
  });
});

describe('sessions', () => {
  it('a session ends 30 days after sign-in even when used every day', async () => {
    const { agent, email } = await signUpShop(h);
    const [member] = await h.database.db.select({ id: members.id }).from(members).where(eq(members.email, email));
    const age = (days: number) =>
      h.database.db.update(sessions).set({ signedInAt: sql`now() - make_interval(days => ${days})` }).where(eq(sessions.userId, member!.id));
    await age(29);
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    await age(30);
    const ended = await agent.get('/api/auth/me');
    expect(ended.status).toBe(401);
    expect(ended.headers['set-cookie']?.[0]).toMatch(/^matwright_session=;/);
    expect(await h.database.db.$count(sessions, eq(sessions.userId, member!.id))).toBe(0);
  });

  it('sign out everywhere ends the session in another browser too', async () => {
    const { agent, email } = await signUpShop(h);
    const other = await secondBrowser(email);
    expect((await other.get('/api/auth/me')).status).toBe(200);
    const res = await agent.post('/api/auth/sign-out-everywhere');
    expect(res.status).toBe(200);
    expect((await other.get('/api/auth/me')).status).toBe(401);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });

  it('signed out, sign out everywhere is a 401', async () => {
    expect((await request(h.app).post('/api/auth/sign-out-everywhere')).status).toBe(401);
  });
});

describe('changing the password', () => {
  const newPassword = 'plum orchard ladder 7';

  it('needs the current password, refuses a weak new one, and ends the other sessions but keeps this one', async () => {
    const { agent, email } = await signUpShop(h);
    const other = await secondBrowser(email);

    const wrong = await agent.post('/api/auth/password').send({ currentPassword: 'not my password at all', newPassword });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.currentPassword).toMatch(/current password/);
    const weak = await agent.post('/api/auth/password').send({ currentPassword: testPassword, newPassword: 'password12' });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields.newPassword).toMatch(/too common/);
    expect((await other.get('/api/auth/me')).status).toBe(200);

    const changed = await agent.post('/api/auth/password').send({ currentPassword: testPassword, newPassword });
    expect(changed.status).toBe(200);
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    expect((await other.get('/api/auth/me')).status).toBe(401);
    expect((await request(h.app).post('/api/auth/sign-in').send({ email, password: testPassword })).status).toBe(401);
    expect((await request(h.app).post('/api/auth/sign-in').send({ email, password: newPassword })).status).toBe(200);
  });
});
