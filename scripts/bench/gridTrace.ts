// Where a cold load of the stock grid spends its time, in Chromium: every request with its start and end
// relative to navigation (the browser's Resource Timing entries), the scripts' sizes, the main thread's
// script and task time (the DevTools protocol's Performance.getMetrics), and the first frame with rows.
// Not a measure with a floor (that is `npm run bench -- --only=grid`): a look inside one load.
//
//   BENCH_PORT_BASE=5796 LUMENYARD_DB_PORT=3467 npx tsx --tsconfig tsconfig.server.json scripts/bench/gridTrace.ts [--size=demo] [--runs=3] [--reuse-build] [--profile]
//
// --profile samples the main thread's JavaScript (the DevTools protocol's Profiler) from navigation to the first
// rows of the last run, and prints the self time per script file and the busiest functions; with TRACE_PROFILE_OUT=<file>
// it also writes that profile (DevTools' .cpuprofile format) for a closer look. TRACE_CHROME_OUT=<file> writes the
// last run's Chromium trace (every process's main thread, script compilation, loading), for DevTools' Performance panel.
import { spawnSync } from 'node:child_process'
import { existsSync, writeFileSync } from 'node:fs'
import path from 'node:path'
import { parseArgs } from 'node:util'
import { dataRoot, projectRoot } from '../embeddedMariadb.js'
import { launchChromium } from './browser.js'
import { BENCH_PASSWORD, makeFixtures, openDatabase, type Size } from './data.js'
import { signIn } from './http.js'
import { startNodeServer } from './servers.js'
import { median } from './stats.js'

const { values: opts } = parseArgs({
  options: { size: { type: 'string', default: 'demo' }, runs: { type: 'string', default: '3' }, 'reuse-build': { type: 'boolean', default: false }, profile: { type: 'boolean', default: false }, path: { type: 'string', default: '/stock/overview' } },
})
const dist = path.join(dataRoot, 'bench', 'trace-dist')
if (!(opts['reuse-build'] && existsSync(dist))) {
  const res = spawnSync(path.join(projectRoot, 'node_modules/.bin/vite'), ['build', '--logLevel', 'error', '--outDir', dist, '--emptyOutDir'], { cwd: projectRoot, stdio: 'inherit' })
  if (res.status !== 0) throw new Error('vite build failed')
}

interface CpuProfile {
  nodes: { id: number; callFrame: { functionName: string; url: string; lineNumber: number }; children?: number[] }[]
  samples: number[]
  timeDeltas: number[]
}

/** Self time per script file and the busiest functions of a CPU profile (the main thread's JavaScript). */
function printProfile(profile: CpuProfile): void {
  const byId = new Map(profile.nodes.map((n) => [n.id, n]))
  const self = new Map<number, number>()
  profile.samples.forEach((id, i) => self.set(id, (self.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0) / 1000))
  const byFile = new Map<string, number>()
  const byFunction = new Map<string, number>()
  for (const [id, ms] of self) {
    const frame = byId.get(id)!.callFrame
    const file = frame.url ? new URL(frame.url).pathname : `(${frame.functionName || 'engine'})`
    byFile.set(file, (byFile.get(file) ?? 0) + ms)
    const fn = `${frame.functionName || '(anonymous)'} ${file}:${frame.lineNumber + 1}`
    byFunction.set(fn, (byFunction.get(fn) ?? 0) + ms)
  }
  const top = (m: Map<string, number>, n: number) => [...m].sort((a, b) => b[1] - a[1]).slice(0, n)
  console.log(`\nJavaScript self time before the first rows, per file (sampled, ${[...self.values()].reduce((s, v) => s + v, 0).toFixed(0)} ms in all):`)
  for (const [file, ms] of top(byFile, 25)) console.log(`  ${ms.toFixed(1).padStart(7)} ms  ${file}`)
  console.log('busiest functions:')
  for (const [fn, ms] of top(byFunction, 30)) console.log(`  ${ms.toFixed(1).padStart(7)} ms  ${fn}`)
}

interface Entry { name: string; start: number; end: number; type: string; bytes: number }

