import { defineConfig } from 'vitest/config';

// End-to-end tests (playwright-core driving Debian's chromium against the app that npm test
// starts) and cross-package checks. One file at a time: a browser is heavy on two cores.
export default defineConfig({
  test: {
    include: ['e2e/**/*.test.ts', 'checks/**/*.test.ts'],
    root: new URL('.', import.meta.url).pathname,
    testTimeout: 90_000,
    hookTimeout: 90_000,
    fileParallelism: false,
  },
});
