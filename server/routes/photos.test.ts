import { and, eq } from 'drizzle-orm';
import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { pino } from 'pino';
import sharp from 'sharp';
import request, { type Agent } from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { connectDatabase } from '../../db/client';
import { activity, photos } from '../../db/schema';
import { PHOTO_MAX_BYTES, PHOTO_MAX_PIXELS } from '../../features/pieces/schema';
import { createApp } from '../app';
import { heicLookalike, noisyImage, pngHeaderOnly } from '../test/fixtures/images';
import { addMember, signUpShop, TEST_PUBLIC_URL, testThrottle, type Harness } from '../test/harness';
import { localFolderStorage } from '../storage/localFolderStorage';
import type { Storage } from '../storage/storage';

const storageDir = await fs.mkdtemp(path.join(os.tmpdir(), 'matwright-photos-'));
const database = connectDatabase(inject('databaseUrl'));
const h: Harness = { app: createApp({ db: database.db, logger: pino({ level: 'silent' }), storage: localFolderStorage(storageDir), publicUrl: TEST_PUBLIC_URL, throttle: testThrottle }), database };
afterAll(async () => {
  await database.close();
  await fs.rm(storageDir, { recursive: true, force: true });
});

async function shopWithPiece(app = h.app) {
  const shop = await signUpShop({ ...h, app }, 'Copperfield Yard Frames');
  const customer = await shop.agent.post('/api/customers').send({ name: 'Marisol Quennell' });
  const job = await shop.agent.post('/api/jobs').send({ title: 'Ironbridge Emberquills jersey and team photo', customerId: customer.body.customer.id });
  const jobId = job.body.job.id as string;
  const piece = await shop.agent.post(`/api/jobs/${jobId}/pieces`).send({ kind: 'photo', label: 'Team photo', widthIn: 8, heightIn: 10 });
  expect(piece.status).toBe(201);
  const pieceId = piece.body.piece.id as string;
  return { ...shop, jobId, pieceId, uploadUrl: `/api/jobs/${jobId}/pieces/${pieceId}/photos` };
}

/** Every file kept for one shop, so a test can prove a refused upload left none. */
async function storedFiles(shopId: string, root = storageDir): Promise<string[]> {
  const folder = path.join(root, 'photos', shopId);
  return (await fs.readdir(folder).catch(() => [] as string[])).sort();
}

async function photoRows(shopId: string) {
  return database.db.select({ id: photos.id }).from(photos).where(eq(photos.shopId, shopId));
}

const upload = (agent: Agent, url: string, bytes: Buffer, filename: string, contentType = 'application/octet-stream') =>
  agent.post(url).attach('photo', bytes, { filename, contentType });

const binary = (res: request.Response, callback: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => callback(null, Buffer.concat(chunks)));
};

