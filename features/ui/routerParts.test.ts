import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { projectRoot, sourceFiles } from '../test/sourceFiles';

/**
 * The web build resolves the app's `from 'expo-router'` to routerParts.ts
 * (metro.config.cjs). A name imported from 'expo-router' that routerParts does
 * not export would be undefined in the browser with no build error, so every
 * value the app imports is checked here against what routerParts exports, and
 * each of those against what expo-router's own main entry exports.
 */
const root = projectRoot;

/** Value names (not types) in `import { ... } from 'expo-router'` and `export { ... } from 'expo-router'`. */
function namesTakenFromExpoRouter(text: string): string[] {
  const names: string[] = [];
  for (const m of text.matchAll(/(?:import|export)\s+(type\s+)?\{([^}]*)\}\s+from\s+'expo-router'/g)) {
    if (m[1]) continue;
    for (const part of m[2]!.split(',')) {
      const name = part.trim();
      if (!name || name.startsWith('type ')) continue;
      names.push(name.split(/\s+as\s+/)[0]!.trim());
    }
  }
  return names;
}

describe("the app's imports from expo-router in the web build", () => {
  const parts = fs.readFileSync(path.join(root, 'features/ui/routerParts.ts'), 'utf8');
  const exported = new Set([...parts.matchAll(/export\s+\{([^}]*)\}/g)].flatMap((m) => m[1]!.split(',').map((n) => n.trim()).filter(Boolean)));

  it('are all exported by routerParts', () => {
    const used = new Set<string>();
    for (const file of sourceFiles('app', 'features')) {
      for (const name of namesTakenFromExpoRouter(fs.readFileSync(file, 'utf8'))) used.add(name);
    }
    expect(used.size).toBeGreaterThan(3);
    expect([...used].filter((n) => !exported.has(n))).toEqual([]);
  });

  it("are the same names expo-router's main entry exports", () => {
    const typings = fs.readFileSync(path.join(root, 'node_modules/expo-router/build/exports.d.ts'), 'utf8') + fs.readFileSync(path.join(root, 'node_modules/expo-router/build/link/Link.d.ts'), 'utf8');
    for (const name of exported) expect(typings, name).toMatch(new RegExp(`\\b${name}\\b`));
  });
});

describe("Expo Router's internal modules the web build stands in for (routerInternals.tsx)", () => {
  const build = path.join(root, 'node_modules/expo-router/build');
  const taken = (file: string, binding: string) =>
    new Set([...fs.readFileSync(path.join(build, file), 'utf8').matchAll(new RegExp(`${binding}\\.(\\w+)`, 'g'))].map((m) => m[1]!));
  const standIn = fs.readFileSync(path.join(root, 'features/ui/routerInternals.tsx'), 'utf8');

  it('Navigator takes only the stack router from StackClient, which wraps React Navigation\'s', () => {
    expect([...taken('views/Navigator.js', 'StackClient_1')]).toEqual(['StackRouter']);
    expect(fs.readFileSync(path.join(build, 'layouts/StackClient.js'), 'utf8')).toMatch(/\(0, native_1\.StackRouter\)\(options\)/);
    expect(standIn).toMatch(/export \{ StackRouter \} from 'expo-router\/build\/react-navigation\/routers'/);
  });

  it('the development notes take only the toast and its wrapper', () => {
    for (const file of ['views/SuspenseFallback.js', 'views/EmptyRoute.js']) {
      for (const name of taken(file, 'Toast_1')) expect(standIn, `${file}: ${name}`).toMatch(new RegExp(`export (function|const) ${name}\\b`));
    }
  });
});
