import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['src/**/__tests__/**/*.test.ts'],
    environment: 'node',
    testTimeout: 30_000,
    hookTimeout: 60_000,
    // Each test starts the built CLI as a child process; two workers suit the 2-core machine.
    maxWorkers: 2,
    env: { SCARF_ANALYTICS: 'false' },
  },
});
