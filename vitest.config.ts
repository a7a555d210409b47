import { fileURLToPath } from 'node:url';
import { configDefaults, defineConfig } from 'vitest/config';

const alias = { '@': fileURLToPath(new URL('./', import.meta.url)) };

// Two projects: pure code runs in parallel with no services; server tests share
// one fresh Postgres database created by the global setup, so they run in series.
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['geometry/**/*.test.ts', 'features/**/*.test.ts', 'server/quotes/**/*.test.ts'],
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          include: ['server/**/*.test.ts', 'db/**/*.test.ts', 'scripts/**/*.test.ts'],
          // Pure quote arithmetic runs with the unit tests.
          exclude: [...configDefaults.exclude, 'server/quotes/**'],
          globalSetup: ['./server/test/globalSetup.ts'],
          testTimeout: 20000,
          hookTimeout: 60000,
          fileParallelism: false,
        },
      },
    ],
  },
});
