// Going live, measured: an opening-stock sheet of 60,000 rows (20,000 SKUs × 3 warehouses) taken the way the
// import page takes it: a check (parse in its child process, every row checked, the file kept in MariaDB for the
// commit, every problem kept beside the run), then the commit of that checked run by its id (the kept file read
// back, checked again and written chunk by chunk in one transaction through the stock service), side by side
// with its floor: a bare bulk insert of the same 60,000 balances and 60,000 ledger rows in one transaction.
// Rounds alternate; each starts from empty stock tables. Reports time and the bench process's peak resident
// memory above its start (the parse child's own heap is capped at 128 MB apart from it). Then a check of the same
// sheet with a problem on every row (an unknown bin), for the cost of keeping 60,000 problems.
// Beside it, a bins import (one of the kinds of simple records, checked chunk by chunk) at two sizes, with the
// same peak figure, to show that memory follows the chunk and the file rather than the tables.
// In a database of its own on the test MariaDB instance. Not part of npm test.
//
//   tsx --tsconfig tsconfig.server.json scripts/bench/goLive.ts [--rounds=3] [--bins-only] [--bins=2000,20000]
//   (or npm run bench -- --only=golive)
import { parseArgs } from 'node:util'
import type { DataSource } from 'typeorm'
import { loadConfig } from '../../server/config.js'
import { createDataSource } from '../../server/db/dataSource.js'
import { commitImport, previewImport } from '../../server/services/imports/dataImports.js'
import { checkedUpload, runImportStep } from '../../server/services/imports/importRuns.js'
import { openingStockImport } from '../../server/services/imports/openingStockImport.js'
import { binsImport } from '../../server/services/imports/warehousesImport.js'
import { prepareEnvironment } from '../environment.js'
import { median, withPeak } from './stats.js'

export const GO_LIVE_DATABASE = 'lumenyard_bench_golive'
const SKUS = 20_000
const WAREHOUSES = ['GLA', 'GLB', 'GLC']
const BINS_PER_WAREHOUSE = 2_000

export interface GoLiveTimes {
  rows: number
  /** Check and commit together, and each apart; peaks are of each step (the larger is the import's). */
  importMs: number[]; checkMs: number[]; commitMs: number[]; floorMs: number[]
  importPeakMb: number[]; checkPeakMb: number[]; commitPeakMb: number[]; floorPeakMb: number[]
  /** A check of the same sheet with a problem on every row. */
  problems: { count: number; ms: number; peakMb: number } | null
}

async function seed(ds: DataSource, log: (line: string) => void): Promise<void> {
  const [{ n }] = (await ds.query("SELECT COUNT(*) AS n FROM items WHERE sku LIKE 'GL-%'")) as { n: string }[]
  if (Number(n) === SKUS) return
  log(`  seeding ${SKUS.toLocaleString('en-US')} items and ${WAREHOUSES.length} × ${BINS_PER_WAREHOUSE.toLocaleString('en-US')} bins…`)
  for (let i = 0; i < SKUS; i += 1000) {
    const chunk = Array.from({ length: Math.min(1000, SKUS - i) }, (_, k) => i + k)
    await ds.query(
      `INSERT INTO items (sku, name, family, stock_unit, cost, case_qty, match_lot) VALUES ${chunk.map(() => "(?, ?, 'glass_block', 'each', 0, 8, ?)").join(', ')}`,
      chunk.flatMap((k) => [`GL-${String(k).padStart(5, '0')}`, `Bench block ${k}`, k % 5 === 0 ? 1 : 0]),
    )
  }
  for (const code of WAREHOUSES) {
    const res = (await ds.query('INSERT INTO warehouses (code, name) VALUES (?, ?)', [code, `Bench yard ${code}`])) as { insertId: number }
    const bins = Array.from({ length: BINS_PER_WAREHOUSE }, (_, b) => `A-${String(Math.floor(b / 40) + 1).padStart(2, '0')}-${(b % 40) + 1}`)
    for (let i = 0; i < bins.length; i += 1000) {
      const chunk = bins.slice(i, i + 1000)
      await ds.query(`INSERT INTO bins (warehouse_id, code, kind) VALUES ${chunk.map(() => "(?, ?, 'storage')").join(', ')}`, chunk.flatMap((c) => [res.insertId, c]))
    }
  }
}

