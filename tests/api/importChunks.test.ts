// A commit checks and writes a file a chunk at a time inside its one transaction. With chunks made two rows long,
// rows that belong together stand on both sides of a chunk's end: an item's moving average blended over two
// chunks, an order whose lines (and whose first, fully received line) straddle one, a new vendor named in one chunk
// and used in the next, accounts with terms in several. Each comes out as the whole file at once would have it;
// a problem in a later chunk leaves nothing of the earlier ones, with every problem counted. Real MariaDB.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { AuditActor } from '../../server/services/auditService.js'
import { commitImport, previewImport, reverseImport, type DataImportDefinition, type ImportProgress } from '../../server/services/imports/dataImports.js'
import { DATA_IMPORTS } from '../../server/services/imports/dataImportKinds.js'
import { AppError } from '../../server/errors.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, insertId, tagOf } from '../support/fixtureRows.js'
import { createWarehouse } from '../support/stockFixtures.js'

let h: ApiHarness
let actor: AuditActor
const tag = tagOf()
const WH = `CK${tag}`
const VENDOR = `CKV${tag}`
const BLK = `CK-BLK-${tag}`
const SEAL = `CK-SEAL-${tag}`
const ids = { blk: 0, seal: 0, wh: 0, bins: {} as Record<string, number> }
const today = new Date().toISOString().slice(0, 10)
/** Two rows a chunk: row 2 and 3 are one chunk, rows 4 and 5 the next, and so on (the header is row 1). */
const SMALL = { chunkRows: 2 }

beforeAll(async () => {
  h = await startApiHarness()
  actor = { userId: (await h.user(`t-chunks-${tag}`, ['admin'])).id }
  ids.blk = await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test clear 8x8 block', 'glass_block', 'each', 0)", [BLK])
  ids.seal = await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test clear sealant', 'sealant', 'tube', 0)", [SEAL])
  const wh = await createWarehouse(h.ds, WH, ['A-01-1', 'A-01-2', 'A-01-3'])
  ids.wh = wh.id
  ids.bins = wh.bins
  await h.ds.query('INSERT INTO vendors (code, name) VALUES (?, ?)', [VENDOR, `Test glassworks ${tag}`])
})
afterAll(() => h?.close())

const csv = (...lines: string[]) => ({ kind: 'csv' as const, filename: `chunks-${tag}-${Math.random()}.csv`, data: Buffer.from(lines.join('\r\n') + '\r\n', 'utf8') })
const def = (kind: keyof typeof DATA_IMPORTS) => DATA_IMPORTS[kind] as DataImportDefinition<unknown>

/** The rows each progress call reported, by kind of call. */
function recorder() {
  const seen = { read: [] as number[], checked: [] as number[], written: [] as number[] }
  const progress: ImportProgress = { read: (n) => seen.read.push(n), checked: (n) => seen.checked.push(n), written: (n) => seen.written.push(n) }
  return { seen, progress }
}

async function refusal(run: Promise<unknown>): Promise<AppError> {
  const err = await run.then(() => null, (e: unknown) => e)
  expect(err).toBeInstanceOf(AppError)
  return err as AppError
}

