// Entry of the compute threads. In production it loads the bundle that
// `npm run build:server` writes (plain JavaScript, nothing compiled at run
// time); otherwise it loads the TypeScript through tsx, which works both
// under `node --import tsx` and inside the test runner.
import fs from 'node:fs';

const built = new URL('../../dist-server/computeTask.mjs', import.meta.url);
const useBuilt = process.env.NODE_ENV === 'production' && fs.existsSync(built);
const loaded = useBuilt ? await import(built.href) : await (await import('tsx/esm/api')).tsImport('./computeTask.ts', import.meta.url);
export default loaded.default.default ?? loaded.default;
