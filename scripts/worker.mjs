// `npm run worker`: a tracing worker on its own, for the same database as `npm start`.
import { spawn } from 'node:child_process';
import { bootstrap, root } from './bootstrap.mjs';

const pg = bootstrap();
const worker = spawn(process.execPath, ['--import', 'tsx', 'server/worker.ts'], {
  cwd: root,
  stdio: 'inherit',
  env: { LOG_LEVEL: 'warn', ...process.env, DATABASE_URL: pg.url, NODE_ENV: process.env.NODE_ENV ?? 'development' },
});
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => worker.kill(signal));
worker.on('exit', (code) => process.exit(code ?? 0));
