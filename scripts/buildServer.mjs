// `npm run build:server`: the compute threads' code as plain JavaScript in
// dist-server/, so production threads start without compiling TypeScript
// (server/compute/computeThread.mjs loads it when NODE_ENV=production).
// Everything is bundled (some packages are CommonJS reached by deep paths);
// a `require` made for the bundle serves their Node built-ins.
import { build } from 'esbuild';
import path from 'node:path';

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');

await build({
  entryPoints: [path.join(root, 'server/compute/computeTask.ts')],
  outfile: path.join(root, 'dist-server/computeTask.mjs'),
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  banner: { js: "import { createRequire as __matwrightRequire } from 'node:module'; const require = __matwrightRequire(import.meta.url);" },
  sourcemap: true,
  logLevel: 'warning',
});
process.stdout.write('dist-server/computeTask.mjs is built\n');
