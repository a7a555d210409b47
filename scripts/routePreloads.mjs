// Each screen of the web app is its own script (Expo Router's asynchronous
// routes), which the app asks for only after its main script has run: a
// second trip on a slow line before the screen can draw. This step reads,
// from the exported main script, which script holds which route file, and
// writes one copy of index.html per route that asks for the route's scripts
// (its layouts' and its own) from the start with <link rel="preload">.
// The server picks the copy whose route matches the address (server/webAssets.ts).
// Plain Node, no dependencies.
import fs from 'node:fs';
import path from 'node:path';

export const ROUTE_MANIFEST = '_expo/route-pages.json';
const PAGES_DIR = '_expo/route-pages';

/**
 * Route file -> script URL, read from the route table Metro writes into the
 * main script: `"./sign-in.tsx":{enumerable:!0,get:()=>r(d[1])(d[18],d.paths)}`
 * with the module's dependency map `{"18":795,...,"paths":{"795":"/_expo/.../sign-in-<hash>.js"}}`.
 * Returns an empty map when the table is not found (the pages then load as before).
 */
export function routeScripts(entrySource) {
  const routes = new Map();
  const first = entrySource.search(/"\.\/_layout\.tsx":\{enumerable/);
  if (first < 0) return routes;
  const tableStart = entrySource.lastIndexOf('__d(function', first);
  const depsMatch = /\},\d+,(\{"0":[^;]*?"paths":\{[^{}]*\}\})\)/.exec(entrySource.slice(first));
  if (tableStart < 0 || !depsMatch) return routes;
  const deps = JSON.parse(depsMatch[1]);
  const body = entrySource.slice(tableStart, first + depsMatch.index);
  const entry = /"(\.\/[^"]+\.[jt]sx?)":\{enumerable:!0,get:\(\)=>\w+\(\w+\[\d+\]\)\(\w+\[(\d+)\],\w+\.paths\)\}/g;
  for (const [, file, slot] of body.matchAll(entry)) {
    const url = deps.paths[String(deps[slot])];
    if (url) routes.set(file.replace(/^\.\//, ''), url);
  }
  return routes;
}

/** "(shop)/customers/[id].tsx" -> "/customers/[id]"; null for layouts and the not-found page. */
export function routePattern(file) {
  const parts = file.replace(/\.[jt]sx?$/, '').split('/');
  const name = parts[parts.length - 1];
  if (name === '_layout' || name.startsWith('+')) return null;
  const segments = parts.filter((p) => !/^\(.*\)$/.test(p)).filter((p, i, all) => !(p === 'index' && i === all.length - 1));
  return `/${segments.join('/')}`;
}

/** The layouts that wrap a route file, outermost first ("_layout.tsx", "(shop)/_layout.tsx"). */
function layoutsOf(file, routes) {
  const dirs = file.split('/').slice(0, -1);
  const layouts = [];
  for (let depth = 0; depth <= dirs.length; depth++) {
    const layout = [...dirs.slice(0, depth), '_layout.tsx'].join('/');
    if (routes.has(layout)) layouts.push(layout);
  }
  return layouts;
}

/** Writes the per-route pages and their manifest; returns how many routes got one. */
export function writeRoutePages(dir) {
  const indexHtml = fs.readFileSync(path.join(dir, 'index.html'), 'utf8');
  const main = /<script src="(\/_expo\/static\/js\/web\/index-[0-9a-f]+\.js)"/.exec(indexHtml);
  const manifest = [];
  fs.rmSync(path.join(dir, PAGES_DIR), { recursive: true, force: true });
  if (main) {
    const routes = routeScripts(fs.readFileSync(path.join(dir, main[1]), 'utf8'));
    fs.mkdirSync(path.join(dir, PAGES_DIR), { recursive: true });
    for (const [file, url] of routes) {
      const pattern = routePattern(file);
      if (!pattern) continue;
      const scripts = [...layoutsOf(file, routes).map((l) => routes.get(l)), url];
      const links = scripts.map((s) => `<link rel="preload" href="${s}" as="script" />`).join('\n    ');
      const page = `${PAGES_DIR}/${manifest.length}.html`;
      fs.writeFileSync(path.join(dir, page), indexHtml.replace('</head>', `  ${links}\n  </head>`));
      manifest.push({ pattern, page });
    }
  }
  fs.writeFileSync(path.join(dir, ROUTE_MANIFEST), JSON.stringify(manifest, null, 2));
  return manifest.length;
}
