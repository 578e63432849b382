import { fileURLToPath, URL } from 'node:url'
import { defineConfig } from 'vitest/config'

// Three projects: unit (pure code, no services), api (supertest against the real app and MariaDB),
// e2e (playwright-core driving Debian's Chromium). scripts/test.sh prepares the database first.
// A fourth, faults, runs only on request (npm run test:faults): crash tests with their own database.
const decorators = { decorator: { legacy: true, emitDecoratorMetadata: true } }
// The client's aliases, for unit tests of client modules that run without a browser (message files, error words).
const alias = {
  '@': fileURLToPath(new URL('./src', import.meta.url)),
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
}

export default defineConfig({
  oxc: decorators,
  test: {
    projects: [
      {
        oxc: decorators,
        resolve: { alias },
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' },
      },
      {
        oxc: decorators,
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
      {
        oxc: decorators,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 180_000,
        },
      },
      {
        oxc: decorators,
        test: {
          name: 'faults',
          include: ['tests/faults/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 180_000,
          hookTimeout: 240_000,
        },
      },
    ],
  },
})
