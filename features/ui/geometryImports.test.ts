import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { projectRoot, sourceFiles } from '../test/sourceFiles';

/**
 * The browser's code takes each geometry module directly: Metro keeps every
 * module an index re-exports, so a value imported from `geometry` would put
 * the DXF writer, the cut sheet and tracing (server work) into the page's
 * script. Type-only imports leave nothing in the build and are fine.
 */

/** `import { ... } from '<...>/geometry'` that brings in values, not types only. */
function valueImportsOfGeometryIndex(text: string): string[] {
  return [...text.matchAll(/import\s+(type\s+)?\{([^}]*)\}\s+from\s+'(?:\.\.\/)+geometry'/g)]
    .filter((m) => !m[1] && m[2]!.split(',').some((part) => part.trim() !== '' && !part.trim().startsWith('type ')))
    .map((m) => m[0]);
}

describe("the browser's imports of the geometry", () => {
  it('take no value from the geometry index', () => {
    const found = sourceFiles('features', 'app').flatMap((file) =>
      valueImportsOfGeometryIndex(fs.readFileSync(file, 'utf8')).map((line) => `${path.relative(projectRoot, file)}: ${line}`),
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
