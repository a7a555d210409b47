import type { Request, RequestHandler, Response } from 'express';
import express from 'express';
import fs from 'node:fs';
import path from 'node:path';

/**
 * The exported web build, served the way a phone on a slow line needs it:
 * brotli or gzip copies made at build time (scripts/compressWeb.mjs) chosen
 * by the browser's Accept-Encoding, files whose names carry a content hash
 * cached for a year as immutable, and everything else (index.html above all)
 * revalidated on every visit so a new release is picked up at once.
 */

/** A content hash in a file name, as Metro and Expo's asset export write them (entry-3f2a...e1.js, font.8c1d...b.ttf). */
const HASHED_NAME = /[.-][0-9a-f]{16,}\.[a-z0-9]+$/i;
export const IMMUTABLE = 'public, max-age=31536000, immutable';
export const REVALIDATE = 'no-cache';

export function cacheControlFor(file: string): string {
  return HASHED_NAME.test(path.basename(file)) ? IMMUTABLE : REVALIDATE;
}

type Encoding = 'br' | 'gzip';
const SUFFIX: Record<Encoding, string> = { br: '.br', gzip: '.gz' };

/** URL paths of the build that have pre-compressed copies, with the encodings on disk. */
function compressedCopies(webDir: string): Map<string, Set<Encoding>> {
  const copies = new Map<string, Set<Encoding>>();
  const visit = (dir: string) => {
    for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) visit(full);
      for (const encoding of ['br', 'gzip'] as const) {
        if (!entry.isFile() || !entry.name.endsWith(SUFFIX[encoding])) continue;
        const original = full.slice(0, -SUFFIX[encoding].length);
        if (!fs.existsSync(original)) continue;
        const urlPath = `/${path.relative(webDir, original).split(path.sep).join('/')}`;
        copies.set(urlPath, (copies.get(urlPath) ?? new Set()).add(encoding));
      }
    }
  };
  visit(webDir);
  return copies;
}

/**
 * Brotli whenever the browser takes it (it is the smaller), else gzip. Browsers list
 * "gzip, deflate, br" with equal weight, so the server's preference must decide, not their order.
 */
function smallestAccepted(req: Request, available: ReadonlySet<Encoding>): Encoding | null {
  for (const encoding of ['br', 'gzip'] as const) {
    if (available.has(encoding) && req.acceptsEncodings(encoding) === encoding) return encoding;
  }
  return null;
}

/** A pre-rendered page of the export and the URL paths it answers. */
interface PageRoute {
  /** The page's file, as a URL path of the build ("/jobs/[id].html"). */
  readonly file: string;
  readonly pattern: RegExp;
  /** Per segment: 0 a fixed name, 1 one dynamic segment, 2 the rest of the path; a lower list wins. */
  readonly rank: readonly number[];
}

const escapeRegExp = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/**
 * The export's pages as routes, in Expo Router's order of precedence: with web output
 * "static" each route is an HTML file named like its route file ("jobs/[id].html",
 * "customers/index.html"), so "/jobs/new" finds jobs/new.html before jobs/[id].html.
 * Files named with + or _ (the not-found page, a sitemap) answer no path of their own.
 */
export function pageRoutes(webDir: string): PageRoute[] {
  const routes: PageRoute[] = [];
  const visit = (dir: string, segments: readonly string[]) => {
    for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
      if (entry.isDirectory()) {
        if (!/^\(.+\)$/.test(entry.name) && entry.name !== '_expo') visit(path.join(dir, entry.name), [...segments, entry.name]);
        continue;
      }
      if (!entry.isFile() || !entry.name.endsWith('.html') || /^[+_]/.test(entry.name)) continue;
      const name = entry.name.slice(0, -'.html'.length);
      const parts = name === 'index' ? segments : [...segments, name];
      const rank = parts.map((part) => (/^\[\.\.\..+\]$/.test(part) ? 2 : /^\[.+\]$/.test(part) ? 1 : 0));
      const source = parts.map((part, i) => (rank[i] === 2 ? '/.+' : rank[i] === 1 ? '/[^/]+' : `/${escapeRegExp(part)}`)).join('');
      routes.push({ file: `/${[...segments, entry.name].join('/')}`, pattern: new RegExp(`^${source}/?$`), rank });
    }
  };
  visit(webDir, []);
  const compare = (a: readonly number[], b: readonly number[]): number => {
    for (let i = 0; i < Math.min(a.length, b.length); i++) if (a[i] !== b[i]) return a[i]! - b[i]!;
    return b.length - a.length;
  };
  return routes.sort((a, b) => compare(a.rank, b.rank));
}

