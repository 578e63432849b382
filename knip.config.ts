// knip (npm run unused, part of npm run lint): files nobody imports, exports nobody imports, dependencies nobody
// uses. The entries are what runs on its own: the server and its workers, the client and its worker, the scripts the
// npm scripts start (through bash, which knip does not read), the benchmarks and every test file.
import type { KnipConfig } from 'knip'

const config: KnipConfig = {
  entry: [
    'server/main.ts',
    'server/services/counter/computeWorker.ts',
    'src/workers/*.worker.ts',
    'scripts/*.ts',
    'scripts/bench/run.ts',
    'scripts/bench/serveApp.ts',
    'scripts/bench/floorServer.ts',
    'scripts/bench/gridTrace.ts', // run by hand (its header says how)
    'scripts/bench/floorPages/{grid,signin}.ts',
    'scripts/bench/floorPages/vite.config.ts',
    'tests/**/*.test.ts',
  ],
  project: ['server/**/*.ts', 'src/**/*.{ts,vue}', 'shared/**/*.ts', 'scripts/**/*.{ts,vue}', 'tests/**/*.ts'],
  // An export its own file uses is a file's public face (a constant a test may read): only exports nobody uses count.
  ignoreExportsUsedInFile: true,
  // Debian's programs the tests call as outside checkers (scripts/test.sh installs them).
  ignoreBinaries: ['soffice', 'pdftotext', 'pdftoppm', 'zbarimg'],
  ignoreDependencies: [
    // Not imported: pinned so the lint rules @vue/eslint-config-typescript loads (its range is ^8) stay one exact version.
    'typescript-eslint',
  ],
}

export default config
