// `npm run build:web`: the web app exported to dist/ and finished for phones
// (hashed woff2 fonts preloaded, brotli and gzip copies); see webBuildFinish.mjs.
import { spawnSync } from 'node:child_process';
import { finishWebBuild } from './webBuildFinish.mjs';

const result = spawnSync('npx', ['expo', 'export', '--platform', 'web', '--output-dir', 'dist'], {
  stdio: ['ignore', 'inherit', 'inherit'],
  env: { ...process.env, CI: '1', EXPO_OFFLINE: '1' },
});
if (result.status !== 0) process.exit(result.status ?? 1);
const { files } = finishWebBuild('dist');
process.stdout.write(`dist/ is ready: ${files} files pre-compressed\n`);
