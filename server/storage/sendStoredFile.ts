import type { Response } from 'express';
import { pipeline } from 'node:stream/promises';
import { notFound } from '../errors';
import { DOWNLOAD_URL_LIFETIME_S, type Storage } from './storage';

export interface StoredFile {
  key: string;
  contentType: string;
  /** Names what is missing in the 404 when the key holds nothing, e.g. "Photo file". */
  what: string;
}

/**
 * Answers with a file the caller has already been allowed to see. Where the
 * storage signs addresses (S3), a 302 to a presigned URL that lives a minute,
 * so the bytes go from the bucket to the browser and never through this
 * process; the redirect itself is never cached, so a reload gets a fresh one.
 * Otherwise (the local folder) the bytes are streamed from storage.
 */
export async function sendStoredFile(res: Response, storage: Storage, file: StoredFile): Promise<void> {
  if (storage.downloadUrl) {
    const url = await storage.downloadUrl(file.key, { contentType: file.contentType, expiresInS: DOWNLOAD_URL_LIFETIME_S });
    res.set('Cache-Control', 'private, no-store');
    res.redirect(302, url);
    return;
  }
  const object = await storage.get(file.key);
  if (!object) throw notFound(file.what);
  res.set({
    'Content-Type': file.contentType,
    'Content-Length': String(object.bytes),
    // Only for this browser: shared caches must never keep one shop's photos.
    'Cache-Control': 'private, max-age=3600',
    'X-Content-Type-Options': 'nosniff',
    'Content-Disposition': 'inline',
  });
  // A browser that leaves mid-download is not a server error; only a failure before any byte was sent is.
  await pipeline(object.body, res).catch((err: unknown) => {
    if (!res.headersSent) throw err;
  });
}
