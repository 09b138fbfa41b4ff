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
        test: { name: 'unit', include: ['lib/**/*.test.ts', 'db/**/*.test.ts'], environment: 'node', testTimeout: 30_000 },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          exclude: ['tests/integration/s3/**'],
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
          include: ['tests/integration/s3/**/*.test.ts'],
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
