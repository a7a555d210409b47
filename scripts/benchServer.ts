/**
 * What the API and web benchmarks share: a server of their own on a fresh
 * database with the demo shop, a signed-in designer, and the benchmark
 * shadowbox (scripts/benchLayout.ts) saved as a layout with a frozen version.
 *
 * BENCH_SERVER_ROOT=/path/to/another/checkout runs that checkout's server
 * code instead (to measure an older version on the same machine).
 * BENCH_SERVER_NODE_ARGS="--cpu-prof --cpu-prof-dir=/tmp/prof" passes Node
 * options to the server process (profiles are written when it stops).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { benchLayout } from './benchLayout';
// @ts-expect-error plain Node module without types
import { ensurePostgres, psqlAdmin } from './postgres.mjs';

export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
export const DEMO_DESIGNER = { email: 'designer@tallowmere.example', password: 'demo-frames-2026' };
export const DEMO_OWNER = { email: 'owner@tallowmere.example', password: 'demo-frames-2026' };

export interface BenchServer {
  readonly base: string;
  readonly databaseUrl: string;
  stop(): Promise<void>;
}

export async function startBenchServer(port: number, extraEnv: Record<string, string> = {}): Promise<BenchServer> {
  const name = `matwright_bench_${Date.now()}`;
  const pg = ensurePostgres(name) as { url: string; external?: boolean };
  const root = process.env.BENCH_SERVER_ROOT ?? projectRoot;
  const nodeArgs = (process.env.BENCH_SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean);
  const server: ChildProcess = spawn(process.execPath, [...nodeArgs, '--import', 'tsx', 'server/main.ts'], {
    cwd: root,
    stdio: ['ignore', 'ignore', 'inherit'],
    env: {
      ...process.env, DATABASE_URL: pg.url, PORT: String(port), HOST: '127.0.0.1', LOG_LEVEL: 'warn', SEED_DEMO: '1',
      NODE_ENV: 'test', AUTH_LIMIT_PER_ADDRESS: '100000', TRACE_WORKER: '0', WEB_DIR: path.join(root, 'dist'), ...extraEnv,
    },
  });
  const base = `http://127.0.0.1:${port}`;
  const stop = async () => {
    const exited = new Promise((resolve) => server.once('exit', resolve));
    server.kill('SIGTERM');
    await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 10_000))]);
    if (!pg.external) psqlAdmin(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
  };
  for (let i = 0; i < 240; i++) {
    if (await fetch(`${base}/api/health`).then((r) => r.ok, () => false)) return { base, databaseUrl: pg.url, stop };
    await new Promise((r) => setTimeout(r, 500));
  }
  await stop();
  throw new Error('the bench server did not start');
}

/** Signs in and returns the session cookie as a Cookie header value. */
export async function signIn(base: string, account = DEMO_DESIGNER): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(account) });
  if (!res.ok) throw new Error(`sign-in failed (${res.status})`);
  return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

export async function api<T = Record<string, any>>(base: string, cookie: string, method: string, url: string, body?: unknown): Promise<T> {
  const res = await fetch(`${base}/api${url}`, {
    method, headers: { cookie, ...(body === undefined ? {} : { 'content-type': 'application/json' }) }, body: body === undefined ? undefined : JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`${method} ${url}: ${res.status} ${(await res.text()).slice(0, 300)}`);
  return (res.status === 204 ? null : await res.json()) as T;
}

export interface BenchJob {
  readonly jobId: string;
  readonly layoutId: string;
  readonly draftRevision: number;
  readonly versionNumber: number;
}

/** A job holding the benchmark shadowbox (2 000-point garment), its draft and version 1 frozen. */
export async function makeBenchJob(base: string, cookie: string): Promise<BenchJob> {
  const { customer } = await api(base, cookie, 'POST', '/customers', { name: 'Bench Customer' });
  const { job } = await api(base, cookie, 'POST', '/jobs', { title: 'Bench shadowbox', customerId: customer.id });
  const created = await api(base, cookie, 'POST', `/jobs/${job.id}/layouts`, { name: 'Bench layout', document: benchLayout(2000) });
  const layoutId = created.layout.id as string;
  const frozen = await api(base, cookie, 'POST', `/layouts/${layoutId}/versions`, { baseRevision: created.layout.draftRevision, note: 'bench' });
  // Cut files come only from an approved version: the owner releases this one, as after an approval at the counter.
  const owner = await signIn(base, DEMO_OWNER);
  await api(base, owner, 'POST', `/layouts/${layoutId}/versions/${frozen.number}/release`, { reason: 'Benchmark: approved at the counter' });
  return { jobId: job.id, layoutId, draftRevision: created.layout.draftRevision, versionNumber: frozen.number };
}
