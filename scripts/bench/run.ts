// npm run bench: Lumenyard side by side with its floor, in one run, on two data sets. Each measure alternates
// Lumenyard and the floor round by round (medians), prints the ratio, p50/p99, the load average and the
// machine, and the whole run is written as JSON to .data/bench/. Not part of npm test.
//
//   npm run bench                        everything (about 15 minutes; the large data set is built once, ~1 min)
//   npm run bench -- --only=scan,issue   some measures: scan issue pick takeoff compute levels grid signin reorder golive everythingout
//   npm run bench -- --sizes=demo        one data set (demo or large)
//   npm run bench -- --rounds=5 --seconds=10 --rebuild --cpu-prof
//   npm run bench -- --only=everythingout --moves=100000,1000000   the ledger sizes of the everything-out measure
//   npm run bench -- --reuse-build        keep the client built by the last run (when only the server changed)
import { spawnSync } from 'node:child_process'
import { existsSync, mkdirSync, writeFileSync } from 'node:fs'
import path from 'node:path'
import { parseArgs } from 'node:util'
import type { Browser } from 'playwright-core'
import { stockLevels } from '../../server/services/stockQueries.js'
import { dataRoot, projectRoot } from '../embeddedMariadb.js'
import { firstGridRows, gridLoadWords, launchChromium, pageScripts, type GridLoad } from './browser.js'
import { BENCH_PASSWORD, makeFixtures, openDatabase, SCANNERS, SIZES, WRITERS, type BenchDatabase, type Fixtures, type Size } from './data.js'
import { runLoad, signIn, type LoadResult, type LoadSpec } from './http.js'
import { BINS_IMPORT_SIZES, measureBinsImport, measureGoLive, openGoLiveDatabase } from './goLive.js'
import { LEDGER_SIZES, measureEverythingOut } from './everythingOut.js'
import { measureReorder } from './reorder.js'
import { measureTakeoffCompute } from './takeoffCompute.js'
import { startNodeServer, type BenchServer } from './servers.js'
import { describeMachine, judgeP99, loadAverage, machine, mariadbPid, median, processCpuMs, timed, type P99Target } from './stats.js'

const MEASURES = ['scan', 'issue', 'pick', 'takeoff', 'compute', 'levels', 'grid', 'signin', 'reorder', 'golive', 'everythingout'] as const
type MeasureName = (typeof MEASURES)[number]

const { values: opts } = parseArgs({
  options: {
    only: { type: 'string', default: MEASURES.join(',') },
    sizes: { type: 'string', default: 'demo,large' },
    rounds: { type: 'string', default: '3' },
    seconds: { type: 'string', default: '8' },
    rebuild: { type: 'boolean', default: false },
    'cpu-prof': { type: 'boolean', default: false },
    moves: { type: 'string', default: LEDGER_SIZES.join(',') },
    'reuse-build': { type: 'boolean', default: false },
  },
})
const only = new Set(opts.only!.split(',') as MeasureName[])
const sizes = opts.sizes!.split(',') as Size[]
const ROUNDS = Number(opts.rounds)
const SECONDS = Number(opts.seconds)
const benchDir = path.join(dataRoot, 'bench')
const portBase = Number(process.env.BENCH_PORT_BASE ?? 5690)

interface Side {
  median: number
  p50?: number
  p99?: number
  runs: number[]
  unit: string
  note?: string
  /** CPU per answered request (ms): the server process, and MariaDB over the same seconds (a load test's only). */
  cpuMsPerRequest?: { server: number | null; database: number | null }
}
interface Row {
  measure: string
  size: Size | '—'
  lumenyard: Side
  floor: Side | null
  /** Lumenyard ÷ floor: throughput (higher is better) or time and size (lower is better). */
  ratio: number | null
  target: string
  holds: boolean | null
  /** A load measure's latency target, judged apart from its ratio, with the floor's p99 from the same rounds beside it. */
  p99Target?: P99Target
  loadAverage: number[]
}

const rows: Row[] = []
const log = (line: string) => console.log(line)

