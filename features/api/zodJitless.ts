// zod as the web build gives it to the app's modules: metro.config.cjs resolves every
// `from 'zod'` in the app to this module, so its setting comes before any schema is built.
// zod compiles object parsers with `new Function` when it may, and probes for it with
// a caught `new Function("")` when an object schema is made. The app's
// Content-Security-Policy has no 'unsafe-eval', so the probe alone is reported as a
// violation; jitless mode skips both.
import { z } from 'zod';

z.config({ jitless: true });

export * from 'zod';
