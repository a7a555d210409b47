import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { text } from 'node:stream/consumers';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { localFolderStorage } from './localFolderStorage';
import { startS3Fake, type S3Fake } from './s3Fake';
import { s3Storage } from './s3Storage';
import type { Storage } from './storage';

const parent = await fs.mkdtemp(path.join(os.tmpdir(), 'matwright-storage-'));
const root = path.join(parent, 'root');
let fake: S3Fake;
let s3: Storage;
beforeAll(async () => {
  fake = await startS3Fake();
  s3 = s3Storage(fake.settings);
});
afterAll(async () => {
  await fake.close();
  await fs.rm(parent, { recursive: true, force: true });
});

// The same contract for every driver: what one machine uses and what several share.
const drivers: [string, () => Storage][] = [
  ['local folder', () => localFolderStorage(root)],
  ['S3 (s3rver behind a signature check)', () => s3],
];

describe.each(drivers)('%s storage', (_name, storageOf) => {
  it('reads back what was put, with its size', async () => {
    const storage = storageOf();
    await storage.put('photos/shop-a/one.original.png', Buffer.from('first bytes'), 'image/png');
    const object = await storage.get('photos/shop-a/one.original.png');
    expect(object?.bytes).toBe(11);
    expect(await text(object!.body)).toBe('first bytes');
  });

  it('a put over an existing key replaces it whole', async () => {
    const storage = storageOf();
    await storage.put('photos/shop-a/replaced.preview.jpg', Buffer.from('a longer first version'), 'image/jpeg');
    await storage.put('photos/shop-a/replaced.preview.jpg', Buffer.from('short'), 'image/jpeg');
    expect(await text((await storage.get('photos/shop-a/replaced.preview.jpg'))!.body)).toBe('short');
  });

  it('a missing key reads as null, and deleting it twice is not an error', async () => {
    const storage = storageOf();
    await storage.put('photos/shop-a/two.preview.jpg', Buffer.from('x'), 'image/jpeg');
    await storage.delete('photos/shop-a/two.preview.jpg');
    await storage.delete('photos/shop-a/two.preview.jpg');
    expect(await storage.get('photos/shop-a/two.preview.jpg')).toBeNull();
  });

  it('lists every key under a prefix with its size, in key order, and nothing outside it', async () => {
    const storage = storageOf();
    const bytes = Buffer.alloc(70_000, 7); // more than one network packet, binary
    await storage.put('photos/shop-list/b.original.jpg', bytes, 'image/jpeg');
    await storage.put('photos/shop-list/a.preview.jpg', Buffer.from('abc'), 'image/jpeg');
    await storage.put('photos/shop-other/c.preview.jpg', Buffer.from('no'), 'image/jpeg');
    expect(await storage.list('photos/shop-list/')).toEqual([
      { key: 'photos/shop-list/a.preview.jpg', bytes: 3 },
      { key: 'photos/shop-list/b.original.jpg', bytes: 70_000 },
    ]);
    const back = await storage.get('photos/shop-list/b.original.jpg');
    const chunks: Buffer[] = [];
    for await (const chunk of back!.body) chunks.push(chunk as Buffer);
    expect(Buffer.concat(chunks).equals(bytes)).toBe(true);
    const all = (await storage.list()).map((o) => o.key);
    expect(all).toContain('photos/shop-other/c.preview.jpg');
    expect(all).toEqual([...all].sort());
  });

  it.each(['../escape.txt', 'photos/../../escape.txt', '/etc/passwd', 'photos//double', 'photos/./here', 'Photos/Upper', '', 'photos/a b'])(
    'refuses the key %j before touching storage',
    async (key) => {
      const storage = storageOf();
      await expect(storage.put(key, Buffer.from('nope'), 'text/plain')).rejects.toThrow(/Refusing storage key/);
      await expect(storage.get(key)).rejects.toThrow(/Refusing storage key/);
      await expect(storage.delete(key)).rejects.toThrow(/Refusing storage key/);
      if (storage.downloadUrl) await expect(storage.downloadUrl(key, { contentType: 'image/jpeg', expiresInS: 60 })).rejects.toThrow(/Refusing storage key/);
    },
  );
});

describe('local folder storage on disk', () => {
  it('leaves no temporary file beside a stored one and nothing outside its folder', async () => {
    const storage = localFolderStorage(root);
    await storage.put('photos/shop-disk/one.original.png', Buffer.from('bytes'), 'image/png');
    expect(await fs.readdir(path.join(root, 'photos/shop-disk'))).toEqual(['one.original.png']);
    expect((await fs.readdir(parent)).filter((name) => name !== 'root')).toEqual([]);
  });

  it('has no presigned addresses: photos stream through the server', () => {
    expect(localFolderStorage(root).downloadUrl).toBeUndefined();
  });
});

describe('S3 presigned download addresses', () => {
  it('serve the object with the type and disposition asked for', async () => {
    await s3.put('photos/shop-url/p.preview.jpg', Buffer.from('jpeg bytes'), 'application/octet-stream');
    const url = await s3.downloadUrl!('photos/shop-url/p.preview.jpg', { contentType: 'image/jpeg', expiresInS: 60 });
    const res = await fetch(url);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('image/jpeg');
    expect(res.headers.get('content-disposition')).toBe('inline');
    expect(await res.text()).toBe('jpeg bytes');
  });

  it('are refused once their lifetime has passed', async () => {
    await s3.put('photos/shop-url/short.preview.jpg', Buffer.from('brief'), 'image/jpeg');
    const url = await s3.downloadUrl!('photos/shop-url/short.preview.jpg', { contentType: 'image/jpeg', expiresInS: 1 });
    expect((await fetch(url)).status).toBe(200);
    await new Promise((resolve) => setTimeout(resolve, 2100));
    const late = await fetch(url);
    expect(late.status).toBe(403);
    expect(await late.text()).toContain('Request has expired');
  });

  it('are refused when any part is changed: the key, the lifetime or the signature', async () => {
    await s3.put('photos/shop-url/other.preview.jpg', Buffer.from('not yours'), 'image/jpeg');
    const url = new URL(await s3.downloadUrl!('photos/shop-url/p.preview.jpg', { contentType: 'image/jpeg', expiresInS: 60 }));
    const otherKey = new URL(url);
    otherKey.pathname = otherKey.pathname.replace('p.preview.jpg', 'other.preview.jpg');
    const longer = new URL(url);
    longer.searchParams.set('X-Amz-Expires', '604800');
    const forged = new URL(url);
    forged.searchParams.set('X-Amz-Signature', '0'.repeat(64));
    for (const changed of [otherKey, longer, forged]) {
      const res = await fetch(changed);
      expect(res.status).toBe(403);
      expect(await res.text()).toContain('SignatureDoesNotMatch');
    }
  });

  it('a client holding the wrong secret can neither read nor write', async () => {
    const stranger = s3Storage({ ...fake.settings, secretAccessKey: 'guessed-secret' });
    await expect(stranger.get('photos/shop-url/p.preview.jpg')).rejects.toThrow();
    await expect(stranger.put('photos/shop-url/intruder.jpg', Buffer.from('x'), 'image/jpeg')).rejects.toThrow();
    expect(await s3.get('photos/shop-url/intruder.jpg')).toBeNull();
  });
});
