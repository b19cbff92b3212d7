import { defineConfig } from 'vitest/config';
import path from 'node:path';

const alias = { '@': path.resolve(import.meta.dirname) };

/**
 * Two projects: "unit" (pure lib/ code, parallel, no services) and "integration" (database, API
 * over HTTP against the production build, end-to-end in Chromium; one file at a time, with the
 * server and fakes started once by the global setup).
 */
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: { name: 'unit', include: ['tests/lib/**/*.test.ts'], environment: 'node', testTimeout: 60_000 },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: ['tests/{api,e2e,jobs}/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/helpers/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
