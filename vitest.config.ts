import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    environment: 'node',
    // Builds the `linewright` command from the current source before the CLI tests spawn it.
    globalSetup: ['test/globalSetup.ts'],
    // Time is not what these tests check (benchmarks print speed); a loaded 2-core machine must not fail them.
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
