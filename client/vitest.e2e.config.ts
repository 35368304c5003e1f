import { defineConfig } from 'vitest/config';

/** Browser journeys: real server (built), real PostgreSQL, Debian chromium. Run after `npm run build`. */
export default defineConfig({
  test: {
    environment: 'node',
    include: ['e2e/**/*.e2e.test.ts'],
    globalSetup: ['./e2e/global-setup.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    fileParallelism: false,
  },
});
