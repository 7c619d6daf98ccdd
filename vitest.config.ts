import { defineConfig } from 'vitest/config';
import path from 'node:path';

// Two projects: pure unit tests, and integration tests against the real PostgreSQL
// (run one file at a time in forked processes; see tests/integration/global-setup.ts).
export default defineConfig({
  resolve: { alias: { '@': path.resolve(import.meta.dirname) } },
  test: {
    projects: [
      {
        extends: true,
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' },
      },
      {
        extends: true,
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts', 'tests/security/**/*.test.ts'],
          environment: 'node',
          pool: 'forks',
          fileParallelism: false,
          globalSetup: ['tests/integration/global-setup.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
