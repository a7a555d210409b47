import { pino } from 'pino';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { connectDatabase } from '../../db/client';
import { benchLayout } from '../../scripts/benchLayout';
import { createApp } from '../app';
import { HttpError } from '../errors';
import { createHarness, signUpShop, testPassword, testThrottle, TEST_PUBLIC_URL } from '../test/harness';
import { createComputePool } from './computePool';

const h = createHarness();
/** A second app on the same database whose compute threads get a 300 ms budget per task. */
const tight = createComputePool({ budgetMs: 300, threads: 1 });
const database = connectDatabase(inject('databaseUrl'));
const tightApp = createApp({ db: database.db, logger: pino({ level: 'silent' }), publicUrl: TEST_PUBLIC_URL, throttle: testThrottle, compute: tight });

afterAll(async () => {
  await Promise.all([tight.close(), (h.app.locals.compute as { close(): Promise<void> }).close()]);
  await Promise.all([h.database.close(), database.close()]);
});

async function rejection(promise: Promise<unknown>): Promise<HttpError> {
  const outcome = await promise.then(() => null, (err: unknown) => err);
  expect(outcome).toBeInstanceOf(HttpError);
  return outcome as HttpError;
}

describe('compute threads', () => {
  it('stops a task past its time budget with plain words, and the next task runs on a fresh thread', async () => {
    const pool = createComputePool({ budgetMs: 400, threads: 1 });
    try {
      await pool.run({ kind: 'warm' }).catch(() => undefined); // loading the code may itself take longer than 400 ms
      const started = Date.now();
      const err = await rejection(pool.run({ kind: 'spin', ms: 10_000 }));
      // The busy thread is cut off at the budget, not after the 10 s it asked for.
      expect(Date.now() - started).toBeLessThan(5_000);
      expect(err.status).toBe(422);
      expect(err.code).toBe('took_too_long');
      expect(err.message).toMatch(/took longer than the 400 ms allowed, so it was stopped/);
      // A roomy budget this time, so that loading the code on a new thread fits.
      const roomy = createComputePool({ budgetMs: 20_000, threads: 1 });
      await expect(roomy.run({ kind: 'spin', ms: 10 })).resolves.toBeNull();
      await roomy.close();
    } finally {
      await pool.close();
    }
  }, 120_000); // starting threads that load the geometry through tsx: seconds on a busy machine

  it('turns work away with 503 once it is closing', async () => {
    const pool = createComputePool({ threads: 1 });
    await pool.close();
    const err = await rejection(pool.run({ kind: 'spin', ms: 1 }));
    expect(err.status).toBe(503);
    expect(err.message).toMatch(/restarting/);
  });

  it('answers an export that runs past its budget with 422 in plain words, and the server keeps answering', async () => {
    const shop = await signUpShop(h, 'Larchmont Frame Loft');
    const customer = (await shop.agent.post('/api/customers').send({ name: 'Perrin Ashdown' })).body.customer;
    const job = (await shop.agent.post('/api/jobs').send({ title: 'Ridge Foxes jersey', customerId: customer.id })).body.job;
    const created = await shop.agent.post(`/api/jobs/${job.id}/layouts`).send({ name: 'Bench shadowbox', document: benchLayout(2000) });
    expect(created.status).toBe(201);
    const layoutId = created.body.layout.id as string;
    expect((await shop.agent.post(`/api/layouts/${layoutId}/versions`).send({ baseRevision: created.body.layout.draftRevision })).status).toBe(201);
    expect((await shop.agent.post(`/api/layouts/${layoutId}/versions/1/release`).send({ reason: 'Approved at the counter' })).status).toBe(201);

    // The same owner on the app whose threads get 300 ms: a cold thread alone takes longer to load the geometry.
    const tightAgent = request.agent(tightApp);
    expect((await tightAgent.post('/api/auth/sign-in').send({ email: shop.email, password: testPassword })).status).toBe(200);
    const exported = await tightAgent.get(`/api/layouts/${layoutId}/versions/1/export?format=dxf`);
    expect(exported.status).toBe(422);
    expect(exported.body.error.code).toBe('took_too_long');
    expect(exported.body.error.message).toMatch(/^This took longer than the 300 ms allowed, so it was stopped and nothing was made\./);

    const health = await request(tightApp).get('/api/health');
    expect(health.status).toBe(200);
    const jobs = await tightAgent.get('/api/jobs');
    expect(jobs.status).toBe(200);
    expect(jobs.body.jobs.map((j: { id: string }) => j.id)).toContain(job.id);
    // The app with the usual budget makes the same file.
    const normal = await shop.agent.get(`/api/layouts/${layoutId}/versions/1/export?format=dxf&mat=1`).buffer(true);
    expect(normal.status).toBe(200);
    expect(String(normal.text ?? normal.body)).toContain('LWPOLYLINE');
  }, 120_000);
});
