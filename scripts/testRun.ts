// Prepares the test database (reset), migrates it, loads the demo scenario, builds the client for
// the browser tests, runs vitest and prints one summary line. When the browser tests run with others, they
// run at the same time in a second vitest on a database of their own (<name>_e2e), so the two never see
// each other's rows or settings.
import { spawn } from 'node:child_process'
import bcrypt from 'bcryptjs'
import { existsSync, readFileSync, rmSync } from 'node:fs'
import path from 'node:path'
import { loadConfig } from '../server/config.js'
import { createDataSource } from '../server/db/dataSource.js'
import { loadDemoScenario } from '../server/demo/index.js'
import { DEMO_PASSWORD, DEMO_USERS } from '../server/demo/demoUsers.js'
import { TEST_HASH_COST } from '../tests/support/testHashCost.js'
import { dataRoot, projectRoot } from './embeddedMariadb.js'
import { prepareEnvironment } from './environment.js'

const PROJECTS = ['unit', 'api', 'e2e'] as const
/** Run only when named (`npm run test:faults`): they start and kill their own database and app processes. */
const ON_REQUEST = ['faults'] as const
const KNOWN: readonly string[] = [...PROJECTS, ...ON_REQUEST]
/**
 * The test server writes its redo log at every commit and flushes it to disk about once a second (source: MariaDB
 * documentation, innodb_flush_log_at_trx_commit = 2) instead of at every commit: a disk flush per commit cost
 * several milliseconds a commit on a shared disk, and the tests commit many small transactions. The test databases
 * are made again every run, so a crash of this server loses nothing worth keeping. The crash tests (tests/faults)
 * start servers of their own that flush at every commit, and check that a committed move survives a kill -9.
 */
const TEST_SERVER_ARGS = ['--innodb-flush-log-at-trx-commit=2']

async function migrateAndLoadDemo(env: Record<string, string>) {
  const config = loadConfig({ ...process.env, ...env, NODE_ENV: 'test' })
  const ds = createDataSource(config)
  await ds.initialize()
  try {
    await ds.runMigrations({ transaction: 'each' })
    await loadDemoScenario(ds)
    // The demo users sign in at bcrypt cost 4 in the tests (tests/support/testHashCost.ts).
    await ds.query('UPDATE users SET password_hash = ? WHERE username IN (?)', [await bcrypt.hash(DEMO_PASSWORD, TEST_HASH_COST), DEMO_USERS.map((u) => u.username)])
  } finally {
    await ds.destroy()
  }
}

/**
 * The client build for the browser tests, in the background (it overlaps the database preparation). Built in
 * mode `test`: a production build that still checks every answer against its schema (src/api/client.ts).
 */
function buildClient(outDir: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(path.join(projectRoot, 'node_modules/.bin/vite'), ['build', '--mode', 'test', '--logLevel', 'error', '--outDir', outDir, '--emptyOutDir'], {
      cwd: projectRoot,
      stdio: 'inherit',
      env: { ...process.env, LUMENYARD_PRECOMPRESS: '0' }, // no .gz/.br files: the browser tests don't need them
    })
    child.on('exit', (code) => (code === 0 ? resolve() : reject(new Error('The client build failed.'))))
  })
}

interface VitestRun { projects: string[]; env: Record<string, string>; resultsFile: string }

/**
 * Runs vitest for some projects. With `prefixLines`, its output is passed on whole lines at a time, so two
 * runs at once interleave by line (and vitest, writing to a pipe, prints plain lines, not a live summary).
 */
function runVitest(run: VitestRun, filters: string[], prefixLines: boolean): Promise<number> {
  const args = ['run', ...run.projects.flatMap((p) => ['--project', p]), ...filters, '--passWithNoTests',
    '--reporter=default', '--reporter=json', `--outputFile.json=${run.resultsFile}`]
  rmSync(run.resultsFile, { force: true })
  return new Promise((resolve) => {
    const child = spawn(path.join(projectRoot, 'node_modules/.bin/vitest'), args, {
      cwd: projectRoot,
      stdio: prefixLines ? ['ignore', 'pipe', 'pipe'] : 'inherit',
      env: { ...process.env, ...run.env, ...(prefixLines && process.stdout.isTTY ? { FORCE_COLOR: '1' } : {}) },
    })
    if (prefixLines) {
      for (const [from, to] of [[child.stdout!, process.stdout], [child.stderr!, process.stderr]] as const) {
        let rest = ''
        from.on('data', (d: Buffer) => {
          const text = rest + d.toString()
          const cut = text.lastIndexOf('\n') + 1
          if (cut) to.write(text.slice(0, cut))
          rest = text.slice(cut)
        })
        from.on('end', () => rest && to.write(rest + '\n'))
      }
    }
    child.on('exit', (code) => resolve(code ?? 1))
  })
}

