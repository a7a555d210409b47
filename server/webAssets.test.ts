import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { connectDatabase } from '../db/client';
// @ts-expect-error plain Node module without types
import { compressWebBuild } from '../scripts/compressWeb.mjs';
import { createApp } from './app';
import { TEST_PUBLIC_URL } from './test/harness';

/**
 * A small web build made here (an index, a bundle under a hashed name, an
 * unhashed file) and compressed by the same build step the real one uses; the
 * answers are decoded with Node's own zlib (an implementation of RFC 7932
 * brotli and RFC 1952 gzip independent of the server's code).
 */
const webDir = fs.mkdtempSync(path.join(os.tmpdir(), 'matwright-web-'));
const bundlePath = '/_expo/static/js/web/entry-0f3c9a51d2b7e8846a1c0e2f9b3d5a77.js';
const bundle = `/* bundle */\n${'console.log("Matwright opening", 1);\n'.repeat(400)}`;
fs.mkdirSync(path.join(webDir, path.dirname(bundlePath)), { recursive: true });
fs.writeFileSync(path.join(webDir, bundlePath), bundle);
fs.writeFileSync(path.join(webDir, 'index.html'), `<!doctype html><html><head><title>Matwright</title></head><body>${'<!-- padding -->'.repeat(100)}<script src="${bundlePath}" defer></script></body></html>`);
fs.writeFileSync(path.join(webDir, 'robots.txt'), 'User-agent: *\n');
compressWebBuild(webDir);

const database = connectDatabase(inject('databaseUrl'));
const app = createApp({ db: database.db, logger: pino({ level: 'silent' }), publicUrl: TEST_PUBLIC_URL, webDir });
afterAll(async () => {
  await (app.locals.compute as { close(): Promise<void> }).close();
  await database.close();
  fs.rmSync(webDir, { recursive: true, force: true });
});

let base = '';
const server = app.listen(0, '127.0.0.1');
beforeAll(async () => {
  if (!server.listening) await new Promise((resolve) => server.once('listening', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

interface RawAnswer {
  readonly status: number;
  readonly headers: http.IncomingHttpHeaders;
  /** The bytes as they came over the wire, not decoded. */
  readonly body: Buffer;
}

/** A GET through Node's own HTTP client, which leaves the body exactly as sent. */
function get(url: string, acceptEncoding: string): Promise<RawAnswer> {
  return new Promise((resolve, reject) => {
    http.get(`${base}${url}`, { headers: { 'Accept-Encoding': acceptEncoding } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
    }).on('error', reject);
  });
}

describe('the web build', () => {
  it('sends a hashed bundle as brotli when the browser accepts it, cached a year as immutable', async () => {
    const res = await get(bundlePath, 'gzip, deflate, br, zstd'); // as Chromium sends it
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/^(application|text)\/javascript/);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(res.headers.vary).toMatch(/Accept-Encoding/i);
    expect(zlib.brotliDecompressSync(res.body).toString('utf8')).toBe(bundle);
    expect(res.body.length).toBeLessThan(bundle.length / 5);
  });

  it('sends gzip to a browser that takes gzip only, and the plain file to one that takes neither', async () => {
    const gz = await get(bundlePath, 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.headers['cache-control']).toContain('immutable');
    expect(zlib.gunzipSync(gz.body).toString('utf8')).toBe(bundle);

    const plain = await get(bundlePath, 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body.toString('utf8')).toBe(bundle);
    expect(plain.headers['cache-control']).toContain('immutable');
  });

  it('never lets a browser keep index.html or an unhashed file without asking again', async () => {
    for (const url of ['/', '/jobs/123', '/index.html']) {
      const res = await get(url, 'br');
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toBe('no-cache');
      const html = res.headers['content-encoding'] === 'br' ? zlib.brotliDecompressSync(res.body) : res.body;
      expect(html.toString('utf8')).toContain('<title>Matwright</title>');
    }
    const robots = await get('/robots.txt', 'br');
    expect(robots.headers['cache-control']).toBe('no-cache');
  });

  it('keeps the proof page out of every cache', async () => {
    const res = await get('/proof/some-link', 'br');
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.headers['referrer-policy']).toBe('no-referrer');
  });
});
