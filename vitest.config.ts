import { configDefaults, defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

const alias = {
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
  '@': fileURLToPath(new URL('./src', import.meta.url)),
};

// Four projects: pure unit tests (no services), API tests against the real
// PostgreSQL started by scripts/test.mjs, the clip/marking/fit API tests again
// on the S3 fake, and browser tests in Debian's chromium.
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          sequence: { groupOrder: 0 },
          include: ['tests/unit/**/*.test.ts', 'tests/architecture/**/*.test.ts', 'shared/**/*.test.ts', 'src/**/*.test.ts', 'server/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          // api and api-s3 share one database and the demo team: they run one after the other.
          sequence: { groupOrder: 0 },
          include: ['tests/api/**/*.test.ts'],
          // Storage tests need the S3 fake and its workers: they belong to api-s3.
          exclude: [...configDefaults.exclude, 'tests/api/storage-*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/support/api-global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
      {
        resolve: { alias },
        test: {
          // The clip, marking and fit suites again with clips in the S3 fake, the in-process
          // worker off and two `npm run worker` processes (tests/support/api-s3-global-setup.ts).
          // The worker-kill test of local disk has its S3 twin in storage-s3-workers.test.ts.
          name: 'api-s3',
          sequence: { groupOrder: 1 },
          include: ['tests/api/clips-*.test.ts', 'tests/api/marking-*.test.ts', 'tests/api/fit-*.test.ts', 'tests/api/storage-*.test.ts'],
          exclude: [...configDefaults.exclude, 'tests/api/clips-worker-resilience.test.ts'],
          environment: 'node',
          globalSetup: ['tests/support/api-global-setup.ts', 'tests/support/api-s3-global-setup.ts'],
          testTimeout: 120_000,
          hookTimeout: 180_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          sequence: { groupOrder: 1 },
          include: ['tests/e2e/**/*.e2e.ts'],
          environment: 'node',
          globalSetup: ['tests/support/e2e-global-setup.ts'],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
