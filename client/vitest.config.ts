import { defineConfig, mergeConfig } from 'vitest/config';
import viteConfig from './vite.config.ts';

export default mergeConfig(
  viteConfig,
  defineConfig({
    test: {
      environment: 'jsdom',
      include: ['src/**/*.test.{ts,tsx}'],
      setupFiles: ['./src/testing/setup-tests.ts'],
      css: false,
      restoreMocks: true,
      // jsdom renders of the Workbench take seconds on a loaded 2-core machine; the default 5 s is too tight.
      testTimeout: 20_000,
    },
  }),
);
