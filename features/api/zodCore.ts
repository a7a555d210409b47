// zod's core (the checks and parsers every schema is built on) as a start-up
// step of its own, ahead of zod's schema builders (see index.ts). An ES import,
// so it is the very module zod's own entry imports, not a second copy.
import 'zod/v4/core';
