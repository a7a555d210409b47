import fs from 'node:fs';
import path from 'node:path';
import type { Request, Response } from 'express';
import { createHash } from 'node:crypto';
import { Piscina } from 'piscina';
import { VIEW_COOKIE, parseViewCookie } from '../../features/api/viewCookie';
import type { Logger } from 'pino';
import { IMMUTABLE, type DrawnPage } from '../webAssets';

/**
 * Signed-in pages drawn on the server with the visitor's data, on a thread of
 * their own (server/pages/drawingThread.mjs), so a phone paints the jobs list
 * or a job as soon as the HTML is in rather than after ~270 KB of code and its
 * first API reads. Drawing is an improvement, never a requirement: a page the
 * thread cannot draw in time, or at all, is sent as the build's page, which the
 * browser draws itself as before.
 */

/** Routes drawn with data, by their page in the build; the job page only for a job id. */
const DRAWN: ReadonlyArray<{ file: string; path: RegExp }> = [
  { file: '/index.html', path: /^\/?$/ },
  { file: '/jobs/[id].html', path: /^\/jobs\/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}\/?$/i },
  { file: '/layouts/[id].html', path: /^\/layouts\/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}\/?$/i },
];

/** Longest the drawing thread may take to load its bundle as the server starts. */
const WARM_UP_LIMIT_MS = 10_000;

export interface PageDrawerOptions {
  /** The exported web build (dist/). */
  readonly webDir: string;
  /** The drawing bundle (dist-pages/render.cjs); without it nothing is drawn. */
  readonly bundle: string;
  /** Where the thread reaches this server's API ("http://127.0.0.1:8080"); never taken from a request. */
  readonly apiOrigin: string;
  /** How long a page may take before the build's page is sent instead (default 1500 ms). */
  readonly budgetMs?: number;
  /** Pages waiting for the thread before more are sent undrawn (default 8). */
  readonly maxQueue?: number;
  /** Where a page sent undrawn is noted, with why. */
  readonly logger?: Pick<Logger, 'warn' | 'info'>;
}

export interface PageDrawer {
  /** Where the script that starts a drawn page's scripts after its first paint is served (named by its content). */
  readonly afterPaintPath: string;
  /** Sends that script (server/pages/afterPaint.js), cached a year: its name changes with it. */
  sendAfterPaint(res: Response): void;
  /** The page drawn for a signed-in visitor (the caller checks the session cookie; every read checks the session). */
  draw(req: Request, file: string, encoding: 'br' | 'gzip' | null): Promise<DrawnPage | null>;
  close(): Promise<void>;
}

function cookieValue(header: string | undefined, name: string): string | undefined {
  for (const part of (header ?? '').split(';')) {
    const at = part.indexOf('=');
    if (at > 0 && part.slice(0, at).trim() === name) return part.slice(at + 1).trim();
  }
  return undefined;
}

export function createPageDrawer(options: PageDrawerOptions): PageDrawer | null {
  if (!fs.existsSync(options.bundle)) return null;
  const webDir = path.resolve(options.webDir);
  const bundle = path.resolve(options.bundle);
  const afterPaint = fs.readFileSync(new URL('./afterPaint.js', import.meta.url));
  const afterPaintPath = `/after-paint-${createHash('sha256').update(afterPaint).digest('hex').slice(0, 20)}.js`;
  const budgetMs = options.budgetMs ?? 1500;
  const pool = new Piscina({
    filename: new URL('./drawingThread.mjs', import.meta.url).href,
    minThreads: 1,
    maxThreads: 1,
    maxQueue: options.maxQueue ?? 8,
    idleTimeout: Infinity,
    resourceLimits: { maxOldGenerationSizeMb: 256 },
  });
  pool.on('error', () => undefined);
  let closed = false;
  // The thread loads the bundle now (a few hundred ms), before a page's budget starts counting.
  // Pages wait for it, so it has a limit of its own: a warm-up stopped there leaves the thread to
  // load the bundle with the first page (likely past that page's budget: it goes out undrawn).
  const loaded = pool.run({ bundle, warm: true }, { signal: AbortSignal.timeout(WARM_UP_LIMIT_MS) }).then(
    () => undefined,
    (err: unknown) => options.logger?.warn({ err }, 'the page-drawing thread did not warm up'),
  );

  return {
    afterPaintPath,
    sendAfterPaint(res) {
      res.type('js').setHeader('Cache-Control', IMMUTABLE);
      res.send(afterPaint);
    },
    async draw(req, file, encoding) {
      const route = DRAWN.find((d) => path.join(webDir, d.file) === file);
      if (closed || !route || !route.path.test(req.path)) return null;
      const view = parseViewCookie(cookieValue(req.headers.cookie, VIEW_COOKIE));
      if (!view) return null;
      await loaded;
      try {
        const drawn = (await pool.run(
          { bundle, template: file, url: req.originalUrl, apiOrigin: options.apiOrigin, cookie: req.headers.cookie ?? '', view, encoding, afterPaint: afterPaintPath },
          { signal: AbortSignal.timeout(budgetMs) },
        )) as { body: Uint8Array; encoding: 'br' | 'gzip' | null } | { undrawn: string };
        if ('undrawn' in drawn) {
          options.logger?.info({ path: req.path, reason: drawn.undrawn }, 'a page was sent undrawn');
          return null;
        }
        return { body: Buffer.from(drawn.body), encoding: drawn.encoding };
      } catch (err) {
        // Busy, too slow or failed: the browser draws the page itself, as without a drawing thread.
        options.logger?.warn({ err, path: req.path }, 'a page was sent undrawn');
        return null;
      }
    },
    async close() {
      closed = true;
      await pool.destroy();
    },
  };
}
