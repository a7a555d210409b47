/**
 * How the web app loads on a phone, measured with Lighthouse (mobile
 * settings: a mid-range phone's screen, a slow 4G line and a slowed CPU,
 * simulated) in Debian's Chromium: the sign-in page, the jobs list, the
 * designer of the demo layout and its job's page (signed in through a Cookie
 * header carrying the session and the view cookie the signed-in area writes on
 * Lighthouse's phone, so the server draws the pages it draws with data for a
 * returning visitor; BENCH_WEB_UNDRAWN=1 leaves the view cookie out, and the
 * browser draws them itself) and the customer's proof page (a proof of the demo layout sent through the API in
 * the set-up, opened through its link).
 *
 *   npm run bench:web      (builds the web app first when its sources changed)
 *
 * Prints performance and accessibility scores, largest contentful paint,
 * total blocking time, layout shift and the JavaScript each page loads
 * (bytes on the wire, and unpacked). Targets: performance 90+, LCP under
 * 2.5 s, TBT under 200 ms, under 250 KB of JavaScript on the wire before
 * sign-in. Asserts nothing.
 *
 * Every page is requested once before Lighthouse opens any, so the server has
 * drawn that kind of page before, as a server that has been up a while has.
 * Each page is measured BENCH_WEB_RUNS times (3 unless set), each run in a
 * browser of its own; each figure printed is the median over the runs, with
 * the blocked time of every run beside it: on this two-core machine one
 * run's blocked time can be three times the next one's.
 *
 * BENCH_WEB_REPORTS=/some/folder also writes each page's full Lighthouse
 * report there as JSON (main-thread breakdown, long tasks, script boot-up).
 */
import * as chromeLauncher from 'chrome-launcher';
import fs from 'node:fs';
import path from 'node:path';
import lighthouse from 'lighthouse';
import { VIEW_COOKIE, viewCookieValue } from '../features/api/viewCookie';
import { api, signIn, startBenchServer } from './benchServer';
// @ts-expect-error plain Node module without types
import { ensureWebBuild } from './bootstrap.mjs';

const port = Number(process.env.PORT) || 8295;
/** Lighthouse runs per page (BENCH_WEB_RUNS); the median run is printed. */
const RUNS = Math.max(1, Math.min(9, Number(process.env.BENCH_WEB_RUNS) || 3));
const CHROME_FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

interface PageToMeasure {
  readonly label: string;
  readonly url: string;
  readonly cookie?: string;
}

/** The view cookie the signed-in area writes in Lighthouse's emulated phone (412 x 823, Chromium's default locale and this machine's zone). */
const phoneView = `${VIEW_COOKIE}=${viewCookieValue({ width: 412, height: 823, locale: 'en-US', timeZone: new Intl.DateTimeFormat().resolvedOptions().timeZone })}`;

async function demoPages(base: string): Promise<PageToMeasure[]> {
  const session = await signIn(base);
  const cookie = process.env.BENCH_WEB_UNDRAWN === '1' ? session : `${session}; ${phoneView}`;
  const { jobs } = await api(base, session, 'GET', '/jobs?limit=100');
  for (const job of jobs) {
    const { layouts } = await api(base, session, 'GET', `/jobs/${job.id}/layouts`);
    if (layouts.length === 0) continue;
    const layout = layouts[0];
    const sent = await api(base, session, 'POST', `/jobs/${job.id}/proofs`, { layoutId: layout.id, baseRevision: layout.draftRevision, message: 'Here is the layout we talked about.' });
    return [
      { label: 'sign-in', url: `${base}/sign-in` },
      { label: 'jobs list', url: `${base}/`, cookie },
      { label: 'designer (demo layout)', url: `${base}/layouts/${layout.id}`, cookie },
      { label: 'job page (demo job)', url: `${base}/jobs/${job.id}`, cookie },
      { label: 'customer\'s proof page', url: sent.link.replace(/^https?:\/\/[^/]+/, base) },
    ];
  }
  throw new Error('the demo shop has no job with a layout');
}

function scriptBytes(lhr: any): { wire: number; unpacked: number; files: number } {
  const items: any[] = lhr.audits['network-requests']?.details?.items ?? [];
  const scripts = items.filter((i) => i.resourceType === 'Script');
  return {
    wire: scripts.reduce((sum, i) => sum + (i.transferSize ?? 0), 0),
    unpacked: scripts.reduce((sum, i) => sum + (i.resourceSize ?? 0), 0),
    files: scripts.length,
  };
}