function record(row: Row): void {
  rows.push(row)
  const side = (s: Side) => `${s.median.toFixed(s.unit === 'req/s' ? 0 : 1)} ${s.unit}${s.p99 !== undefined ? ` (p50 ${s.p50!.toFixed(1)} ms, p99 ${s.p99.toFixed(1)} ms)` : ''}`
  log(`→ ${row.measure} [${row.size}]: Lumenyard ${side(row.lumenyard)}${row.floor ? `; floor ${side(row.floor)}; ratio ${row.ratio!.toFixed(2)}` : ''}; ` +
    `target ${row.target}: ${row.holds === null ? 'n/a' : row.holds ? 'holds' : 'MISSED'}; load ${row.loadAverage.join(' ')}`)
}

function build(outDir: string, config?: string): void {
  const args = ['build', '--logLevel', 'error', '--outDir', outDir, '--emptyOutDir', ...(config ? ['--config', config] : [])]
  const res = spawnSync(path.join(projectRoot, 'node_modules/.bin/vite'), args, { cwd: projectRoot, stdio: 'inherit' })
  if (res.status !== 0) throw new Error(`vite build ${config ?? ''} failed`)
}

interface CpuLoadResult extends LoadResult { serverCpu: number | null; dbCpu: number | null }

/** One round of load, with the CPU the server and MariaDB spent on it per answered request. */
async function loadWithCpu(server: BenchServer, spec: LoadSpec): Promise<CpuLoadResult> {
  const db = mariadbPid('test', dataRoot)
  const before = [processCpuMs(server.child.pid), processCpuMs(db)]
  const res = await runLoad(server.url, spec)
  const after = [processCpuMs(server.child.pid), processCpuMs(db)]
  const per = (i: number) => (before[i] === null || after[i] === null || !res.ok ? null : (after[i]! - before[i]!) / res.ok)
  return { ...res, serverCpu: per(0), dbCpu: per(1) }
}

/** Rounds of load, alternating which side goes first, and the medians of each side's rounds. */
async function sideBySide(app: BenchServer, floor: BenchServer, appSpec: LoadSpec, floorSpec: LoadSpec): Promise<[Side, Side]> {
  const a: CpuLoadResult[] = []
  const f: CpuLoadResult[] = []
  await runLoad(app.url, { ...appSpec, seconds: 2 })
  await runLoad(floor.url, { ...floorSpec, seconds: 2 })
  for (let r = 0; r < ROUNDS; r++) {
    const order: [BenchServer, LoadSpec, CpuLoadResult[]][] = [[app, appSpec, a], [floor, floorSpec, f]]
    if (r % 2) order.reverse()
    for (const [server, spec, out] of order) {
      const res = await loadWithCpu(server, spec)
      out.push(res)
      const cpu = res.serverCpu === null ? '' : `; CPU per request: server ${res.serverCpu.toFixed(2)} ms, MariaDB ${res.dbCpu?.toFixed(2) ?? '?'} ms`
      log(`  round ${r + 1} ${server.name}: ${res.rps.toFixed(0)} req/s, p50 ${res.p50} ms, p99 ${res.p99} ms${res.failed ? `, ${res.failed} FAILED` : ''}${cpu}`)
    }
  }
  const cpuMedian = (xs: (number | null)[]) => (xs.some((x) => x === null) ? null : median(xs as number[]))
  const side = (xs: CpuLoadResult[]): Side => ({
    median: median(xs.map((x) => x.rps)), p50: median(xs.map((x) => x.p50)), p99: median(xs.map((x) => x.p99)), runs: xs.map((x) => x.rps), unit: 'req/s',
    cpuMsPerRequest: { server: cpuMedian(xs.map((x) => x.serverCpu)), database: cpuMedian(xs.map((x) => x.dbCpu)) },
    ...(xs.some((x) => x.failed) ? { note: `${xs.reduce((s, x) => s + x.failed, 0)} failed requests` } : {}),
  })
  return [side(a), side(f)]
}

function throughputRow(measure: string, size: Size, [l, f]: [Side, Side], minRatio: number | null, p99: { maxMs: number; connections: number } | null): void {
  const ratio = l.median / f.median
  const target = [minRatio !== null ? `≥ ${minRatio.toFixed(2)}` : null, p99 !== null ? `p99 < ${p99.maxMs} ms` : null].filter(Boolean).join(', ') || '—'
  const p99Target = p99 ? judgeP99(p99.maxMs, p99.connections, { median: l.median, p99: l.p99! }, { median: f.median, p99: f.p99! }) : undefined
  const holds = minRatio === null && !p99Target ? null : (minRatio === null || ratio >= minRatio) && (!p99Target || p99Target.holds) && !l.note
  record({ measure, size, lumenyard: l, floor: f, ratio, target, holds, p99Target, loadAverage: loadAverage() })
  if (p99Target) log(`  ${p99Target.verdict}`)
}

