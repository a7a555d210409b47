// Writes Expo Router's route types (.expo/types/router.d.ts) from the app/
// folder, the same declarations `expo start` writes, so `npm run typecheck`
// checks every Link and router.push against the real routes without a dev server.
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import path from 'node:path';

const root = path.dirname(path.dirname(fileURLToPath(import.meta.url)));
const require = createRequire(path.join(root, 'package.json'));
process.env.EXPO_ROUTER_APP_ROOT = path.join(root, 'app');
import { mkdirSync } from 'node:fs';
mkdirSync(path.join(root, '.expo', 'types'), { recursive: true });
const typedRoutes = require('@expo/router-server/build/typed-routes');
typedRoutes.regenerateDeclarations(path.join(root, '.expo', 'types'), {});
