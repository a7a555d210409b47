import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { addMember, createHarness, signUpShop, testPassword, uniqueEmail } from '../test/harness';

const h = createHarness();
afterAll(() => h.database.close());

describe('sign-up and sign-in', () => {
  it('sign-up creates a shop whose first member is its owner, signed in by cookie', async () => {
    const agent = request.agent(h.app);
    const email = uniqueEmail('new-owner');
    const res = await agent.post('/api/auth/sign-up').send({ shopName: 'Fennick Street Frames', name: 'Rosa Pell', email, password: testPassword });
    expect(res.status).toBe(201);
    const cookie = res.headers['set-cookie']?.[0] ?? '';
    expect(cookie).toMatch(/^matwright_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);

    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body).toEqual({
      member: { id: expect.any(String), name: 'Rosa Pell', email, role: 'owner' },
      shop: { id: expect.any(String), name: 'Fennick Street Frames' },
    });
  });

  it('signing up twice with one e-mail is refused with 409 naming the field', async () => {
    const { email } = await signUpShop(h);
    const res = await request(h.app).post('/api/auth/sign-up').send({ shopName: 'Second Shop', name: 'X', email, password: testPassword });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('email_taken');
    expect(res.body.error.fields.email).toMatch(/already/);
  });

  it('e-mail addresses are matched without regard to case', async () => {
    const { email } = await signUpShop(h);
    const res = await request(h.app).post('/api/auth/sign-in').send({ email: email.toUpperCase(), password: testPassword });
    expect(res.status).toBe(200);
  });

  it('a wrong password gets 401 with a clear message and no session', async () => {
    const { email } = await signUpShop(h);
    const res = await request(h.app).post('/api/auth/sign-in').send({ email, password: 'not the password' });
    expect(res.status).toBe(401);
    expect(res.body.error).toEqual({ code: 'wrong_credentials', message: 'That e-mail and password do not match an account', requestId: expect.any(String) });
    expect(res.headers['set-cookie']).toBeUndefined();
  });

  it('an unknown e-mail gets the same 401 as a wrong password', async () => {
    const res = await request(h.app).post('/api/auth/sign-in').send({ email: uniqueEmail('nobody'), password: testPassword });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('wrong_credentials');
  });

  it('sign-out ends the session so /me answers 401', async () => {
    const { agent } = await signUpShop(h);
    expect((await agent.post('/api/auth/sign-out')).status).toBe(200);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(401);
    expect(me.body.error.code).toBe('signed_out');
  });

  it('a malformed sign-up gets 400 naming each bad field', async () => {
    const res = await request(h.app).post('/api/auth/sign-up').send({ shopName: 'A', email: 'not-an-address', password: 'short' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'name', 'password', 'shopName']);
  });

  it('a body that is not JSON gets 400, not 500', async () => {
    const res = await request(h.app).post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
  });

  it('a state-changing request from another site is refused', async () => {
    const res = await request(h.app).post('/api/auth/sign-in').set('Origin', 'https://elsewhere.example').send({ email: 'a@b.example', password: 'x' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('cross_origin');
  });
});

describe('roles', () => {
  it('an owner-only route refuses a designer and a front-desk member with 403', async () => {
    const { shopId, agent: owner } = await signUpShop(h);
    for (const role of ['designer', 'front_desk'] as const) {
      const member = await addMember(h, shopId, role);
      const res = await member.patch('/api/shop').send({ name: 'Renamed By Staff' });
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('role_refused');
    }
    const res = await owner.patch('/api/shop').send({ name: 'Renamed By Owner' });
    expect(res.status).toBe(200);
    expect(res.body.shop.name).toBe('Renamed By Owner');
  });

  it('signed-out requests to member routes get 401', async () => {
    const res = await request(h.app).get('/api/jobs');
    expect(res.status).toBe(401);
  });

  it('an unknown API route gets a JSON 404', async () => {
    const res = await request(h.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('no_such_route');
  });
});
