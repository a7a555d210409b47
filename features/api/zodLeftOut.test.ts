import fs from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import * as leftOut from './zodLeftOut';

/**
 * The web build swaps five of zod's modules for zodLeftOut (metro.config.cjs).
 * Checked against zod's own published modules: every name they export is
 * there, so a schema built in the browser finds what it looks up; and nothing
 * in the app calls what was left out.
 */
const zodDir = path.resolve(path.dirname(createRequire(import.meta.url).resolve('zod/v4/core')), '..');
const replaced = ['core/compile.js', 'core/to-json-schema.js', 'core/json-schema-processors.js', 'core/json-schema-generator.js', 'classic/from-json-schema.js'];

describe("zod's parts left out of the web build", () => {
  it.each(replaced)('%s: every name it exports has a counterpart', async (file) => {
    const real = await import(pathToFileURL(path.join(zodDir, file)).href);
    const names = Object.keys(real);
    expect(names.length).toBeGreaterThan(0);
    // The per-type converters are only looked up while converting to JSON Schema.
    const needed = names.filter((n) => !/Processor$/.test(n));
    expect(needed.filter((n) => !(n in leftOut))).toEqual([]);
  });

  it('says plainly that a left-out part is not in the build when called', () => {
    expect(() => leftOut.toJSONSchema()).toThrow(/not part of Matwright's web build/);
    expect(() => leftOut.createStandardJSONSchemaMethod()()).toThrow(/JSON Schema output/);
    expect(() => new leftOut.JSONSchemaGenerator()).toThrow(/not part/);
  });

  it('is not called anywhere in the app', () => {
    const root = path.resolve(__dirname, '../..');
    const hits: string[] = [];
    const visit = (dir: string) => {
      for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
        const full = path.join(dir, entry.name);
        if (entry.isDirectory()) visit(full);
        else if (/\.tsx?$/.test(entry.name) && !entry.name.endsWith('.test.ts') && !full.endsWith('zodLeftOut.ts')) {
          const text = fs.readFileSync(full, 'utf8');
          if (/toJSONSchema|fromJSONSchema|JSONSchemaGenerator|z\.compile|~standard/.test(text)) hits.push(path.relative(root, full));
        }
      }
    };
    for (const dir of ['app', 'features', 'geometry']) visit(path.join(root, dir));
    expect(hits).toEqual([]);
  });
});
