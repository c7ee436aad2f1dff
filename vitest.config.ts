import { fileURLToPath, URL } from 'node:url';
import { defineConfig } from 'vitest/config';

const alias = {
  '@shared': fileURLToPath(new URL('./shared/src', import.meta.url)),
  '@': fileURLToPath(new URL('./frontend/src', import.meta.url)),
};

// Three suites: pure unit and reference checks, API tests against real PostgreSQL,
// and browser tests in Chromium. scripts/test.ts provides the database for the last two.
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        // Reference checks run whole optimisations (every candidate simulated): 30 s each on 2 cores.
        test: { name: 'unit', include: ['shared/**/*.test.ts', 'tests/unit/**/*.test.ts', 'tests/reference/**/*.test.ts', 'frontend/**/*.test.ts'], environment: 'node', testTimeout: 30_000 },
      },
      {
        resolve: { alias },
        test: { name: 'api', include: ['tests/api/**/*.test.ts'], environment: 'node', testTimeout: 90_000, hookTimeout: 60_000 },
      },
      {
        resolve: { alias },
        test: { name: 'e2e', include: ['tests/e2e/**/*.test.ts'], environment: 'node', testTimeout: 120_000, hookTimeout: 120_000, fileParallelism: false },
      },
      {
        // Stops PostgreSQL for real: scripts/test.ts runs it alone, after the others.
        resolve: { alias },
        test: { name: 'outage', include: ['tests/outage/**/*.test.ts'], environment: 'node', testTimeout: 60_000, hookTimeout: 60_000 },
      },
    ],
  },
});