describe('uploading photos', () => {
  it('a PNG is kept with its detected type and size, and its preview is a smaller JPEG of at most 1600 px', async () => {
    const { agent, uploadUrl, shopId } = await shopWithPiece();
    const png = await noisyImage(2400, 1800, 'png');
    const res = await upload(agent, uploadUrl, png, 'team.png', 'image/png');
    expect(res.status).toBe(201);
    expect(res.body.photo).toMatchObject({ mimeType: 'image/png', widthPx: 2400, heightPx: 1800, bytes: png.length, originalName: 'team.png' });

    const preview = await agent.get(`/api/photos/${res.body.photo.id}/preview`).buffer(true).parse(binary);
    expect(preview.status).toBe(200);
    expect(preview.headers['content-type']).toBe('image/jpeg');
    expect(preview.headers['cache-control']).toMatch(/^private/);
    const previewMeta = await sharp(preview.body as Buffer).metadata();
    expect({ format: previewMeta.format, width: previewMeta.width, height: previewMeta.height }).toEqual({ format: 'jpeg', width: 1600, height: 1200 });
    expect((preview.body as Buffer).length).toBeLessThan(png.length);

    const original = await agent.get(`/api/photos/${res.body.photo.id}/original`).buffer(true).parse(binary);
    expect(original.headers['content-type']).toBe('image/png');
    expect((original.body as Buffer).equals(png)).toBe(true);
    expect(await storedFiles(shopId)).toHaveLength(2);
  });

  it('a JPEG sent as a generic file is recognised by its content and turned upright by its orientation tag', async () => {
    const { agent, uploadUrl } = await shopWithPiece();
    // Stored landscape 3000 x 2000 with EXIF orientation 6: the camera was held upright.
    const jpeg = await noisyImage(3000, 2000, 'jpeg', 6);
    const res = await upload(agent, uploadUrl, jpeg, 'IMG_0042');
    expect(res.status).toBe(201);
    expect(res.body.photo).toMatchObject({ mimeType: 'image/jpeg', widthPx: 2000, heightPx: 3000 });
    const preview = await agent.get(`/api/photos/${res.body.photo.id}/preview`).buffer(true).parse(binary);
    const meta = await sharp(preview.body as Buffer).metadata();
    expect(meta.height).toBe(1600);
    expect(Math.abs(meta.width! - (1600 * 2000) / 3000)).toBeLessThanOrEqual(1);
    expect(meta.orientation ?? 1).toBe(1);
  });

  it('a small WebP keeps its size in the preview instead of being enlarged', async () => {
    const { agent, uploadUrl } = await shopWithPiece();
    const res = await upload(agent, uploadUrl, await noisyImage(300, 200, 'webp'), 'patch.webp', 'image/webp');
    expect(res.body.photo.mimeType).toBe('image/webp');
    const preview = await agent.get(`/api/photos/${res.body.photo.id}/preview`).buffer(true).parse(binary);
    const meta = await sharp(preview.body as Buffer).metadata();
    expect([meta.width, meta.height]).toEqual([300, 200]);
  });

  it('the new photo is listed on its piece and logged in the job activity', async () => {
    const { agent, uploadUrl, jobId, pieceId, shopId } = await shopWithPiece();
    const res = await upload(agent, uploadUrl, await noisyImage(400, 300, 'png'), 'team.png');
    const list = await agent.get(`/api/jobs/${jobId}/pieces`);
    expect(list.body.pieces[0].photos.map((p: { id: string }) => p.id)).toEqual([res.body.photo.id]);
    const logged = await database.db
      .select({ detail: activity.detail })
      .from(activity)
      .where(and(eq(activity.jobId, jobId), eq(activity.kind, 'photo_added')));
    expect(logged).toEqual([{ detail: { pieceId, photoId: res.body.photo.id, label: 'Team photo' } }]);
    expect(await storedFiles(shopId)).toHaveLength(2);
  });

  it('designer and front desk may upload, view and delete photos too', async () => {
    const { uploadUrl, shopId } = await shopWithPiece();
    for (const role of ['designer', 'front_desk'] as const) {
      const member = await addMember(h, shopId, role);
      const res = await upload(member, uploadUrl, await noisyImage(200, 200, 'png'), `${role}.png`);
      expect(res.status).toBe(201);
      expect((await member.get(`/api/photos/${res.body.photo.id}/preview`)).status).toBe(200);
      expect((await member.delete(`/api/photos/${res.body.photo.id}`)).status).toBe(204);
    }
    expect(await storedFiles(shopId)).toEqual([]);
  });
});

