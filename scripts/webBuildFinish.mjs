// The steps after `expo export` that make the web build fast on a phone:
// the typeface as woff2 under content-hashed names (cached a year), the Latin part of each face
// preloaded from every pre-rendered page with @font-face rules whose font-display is `optional`, so
// text never shifts when the font arrives (a font that misses the first paint
// is used from the next page on); then brotli and gzip copies of every text
// file (scripts/compressWeb.mjs). Plain Node, no dependencies; safe to re-run.
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { compressWebBuild } from './compressWeb.mjs';

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');
const MARK = '<!-- matwright fonts -->';

/**
 * The faces theme.ts names (fonts.regular, .semibold, .bold), each in two files with the
 * characters they hold as a unicode-range (fonts/faces.json, written by subsetFonts.mjs):
 * the Latin part of each face is preloaded, the rest is only fetched by a page that shows it.
 */
function readFaces() {
  return JSON.parse(fs.readFileSync(path.join(root, 'fonts', 'faces.json'), 'utf8'));
}

function copyHashedFonts(dir) {
  fs.mkdirSync(path.join(dir, 'fonts'), { recursive: true });
  return readFaces().map(({ family, file, preload, unicodeRange }) => {
    const bytes = fs.readFileSync(path.join(root, 'fonts', file));
    const hash = createHash('sha256').update(bytes).digest('hex').slice(0, 20);
    const name = `${path.basename(file, '.woff2')}.${hash}.woff2`;
    fs.writeFileSync(path.join(dir, 'fonts', name), bytes);
    return { family, preload, unicodeRange, url: `/fonts/${name}` };
  });
}

function fontHead(faces) {
  // The Latin part of all three faces is preloaded (~14 KB each; the whole faces were ~31 KB).
  // Not preloaded, the semibold and bold faces were only asked for at the first layout, and with
  // font-display optional the browser held the pre-rendered page's first paint up to 100 ms for
  // them, often until after the scripts were requested: Lighthouse's largest paint on sign-in
  // then swung between 1.4 and 2.7 s (1.5 s with the preloads, 1.1 s with the Latin parts alone).
  const preload = faces.filter((f) => f.preload).map((f) => `<link rel="preload" href="${f.url}" as="font" type="font/woff2" crossorigin />`).join('\n    ');
  const rules = faces
    .map((f) => `@font-face { font-family: '${f.family}'; src: url('${f.url}') format('woff2'); font-display: optional; unicode-range: ${f.unicodeRange}; }`)
    .join('\n      ');
  return `${MARK}\n    ${preload}\n    <style id="matwright-fonts">\n      ${rules}\n    </style>\n  `;
}

/** Every page of the export: with web output "static" each route is its own pre-rendered HTML file. */
function* htmlFiles(dir) {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) yield* htmlFiles(full);
    else if (entry.name.endsWith('.html')) yield full;
  }
}

/**
 * Expo marks a pre-rendered page with one inline script (setting the flag that makes React
 * hydrate); index.ts sets that flag from the page instead, so the Content-Security-Policy can
 * refuse every inline script. Any other inline script would be refused by that policy in the
 * browser, so the build stops on one rather than ship a page that breaks.
 */
const HYDRATE_MARK = /<script type="module">globalThis\.__EXPO_ROUTER_HYDRATE__=true;<\/script>/g;

function finishPage(file, head) {
  let html = fs.readFileSync(file, 'utf8');
  html = html.replace(HYDRATE_MARK, '');
  const inline = html.match(/<script(?![^>]*\bsrc=)[^>]*>[^<]/);
  if (inline) throw new Error(`${file} has an inline script the Content-Security-Policy refuses: ${inline[0]}`);
  if (!html.includes(MARK)) html = html.replace('</head>', `${head}</head>`);
  fs.writeFileSync(file, html);
}

/**
 * Pages the server never sends: the copies Expo writes under route groups' folder names
 * ("(shop)/jobs/new.html" beside "jobs/new.html") and the development sitemap.
 */
function dropUnservedPages(dir) {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    if (entry.isDirectory() && /^\(.+\)$/.test(entry.name)) fs.rmSync(path.join(dir, entry.name), { recursive: true });
  }
  fs.rmSync(path.join(dir, '_sitemap.html'), { force: true });
}

/**
 * The modules a Metro chunk defines, each with the modules it requires (by id) and those it
 * only loads later (its dependency map's "paths": other chunks, fetched when needed). Metro
 * writes each as `__d(function(g,r,i,a,m,e,d){...},<id>,<dependency map>);` on a line of its own.
 */
export function modulesOf(code) {
  const modules = new Map();
  const ending = /\},(\d+),(\[[\d,]*\]|\{(?:[^{}\n]|\{[^{}\n]*\})*\})\);?(?=\n|$)/g;
  for (const m of code.matchAll(ending)) {
    const map = JSON.parse(m[2]);
    const later = new Set(Array.isArray(map) ? [] : Object.keys(map.paths ?? {}).map(Number));
    const all = Array.isArray(map) ? map : Object.entries(map).filter(([k]) => k !== 'paths').map(([, v]) => v);
    modules.set(Number(m[1]), { requires: all.filter((id) => !later.has(id)), later: [...later] });
  }
  return modules;
}

