import { defineConfig } from 'vitest/config';

// Browser tests: Node drives Debian Chromium (playwright-core) against built copies of the app.
// One file at a time: two cores, one browser.
export default defineConfig({
  test: {
    include: ['tests/browser/**/*.test.ts'],
    environment: 'node',
    testTimeout: 180_000,
    hookTimeout: 180_000,
    fileParallelism: false,
    maxWorkers: 1,
    reporters: ['default'],
  },
});
