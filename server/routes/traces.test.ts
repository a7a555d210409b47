import { spawn, type ChildProcess } from 'node:child_process';
import { eq } from 'drizzle-orm';
import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { pino } from 'pino';
import sharp from 'sharp';
import type { Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { connectDatabase } from '../../db/client';
import { traceRuns } from '../../db/schema';
import { polygonArea } from '../../geometry';
import { createApp } from '../app';
import { garmentPhoto, jerseyOutline } from '../test/fixtures/garmentPhoto';
import { heicLookalike } from '../test/fixtures/images';
import { signUpShop, TEST_PUBLIC_URL, testThrottle } from '../test/harness';
import { localFolderStorage } from '../storage/localFolderStorage';
import { createImagePool } from '../trace/imagePool';
import { startTracing, type Tracing } from '../trace/startTracing';

const databaseUrl = inject('databaseUrl');
const storageDir = await fs.mkdtemp(path.join(os.tmpdir(), 'matwright-traces-'));
const storage = localFolderStorage(storageDir);
const database = connectDatabase(databaseUrl);
const logger = pino({ level: 'silent' });
/** A dead worker's job is handed on after 8 s here instead of the default 90 s. */
const queue = { expireInSeconds: 8, maintenanceIntervalSeconds: 1 };
/** One pool of image threads for the whole file, as one server process has. */
const pool = createImagePool();
let sender: Tracing;
let app: ReturnType<typeof createApp>;

beforeAll(async () => {
  sender = await startTracing({ db: database.db, databaseUrl, storage, logger, worker: false, queue, pool });
  app = createApp({ db: database.db, logger, storage, tracing: sender, publicUrl: TEST_PUBLIC_URL, throttle: testThrottle });
}, 60000);

afterAll(async () => {
  await sender.stop();
  await pool.close();
  await database.close();
  await fs.rm(storageDir, { recursive: true, force: true });
});

async function waitFor<T>(what: string, read: () => Promise<T | null | undefined | false>, timeoutMs = 45000): Promise<T> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const value = await read();
    if (value) return value;
    await new Promise((r) => setTimeout(r, 40));
  }
  throw new Error(`timed out waiting for ${what}`);
}

async function garmentWithPhoto(photo: Buffer, kind = 'garment') {
  const shop = await signUpShop({ app, database }, 'Saltmarsh Frame Works');
  const customer = await shop.agent.post('/api/customers').send({ name: 'Ottilie Brackwater' });
  const job = await shop.agent.post('/api/jobs').send({ title: 'Harbour Saltwhistles home jersey', customerId: customer.body.customer.id });
  const jobId = job.body.job.id as string;
  const piece = await shop.agent.post(`/api/jobs/${jobId}/pieces`).send({ kind, label: 'Home jersey', widthIn: 16, heightIn: 18 });
  const pieceId = piece.body.piece.id as string;
  const upload = await shop.agent.post(`/api/jobs/${jobId}/pieces/${pieceId}/photos`).attach('photo', photo, { filename: 'jersey.jpg', contentType: 'image/jpeg' });
  expect(upload.status).toBe(201);
  return { agent: shop.agent, jobId, pieceId, photoId: upload.body.photo.id as string, traceUrl: `/api/jobs/${jobId}/pieces/${pieceId}/traces` };
}

const traceOf = async (agent: Agent, id: string) => (await agent.get(`/api/traces/${id}`)).body.trace;