/** The opening-stock sheet; with `badBins`, every row names a bin no warehouse has (a problem on each row). */
function sheet(badBins = false): { csv: Buffer; rows: number } {
  const lines = ['SKU,Warehouse,Bin,Lot,Quantity,Unit cost']
  for (let k = 0; k < SKUS; k++) {
    for (const [w, code] of WAREHOUSES.entries()) {
      const b = (k + w * 7) % BINS_PER_WAREHOUSE
      const bin = badBins ? `Z-${k % 97}-${w}` : `A-${String(Math.floor(b / 40) + 1).padStart(2, '0')}-${(b % 40) + 1}`
      const qty = k % 3 === 0 ? `${1 + (k % 9)} cases` : String(5 + (k % 200))
      lines.push(`GL-${String(k).padStart(5, '0')},${code},${bin},${k % 5 === 0 ? `R-${k % 17}` : ''},${qty},${(2 + (k % 300) / 100).toFixed(2)}`)
    }
  }
  return { csv: Buffer.from(lines.join('\n') + '\n'), rows: lines.length - 1 }
}

async function emptyStock(ds: DataSource): Promise<void> {
  await ds.query('SET FOREIGN_KEY_CHECKS = 0')
  for (const t of ['stock_moves', 'stock_balances', 'data_import_costs', 'data_imports', 'data_import_problems', 'data_import_runs', 'stored_file_parts', 'stored_files',
    'item_warehouses', 'floor_moves', 'floor_balances']) await ds.query(`TRUNCATE ${t}`)
  await ds.query('SET FOREIGN_KEY_CHECKS = 1')
}

/** The floor: the same number of balance and ledger rows, written in one transaction, 1,000 a statement. */
async function bareBulkInsert(ds: DataSource, rows: number): Promise<void> {
  const [items, bins]: [{ id: number }[], { id: number; warehouse_id: number }[]] = await Promise.all([
    ds.query("SELECT id FROM items WHERE sku LIKE 'GL-%' ORDER BY id"),
    ds.query('SELECT b.id, b.warehouse_id FROM bins b JOIN warehouses w ON w.id = b.warehouse_id WHERE w.code IN (?) ORDER BY b.id', [WAREHOUSES]),
  ])
  await ds.transaction(async (em) => {
    for (let i = 0; i < rows; i += 1000) {
      const chunk = Array.from({ length: Math.min(1000, rows - i) }, (_, k) => {
        const n = i + k
        const bin = bins[n % bins.length]
        return [items[Math.floor(n / WAREHOUSES.length)].id, bin.warehouse_id, bin.id, 10]
      })
      await em.query(`INSERT INTO floor_balances (item_id, warehouse_id, bin_id, on_hand, reserved) VALUES ${chunk.map(() => '(?, ?, ?, ?, 0)').join(', ')}`, chunk.flat())
      await em.query(
        `INSERT INTO floor_moves (at, move_type, item_id, warehouse_id, bin_id, qty, unit_cost, batch_id) VALUES ${chunk.map(() => "(NOW(3), 'opening', ?, ?, ?, ?, 2.5, 'bench')").join(', ')}`,
        chunk.flat(),
      )
    }
  })
}

/** A check of the sheet as the import page sends it: the run's id (its file kept for the commit) and its problems. */
async function check(ds: DataSource, userId: number, csv: Buffer, filename: string): Promise<{ runId: string; problems: number }> {
  const upload = { kind: 'csv' as const, filename, data: csv }
  let runId = ''
  const preview = await runImportStep(ds, { userId }, openingStockImport.kind, 'preview', upload, (progress) => {
    runId = progress.problems!.runId
    return previewImport(ds, openingStockImport, upload, progress)
  })
  return { runId, problems: preview.problems }
}

/** The commit of a checked run by its id, as the import page sends it: the kept file read back from MariaDB. */
async function commitRun(ds: DataSource, userId: number, runId: string): Promise<void> {
  const { kind, upload } = await checkedUpload(ds, userId, runId)
  if (kind !== openingStockImport.kind) throw new Error(`run ${runId} kept a ${kind} file`)
  await runImportStep(ds, { userId }, kind, 'commit', upload, (progress) => commitImport(ds, { userId }, openingStockImport, upload, progress), runId)
}