async function httpMeasures(size: Size, db: BenchDatabase, fx: Fixtures, browser: Browser): Promise<void> {
  // Production, but over plain http on the loopback: Secure cookies (the production default) would never be sent.
  const env = { ...db.env, NODE_ENV: 'production', LUMENYARD_SECURE_COOKIES: 'false', LUMENYARD_LOG_LEVEL: 'info', LUMENYARD_CLIENT_DIST: path.join(benchDir, 'dist'), LUMENYARD_HOST: '127.0.0.1' }
  // Both sides profiled, each in a folder of its own, so a profile of Lumenyard can be read against the floor's.
  const profile = (side: string) => (opts['cpu-prof'] ? ['--cpu-prof', `--cpu-prof-dir=${path.join(benchDir, 'profiles', size, side)}`] : [])
  const app = await startNodeServer('Lumenyard', 'scripts/bench/serveApp.ts', { ...env, LUMENYARD_PORT: String(portBase) }, profile('lumenyard'))
  const floor = await startNodeServer('floor', 'scripts/bench/floorServer.ts', {
    ...env, BENCH_PORT: String(portBase + 1), BENCH_USER_ID: String(fx.floorUserId), BENCH_FLOOR_PAGES: path.join(benchDir, 'floor-pages'),
  }, profile('floor'))
  try {
    const scanners = await signIn(app.url, fx.scanners, BENCH_PASSWORD)
    const code = (conn: number, n: number) => fx.scanCodes[(conn * 37 + n) % fx.scanCodes.length]
    if (only.has('scan')) {
      log(`scan lookup by GTIN, ${SCANNERS} connections each signed in as its own scanner [${size}]`)
      throughputRow('scan lookup by GTIN, 50 connections, signed in', size, await sideBySide(app, floor,
        { connections: SCANNERS, seconds: SECONDS, cookies: scanners, request: (c, n) => ({ method: 'GET', path: `/api/stock/lookup?kind=gtin&code=${code(c, n)}` }) },
        { connections: SCANNERS, seconds: SECONDS, request: (c, n) => ({ method: 'GET', path: `/api/lookup?code=${code(c, n)}` }) },
      ), 0.4, { maxMs: 30, connections: SCANNERS })
    }
    if (only.has('issue')) {
      log(`stock issue, ${WRITERS} clients each on its own item and bin [${size}]`)
      const row = (c: number) => fx.issueRows[c % fx.issueRows.length]
      throughputRow('stock issue, 20 clients, own rows', size, await sideBySide(app, floor,
        { connections: WRITERS, seconds: SECONDS, cookies: scanners.slice(0, WRITERS), request: (c) => ({ method: 'POST', path: '/api/stock/issues', body: { lines: [{ ...row(c), lotId: null, qty: 1 }] } }) },
        { connections: WRITERS, seconds: SECONDS, request: (c) => ({ method: 'POST', path: '/api/issue', body: { ...row(c), qty: 1 } }) },
      ), 0.6, { maxMs: 50, connections: WRITERS })
    }
    if (only.has('pick')) {
      log(`pick confirmation, ${WRITERS} scanners each on its own pick list [${size}]`)
      const line = (c: number) => fx.pickLines[c % fx.pickLines.length]
      const body = (c: number) => ({ lineId: line(c).lineId, binScan: line(c).binScan, itemScan: line(c).itemScan, qty: 1 })
      throughputRow('pick confirmation, 20 scanners', size, await sideBySide(app, floor,
        { connections: WRITERS, seconds: SECONDS, cookies: scanners.slice(WRITERS, 2 * WRITERS), request: (c) => ({ method: 'POST', path: `/api/pick-lists/${line(c).listId}/confirmations`, body: body(c) }) },
        { connections: WRITERS, seconds: SECONDS, request: (c) => ({ method: 'POST', path: `/api/pick-lists/${line(c).listId}/confirmations`, body: body(c) }) },
      ), null, null)
    }
    if (only.has('takeoff') && fx.takeoff) {
      log(`takeoff of a ${fx.takeoff.walls.length}-wall job, one clerk at a time [${size}]`)
      const [counter] = await signIn(app.url, [fx.counter], BENCH_PASSWORD)
      const size50 = await answerSize(app.url + '/api/takeoffs/compute', { takeoff: fx.takeoff, unit: 'in' }, counter)
      const [l, f] = await sideBySide(app, floor,
        { connections: 1, seconds: SECONDS, cookies: [counter], request: () => ({ method: 'POST', path: '/api/takeoffs/compute', body: { takeoff: fx.takeoff, unit: 'in' } }) },
        { connections: 1, seconds: SECONDS, request: () => ({ method: 'POST', path: '/api/takeoff', body: { takeoff: fx.takeoff, unit: 'in' } }) },
      )
      const floorSize = await answerSize(floor.url + '/api/takeoff', { takeoff: fx.takeoff, unit: 'in' })
      const asTime = (s: Side, bytes: number): Side => ({ ...s, median: s.p50!, unit: 'ms', note: `answer ${(bytes / 1024).toFixed(0)} KB` })
      record({ measure: 'takeoff of a 50-wall job (one clerk)', size, lumenyard: asTime(l, size50), floor: asTime(f, floorSize), ratio: l.p50! / f.p50!, target: '—', holds: null, loadAverage: loadAverage() })
    }
    if (only.has('grid')) await gridMeasure(size, app, floor, browser, fx)
    if (only.has('signin') && size === sizes[0]) await signinMeasure(app, floor, browser)
  } finally {
    await app.stop()
    await floor.stop()
  }
}

