// `npm run bench:restart`: two web processes and one worker on one database and
// one bucket (the local S3 fake) behind a small load balancer; a bounded load of
// reads, saves and uploads runs while each process is restarted once with
// SIGTERM. Prints every failed request; exits 1 when there was any.
import pg from 'pg';
import sharp from 'sharp';
import { startS3Fake } from '../server/storage/s3Fake';
import { startLoadBalancer, type Backend } from './restartBench/loadBalancer';
import { percentile, runLoad, type LoadTarget, type Outcome } from './restartBench/load';
import { startProcess, stopProcess, waitReady, type Managed } from './restartBench/processes';
// @ts-expect-error plain ESM script without types
import { ensurePostgres } from './postgres.mjs';

const MIN_REQUESTS = Number(process.env.RESTART_REQUESTS) || 2400;
const CONCURRENCY = 8;
const basePort = Number(process.env.PORT) || 8080;

const progress = (text: string) => process.stdout.write(`  [${new Date().toISOString().slice(11, 19)}] ${text}\n`);

async function freshDatabase(): Promise<{ url: string; drop(): Promise<void> }> {
  const admin = (ensurePostgres('matwright') as { url: string }).url;
  const name = `matwright_restart_${Date.now()}`;
  const run = async (sql: string) => {
    const c = new pg.Client({ connectionString: admin });
    await c.connect();
    await c.query(sql);
    await c.end();
  };
  await run(`create database "${name}"`);
  const url = Object.assign(new URL(admin), { pathname: `/${name}` }).toString();
  return { url, drop: () => run(`drop database if exists "${name}" with (force)`) };
}

async function signUpAndPrepare(url: string): Promise<LoadTarget> {
  const post = (path: string, body: unknown, cookie = '') =>
    fetch(`${url}${path}`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body: JSON.stringify(body) });
  const signUp = await post('/api/auth/sign-up', { shopName: 'Kestrel Lane Framing', name: 'Bench Owner', email: `bench-${Date.now()}@bench.example`, password: 'quiet lantern harbour 42' });
  if (signUp.status !== 201) throw new Error(`sign-up failed: ${signUp.status} ${await signUp.text()}`);
  const cookie = signUp.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  const customer = (await (await post('/api/customers', { name: 'Marlow Quince' }, cookie)).json()) as { customer: { id: string } };
  const job = (await (await post('/api/jobs', { title: 'Tidewater Otters signed jersey', customerId: customer.customer.id }, cookie)).json()) as { job: { id: string } };
  const piece = (await (await post(`/api/jobs/${job.job.id}/pieces`, { kind: 'garment', label: 'Jersey', widthIn: 16, heightIn: 18 }, cookie)).json()) as { piece: { id: string } };
  const photo = await sharp({ create: { width: 96, height: 64, channels: 3, background: { r: 200, g: 190, b: 170 } } }).png().toBuffer();
  return { url, cookie, jobId: job.job.id, pieceId: piece.piece.id, photo };
}

interface Restart {
  name: string;
  stopMs: number;
  exitCode: number | null;
  readyMs: number;
}

function report(outcomes: Outcome[], restarts: Restart[], lb: { forwarded: number; refusedThenRetried: number }, seconds: number) {
  const failed = outcomes.filter((o) => !o.ok);
  const line = (label: string, value: string | number) => process.stdout.write(`  ${label.padEnd(34)} ${value}\n`);
  process.stdout.write('\nRolling restart under load\n');
  line('requests sent', `${outcomes.length} (target at least 2000)`);
  for (const kind of ['read', 'save', 'upload'] as const) {
    const mine = outcomes.filter((o) => o.kind === kind);
    line(`  ${kind}s`, `${mine.length}, p50 ${percentile(mine.map((o) => o.ms), 50).toFixed(0)} ms, p95 ${percentile(mine.map((o) => o.ms), 95).toFixed(0)} ms`);
  }
  line('failed requests', `${failed.length} (target 0)`);
  line('wall time', `${seconds.toFixed(1)} s (${(outcomes.length / seconds).toFixed(0)} requests/s at ${CONCURRENCY} at once)`);
  line('refused connections retried by LB', lb.refusedThenRetried);
  for (const r of restarts) line(`restart ${r.name}`, `stopped in ${r.stopMs} ms (exit ${r.exitCode}), ready again ${r.readyMs} ms later`);
  for (const f of failed.slice(0, 30)) process.stdout.write(`  FAILED ${f.kind}: status ${f.status} ${f.error ?? ''}\n`);
  return failed.length;
}

