// The web app's two exports. The first is what browsers load: every route
// pre-rendered to HTML (app.json's web output "static") in dist/, then finished
// for phones (webBuildFinish.mjs). The second exports the same app for a server
// (app.config.js, MATWRIGHT_RENDER_BUNDLE=1), of which only Expo Router's
// rendering bundle is kept, as dist-pages/render.cjs: the server's page-drawing
// thread (server/pages/drawingThread.mjs) draws signed-in pages with it. It is
// kept out of dist/, which is served as it is.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { finishWebBuild } from './webBuildFinish.mjs';

function expoExport(root, outDir, stdio, extraEnv) {
  const result = spawnSync('npx', ['expo', 'export', '--platform', 'web', '--output-dir', outDir], {
    cwd: root,
    stdio,
    env: { ...process.env, CI: '1', EXPO_OFFLINE: '1', ...extraEnv },
  });
  if (result.status !== 0) throw new Error('expo export failed; run it by hand to see why: npx expo export --platform web');
}

/** Both exports; answers how many files of dist/ were pre-compressed. */
export function exportWeb(root, { stdio = ['ignore', 'inherit', 'inherit'] } = {}) {
  const dist = path.join(root, 'dist');
  expoExport(root, dist, stdio, {});
  const { files } = finishWebBuild(dist);
  const scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'matwright-pages-'));
  try {
    expoExport(root, scratch, stdio, { MATWRIGHT_RENDER_BUNDLE: '1' });
    const bundle = path.join(scratch, 'server', '_expo', 'server', 'render.js');
    if (!fs.existsSync(bundle)) throw new Error(`the server export wrote no ${path.relative(scratch, bundle)}`);
    const pages = path.join(root, 'dist-pages');
    fs.rmSync(pages, { recursive: true, force: true });
    fs.mkdirSync(pages, { recursive: true });
    // .cjs: the project's package.json makes a .js file an ES module, and the bundle is CommonJS.
    fs.copyFileSync(bundle, path.join(pages, 'render.cjs'));
  } finally {
    fs.rmSync(scratch, { recursive: true, force: true });
  }
  return { files };
}
