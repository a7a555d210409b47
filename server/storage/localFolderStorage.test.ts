import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { text } from 'node:stream/consumers';
import { afterAll, describe, expect, it } from 'vitest';
import { localFolderStorage } from './localFolderStorage';

const parent = await fs.mkdtemp(path.join(os.tmpdir(), 'matwright-storage-'));
const root = path.join(parent, 'root');
const storage = localFolderStorage(root);
afterAll(() => fs.rm(parent, { recursive: true, force: true }));

describe('local folder storage', () => {
  it('reads back what was put, with its size, and leaves no temporary file beside it', async () => {
    await storage.put('photos/shop-a/one.original.png', Buffer.from('first bytes'), 'image/png');
    const object = await storage.get('photos/shop-a/one.original.png');
    expect(object?.bytes).toBe(11);
    expect(await text(object!.body)).toBe('first bytes');
    expect(await fs.readdir(path.join(root, 'photos/shop-a'))).toEqual(['one.original.png']);
  });

  it('a missing key reads as null, and deleting it twice is not an error', async () => {
    await storage.put('photos/shop-a/two.preview.jpg', Buffer.from('x'), 'image/jpeg');
    await storage.delete('photos/shop-a/two.preview.jpg');
    await storage.delete('photos/shop-a/two.preview.jpg');
    expect(await storage.get('photos/shop-a/two.preview.jpg')).toBeNull();
  });

  it.each(['../escape.txt', 'photos/../../escape.txt', '/etc/passwd', 'photos//double', 'photos/./here', 'Photos/Upper', '', 'photos/a b'])(
    'refuses the key %j without touching the disk',
    async (key) => {
      await expect(storage.put(key, Buffer.from('nope'), 'text/plain')).rejects.toThrow(/Refusing storage key/);
      await expect(storage.get(key)).rejects.toThrow(/Refusing storage key/);
      await expect(storage.delete(key)).rejects.toThrow(/Refusing storage key/);
      expect((await fs.readdir(parent)).filter((name) => name !== 'root')).toEqual([]);
    },
  );
});
