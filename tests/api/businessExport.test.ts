// Everything out, against the real MariaDB: the demo scenario loaded into a database of its own is taken out
// as one zip (a workbook per kind of record and a README), with no password hash or secret in it and an audit
// entry for the download; then the files our imports read are brought into a second, empty database, and its
// stock on hand by item, warehouse, bin and lot, its stock value and its counts equal the source's.
import path from 'node:path'
import ExcelJS from 'exceljs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { adminSql, dataRoot } from '../../scripts/embeddedMariadb.js'
import { loadConfig } from '../../server/config.js'
import { createDataSource } from '../../server/db/dataSource.js'
import { loadDemoScenario } from '../../server/demo/index.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { download, loadWorkbook, unzipEntries } from '../support/downloads.js'

const socket = path.join(dataRoot, 'test', 'mysqld.sock')
const base = loadConfig(process.env).db.database
const SRC = `${base}_out_src`
const DST = `${base}_out_dst`
let src: ApiHarness
let dst: ApiHarness
let files: Map<string, Buffer>

async function freshDatabase(name: string, withDemo: boolean) {
  const user = loadConfig(process.env).db.user
  // The app user may create only its own database: these come from the instance admin, as in the backup test.
  await adminSql({ socket }, `DROP DATABASE IF EXISTS \`${name}\`; CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci; GRANT ALL PRIVILEGES ON \`${name}\`.* TO '${user}'@'127.0.0.1'`)
  const ds = createDataSource(loadConfig({ ...process.env, LUMENYARD_DB_NAME: name }))
  await ds.initialize()
  try {
    await ds.runMigrations({ transaction: 'each' })
    if (withDemo) await loadDemoScenario(ds)
  } finally {
    await ds.destroy()
  }
}

interface Parsed { headers: string[]; rows: Record<string, ExcelJS.CellValue>[]; texts: string[] }
const parsed = new Map<string, Parsed>()

/** A workbook's first sheet as objects keyed by the header row, and every text it shows (read once per file). */
async function sheetRows(file: string): Promise<Parsed> {
  const known = parsed.get(file)
  if (known) return known
  const book = await loadWorkbook(files.get(file)!)
  const ws = book.worksheets[0]
  const headers = (ws.getRow(1).values as ExcelJS.CellValue[]).slice(1).map(String)
  const rows: Record<string, ExcelJS.CellValue>[] = []
  const texts: string[] = [...headers]
  ws.eachRow((row, n) => {
    if (n === 1) return
    rows.push(Object.fromEntries(headers.map((h, i) => [h, row.getCell(i + 1).value])))
    row.eachCell((cell) => { if (typeof cell.value === 'string') texts.push(cell.value) })
  })
  const out = { headers, rows, texts }
  parsed.set(file, out)
  return out
}

beforeAll(async () => {
  await freshDatabase(SRC, true)
  await freshDatabase(DST, false)
  src = await startApiHarness({ LUMENYARD_DB_NAME: SRC })
  dst = await startApiHarness({ LUMENYARD_DB_NAME: DST })
}, 300_000)

afterAll(async () => {
  await src?.close()
  await dst?.close()
  await adminSql({ socket }, `DROP DATABASE IF EXISTS \`${SRC}\`; DROP DATABASE IF EXISTS \`${DST}\``)
})

