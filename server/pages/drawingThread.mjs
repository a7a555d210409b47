// Entry of the page-drawing thread: draws a signed-in page with its data on the
// server, so a phone paints the page as soon as its HTML arrives instead of after
// the app's code and its first API reads. The drawing is Expo Router's own server
// rendering of the app (the bundle `npm run build:web` writes to dist-pages/),
// run in passes: each pass draws the page, and the reads that pass asked for and
// lacked are then read from the server's own API as the visitor (their cookie),
// until a pass asks for nothing new. The result is the route's pre-rendered page
// from the build with its markup and styles replaced by the drawing's, and the
// reads as a JSON block the browser's query cache starts with, so React adopts
// the markup as it is. Plain JavaScript: the bundle is already built code.
import fs from 'node:fs';
import { createRequire } from 'node:module';
import { promisify } from 'node:util';
import zlib from 'node:zlib';

const brotli = promisify(zlib.brotliCompress);
const gzip = promisify(zlib.gzip);

/** Passes at most: the frame, then the page, then anything the page's first answers lead to. */
export const MAX_PASSES = 4;

const FIRST_READS_ID = 'matwright-first-reads';
const STYLE_OPEN = '<style id="react-native-stylesheet">';

// The reads reuse kept-alive connections to the server, which closes one after a few idle
// seconds; a read that meets a connection closing under it is sent once more, on a new one.
// Only reads (GET) are ever sent from here, so sending one twice changes nothing.
const fetchOnce = globalThis.fetch;
globalThis.fetch = async (input, init) => {
  try {
    return await fetchOnce(input, init);
  } catch (err) {
    if ((init?.method ?? 'GET') !== 'GET') throw err;
    return fetchOnce(input, init);
  }
};

let bundle = null;
const templates = new Map();

function renderBundle(file) {
  bundle ??= createRequire(import.meta.url)(file);
  return bundle;
}

/** A JSON text safe inside a <script> element: nothing in it can close the element or open a comment. */
export function scriptSafeJson(value) {
  return JSON.stringify(value).replace(/</g, '\\u003c').replace(/>/g, '\\u003e').replace(/\u2028/g, '\\u2028').replace(/\u2029/g, '\\u2029');
}

function between(text, open, close, from = 0) {
  const start = text.indexOf(open, from);
  if (start < 0) return null;
  const end = text.indexOf(close, start + open.length);
  if (end < 0) return null;
  return { start, end: end + close.length, inner: text.slice(start + open.length, end) };
}

/**
 * The build's page for the route (`template`) with the drawing's styles and markup in
 * place of its own, and the reads as a JSON block. Null when either page lacks a part
 * (a build this code does not know): the caller then sends the page undrawn.
 */
export function spliceDrawing(template, drawn, reads, afterPaint) {
  const drawnStyle = between(drawn, STYLE_OPEN, '</style>');
  const drawnRoot = between(drawn, '<div id="root">', '</body>');
  const style = between(template, STYLE_OPEN, '</style>');
  if (!drawnStyle || !drawnRoot || !style) return null;
  const rootStart = template.indexOf('<div id="root">', style.end);
  const rootEnd = template.indexOf('<script', rootStart);
  if (rootStart < 0 || rootEnd < 0) return null;
  // The drawing's root runs to its </body>: its scripts (none) and nothing else follow it. The
  // app draws its own page beside this one before taking over (features/ui/drawnPage.ts), so
  // the drawn copy leaves out the test ids: each then names the one element the app drew.
  const root = `<div id="root">${drawnRoot.inner.trimEnd().replace(/ data-testid="[^"]*"/g, '')}`;
  const block = `<script type="application/json" id="${FIRST_READS_ID}">${scriptSafeJson(reads)}</script>`;
  // The page's scripts are fetched at once (preloaded) but run once the drawn page is on screen
  // (server/pages/afterPaint.js): run first, they would hold back its first paint.
  const scripts = [...template.slice(rootEnd).matchAll(/<script src="([^"]+)" defer><\/script>/g)].map((m) => m[1]);
  const rest = template.slice(rootEnd).replace(/<script src="[^"]+" defer><\/script>/g, '');
  if (scripts.length === 0 || /<script/.test(rest)) return null;
  const start =
    scripts.map((src) => `<link rel="preload" href="${src}" as="script"/>`).join('') +
    `<script src="${afterPaint}" defer data-scripts="${scripts.join(' ')}"></script>`;
  return (
    template.slice(0, style.start) +
    STYLE_OPEN + drawnStyle.inner + '</style>' +
    // Painted whole: a page painted while still arriving shows a row's first column alone, at
    // the row's full width, then narrows it when the next one is in (a layout shift).
    `<link rel="expect" href="#${FIRST_READS_ID}" blocking="render"/>` +
    template.slice(style.end, rootStart) +
    root +
    block +
    start +
    rest
  );
}

/**
 * One page: { bundle, template, url, apiOrigin, cookie, view, encoding, afterPaint }.
 * Answers { body, encoding } or null when the page is not to be drawn with data
 * (a read failed, or the route has no signed-in frame).
 */
export default async function drawPage(task) {
  const render = renderBundle(task.bundle);
  if (task.warm) {
    // Ahead of the first page: the bundle loaded and the framework's code run once (a page with
    // no visitor draws the frame's wait), so the first visitor waits for their page only.
    await render.getStaticContent(new URL('/', 'http://drawing.invalid'));
    return { undrawn: 'warmed up' };
  }
  let template = templates.get(task.template);
  if (template === undefined) {
    template = fs.readFileSync(task.template, 'utf8');
    templates.set(task.template, template);
  }
  const drawing = { apiOrigin: task.apiOrigin, cookie: task.cookie, view: task.view };
  globalThis.__matwrightPageDrawing = drawing;
  let html = '';
  try {
    for (let pass = 1; ; pass++) {
      html = await render.getStaticContent(new URL(task.url, 'http://drawing.invalid'));
      if (!drawing.readPending) return { undrawn: 'the route has no signed-in frame' };
      if (pass === MAX_PASSES) break;
      if ((await drawing.readPending()) === 0) break;
    }
    if (drawing.anyFailed()) return { undrawn: `a read failed: ${drawing.anyFailed()}` };
    const page = spliceDrawing(template, html, drawing.reads(), task.afterPaint);
    if (page === null) return { undrawn: 'the build page has no root or styles to replace' };
    const body = Buffer.from(page);
    if (task.encoding === 'br') {
      return { body: await brotli(body, { params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 5 } }), encoding: 'br' };
    }
    if (task.encoding === 'gzip') return { body: await gzip(body, { level: 6 }), encoding: 'gzip' };
    return { body, encoding: null };
  } finally {
    globalThis.__matwrightPageDrawing = undefined;
  }
}
