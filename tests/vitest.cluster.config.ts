import { defineConfig } from 'vitest/config';

// The cluster tests (npm run test:cluster, which starts the Galera cluster and two API instances
// they run against): one file at a time, in the order of their names.
export default defineConfig({
  test: {
    include: ['cluster/**/*.test.ts'],
    root: new URL('.', import.meta.url).pathname,
    testTimeout: 180_000,
    hookTimeout: 90_000,
    fileParallelism: false,
    sequence: { shuffle: false },
  },
});
