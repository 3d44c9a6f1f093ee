import { defineConfig, mergeConfig } from 'vitest/config';
import viteConfig from './vite.config.ts';

export default mergeConfig(
  viteConfig,
  defineConfig({
    test: {
      environment: 'jsdom',
      globals: true,
      include: ['src/**/*.test.{ts,tsx}'],
      setupFiles: ['./src/testing/setup-tests.ts'],
      css: false,
      restoreMocks: true,
      unstubGlobals: true,
      // Typing through a whole form takes a few seconds on a busy 2-core machine.
      testTimeout: 20_000,
    },
  }),
);
