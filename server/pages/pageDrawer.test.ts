import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import zlib from 'node:zlib';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { connectDatabase } from '../../db/client';
import { VIEW_COOKIE, viewCookieValue } from '../../features/api/viewCookie';
import { createApp } from '../app';
import { TEST_PUBLIC_URL, testPassword, testThrottle, uniqueEmail } from '../test/harness';
import { createPageDrawer, type PageDrawer } from './pageDrawer';

/**
 * Signed-in pages drawn with their data, end to end: the real web build and
 * drawing bundle (`npm test` builds both first), a server on a port of its own
 * (the drawing thread reads its API over HTTP, as the visitor), answers read
 * with Node's own HTTP client and zlib.
 */
const root = path.resolve(import.meta.dirname, '../..');
const webDir = path.join(root, 'dist');
const bundle = path.join(root, 'dist-pages', 'render.cjs');
const database = connectDatabase(inject('databaseUrl'));
const server = http.createServer();
const drawers: PageDrawer[] = [];
let base = '';
let session = '';
let jobId = '';
const title = 'Quillon Reach Gannets jersey #31 and pennant';
const view = `${VIEW_COOKIE}=${viewCookieValue({ width: 390, height: 844, locale: 'en-GB', timeZone: 'Europe/Lisbon' })}`;

function appWith(drawer: PageDrawer | null) {
  return createApp({ db: database.db, logger: pino({ level: 'silent' }), publicUrl: TEST_PUBLIC_URL, throttle: testThrottle, webDir, pageDrawer: drawer });
}

function drawer(budgetMs = 20_000): PageDrawer {
  const made = createPageDrawer({ webDir, bundle, apiOrigin: base, budgetMs, logger: pino({ level: process.env.TEST_LOG_LEVEL ?? 'silent' }) });
  if (!made) throw new Error(`no drawing bundle at ${bundle}: npm run build:web writes it`);
  drawers.push(made);
  return made;
}

interface Answer {
  readonly status: number;
  readonly headers: http.IncomingHttpHeaders;
  readonly text: string;
}

function get(pathname: string, headers: Record<string, string>): Promise<Answer> {
  return new Promise((resolve, reject) => {
    http.get(`${base}${pathname}`, { headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        const body = Buffer.concat(chunks);
        const encoding = res.headers['content-encoding'];
        const text = (encoding === 'br' ? zlib.brotliDecompressSync(body) : encoding === 'gzip' ? zlib.gunzipSync(body) : body).toString('utf8');
        resolve({ status: res.statusCode ?? 0, headers: res.headers, text });
      });
    }).on('error', reject);
  });
}

const readsOf = (page: string) => {
  const block = /<script type="application\/json" id="matwright-first-reads"[^>]*>([^]*?)<\/script>/.exec(page);
  return block ? JSON.parse(block[1]!) : null;
};

beforeAll(async () => {
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const app = appWith(drawer());
  server.on('request', app);
  const signUp = await request(app).post('/api/auth/sign-up').send({ shopName: 'Gannet Quay Frames', name: 'Orsolya Penhallow', email: uniqueEmail('drawn'), password: testPassword });
  expect(signUp.status).toBe(201);
  session = String(signUp.headers['set-cookie']).split(';')[0]!;
  const customer = await request(app).post('/api/customers').set('Cookie', session).send({ name: 'Tamsin Arkwright' });
  const job = await request(app).post('/api/jobs').set('Cookie', session).send({ title, customerId: customer.body.customer.id, dueDate: '2027-02-14' });
  expect(job.status).toBe(201);
  jobId = job.body.job.id;
});

afterAll(async () => {
  await Promise.all(drawers.map((d) => d.close()));
  await new Promise<void>((resolve) => server.close(() => resolve()));
  await database.close();
});

describe('signed-in pages drawn on the server', () => {
  it('sends the jobs list drawn with its jobs, the reads it was drawn with, and no preloads', async () => {
    const page = await get('/', { Cookie: `${session}; ${view}`, 'Accept-Encoding': 'br' });
    expect(page.status).toBe(200);
    expect(page.headers['content-encoding']).toBe('br');
    expect(page.headers['cache-control']).toBe('private, no-cache');
    expect(String(page.headers.vary)).toMatch(/Cookie/);
    expect(page.headers.link).toBeUndefined();
    const rootMarkup = page.text.slice(page.text.indexOf('<div id="root">'), page.text.indexOf('id="matwright-first-reads"'));
    expect(rootMarkup).toContain(title);
    expect(rootMarkup).toContain('Gannet Quay Frames');
    // The due date in the visitor's own locale (en-GB), as their browser writes it.
    expect(rootMarkup).toContain(new Date(Date.UTC(2027, 1, 14, 12)).toLocaleDateString('en-GB', { weekday: 'short', month: 'short', day: 'numeric', year: 'numeric', timeZone: 'UTC' }));
    const reads = readsOf(page.text);
    const keys = reads.queries.map((q: { queryKey: unknown[] }) => q.queryKey[0]);
    expect(keys).toEqual(expect.arrayContaining(['auth', 'jobs']));
    expect(JSON.stringify(reads)).toContain(title);
    // The build's scripts are all still there, after the markup: preloaded, and started after the first paint.
    const started = /<script src="(\/after-paint-[0-9a-f]+\.js)" defer data-scripts="([^"]+)"><\/script>/.exec(page.text);
    const scripts = started![2]!.split(' ');
    expect(scripts.length).toBeGreaterThan(2);
    for (const src of scripts) expect(page.text).toContain(`<link rel="preload" href="${src}" as="script"/>`);
    // The starter is served under its content's name, cached a year.
    const starter = await get(started![1]!, {});
    expect(starter.status).toBe(200);
    expect(starter.headers['cache-control']).toContain('immutable');
    expect(starter.text).toContain('data-scripts');
  });

  it("sends a job's page drawn with the job and its sections' reads", async () => {
    const page = await get(`/jobs/${jobId}`, { Cookie: `${session}; ${view}`, 'Accept-Encoding': 'gzip' });
    expect(page.headers['content-encoding']).toBe('gzip');
    expect(page.text.slice(0, page.text.indexOf('id="matwright-first-reads"'))).toContain(title);
    const keys = readsOf(page.text).queries.map((q: { queryKey: unknown[] }) => JSON.stringify(q.queryKey));
    expect(keys.length).toBeGreaterThan(3);
  });

  it("sends the build's own page when it cannot draw one: no view cookie, no session, a session that has ended", async () => {
    for (const cookie of [session, view, `matwright_session=not-a-session; ${view}`]) {
      const page = await get('/', { Cookie: cookie });
      expect(page.status, cookie).toBe(200);
      expect(readsOf(page.text), cookie).toBeNull();
      expect(page.text, cookie).not.toContain(title);
    }
    // Without a view the server cannot draw, but it still preloads the first reads for a session.
    expect((await get('/', { Cookie: session })).headers.link).toContain('/api/auth/me');
  });

  it('sends the build page, and keeps answering, when a drawing runs past its time budget', async () => {
    const hurried = appWith(drawer(1));
    const page = await request(hurried).get('/').set('Cookie', `${session}; ${view}`);
    expect(page.status).toBe(200);
    expect(readsOf(page.text)).toBeNull();
    expect((await request(hurried).get('/api/health')).status).toBe(200);
  });
});
