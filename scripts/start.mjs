// `npm start`: everything a fresh machine needs, then one server process.
import { spawn } from 'node:child_process';
import { bootstrap, ensureWebBuild, root } from './bootstrap.mjs';

const pg = bootstrap();
ensureWebBuild();
const server = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
  cwd: root,
  stdio: 'inherit',
  // Request logs are JSON for log tools; a person at the terminal sees warnings and the banner.
  env: { PORT: '8080', LOG_LEVEL: 'warn', ...process.env, DATABASE_URL: pg.url, NODE_ENV: process.env.NODE_ENV ?? 'development' },
});
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.kill(signal));
server.on('exit', (code) => process.exit(code ?? 0));
