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
import { pageRoutes, preloadLinks } from './webAssets';
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

/**
 * A build exported with web output "static": one pre-rendered HTML file per route, named the
 * way Expo Router names routes (fixed names, [param] for one segment, [...rest] for the rest,
 * index for a folder's own path, +not-found for everything else). Which page answers which path
 * is checked against a table written out by hand from those naming rules, not from the code.
 */
const pagesDir = fs.mkdtempSync(path.join(os.tmpdir(), 'matwright-pages-'));
const pageFiles = ['index.html', 'sign-in.html', 'jobs/new.html', 'jobs/[id].html', 'customers/index.html', 'customers/[id].html', 'files/[...rest].html', '+not-found.html'];
for (const file of pageFiles) {
  fs.mkdirSync(path.join(pagesDir, path.dirname(file)), { recursive: true });
  fs.writeFileSync(path.join(pagesDir, file), `<!doctype html><html><head><title>Matwright</title></head><body><p>page ${file}</p>${'<!-- padding -->'.repeat(100)}</body></html>`);
}
compressWebBuild(pagesDir);
const pagesApp = createApp({ db: database.db, logger: pino({ level: process.env.TEST_LOG_LEVEL ?? 'silent' }), publicUrl: TEST_PUBLIC_URL, webDir: pagesDir });
const pagesServer = pagesApp.listen(0, '127.0.0.1');
let pagesBase = '';
beforeAll(async () => {
  if (!pagesServer.listening) await new Promise((resolve) => pagesServer.once('listening', resolve));
  pagesBase = `http://127.0.0.1:${(pagesServer.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise<void>((resolve) => pagesServer.close(() => resolve()));
  await (pagesApp.locals.compute as { close(): Promise<void> }).close();
  fs.rmSync(pagesDir, { recursive: true, force: true });
});

async function page(url: string): Promise<{ status: number; cacheControl: string | undefined; file: string | undefined }> {
  const res = await fetch(`${pagesBase}${url}`, { headers: { 'Accept-Encoding': 'br' } });
  const text = await res.text(); // fetch decodes the brotli itself
  return { status: res.status, cacheControl: res.headers.get('cache-control') ?? undefined, file: /<p>page (.+?)<\/p>/.exec(text)?.[1] };
}

describe('pre-rendered pages', () => {
  it('answers each path with its own route\'s page, fixed names before dynamic segments', async () => {
    const expected: Array<[string, string]> = [
      ['/', 'index.html'],
      ['/sign-in', 'sign-in.html'],
      ['/sign-in/', 'sign-in.html'],
      ['/jobs/new', 'jobs/new.html'],
      ['/jobs/8f1c2d', 'jobs/[id].html'],
      ['/customers', 'customers/index.html'],
      ['/customers/41', 'customers/[id].html'],
      ['/files/a/b/c', 'files/[...rest].html'],
    ];
    for (const [url, file] of expected) {
      const res = await page(url);
      expect({ url, status: res.status, file: res.file }).toEqual({ url, status: 200, file });
      expect(res.cacheControl).toBe('no-cache');
    }
  });

  it('answers a path no route has with the not-found page and a 404, malformed escapes included', async () => {
    for (const url of ['/nowhere', '/jobs/8f1c2d/extra', '/sign-in/more', '/%E0%A4%A']) {
      const res = await page(url);
      expect({ url, status: res.status, file: res.file }).toEqual({ url, status: 404, file: '+not-found.html' });
    }
  });

  it('never gives a page to a file name that starts with + or _, or to a route group\'s copies', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'matwright-routes-'));
    for (const file of ['_sitemap.html', '+not-found.html', '(shop)/jobs/new.html', 'jobs/new.html']) {
      fs.mkdirSync(path.join(dir, path.dirname(file)), { recursive: true });
      fs.writeFileSync(path.join(dir, file), '<!doctype html>');
    }
    expect(pageRoutes(dir).map((route) => route.file)).toEqual(['/jobs/new.html']);
    fs.rmSync(dir, { recursive: true, force: true });
  });
});

describe('first reads named for preloading', () => {
  const withCookie = (url: string, cookie?: string) =>
    new Promise<http.IncomingHttpHeaders>((resolve, reject) => {
      http
        .get(`${base}${url}`, { headers: cookie ? { Cookie: cookie } : {} }, (res) => {
          res.resume();
          res.on('end', () => resolve(res.headers));
        })
        .on('error', reject);
    });

  it("names who is signed in and the jobs list's first page on the list, only for a visitor with a session cookie", async () => {
    const signedIn = await withCookie('/', 'matwright_session=abc123');
    const links = String(signedIn.link ?? '').split(', ');
    expect(links[0]).toBe('</api/auth/me>; rel=preload; as=fetch; crossorigin');
    // The list's default query, written out here: every status but the finished ones, due soonest first, one page of 30.
    const open = ['taken_in', 'designing', 'awaiting_approval', 'approved', 'cutting', 'assembling', 'ready'];
    const listLink = links[1] ?? '';
    const url = new URL(/^<([^>]+)>/.exec(listLink)![1]!, 'http://x');
    expect(url.pathname).toBe('/api/jobs');
    expect(url.searchParams.get('status')!.split(',').sort()).toEqual([...open].sort());
    expect(url.searchParams.get('sort')).toBe('due');
    expect(url.searchParams.get('order')).toBe('asc');
    expect(url.searchParams.get('limit')).toBe('30');
    expect(url.searchParams.get('offset')).toBe('0');
    expect(String(signedIn.vary)).toMatch(/Cookie/);

    expect((await withCookie('/')).link).toBeUndefined();
    expect((await withCookie('/', 'other=1')).link).toBeUndefined();
  });

  it('names nothing for a path no page answers', async () => {
    // This build has index.html alone (web output "single"), so the path gets it, with no preloads.
    const missing = await withCookie('/no/such/page', 'matwright_session=abc123');
    expect(missing.link).toBeUndefined();
  });

  it('passes only paths that cannot break out of the header', () => {
    expect(preloadLinks(['/api/auth/me', '/api/jobs?status=a%2Cb&limit=30'])).toBe(
      '</api/auth/me>; rel=preload; as=fetch; crossorigin, </api/jobs?status=a%2Cb&limit=30>; rel=preload; as=fetch; crossorigin',
    );
    expect(preloadLinks(['/api/x>; rel=stylesheet', '/api/a,b', '/api/a b', 'https://elsewhere.example/x'])).toBe('');
  });
});
