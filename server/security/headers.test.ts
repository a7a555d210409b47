import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { connectDatabase } from '../../db/client';
import { createApp } from '../app';
import { localFolderStorage } from '../storage/localFolderStorage';
import { noisyImage } from '../test/fixtures/images';
import { signUpShop, testPassword, testThrottle, uniqueEmail } from '../test/harness';

const database = connectDatabase(inject('databaseUrl'));
let webDir = '';
let storageDir = '';

function appAt(publicUrl: string) {
  return createApp({
    db: database.db,
    logger: pino({ level: 'silent' }),
    webDir,
    storage: localFolderStorage(storageDir),
    publicUrl,
    throttle: testThrottle,
  });
}

beforeAll(async () => {
  webDir = await fs.mkdtemp(path.join(os.tmpdir(), 'matwright-web-'));
  storageDir = await fs.mkdtemp(path.join(os.tmpdir(), 'matwright-headers-'));
  await fs.writeFile(path.join(webDir, 'index.html'), '<!doctype html><title>Matwright</title><div id="root"></div>');
});
afterAll(async () => {
  await database.close();
  await fs.rm(webDir, { recursive: true, force: true });
  await fs.rm(storageDir, { recursive: true, force: true });
});

/** The CSP as a map of directive -> sources. */
function csp(header: string | undefined): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const part of (header ?? '').split(';')) {
    const [name, ...sources] = part.trim().split(/\s+/);
    if (name) out[name] = sources;
  }
  return out;
}

/** The headers OWASP's Secure Headers Project recommends for a web app, as this app sets them. */
function expectSecurityHeaders(headers: Record<string, string | string[] | undefined>, https: boolean) {
  const policy = csp(headers['content-security-policy'] as string);
  expect(policy['default-src']).toEqual(["'self'"]);
  expect(policy['script-src']).toEqual(["'self'"]);
  expect(policy['frame-ancestors']).toEqual(["'none'"]);
  expect(policy['object-src']).toEqual(["'none'"]);
  expect('upgrade-insecure-requests' in policy).toBe(https);
  expect(headers['x-frame-options']).toBe('DENY');
  expect(headers['x-content-type-options']).toBe('nosniff');
  expect(headers['referrer-policy']).toBe('strict-origin-when-cross-origin');
  if (https) expect(headers['strict-transport-security']).toBe('max-age=31536000; includeSubDomains');
  else expect(headers['strict-transport-security']).toBeUndefined();
  expect(headers['x-powered-by']).toBeUndefined();
}

describe('security headers', () => {
  it('plain http (loopback): every header but HSTS on /, /api/auth/me and a photo; the cookie is not Secure', async () => {
    const app = appAt('http://127.0.0.1:8080');
    const page = await request(app).get('/');
    expect(page.status).toBe(200);
    expectSecurityHeaders(page.headers, false);
    const me = await request(app).get('/api/auth/me');
    expect(me.status).toBe(401);
    expectSecurityHeaders(me.headers, false);

    const shop = await signUpShop({ app, database }, 'Saltwick Frame Room');
    const customer = await shop.agent.post('/api/customers').send({ name: 'Orla Penhaligon' });
    const job = await shop.agent.post('/api/jobs').send({ title: 'Saltwick Mossjacks home shirt', customerId: customer.body.customer.id });
    const piece = await shop.agent.post(`/api/jobs/${job.body.job.id}/pieces`).send({ kind: 'photo', label: 'Signing day', widthIn: 8, heightIn: 10 });
    const uploaded = await shop.agent
      .post(`/api/jobs/${job.body.job.id}/pieces/${piece.body.piece.id}/photos`)
      .attach('photo', await noisyImage(40, 30, 'png'), { filename: 'day.png', contentType: 'image/png' });
    expect(uploaded.status).toBe(201);
    const photo = await shop.agent.get(`/api/photos/${uploaded.body.photo.id}/preview`);
    expect(photo.status).toBe(200);
    expect(photo.headers['content-type']).toBe('image/jpeg');
    expectSecurityHeaders(photo.headers, false);

    const signIn = await request(app).post('/api/auth/sign-in').send({ email: shop.email, password: testPassword });
    expect(signIn.headers['set-cookie']?.[0]).not.toMatch(/;\s*Secure/i);
  });

  it('an https PUBLIC_URL adds HSTS and upgrade-insecure-requests, and the session cookie is Secure', async () => {
    const app = appAt('https://frames.example');
    expectSecurityHeaders((await request(app).get('/')).headers, true);
    expectSecurityHeaders((await request(app).get('/api/auth/me')).headers, true);
    const email = uniqueEmail('secure');
    const res = await request(app).post('/api/auth/sign-up').send({ shopName: 'Harrowgate Frames', name: 'Bex Test', email, password: testPassword });
    expect(res.status).toBe(201);
    expect(res.headers['set-cookie']?.[0]).toMatch(/^matwright_session=[^;]+;.*;\s*Secure/i);
    expect(res.headers['set-cookie']?.[0]).toMatch(/HttpOnly/i);
  });
});
