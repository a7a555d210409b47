import { createHash } from 'node:crypto';

/**
 * Cut files and cut sheets made from frozen versions, kept in memory.
 *
 * A frozen version never changes (a database trigger refuses updates), so a
 * file made from it depends only on the version and on what went into the
 * making beside the document: format, mat, cutter profile, the shop's
 * rounding, piece labels, titles, the date on a cut sheet. The key is the
 * version's id and a hash of all of that, so a changed setting is a new key
 * and the old file is never served for it. Only files that were made are
 * kept; a refusal (422, 400) is worked out again on the next request.
 *
 * In memory rather than in the database: the files depend on this process's
 * writers too, so a new release starts empty instead of serving files an
 * older writer made. The least recently used files go first past the byte
 * budget (FROZEN_FILE_CACHE_MB, 64 MB by default; 0 keeps nothing).
 */

export interface FrozenFileCache {
  /** The file for `key`, made by `make` at most once at a time; later calls get the same text. */
  obtain<T extends { readonly body: string }>(key: string, make: () => Promise<T>): Promise<T>;
  /** Bytes of file text kept now. */
  readonly size: () => number;
}

/** The key of a file made from version `versionId` with `inputs` (everything but the document). */
export function frozenFileKey(versionId: string, inputs: unknown): string {
  return `${versionId}:${createHash('sha256').update(JSON.stringify(inputs)).digest('base64url')}`;
}

const DEFAULT_BUDGET_BYTES = (Number(process.env.FROZEN_FILE_CACHE_MB ?? 64) || 0) * 1024 * 1024;

export function createFrozenFileCache(budgetBytes = DEFAULT_BUDGET_BYTES): FrozenFileCache {
  // A Map keeps insertion order: the first entry is the least recently used one.
  const kept = new Map<string, { readonly body: string }>();
  // Requests that arrive while the same file is being made wait for it rather than making it again.
  const making = new Map<string, Promise<{ readonly body: string }>>();
  let bytes = 0;
  // JavaScript strings hold UTF-16; the files are ASCII text, so this is near the memory used.
  const cost = (file: { readonly body: string }) => file.body.length * 2;

  function keep(key: string, file: { readonly body: string }) {
    if (cost(file) > budgetBytes) return;
    kept.set(key, file);
    bytes += cost(file);
    for (const [oldKey, oldFile] of kept) {
      if (bytes <= budgetBytes) break;
      kept.delete(oldKey);
      bytes -= cost(oldFile);
    }
  }

  async function obtain<T extends { readonly body: string }>(key: string, make: () => Promise<T>): Promise<T> {
    const found = kept.get(key);
    if (found) {
      kept.delete(key);
      kept.set(key, found);
      return found as T;
    }
    const pending = making.get(key);
    if (pending) return (await pending) as T;
    const made = make();
    making.set(key, made);
    try {
      const file = await made;
      keep(key, file);
      return file;
    } finally {
      making.delete(key);
    }
  }

  return { obtain, size: () => bytes };
}
