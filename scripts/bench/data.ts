// The two data sets every benchmark runs on, side by side so cost growth shows: the demo scenario, and
// 5,000 items × 20,000 balances × 1,000,000 moves (largeData.ts). Both live on the test MariaDB instance
// (LUMENYARD_DB_PORT), in databases of their own. Fixtures for the load tests are made fresh each run.
import type { DataSource } from 'typeorm'
import type { Takeoff } from '../../shared/schemas/takeoff.js'
import { loadConfig } from '../../server/config.js'
import { createDataSource } from '../../server/db/dataSource.js'
import { loadDemoScenario } from '../../server/demo/index.js'
import bcrypt from 'bcryptjs'
import { TEST_HASH_COST } from '../../tests/support/testHashCost.js'
import { prepareEnvironment, type PreparedEnvironment } from '../environment.js'
import { generateBenchData } from './largeData.js'

export type Size = 'demo' | 'large'
export const SIZES: Record<Size, { database: string; label: string }> = {
  demo: { database: 'lumenyard_bench_demo', label: 'demo' },
  large: { database: 'lumenyard_bench', label: '5,000 items × 20,000 balances × 1,000,000 moves' },
}

export const BENCH_PASSWORD = 'bench-password-for-load-tests'
export const SCANNERS = 50
export const WRITERS = 20

export interface Fixtures {
  scanners: string[]
  counter: string
  admin: string
  floorUserId: number
  scanCodes: string[]
  issueRows: { itemId: number; binId: number }[]
  pickLines: { listId: number; lineId: number; binScan: string; itemScan: string }[]
  oneItem: { itemId: number; balances: number }
  balances: number
  takeoff: Takeoff | null
}

export interface BenchDatabase {
  size: Size
  env: Record<string, string>
  ds: DataSource
  prepared: PreparedEnvironment
}

export async function openDatabase(size: Size, opts: { rebuild: boolean }, log: (line: string) => void): Promise<BenchDatabase> {
  const prepared = await prepareEnvironment('bench', { database: SIZES[size].database, reset: opts.rebuild })
  const env = { ...prepared.env, LUMENYARD_DB_NAME: SIZES[size].database }
  const ds = createDataSource(loadConfig({ ...process.env, ...env, NODE_ENV: 'test' }))
  await ds.initialize()
  await ds.runMigrations({ transaction: 'each' })
  const [{ n }] = (await ds.query('SELECT COUNT(*) AS n FROM items')) as { n: string }[]
  if (Number(n) === 0) {
    const started = Date.now()
    log(`building the ${SIZES[size].label} data set…`)
    if (size === 'demo') await loadDemoScenario(ds)
    else await generateBenchData(ds)
    log(`  built in ${((Date.now() - started) / 1000).toFixed(0)} s`)
  }
  return { size, env, ds, prepared }
}

async function insertId(ds: DataSource, sql: string, params: unknown[]): Promise<number> {
  return Number((await ds.query(sql, params)).insertId)
}

