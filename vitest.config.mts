import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('.', import.meta.url));
const alias = { '@': root, 'server-only': `${root}tests/stubs/server-only.ts` };

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        // Property tests share two cores with the planners' own searches, so 5 s is too tight.
        test: { name: 'unit', include: ['lib/**/*.test.ts', 'db/**/*.test.ts', 'storage/**/*.test.ts', 'scripts/**/*.test.mjs'], environment: 'node', testTimeout: 30_000 },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          environment: 'node',
          setupFiles: ['tests/integration/setup.ts'],
          // A guard against a hang, not a speed check: the heaviest tests (the cut-plan pool's, with four load
          // episodes of 72 parts inserted one by one) took 10-16 s on a loaded two-core run.
          testTimeout: 60_000,
          hookTimeout: 60_000,
          env: { NODE_ENV: 'test' },
        },
      },
      {
        // System tests: real HTTP against the production build (`next start`), so only this project waits for the build;
        // scripts/test.mjs runs it after `next build`, and unit + integration before.
        resolve: { alias },
        test: {
          name: 'system',
          include: ['tests/system/**/*.test.ts'],
          exclude: ['tests/system/s3/**'],
          environment: 'node',
          setupFiles: ['tests/integration/setup.ts'],
          testTimeout: 30_000,
          hookTimeout: 30_000,
          env: { NODE_ENV: 'test' },
        },
      },
      {
        resolve: { alias },
        // App processes on S3 with their background workers on: their own database (scripts/test.mjs), so
        // those workers never claim the disk-backed tests' clip jobs or mail.
        test: {
          name: 'storage-s3',
          include: ['tests/system/s3/**/*.test.ts'],
          environment: 'node',
          setupFiles: ['tests/integration/setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          env: { NODE_ENV: 'test', ...(process.env.KERFLINE_S3_DATABASE_URL ? { DATABASE_URL: process.env.KERFLINE_S3_DATABASE_URL } : {}) },
        },
      },
    ],
  },
});
