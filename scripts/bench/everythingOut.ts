// Everything out, measured: the whole-business zip (server/services/exports/businessExport.ts) over a ledger
// of 100,000 and then 1,000,000 moves, side by side with its floor: a bare streamed write of the same moves
// (a mysql2 query stream into an exceljs streaming workbook, no zip, no joins). Both write into a sink that
// only counts bytes. Reports time and this process's peak resident memory above its start for each side and
// size: memory that stays flat from 100,000 to 1,000,000 moves shows the ledger is never held. Rounds
// alternate the two sides. Each ledger size has a database of its own on the test MariaDB instance, built once
// (bulk INSERT … SELECT from MariaDB's sequence tables) and reused by later runs. Not part of npm test.
//
//   tsx --tsconfig tsconfig.server.json scripts/bench/everythingOut.ts [--rounds=1] [--moves=100000,1000000]
//   (or npm run bench -- --only=everythingout [--moves=…])
import { Writable } from 'node:stream'
import { parseArgs } from 'node:util'
import ExcelJS from 'exceljs'
import mysql from 'mysql2'
import type { DataSource } from 'typeorm'
import { loadConfig } from '../../server/config.js'
import { createDataSource } from '../../server/db/dataSource.js'
import { streamBusinessExport } from '../../server/services/exports/businessExport.js'
import { prepareEnvironment } from '../environment.js'
import { median, withPeak } from './stats.js'

/** The database of one ledger size: kept between runs, so a size is built only once. */
export const exportDatabase = (moves: number) => `lumenyard_bench_out_${moves}`
export const LEDGER_SIZES = [100_000, 1_000_000]
/** Moves written per statement while the ledger is built. */
const CHUNK = 250_000
const ITEMS = 2_000
const BINS = 500

export interface ExportSizeTimes { moves: number; mariadb: string; exportMs: number[]; floorMs: number[]; exportPeakMb: number[]; floorPeakMb: number[]; zipMb: number; floorMb: number }

/** A sink that keeps nothing: counts bytes and lets the writer go on. */
class CountingSink extends Writable {
  bytes = 0
  _write(chunk: Buffer, _enc: BufferEncoding, done: () => void) { this.bytes += chunk.length; done() }
}

async function seedCatalog(ds: DataSource): Promise<void> {
  const [{ n }] = (await ds.query("SELECT COUNT(*) AS n FROM items WHERE sku LIKE 'EO-%'")) as { n: string }[]
  if (Number(n) === ITEMS) return
  await ds.query(
    `INSERT INTO items (sku, name, family, stock_unit, cost, case_qty, match_lot)
     SELECT CONCAT('EO-', LPAD(seq, 5, '0')), CONCAT('Bench block ', seq), 'glass_block', 'each', 2.5, 8, 0 FROM seq_1_to_${ITEMS}`,
  )
  const res = (await ds.query("INSERT INTO warehouses (code, name) VALUES ('EOA', 'Bench yard')")) as { insertId: number }
  await ds.query(`INSERT INTO bins (warehouse_id, code, kind) SELECT ?, CONCAT('B-', LPAD(seq, 4, '0')), 'storage' FROM seq_1_to_${BINS}`, [res.insertId])
}

/**
 * Builds the ledger up to `moves` rows: alternating receipts and issues over the bench items and bins, in
 * statements of 250,000 rows on one connection with foreign-key and unique checks off (the rows are made to
 * fit; checking a million of them one by one was most of the build).
 */
async function ledgerOf(ds: DataSource, moves: number, log: (line: string) => void): Promise<void> {
  const [{ n }] = (await ds.query('SELECT COUNT(*) AS n FROM stock_moves')) as { n: string }[]
  const have = Number(n)
  if (have >= moves) return
  log(`  building a ledger of ${moves.toLocaleString('en-US')} moves (from ${have.toLocaleString('en-US')})…`)
  const started = Date.now()
  const [{ item0 }] = (await ds.query("SELECT MIN(id) AS item0 FROM items WHERE sku LIKE 'EO-%'")) as { item0: number }[]
  const [{ bin0, wh }] = (await ds.query("SELECT MIN(b.id) AS bin0, MIN(b.warehouse_id) AS wh FROM bins b JOIN warehouses w ON w.id = b.warehouse_id WHERE w.code = 'EOA'")) as { bin0: number; wh: number }[]
  const [{ user }] = (await ds.query('SELECT MIN(id) AS user FROM users')) as { user: number }[]
  const runner = ds.createQueryRunner()
  try {
    await runner.query('SET SESSION foreign_key_checks = 0, unique_checks = 0')
    for (let from = have; from < moves; from += CHUNK) {
      const to = Math.min(moves, from + CHUNK)
      await runner.query(
        `INSERT INTO stock_moves (at, move_type, item_id, warehouse_id, bin_id, qty, unit_cost, user_id, note, batch_id)
         SELECT TIMESTAMPADD(SECOND, seq * 30, '2025-01-01'), IF(seq MOD 2, 'receipt', 'issue'), ? + seq MOD ${ITEMS}, ?, ? + seq MOD ${BINS},
                IF(seq MOD 2, 12, -12), 2.5, ?, IF(seq MOD 7 = 0, 'bench move', NULL), LPAD(seq DIV 2, 36, '0')
           FROM seq_${from + 1}_to_${to}`,
        [item0, wh, bin0, user],
      )
    }
  } finally {
    await runner.release()
  }
  log(`  built in ${((Date.now() - started) / 1000).toFixed(0)} s`)
}