async function main() {
  const database = await freshDatabase();
  const fake = await startS3Fake();
  const shared: NodeJS.ProcessEnv = {
    DATABASE_URL: database.url,
    NODE_ENV: 'development',
    SEED_DEMO: '0',
    LOG_LEVEL: 'warn',
    WEB_DIR: 'no-web-build-here',
    TRACE_WORKER: '0',
    AUTH_LIMIT_PER_ADDRESS: '100000',
    SHUTDOWN_DRAIN_MS: '400',
    // Generous on a shared, busy machine: the benchmark counts restarts, not a slow disk.
    DB_CONNECT_TIMEOUT_MS: '15000',
    DB_STATEMENT_TIMEOUT_MS: '20000',
    SHUTDOWN_TIMEOUT_MS: '10000',
    STORAGE: 's3',
    S3_ENDPOINT: fake.settings.endpoint,
    S3_BUCKET: fake.settings.bucket,
    S3_REGION: fake.settings.region,
    S3_ACCESS_KEY_ID: fake.settings.accessKeyId,
    S3_SECRET_ACCESS_KEY: fake.settings.secretAccessKey,
  };
  const backends: Backend[] = [
    { name: 'web-1', port: basePort, up: false },
    { name: 'web-2', port: Number(process.env.E2E_PORT) || basePort + 1, up: false },
  ];
  const startWeb = (b: Backend) => startProcess(b.name, 'server/main.ts', { ...shared, PORT: String(b.port) });
  const running = new Map<string, Managed>();
  for (const b of backends) running.set(b.name, startWeb(b));
  running.set('worker', startProcess('worker', 'server/worker.ts', shared));
  const lb = await startLoadBalancer(backends);
  try {
    for (const b of backends) progress(`${b.name} ready after ${await waitReady(`http://127.0.0.1:${b.port}/api/ready`)} ms more`);
    await new Promise((r) => setTimeout(r, 300));
    const target = await signUpAndPrepare(lb.url);
    const restarts: Restart[] = [];
    let restartsDone = false;
    const restartAll = async () => {
      await new Promise((r) => setTimeout(r, 1500));
      for (const b of backends) {
        progress(`SIGTERM to ${b.name}`);
        const stopped = await stopProcess(running.get(b.name)!);
        const started = Date.now();
        running.set(b.name, startWeb(b));
        await waitReady(`http://127.0.0.1:${b.port}/api/ready`);
        await new Promise((r) => setTimeout(r, 300)); // the balancer's next health check
        restarts.push({ name: b.name, stopMs: stopped.ms, exitCode: stopped.code, readyMs: Date.now() - started });
        progress(`${b.name} is back`);
      }
      const stopped = await stopProcess(running.get('worker')!);
      running.set('worker', startProcess('worker', 'server/worker.ts', shared));
      restarts.push({ name: 'worker', stopMs: stopped.ms, exitCode: stopped.code, readyMs: 0 });
      progress('worker restarted');
      restartsDone = true;
    };
    const began = Date.now();
    const [outcomes] = await Promise.all([runLoad(target, { concurrency: CONCURRENCY, cap: 20_000, keepGoing: (sent) => sent < MIN_REQUESTS || !restartsDone }), restartAll()]);
    const failed = report(outcomes, restarts, lb.stats, (Date.now() - began) / 1000);
    process.exitCode = failed === 0 && restarts.every((r) => r.exitCode === 0) ? 0 : 1;
  } finally {
    await lb.close();
    await Promise.all([...running.values()].map((p) => (p.child.exitCode === null ? stopProcess(p) : null)));
    await fake.close();
    await database.drop();
  }
}

main().catch((err) => {
  process.stderr.write(`${err instanceof Error ? err.stack ?? err.message : String(err)}\n`);
  process.exit(1);
});
