/**
 * Password guessing against a real server process with the production limits:
 * 300 wrong passwords for one account, then 300 spread over 30 accounts, all
 * from one address, 10 at a time. Prints how each was answered, how long the
 * runs took, and the server's peak memory (argon2 holds 19 MiB per hash).
 *
 *   npx tsx scripts/benchSignIn.ts
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';
// @ts-expect-error plain ESM script without types
import { ensurePostgres, psqlAdmin } from './postgres.mjs';

const root = path.resolve(import.meta.dirname, '..');
const password = 'plum orchard ladder 7';

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const server = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

const rssMiB = (pid: number) => {
  const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
  return Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0) / 1024;
};

/** A POST as if from `address`: the server trusts X-Forwarded-For from a proxy on loopback, as this script is. */
async function post(base: string, route: string, body: object, address: string) {
  const headers = { 'Content-Type': 'application/json', 'X-Forwarded-For': address };
  const res = await fetch(`${base}${route}`, { method: 'POST', headers, body: JSON.stringify(body) });
  return res.status;
}

/** Sends `count` sign-ins, `parallel` at a time; returns the statuses and the seconds taken. */
async function guess(base: string, count: number, email: (i: number) => string, address: string, parallel = 10) {
  const statuses: Record<number, number> = {};
  const started = performance.now();
  let next = 0;
  const worker = async () => {
    while (next < count) {
      const i = next++;
      const status = await post(base, '/api/auth/sign-in', { email: email(i), password: `wrong guess ${i}` }, address);
      statuses[status] = (statuses[status] ?? 0) + 1;
    }
  };
  await Promise.all(Array.from({ length: parallel }, worker));
  return { statuses, seconds: (performance.now() - started) / 1000 };
}

async function main() {
  const name = `matwright_bench_signin_${Date.now()}`;
  const pg = ensurePostgres(name);
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const server = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: root,
    stdio: 'ignore',
    env: { ...process.env, DATABASE_URL: pg.url, PORT: String(port), SEED_DEMO: '0', LOG_LEVEL: 'silent', NODE_ENV: 'development' },
  });
  try {
    for (let i = 0; i < 100 && !(await fetch(`${base}/api/health`).then((r) => r.ok, () => false)); i++) await new Promise((r) => setTimeout(r, 200));
    const emails = Array.from({ length: 30 }, (_, i) => `bench-${i}@bench.example`);
    for (const [i, email] of emails.entries()) await post(base, '/api/auth/sign-up', { shopName: 'Bench Frames', name: 'Bench', email, password }, `198.51.100.${i + 1}`);
    let peak = 0;
    const sampler = setInterval(() => (peak = Math.max(peak, rssMiB(server.pid!))), 20);
    const before = rssMiB(server.pid!);
    // Documentation addresses (RFC 5737): one guesser per run, the owners elsewhere.
    const one = await guess(base, 300, () => emails[0]!, '203.0.113.10');
    const spread = await guess(base, 300, (i) => emails[i % 30]!, '203.0.113.20');
    clearInterval(sampler);
    const owner = await post(base, '/api/auth/sign-in', { email: emails[1], password }, '198.51.100.200');
    const lockedOwner = await post(base, '/api/auth/sign-in', { email: emails[0], password }, '198.51.100.201');
    process.stdout.write(
      [
        `300 wrong passwords, one account:   ${JSON.stringify(one.statuses)} in ${one.seconds.toFixed(1)} s`,
        `300 wrong passwords, 30 accounts:   ${JSON.stringify(spread.statuses)} in ${spread.seconds.toFixed(1)} s`,
        `the right password afterwards from the owner's own address: ${owner} for an account of the spread run, ${lockedOwner} for the account guessed 300 times (until its 15-minute window ends)`,
        `server memory: ${before.toFixed(0)} MiB before, peak ${peak.toFixed(0)} MiB during the guessing`,
        '',
      ].join('\n'),
    );
  } finally {
    server.kill('SIGTERM');
    await new Promise((r) => setTimeout(r, 500));
    psqlAdmin(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
  }
}

void main();
