import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['shared-core/src/**/*.test.ts', 'server/src/**/*.test.ts', 'test/**/*.test.ts'],
    setupFiles: ['test/setup/fastCheck.ts'],
    testTimeout: 60_000,
  },
});
