import { defineConfig } from 'vitest/config';

/**
 * The robustness suites (tests/robustness): fuzzing, load, faults, security. One file at a
 * time (they start servers and measure throughput on a shared 2-core machine), loopback only.
 */
export default defineConfig({
  test: {
    include: ['robustness/**/*.test.ts'],
    environment: 'node',
    testTimeout: 120_000,
    hookTimeout: 60_000,
    fileParallelism: false,
    maxWorkers: 1,
    env: { SCARF_ANALYTICS: 'false' },
  },
});