interface Results {
  numPassedTests: number
  numFailedTests: number
  numPendingTests: number
  testResults: { status: string; assertionResults: unknown[] }[]
}

function summarise(resultsFiles: string[]): string {
  let passed = 0
  let failed = 0
  let skipped = 0
  for (const file of resultsFiles) {
    if (!existsSync(file)) {
      failed++
      continue
    }
    const r = JSON.parse(readFileSync(file, 'utf8')) as Results
    // A file that failed to load counts as a failure even though none of its tests ran.
    const brokenFiles = r.testResults.filter((f) => f.status === 'failed' && f.assertionResults.length === 0).length
    passed += r.numPassedTests
    failed += r.numFailedTests + brokenFiles
    skipped += r.numPendingTests
  }
  return `tests: ${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`
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
  const withE2e = projects.includes('e2e')
  const others = projects.filter((p) => p !== 'e2e')
  const needsDb = projects.some((p) => p === 'api' || p === 'e2e')
  // The browser tests run beside the others, on a database of their own (on the same MariaDB instance), when
  // both kinds are asked for and the embedded instance is used (an existing server has only the one database).
  const beside = withE2e && others.length > 0 && !process.env.LUMENYARD_DB_PASSWORD
  const outDir = path.join(dataRoot, 'test', `dist-${database}`)
  const built = withE2e ? buildClient(outDir) : Promise.resolve()
  built.catch(() => undefined) // awaited below; this keeps an early failure from being unhandled meanwhile
  const runs: VitestRun[] = []
  const resultsFile = (db: string) => path.join(dataRoot, 'test', `results-${db}.json`)
  let stop = async () => {}
  try {
    if (beside) {
      const primary = await prepareEnvironment('test', { database, reset: true, serverArgs: TEST_SERVER_ARGS })
      const e2e = await prepareEnvironment('test', { database: `${database}_e2e`, reset: true, serverArgs: TEST_SERVER_ARGS })
      stop = primary.stop
      await Promise.all([migrateAndLoadDemo({ ...env, ...primary.env }), migrateAndLoadDemo({ ...env, ...e2e.env })])
      runs.push({ projects: others, env: { ...env, ...primary.env }, resultsFile: resultsFile(database) })
      runs.push({ projects: ['e2e'], env: { ...env, ...e2e.env, LUMENYARD_CLIENT_DIST: outDir }, resultsFile: resultsFile(`${database}_e2e`) })
    } else {
      if (needsDb) {
        const prepared = await prepareEnvironment('test', { database, reset: true, serverArgs: TEST_SERVER_ARGS })
        stop = prepared.stop
        Object.assign(env, prepared.env)
        await migrateAndLoadDemo(env)
      }
      runs.push({ projects, env: { ...env, ...(withE2e ? { LUMENYARD_CLIENT_DIST: outDir } : {}) }, resultsFile: resultsFile(database) })
    }
    await built
  } catch (err) {
    await stop().catch((e) => console.error(e))
    throw err
  }
  let codes: number[] = []
  try {
    codes = await Promise.all(runs.map((run) => runVitest(run, filters, runs.length > 1)))
  } finally {
    await stop().catch((e) => console.error(e))
  }
  console.log(`\n${summarise(runs.map((r) => r.resultsFile))} (${Math.round((Date.now() - started) / 1000)} s)`)
  process.exit(codes.every((c) => c === 0) ? 0 : 1)
}

main().catch((err) => {
  console.error(`lumenyard tests: ${err instanceof Error ? err.stack : err}`)
  process.exit(1)
})