async function answerSize(url: string, body: unknown, cookie?: string): Promise<number> {
  const res = await fetch(url, {
    method: 'POST', body: JSON.stringify(body),
    headers: { 'content-type': 'application/json', 'x-lumenyard-request': '1', 'accept-encoding': 'identity', ...(cookie ? { cookie } : {}) },
  })
  return (await res.arrayBuffer()).byteLength
}

async function gridMeasure(size: Size, app: BenchServer, floor: BenchServer, browser: Browser, fx: Fixtures): Promise<void> {
  log(`first stock-grid rows in Chromium, cold cache, ${fx.balances.toLocaleString('en')} balances [${size}]`)
  const [admin] = await signIn(app.url, [fx.admin], BENCH_PASSWORD)
  const l: GridLoad[] = []
  const f: GridLoad[] = []
  await firstGridRows(browser, app.url + '/stock/overview', admin)
  await firstGridRows(browser, floor.url + '/grid.html')
  for (let r = 0; r < Math.max(5, ROUNDS); r++) {
    l.push(await firstGridRows(browser, app.url + '/stock/overview', admin))
    f.push(await firstGridRows(browser, floor.url + '/grid.html'))
    const run = (x: GridLoad) => `${x.firstRows.toFixed(0)} ms (main thread ${x.tasks.toFixed(0)} ms, last script in at ${x.lastScript.toFixed(0)})`
    log(`  run ${r + 1}: Lumenyard ${run(l.at(-1)!)}, floor ${run(f.at(-1)!)}`)
  }
  const [lm, fm] = [median(l.map((x) => x.firstRows)), median(f.map((x) => x.firstRows))]
  const [ln, fn] = [gridLoadWords(l, median), gridLoadWords(f, median)]
  log(`  Lumenyard: ${ln}\n  floor: ${fn}`)
  record({
    measure: 'first stock-grid rows (Chromium, cold cache)', size,
    lumenyard: { median: lm, runs: l.map((x) => x.firstRows), unit: 'ms', note: ln }, floor: { median: fm, runs: f.map((x) => x.firstRows), unit: 'ms', note: fn },
    ratio: lm / fm, target: '< 1 s, ≤ 1.2× floor', holds: lm < 1000 && lm / fm <= 1.2, loadAverage: loadAverage(),
  })
}

async function signinMeasure(app: BenchServer, floor: BenchServer, browser: Browser): Promise<void> {
  log('JavaScript of the sign-in page, gzip')
  const l = await pageScripts(browser, app.url + '/sign-in')
  const f = await pageScripts(browser, floor.url + '/signin.html')
  const kb = (b: number) => b / 1024
  record({
    measure: 'JS of the sign-in page (gzip)', size: '—',
    lumenyard: { median: kb(l.gzipBytes), runs: [kb(l.gzipBytes)], unit: 'KB', note: `${l.files} files, ${kb(l.bytes).toFixed(0)} KB raw` },
    floor: { median: kb(f.gzipBytes), runs: [kb(f.gzipBytes)], unit: 'KB', note: `${f.files} files, ${kb(f.bytes).toFixed(0)} KB raw` },
    ratio: l.gzipBytes / f.gzipBytes, target: '≤ 200 KB', holds: kb(l.gzipBytes) <= 200, loadAverage: loadAverage(),
  })
}

