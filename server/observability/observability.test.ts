import { Writable } from 'node:stream';
import request from 'supertest';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { connectDatabase } from '../../db/client';
import { createApp } from '../app';
import { createLogger } from '../logger';
import { TEST_PUBLIC_URL, testThrottle } from '../test/harness';

const database = connectDatabase(inject('databaseUrl'));
afterAll(() => database.close());

/** A logger whose lines the test can read, parsed. */
function capturedLogger() {
  const lines: Record<string, unknown>[] = [];
  const sink = new Writable({
    write(chunk, _enc, done) {
      for (const line of String(chunk).split('\n')) if (line) lines.push(JSON.parse(line));
      done();
    },
  });
  return { logger: createLogger('info', sink), lines };
}

const token = 'scrape-token-for-tests-0123456789';
const appWith = (metricsToken?: string, logger = createLogger('silent')) =>
  createApp({ db: database.db, logger, publicUrl: TEST_PUBLIC_URL, throttle: testThrottle, metricsToken });

describe('request ids', () => {
  it('every response carries one, error bodies repeat it, and every log line about the request names it', async () => {
    const { logger, lines } = capturedLogger();
    const app = appWith(undefined, logger);
    const res = await request(app).get('/api/jobs');
    expect(res.status).toBe(401);
    const id = res.headers['x-request-id'] as string;
    expect(id).toMatch(/^[0-9a-f-]{36}$/);
    expect(res.body.error.requestId).toBe(id);
    const about = lines.filter((l) => JSON.stringify(l).includes('/api/jobs'));
    expect(about.length).toBeGreaterThan(0);
    for (const line of about) expect((line.req as { id?: string } | undefined)?.id ?? line.reqId).toBe(id);
  });

  it("keeps a load balancer's safe id and replaces one that is not", async () => {
    const app = appWith();
    const kept = await request(app).get('/api/health').set('X-Request-Id', 'lb-7f3a9c21e0');
    expect(kept.headers['x-request-id']).toBe('lb-7f3a9c21e0');
    const replaced = await request(app).get('/api/health').set('X-Request-Id', 'bad id\twith "quotes"');
    expect(replaced.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('two requests never share an id', async () => {
    const app = appWith();
    const ids = await Promise.all(Array.from({ length: 20 }, () => request(app).get('/api/health').then((r) => r.headers['x-request-id'])));
    expect(new Set(ids).size).toBe(20);
  });
});

describe('GET /api/metrics', () => {
  it('does not exist without a token in the environment', async () => {
    const res = await request(appWith()).get('/api/metrics').set('Authorization', `Bearer ${token}`);
    expect(res.status).toBe(404);
  });

  it('answers 401 without the token or with a wrong one', async () => {
    const app = appWith(token);
    expect((await request(app).get('/api/metrics')).status).toBe(401);
    const wrong = await request(app).get('/api/metrics').set('Authorization', `Bearer ${token.slice(0, -1)}x`);
    expect(wrong.status).toBe(401);
    expect(wrong.headers['www-authenticate']).toContain('Bearer');
  });

  it('with the token: Prometheus text with request durations by route template, job durations and queue depth', async () => {
    const app = appWith(token);
    await request(app).get('/api/health');
    await request(app).get('/api/jobs/6a1f2c3d-0000-4000-8000-000000000001');
    await request(app).get('/api/no-such-thing');
    const res = await request(app).get('/api/metrics').set('Authorization', `Bearer ${token}`);
    expect(res.status).toBe(200);
    // Prometheus text exposition format 0.0.4 (prometheus.io, "Exposition formats").
    expect(res.headers['content-type']).toContain('text/plain');
    expect(res.headers['content-type']).toContain('version=0.0.4');
    const text = res.text;
    expect(text).toContain('# TYPE matwright_http_request_duration_seconds histogram');
    expect(text).toMatch(/matwright_http_request_duration_seconds_count\{method="GET",route="\/api\/health",status="200"\} 1/);
    // Labelled by template, never by id, so series do not grow with data.
    expect(text).toMatch(/route="\/api\/jobs\/:id",status="401"\} 1/);
    expect(text).not.toContain('6a1f2c3d');
    expect(text).toMatch(/route="unmatched",status="404"\} 1/);
    expect(text).toContain('# TYPE matwright_job_duration_seconds histogram');
    expect(text).toContain('# TYPE matwright_queue_depth gauge');
  });
});
