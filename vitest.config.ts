import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    exclude: ['test/bench/**', 'node_modules/**', 'dist/**'],
    pool: 'forks',
    testTimeout: 60000,
    hookTimeout: 60000,
  },
});
