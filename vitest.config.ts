import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

export default defineConfig({
  resolve: {
    alias: { '@': fileURLToPath(new URL('./', import.meta.url)) },
  },
  test: {
    include: ['geometry/**/*.test.ts', 'features/**/*.test.ts', 'server/**/*.test.ts', 'db/**/*.test.ts', 'scripts/**/*.test.ts'],
    globalSetup: ['./server/test/globalSetup.ts'],
    testTimeout: 20000,
    hookTimeout: 60000,
    fileParallelism: false,
  },
});