describe('refused uploads leave nothing behind', () => {
  it('a file over 25 MB gets 413 with the usual error shape, and no row or file is kept', async () => {
    const { agent, uploadUrl, shopId } = await shopWithPiece();
    const big = Buffer.concat([await noisyImage(64, 64, 'jpeg'), Buffer.alloc(PHOTO_MAX_BYTES)]);
    const res = await upload(agent, uploadUrl, big, 'huge.jpg', 'image/jpeg');
    expect(res.status).toBe(413);
    expect(res.body.error).toEqual({ code: 'too_large', message: expect.stringContaining('larger than 25 MB'), requestId: expect.any(String) });
    expect(await photoRows(shopId)).toEqual([]);
    expect(await storedFiles(shopId)).toEqual([]);
  });

  it('a text file named photo.jpg and declared as a JPEG gets 415 naming the accepted formats, and nothing is kept', async () => {
    const { agent, uploadUrl, shopId } = await shopWithPiece();
    const res = await upload(agent, uploadUrl, Buffer.from('Measurements: 22 1/2 x 30 1/4 in\n'), 'photo.jpg', 'image/jpeg');
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_type');
    expect(res.body.error.message).toContain('JPEG, PNG, WebP or AVIF');
    expect(await photoRows(shopId)).toEqual([]);
    expect(await storedFiles(shopId)).toEqual([]);
  });

  it('a HEIC photo gets 415 that says HEIC cannot be read and which formats can', async () => {
    const { agent, uploadUrl, shopId } = await shopWithPiece();
    const res = await upload(agent, uploadUrl, heicLookalike(), 'IMG_0007.HEIC', 'image/heic');
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/^HEIC photos cannot be read here/);
    expect(res.body.error.message).toContain('JPEG, PNG, WebP or AVIF');
    expect(await storedFiles(shopId)).toEqual([]);
  });

  it('a PNG cut short gets 415 as damaged, and nothing is kept', async () => {
    const { agent, uploadUrl, shopId } = await shopWithPiece();
    const png = await noisyImage(800, 600, 'png');
    const res = await upload(agent, uploadUrl, png.subarray(0, Math.floor(png.length / 2)), 'half.png');
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unreadable_image');
    expect(await photoRows(shopId)).toEqual([]);
    expect(await storedFiles(shopId)).toEqual([]);
  });

  it('a request without a file, or with the file under another name, gets 400 naming the photo field', async () => {
    const { agent, uploadUrl } = await shopWithPiece();
    const none = await agent.post(uploadUrl).field('note', 'no file here');
    expect(none.status).toBe(400);
    expect(none.body.error.fields).toEqual({ photo: 'Choose a photo to upload' });
    const misnamed = await agent.post(uploadUrl).attach('picture', await noisyImage(50, 50, 'png'), 'a.png');
    expect(misnamed.status).toBe(400);
    expect(misnamed.body.error.fields).toEqual({ photo: 'Send one photo, in the field named "photo"' });
  });

  it('when storing the preview fails, the original already written is removed and no row is added', async () => {
    const failingDir = await fs.mkdtemp(path.join(os.tmpdir(), 'matwright-failing-'));
    const inner = localFolderStorage(failingDir);
    const failing: Storage = {
      ...inner,
      put: (key, bytes, type) => (key.endsWith('.preview.jpg') ? Promise.reject(new Error('disk full')) : inner.put(key, bytes, type)),
    };
    const app = createApp({ db: database.db, logger: pino({ level: 'silent' }), storage: failing, publicUrl: TEST_PUBLIC_URL, throttle: testThrottle });
    const { agent, uploadUrl, shopId } = await shopWithPiece(app);
    const res = await upload(agent, uploadUrl, await noisyImage(300, 300, 'png'), 'a.png');
    expect(res.status).toBe(500);
    expect(await photoRows(shopId)).toEqual([]);
    expect(await storedFiles(shopId, failingDir)).toEqual([]);
    await fs.rm(failingDir, { recursive: true, force: true });
  });
});