describe('tracing as a background job', () => {
  it('proposes the sheet’s corners, queues a trace that reports progress and finishes, and saves the outline on the piece', async () => {
    const worker = await startTracing({ db: database.db, databaseUrl, storage, logger, worker: true, queue, pool });
    try {
      const photo = await garmentPhoto(2000, 1500, 15);
      const g = await garmentWithPhoto(photo.jpeg);
      const proposed = await g.agent.get(`/api/photos/${g.photoId}/corners`);
      expect(proposed.status).toBe(200);
      proposed.body.corners.forEach((c: { x: number; y: number }, i: number) => {
        expect(Math.hypot(c.x - photo.sheetCorners[i]!.x, c.y - photo.sheetCorners[i]!.y)).toBeLessThan(12);
      });
      const queued = await g.agent.post(g.traceUrl).send({ photoId: g.photoId, calibration: { kind: 'rectangle', corners: proposed.body.corners, widthIn: 8.5, heightIn: 11 } });
      expect(queued.status).toBe(202);
      expect(queued.body.trace.status).toBe('queued');
      const seen = new Set<string>();
      const done = await waitFor('the trace to finish', async () => {
        const t = await traceOf(g.agent, queued.body.trace.id);
        seen.add(`${t.status}:${t.stage}`);
        return t.status === 'done' || t.status === 'failed' ? t : null;
      });
      expect(done.status).toBe('done');
      expect([...seen].some((s) => s.startsWith('running:'))).toBe(true);
      // Within 1 % of the made-up jersey's area even with the corners found automatically.
      expect(Math.abs(done.result.areaSqIn - polygonArea(jerseyOutline)) / polygonArea(jerseyOutline)).toBeLessThan(0.01);
      const image = await g.agent.get(`/api/traces/${done.id}/image`);
      expect(image.headers['content-type']).toBe('image/jpeg');
      const meta = await sharp(image.body as Buffer).metadata();
      expect(meta.width! / done.result.imageWidthIn).toBeCloseTo(meta.height! / done.result.imageHeightIn, 0);

      const before = await g.agent.get(`/api/jobs/${g.jobId}/pieces/${g.pieceId}`);
      expect(before.body.piece.outline).toBeNull();
      const saved = await g.agent.put(`/api/jobs/${g.jobId}/pieces/${g.pieceId}/outline`).send({ traceId: done.id, points: done.result.points });
      expect(saved.status).toBe(200);
      expect(saved.body.piece.outline.points).toHaveLength(done.result.points.length);
      expect(saved.body.piece.outline.calibration.corners).toEqual(proposed.body.corners);
      expect(saved.body.piece.widthIn).toBeCloseTo(16, 1);
      expect(saved.body.piece.heightIn).toBeCloseTo(18, 1);
    } finally {
      await worker.stop();
    }
  }, 90000);

  it('hands a job on when its worker is killed mid-trace, and the retry completes', async () => {
    const photo = await garmentPhoto(4000, 3000, 15, 11);
    const g = await garmentWithPhoto(photo.jpeg);
    const queued = await g.agent.post(g.traceUrl).send({ photoId: g.photoId, calibration: { kind: 'rectangle', corners: photo.sheetCorners, widthIn: 8.5, heightIn: 11 } });
    expect(queued.status).toBe(202);
    const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'server/worker.ts'], {
      env: { ...process.env, DATABASE_URL: databaseUrl, STORAGE_DIR: storageDir, LOG_LEVEL: 'silent', TRACE_EXPIRE_SECONDS: '8', TRACE_MAINTENANCE_SECONDS: '1' },
      stdio: 'ignore',
    });
    const exited = new Promise((resolve) => child.on('exit', resolve));
    await waitFor('the worker to start the trace', async () => (await traceOf(g.agent, queued.body.trace.id)).status === 'running', 60000);
    child.kill('SIGKILL');
    await exited;
    const stranded = await traceOf(g.agent, queued.body.trace.id);
    expect(stranded.status).toBe('running');
    expect(stranded.attempts).toBe(1);

    const rescuer = await startTracing({ db: database.db, databaseUrl, storage, logger, worker: true, queue, pool });
    try {
      const done = await waitFor('the retried trace', async () => {
        const t = await traceOf(g.agent, queued.body.trace.id);
        return t.status === 'done' || t.status === 'failed' ? t : null;
        // The job waits out its lease before it is handed on, then traces a 12 MP photo again:
        // seconds alone, over a minute once when the whole suite shared two cores with it.
      }, 120000);
      expect(done.status).toBe('done');
      expect(done.attempts).toBe(2);
      expect(Math.abs(done.result.areaSqIn - polygonArea(jerseyOutline)) / polygonArea(jerseyOutline)).toBeLessThan(0.01);
    } finally {
      await rescuer.stop();
    }
  }, 200000);
});

