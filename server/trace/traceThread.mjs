// Entry for worker threads: loads the TypeScript task through tsx, so the
// pool works both under `node --import tsx` and inside the test runner.
import { tsImport } from 'tsx/esm/api';

const task = await tsImport('./traceTask.ts', import.meta.url);
export default task.default.default ?? task.default;
