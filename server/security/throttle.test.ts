import { pino } from 'pino';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { connectDatabase } from '../../db/client';
import { createApp } from '../app';
import { TEST_PUBLIC_URL, signUpShop, testPassword, uniqueEmail, createHarness } from '../test/harness';
import { ARGON2_CONCURRENCY, ARGON2_MAX_WAITING, hashingLoad, hashPassword, verifyPassword } from './passwordHashing';
import type { ThrottleOptions, ThrottleRules } from './throttle';

const pools: { close(): Promise<void> }[] = [];
afterAll(() => Promise.all(pools.map((p) => p.close())));

const rule = (points: number, durationS: number) => ({ points, durationS });
const wide = rule(100_000, 60);

/** An app on the shared test database with its own limits; the same prefix makes two apps share counts. */
function appWith(throttle: ThrottleOptions) {
  const database = connectDatabase(inject('databaseUrl'));
  pools.push(database);
  return createApp({ db: database.db, logger: pino({ level: 'silent' }), publicUrl: TEST_PUBLIC_URL, throttle });
}

let prefixes = 0;
const freshPrefix = () => `t${Date.now()}-${(prefixes += 1)}:`;
const signInRules = (rules: ThrottleRules): ThrottleOptions => ({ keyPrefix: freshPrefix(), rules: { signIn: rules } });

const h = createHarness();
pools.push(h.database);

describe('sign-in throttle', () => {
  it('one account: 429 with Retry-After after the limit, even for the right password, which works again after the window', async () => {
    const { email } = await signUpShop(h);
    const app = appWith(signInRules({ perAccount: rule(3, 2), perAddress: wide }));
    const wrong = () => request(app).post('/api/auth/sign-in').send({ email, password: 'not the right one at all' });
    expect([(await wrong()).status, (await wrong()).status, (await wrong()).status]).toEqual([401, 401, 401]);
    const refused = await wrong();
    expect(refused.status).toBe(429);
    expect(refused.body.error.code).toBe('too_many_attempts');
    const retryAfter = Number(refused.headers['retry-after']);
    expect(retryAfter).toBeGreaterThanOrEqual(1);
    expect(retryAfter).toBeLessThanOrEqual(2);
    expect((await request(app).post('/api/auth/sign-in').send({ email, password: testPassword })).status).toBe(429);

    await new Promise((r) => setTimeout(r, retryAfter * 1000 + 200));
    expect((await request(app).post('/api/auth/sign-in').send({ email, password: testPassword })).status).toBe(200);
  });

  it('a successful sign-in clears the account count, so an owner never locks themself out by signing in often', async () => {
    const { email } = await signUpShop(h);
    const app = appWith(signInRules({ perAccount: rule(2, 60), perAddress: wide }));
    for (let i = 0; i < 4; i++) {
      expect((await request(app).post('/api/auth/sign-in').send({ email, password: 'not the right one at all' })).status).toBe(401);
      expect((await request(app).post('/api/auth/sign-in').send({ email, password: testPassword })).status).toBe(200);
    }
  });

  it('one address guessing across many accounts: 429 after the address limit', async () => {
    const app = appWith(signInRules({ perAccount: wide, perAddress: rule(5, 60) }));
    const statuses: number[] = [];
    for (let i = 0; i < 8; i++) {
      statuses.push((await request(app).post('/api/auth/sign-in').send({ email: uniqueEmail('spray'), password: 'summer-guess-1' })).status);
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429, 429, 429]);
  });

  it('two server processes on one database share the count', async () => {
    const { email } = await signUpShop(h);
    const options = signInRules({ perAccount: rule(4, 60), perAddress: wide });
    const first = appWith(options);
    const second = appWith(options);
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      const app = i % 2 === 0 ? first : second;
      statuses.push((await request(app).post('/api/auth/sign-in').send({ email, password: 'not the right one at all' })).status);
    }
    expect(statuses).toEqual([401, 401, 401, 401, 429, 429]);
  });
});

describe('other credential forms', () => {
  it('sign-up is limited per e-mail and per address', async () => {
    const app = appWith({ keyPrefix: freshPrefix(), rules: { signUp: { perAccount: wide, perAddress: rule(2, 60) } } });
    const signUp = () =>
      request(app).post('/api/auth/sign-up').send({ shopName: 'Gannet Row Frames', name: 'Pim Test', email: uniqueEmail('flood'), password: testPassword });
    expect([(await signUp()).status, (await signUp()).status, (await signUp()).status]).toEqual([201, 201, 429]);
  });

  it('password changes are limited per member', async () => {
    const app = appWith({ keyPrefix: freshPrefix(), rules: { passwordChange: { perAccount: rule(2, 60), perAddress: wide } } });
    const agent = request.agent(app);
    const email = uniqueEmail('changer');
    expect((await agent.post('/api/auth/sign-up').send({ shopName: 'Gannet Row Frames', name: 'Pim Test', email, password: testPassword })).status).toBe(201);
    const change = () => agent.post('/api/auth/password').send({ currentPassword: 'a wrong guess here', newPassword: 'plum orchard ladder 7' });
    expect([(await change()).status, (await change()).status, (await change()).status]).toEqual([400, 400, 429]);
  });

  it('joining by invitation is limited per link', async () => {
    const app = appWith({ keyPrefix: freshPrefix(), rules: { joinInvitation: { perAccount: rule(2, 60), perAddress: wide } } });
    const secret = 'A'.repeat(43);
    const join = () => request(app).post(`/api/invitations/${secret}/accept`).send({ name: 'Guess', password: 'plum orchard ladder 7' });
    expect([(await join()).status, (await join()).status, (await join()).status]).toEqual([404, 404, 429]);
  });
});

describe('argon2 work', () => {
  it(`runs at most ${ARGON2_CONCURRENCY} hashes at once and refuses a flood past ${ARGON2_MAX_WAITING} waiting with 503 busy`, async () => {
    const digest = await hashPassword('plum orchard ladder 7');
    let busiest = 0;
    const sample = setInterval(() => {
      busiest = Math.max(busiest, hashingLoad().active);
    }, 2);
    const results = await Promise.allSettled(Array.from({ length: ARGON2_MAX_WAITING + 10 }, () => verifyPassword(digest, 'plum orchard ladder 7')));
    clearInterval(sample);
    const refused = results.filter((r) => r.status === 'rejected');
    expect(busiest).toBeGreaterThan(0);
    expect(busiest).toBeLessThanOrEqual(ARGON2_CONCURRENCY);
    expect(refused.length).toBeGreaterThan(0);
    expect(refused.every((r) => (r as PromiseRejectedResult).reason.code === 'busy' && (r as PromiseRejectedResult).reason.status === 503)).toBe(true);
    expect(results.filter((r) => r.status === 'fulfilled' && r.value === true).length).toBe(results.length - refused.length);
  });
});
