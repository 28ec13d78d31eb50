import { defineConfig } from 'vitest/config';

/**
 * Editor end-to-end tests (`npm run test:editor`): real editors, so one file at a time, long hooks
 * (the first code-server build takes minutes), and nothing of the unit suite.
 */
export default defineConfig({
  test: {
    root: new URL('../..', import.meta.url).pathname,
    include: ['test/editor/**/*.e2e.ts'],
    fileParallelism: false,
    // Verbose, so a skipped suite shows its reason (in its title) in the closing output.
    reporters: ['verbose'],
    testTimeout: 120_000,
    hookTimeout: 15 * 60_000,
  },
});
