// Prepares the test database (reset), migrates it, loads the demo scenario, builds the client for
// the browser tests, runs vitest and prints one summary line.
import { spawn, spawnSync } from 'node:child_process'
import { existsSync, readFileSync, rmSync } from 'node:fs'
import path from 'node:path'
import { loadConfig } from '../server/config.js'
import { createDataSource } from '../server/db/dataSource.js'
import { loadDemoScenario } from '../server/demo/index.js'
import { dataRoot, projectRoot } from './embeddedMariadb.js'
import { prepareEnvironment } from './environment.js'

const PROJECTS = ['unit', 'api', 'e2e'] as const
/** Run only when named (`npm run test:faults`): they start and kill their own database and app processes. */
const ON_REQUEST = ['faults'] as const
const KNOWN: readonly string[] = [...PROJECTS, ...ON_REQUEST]

async function migrateAndLoadDemo(env: Record<string, string>) {
  const config = loadConfig({ ...process.env, ...env, NODE_ENV: 'test' })
  const ds = createDataSource(config)
  await ds.initialize()
  try {
    await ds.runMigrations({ transaction: 'each' })
    await loadDemoScenario(ds)
  } finally {
    await ds.destroy()
  }
}

function buildClient(outDir: string) {
  const res = spawnSync(path.join(projectRoot, 'node_modules/.bin/vite'), ['build', '--logLevel', 'error', '--outDir', outDir, '--emptyOutDir'], {
    cwd: projectRoot,
    stdio: 'inherit',
    env: { ...process.env, LUMENYARD_PRECOMPRESS: '0' }, // no .gz/.br files: the browser tests don't need them
  })
  if (res.status !== 0) throw new Error('The client build failed.')
}

function runVitest(projects: string[], filters: string[], env: Record<string, string>, resultsFile: string): Promise<number> {
  const args = ['run', ...projects.flatMap((p) => ['--project', p]), ...filters, '--reporter=default', '--reporter=json', `--outputFile.json=${resultsFile}`]
  return new Promise((resolve) => {
    const child = spawn(path.join(projectRoot, 'node_modules/.bin/vitest'), args, {
      cwd: projectRoot,
      stdio: 'inherit',
      env: { ...process.env, ...env },
    })
    child.on('exit', (code) => resolve(code ?? 1))
  })
}

function summarise(resultsFile: string): string {
  if (!existsSync(resultsFile)) return 'tests: 0 passed, 1 failed'
  const r = JSON.parse(readFileSync(resultsFile, 'utf8')) as {
    numPassedTests: number
    numFailedTests: number
    numPendingTests: number
    testResults: { status: string; assertionResults: unknown[] }[]
  }
  // A file that failed to load counts as a failure even though none of its tests ran.
  const brokenFiles = r.testResults.filter((f) => f.status === 'failed' && f.assertionResults.length === 0).length
  const failed = r.numFailedTests + brokenFiles
  const skipped = r.numPendingTests ? `, ${r.numPendingTests} skipped` : ''
  return `tests: ${r.numPassedTests} passed, ${failed} failed${skipped}`
}

async function main() {
  const args = process.argv.slice(2)
  const wanted = args.filter((a) => KNOWN.includes(a))
  // Anything else narrows the run to matching test files (vitest filters), e.g. tests/api/stock.
  const filters = args.filter((a) => !KNOWN.includes(a))
  const projects = wanted.length ? wanted : [...PROJECTS]
  const database = process.env.LUMENYARD_TEST_DB ?? 'lumenyard_test'
  const started = Date.now()
  const env: Record<string, string> = { NODE_ENV: 'test', LUMENYARD_LOG_LEVEL: process.env.LUMENYARD_LOG_LEVEL ?? 'silent' }
  const needsDb = projects.some((p) => p === 'api' || p === 'e2e')
  let stop = async () => {}
  if (needsDb) {
    const prepared = await prepareEnvironment('test', { database, reset: true })
    stop = prepared.stop
    Object.assign(env, prepared.env)
    await migrateAndLoadDemo(env)
  }
  if (projects.includes('e2e')) {
    const outDir = path.join(dataRoot, 'test', `dist-${database}`)
    buildClient(outDir)
    env.LUMENYARD_CLIENT_DIST = outDir
  }
  const resultsFile = path.join(dataRoot, 'test', `results-${database}.json`)
  rmSync(resultsFile, { force: true })
  let code = 1
  try {
    code = await runVitest(projects, filters, env, resultsFile)
  } finally {
    await stop().catch((e) => console.error(e))
  }
  console.log(`\n${summarise(resultsFile)} (${Math.round((Date.now() - started) / 1000)} s)`)
  process.exit(code)
}

main().catch((err) => {
  console.error(`lumenyard tests: ${err instanceof Error ? err.stack : err}`)
  process.exit(1)
})
