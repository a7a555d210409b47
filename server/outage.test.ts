import { spawn, type ChildProcess } from 'node:child_process';
import { execFile } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { promisify } from 'node:util';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
// @ts-expect-error plain ESM script without types
import { ensurePostgres } from '../scripts/postgres.mjs';
import { testPassword, uniqueEmail } from './test/harness';

// A real server process (server/main.ts) over the test database, while this
// checkout's Postgres is stopped with an immediate shutdown (as a crash would)
// and started again.
const root = path.resolve(import.meta.dirname, '..');
const run = promisify(execFile);
const STATEMENT_TIMEOUT_MS = 3000;
const CONNECT_TIMEOUT_MS = 1500;
const OUTAGE_MS = 2500;
const MAX_REQUESTS = 600;
const MAX_LOOP_MS = 45_000;

interface Attempt {
  status: number;
  ms: number;
  /** When the answer came, in ms since the loop started. */
  at: number;
  id?: string;
  retryAfter?: string | null;
  phase: 'before' | 'outage' | 'after';
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
    server.once('error', reject);
  });
}

const databaseName = () => new URL(inject('databaseUrl')).pathname.slice(1);

/** Starts the cluster again; safe to call when it already runs. */
function restartPostgres() {
  ensurePostgres(databaseName());
}

async function waitForHealth(base: string, child: ChildProcess) {
  for (let i = 0; i < 150; i++) {
    if (child.exitCode !== null) throw new Error(`the server exited with ${child.exitCode}`);
    const ok = await fetch(`${base}/api/health`).then((r) => r.ok, () => false);
    if (ok) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('the server did not answer /api/health within 30 s');
}

let child: ChildProcess;
let base = '';
let stderr = '';

beforeAll(async () => {
  const local = ensurePostgres(databaseName()) as { external: boolean; config?: { port: number } };
  if (local.external || new URL(inject('databaseUrl')).port !== String(local.config?.port)) {
    throw new Error("This test stops and starts this checkout's own Postgres; it cannot run against a server named by DATABASE_URL.");
  }
  const port = await freePort();
  base = `http://127.0.0.1:${port}`;
  child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: root,
    stdio: ['ignore', 'ignore', 'pipe'],
    env: {
      ...process.env,
      NODE_ENV: 'test',
      DATABASE_URL: inject('databaseUrl'),
      PORT: String(port),
      HOST: '127.0.0.1',
      SEED_DEMO: '0',
      LOG_LEVEL: 'warn',
      WEB_DIR: path.join(root, 'no-web-build-here'),
      DB_STATEMENT_TIMEOUT_MS: String(STATEMENT_TIMEOUT_MS),
      DB_CONNECT_TIMEOUT_MS: String(CONNECT_TIMEOUT_MS),
      AUTH_LIMIT_PER_ADDRESS: '100000',
    },
  });
  child.stderr?.on('data', (chunk: Buffer) => {
    stderr += chunk.toString();
  });
  await waitForHealth(base, child);
}, 60_000);

afterAll(() => {
  // Other test files share the cluster: it must be running whatever happened here.
  restartPostgres();
  child?.kill('SIGTERM');
});