/** One item's levels through the service against a hand-written query with the filter inside, in-process. */
async function levelsMeasure(size: Size, db: BenchDatabase, fx: Fixtures): Promise<void> {
  log(`stock levels of one item (${fx.oneItem.balances} balances of ${fx.balances.toLocaleString('en')}) [${size}]`)
  const handWritten = () => db.ds.query(
    `SELECT i.id, i.sku, i.name, w.id AS warehouse_id, w.code, SUM(IF(bn.kind = 'transit', 0, b.on_hand)) AS on_hand,
            SUM(IF(bn.kind = 'transit', 0, b.reserved)) AS reserved, SUM(IF(bn.kind = 'transit', b.on_hand, 0)) AS in_transit, iw.min_qty
       FROM stock_balances b JOIN bins bn ON bn.id = b.bin_id JOIN items i ON i.id = b.item_id JOIN warehouses w ON w.id = b.warehouse_id
       LEFT JOIN item_warehouses iw ON iw.item_id = b.item_id AND iw.warehouse_id = b.warehouse_id
      WHERE b.item_id = ? GROUP BY b.item_id, b.warehouse_id`, [fx.oneItem.itemId])
  const service = () => stockLevels(db.ds, { itemId: fx.oneItem.itemId, lowOnly: false, includeEmpty: false })
  await handWritten()
  await service()
  const l: number[] = []
  const f: number[] = []
  for (let r = 0; r < 21; r++) {
    l.push((await timed(service)).ms)
    f.push((await timed(handWritten)).ms)
  }
  const [lm, fm] = [median(l), median(f)]
  record({
    measure: `stock levels of one item, ${fx.balances.toLocaleString('en')} balances`, size, lumenyard: { median: lm, runs: l, unit: 'ms' }, floor: { median: fm, runs: f, unit: 'ms' },
    ratio: lm / fm, target: '≤ 3× the filter-inside query', holds: lm / fm <= 3, loadAverage: loadAverage(),
  })
}

/**
 * The load measures write to the ledger (a stock issue and a pick confirmation are moves): those moves are
 * taken out again once the data set's load is over, so the reorder list after them and every later run read
 * the data set as it was built, not one that grows with each run.
 */
async function withLedgerRestored(db: BenchDatabase, work: () => Promise<void>): Promise<void> {
  const [{ id: last }] = (await db.ds.query('SELECT COALESCE(MAX(id), 0) AS id FROM stock_moves')) as { id: string }[]
  try {
    await work()
  } finally {
    const res = (await db.ds.query('DELETE FROM stock_moves WHERE id > ?', [last])) as { affectedRows?: number }
    if (res.affectedRows) log(`  took the ${res.affectedRows.toLocaleString('en')} moves the load wrote out of the ${db.size} ledger again`)
  }
}

/** The suggestion list on each data set (how its cost grows with the moves), against the hand-written aggregate. */
async function reorderMeasure(size: Size, db: BenchDatabase): Promise<void> {
  const [{ n }] = (await db.ds.query('SELECT COUNT(*) AS n FROM stock_moves')) as { n: string }[]
  const moves = Number(n).toLocaleString('en')
  log(`reorder list over ${moves} moves, against the hand-written aggregate [${size}]`)
  const t = await measureReorder(db.ds, Math.max(5, ROUNDS), log)
  const [lm, fm] = [median(t.service), median(t.handWritten)]
  record({
    measure: `reorder list, ${t.lines.toLocaleString('en')} lines over ${moves} moves`, size,
    lumenyard: { median: lm, runs: t.service, unit: 'ms' }, floor: { median: fm, runs: t.handWritten, unit: 'ms', note: `keyed form alone ${median(t.keyed).toFixed(0)} ms` },
    ratio: lm / fm, target: '≤ 1.3× hand-written', holds: lm / fm <= 1.3, loadAverage: loadAverage(),
  })
}

