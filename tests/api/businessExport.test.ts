// Everything out, against the real MariaDB: the demo scenario loaded into a database of its own is taken out
// as one zip (a README workbook first, then a workbook per kind of record), with no password hash or secret in it and an audit
// entry for the download; then the files our imports read are brought into a second, empty database, and its
// stock on hand by item, warehouse, bin and lot, its stock value and its counts equal the source's.
import ExcelJS from 'exceljs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { EXPORT_PARTS } from '../../server/services/exports/businessExport.js'
import type { ReorderLine } from '../../shared/schemas/reorder.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { download, loadWorkbook, unzipEntries, workbookTexts } from '../support/downloads.js'
import { databaseNamed, dropDatabases, freshDatabase } from '../support/freshDatabase.js'
import { parseXlsxRows } from '../../server/services/imports/sheetRows.js'
import type { ImportSpec } from '../../server/services/imports/importTypes.js'

const SRC = databaseNamed('out_src')
const DST = databaseNamed('out_dst')
let src: ApiHarness
let dst: ApiHarness
let files: Map<string, Buffer>
const HOSTILE_NAME = "=cmd|' /C calc'!A1"
const HOSTILE_CONTACT = '@SUM(1)'
const HOSTILE_ITEM = '+2 spare anchors =A1'

interface Parsed { headers: string[]; rows: Record<string, ExcelJS.CellValue>[]; texts: string[]; sheets: string[] }
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
  const out = { headers, rows, texts, sheets: book.worksheets.map((w) => w.name) }
  parsed.set(file, out)
  return out
}

beforeAll(async () => {
  await freshDatabase(SRC, { demo: true })
  await freshDatabase(DST)
  src = await startApiHarness({ LUMENYARD_DB_NAME: SRC })
  dst = await startApiHarness({ LUMENYARD_DB_NAME: DST })
  // Text a spreadsheet would otherwise run as a formula (source: OWASP "CSV Injection") in an account's name and
  // contact and an item's name: it goes out and comes back in exactly as typed.
  await src.ds.query('UPDATE customers SET name = ?, contact_name = ? ORDER BY code LIMIT 1', [HOSTILE_NAME, HOSTILE_CONTACT])
  await src.ds.query('UPDATE items SET name = ? ORDER BY sku LIMIT 1', [HOSTILE_ITEM])
  // One warehouse's sales tax to four decimals, as some combined local rates are.
  await src.ds.query("UPDATE sales_tax_rates SET rate_percent = '7.1875' ORDER BY warehouse_id LIMIT 1")
}, 300_000)