async function signUp(): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-up`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ shopName: 'Lantern Quay Frames', name: 'Outage Tester', email: uniqueEmail('outage'), password: testPassword }),
  });
  expect(res.status).toBe(201);
  return (res.headers.get('set-cookie') ?? '').split(';')[0]!;
}

/** One customer write; a request that takes longer than 15 s is cut and counts as a hang (status 0). */
async function writeOnce(cookie: string, n: number, phase: Attempt['phase'], loopStart: number): Promise<Attempt> {
  const started = performance.now();
  const at = () => performance.now() - loopStart;
  try {
    const res = await fetch(`${base}/api/customers`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', cookie },
      body: JSON.stringify({ name: `Outage write ${n}` }),
      signal: AbortSignal.timeout(15_000),
    });
    const body = (await res.json().catch(() => null)) as { customer?: { id: string } } | null;
    return { status: res.status, ms: performance.now() - started, at: at(), id: body?.customer?.id, retryAfter: res.headers.get('retry-after'), phase };
  } catch {
    return { status: 0, ms: performance.now() - started, at: at(), phase };
  }
}

/**
 * Two writers loop while a controller stops Postgres immediately after a few
 * successes, keeps it down for OUTAGE_MS, starts it again, and ends the loop
 * once ten writes succeeded after the restart. Bounded in count and time.
 */
async function writeThroughOutage(cookie: string): Promise<{ attempts: Attempt[]; restartedAt: number }> {
  const attempts: Attempt[] = [];
  const loopStart = performance.now();
  let restartedAt = 0;
  let phase: Attempt['phase'] = 'before';
  let done = false;
  let n = 0;
  const started = Date.now();
  const writer = async () => {
    while (!done && n < MAX_REQUESTS && Date.now() - started < MAX_LOOP_MS) {
      n += 1;
      attempts.push(await writeOnce(cookie, n, phase, loopStart));
      await new Promise((r) => setTimeout(r, 20));
    }
  };
  const successes = (p: Attempt['phase']) => attempts.filter((a) => a.phase === p && a.status === 201).length;
  const controller = async () => {
    while (successes('before') < 8) await new Promise((r) => setTimeout(r, 20));
    phase = 'outage';
    await run(process.execPath, ['scripts/postgres.mjs', 'stop', 'immediate'], { cwd: root });
    await new Promise((r) => setTimeout(r, OUTAGE_MS));
    await run(process.execPath, ['scripts/postgres.mjs', 'start', databaseName()], { cwd: root });
    phase = 'after';
    restartedAt = performance.now() - loopStart;
    while (successes('after') < 10 && Date.now() - started < MAX_LOOP_MS) await new Promise((r) => setTimeout(r, 50));
    done = true;
  };
  try {
    await Promise.all([writer(), writer(), controller()]);
  } finally {
    restartPostgres();
  }
  return { attempts, restartedAt };
}

describe('a Postgres restart under load', () => {
  it('keeps the server up: 503 with Retry-After during the outage, none hung or 500, writes succeed after, every 2xx write is stored', async () => {
    const cookie = await signUp();
    const { attempts, restartedAt } = await writeThroughOutage(cookie);

    const outage = attempts.filter((a) => a.phase === 'outage');
    const after = attempts.filter((a) => a.phase === 'after');
    const slowest = attempts.reduce((m, a) => (a.ms > m ? a.ms : m), 0);
    const byStatus = attempts.reduce<Record<number, number>>((acc, a) => ({ ...acc, [a.status]: (acc[a.status] ?? 0) + 1 }), {});
    const firstAfter = attempts.find((a) => a.phase === 'after' && a.status === 201);
    const recovery = firstAfter ? `${(firstAfter.at - restartedAt).toFixed(0)} ms` : 'never';
    console.info(
      `outage run: ${attempts.length} writes, statuses ${JSON.stringify(byStatus)}, slowest ${slowest.toFixed(0)} ms, ` +
        `first stored write ${recovery} after Postgres was back`,
    );

    expect(child.exitCode).toBeNull();
    expect((await fetch(`${base}/api/health`)).status).toBe(200);
    expect((await fetch(`${base}/api/ready`)).status).toBe(200);

    expect(attempts.filter((a) => a.status !== 201 && a.status !== 503)).toEqual([]);
    const refused = outage.filter((a) => a.status === 503);
    expect(refused.length).toBeGreaterThan(0);
    expect(refused.every((a) => a.retryAfter === '5')).toBe(true);
    expect(slowest).toBeLessThan(STATEMENT_TIMEOUT_MS);
    expect(after.filter((a) => a.status === 201).length).toBeGreaterThanOrEqual(10);
    expect(after.slice(-5).map((a) => a.status)).toEqual([201, 201, 201, 201, 201]);

    const stored = new pg.Client({ connectionString: inject('databaseUrl') });
    await stored.connect();
    try {
      const ids = attempts.filter((a) => a.status === 201).map((a) => a.id!);
      const found = await stored.query<{ id: string }>('select id from customers where id = any($1::uuid[])', [ids]);
      expect(found.rows.map((r) => r.id).sort()).toEqual([...ids].sort());
    } finally {
      await stored.end();
    }
    expect(stderr).not.toMatch(/Unhandled 'error' event|uncaught/i);
  }, 90_000);

  it('/api/ready answers 503 while Postgres is down and /api/health stays 200', async () => {
    try {
      await run(process.execPath, ['scripts/postgres.mjs', 'stop', 'immediate'], { cwd: root });
      const ready = await fetch(`${base}/api/ready`);
      expect(ready.status).toBe(503);
      expect(((await ready.json()) as { error: { code: string } }).error.code).toBe('db_unavailable');
      expect((await fetch(`${base}/api/health`)).status).toBe(200);
      // Started without blocking this process, so its kept-alive connections to the server stay fresh.
      await run(process.execPath, ['scripts/postgres.mjs', 'start', databaseName()], { cwd: root });
    } finally {
      restartPostgres();
    }
    expect(child.exitCode).toBeNull();
    expect((await fetch(`${base}/api/ready`, { headers: { connection: 'close' } })).status).toBe(200);
  }, 60_000);
});
