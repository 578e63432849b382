import { fileURLToPath, URL } from 'node:url'
import { defineConfig } from 'vitest/config'

// Three projects: unit (pure code, no services), api (supertest against the real app and MariaDB),
// e2e (playwright-core driving Debian's Chromium). scripts/test.sh prepares the database first.
// A fourth, faults, runs only on request (npm run test:faults): crash tests with their own database.
// The api and e2e files run one after another in one worker that keeps its loaded modules (isolate: false):
// loading the server's module graph again for every file cost about half of the API run. A file that changes
// process-wide state (process.env, fake timers) puts it back in its afterAll/afterEach.
// scripts/testRun.ts runs the api and e2e projects at the same time, each on a database of its own.
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
        // A bound for a loaded machine (the unit tests run beside the browser tests): never a speed check.
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node', testTimeout: 30_000 },
      },
      {
        oxc: decorators,
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          isolate: false,
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
          isolate: false,
          testTimeout: 120_000,
          hookTimeout: 180_000,
          // expect.poll gives up after 1 s unless told: a page's answer on a loaded machine (the browser, the app and
          // MariaDB share two cores with the API tests) can take longer. A bound to wait within, never a speed check.
          expect: { poll: { timeout: 10_000 } },
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
