// What `npm start` and `npm test` both do first on any machine: install the
// npm packages when the lock file changed, start Postgres, and build the web
// app when its sources changed. Plain Node: it runs before node_modules exists.
import { execSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { ensurePostgres } from './postgres.mjs';
import { exportWeb } from './exportWeb.mjs';

export const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');

export function say(message) {
  process.stdout.write(`[matwright] ${message}\n`);
}

function hashFiles(paths) {
  const hash = createHash('sha256');
  const visit = (p) => {
    if (!fs.existsSync(p)) return;
    const stat = fs.statSync(p);
    if (stat.isDirectory()) {
      for (const name of fs.readdirSync(p).sort()) {
        if (name === 'node_modules' || name.endsWith('.test.ts')) continue;
        visit(path.join(p, name));
      }
    } else {
      hash.update(path.relative(root, p));
      hash.update(fs.readFileSync(p));
    }
  };
  for (const p of paths) visit(path.join(root, p));
  return hash.digest('hex');
}

export function ensureNodeModules() {
  const stamp = path.join(root, 'node_modules', '.matwright-lock');
  const want = hashFiles(['package-lock.json']); // the lock names every installed version
  if (fs.existsSync(stamp) && fs.readFileSync(stamp, 'utf8') === want) return;
  say('installing npm packages (npm ci, about a minute on a fresh machine)...');
  execSync('npm ci --no-audit --no-fund', { cwd: root, stdio: 'inherit' });
  fs.writeFileSync(stamp, want);
}

const webSources = ['index.ts', 'app', 'features', 'geometry', 'assets', 'fonts', 'app.json', 'metro.config.cjs', 'package.json', 'package-lock.json', 'tsconfig.json', 'scripts/webBuildFinish.mjs', 'scripts/compressWeb.mjs', 'scripts/exportWeb.mjs', 'app.config.js'];

export function ensureWebBuild() {
  const stamp = path.join(root, 'dist', '.source-hash');
  const want = hashFiles(webSources);
  const drawing = path.join(root, 'dist-pages', 'render.cjs');
  if (fs.existsSync(stamp) && fs.readFileSync(stamp, 'utf8') === want && fs.existsSync(drawing)) return;
  say('building the web app (expo export, pre-rendering every page, then the server\'s drawing bundle; a few minutes cold)...');
  exportWeb(root, { stdio: ['ignore', 'ignore', 'inherit'] });
  fs.writeFileSync(stamp, want);
}

/** Debian's Chromium for Playwright; installed with apt, never downloaded by a test tool. */
export function ensureChromium() {
  if (fs.existsSync('/usr/bin/chromium')) return;
  if (process.getuid?.() !== 0) throw new Error('Chromium is missing; run: sudo apt-get install -y chromium');
  say('installing Debian\'s chromium package (about a minute)...');
  execSync('apt-get update -qq && apt-get install -y -qq chromium', {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}

export function bootstrap({ database = 'matwright' } = {}) {
  ensureNodeModules();
  return ensurePostgres(database);
}
