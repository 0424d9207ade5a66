import { defineConfig } from 'vitest/config';

// WebKit browser tests: Node drives Debian's WebKitGTK (WebKitWebDriver + MiniBrowser) against the built app.
// Run through scripts/webkit-tests.mjs, which finds or installs the packages and sets the C locale.
export default defineConfig({
  test: {
    include: ['tests/browser/webkit/**/*.test.ts'],
    environment: 'node',
    testTimeout: 180_000,
    hookTimeout: 180_000,
    fileParallelism: false,
    maxWorkers: 1,
    reporters: ['default'],
  },
});
