import { defineConfig } from 'vitest/config';

// The one-minute soak runs by itself, last in `npm test` (or alone: `npm test -- soak`), so its memory reading is not shaped
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
