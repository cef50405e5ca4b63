import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    root: '.',
    include: ['tests/**/*.test.ts'],
    environment: 'node',
    testTimeout: 60_000,
    hookTimeout: 120_000,
    // Two cores on CI: keep workers modest so raster-heavy suites do not thrash.
    maxWorkers: 2,
  },
});
