import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['src/**/__tests__/**/*.test.ts'],
    environment: 'node',
    testTimeout: 30_000,
    hookTimeout: 30_000,
    // Each file opens its own temporary SQLite databases; two workers suit the 2-core machine.
    maxWorkers: 2,
    env: { SCARF_ANALYTICS: 'false' },
  },
});
