// What the web build puts in place of the parts of zod the app never calls (see
// metro.config.cjs): JSON Schema output and input (toJSONSchema, fromJSONSchema and
// their per-type converters) and z.compile (which needs `new Function`, refused by the
// app's Content-Security-Policy). About 70 KB of the first download otherwise.
// Every name those modules export is here, so nothing imported from them is
// silently undefined; calling one says plainly that it is not in this build.

function leftOut(what: string): (...args: unknown[]) => never {
  return () => {
    throw new Error(`${what} is not part of Matwright's web build`);
  };
}

// zod/v4/core/compile.js
export const INVALID = Symbol.for('zod.compile.invalid');
export class ZodCompileAsyncError extends Error {}
export class ZodCompileUnsupportedError extends Error {}
export const compile = leftOut('z.compile');
export const compileFn = leftOut('z.compile');
export const withParser = leftOut('z.compile');

// zod/v4/core/to-json-schema.js
export const initializeContext = leftOut('JSON Schema output');
export const handleUnrepresentable = leftOut('JSON Schema output');
export const processSchema = leftOut('JSON Schema output');
export { processSchema as process };
export const extractDefs = leftOut('JSON Schema output');
export const finalize = leftOut('JSON Schema output');
/** Schemas make these when built; only calling the method they return would need the real thing. */
export const createToJSONSchemaMethod = (): ((...args: unknown[]) => never) => leftOut('JSON Schema output');
export const createStandardJSONSchemaMethod = (): ((...args: unknown[]) => never) => leftOut('JSON Schema output');

// zod/v4/core/json-schema-processors.js (the per-type converters are looked up only while converting)
export const aggregateChecks = leftOut('Reading checks back from a schema');
export const allProcessors = {};
export const toJSONSchema = leftOut('JSON Schema output');

// zod/v4/core/json-schema-generator.js and zod/v4/classic/from-json-schema.js
export class JSONSchemaGenerator {
  constructor() {
    leftOut('JSON Schema output')();
  }
}
export const fromJSONSchema = leftOut('JSON Schema input');