export async function measureGoLive(ds: DataSource, rounds: number, log: (line: string) => void): Promise<GoLiveTimes> {
  await seed(ds, log)
  await ds.query('CREATE TABLE IF NOT EXISTS floor_balances LIKE stock_balances')
  await ds.query('CREATE TABLE IF NOT EXISTS floor_moves LIKE stock_moves')
  const [{ id: adminId }] = (await ds.query("SELECT id FROM users ORDER BY id LIMIT 1")) as { id: number }[]
  const { csv, rows } = sheet()
  log(`  opening-stock sheet: ${rows.toLocaleString('en-US')} rows, ${(csv.length / 1048576).toFixed(1)} MB CSV`)
  const out: GoLiveTimes = { rows, importMs: [], checkMs: [], commitMs: [], floorMs: [], importPeakMb: [], checkPeakMb: [], commitPeakMb: [], floorPeakMb: [], problems: null }
  for (let r = 0; r < rounds; r++) {
    const sides: [string, () => Promise<void>][] = [
      ['import', async () => {
        let runId = ''
        const checked = await withPeak(async () => { ({ runId } = await check(ds, adminId, csv, `opening-${r}.csv`)) })
        const committed = await withPeak(() => commitRun(ds, adminId, runId))
        out.checkMs.push(checked.ms); out.checkPeakMb.push(checked.peakMb)
        out.commitMs.push(committed.ms); out.commitPeakMb.push(committed.peakMb)
        out.importMs.push(checked.ms + committed.ms); out.importPeakMb.push(Math.max(checked.peakMb, committed.peakMb))
        log(`  round ${r + 1} check ${(checked.ms / 1000).toFixed(1)} s (peak +${checked.peakMb.toFixed(0)} MB), commit by run id ${(committed.ms / 1000).toFixed(1)} s (peak +${committed.peakMb.toFixed(0)} MB)`)
      }],
      ['floor', async () => {
        const { ms, peakMb } = await withPeak(() => bareBulkInsert(ds, rows))
        out.floorMs.push(ms); out.floorPeakMb.push(peakMb)
      }],
    ]
    if (r % 2) sides.reverse()
    for (const [name, work] of sides) {
      await emptyStock(ds)
      await work()
      const ms = name === 'import' ? out.importMs.at(-1)! : out.floorMs.at(-1)!
      const peakMb = name === 'import' ? out.importPeakMb.at(-1)! : out.floorPeakMb.at(-1)!
      const [{ moves }] = (await ds.query(`SELECT COUNT(*) AS moves FROM ${name === 'import' ? 'stock_moves' : 'floor_moves'}`)) as { moves: string }[]
      if (Number(moves) !== rows) throw new Error(`${name} wrote ${moves} ledger rows of ${rows}`)
      log(`  round ${r + 1} ${name}: ${(ms / 1000).toFixed(1)} s, peak +${peakMb.toFixed(0)} MB, ${Number(moves).toLocaleString('en-US')} ledger rows`)
    }
  }
  log(`  import (check + commit) median ${(median(out.importMs) / 1000).toFixed(1)} s vs floor ${(median(out.floorMs) / 1000).toFixed(1)} s (ratio ${(median(out.importMs) / median(out.floorMs)).toFixed(2)})`)
  await emptyStock(ds)
  const bad = sheet(true)
  let problems = 0
  const { ms, peakMb } = await withPeak(async () => { ({ problems } = await check(ds, adminId, bad.csv, 'opening-unknown-bins.csv')) })
  const [{ kept }] = (await ds.query('SELECT COUNT(*) AS kept FROM data_import_problems')) as { kept: string }[]
  if (Number(kept) !== problems || problems < bad.rows) throw new Error(`check found ${problems} problems and kept ${kept} for ${bad.rows} rows`)
  log(`  check of ${bad.rows.toLocaleString('en-US')} rows, each with a problem: ${(ms / 1000).toFixed(1)} s, peak +${peakMb.toFixed(0)} MB, ${problems.toLocaleString('en-US')} problems kept`)
  out.problems = { count: problems, ms, peakMb }
  await emptyStock(ds)
  return out
}

