import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    environment: 'node',
    // Time is not what these tests check (benchmarks print speed); a loaded 2-core machine must not fail them.
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
