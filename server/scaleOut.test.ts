import { spawn } from 'node:child_process';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { connectDatabase, type Database } from '../db/client';
import { createApp } from './app';
import { startS3Fake, type S3Fake } from './storage/s3Fake';
import { s3Storage } from './storage/s3Storage';
import { garmentPhoto } from './test/fixtures/garmentPhoto';
import { TEST_PUBLIC_URL, testPassword, uniqueEmail } from './test/harness';
import { startTracing, type Tracing } from './trace/startTracing';

// Two web processes as a load balancer would see them: separate apps, pools and
// storage clients, sharing only Postgres and one bucket (an S3 fake).
const databaseUrl = inject('databaseUrl');
const logger = pino({ level: 'silent' });
const throttle = { minPerAddress: 100_000, keyPrefix: `scale-out-${Date.now()}:` };
let fake: S3Fake;
let sender: Tracing;
let senderDb: Database;
const processes: { database: Database; server: http.Server; url: string }[] = [];

async function startWebProcess(tracing?: Tracing) {
  const database = connectDatabase(databaseUrl);
  const app = createApp({ db: database.db, logger, publicUrl: TEST_PUBLIC_URL, throttle, storage: s3Storage(fake.settings), tracing });
  const server = await new Promise<http.Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  processes.push({ database, server, url });
  return url;
}

let a: string;
let b: string;
beforeAll(async () => {
  fake = await startS3Fake();
  senderDb = connectDatabase(databaseUrl);
  sender = await startTracing({ db: senderDb.db, databaseUrl, storage: s3Storage(fake.settings), logger, worker: false });
  a = await startWebProcess(sender);
  b = await startWebProcess();
}, 60000);

afterAll(async () => {
  await sender.stop();
  await senderDb.close();
  for (const p of processes) {
    p.server.closeAllConnections();
    await new Promise((resolve) => p.server.close(resolve));
    await p.database.close();
  }
  await fake.close();
});

