import { defineConfig } from 'vitest/config';

// The one-minute soak (`npm test -- soak`) runs by itself, so its memory reading is not shaped
// by test workers competing for the same two cores.
export default defineConfig({
  resolve: { alias: { '@': import.meta.dirname } },
  test: {
    include: ['tests/soak/**/*.test.ts'],
    testTimeout: 300000,
    pool: 'forks',
    maxWorkers: 1,
    fileParallelism: false,
  },
});