describe('a commit a chunk at a time', () => {
  it('blends an item’s moving average over rows in two chunks, keeps the cost from before the first for a reversal, and reports rows written per chunk', async () => {
    // An average held before, with nothing on hand: the first receipt replaces it (common practice: a moving
    // average blends with the units on hand, and none are).
    await h.ds.query('INSERT INTO item_warehouses (item_id, warehouse_id, avg_cost) VALUES (?, ?, 1.5000)', [ids.blk, ids.wh])
    const file = csv('SKU,Warehouse,Bin,Lot,Quantity,Unit cost',
      `${BLK},${WH},A-01-1,,10,2.0000`,
      `${SEAL},${WH},A-01-1,,12,3.1000`,
      `${BLK},${WH},A-01-2,,30,4.0000`, // the same item and warehouse, in the next chunk
      `${SEAL},${WH},A-01-3,,6,3.1000`,
      `${BLK},${WH},A-01-3,,40,2.5000`) // and in the third
    const { seen, progress } = recorder()
    const res = await commitImport(h.ds, actor, def('opening_stock'), file, progress, SMALL)
    expect(res.record.summary).toEqual({ lines: 5, units: 98, lotsCreated: 0 })
    // source: perpetual weighted (moving) average cost, textbook method (from memory): each receipt re-averages the
    // units on hand. 10 @ 2.00 → 2.0000; + 30 @ 4.00 → (20 + 120) / 40 = 3.5000; + 40 @ 2.50 → (140 + 100) / 80 = 3.0000.
    const [avg] = await h.ds.query('SELECT avg_cost FROM item_warehouses WHERE item_id = ? AND warehouse_id = ?', [ids.blk, ids.wh])
    expect(avg.avg_cost).toBe('3.0000')
    const [onHand] = await h.ds.query('SELECT SUM(on_hand) AS n FROM stock_balances WHERE item_id = ? AND warehouse_id = ?', [ids.blk, ids.wh])
    expect(Number(onHand.n)).toBe(80)
    // Written as the chunks were checked: 2, 2, then 1 row; every row read and checked once.
    expect(seen).toEqual({ read: [2, 2, 1], checked: [2, 2, 1], written: [2, 2, 1] })
    // The cost a reversal puts back is the one from before the import, not the one the first chunk left.
    const [before] = await h.ds.query('SELECT avg_before, on_hand_before FROM data_import_costs WHERE import_id = ? AND item_id = ?', [res.record.id, ids.blk])
    expect(before).toEqual({ avg_before: '1.5000', on_hand_before: 0 })
    await reverseImport(h.ds, actor, DATA_IMPORTS, res.record.id)
    const [back] = await h.ds.query('SELECT avg_cost FROM item_warehouses WHERE item_id = ? AND warehouse_id = ?', [ids.blk, ids.wh])
    expect(back.avg_cost).toBe('1.5000')
    const [none] = await h.ds.query('SELECT COALESCE(SUM(on_hand), 0) AS n FROM stock_balances WHERE item_id IN (?, ?) AND warehouse_id = ?', [ids.blk, ids.seal, ids.wh])
    expect(Number(none.n)).toBe(0)
  })

  it('leaves nothing of the chunks written before a problem, and counts the problems of every chunk after it', async () => {
    const moves = await countRows(h.ds, 'stock_moves', 'warehouse_id = ?', [ids.wh])
    const imports = await countRows(h.ds, 'data_imports')
    const file = csv('SKU,Warehouse,Bin,Lot,Quantity,Unit cost',
      `${BLK},${WH},A-01-1,,10,2.0000`,
      `${SEAL},${WH},A-01-1,,12,3.1000`, // the first chunk is good and is written
      `${BLK},${WH},NO-BIN,,5,2.0000`, // a problem in the second
      `${SEAL},${WH},A-01-2,,4,3.1000`,
      `NOPE-${tag},${WH},A-01-1,,1,1.0000`) // and another in the third, still checked
    const { seen, progress } = recorder()
    const err = await refusal(commitImport(h.ds, actor, def('opening_stock'), file, progress, SMALL))
    expect(err.code).toBe('import_invalid')
    expect(err.params).toMatchObject({ rows: 2, total: 5 })
    expect(Object.keys(err.fields ?? {})).toEqual(['4', '6'])
    // Nothing was written after the problem; every row was still checked.
    expect(seen.written).toEqual([2])
    expect(seen.checked).toEqual([2, 2, 1])
    expect(await countRows(h.ds, 'stock_moves', 'warehouse_id = ?', [ids.wh])).toBe(moves)
    expect(await countRows(h.ds, 'data_imports')).toBe(imports)
  })

  it('writes an order whose lines straddle chunks as one order, its fully received first line held until an open line comes', async () => {
    const head = 'Order number,Vendor code,Ship to warehouse,Ordered on,Expected,SKU,Quantity ordered,Received so far,Cost per stock unit'
    const file = csv(head,
      `Q${tag}-1,${VENDOR},${WH},${today},,${BLK},10,10,0.8500`, // fully received: the order is open only if a later line is
      `Q${tag}-2,${VENDOR},${WH},${today},,${SEAL},5,0,6.1000`,
      `Q${tag}-1,${VENDOR},${WH},${today},,${SEAL},24,4,6.1250`, // next chunk: opens Q-1
      `Q${tag}-2,${VENDOR},${WH},${today},,${BLK},7,0,0.8500`,
      `Q${tag}-1,${VENDOR},${WH},${today},,${BLK},3,0,0.8500`)
    const preview = await previewImport(h.ds, def('purchase_orders'), file, undefined, SMALL)
    expect([preview.ready, preview.errorRows]).toEqual([5, 0])
    const res = await commitImport(h.ds, actor, def('purchase_orders'), file, undefined, SMALL)
    expect(res.record.summary).toEqual({ orders: 2, lines: 5, units: 10 - 10 + 5 + 24 - 4 + 7 + 3 })
    const orders = await h.ds.query('SELECT number, status, total FROM purchase_orders WHERE number LIKE ? ORDER BY number', [`Q${tag}-%`])
    // Totals worked by hand (a line's total rounded to cents, then added):
    // Q-1: 10 × 0.85 = 8.50; 24 × 6.125 = 147.00; 3 × 0.85 = 2.55 → 158.05. Q-2: 5 × 6.10 = 30.50; 7 × 0.85 = 5.95 → 36.45.
    expect(orders).toEqual([
      { number: `Q${tag}-1`, status: 'partly_received', total: '158.05' },
      { number: `Q${tag}-2`, status: 'sent', total: '36.45' },
    ])
    const lines = await h.ds.query(
      'SELECT o.number, l.line_no, l.qty_ordered, l.qty_received FROM purchase_order_lines l JOIN purchase_orders o ON o.id = l.po_id WHERE o.number LIKE ? ORDER BY o.number, l.line_no',
      [`Q${tag}-%`])
    expect(lines).toEqual([
      { number: `Q${tag}-1`, line_no: 1, qty_ordered: 10, qty_received: 10 },
      { number: `Q${tag}-1`, line_no: 2, qty_ordered: 24, qty_received: 4 },
      { number: `Q${tag}-1`, line_no: 3, qty_ordered: 3, qty_received: 0 },
      { number: `Q${tag}-2`, line_no: 1, qty_ordered: 5, qty_received: 0 },
      { number: `Q${tag}-2`, line_no: 2, qty_ordered: 7, qty_received: 0 },
    ])
    await reverseImport(h.ds, actor, DATA_IMPORTS, res.record.id)
    expect(await countRows(h.ds, 'purchase_orders', 'number LIKE ?', [`Q${tag}-%`])).toBe(0)
  })

  it('refuses an order received in full across chunks on its first row, and a line of another vendor naming the first', async () => {
    const head = 'Order number,Vendor code,Ship to warehouse,Ordered on,Expected,SKU,Quantity ordered,Received so far,Cost per stock unit'
    const before = await countRows(h.ds, 'purchase_orders')
    const other = `CKW${tag}`
    await h.ds.query('INSERT INTO vendors (code, name) VALUES (?, ?)', [other, `Test second glassworks ${tag}`])
    const file = csv(head,
      `R${tag}-1,${VENDOR},${WH},${today},,${BLK},10,10,0.85`,
      `R${tag}-2,${VENDOR},${WH},${today},,${BLK},10,0,0.85`,
      `R${tag}-1,${VENDOR},${WH},${today},,${SEAL},4,4,6.10`, // R-1 is received in full: not open
      `R${tag}-2,${other},${WH},${today},,${SEAL},4,0,6.10`) // another vendor on R-2's line
    const err = await refusal(commitImport(h.ds, actor, def('purchase_orders'), file, undefined, SMALL))
    expect(err.fields).toEqual({
      2: { code: 'import_order_closed', params: { number: `R${tag}-1` } },
      5: { code: 'import_order_differs', params: { row: 3 } },
    })
    expect(await countRows(h.ds, 'purchase_orders')).toBe(before)
  })

  it('adds a vendor named in one chunk once, for its rows in the next; brings accounts with terms in over several chunks', async () => {
    const fresh = `CKN${tag}`
    const file = csv('Vendor code,Vendor name,SKU,Vendor SKU,Pack size,Minimum order,Cost per stock unit,Lead time days,Preferred',
      `${VENDOR},,${BLK},GW-1,8,1,0.80,,`,
      `${fresh},Test blockworks ${tag},${BLK},BW-1,10,1,0.82,,`,
      `${fresh},,${SEAL},BW-2,12,1,6.00,,yes`) // the new vendor again, without its name, in the next chunk
    const res = await commitImport(h.ds, actor, def('vendor_items'), file, undefined, SMALL)
    expect(res.record.summary).toEqual({ vendorItems: 3, vendors: 1 })
    expect(await countRows(h.ds, 'vendors', 'code = ?', [fresh])).toBe(1)
    expect(await countRows(h.ds, 'vendor_items vi JOIN vendors v ON v.id = vi.vendor_id', 'v.code = ?', [fresh])).toBe(2)

    const level = `CKL${tag}`
    await h.ds.query('INSERT INTO price_levels (code, name) VALUES (?, ?)', [level, `Test trade level ${tag}`])
    const accounts = csv('Account code,Name,Price level,Tax-exempt certificate',
      ...Array.from({ length: 5 }, (_, i) => `K${tag}-${i},Test mason ${i},${i % 2 ? level : ''},${i % 2 ? '' : `EX-${i}`}`))
    const done = await commitImport(h.ds, actor, def('accounts'), accounts, undefined, SMALL)
    expect(done.record.summary).toEqual({ accounts: 5, withTerms: 5 })
    expect(await countRows(h.ds, 'customer_terms t JOIN customers c ON c.id = t.customer_id', 'c.code LIKE ?', [`K${tag}-%`])).toBe(5)
  })

  it('names an account code repeated in a later chunk as a repeat of its row, not as an account held before', async () => {
    const file = csv('Account code,Name',
      `J${tag}-1,Test mason one`,
      `J${tag}-2,Test mason two`,
      `J${tag}-3,Test mason three`,
      `J${tag}-1,Test mason one again`) // the first row's code, in the next chunk (the first chunk is written by then)
    const err = await refusal(commitImport(h.ds, actor, def('accounts'), file, undefined, SMALL))
    expect(err.fields).toEqual({ 5: { code: 'import_row_repeated', params: { row: 2 } } })
    expect(await countRows(h.ds, 'customers', 'code LIKE ?', [`J${tag}-%`])).toBe(0)
  })
})
