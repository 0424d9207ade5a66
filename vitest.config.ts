import { defineConfig } from 'vitest/config';
import preact from '@preact/preset-vite';

// Unit, reference and component tests. Browser tests run separately (scripts/browser-tests.mjs).
export default defineConfig({
  plugins: [preact()],
  test: {
    include: ['tests/unit/**/*.test.{ts,tsx}'],
    environment: 'node',
    testTimeout: 60_000,
    reporters: ['default'],
  },
});