/**
 * Every page once before any is measured, as a server that has been up a while has: a signed-in
 * page's first drawing on a fresh server runs its screen's code for the first time (~0.4 s), and
 * the drawing thread warms up as the server starts. On this machine the server and the browser
 * share two cores, so that work, left to run while the first page loads, counts as the browser's
 * blocked time.
 */
async function warmUp(pages: PageToMeasure[]) {
  for (const page of pages) {
    await fetch(page.url, { headers: page.cookie ? { Cookie: page.cookie } : {} }).then((r) => r.arrayBuffer());
  }
  // Then idle a moment, as such a server is between visitors (its collector and compression done).
  await new Promise((resolve) => setTimeout(resolve, 2000));
}

/** One Lighthouse run of a page in a browser of its own; a run whose trace broke is run again (twice at most). */
async function lighthouseRun(page: PageToMeasure): Promise<any> {
  for (let attempt = 1; ; attempt++) {
    // A browser of its own per run: a cookie one page's script writes (the view cookie) would
    // otherwise be sent in place of the Cookie header that signs the next page in.
    const chrome = await chromeLauncher.launch({ chromePath: '/usr/bin/chromium', chromeFlags: CHROME_FLAGS });
    try {
      const result = await lighthouse(page.url, {
        port: chrome.port,
        output: 'json',
        logLevel: 'error',
        onlyCategories: ['performance', 'accessibility'],
        extraHeaders: page.cookie ? { Cookie: page.cookie } : undefined,
      });
      if (!result) throw new Error(`lighthouse gave no result for ${page.label}`);
      const lhr = result.lhr as any;
      if (!lhr.runtimeError || attempt === 3) return lhr;
      console.log(`  ${page.label}: run again (${lhr.runtimeError.code})`);
    } finally {
      await chrome.kill();
    }
  }
}

async function measure(page: PageToMeasure) {
  const lhrs: any[] = [];
  for (let run = 0; run < RUNS; run++) lhrs.push(await lighthouseRun(page));
  // Each figure is the median of the runs (Lighthouse's guidance on variability suggests several
  // runs); blocked time swings most, so every run's is printed beside it, in the order run.
  const median = (pick: (l: any) => number) => {
    const values = lhrs.map(pick).filter((v) => Number.isFinite(v)).sort((a, b) => a - b);
    return values.length === 0 ? NaN : values[Math.floor((values.length - 1) / 2)]!;
  };
  const lhr = lhrs.find((l) => !l.runtimeError) ?? lhrs[0];
  const js = scriptBytes(lhr);
  const score = (c: string) => Math.round(median((l) => l.categories[c]?.score ?? NaN) * 100);
  const value = (a: string) => median((l) => l.audits[a]?.numericValue ?? NaN);
  const runs = RUNS > 1 ? ` (${lhrs.map((l) => (l.audits['total-blocking-time']?.numericValue ?? NaN).toFixed(0)).join(', ')})` : '';
  console.log(
    `${page.label.padEnd(24)} performance ${String(score('performance')).padStart(3)}  accessibility ${String(score('accessibility')).padStart(3)}  ` +
      `LCP ${(value('largest-contentful-paint') / 1000).toFixed(2)} s  TBT ${value('total-blocking-time').toFixed(0)} ms${runs}  CLS ${value('cumulative-layout-shift').toFixed(3)}  ` +
      `JS ${(js.wire / 1024).toFixed(0)} KB on the wire (${(js.unpacked / 1024).toFixed(0)} KB unpacked, ${js.files} files)`,
  );
  if (lhr.runtimeError) console.log(`  lighthouse: ${lhr.runtimeError.message}`);
  const reports = process.env.BENCH_WEB_REPORTS;
  if (reports) {
    fs.mkdirSync(reports, { recursive: true });
    fs.writeFileSync(path.join(reports, `${page.label.replace(/[^a-z0-9]+/gi, '-').replace(/-+$/, '')}.json`), JSON.stringify(lhr));
  }
}

async function main() {
  if (!process.env.BENCH_SERVER_ROOT) ensureWebBuild();
  const server = await startBenchServer(port);
  try {
    const pages = await demoPages(server.base);
    await warmUp(pages);
    console.log(`Lighthouse 12 (mobile, simulated slow 4G and 4x slower CPU), Debian Chromium; each figure the median of ${RUNS} runs a page, the blocked time of each run in brackets`);
    for (const page of pages) await measure(page);
  } finally {
    await server.stop();
  }
}

await main();
