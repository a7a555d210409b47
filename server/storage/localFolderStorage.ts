import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import fsp from 'node:fs/promises';
import path from 'node:path';
import { assertStorageKey, LIST_LIMIT, type ListedObject, type Storage } from './storage';

/** Relative to the working folder, beside the database files and outside the web build. */
export const DEFAULT_STORAGE_DIR = '.data/storage';

/**
 * Files in a folder on this machine. Content types are not kept: the database
 * row that names a key also records its type, so a sidecar file would only
 * duplicate it. Writes go to a temporary name first and are renamed into
 * place, so a crash never leaves half a photo under a real key.
 */
export function localFolderStorage(folder: string): Storage {
  const root = path.resolve(folder);

  const fileFor = (key: string) => {
    assertStorageKey(key);
    const file = path.resolve(root, key);
    // The key pattern already forbids "..", this second check guards against a future change to it.
    if (!file.startsWith(root + path.sep)) throw new Error(`Storage key ${key} resolves outside ${root}`);
    return file;
  };

  return {
    async put(key, bytes) {
      const file = fileFor(key);
      await fsp.mkdir(path.dirname(file), { recursive: true });
      const temporary = `${file}.${randomUUID()}.partial`;
      try {
        await fsp.writeFile(temporary, bytes, { flag: 'wx' });
        await fsp.rename(temporary, file);
      } catch (err) {
        await fsp.rm(temporary, { force: true });
        throw err;
      }
    },

    async get(key) {
      const file = fileFor(key);
      try {
        const stat = await fsp.stat(file);
        return { body: fs.createReadStream(file), bytes: stat.size };
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
        throw err;
      }
    },

    async delete(key) {
      await fsp.rm(fileFor(key), { force: true });
    },

    async list(prefix = '') {
      const found: ListedObject[] = [];
      await walk(root, '', prefix, found);
      return found.sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
    },
  };
}

/** Files below `folder` whose key starts with `prefix`; half-written `.partial` files are not objects. */
async function walk(folder: string, keyPrefix: string, prefix: string, found: ListedObject[]): Promise<void> {
  let entries: fs.Dirent[];
  try {
    entries = await fsp.readdir(folder, { withFileTypes: true });
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'ENOENT') return;
    throw err;
  }
  for (const entry of entries) {
    const key = keyPrefix + entry.name;
    if (entry.isDirectory()) {
      if (prefix.startsWith(key + '/') || (key + '/').startsWith(prefix)) await walk(path.join(folder, entry.name), key + '/', prefix, found);
    } else if (entry.isFile() && !entry.name.endsWith('.partial') && key.startsWith(prefix)) {
      if (found.length >= LIST_LIMIT) throw new Error(`More than ${LIST_LIMIT} stored objects; list a narrower prefix`);
      found.push({ key, bytes: (await fsp.stat(path.join(folder, entry.name))).size });
    }
  }
}
