import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import zlib from 'node:zlib';
import { Router } from 'express';

const here = path.dirname(fileURLToPath(import.meta.url));
const ASSET_DIR = path.join(here, 'assets');
const FONT_DIR = path.resolve(here, '../../fonts');
/** A font file as fonts/faces.json lists it (scripts/subsetFonts.mjs writes it). */
interface FontFile {
  family: string;
  file: string;
  preload: boolean;
  unicodeRange: string;
}

/** The faces the page uses, by the weight its stylesheet asks for. */
const PAGE_WEIGHTS: Record<string, number> = { Manrope_400Regular: 400, Manrope_700Bold: 700 };
const FONT_RULES = /\/\* @font-face rules for Manrope[^*]*\*\//;

/** Hashed names never change their bytes: a year, immutable. */
const CACHE_FOREVER = 'public, max-age=31536000, immutable';

interface Asset {
  url: string;
  type: string;
  bytes: Buffer;
  /** Compressed copies made once at start-up, for text files. */
  br?: Buffer;
  gzip?: Buffer;
}

/** The addresses the page links to, by what they are. */
export interface ProofPageAssets {
  css: string;
  script: string;
  /** The Latin part of the regular face, preloaded by the page. */
  font: string;
  router: Router;
}

function hashed(name: string, bytes: Buffer, type: string): Asset {
  const hash = createHash('sha256').update(bytes).digest('hex').slice(0, 16);
  const ext = path.extname(name);
  const text = type.startsWith('text/');
  return {
    url: `/proof-assets/${path.basename(name, ext)}.${hash}${ext}`,
    type,
    bytes,
    ...(text ? { br: zlib.brotliCompressSync(bytes), gzip: zlib.gzipSync(bytes, { level: 9 }) } : {}),
  };
}

/**
 * The page's stylesheet, zoom script and typeface under content-hashed names,
 * read once at start-up (a few tens of KB) and served from memory.
 */
export function proofPageAssets(): ProofPageAssets {
  const faces: FontFile[] = JSON.parse(fs.readFileSync(path.join(FONT_DIR, 'faces.json'), 'utf8'));
  const fonts = faces
    .filter((f) => f.family in PAGE_WEIGHTS)
    .map((f) => ({ ...f, asset: hashed(f.file, fs.readFileSync(path.join(FONT_DIR, f.file)), 'font/woff2') }));
  const rules = fonts.map(
    (f) => `@font-face { font-family: 'Manrope'; src: url('${f.asset.url}') format('woff2'); font-weight: ${PAGE_WEIGHTS[f.family]}; font-display: swap; unicode-range: ${f.unicodeRange}; }`,
  );
  const css = fs.readFileSync(path.join(ASSET_DIR, 'proofPage.css'), 'utf8').replace(FONT_RULES, (comment) => `${comment}\n${rules.join('\n')}`);
  const style = hashed('proofPage.css', Buffer.from(css, 'utf8'), 'text/css; charset=utf-8');
  const script = hashed('proofZoom.js', fs.readFileSync(path.join(ASSET_DIR, 'proofZoom.js')), 'text/javascript; charset=utf-8');
  const byUrl = new Map([style, script, ...fonts.map((f) => f.asset)].map((a) => [a.url, a]));
  const router = Router();
  router.get('/proof-assets/:name', (req, res, next) => {
    const asset = byUrl.get(req.path);
    if (!asset) return next();
    res.set({ 'Content-Type': asset.type, 'Cache-Control': CACHE_FOREVER, 'X-Content-Type-Options': 'nosniff', Vary: 'Accept-Encoding' });
    const encoding = asset.br ? req.acceptsEncodings('br', 'gzip') : false;
    if (encoding === 'br' || encoding === 'gzip') res.setHeader('Content-Encoding', encoding);
    res.end(encoding === 'br' ? asset.br : encoding === 'gzip' ? asset.gzip : asset.bytes);
  });
  const regular = fonts.find((f) => f.family === 'Manrope_400Regular' && f.preload);
  if (!regular) throw new Error('fonts/faces.json has no preloaded regular face');
  return { css: style.url, script: script.url, font: regular.asset.url, router };
}
