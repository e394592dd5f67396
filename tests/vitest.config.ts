import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['reference/**/*.test.ts', 'parity/**/*.test.ts'],
    environment: 'node',
    testTimeout: 20_000,
  },
});
