import { defineConfig } from 'vitest/config';

// Browser tests: Node drives Debian Chromium (playwright-core) against built copies of the app.
// One file at a time: two cores, one browser.
export default defineConfig({
  test: {
    include: ['tests/browser/**/*.test.ts'],
    // WebKit has its own pass (vitest.webkit.config.ts, scripts/webkit-tests.mjs).
    exclude: ['tests/browser/webkit/**', '**/node_modules/**'],
    environment: 'node',
    testTimeout: 180_000,
    hookTimeout: 180_000,
    fileParallelism: false,
    maxWorkers: 1,
    reporters: ['default'],
  },
});