/**
 * Expo puts every module two screens share into one `__common` script and has every page load it.
 * A page whose own scripts define everything they require (the pages before sign-in, whose
 * screens draw with what the entry script holds) does not need it: the script tag is taken out
 * and its address left in <meta name="matwright-shared-code">, with the scripts that can do
 * without it listed in its data-not-needed-by; the app fetches the shared script along with any
 * other screen's script (features/ui/sharedCode.ts). Pages that keep it also preload the
 * signed-in frame's script, which their layout asks for as soon as it runs.
 * Returns the pages that went without.
 */
function leaveOutUnneededSharedCode(dir) {
  const jsDir = path.join(dir, '_expo', 'static', 'js', 'web');
  if (!fs.existsSync(jsDir)) return [];
  const names = fs.readdirSync(jsDir).filter((name) => name.endsWith('.js'));
  const common = names.find((name) => /^__common-[0-9a-f]+\.js$/.test(name));
  if (!common) return [];
  const url = (name) => `/_expo/static/js/web/${name}`;
  const modules = new Map(names.map((name) => [url(name), modulesOf(fs.readFileSync(path.join(jsDir, name), 'utf8'))]));
  const shared = modules.get(url(common));
  if (shared.size === 0) throw new Error(`${common} defines no module this build step can read; Metro's output format changed`);
  const needsShared = (chunk) => [...modules.get(chunk).values()].some((m) => m.requires.some((id) => shared.has(id)));
  const selfSufficient = [...modules.keys()].filter((chunk) => chunk !== url(common) && !needsShared(chunk));
  const frame = names.find((name) => /^ShopFrameInSteps-[0-9a-f]+\.js$/.test(name));
  const without = [];
  for (const file of htmlFiles(dir)) {
    let html = fs.readFileSync(file, 'utf8');
    const tag = `<script src="${url(common)}" defer></script>`;
    if (!html.includes(tag)) continue;
    const own = [...html.matchAll(/<script src="([^"]+)" defer><\/script>/g)].map((m) => m[1]).filter((src) => src !== url(common));
    if (own.some((src) => !modules.has(src))) throw new Error(`${file} loads a script the build does not have`);
    if (own.every((src) => selfSufficient.includes(src))) {
      const meta = `<meta name="matwright-shared-code" content="${url(common)}" data-not-needed-by="${selfSufficient.join(' ')}"/>`;
      html = html.replace(tag, '').replace('</head>', `${meta}</head>`);
      without.push(path.relative(dir, file));
    } else if (frame) {
      html = html.replace('</head>', `<link rel="preload" href="${url(frame)}" as="script"/></head>`);
    }
    fs.writeFileSync(file, html);
  }
  return without;
}

/**
 * V8's explicit compile hint (Chrome 136+, a comment on a script's first line): every function in
 * the script is compiled as the script streams in, on a background thread, instead of on the main
 * thread the first time it is called. Metro wraps each module in a function called once when first
 * required, so without the hint each module's compile lands on the main thread at start-up; with it,
 * On a 4x slowed CPU, loading the jobs list's modules went from about 700 to 300 ms and React's
 * first render from about 450 to 250 ms; Lighthouse's blocking time on sign-in from 140-160 to
 * 60-85 ms. Every script gets it: each is fetched when its screen opens and runs most of its code
 * then. Browsers without the hint read a comment. Source maps get one empty line in front to match.
 */
export const COMPILE_HINT = '//# allFunctionsCalledOnLoad';

function hintEagerCompile(dir) {
  const jsDir = path.join(dir, '_expo', 'static', 'js', 'web');
  if (!fs.existsSync(jsDir)) return [];
  const hinted = [];
  for (const name of fs.readdirSync(jsDir).filter((n) => n.endsWith('.js'))) {
    const file = path.join(jsDir, name);
    const code = fs.readFileSync(file, 'utf8');
    if (code.startsWith(COMPILE_HINT)) continue;
    fs.writeFileSync(file, `${COMPILE_HINT}\n${code}`);
    const mapFile = `${file}.map`;
    if (fs.existsSync(mapFile)) {
      const map = JSON.parse(fs.readFileSync(mapFile, 'utf8'));
      map.mappings = `;${map.mappings}`;
      fs.writeFileSync(mapFile, JSON.stringify(map));
    }
    hinted.push(name);
  }
  return hinted;
}

export function finishWebBuild(dir) {
  dropUnservedPages(dir);
  const head = fontHead(copyHashedFonts(dir));
  for (const file of htmlFiles(dir)) finishPage(file, head);
  const withoutSharedCode = leaveOutUnneededSharedCode(dir);
  const eagerlyCompiled = hintEagerCompile(dir);
  return { ...compressWebBuild(dir), withoutSharedCode, eagerlyCompiled };
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(new URL(import.meta.url).pathname)) {
  const dir = path.resolve(process.argv[2] ?? 'dist');
  const { files, raw, br, withoutSharedCode } = finishWebBuild(dir);
  process.stdout.write(`web build finished in ${dir}: fonts preloaded, ${files} files compressed (${(raw / 1024).toFixed(0)} KB -> ${(br / 1024).toFixed(0)} KB brotli); pages without the shared script: ${withoutSharedCode.join(', ') || 'none'}\n`);
}
