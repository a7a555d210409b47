// The server the browser tests drive: the built web app and the API over a
// database created fresh for this run (and dropped when the server stops).
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { ensurePostgres, psqlAdmin } from './postgres.mjs';
import { root } from './bootstrap.mjs';

const port = process.argv[2] ?? '8181';
const name = `matwright_e2e_${Date.now()}`;
const pg = ensurePostgres(name);
// Browser tests that need set-up no route offers yet read the run's database address here.
fs.mkdirSync(path.join(root, 'e2e/output'), { recursive: true });
fs.writeFileSync(path.join(root, 'e2e/output/database-url'), pg.url, { mode: 0o600 });
const server = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
  cwd: root,
  stdio: 'inherit',
  // Every browser test signs in from 127.0.0.1: the per-address attempt limits are raised for them
  // (the per-account limits stay as they are in production).
  env: { ...process.env, DATABASE_URL: pg.url, PORT: port, LOG_LEVEL: 'warn', SEED_DEMO: '1', NODE_ENV: 'test', AUTH_LIMIT_PER_ADDRESS: '1000' },
});
const drop = () => {
  if (!pg.external) psqlAdmin(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
};
for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => {
    server.kill('SIGTERM');
  });
}
server.on('exit', (code) => {
  drop();
  process.exit(code ?? 0);
});