const db = await openDatabase(opts.size as Size, { rebuild: false }, console.log)
const fx = await makeFixtures(db.ds)
const port = Number(process.env.BENCH_PORT_BASE ?? 5690) + 5
const app = await startNodeServer('Lumenyard', 'scripts/bench/serveApp.ts', {
  ...db.env, NODE_ENV: 'production', LUMENYARD_SECURE_COOKIES: 'false', LUMENYARD_LOG_LEVEL: 'warn', LUMENYARD_CLIENT_DIST: dist, LUMENYARD_HOST: '127.0.0.1', LUMENYARD_PORT: String(port),
})
const browser = await launchChromium()
try {
  const [cookie] = await signIn(app.url, [fx.admin], BENCH_PASSWORD)
  const firsts: number[] = []
  for (let run = 0; run < Number(opts.runs); run++) {
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } })
    const [name, value] = cookie.split('=')
    await context.addCookies([{ name, value, url: app.url }])
    const page = await context.newPage()
    const cdp = await context.newCDPSession(page)
    await cdp.send('Performance.enable')
    const profiling = opts.profile && run === Number(opts.runs) - 1
    if (profiling) {
      await cdp.send('Profiler.enable')
      await cdp.send('Profiler.setSamplingInterval', { interval: 200 })
      await cdp.send('Profiler.start')
    }
    const tracing = process.env.TRACE_CHROME_OUT && run === Number(opts.runs) - 1
    if (tracing) await browser.startTracing(page, { path: process.env.TRACE_CHROME_OUT, categories: ['devtools.timeline', 'disabled-by-default-devtools.timeline', 'v8.execute', 'blink.user_timing', 'loading', 'netlog', 'disabled-by-default-v8.compile'] })
    await page.goto(app.url + opts.path, { waitUntil: 'commit' })
    const first = Number(await (await page.waitForFunction(() => (document.querySelector('.ag-row .ag-cell') ? performance.now() : false), null, { polling: 'raf', timeout: 60_000 })).jsonValue())
    firsts.push(first)
    if (tracing) await browser.stopTracing()
    if (profiling) {
      const { profile } = (await cdp.send('Profiler.stop')) as { profile: CpuProfile }
      printProfile(profile)
      if (process.env.TRACE_PROFILE_OUT) writeFileSync(process.env.TRACE_PROFILE_OUT, JSON.stringify(profile))
    }
    const { metrics } = (await cdp.send('Performance.getMetrics')) as { metrics: { name: string; value: number }[] }
    const metric = (n: string) => (metrics.find((m) => m.name === n)?.value ?? 0) * 1000
    const entries = (await page.evaluate(() => [
      ...performance.getEntriesByType('navigation').map((e) => ({ name: 'document', start: e.startTime, end: (e as PerformanceNavigationTiming).responseEnd, type: 'navigation', bytes: (e as PerformanceNavigationTiming).transferSize })),
      ...(performance.getEntriesByType('resource') as PerformanceResourceTiming[]).map((e) => ({ name: new URL(e.name).pathname + new URL(e.name).search, start: e.startTime, end: e.responseEnd, type: e.initiatorType, bytes: e.encodedBodySize })),
    ])) as Entry[]
    const scripts = entries.filter((e) => /\.js$/.test(e.name))
    console.log(`\nrun ${run + 1}: first rows ${first.toFixed(0)} ms; ${entries.length} requests, ${scripts.length} scripts, ${(scripts.reduce((s, e) => s + e.bytes, 0) / 1024).toFixed(0)} KB of script over the wire; ` +
      `main thread: script ${metric('ScriptDuration').toFixed(0)} ms, tasks ${metric('TaskDuration').toFixed(0)} ms, layout ${metric('LayoutDuration').toFixed(0)} ms, style ${metric('RecalcStyleDuration').toFixed(0)} ms`)
    if (run === Number(opts.runs) - 1 || process.env.TRACE_ALL) {
      for (const e of entries.sort((a, b) => a.start - b.start)) {
        console.log(`  ${e.start.toFixed(0).padStart(6)} → ${e.end.toFixed(0).padStart(6)} ms  ${(e.bytes / 1024).toFixed(1).padStart(7)} KB  ${e.type.padEnd(10)} ${e.name}`)
      }
    }
    await context.close()
  }
  console.log(`\nfirst rows, median of ${firsts.length}: ${median(firsts).toFixed(0)} ms (${firsts.map((f) => f.toFixed(0)).join(', ')})`)
} finally {
  await browser.close()
  await app.stop()
  await db.ds.destroy()
  if (db.prepared.server?.startedHere) await db.prepared.stop()
}