/** The floor: the ledger's rows straight from a mysql2 query stream into one streaming worksheet. */
async function bareStreamedWrite(db: ExportDatabase, sink: Writable): Promise<void> {
  const config = loadConfig({ ...process.env, ...db.env, NODE_ENV: 'test' })
  const conn = mysql.createConnection({ host: config.db.host, port: config.db.port, user: config.db.user, password: config.db.password, database: config.db.database })
  try {
    const book = new ExcelJS.stream.xlsx.WorkbookWriter({ stream: sink, useStyles: false, useSharedStrings: false })
    const sheet = book.addWorksheet('Moves')
    sheet.addRow(['id', 'at', 'move_type', 'item_id', 'warehouse_id', 'bin_id', 'lot_id', 'qty', 'unit_cost', 'note']).commit()
    const rows = conn.query('SELECT id, at, move_type, item_id, warehouse_id, bin_id, lot_id, qty, unit_cost, note FROM stock_moves ORDER BY id').stream({ highWaterMark: 1000 })
    for await (const r of rows as AsyncIterable<Record<string, unknown>>) {
      sheet.addRow([r.id, r.at, r.move_type, r.item_id, r.warehouse_id, r.bin_id, r.lot_id, r.qty, Number(r.unit_cost), r.note]).commit()
    }
    sheet.commit()
    await book.commit()
  } finally {
    conn.end()
  }
}

interface ExportDatabase { ds: DataSource; env: Record<string, string>; stopServer: () => Promise<void> }

/**
 * Each size in its own database, built on first use. `stopServer` of the first database opened stops the MariaDB
 * instance when this run started it (the caller calls it once, at the end).
 */
export async function measureEverythingOut(rounds: number, log: (line: string) => void, sizes = LEDGER_SIZES, stops: (() => Promise<void>)[] = []): Promise<ExportSizeTimes[]> {
  const out: ExportSizeTimes[] = []
  for (const moves of sizes) {
    const db = await openEverythingOutDatabase(moves)
    stops.push(db.stopServer)
    try {
      await seedCatalog(db.ds)
      await ledgerOf(db.ds, moves, log)
      out.push(await measureSize(db, moves, rounds, log))
    } finally {
      await db.ds.destroy()
    }
  }
  return out
}

async function measureSize(db: ExportDatabase, moves: number, rounds: number, log: (line: string) => void): Promise<ExportSizeTimes> {
  const [{ v }] = (await db.ds.query('SELECT VERSION() AS v')) as { v: string }[]
  const t: ExportSizeTimes = { moves, mariadb: v, exportMs: [], floorMs: [], exportPeakMb: [], floorPeakMb: [], zipMb: 0, floorMb: 0 }
  for (let r = 0; r < rounds; r++) {
    const sides: [string, () => Promise<unknown>][] = [
      ['export', async () => { const sink = new CountingSink(); await streamBusinessExport(db.ds, sink); sink.end(); t.zipMb = sink.bytes / 1048576 }],
      ['floor', async () => { const sink = new CountingSink(); await bareStreamedWrite(db, sink); t.floorMb = sink.bytes / 1048576 }],
    ]
    if (r % 2) sides.reverse()
    for (const [name, work] of sides) {
      const { ms, peakMb } = await withPeak(work)
      if (name === 'export') { t.exportMs.push(ms); t.exportPeakMb.push(peakMb) } else { t.floorMs.push(ms); t.floorPeakMb.push(peakMb) }
      log(`  ${moves.toLocaleString('en-US')} moves, round ${r + 1} ${name}: ${(ms / 1000).toFixed(1)} s, peak +${peakMb.toFixed(0)} MB, ${(name === 'export' ? t.zipMb : t.floorMb).toFixed(1)} MB written`)
    }
  }
  log(`  ${moves.toLocaleString('en-US')} moves: export median ${(median(t.exportMs) / 1000).toFixed(1)} s vs floor ${(median(t.floorMs) / 1000).toFixed(1)} s (ratio ${(median(t.exportMs) / median(t.floorMs)).toFixed(2)})`)
  return t
}

export async function openEverythingOutDatabase(moves: number): Promise<ExportDatabase> {
  const database = exportDatabase(moves)
  const prepared = await prepareEnvironment('bench', { database, reset: false })
  const env = { ...prepared.env, LUMENYARD_DB_NAME: database }
  const ds = createDataSource(loadConfig({ ...process.env, ...env, NODE_ENV: 'test' }))
  await ds.initialize()
  await ds.runMigrations({ transaction: 'each' })
  const [{ n }] = (await ds.query('SELECT COUNT(*) AS n FROM users')) as { n: string }[]
  if (!Number(n)) await ds.query("INSERT INTO users (username, display_name, roles, password_hash, active) VALUES ('bench-out', 'Bench admin', 'admin', '-', 1)")
  return { ds, env, stopServer: () => prepared.stop() }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const { values } = parseArgs({ options: { rounds: { type: 'string', default: '1' }, moves: { type: 'string', default: LEDGER_SIZES.join(',') } } })
  const stops: (() => Promise<void>)[] = []
  try {
    await measureEverythingOut(Number(values.rounds), (l) => console.log(l), values.moves!.split(',').map(Number), stops)
  } finally {
    await stops[0]?.()
  }
}