describe('everything out', () => {
  it('downloads the whole business as one zip with a README, no password hash or secret, and an audit entry', async () => {
    const auditsBefore = Number((await src.ds.query("SELECT COUNT(*) AS n FROM audit_entries WHERE action = 'business.export'"))[0].n)
    const res = await download(await src.as('admin'), '/api/business-export')
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toContain('application/zip')
    files = await unzipEntries(res.body as Buffer)
    console.log(`everything out: ${(res.body as Buffer).length} bytes, ${files.size} files`)
    // One file per kind of record the business holds (common practice: a full data export covers every record type).
    for (const f of ['items', 'warehouses', 'bins', 'lots', 'stock-by-bin', 'moves', 'accounts', 'jobs', 'vendors', 'vendor-items',
      'open-purchase-orders', 'purchase-orders', 'purchase-order-lines', 'receipts', 'quotes', 'quote-lines', 'users', 'settings']) {
      expect(files.has(`${f}.xlsx`), f).toBe(true)
    }
    const readme = files.get('README.txt')!.toString('utf8')
    // Every column of every workbook is explained in the README, under its file.
    for (const [name] of files) {
      if (!name.endsWith('.xlsx')) continue
      const { headers } = await sheetRows(name)
      const section = readme.slice(readme.indexOf(`${name} (sheet`))
      expect(readme.includes(`${name} (sheet`), name).toBe(true)
      for (const h of headers) expect(section.includes(`  - ${h}: `), `${name}: ${h}`).toBe(true)
    }
    // Counts straight from the source database.
    const count = async (table: string) => Number((await src.ds.query(`SELECT COUNT(*) AS n FROM ${table}`))[0].n)
    expect((await sheetRows('moves.xlsx')).rows.length).toBe(await count('stock_moves'))
    expect((await sheetRows('items.xlsx')).rows.length).toBe(await count('items'))
    expect((await sheetRows('users.xlsx')).rows.length).toBe(await count('users'))
    expect((await sheetRows('purchase-order-lines.xlsx')).rows.length).toBe(await count('purchase_order_lines'))

    // No secrets: no bcrypt hash (source: OpenBSD bcrypt's modular crypt format, $2a$/$2b$/$2y$ and a two-digit
    // cost), no session secret, no database password, and no column that could hold them.
    const hashes: { password_hash: string }[] = await src.ds.query('SELECT password_hash FROM users WHERE password_hash IS NOT NULL')
    expect(hashes.length).toBeGreaterThan(0)
    const secrets = [src.config.session.secret, src.config.db.password, ...hashes.map((u) => u.password_hash)]
    for (const [name, bytes] of files) {
      const texts = name.endsWith('.xlsx') ? (await sheetRows(name)).texts : name.endsWith('.txt') ? [bytes.toString('utf8')] : []
      for (const t of texts) {
        expect(/\$2[aby]\$\d\d\$/.test(t), `${name}: ${t.slice(0, 20)}`).toBe(false)
        for (const s of secrets) expect(t.includes(s), name).toBe(false)
      }
    }
    expect((await sheetRows('users.xlsx')).headers.filter((h) => /password|hash|session|epoch/i.test(h))).toEqual([])

    const audits: { detail: string; user_id: number }[] = await src.ds.query("SELECT detail, user_id FROM audit_entries WHERE action = 'business.export' ORDER BY id")
    expect(audits.length).toBe(auditsBefore + 1)
    console.log(`everything out took ${JSON.parse(audits.at(-1)!.detail).ms} ms on the server`)
    expect(JSON.parse(audits.at(-1)!.detail)).toMatchObject({ finished: true, rows: { moves: await count('stock_moves') } })
  }, 300_000)

  it('refuses other roles', async () => {
    for (const role of ['counter', 'buyer', 'warehouse', 'viewer'] as const) {
      expect((await (await src.as(role)).get('/api/business-export')).status).toBe(403)
    }
    expect((await src.agent().get('/api/business-export')).status).toBe(401)
  })

  it('reads back into an empty database: the same stock on hand by bin and lot, the same value to the cent', async () => {
    expect(files, 'the download test ran first').toBeDefined()
    // Warehouses, bins and price levels have no import: set them up from their files as an administrator would.
    for (const w of (await sheetRows('warehouses.xlsx')).rows) {
      await dst.ds.query('INSERT INTO warehouses (code, name, address, active) VALUES (?, ?, ?, ?)', [w.Code, w.Name, w.Address ?? null, w.Active === 'yes' ? 1 : 0])
    }
    for (const b of (await sheetRows('bins.xlsx')).rows) {
      await dst.ds.query('INSERT INTO bins (warehouse_id, code, kind, active) SELECT id, ?, ?, ? FROM warehouses WHERE code = ?', [b.Bin, b.Kind, b.Active === 'yes' ? 1 : 0, b.Warehouse])
    }
    for (const p of (await sheetRows('price-levels.xlsx')).rows) {
      await dst.ds.query('INSERT INTO price_levels (code, name, percent_off, active) VALUES (?, ?, ?, ?)', [p.Code, p.Name, p['Percent off'], p.Active === 'yes' ? 1 : 0])
    }
    const admin = await dst.as('admin')
    const items = await admin.post('/api/items/import/commit').set(CSRF).attach('file', files.get('items.xlsx')!, 'items.xlsx')
    expect(items.status, JSON.stringify(items.body).slice(0, 400)).toBe(200)
    for (const [kind, file] of [['opening_stock', 'stock-by-bin.xlsx'], ['accounts', 'accounts.xlsx']] as const) {
      const done = await admin.post(`/api/imports/${kind}/commit`).set(CSRF).attach('file', files.get(file)!, file)
      expect(done.status, `${kind}: ${JSON.stringify(done.body).slice(0, 600)}`).toBe(200)
      expect(done.body.errorRows).toBe(0)
    }

    const count = async (h: ApiHarness, table: string) => Number((await h.ds.query(`SELECT COUNT(*) AS n FROM ${table}`))[0].n)
    expect(await count(dst, 'items')).toBe(await count(src, 'items'))
    expect(await count(dst, 'customers')).toBe(await count(src, 'customers'))
    // On hand by item, warehouse, bin and lot (transit bins hold stock on the way, not on hand).
    const byPlace = (h: ApiHarness) => h.ds.query(
      `SELECT i.sku, w.code AS warehouse, b.code AS bin, COALESCE(l.code, '') AS lot, SUM(s.on_hand) AS qty FROM stock_balances s
       JOIN items i ON i.id = s.item_id JOIN warehouses w ON w.id = s.warehouse_id JOIN bins b ON b.id = s.bin_id LEFT JOIN lots l ON l.id = s.lot_id
       WHERE b.kind <> 'transit' GROUP BY i.sku, w.code, b.code, lot HAVING qty <> 0 ORDER BY i.sku, w.code, b.code, lot`)
    const srcPlaces = await byPlace(src)
    expect(srcPlaces.length).toBeGreaterThan(100)
    expect(await byPlace(dst)).toEqual(srcPlaces)
    // Stock value by warehouse to the cent: on hand × moving-average cost (source: the weighted-average cost
    // method of inventory valuation, any cost accounting textbook).
    const value = (h: ApiHarness) => h.ds.query(
      `SELECT w.code, ROUND(SUM(s.on_hand * iw.avg_cost), 2) AS value FROM stock_balances s JOIN bins b ON b.id = s.bin_id
       JOIN item_warehouses iw ON iw.item_id = s.item_id AND iw.warehouse_id = s.warehouse_id JOIN warehouses w ON w.id = s.warehouse_id
       WHERE b.kind <> 'transit' GROUP BY w.code ORDER BY w.code`)
    const srcValue = await value(src)
    expect(srcValue.length).toBeGreaterThan(1)
    expect(await value(dst)).toEqual(srcValue)
    // The new ledger equals its balances (common practice: a perpetual inventory's ledger sums to its stock).
    const gaps = await dst.ds.query(
      `SELECT m.item_id, m.bin_id, SUM(m.qty) AS moved, MAX(b.on_hand) AS on_hand FROM stock_moves m
       JOIN stock_balances b ON b.item_id = m.item_id AND b.bin_id = m.bin_id AND b.lot_key = COALESCE(m.lot_id, 0)
       GROUP BY m.item_id, m.bin_id, m.lot_id HAVING moved <> on_hand`)
    expect(gaps).toEqual([])
  }, 300_000)
})
