import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('.', import.meta.url));
const alias = {
  '@': root.replace(/\/$/, ''),
  // Server-only modules are imported by data functions under test; the guard is for bundles.
  'server-only': fileURLToPath(new URL('./tests/support/empty.ts', import.meta.url)),
};

// Fast password hashing in tests; the cost travels inside each hash, production uses 2^17.
const env = { SCRYPT_LOG_N: '12' };

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          env,
          name: 'unit',
          include: [
            'tests/domain/**/*.test.ts',
            'tests/unit/**/*.test.ts',
            'tests/fakes/**/*.test.ts',
            'tests/pdf/**/*.test.ts',
          ],
          testTimeout: 30_000,
        },
      },
      {
        resolve: { alias },
        test: {
          env,
          name: 'db',
          include: ['tests/data/**/*.test.ts'],
          globalSetup: ['tests/support/db-setup.ts'],
          setupFiles: ['tests/support/next-mocks.ts'],
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
      {
        resolve: { alias },
        test: {
          env,
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/support/e2e-setup.ts'],
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 600_000,
        },
      },
    ],
  },
});
