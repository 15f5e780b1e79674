import path from 'node:path';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  resolve: { alias: { '@': import.meta.dirname } },
  test: {
    include: ['tests/unit/**/*.test.ts', 'tests/api/**/*.test.ts'],
    // The one-minute soak (tests/soak) runs after the other suites, alone (vitest.soak.config.mts).
    globalSetup: ['tests/support/globalSetup.ts'],
    testTimeout: 30000,
    hookTimeout: 60000,
    pool: 'forks',
    maxWorkers: 2,
  },
});