export interface WebBuild {
  /** Serves a file of the build, compressed when the browser accepts it; passes on when the path is not in the build. */
  readonly assets: RequestHandler;
  /**
   * Sends the pre-rendered page of the route the path names (compressed when accepted, never
   * cached without asking again); a path no route answers gets the not-found page with a 404.
   * A build with only index.html (web output "single") answers every path with it.
   */
  sendPage(req: Request, res: Response): Promise<void>;
}

/** A page drawn for its visitor with their data (server/pages/pageDrawer.ts), compressed as they accept. */
export interface DrawnPage {
  readonly body: Buffer;
  readonly encoding: Encoding | null;
}

export interface WebBuildOptions {
  /**
   * Same-origin fetches a page's code will start with, named in a `Link: rel=preload`
   * header of its response so they load beside the code; asked only for a path a page answers.
   */
  readonly preloadsFor?: (req: Request) => readonly string[];
  /**
   * The page drawn for this visitor with their data, or null to send the build's page
   * (not signed in, a route drawn in the browser only, the drawing thread busy or too slow).
   * `file` is the route's page in the build; `encoding` the smallest the browser accepts.
   */
  readonly drawPage?: (req: Request, file: string, encoding: Encoding | null) => Promise<DrawnPage | null>;
}

/** Characters a preloaded path may hold: an already-encoded same-origin path and query, nothing that could end the header's <...>. */
const LINKABLE_PATH = /^\/[A-Za-z0-9\-._~%!$&'()*+;=:@/?]*$/;

/**
 * A `Link` header value preloading fetches; `crossorigin` makes the preload's credentials mode
 * match a same-origin fetch(). The paths go in exactly as the page's code will ask for them
 * (already encoded), or the browser would not match the two.
 */
export function preloadLinks(paths: readonly string[]): string {
  return paths
    .filter((p) => LINKABLE_PATH.test(p))
    .map((p) => `<${p}>; rel=preload; as=fetch; crossorigin`)
    .join(', ');
}

export function webBuild(webDir: string, options: WebBuildOptions = {}): WebBuild {
  const root = path.resolve(webDir);
  const copies = compressedCopies(root);
  const routes = pageRoutes(root);
  const notFound = fs.existsSync(path.join(root, '+not-found.html')) ? '/+not-found.html' : null;
  const plain = express.static(root, {
    index: false,
    setHeaders: (res, file) => res.setHeader('Cache-Control', cacheControlFor(file)),
  });

  const sendVariant = (req: Request, res: Response, urlPath: string): boolean => {
    const available = copies.get(urlPath);
    if (!available) return false;
    res.vary('Accept-Encoding');
    const chosen = smallestAccepted(req, available);
    if (!chosen) return false;
    const original = path.join(root, urlPath);
    res.type(path.extname(original)); // the type of the file itself, not of its .br or .gz copy
    res.setHeader('Content-Encoding', chosen);
    // A response that already set its own rule keeps it.
    const cacheControl = String(res.getHeader('Cache-Control') ?? cacheControlFor(original));
    res.sendFile(`${original}${SUFFIX[chosen]}`, { cacheControl: false, headers: { 'Cache-Control': cacheControl } });
    return true;
  };

  return {
    assets(req, res, next) {
      if (req.method !== 'GET' && req.method !== 'HEAD') return next();
      let urlPath: string;
      try {
        urlPath = decodeURIComponent(req.path);
      } catch {
        return next();
      }
      if (sendVariant(req, res, urlPath)) return;
      plain(req, res, next);
    },
    async sendPage(req, res) {
      let urlPath = req.path;
      try {
        urlPath = decodeURIComponent(req.path);
      } catch {
        // A malformed escape names no route: the not-found page says so.
      }
      const page = routes.find((route) => route.pattern.test(urlPath));
      let file = page?.file;
      if (!file) {
        file = notFound ?? '/index.html';
        if (notFound) res.status(404);
      } else if (options.drawPage || options.preloadsFor) {
        // What is drawn and preloaded depends on the visitor (signed in or not).
        res.vary('Cookie');
        res.vary('Accept-Encoding');
        const drawn = await options.drawPage?.(req, path.join(root, file), smallestAccepted(req, new Set(['br', 'gzip'])));
        if (drawn) {
          res.type('html');
          // The visitor's own data: never kept by a shared cache, asked for again on every visit.
          res.setHeader('Cache-Control', 'private, no-cache');
          if (drawn.encoding) res.setHeader('Content-Encoding', drawn.encoding);
          res.send(drawn.body);
          return;
        }
        const links = preloadLinks(options.preloadsFor?.(req) ?? []);
        if (links) res.setHeader('Link', links);
      }
      if (!res.getHeader('Cache-Control')) res.setHeader('Cache-Control', REVALIDATE);
      if (sendVariant(req, res, file)) return;
      res.sendFile(path.join(root, file), { cacheControl: false });
    },
  };
}
