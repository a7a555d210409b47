/**
 * The API under load, on this machine: a server of its own on a fresh
 * database (the demo shop, then 10 000 jobs and 2 000 customers of invented
 * data, and the benchmark shadowbox with its 2 000-point garment), then
 * autocannon, 50 connections for 20 s each, against the jobs list, one job,
 * a layout read, a draft save of the benchmark layout and a DXF export of its
 * frozen version. Beside each, /api/health is asked every 25 ms by another
 * client to see whether the event loop keeps answering under that load.
 * Then the lists at that size, one request at a time: the jobs list by due
 * date, a text search, and the customers list.
 *
 *   npm run bench:api          (DURATION=5 CONNECTIONS=10 for a quick look)
 *
 * While iterating on one part: BENCH_ONLY=draft,export runs only the load
 * scenarios whose keys are listed (jobs, job, read, draft, draft-whole, export, lists) and
 * BENCH_LARGE_SEED=0 skips the 10 000 jobs. The default is the full run.
 *
 * Prints requests per second and p50/p95/p99 latencies; asserts nothing.
 */
import autocannon from 'autocannon';
import { connectDatabase } from '../db/client';
import { demoShop } from '../db/seed';
import { seedLargeShop } from '../db/seedLarge';
import { benchLayout } from './benchLayout';
import { api, makeBenchJob, signIn, startBenchServer, type BenchJob } from './benchServer';

const DURATION = Number(process.env.DURATION) || 20;
const CONNECTIONS = Number(process.env.CONNECTIONS) || 50;
const port = Number(process.env.PORT) || 8295;
/** Scenario keys to run; all of them when unset. */
const ONLY = process.env.BENCH_ONLY ? new Set(process.env.BENCH_ONLY.split(',').map((k) => k.trim())) : null;
const LARGE_SEED = process.env.BENCH_LARGE_SEED !== '0';
const wanted = (key: string) => ONLY === null || ONLY.has(key);

const quantileOf = (sorted: readonly number[], q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] ?? NaN;
const ms = (v: number) => (v >= 100 ? v.toFixed(0) : v.toFixed(1));
function spread(times: number[]): string {
  const sorted = [...times].sort((a, b) => a - b);
  return `p50 ${ms(quantileOf(sorted, 0.5))} ms, p95 ${ms(quantileOf(sorted, 0.95))} ms, p99 ${ms(quantileOf(sorted, 0.99))} ms`;
}

/** Asks /api/health one request at a time until stopped; the latencies. */
function watchHealth(base: string) {
  const times: number[] = [];
  let running = true;
  const loop = (async () => {
    while (running) {
      const t = performance.now();
      await fetch(`${base}/api/health`).then((r) => r.arrayBuffer(), () => undefined);
      times.push(performance.now() - t);
      await new Promise((r) => setTimeout(r, 25));
    }
  })();
  return async () => {
    running = false;
    await loop;
    return times;
  };
}

type Scenario = { key: string; label: string; options: Partial<autocannon.Options> & { path?: string } };

async function load(base: string, cookie: string, scenario: Scenario) {
  const stopHealth = watchHealth(base);
  const times: number[] = [];
  const statuses = new Map<number, number>();
  // autocannon takes the path as part of the url; a `path` option alone is not read, and every request would fetch the page.
  const { path, ...options } = scenario.options as Partial<autocannon.Options> & { path?: string };
  const instance = autocannon({ connections: CONNECTIONS, duration: DURATION, headers: { cookie }, ...options, url: `${base}${path ?? ''}` });
  instance.on('response', (_client: unknown, status: number, _bytes: number, time: number) => {
    times.push(time);
    statuses.set(status, (statuses.get(status) ?? 0) + 1);
  });
  const result = await instance;
  const health = await stopHealth();
  const codes = [...statuses].map(([code, n]) => `${code}x${n}`).join(' ');
  console.log(`${scenario.label}: ${(result.requests.average).toFixed(1)} req/s, ${spread(times)}  [${codes}${result.errors ? `, ${result.errors} errors` : ''}${result.timeouts ? `, ${result.timeouts} timeouts` : ''}]`);
  console.log(`  /api/health meanwhile: ${spread(health)} over ${health.length} requests`);
}

/**
 * Each request saves a copy of the benchmark layout that no other request is
 * saving at that moment, carrying its revision forward, so the figures are
 * of saves rather than of 409s. autocannon starts each request with a fresh
 * context, so the copies not being saved wait in a queue of their own.
 *
 * `byName` saves as the designer does between edits: the garment, which the
 * server already holds, goes by the name the server gave it (a moved
 * opening, a changed reveal). Otherwise every point is sent each time, as
 * in the first save after a trace or from a client that keeps no names.
 */
