// `npm run build:web`: the web app exported to dist/ and finished for phones
// (hashed woff2 fonts preloaded, brotli and gzip copies), and the bundle that
// draws signed-in pages on the server in dist-pages/; see exportWeb.mjs.
import path from 'node:path';
import { exportWeb } from './exportWeb.mjs';

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');
const { files } = exportWeb(root);
process.stdout.write(`dist/ is ready: ${files} files pre-compressed; dist-pages/render.cjs draws signed-in pages\n`);
