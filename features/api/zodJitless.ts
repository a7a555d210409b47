import { z } from 'zod';

// zod compiles object parsers with `new Function` when it may, and probes for it with
// a caught `new Function("")`. The app's Content-Security-Policy has no 'unsafe-eval',
// so the probe alone is reported as a violation; jitless mode skips both.
// index.ts imports this before anything else, so no schema is built earlier.
z.config({ jitless: true });
