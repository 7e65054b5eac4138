// End-to-end: builds the browser preview, serves it on 127.0.0.1 and drives Debian's Chromium.
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/e2e/**/*.e2e.ts'],
    environment: 'node',
    testTimeout: 60_000,
    hookTimeout: 120_000,
    fileParallelism: false,
    globalSetup: ['test/e2e/global-setup.ts'],
  },
});