/** Users, stock rows of their own for each writer, pick lists for the scanners, scan codes, a 50-wall takeoff. */
export async function makeFixtures(ds: DataSource): Promise<Fixtures> {
  // Cost 4, as the test users (tests/support/testHashCost.ts): a sign-in checks at the hash's own cost, and the
  // bench signs in some seventy people per data set before it measures anything (sign-in is not a measure).
  const hash = await bcrypt.hash(BENCH_PASSWORD, TEST_HASH_COST)
  const scanners = Array.from({ length: SCANNERS }, (_, i) => `bench-scan-${String(i + 1).padStart(2, '0')}`)
  const people: [string, string][] = [...scanners.map((u) => [u, 'warehouse'] as [string, string]), ['bench-counter', 'counter'], ['bench-admin', 'admin']]
  await ds.query(
    `INSERT INTO users (username, display_name, password_hash, roles, active, locale) VALUES ${people.map(() => "(?, ?, ?, ?, 1, 'en')").join(', ')}
     ON DUPLICATE KEY UPDATE password_hash = VALUES(password_hash)`,
    people.flatMap(([u, role]) => [u, `Bench ${u}`, hash, role]),
  )
  const [{ id: floorUserId }] = await ds.query("SELECT id FROM users WHERE username = 'bench-admin'")

  // Each writer its own item and bin (no lot), with plenty on hand: the load measures the path, not waiting on locks.
  const issueRows: { itemId: number; binId: number }[] = (await ds.query(
    `SELECT b.item_id AS itemId, MIN(b.bin_id) AS binId FROM stock_balances b JOIN bins bn ON bn.id = b.bin_id JOIN items i ON i.id = b.item_id
      WHERE b.lot_id IS NULL AND bn.kind <> 'transit' AND bn.active = 1 AND i.active = 1 AND i.made_to_order = 0
      GROUP BY b.item_id ORDER BY b.item_id LIMIT ${WRITERS * 2}`,
  )).map((r: { itemId: number; binId: number }) => ({ itemId: Number(r.itemId), binId: Number(r.binId) }))
  if (issueRows.length < WRITERS * 2) throw new Error(`only ${issueRows.length} stock rows without a lot for ${WRITERS * 2} writers`)
  for (const r of issueRows) {
    await ds.query('UPDATE stock_balances SET on_hand = reserved + 100000000 WHERE item_id = ? AND bin_id = ? AND lot_key = 0', [r.itemId, r.binId])
  }

  // Pick lists in progress, one line each, on the second half of those rows.
  const customerId = await insertId(ds, 'INSERT INTO customers (code, name) VALUES (?, ?)', [`BN${Date.now() % 1e8}`, 'Bench contractor'])
  const jobId = await insertId(ds, 'INSERT INTO jobs (customer_id, name) VALUES (?, ?)', [customerId, 'Bench job'])
  const bomId = await insertId(ds, 'INSERT INTO boms (job_id) VALUES (?)', [jobId])
  const pickLines: Fixtures['pickLines'] = []
  for (const [n, row] of issueRows.slice(WRITERS).entries()) {
    const [place] = await ds.query(
      'SELECT bn.code, bn.warehouse_id, i.sku FROM bins bn JOIN items i ON i.id = ? WHERE bn.id = ?', [row.itemId, row.binId])
    const bomLineId = await insertId(ds, "INSERT INTO bom_lines (bom_id, line_no, item_id, description, qty, unit) VALUES (?, ?, ?, 'bench', 100000000, 'each')",
      [bomId, n + 1, row.itemId])
    const listId = await insertId(ds, "INSERT INTO pick_lists (bom_id, job_id, warehouse_id, status) VALUES (?, ?, ?, 'picking')", [bomId, jobId, place.warehouse_id])
    const lineId = await insertId(ds, 'INSERT INTO pick_list_lines (pick_list_id, bom_line_id, item_id, bin_id, qty) VALUES (?, ?, ?, ?, 100000000)',
      [listId, bomLineId, row.itemId, row.binId])
    pickLines.push({ listId, lineId, binScan: place.code, itemScan: place.sku })
  }

  // What a scanner sends for a stored GTIN-14 with a leading zero: the 13 digits of the EAN-13 symbol.
  const scanCodes = (await ds.query('SELECT gtin FROM items WHERE gtin IS NOT NULL ORDER BY id LIMIT 1000')).map((r: { gtin: string }) =>
    r.gtin.length === 14 && r.gtin.startsWith('0') ? r.gtin.slice(1) : r.gtin)

  const [most] = await ds.query('SELECT item_id, COUNT(*) AS n FROM stock_balances GROUP BY item_id ORDER BY n DESC, item_id LIMIT 1')
  const [{ n: balances }] = await ds.query('SELECT COUNT(*) AS n FROM stock_balances')

  // A 50-wall job from the walls of the saved takeoffs (the demo has a curved shower and straight walls).
  const saved: { input_json: string }[] = await ds.query('SELECT input_json FROM takeoffs ORDER BY id')
  const walls = saved.flatMap((t) => (JSON.parse(t.input_json) as Takeoff).walls)
  const takeoff: Takeoff | null = walls.length
    ? { name: 'Bench job, 50 walls', walls: Array.from({ length: 50 }, (_, i) => ({ ...walls[i % walls.length], name: `Wall ${i + 1}` })), looseLines: [] }
    : null

  return {
    scanners, counter: 'bench-counter', admin: 'bench-admin', floorUserId: Number(floorUserId), scanCodes, issueRows: issueRows.slice(0, WRITERS), pickLines,
    oneItem: { itemId: Number(most.item_id), balances: Number(most.n) }, balances: Number(balances), takeoff,
  }
}
