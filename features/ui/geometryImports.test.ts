import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * The browser's code takes each geometry module directly: Metro keeps every
 * module an index re-exports, so a value imported from `geometry` would put
 * the DXF writer, the cut sheet and tracing (server work) into the page's
 * script. Type-only imports leave nothing in the build and are fine.
 */
const root = path.resolve(__dirname, '../..');

function sourceFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(full);
    return /\.tsx?$/.test(entry.name) && !/\.test\.tsx?$/.test(entry.name) ? [full] : [];
  });
}

/** `import { ... } from '<...>/geometry'` that brings in values, not types only. */
function valueImportsOfGeometryIndex(text: string): string[] {
  return [...text.matchAll(/import\s+(type\s+)?\{([^}]*)\}\s+from\s+'(?:\.\.\/)+geometry'/g)]
    .filter((m) => !m[1] && m[2]!.split(',').some((part) => part.trim() !== '' && !part.trim().startsWith('type ')))
    .map((m) => m[0]);
}

describe("the browser's imports of the geometry", () => {
  it('take no value from the geometry index', () => {
    const found = [...sourceFiles(path.join(root, 'features')), ...sourceFiles(path.join(root, 'app'))].flatMap((file) =>
      valueImportsOfGeometryIndex(fs.readFileSync(file, 'utf8')).map((line) => `${path.relative(root, file)}: ${line}`),
    );
    expect(found).toEqual([]);
  });

  it('tell a value import from a type-only one', () => {
    expect(valueImportsOfGeometryIndex("import { parseLayout, type Layout } from '../../geometry';")).toHaveLength(1);
    expect(valueImportsOfGeometryIndex("import type { Layout } from '../../geometry';")).toEqual([]);
    expect(valueImportsOfGeometryIndex("import { type Layout } from '../geometry';")).toEqual([]);
    expect(valueImportsOfGeometryIndex("import { parseLayout } from '../../geometry/layoutSchema';")).toEqual([]);
  });
});
