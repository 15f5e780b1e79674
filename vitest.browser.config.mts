import path from 'node:path';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  resolve: { alias: { '@': import.meta.dirname } },
  test: {
    include: ['tests/browser/**/*.test.ts'],
    globalSetup: ['tests/browser/globalSetup.ts'],
    testTimeout: 90000,
    hookTimeout: 120000,
    pool: 'forks',
    maxWorkers: 1,
    fileParallelism: false,
  },
});
