import { defineConfig } from 'vitest/config';

/** Browser tests: the built app served by the real server entry point, driven by Debian's Chromium. */
export default defineConfig({
  test: {
    include: ['tests/browser/**/*.test.ts'],
    environment: 'node',
    pool: 'forks',
    fileParallelism: false,
    testTimeout: 180_000,
    hookTimeout: 180_000,
  },
});