/** Going live: a 60,000-row opening-stock check and commit by run id against a bare bulk insert of the same rows (goLive.ts). */
async function goLiveMeasure(stops: (() => Promise<void>)[]): Promise<void> {
  log('opening-stock import (check, then commit by run id), 20,000 SKUs × 3 warehouses, against a bare bulk insert')
  const { ds, stopServer } = await openGoLiveDatabase()
  stops.push(stopServer)
  try {
    const t = await measureGoLive(ds, ROUNDS, log)
    const [lm, fm] = [median(t.importMs), median(t.floorMs)]
    record({
      measure: `opening-stock import, ${t.rows.toLocaleString('en')} rows`, size: '—',
      lumenyard: {
        median: lm, runs: t.importMs, unit: 'ms',
        note: `check ${(median(t.checkMs) / 1000).toFixed(1)} s, peak +${median(t.checkPeakMb).toFixed(0)} MB; commit by run id ${(median(t.commitMs) / 1000).toFixed(1)} s, peak +${median(t.commitPeakMb).toFixed(0)} MB`,
      },
      floor: { median: fm, runs: t.floorMs, unit: 'ms', note: `peak +${median(t.floorPeakMb).toFixed(0)} MB` },
      ratio: lm / fm, target: 'an afternoon (reported, not judged)', holds: null, loadAverage: loadAverage(),
    })
    if (t.problems) {
      record({
        measure: `opening-stock check, ${t.rows.toLocaleString('en')} rows each with a problem`, size: '—',
        lumenyard: { median: t.problems.ms, runs: [t.problems.ms], unit: 'ms', note: `peak +${t.problems.peakMb.toFixed(0)} MB, ${t.problems.count.toLocaleString('en')} problems kept` },
        floor: null, ratio: null, target: 'memory as for a clean file (reported, not judged)', holds: null, loadAverage: loadAverage(),
      })
    }
    log(`bins import at ${BINS_IMPORT_SIZES.map((n) => n.toLocaleString('en')).join(' and ')} rows: peak memory as the file grows`)
    const [small, large] = await measureBinsImport(ds, BINS_IMPORT_SIZES, log)
    record({
      measure: `bins import, ${large.rows.toLocaleString('en')} rows against ${small.rows.toLocaleString('en')}`, size: '—',
      lumenyard: { median: large.ms, runs: [large.ms], unit: 'ms', note: `peak +${large.peakMb.toFixed(0)} MB` },
      floor: { median: small.ms, runs: [small.ms], unit: 'ms', note: `peak +${small.peakMb.toFixed(0)} MB (the smaller file)` },
      ratio: large.ms / small.ms, target: 'memory bounded as the file grows (reported, not judged)', holds: null, loadAverage: loadAverage(),
    })
  } finally {
    await ds.destroy()
  }
}

/** Answers the MariaDB version it ran on, for the machine line. */
async function everythingOutMeasure(stops: (() => Promise<void>)[]): Promise<string> {
  const sizes = opts.moves!.split(',').map(Number)
  log(`everything-out zip over ${sizes.map((m) => m.toLocaleString('en')).join(' and ')} moves, against a bare streamed write of the moves`)
  let version = ''
  for (const t of await measureEverythingOut(ROUNDS, log, sizes, stops)) {
    const [lm, fm] = [median(t.exportMs), median(t.floorMs)]
    record({
      measure: `everything out, ${t.moves.toLocaleString('en')} moves`, size: '—',
      lumenyard: { median: lm, runs: t.exportMs, unit: 'ms', note: `peak +${median(t.exportPeakMb).toFixed(0)} MB, zip ${t.zipMb.toFixed(1)} MB` },
      floor: { median: fm, runs: t.floorMs, unit: 'ms', note: `peak +${median(t.floorPeakMb).toFixed(0)} MB, ${t.floorMb.toFixed(1)} MB` },
      ratio: lm / fm, target: '≤ ~2× the floor, memory flat as moves grow', holds: lm / fm <= 2.2, loadAverage: loadAverage(),
    })
    version = t.mariadb
  }
  return version
}

/** The takeoff computation itself, in Node, no database or HTTP: what one compute request costs the worker. */
function computeMeasure(): void {
  log('takeoff compute of a 200-wall job, in Node')
  const m = measureTakeoffCompute()
  record({
    measure: `takeoff compute, ${m.walls} walls, ${m.blocks.toLocaleString('en')} blocks (lean answer)`, size: '—',
    lumenyard: { median: m.lean.medianMs, runs: [], unit: 'ms', note: `CPU ${m.lean.cpuMedianMs.toFixed(0)} ms; with drawings ${m.full.medianMs.toFixed(0)} ms` },
    floor: null, ratio: null, target: `< ${m.targetMs} ms`, holds: m.lean.medianMs < m.targetMs, loadAverage: loadAverage(),
  })
}