afterAll(async () => {
  await src?.close()
  await dst?.close()
  await dropDatabases(SRC, DST)
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
      'open-purchase-orders', 'purchase-orders', 'purchase-order-lines', 'receipts', 'quotes', 'quote-lines', 'users', 'settings',
      'takeoffs', 'takeoff-walls', 'takeoff-loose-lines', 'bills', 'bill-lines', 'bill-cautions', 'sales-orders', 'sales-order-lines', 'payments']) {
      expect(files.has(`${f}.xlsx`), f).toBe(true)
    }
    // Counts straight from the source database.
    const count = async (table: string) => Number((await src.ds.query(`SELECT COUNT(*) AS n FROM ${table}`))[0].n)
    expect((await sheetRows('moves.xlsx')).rows.length).toBe(await count('stock_moves'))
    expect((await sheetRows('items.xlsx')).rows.length).toBe(await count('items'))
    expect((await sheetRows('users.xlsx')).rows.length).toBe(await count('users'))
    expect((await sheetRows('purchase-order-lines.xlsx')).rows.length).toBe(await count('purchase_order_lines'))
    for (const [file, table] of [['bills', 'boms'], ['bill-lines', 'bom_lines'], ['takeoffs', 'takeoffs'], ['sales-orders', 'sales_orders'],
      ['sales-order-lines', 'sales_order_lines'], ['payments', 'payments'], ['handovers', 'handover_ticket_lines'], ['returns', 'sales_return_lines'], ['account-credits', 'account_credits'], ['transfers', 'transfer_lines'], ['counts', 'count_lines']] as const) {
      expect((await sheetRows(`${file}.xlsx`)).rows.length, file).toBe(await count(table))
    }
    expect(await count('takeoffs')).toBeGreaterThan(0)
    expect(await count('bom_lines')).toBeGreaterThan(0)
    // Walls, loose lines and cautions are read out of the saved JSON here in the test (JSON.parse), one row each.
    const takeoffs: { id: number; input_json: string }[] = await src.ds.query('SELECT id, input_json FROM takeoffs ORDER BY id')
    const walls = takeoffs.flatMap((t) => (JSON.parse(t.input_json).walls as { name: string; wetArea: boolean }[]).map((w) => ({ takeoff: t.id, ...w })))
    const loose = takeoffs.flatMap((t) => (JSON.parse(t.input_json).looseLines as { sku: string; quantity: number }[]).map((l) => ({ takeoff: t.id, ...l })))
    expect(walls.length).toBeGreaterThan(0)
    const wallRows = (await sheetRows('takeoff-walls.xlsx')).rows
    expect(wallRows.map((r) => [r.Takeoff, r.Name, r['Wet area']])).toEqual(walls.map((w) => [w.takeoff, w.name, w.wetArea ? 'yes' : 'no']))
    expect((await sheetRows('takeoff-loose-lines.xlsx')).rows.map((r) => [r.Takeoff, r.SKU, r.Quantity])).toEqual(loose.map((l) => [l.takeoff, l.sku, l.quantity]))
    const boms: { id: number; cautions_json: string | null }[] = await src.ds.query('SELECT id, cautions_json FROM boms ORDER BY id')
    const cautions = boms.flatMap((b) => (JSON.parse(b.cautions_json ?? '[]') as { message: string }[]).map((c) => [b.id, c.message]))
    expect(cautions.length).toBeGreaterThan(0)
    expect((await sheetRows('bill-cautions.xlsx')).rows.map((r) => [r.Bill, r.Text])).toEqual(cautions)
    // Each bill line keeps its bill's revision.
    const lineRevisions: { bom_id: number; line_no: number; revision: number; qty: number }[] = await src.ds.query(
      'SELECT l.bom_id, l.line_no, b.revision, l.qty FROM bom_lines l JOIN boms b ON b.id = l.bom_id ORDER BY l.bom_id, l.line_no')
    expect((await sheetRows('bill-lines.xlsx')).rows.map((r) => [r.Bill, r.Line, r.Revision, r.Quantity]))
      .toEqual(lineRevisions.map((l) => [l.bom_id, l.line_no, l.revision, l.qty]))
    // Payments carry no card number: no run of 13 to 19 digits passes the Luhn check (source: ISO/IEC 7812-1,
    // the Luhn check digit of payment card numbers).
    const luhn = (d: string) => [...d].reverse().reduce((sum, ch, i) => sum + (i % 2 ? [0, 2, 4, 6, 8, 1, 3, 5, 7, 9][Number(ch)] : Number(ch)), 0) % 10 === 0
    for (const t of (await sheetRows('payments.xlsx')).texts) {
      for (const run of t.replace(/[ -]/g, '').match(/\d{13,19}/g) ?? []) expect(luhn(run), `payments: ${run}`).toBe(false)
    }
    expect((await sheetRows('payments.xlsx')).headers.filter((h) => /card|pan|cvc|cvv|expir/i.test(h))).toEqual([])

    // No secrets: no bcrypt hash (source: OpenBSD bcrypt's modular crypt format, $2a$/$2b$/$2y$ and a two-digit
    // cost), no session secret, no database password, and no column that could hold them.
    const hashes: { password_hash: string }[] = await src.ds.query('SELECT password_hash FROM users WHERE password_hash IS NOT NULL')
    expect(hashes.length).toBeGreaterThan(0)
    const secrets = [src.config.session.secret, src.config.db.password, ...hashes.map((u) => u.password_hash)]
    for (const [name, bytes] of files) {
      const texts = name === 'README.xlsx' ? workbookTexts(await loadWorkbook(bytes)) : name.endsWith('.xlsx') ? (await sheetRows(name)).texts : []
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
  }, 900_000)

  it('has a file for every table the business records, or names the table and why it is left out', async () => {
    expect(files, 'the download test ran first').toBeDefined()
    // The tables come from the database itself; a file covers a table its query reads.
    const tables: { name: string }[] = await src.ds.query(
      "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' ORDER BY table_name")
    expect(tables.length).toBeGreaterThan(40)
    const read = new Set(EXPORT_PARTS.flatMap((p) => [...p.sql.matchAll(/\b(?:FROM|JOIN)\s+([a-z_]+)/gi)].map((m) => m[1])))
    const leftOutSheet = (await loadWorkbook(files.get('README.xlsx')!)).getWorksheet('Left out')!
    const leftOut = new Map<string, string>()
    leftOutSheet.eachRow((row, n) => { if (n > 1) leftOut.set(String(row.getCell(1).value), String(row.getCell(2).value ?? '')) })
    const missing = tables.map((t) => t.name).filter((t) => !read.has(t) && !leftOut.get(t)?.trim())
    // common practice: a full data export covers every record type, and says what it leaves out.
    expect(missing).toEqual([])
  })

  it('describes every column of every sheet in a README workbook, the first entry, read as the imports read a file', async () => {
    expect(files, 'the download test ran first').toBeDefined()
    expect([...files.keys()][0]).toBe('README.xlsx')
    // The README's first sheet, through the reader every import uses (exceljs's streaming reader, header matching).
    const spec: ImportSpec = {
      columns: [
        { key: 'file', header: 'File', kind: 'text', required: true },
        { key: 'sheet', header: 'Sheet', kind: 'text', required: true },
        { key: 'column', header: 'Column', kind: 'text', required: true },
        { key: 'meaning', header: 'Meaning', kind: 'text', required: true },
        { key: 'allowed', header: 'Allowed values or format', kind: 'text', required: true },
        { key: 'readBy', header: 'Read by an import', kind: 'text', required: true },
      ],
      maxRows: 5000, maxColumns: 10,
    }
    const parsedReadme = await parseXlsxRows(files.get('README.xlsx')!, spec)
    if (!parsedReadme.ok) throw new Error(parsedReadme.message)
    expect(parsedReadme.sheet.issues).toEqual([])
    const described = new Map(parsedReadme.sheet.rows.map((r) => [`${r.values.file} | ${r.values.column}`, r.values as Record<string, string>]))
    // Every column of every sheet of every workbook has its row (common practice: a data dictionary describes
    // every column it ships), and the README describes no column the files do not have.
    const shipped = new Set<string>()
    for (const name of files.keys()) {
      if (!name.endsWith('.xlsx') || name === 'README.xlsx') continue
      const { headers, sheets } = await sheetRows(name)
      expect(sheets.length, name).toBe(1)
      expect(headers.length, name).toBeGreaterThan(0)
      for (const h of headers) {
        const row = described.get(`${name} | ${h}`)
        expect(row, `${name}: ${h}`).toBeDefined()
        expect(row!.sheet, `${name}: ${h}`).toBe(sheets[0])
        expect(row!.meaning.length, `${name}: ${h}`).toBeGreaterThan(3)
        shipped.add(`${name} | ${h}`)
      }
    }
    expect([...described.keys()].filter((k) => !shipped.has(k))).toEqual([])

    // A column said to be read by an import is a column of that import's own blank template, and a column of
    // the template is never said to be skipped: the README and the templates agree on what reads back in.
    const admin = await src.as('admin')
    const templates: [string, string][] = [['items.xlsx', '/api/items/import/template.xlsx'], ['stock-by-bin.xlsx', '/api/imports/opening_stock/template.xlsx'],
      ['usage-history.xlsx', '/api/imports/usage_history/template.xlsx'], ['accounts.xlsx', '/api/imports/accounts/template.xlsx'],
      ['vendor-items.xlsx', '/api/imports/vendor_items/template.xlsx'], ['open-purchase-orders.xlsx', '/api/imports/purchase_orders/template.xlsx'],
      ...(['warehouses', 'bins', 'averages-and-minimums:averages', 'price-levels', 'price-rules', 'vendors', 'reorder-settings', 'lead-times', 'sales-tax'].map((f) => {
        const [file, kind = file] = f.split(':')
        return [`${file}.xlsx`, `/api/imports/${kind.replace(/-/g, '_')}/template.xlsx`] as [string, string]
      }))]
    for (const [file, path] of templates) {
      const res = await download(admin, path)
      expect(res.status, path).toBe(200)
      const template = (await loadWorkbook(res.body as Buffer)).worksheets[0]
      const templateHeaders = (template.getRow(1).values as ExcelJS.CellValue[]).slice(1).map(String)
      for (const h of (await sheetRows(file)).headers) {
        const readBy = described.get(`${file} | ${h}`)!.readBy
        expect(readBy.startsWith('yes'), `${file}: ${h} (${readBy})`).toBe(templateHeaders.includes(h))
      }
    }
    // No other file claims an import reads it.
    const claimed = [...described.values()].filter((r) => r.readBy.startsWith('yes')).map((r) => r.file)
    expect([...new Set(claimed)].sort()).toEqual(templates.map(([f]) => f).sort())

    // A column whose values come from a list holds only values from that list (common practice: a data
    // dictionary's allowed values cover the data it describes).
    const listed = [...described.values()].filter((r) => r.allowed.startsWith('One of: '))
    expect(listed.length).toBeGreaterThan(8)
    for (const r of listed) {
      const allowed = r.allowed.slice('One of: '.length).replace(/\.$/, '').split(', ')
      const seen = new Set((await sheetRows(r.file)).rows.map((row) => row[r.column]).filter((x) => x !== null && x !== undefined && x !== ''))
      expect([...seen].filter((x) => !allowed.includes(String(x))), `${r.file}: ${r.column}`).toEqual([])
    }
    const moveTypes = (await sheetRows('moves.xlsx')).rows.map((row) => row.Type)
    expect(new Set(moveTypes).size, 'the demo ledger has several kinds of move').toBeGreaterThan(4)
  })

  it('reads the ledger in its own order, never sorting it in a temporary table', async () => {
    // source: MariaDB's EXPLAIN documentation: "Using temporary" and "Using filesort" mean the rows are gathered
    // and sorted before the first is sent; over a million-move ledger that is the whole ledger, held by the server.
    for (const part of EXPORT_PARTS.filter((p) => /FROM stock_moves m JOIN/.test(p.sql))) {
      const plan: { table: string; Extra: string | null }[] = await src.ds.query(`EXPLAIN ${part.sql}`)
      expect(plan[0].table, part.file).toBe('m')
      expect(plan.filter((row) => /temporary|filesort/i.test(row.Extra ?? '')), part.file).toEqual([])
    }
  })

  it('refuses other roles', async () => {
    for (const role of ['counter', 'buyer', 'warehouse', 'viewer'] as const) {
      expect((await (await src.as(role)).get('/api/business-export')).status).toBe(403)
    }
    expect((await src.agent().get('/api/business-export')).status).toBe(401)
  })

  it('reads back into an empty database: the same stock on hand by bin and lot, the same value to the cent', async () => {
    expect(files, 'the download test ran first').toBeDefined()
    // Everything comes in through the imports, in the order a new business would bring it: what a file
    // refers to is there before it (warehouses before bins and stock, levels before accounts, vendors before items).
    const admin = await dst.as('admin')
    const bring = async (kind: string, file: string) => {
      if (!(await sheetRows(file)).rows.length) return // the source holds none (the demo sets no price levels)
      const done = await admin.post(`/api/imports/${kind}/commit`).set(CSRF).attach('file', files.get(file)!, file)
      expect(done.status, `${kind}: ${JSON.stringify(done.body).slice(0, 600)}`).toBe(200)
      expect(done.body.errorRows).toBe(0)
    }
    await bring('warehouses', 'warehouses.xlsx')
    await bring('bins', 'bins.xlsx')
    await bring('sales_tax', 'sales-tax.xlsx')
    await bring('price_levels', 'price-levels.xlsx')
    const items = await admin.post('/api/items/import/commit').set(CSRF).attach('file', files.get('items.xlsx')!, 'items.xlsx')
    expect(items.status, JSON.stringify(items.body).slice(0, 400)).toBe(200)
    for (const [kind, file] of [['price_rules', 'price-rules.xlsx'], ['vendors', 'vendors.xlsx'], ['opening_stock', 'stock-by-bin.xlsx'], ['averages', 'averages-and-minimums.xlsx'], ['accounts', 'accounts.xlsx'],
      ['vendor_items', 'vendor-items.xlsx'], ['purchase_orders', 'open-purchase-orders.xlsx'], ['usage_history', 'usage-history.xlsx'],
      ['reorder_settings', 'reorder-settings.xlsx'], ['lead_times', 'lead-times.xlsx']] as const) await bring(kind, file)

    // The same warehouses and bins (transit bins are made by transfers, not brought in), price levels and breaks, vendors.
    const setup = (h: ApiHarness) => Promise.all([
      h.ds.query('SELECT code, name, address, bin_pattern, active FROM warehouses ORDER BY code'),
      h.ds.query("SELECT w.code AS warehouse, b.code, b.kind, b.active FROM bins b JOIN warehouses w ON w.id = b.warehouse_id WHERE b.kind <> 'transit' ORDER BY w.code, b.code"),
      h.ds.query('SELECT code, name, percent_off, active FROM price_levels ORDER BY code'),
      h.ds.query('SELECT l.code AS level, i.sku, r.min_qty, r.basis, r.price, r.percent_off FROM price_rules r JOIN items i ON i.id = r.item_id LEFT JOIN price_levels l ON l.id = r.level_id ORDER BY level, i.sku, r.basis, r.min_qty'),
      h.ds.query('SELECT code, name, contact_name, email, phone, address, terms, currency, lead_time_days, active FROM vendors ORDER BY code'),
    ])
    const srcSetup = await setup(src)
    expect([srcSetup[0].length, srcSetup[1].length, srcSetup[4].length].every((n) => n > 0)).toBe(true)
    // The same sales tax rate and label at each warehouse, to the fourth decimal.
    const taxRates = (h: ApiHarness) => h.ds.query('SELECT w.code, t.rate_percent, t.label FROM sales_tax_rates t JOIN warehouses w ON w.id = t.warehouse_id ORDER BY w.code')
    const srcTax = await taxRates(src)
    expect(srcTax.length).toBeGreaterThan(1)
    expect(srcTax.map((t: { rate_percent: string }) => t.rate_percent)).toContain('7.1875')
    expect(await taxRates(dst)).toEqual(srcTax)
    expect(await setup(dst)).toEqual(srcSetup)

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
    // The same moving-average cost and manual minimum per item and warehouse, warehouses that hold none of the
    // item now included: the reorder figures value an order quantity at that cost (unit cost C of the economic
    // order quantity, from memory: Silver, Pyke & Peterson, ch. 5).
    const averages = (h: ApiHarness) => h.ds.query(
      `SELECT i.sku, w.code, iw.avg_cost, iw.min_qty FROM item_warehouses iw JOIN items i ON i.id = iw.item_id JOIN warehouses w ON w.id = iw.warehouse_id
        WHERE iw.avg_cost > 0 OR iw.min_qty IS NOT NULL ORDER BY i.sku, w.code`)
    const srcAverages = await averages(src)
    const unstocked = await src.ds.query(
      `SELECT COUNT(*) AS n FROM item_warehouses iw WHERE iw.avg_cost > 0 AND NOT EXISTS (SELECT 1 FROM stock_balances s WHERE s.item_id = iw.item_id AND s.warehouse_id = iw.warehouse_id AND s.on_hand <> 0)`)
    expect(Number(unstocked[0].n), 'averages of warehouses that hold none of the item now').toBeGreaterThan(5)
    expect(await averages(dst)).toEqual(srcAverages)
    // The new ledger equals its balances (common practice: a perpetual inventory's ledger sums to its stock).
    const gaps = await dst.ds.query(
      `SELECT m.item_id, m.bin_id, SUM(m.qty) AS moved, MAX(b.on_hand) AS on_hand FROM stock_moves m
       JOIN stock_balances b ON b.item_id = m.item_id AND b.bin_id = m.bin_id AND b.lot_key = COALESCE(m.lot_id, 0)
       GROUP BY m.item_id, m.bin_id, m.lot_id HAVING moved <> on_hand`)
    expect(gaps).toEqual([])

    // The same item names, formula-looking ones included.
    const itemNames = (h: ApiHarness) => h.ds.query('SELECT sku, name FROM items ORDER BY sku')
    expect((await itemNames(src)).map((r: { name: string }) => r.name)).toContain(HOSTILE_ITEM)
    expect(await itemNames(dst)).toEqual(await itemNames(src))
    // The same accounts, field by field (formula-looking name and contact included).
    const accounts = (h: ApiHarness) => h.ds.query(
      `SELECT c.code, c.name, c.contact_name, c.email, c.phone, c.address, c.notes, pl.code AS level, t.exempt_certificate, t.exempt_until
         FROM customers c LEFT JOIN customer_terms t ON t.customer_id = c.id LEFT JOIN price_levels pl ON pl.id = t.price_level_id ORDER BY c.code`)
    expect((await accounts(src)).some((a: { name: string; contact_name: string }) => a.name === HOSTILE_NAME && a.contact_name === HOSTILE_CONTACT)).toBe(true)
    expect(await accounts(dst)).toEqual(await accounts(src))
    // The same vendor items: vendor, item, vendor SKU, pack, minimum, cost, preferred, and the lead time the
    // reorder figures read (the item's, else its vendor's).
    const vendorItems = (h: ApiHarness) => h.ds.query(
      `SELECT v.code AS vendor, i.sku, vi.vendor_sku, vi.pack_qty, vi.min_order_qty, vi.unit_cost, vi.preferred, COALESCE(vi.lead_time_days, v.lead_time_days) AS lead
         FROM vendor_items vi JOIN vendors v ON v.id = vi.vendor_id JOIN items i ON i.id = vi.item_id ORDER BY v.code, i.sku`)
    const srcVendorItems = await vendorItems(src)
    expect(srcVendorItems.length).toBeGreaterThan(10)
    expect(await vendorItems(dst)).toEqual(srcVendorItems)
    // The same open purchase orders: number, vendor, warehouse, and each line's item, ordered, received and cost.
    const openOrders = (h: ApiHarness) => h.ds.query(
      `SELECT o.number, v.code AS vendor, w.code AS warehouse, i.sku, l.qty_ordered, l.qty_received, l.unit_cost
         FROM purchase_orders o JOIN purchase_order_lines l ON l.po_id = o.id JOIN vendors v ON v.id = o.vendor_id JOIN warehouses w ON w.id = o.warehouse_id
         JOIN items i ON i.id = l.item_id WHERE o.status IN ('approved', 'sent', 'partly_received') ORDER BY o.number, i.sku, l.qty_ordered`)
    const srcOrders = await openOrders(src)
    expect(srcOrders.length).toBeGreaterThan(0)
    expect(await openOrders(dst)).toEqual(srcOrders)
    // On order per item and warehouse: ordered less received on open orders (common practice: the on-order
    // term of the inventory position).
    const onOrder = (h: ApiHarness) => h.ds.query(
      `SELECT i.sku, w.code AS warehouse, SUM(l.qty_ordered - l.qty_received) AS qty FROM purchase_orders o JOIN purchase_order_lines l ON l.po_id = o.id
         JOIN items i ON i.id = l.item_id JOIN warehouses w ON w.id = o.warehouse_id WHERE o.status IN ('approved', 'sent', 'partly_received')
        GROUP BY i.sku, w.code HAVING qty > 0 ORDER BY i.sku, w.code`)
    expect(await onOrder(dst)).toEqual(await onOrder(src))

    // The same reorder suggestions, line by line: the inputs (stock, on order, use per day and its spread, lead
    // time and its spread, ABC class, vendor, unit cost) and what the screen works out from them (safety stock, reorder point,
    // order-up-to level, economic order quantity, lot size, the quantity to order, status). The lead time's source may read 'vendorItem' where the source had the vendor's:
    // the vendor items file carries the lead time each item is bought at. Lines the source holds stock for open sales orders on, or has accepted suggestions
    // or draft orders for, differ by those (they are documents of the source, not brought in): the position is
    // compared without them. source for the figures: the reorder-point method, safety stock z·σ over the lead
    // time (from memory: Silver, Pyke & Peterson, Inventory Management and Production Planning and Scheduling, ch. 7).
    const reorder = async (h: ApiHarness) => {
      const res = await (await h.as('buyer')).get('/api/reorder/suggestions')
      expect(res.status).toBe(200)
      return (res.body.lines as ReorderLine[]).map((l) => ({
        line: `${l.sku}@${l.warehouseCode}`, onHand: l.onHand, onOrder: l.onOrder, meanDaily: l.meanDaily, sdDaily: l.sdDaily,
        lastUsed: l.lastUsedDate, abc: l.abcClass, vendor: l.vendorCode, leadTime: l.leadTimeDays, leadTimeSd: l.leadTimeSdDays,
        safetyStock: l.safetyStock, reorderPoint: l.reorderPoint, orderUpTo: l.orderUpToLevel, overridden: l.overridden,
        heldOrPending: Boolean(l.reserved || l.pendingQty), status: l.status as string | null,
        unitCost: l.unitCost, eoq: l.eoq, lotSize: l.lotSize, suggestedOrder: l.suggestedOrder as number | null,
      })).sort((a, b) => a.line.localeCompare(b.line))
    }
    const srcReorder = (await reorder(src)).map((l) => (l.heldOrPending ? { ...l, status: null, suggestedOrder: null } : l))
    expect(srcReorder.filter((l) => l.meanDaily > 0).length).toBeGreaterThan(10)
    // The demo's receipts are not against its orders, so its lead times are the vendors' stated ones; lead times
    // observed before are brought in and read the same in tests/api/setupImports.test.ts.
    expect(srcReorder.filter((l) => l.reorderPoint > 0).length, 'lines with a reorder point').toBeGreaterThan(10)
    const dstReorder = (await reorder(dst)).map((l, i) => (srcReorder[i]?.heldOrPending ? { ...l, status: null, suggestedOrder: null, heldOrPending: true } : l))
    expect(dstReorder).toEqual(srcReorder)
  }, 300_000)
})