async function draftSaveScenario(base: string, cookie: string, job: BenchJob, byName: boolean): Promise<Scenario> {
  const document = benchLayout(2000);
  const free: { id: string; revision: number }[] = [];
  let refs: Record<string, string> = {};
  // Twice the connections: a copy whose answer never came (a timeout) stays out of the queue.
  for (let i = 0; i < CONNECTIONS * 2; i++) {
    const created = await api(base, cookie, 'POST', `/jobs/${job.jobId}/layouts`, { name: `Bench copy ${i + 1}`, document });
    free.push({ id: created.layout.id, revision: created.layout.draftRevision });
    refs = created.layout.outlineRefs;
  }
  const sent = byName
    ? { ...document, openings: document.openings.map((o) => (refs[o.id] ? { ...o, shape: { kind: o.shape.kind, pointsRef: refs[o.id] } } : o)) }
    : document;
  // The document's JSON is written once: stringifying 2 000 points per request would load the client, not the server.
  const documentJson = JSON.stringify(sent);
  const body = (layout: { revision: number }) => `{"document":${documentJson},"baseRevision":${layout.revision}}`;
  return {
    key: byName ? 'draft' : 'draft-whole',
    label: byName
      ? `draft save (2 000-point layout, garment kept by name, ${(documentJson.length / 1024).toFixed(1)} KB)`
      : `draft save (2 000-point layout, every point sent, ${(documentJson.length / 1024).toFixed(1)} KB)`,
    options: {
      requests: [{
        method: 'PUT',
        setupRequest: (req: any, context: any) => {
          context.layout = free.shift() ?? { id: job.layoutId, revision: 0 };
          return { ...req, path: `/api/layouts/${context.layout.id}/draft`, headers: { ...req.headers, 'content-type': 'application/json' }, body: body(context.layout) };
        },
        onResponse: (status: number, text: string, context: any) => {
          if (context.layout.id === job.layoutId) return;
          if (status === 200) context.layout.revision = JSON.parse(text).draftRevision;
          if (status === 409) context.layout.revision = JSON.parse(text).current.draftRevision;
          free.push(context.layout);
        },
      }] as any,
    },
  };
}

async function oneAtATime(base: string, cookie: string, url: string, count = 200) {
  const times: number[] = [];
  let bytes = 0;
  for (let i = 0; i < count; i++) {
    const t = performance.now();
    const res = await fetch(`${base}${url}`, { headers: { cookie } });
    bytes = (await res.arrayBuffer()).byteLength;
    times.push(performance.now() - t);
  }
  return `${spread(times)}, ${(bytes / 1024).toFixed(1)} KB`;
}

async function main() {
  const server = await startBenchServer(port);
  try {
    if (LARGE_SEED) {
      const database = connectDatabase(server.databaseUrl);
      const seeded = await seedLargeShop(database.db, demoShop.members[0].email);
      await database.close();
      console.log(`seeded ${seeded.jobs} jobs and ${seeded.customers} customers; ${CONNECTIONS} connections, ${DURATION} s each`);
    } else {
      console.log(`the demo shop only (BENCH_LARGE_SEED=0); ${CONNECTIONS} connections, ${DURATION} s each`);
    }
    const cookie = await signIn(server.base);
    const job = await makeBenchJob(server.base, cookie);
    const scenarios: Scenario[] = [
      { key: 'jobs', label: 'jobs list (first page, by due date)', options: { path: '/api/jobs' } },
      { key: 'job', label: 'one job', options: { path: `/api/jobs/${job.jobId}` } },
      { key: 'read', label: 'layout read (2 000-point draft)', options: { path: `/api/layouts/${job.layoutId}` } },
      ...(wanted('draft') ? [await draftSaveScenario(server.base, cookie, job, true)] : []),
      ...(wanted('draft-whole') ? [await draftSaveScenario(server.base, cookie, job, false)] : []),
      { key: 'export', label: 'export DXF (2 000-point layout)', options: { path: `/api/layouts/${job.layoutId}/versions/${job.versionNumber}/export?format=dxf&mat=1` } },
    ];
    for (const scenario of scenarios.filter((s) => wanted(s.key))) await load(server.base, cookie, scenario);
    if (!wanted('lists')) return;
    console.log('lists at 10 000 jobs, one request at a time (200 each):');
    console.log(`  jobs list, default filters, by due date: ${await oneAtATime(server.base, cookie, '/api/jobs?sort=due&order=asc')}`);
    console.log(`  jobs list, text search "heron": ${await oneAtATime(server.base, cookie, '/api/jobs?q=heron')}`);
    console.log(`  customers list, first page: ${await oneAtATime(server.base, cookie, '/api/customers')}`);
    console.log(`  customers search "larkspur": ${await oneAtATime(server.base, cookie, '/api/customers?q=larkspur')}`);
  } finally {
    await server.stop();
  }
}

await main();