describe('tracing refuses bad input clearly and keeps nothing', () => {
  let g: Awaited<ReturnType<typeof garmentWithPhoto>>;
  beforeAll(async () => {
    g = await garmentWithPhoto((await garmentPhoto(800, 600, 0)).jpeg);
  }, 60000);

  const runsOf = async (pieceId: string) => database.db.select({ id: traceRuns.id }).from(traceRuns).where(eq(traceRuns.pieceId, pieceId));

  it.each([
    ['corners whose sides cross', { kind: 'rectangle', corners: [{ x: 100, y: 100 }, { x: 500, y: 400 }, { x: 500, y: 100 }, { x: 100, y: 400 }], widthIn: 8.5, heightIn: 11 }, /cross/],
    ['three corners on a line', { kind: 'rectangle', corners: [{ x: 100, y: 100 }, { x: 300, y: 100 }, { x: 500, y: 100 }, { x: 300, y: 400 }], widthIn: 8.5, heightIn: 11 }, /one line/],
    ['two points on top of each other', { kind: 'twoPoints', from: { x: 200, y: 200 }, to: { x: 200, y: 200 }, distanceIn: 10 }, /on top of each other/],
    ['a zero distance', { kind: 'twoPoints', from: { x: 100, y: 200 }, to: { x: 400, y: 200 }, distanceIn: 0 }, /more than 0/],
  ])('refuses %s with a 400 that says why', async (_name, calibration, words) => {
    const res = await g.agent.post(g.traceUrl).send({ photoId: g.photoId, calibration });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.error)).toMatch(words);
    expect(await runsOf(g.pieceId)).toEqual([]);
  });

  it('fails a photo with no garment in it with a message, and the piece keeps no outline', async () => {
    const worker = await startTracing({ db: database.db, databaseUrl, storage, logger, worker: true, queue, pool });
    try {
      const bare = await sharp({ create: { width: 1200, height: 900, channels: 3, background: '#d8cdb8', noise: { type: 'gaussian', mean: 200, sigma: 4 } } }).jpeg().toBuffer();
      const b = await garmentWithPhoto(bare);
      const queued = await b.agent.post(b.traceUrl).send({ photoId: b.photoId, calibration: { kind: 'twoPoints', from: { x: 100, y: 100 }, to: { x: 900, y: 100 }, distanceIn: 20 } });
      const done = await waitFor('the trace to fail', async () => {
        const t = await traceOf(b.agent, queued.body.trace.id);
        return t.status === 'failed' || t.status === 'done' ? t : null;
      });
      expect(done.status).toBe('failed');
      expect(done.stage).toBe('finished');
      expect(done.attempts).toBe(1);
      expect(done.message).toMatch(/No garment stands out/);
      const saved = await b.agent.put(`/api/jobs/${b.jobId}/pieces/${b.pieceId}/outline`).send({ traceId: done.id, points: [{ x: 0, y: 0 }, { x: 5, y: 0 }, { x: 5, y: 5 }] });
      expect(saved.status).toBe(409);
      expect((await b.agent.get(`/api/jobs/${b.jobId}/pieces/${b.pieceId}`)).body.piece.outline).toBeNull();
    } finally {
      await worker.stop();
    }
  }, 60000);

  it('tries a HEIC upload with the HEIC decoder and, when it cannot be read, refuses it with words on sending a JPEG', async () => {
    const res = await g.agent.post(`/api/jobs/${g.jobId}/pieces/${g.pieceId}/photos`).attach('photo', heicLookalike(), { filename: 'IMG_0007.HEIC', contentType: 'image/heic' });
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/JPEG/);
  }, 60000);

  it('refuses a piece that is not a garment', async () => {
    const p = await garmentWithPhoto((await garmentPhoto(600, 450, 0)).jpeg, 'photo');
    const res = await p.agent.post(p.traceUrl).send({ photoId: p.photoId, calibration: { kind: 'twoPoints', from: { x: 10, y: 10 }, to: { x: 300, y: 10 }, distanceIn: 8 } });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/Only garments/);
  });
});
