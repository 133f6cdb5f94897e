import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    testTimeout: 30_000,
    hookTimeout: 30_000,
    // Each file starts its own server and database; run files one after another on 2 cores.
    fileParallelism: false,
  },
});
