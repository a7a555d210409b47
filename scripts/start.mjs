// `npm start`: everything a fresh machine needs, then one server process.
import { spawn, spawnSync } from 'node:child_process';
import { bootstrap, ensureWebBuild, root } from './bootstrap.mjs';

const pg = bootstrap();
ensureWebBuild();
// Production threads run built JavaScript (server/compute/computeThread.mjs).
if (process.env.NODE_ENV === 'production') spawnSync(process.execPath, ['scripts/buildServer.mjs'], { cwd: root, stdio: 'inherit' });
const server = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
  cwd: root,
  stdio: 'inherit',
  // Request logs are JSON for log tools; a person at the terminal sees warnings and the banner.
  env: { PORT: '8080', LOG_LEVEL: 'warn', ...process.env, DATABASE_URL: pg.url, NODE_ENV: process.env.NODE_ENV ?? 'development' },
});
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.kill(signal));
server.on('exit', (code) => process.exit(code ?? 0));
