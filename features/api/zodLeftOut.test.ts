import fs from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import { projectRoot, sourceFiles } from '../test/sourceFiles';
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
    const hits = sourceFiles('app', 'features', 'geometry')
      .filter((file) => !file.endsWith('zodLeftOut.ts'))
      .filter((file) => /toJSONSchema|fromJSONSchema|JSONSchemaGenerator|z\.compile|~standard/.test(fs.readFileSync(file, 'utf8')))
      .map((file) => path.relative(projectRoot, file));
    expect(hits).toEqual([]);
  });
});
