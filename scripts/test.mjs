// `npm test`: the same set-up as `npm start`, then every test: Vitest (unit and
// API against a fresh Postgres database) and Playwright in Debian's Chromium.
import { spawnSync } from 'node:child_process';
import { bootstrap, ensureChromium, ensureWebBuild, root, say } from './bootstrap.mjs';

const pg = bootstrap();
ensureChromium();
ensureWebBuild();

const env = { ...process.env, MATWRIGHT_ADMIN_URL: pg.url };
delete env.DATABASE_URL;
if (pg.external) env.MATWRIGHT_ADMIN_URL = process.env.DATABASE_URL;

function step(name, cmd, args) {
  say(`${name}...`);
  const started = Date.now();
  const result = spawnSync(cmd, args, { cwd: root, stdio: 'inherit', env });
  say(`${name}: ${result.status === 0 ? 'passed' : 'FAILED'} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  return result.status === 0;
}

const results = [
  step('route types', process.execPath, ['scripts/typed-routes.mjs']) &&
    step('type check', 'npx', ['tsc', '-p', 'tsconfig.node.json', '--noEmit']) &&
    step('type check (app)', 'npx', ['tsc', '-p', 'tsconfig.json', '--noEmit']),
  step('unit and API tests', 'npx', ['vitest', 'run']),
  step('browser tests', 'npx', ['playwright', 'test']),
];
const failed = results.filter((ok) => !ok).length;
process.stdout.write(`steps: ${results.length - failed} passed, ${failed} failed\n`);
process.exit(failed === 0 ? 0 : 1);