/** Signs up a shop through `url` and returns the session cookie and the owner's e-mail. */
async function signUpThrough(url: string) {
  const email = uniqueEmail('scale');
  const res = await request(url).post('/api/auth/sign-up').send({ shopName: 'Two Rivers Framing', name: 'Wren Test', email, password: testPassword });
  expect(res.status).toBe(201);
  const cookie = (res.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');
  return { cookie, email };
}

async function pieceThrough(url: string, cookie: string) {
  const customer = await request(url).post('/api/customers').set('Cookie', cookie).send({ name: 'Hollis Fernbrook' });
  const job = await request(url).post('/api/jobs').set('Cookie', cookie).send({ title: 'Ridgeback Comets away jersey', customerId: customer.body.customer.id });
  const jobId = job.body.job.id as string;
  const piece = await request(url).post(`/api/jobs/${jobId}/pieces`).set('Cookie', cookie).send({ kind: 'garment', label: 'Away jersey', widthIn: 16, heightIn: 18 });
  return { jobId, pieceId: piece.body.piece.id as string };
}

/** Follows the photo route's redirect to the bucket, as a browser would, and returns the bytes. */
async function downloadThrough(url: string, path: string, cookie: string) {
  const res = await request(url).get(path).set('Cookie', cookie).redirects(0);
  expect(res.status).toBe(302);
  expect(res.headers['cache-control']).toBe('private, no-store');
  const location = res.headers.location as string;
  expect(location.startsWith(fake.settings.endpoint!)).toBe(true);
  const file = await fetch(location);
  expect(file.status).toBe(200);
  return { bytes: Buffer.from(await file.arrayBuffer()), type: file.headers.get('content-type') };
}

describe('two web processes on one database and one bucket', () => {
  it('a session made through one is valid on the other, and signing out on the other ends it', async () => {
    const { cookie, email } = await signUpThrough(a);
    const me = await request(b).get('/api/auth/me').set('Cookie', cookie);
    expect(me.status).toBe(200);
    expect(me.body.member.email).toBe(email);
    expect((await request(b).post('/api/auth/sign-out').set('Cookie', cookie)).status).toBeLessThan(300);
    expect((await request(a).get('/api/auth/me').set('Cookie', cookie)).status).toBe(401);
  });

  it('a photo uploaded through one is read through the other, byte for byte, from a presigned address', async () => {
    const { cookie } = await signUpThrough(a);
    const { jobId, pieceId } = await pieceThrough(a, cookie);
    const photo = (await garmentPhoto(800, 600, 15)).jpeg;
    const upload = await request(a).post(`/api/jobs/${jobId}/pieces/${pieceId}/photos`).set('Cookie', cookie).attach('photo', photo, { filename: 'away.jpg', contentType: 'image/jpeg' });
    expect(upload.status).toBe(201);
    const original = await downloadThrough(b, `/api/photos/${upload.body.photo.id}/original`, cookie);
    expect(original.bytes.equals(photo)).toBe(true);
    expect(original.type).toBe('image/jpeg');
    // Another shop gets the same 404 as before, and no address to the bucket.
    const stranger = await signUpThrough(b);
    const refused = await request(b).get(`/api/photos/${upload.body.photo.id}/original`).set('Cookie', stranger.cookie).redirects(0);
    expect(refused.status).toBe(404);
    expect(refused.headers.location).toBeUndefined();
  });

  it('the sign-in throttle counts attempts made through both', async () => {
    const { email } = await signUpThrough(a);
    // 10 wrong passwords per account in 15 minutes (security/throttle.ts), spread over both processes.
    for (let i = 0; i < 10; i++) {
      const res = await request(i % 2 ? a : b).post('/api/auth/sign-in').send({ email, password: `wrong guess ${i}` });
      expect(res.status).toBe(401);
    }
    const refused = await request(a).post('/api/auth/sign-in').send({ email, password: testPassword });
    expect(refused.status).toBe(429);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect((await request(b).post('/api/auth/sign-in').send({ email, password: testPassword })).status).toBe(429);
  });

  it('a trace queued through one is completed by a separate worker process, and its photo read through the other', async () => {
    const { cookie } = await signUpThrough(a);
    const { jobId, pieceId } = await pieceThrough(b, cookie);
    const photo = await garmentPhoto(2000, 1500, 15);
    const upload = await request(b).post(`/api/jobs/${jobId}/pieces/${pieceId}/photos`).set('Cookie', cookie).attach('photo', photo.jpeg, { filename: 'jersey.jpg', contentType: 'image/jpeg' });
    const queued = await request(a)
      .post(`/api/jobs/${jobId}/pieces/${pieceId}/traces`)
      .set('Cookie', cookie)
      .send({ photoId: upload.body.photo.id, calibration: { kind: 'rectangle', corners: photo.sheetCorners, widthIn: 8.5, heightIn: 11 } });
    expect(queued.status).toBe(202);
    const worker = spawn(process.execPath, ['--import', 'tsx', 'server/worker.ts'], {
      env: {
        ...process.env,
        DATABASE_URL: databaseUrl,
        LOG_LEVEL: 'silent',
        STORAGE: 's3',
        S3_ENDPOINT: fake.settings.endpoint,
        S3_BUCKET: fake.settings.bucket,
        S3_REGION: fake.settings.region,
        S3_ACCESS_KEY_ID: fake.settings.accessKeyId,
        S3_SECRET_ACCESS_KEY: fake.settings.secretAccessKey,
      },
      stdio: 'ignore',
    });
    const exited = new Promise<number | null>((resolve) => worker.on('exit', resolve));
    try {
      const until = Date.now() + 60_000;
      let trace = queued.body.trace;
      while (trace.status !== 'done' && trace.status !== 'failed' && Date.now() < until) {
        await new Promise((r) => setTimeout(r, 200));
        trace = (await request(b).get(`/api/traces/${trace.id}`).set('Cookie', cookie)).body.trace;
      }
      expect(trace.status).toBe('done');
      const image = await downloadThrough(a, `/api/traces/${trace.id}/image`, cookie);
      expect(image.type).toBe('image/jpeg');
      expect(image.bytes.subarray(0, 3).toString('hex')).toBe('ffd8ff'); // JPEG start-of-image marker (ITU-T T.81)
    } finally {
      worker.kill('SIGTERM');
    }
    // SIGTERM with no job running: the worker stops cleanly.
    expect(await exited).toBe(0);
  }, 90000);
});
