// The steps after `expo export` that make the web build fast on a phone:
// the typeface as woff2 under content-hashed names (cached a year), the regular face preloaded
// from index.html with @font-face rules whose font-display is `optional`, so
// text never shifts when the font arrives (a font that misses the first paint
// is used from the next page on); then brotli and gzip copies of every text
// file (scripts/compressWeb.mjs). Plain Node, no dependencies; safe to re-run.
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { compressWebBuild } from './compressWeb.mjs';

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');
const MARK = '<!-- matwright fonts -->';

/** The faces theme.ts names (fonts.regular, .semibold, .bold) and their weights. */
const FACES = [
  { family: 'Manrope_400Regular', file: 'Manrope_400Regular.woff2', preload: true },
  { family: 'Manrope_600SemiBold', file: 'Manrope_600SemiBold.woff2', preload: false },
  { family: 'Manrope_700Bold', file: 'Manrope_700Bold.woff2', preload: false },
];

function copyHashedFonts(dir) {
  fs.mkdirSync(path.join(dir, 'fonts'), { recursive: true });
  return FACES.map(({ family, file, preload }) => {
    const bytes = fs.readFileSync(path.join(root, 'fonts', file));
    const hash = createHash('sha256').update(bytes).digest('hex').slice(0, 20);
    const name = `${path.basename(file, '.woff2')}.${hash}.woff2`;
    fs.writeFileSync(path.join(dir, 'fonts', name), bytes);
    return { family, preload, url: `/fonts/${name}` };
  });
}

function fontHead(faces) {
  // Only the face most text is set in is preloaded: each preload is ~31 KB on the same slow line
  // as the app's scripts, and a heading that misses its face falls back for this page only.
  const preload = faces.filter((f) => f.preload).map((f) => `<link rel="preload" href="${f.url}" as="font" type="font/woff2" crossorigin />`).join('\n    ');
  const rules = faces.map((f) => `@font-face { font-family: '${f.family}'; src: url('${f.url}') format('woff2'); font-display: optional; }`).join('\n      ');
  return `${MARK}\n    ${preload}\n    <style id="matwright-fonts">\n      ${rules}\n    </style>\n  `;
}

export function finishWebBuild(dir) {
  const indexFile = path.join(dir, 'index.html');
  let html = fs.readFileSync(indexFile, 'utf8');
  if (!html.includes(MARK)) {
    html = html.replace('</head>', `${fontHead(copyHashedFonts(dir))}</head>`);
    fs.writeFileSync(indexFile, html);
  }
  return compressWebBuild(dir);
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(new URL(import.meta.url).pathname)) {
  const dir = path.resolve(process.argv[2] ?? 'dist');
  const { files, raw, br } = finishWebBuild(dir);
  process.stdout.write(`web build finished in ${dir}: fonts preloaded, ${files} files compressed (${(raw / 1024).toFixed(0)} KB -> ${(br / 1024).toFixed(0)} KB brotli)\n`);
}
