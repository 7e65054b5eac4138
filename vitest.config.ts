// Unit, contract, property and component tests. End-to-end tests have their own config.
import { defineConfig } from 'vitest/config';
import vue from '@vitejs/plugin-vue';

export default defineConfig({
  plugins: [vue()],
  test: {
    globals: true,
    // Time limits guard against hangs, not speed (speed is `npm run bench`): generous enough for
    // a busy 2-core machine, where a report or a spawned CLI can take several seconds.
    testTimeout: 30_000,
    projects: [
      {
        extends: true,
        test: {
          name: 'node',
          environment: 'node',
          include: ['test/**/*.test.ts'],
          exclude: ['test/renderer/**', 'test/e2e/**'],
        },
      },
      {
        extends: true,
        test: {
          name: 'renderer',
          environment: 'happy-dom',
          include: ['test/renderer/**/*.test.ts'],
          setupFiles: ['test/renderer/setup.ts'],
        },
      },
    ],
  },
});
