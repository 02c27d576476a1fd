import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    globalSetup: ['test/global-setup.ts'],
    // Property tests are seeded (see test/seed.ts); a failure prints its seed and path.
    testTimeout: 60_000,
  },
});
