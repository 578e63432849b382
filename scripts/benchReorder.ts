// npm run bench: builds lumenyard_bench (5,000 items × 3 warehouses, 1,000,000 moves over a year) on the test
// MariaDB instance, then times the full reorder suggestion list (the service the API calls) against one
// hand-written aggregate over the same data — the per line Σ and Σ² of daily use — several runs each, in two
// forms: as one would first write it, and in the service's faster formulation.
import { execFileSync } from 'node:child_process'
import { readFileSync } from 'node:fs'
import os from 'node:os'
import type { DataSource } from 'typeorm'
import { loadConfig } from '../server/config.js'
import { createDataSource } from '../server/db/dataSource.js'
import { suggestionList } from '../server/services/reorder/suggestionList.js'
import { AGGREGATE_MEMORY } from '../server/services/reorder/usageQueries.js'
import { dayAfter, usageWindow } from '../server/services/reorder/usageWindow.js'
import { BENCH, generateBenchData } from './benchReorderData.js'
import { prepareEnvironment } from './environment.js'

const RUNS = 7

// The straightforward form, grouping by the columns and DATE(at).
const HAND_WRITTEN = `
  SELECT item_id, warehouse_id, SUM(q) AS s, SUM(q * q) AS s2
    FROM (SELECT item_id, warehouse_id, DATE(at) AS day, -SUM(qty) AS q
            FROM stock_moves
           WHERE move_type IN ('issue', 'pick') AND at >= ? AND at < ?
           GROUP BY item_id, warehouse_id, DATE(at)) d
   GROUP BY item_id, warehouse_id`

// The same two sums in the service's own formulation (one packed integer key per level, see usageQueries.ts),
// with its larger temporary table: the fairest baseline for the service's overhead.
const HAND_WRITTEN_KEYED = `${AGGREGATE_MEMORY}
  SELECT k DIV 2048 AS line, SUM(q) AS s, SUM(q * q) AS s2
    FROM (SELECT (item_id * 65536 + warehouse_id) * 2048 + DATEDIFF(at, ?) AS k, -SUM(qty) AS q
            FROM stock_moves
           WHERE move_type IN ('issue', 'pick') AND at >= ? AND at < ?
           GROUP BY k) d
   GROUP BY line`

async function timed<T>(work: () => Promise<T>): Promise<{ ms: number; result: T }> {
  const started = process.hrtime.bigint()
  const result = await work()
  return { ms: Number(process.hrtime.bigint() - started) / 1e6, result }
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]

function machine(mariadbVersion: string): string {
  const cpu = /model name\s*:\s*(.+)/.exec(readFileSync('/proc/cpuinfo', 'utf8'))?.[1] ?? os.cpus()[0]?.model ?? 'unknown'
  const nproc = execFileSync('nproc').toString().trim()
  return `nproc ${nproc}, CPU ${cpu}, MariaDB ${mariadbVersion}, Node ${process.version}`
}

type Times = { plain: number[]; keyed: number[]; service: number[] }

/** Alternates the three, RUNS times, after one warm-up that brings the index into the buffer pool. */
async function measure(ds: DataSource): Promise<{ times: Times; lines: number }> {
  const window = usageWindow(180)
  const params = [window.start, dayAfter(window.end)]
  const plain = () => ds.query(HAND_WRITTEN, params) as Promise<unknown[]>
  const keyed = () => ds.query(HAND_WRITTEN_KEYED, [window.start, ...params]) as Promise<unknown[]>
  await plain()
  await suggestionList(ds, {})
  const times: Times = { plain: [], keyed: [], service: [] }
  let lines = 0
  for (let run = 0; run < RUNS; run++) {
    const p = await timed(plain)
    const k = await timed(keyed)
    const s = await timed(() => suggestionList(ds, {}))
    times.plain.push(p.ms)
    times.keyed.push(k.ms)
    times.service.push(s.ms)
    lines = s.result.lines.length
    console.log(`run ${run + 1}: hand-written ${p.ms.toFixed(0)} ms, keyed ${k.ms.toFixed(0)} ms (${k.result.length} rows); suggestion list ${s.ms.toFixed(0)} ms (${lines} lines)`)
  }
  return { times, lines }
}

function report(times: Times, lines: number, mariadbVersion: string): void {
  // Median for the typical run; the fastest run too, the figure least disturbed by other work on the machine.
  for (const [label, pick] of [['median', median], ['fastest', (xs: number[]) => Math.min(...xs)]] as const) {
    const [p, k, s] = [pick(times.plain), pick(times.keyed), pick(times.service)]
    console.log(`${label} of ${RUNS}: hand-written aggregate ${p.toFixed(0)} ms, keyed ${k.toFixed(0)} ms; full suggestion list ${s.toFixed(0)} ms; ` +
      `ratio ${(s / p).toFixed(2)} to the hand-written, ${(s / k).toFixed(2)} to the keyed`)
  }
  console.log(`lines ${lines}; ${machine(mariadbVersion)}; load average ${os.loadavg().map((l) => l.toFixed(2)).join(' ')}`)
}

async function main(): Promise<void> {
  // --reuse keeps the data of the last run (for timing again); by default the database is built afresh.
  const reuse = process.argv.includes('--reuse')
  const prepared = await prepareEnvironment('bench', { database: 'lumenyard_bench', reset: !reuse })
  const ds = createDataSource(loadConfig({ ...process.env, ...prepared.env, NODE_ENV: 'test' }))
  await ds.initialize()
  try {
    await ds.runMigrations({ transaction: 'each' })
    const [{ n }] = (await ds.query('SELECT COUNT(*) AS n FROM items')) as { n: string }[]
    if (!reuse || Number(n) === 0) {
      console.log(`generating ${BENCH.items} items × ${BENCH.warehouses} warehouses, ${BENCH.moves.toLocaleString('en')} moves…`)
      const { seconds } = await generateBenchData(ds)
      console.log(`generated in ${seconds.toFixed(1)} s`)
    }
    const { times, lines } = await measure(ds)
    const [version] = (await ds.query('SELECT VERSION() AS v')) as { v: string }[]
    report(times, lines, version.v)
  } finally {
    await ds.destroy()
    await prepared.stop()
  }
}

main().catch((err) => {
  console.error(err)
  process.exit(1)
})