async function main(): Promise<void> {
  mkdirSync(benchDir, { recursive: true })
  const startedAt = new Date()
  const loadAtStart = loadAverage()
  log(`npm run bench: ${[...only].join(', ')} on ${sizes.join(' and ')}; load average at start ${loadAtStart.join(' ')}`)
  const needsPages = ['grid', 'signin', 'scan', 'issue', 'pick', 'takeoff'].some((m) => only.has(m as MeasureName))
  if (needsPages && !(opts['reuse-build'] && existsSync(path.join(benchDir, 'dist')) && existsSync(path.join(benchDir, 'floor-pages')))) {
    log('building the client and the floor pages…')
    build(path.join(benchDir, 'dist'))
    build(path.join(benchDir, 'floor-pages'), 'scripts/bench/floorPages/vite.config.ts')
  }
  if (only.has('compute')) computeMeasure()
  const browser = only.has('grid') || only.has('signin') ? await launchChromium() : null
  let mariadb = ''
  const stops: (() => Promise<void>)[] = []
  try {
    if (only.has('golive')) await goLiveMeasure(stops)
    if (only.has('everythingout')) mariadb = await everythingOutMeasure(stops)
    const perSize = needsPages || only.has('levels') || only.has('reorder')
    for (const size of perSize ? sizes : []) {
      const db = await openDatabase(size, { rebuild: opts.rebuild! }, log)
      stops.push(() => db.prepared.stop())
      try {
        mariadb ||= ((await db.ds.query('SELECT VERSION() AS v')) as { v: string }[])[0].v
        const fx = await makeFixtures(db.ds)
        if (only.has('levels')) await levelsMeasure(size, db, fx)
        if (needsPages) await withLedgerRestored(db, () => httpMeasures(size, db, fx, browser!))
        if (only.has('reorder')) await reorderMeasure(size, db)
      } finally {
        await db.ds.destroy()
      }
    }
  } finally {
    await browser?.close()
    await stops[0]?.()
  }
  const m = machine(mariadb)
  const result = { startedAt: startedAt.toISOString(), finishedAt: new Date().toISOString(), machine: m, loadAverage: { start: loadAtStart, end: loadAverage() }, rounds: ROUNDS, seconds: SECONDS, sizes: sizes.map((s) => SIZES[s].label), rows }
  const file = path.join(benchDir, `results-${startedAt.toISOString().replace(/[:.]/g, '-')}.json`)
  writeFileSync(file, JSON.stringify(result, null, 2))
  writeFileSync(path.join(benchDir, 'latest.json'), JSON.stringify(result, null, 2))
  log(`\n${describeMachine(m)}; load average ${loadAtStart.join(' ')} at start, ${result.loadAverage.end.join(' ')} at the end`)
  log('| measure | data | Lumenyard | floor | ratio | target | |')
  log('|---|---|---|---|---|---|---|')
  const cpu = (s: Side) => (s.cpuMsPerRequest?.server == null ? '' : `, CPU ${s.cpuMsPerRequest.server.toFixed(2)} + DB ${s.cpuMsPerRequest.database?.toFixed(2) ?? '?'} ms/req`)
  const cell = (s: Side) => `${s.median.toFixed(s.unit === 'ms' && s.median < 10 ? 1 : 0)} ${s.unit}${s.p99 !== undefined && s.unit === 'req/s' ? `, p99 ${s.p99.toFixed(0)} ms` : ''}${cpu(s)}${s.note ? ` (${s.note})` : ''}`
  for (const r of rows) {
    log(`| ${r.measure} | ${r.size} | ${cell(r.lumenyard)} | ${r.floor ? cell(r.floor) : '—'} | ${r.ratio === null ? '—' : r.ratio.toFixed(2)} | ${r.target} | ${r.holds === null ? '' : r.holds ? 'holds' : 'missed'} |`)
  }
  for (const r of rows.filter((x) => x.p99Target)) log(`${r.measure} [${r.size}]: ${r.p99Target!.verdict}`)
  log(`\nwritten to ${path.relative(projectRoot, file)}`)
}

main().catch((err) => {
  console.error(err)
  process.exit(1)
})