export interface BinsImportFigures { rows: number; ms: number; peakMb: number; bytes: number }
export const BINS_IMPORT_SIZES = [2_000, 20_000]
const BINS_WAREHOUSE = 'GLBINS'

/** A bins file of `rows` storage bins (A-1-1 … in the default pattern) for the bench's own warehouse. */
function binsSheet(rows: number): Buffer {
  const lines = ['Warehouse,Bin,Kind,Active']
  for (let k = 0; k < rows; k++) lines.push(`${BINS_WAREHOUSE},A-${Math.floor(k / 20) + 1}-${(k % 20) + 1},storage,yes`)
  return Buffer.from(lines.join('\n') + '\n')
}

/**
 * A bins import committed at each size, smallest first, from no bins in the bench's warehouse each time: the
 * time and the peak resident memory of this process above its start (the parse child's heap is apart, capped).
 */
export async function measureBinsImport(ds: DataSource, sizes: readonly number[], log: (line: string) => void): Promise<BinsImportFigures[]> {
  const [{ id: adminId }] = (await ds.query('SELECT id FROM users ORDER BY id LIMIT 1')) as { id: number }[]
  await ds.query('INSERT IGNORE INTO warehouses (code, name) VALUES (?, ?)', [BINS_WAREHOUSE, 'Bench bins yard'])
  const out: BinsImportFigures[] = []
  for (const rows of [...sizes].sort((a, b) => a - b)) {
    await ds.query('DELETE b FROM bins b JOIN warehouses w ON w.id = b.warehouse_id WHERE w.code = ?', [BINS_WAREHOUSE])
    await ds.query("DELETE FROM data_imports WHERE kind = 'bins'")
    const csv = binsSheet(rows)
    const { ms, peakMb } = await withPeak(() => commitImport(ds, { userId: adminId }, binsImport, { kind: 'csv', filename: `bins-${rows}.csv`, data: csv }))
    const [{ n }] = (await ds.query('SELECT COUNT(*) AS n FROM bins b JOIN warehouses w ON w.id = b.warehouse_id WHERE w.code = ?', [BINS_WAREHOUSE])) as { n: string }[]
    if (Number(n) !== rows) throw new Error(`bins import wrote ${n} bins of ${rows}`)
    log(`  bins import ${rows.toLocaleString('en-US')} rows (${(csv.length / 1048576).toFixed(2)} MB CSV): ${(ms / 1000).toFixed(1)} s, peak +${peakMb.toFixed(0)} MB`)
    out.push({ rows, ms, peakMb, bytes: csv.length })
  }
  return out
}

export async function openGoLiveDatabase(): Promise<{ ds: DataSource; stopServer: () => Promise<void> }> {
  const prepared = await prepareEnvironment('bench', { database: GO_LIVE_DATABASE, reset: false })
  const ds = createDataSource(loadConfig({ ...process.env, ...prepared.env, LUMENYARD_DB_NAME: GO_LIVE_DATABASE, NODE_ENV: 'test' }))
  await ds.initialize()
  await ds.runMigrations({ transaction: 'each' })
  const [{ n }] = (await ds.query('SELECT COUNT(*) AS n FROM users')) as { n: string }[]
  if (!Number(n)) await ds.query("INSERT INTO users (username, display_name, roles, password_hash, active) VALUES ('bench-golive', 'Bench admin', 'admin', '-', 1)")
  return { ds, stopServer: () => prepared.stop() }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const { values } = parseArgs({ options: { rounds: { type: 'string', default: '3' }, 'bins-only': { type: 'boolean', default: false }, bins: { type: 'string' } } })
  const { ds, stopServer } = await openGoLiveDatabase()
  try {
    if (!values['bins-only']) await measureGoLive(ds, Number(values.rounds), (l) => console.log(l))
    await measureBinsImport(ds, values.bins ? values.bins.split(',').map(Number) : BINS_IMPORT_SIZES, (l) => console.log(l))
  } finally {
    await ds.destroy()
    await stopServer()
  }
}
