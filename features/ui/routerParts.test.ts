import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * The web build resolves the app's `from 'expo-router'` to routerParts.ts
 * (metro.config.cjs). A name imported from 'expo-router' that routerParts does
 * not export would be undefined in the browser with no build error, so every
 * value the app imports is checked here against what routerParts exports, and
 * each of those against what expo-router's own main entry exports.
 */
const root = path.resolve(__dirname, '../..');

function sourceFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(full);
    return /\.tsx?$/.test(entry.name) && !/\.test\.tsx?$/.test(entry.name) ? [full] : [];
  });
}

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
    for (const file of [...sourceFiles(path.join(root, 'app')), ...sourceFiles(path.join(root, 'features'))]) {
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