describe('deleting', () => {
  it('deleting a photo removes its row and both files', async () => {
    const { agent, uploadUrl, shopId } = await shopWithPiece();
    const res = await upload(agent, uploadUrl, await noisyImage(300, 300, 'png'), 'a.png');
    expect(await storedFiles(shopId)).toHaveLength(2);
    expect((await agent.delete(`/api/photos/${res.body.photo.id}`)).status).toBe(204);
    expect(await storedFiles(shopId)).toEqual([]);
    expect(await photoRows(shopId)).toEqual([]);
    expect((await agent.get(`/api/photos/${res.body.photo.id}/preview`)).status).toBe(404);
  });

  it("deleting a piece removes its photos' files as well", async () => {
    const { agent, uploadUrl, jobId, pieceId, shopId } = await shopWithPiece();
    await upload(agent, uploadUrl, await noisyImage(300, 300, 'png'), 'a.png');
    await upload(agent, uploadUrl, await noisyImage(300, 300, 'jpeg'), 'b.jpg');
    expect(await storedFiles(shopId)).toHaveLength(4);
    expect((await agent.delete(`/api/jobs/${jobId}/pieces/${pieceId}`)).status).toBe(204);
    expect(await storedFiles(shopId)).toEqual([]);
    expect(await photoRows(shopId)).toEqual([]);
  });
});

describe('shops are sealed from each other', () => {
  it("another shop gets 404 uploading to, viewing or deleting this shop's photos, and nothing changes", async () => {
    const mine = await shopWithPiece();
    const res = await upload(mine.agent, mine.uploadUrl, await noisyImage(300, 300, 'png'), 'a.png');
    const photoId = res.body.photo.id as string;
    const other = await signUpShop(h, 'Moorgate Mews Framing');
    const answers = [
      await upload(other.agent, mine.uploadUrl, await noisyImage(300, 300, 'png'), 'b.png'),
      await other.agent.get(`/api/photos/${photoId}/preview`),
      await other.agent.get(`/api/photos/${photoId}/original`),
      await other.agent.delete(`/api/photos/${photoId}`),
    ];
    expect(answers.map((r) => r.status)).toEqual([404, 404, 404, 404]);
    expect(await storedFiles(mine.shopId)).toHaveLength(2);
    expect(await storedFiles(other.shopId)).toEqual([]);
    expect((await mine.agent.get(`/api/photos/${photoId}/original`)).status).toBe(200);
  });

  it('a signed-out visitor gets 401 for a photo, and an unknown variant or non-UUID id is a 404', async () => {
    const mine = await shopWithPiece();
    const res = await upload(mine.agent, mine.uploadUrl, await noisyImage(100, 100, 'png'), 'a.png');
    expect((await request(h.app).get(`/api/photos/${res.body.photo.id}/preview`)).status).toBe(401);
    expect((await mine.agent.get(`/api/photos/${res.body.photo.id}/thumbnail`)).status).toBe(404);
    expect((await mine.agent.get('/api/photos/../../etc/passwd/original')).status).toBe(404);
    expect((await mine.agent.get('/api/photos/1234/original')).status).toBe(404);
  });
});

describe('pixel limit', () => {
  it(`a photo over ${PHOTO_MAX_PIXELS / 1e6} megapixels is refused from its header with 413, nothing kept`, async () => {
    const { agent, uploadUrl, shopId } = await shopWithPiece();
    // 16000 x 16000 = 256 megapixels, a size once accepted; the file itself is under 200 bytes.
    const huge = pngHeaderOnly(16_000, 16_000);
    expect(huge.length).toBeLessThan(200);
    const res = await upload(agent, uploadUrl, huge, 'stadium.png', 'image/png');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_many_pixels');
    expect(res.body.error.message).toContain('256 megapixels');
    // Just past the limit: 8000 x 7501 = 60.008 MP.
    expect((await upload(agent, uploadUrl, pngHeaderOnly(8000, 7501), 'edge.png', 'image/png')).status).toBe(413);
    expect(await photoRows(shopId)).toEqual([]);
    expect(await storedFiles(shopId)).toEqual([]);
  });

  it('a photo at the limit gets past the pixel check (this header-only file is then refused as damaged, 415)', async () => {
    const { agent, uploadUrl } = await shopWithPiece();
    // 8000 x 7500 = exactly 60 MP: allowed by the count, so the decoder runs and finds no pixel data.
    const res = await upload(agent, uploadUrl, pngHeaderOnly(8000, 7500), 'edge.png', 'image/png');
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unreadable_image');
  });
});
