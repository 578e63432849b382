// Reading stock through the API: levels by item and warehouse, bins, lots, the ledger (filters, paging,
// sorting, xlsx export), transfers, manual minimums, the form pickers; and bad input to the stock
// routes answering 400 with field messages while writing nothing.
import { randomUUID } from 'node:crypto'
import ExcelJS from 'exceljs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type supertest from 'supertest'
import { prepareLedgerExport } from '../../server/services/stockLedgerExport.js'
import { withCheckDigit } from '../../shared/barcode/checkDigit.js'
import { ledgerExportQuerySchema } from '../../shared/schemas/stockViews.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { createItem, createStockFixture, ledgerCount, type StockFixture } from '../support/stockFixtures.js'

let h: ApiHarness
let crew: supertest.Agent
let fx: StockFixture
let transferId: number

const move = (path: string, body: object) => crew.post(path).set(CSRF).set('Idempotency-Key', randomUUID()).send(body)

beforeAll(async () => {
  h = await startApiHarness()
  crew = await h.as('warehouse')
  fx = await createStockFixture(h.ds)
  const [w1, w2] = fx.warehouses.map((w) => w.id)
  const receipt = await move('/api/stock/receipts', {
    warehouseId: w1,
    lines: [
      { itemId: fx.itemId, binId: fx.bins.A1, lotId: fx.lotId, qty: 40, unitCost: '3.2500' },
      { itemId: fx.itemId, binId: fx.bins.A2, qty: 12, unitCost: '3.2500' },
    ],
  })
  expect(receipt.status).toBe(201)
  const shipped = await move('/api/stock/transfers', {
    fromWarehouseId: w1, toWarehouseId: w2, lines: [{ itemId: fx.itemId, lotId: fx.lotId, fromBinId: fx.bins.A1, qty: 6 }],
  })
  expect(shipped.status).toBe(201)
  transferId = shipped.body.transfer.id
  expect((await move('/api/stock/issues', { lines: [{ itemId: fx.itemId, binId: fx.bins.A2, lotId: null, qty: 2 }] })).status).toBe(201)
  expect((await move('/api/stock/adjustments', { itemId: fx.itemId, binId: fx.bins.A1, lotId: fx.lotId, delta: -1, reason: 'damaged', note: '=HYPERLINK("http://example.invalid","x")' })).status).toBe(201)
  expect((await move('/api/stock/adjustments', { itemId: fx.itemId, binId: fx.bins.A2, lotId: null, delta: 3, reason: 'found', note: '-3 behind the rack' })).status).toBe(201)
  // A pick list holds 5 of the lot in A1 (reservations have no route of their own yet).
  const [bal] = await h.ds.query('SELECT id, warehouse_id FROM stock_balances WHERE item_id = ? AND bin_id = ? AND lot_id = ?', [fx.itemId, fx.bins.A1, fx.lotId])
  await h.ds.query(
    `INSERT INTO stock_reservations (balance_id, item_id, warehouse_id, bin_id, lot_id, qty, doc_type, doc_id) VALUES (?, ?, ?, ?, ?, 5, 'test_hold', 1)`,
    [bal.id, fx.itemId, bal.warehouse_id, fx.bins.A1, fx.lotId],
  )
  await h.ds.query('UPDATE stock_balances SET reserved = 5 WHERE id = ?', [bal.id])
})
afterAll(() => h?.close())

describe('stock levels by item and warehouse', () => {
  it('shows on hand, reserved, available, and transit stock apart, to every role', async () => {
    const viewer = await h.as('viewer')
    const res = await viewer.get('/api/stock/levels').query({ itemId: fx.itemId })
    expect(res.status).toBe(200)
    const [w1, w2] = fx.warehouses
    const north = res.body.rows.find((r: { warehouseId: number }) => r.warehouseId === w1.id)
    const south = res.body.rows.find((r: { warehouseId: number }) => r.warehouseId === w2.id)
    // A1: 40 − 6 shipped − 1 damaged = 33; A2: 12 − 2 issued + 3 found = 13.
    expect(north).toMatchObject({ onHand: 46, reserved: 5, available: 41, inTransit: 0, minQty: null, low: false })
    expect(south).toMatchObject({ onHand: 0, reserved: 0, available: 0, inTransit: 6 })
    expect((await (await h.as('counter')).get('/api/stock/levels').query({ q: fx.sku })).body.rows).toHaveLength(2)
  })

  it('flags low stock once a minimum is set above what is available', async () => {
    const buyer = await h.as('buyer')
    const w1 = fx.warehouses[0].id
    const put = await buyer.put(`/api/stock/minimums/${fx.itemId}/${w1}`).set(CSRF).send({ minQty: 50 })
    expect(put.status).toBe(200)
    expect(put.body).toMatchObject({ itemId: fx.itemId, warehouseId: w1, minQty: 50 })
    const low = await buyer.get('/api/stock/levels').query({ lowOnly: 'true', q: fx.sku })
    expect(low.body.rows).toHaveLength(1)
    expect(low.body.rows[0]).toMatchObject({ warehouseId: w1, available: 41, minQty: 50, low: true })
    const [entry] = await h.ds.query(`SELECT detail FROM audit_entries WHERE action = 'stock.minimum.set' AND entity_id = ? ORDER BY id DESC LIMIT 1`, [`${fx.itemId}:${w1}`])
    expect(JSON.parse(entry.detail)).toMatchObject({ from: null, to: 50 })
    expect((await buyer.put(`/api/stock/minimums/${fx.itemId}/${w1}`).set(CSRF).send({ minQty: 41 })).status).toBe(200)
    const ok = await buyer.get('/api/stock/levels').query({ itemId: fx.itemId, warehouseId: w1 })
    expect(ok.body.rows[0]).toMatchObject({ minQty: 41, low: false }) // available 41 is not below 41
  })

  it('lists every active item and warehouse with includeEmpty', async () => {
    const itemId = await createItem(h.ds, `EMPTY-${fx.tag}`)
    const res = await crew.get('/api/stock/levels').query({ itemId, includeEmpty: 'true' })
    expect(res.status).toBe(200)
    expect(res.body.rows.length).toBeGreaterThanOrEqual(2)
    expect(res.body.rows.every((r: { onHand: number }) => r.onHand === 0)).toBe(true)
    expect((await crew.get('/api/stock/levels').query({ itemId })).body.rows).toEqual([])
  })

  it('refuses bad filters with field messages', async () => {
    const res = await crew.get('/api/stock/levels').query({ itemId: 'abc', lowOnly: 'maybe' })
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toHaveProperty('itemId')
    expect(res.body.error.fields).toHaveProperty('lowOnly')
  })
})

describe('bins, lots and transfers', () => {
  it('lists a warehouse’s bins with their contents, transit bins last', async () => {
    const res = await crew.get('/api/stock/bin-contents').query({ warehouseId: fx.warehouses[1].id })
    expect(res.status).toBe(200)
    expect(res.body.bins).toHaveLength(1)
    expect(res.body.bins[0]).toMatchObject({ code: 'IN-TRANSIT', kind: 'transit' })
    expect(res.body.bins[0].lines).toEqual([expect.objectContaining({ itemId: fx.itemId, lotCode: fx.lotCode, onHand: 6 })])
    const all = await crew.get('/api/stock/bin-contents').query({ warehouseId: fx.warehouses[1].id, includeEmpty: 'true' })
    expect(all.body.bins.map((b: { code: string }) => b.code)).toEqual(['B-01-1', 'B-01-2', 'IN-TRANSIT'])
    const north = await crew.get('/api/stock/bin-contents').query({ warehouseId: fx.warehouses[0].id })
    expect(north.body.bins.find((b: { binId: number }) => b.binId === fx.bins.A1).lines[0]).toMatchObject({ onHand: 33, reserved: 5 })
  })

  it('answers 400 without a warehouse and 404 for an unknown one', async () => {
    const missing = await crew.get('/api/stock/bin-contents')
    expect(missing.status).toBe(400)
    expect(missing.body.error.fields).toHaveProperty('warehouseId')
    expect((await crew.get('/api/stock/bin-contents').query({ warehouseId: 99999999 })).status).toBe(404)
  })

  it('lists an item’s lots with their places, and the stock kept without a lot', async () => {
    const res = await crew.get('/api/stock/lot-levels').query({ itemId: fx.itemId })
    expect(res.status).toBe(200)
    const lot = res.body.lots.find((l: { lotId: number | null }) => l.lotId === fx.lotId)
    expect(lot).toMatchObject({ lotCode: fx.lotCode, onHand: 39, reserved: 5 })
    expect(lot.places.find((p: { inTransit: boolean }) => p.inTransit)).toMatchObject({ onHand: 6, binCode: 'IN-TRANSIT' })
    expect(res.body.lots.find((l: { lotId: number | null }) => l.lotId === null)).toMatchObject({ onHand: 13 })
    expect((await crew.get('/api/stock/lot-levels')).status).toBe(400)
  })

  it('lists transfers in transit with their lines, then as received', async () => {
    const open = await crew.get('/api/stock/transfers').query({ status: 'in_transit', warehouseId: fx.warehouses[1].id })
    expect(open.status).toBe(200)
    const t = open.body.find((x: { id: number }) => x.id === transferId)
    expect(t).toMatchObject({ status: 'in_transit', fromWarehouseCode: fx.warehouses[0].code, toWarehouseCode: fx.warehouses[1].code })
    expect(t.lines).toEqual([expect.objectContaining({ sku: fx.sku, lotCode: fx.lotCode, qty: 6, receivedQty: 0 })])
    const put = await move(`/api/stock/transfers/${transferId}/receive`, { lines: [{ lineId: t.lines[0].id, toBinId: fx.bins.B1, qty: 6 }] })
    expect(put.status).toBe(200)
    const done = await crew.get('/api/stock/transfers').query({ status: 'received', warehouseId: fx.warehouses[1].id })
    expect(done.body.find((x: { id: number }) => x.id === transferId)).toMatchObject({ status: 'received', lines: [expect.objectContaining({ receivedQty: 6 })] })
    expect((await crew.get('/api/stock/transfers').query({ status: 'lost' })).status).toBe(400)
  })
})

describe('the ledger', () => {
  const ledger = (query: Record<string, unknown>) => crew.get('/api/stock/ledger').query({ itemId: fx.itemId, ...query })

  it('filters by item, bin, lot, move type and document', async () => {
    const all = await ledger({})
    expect(all.status).toBe(200)
    // receipt ×2, transfer out + in, issue, two adjustments, put-away out + in (after the transfer test) = 9
    expect(all.body.total).toBeGreaterThanOrEqual(7)
    expect(all.body.rows[0]).toMatchObject({ sku: fx.sku, warehouseCode: expect.any(String), binCode: expect.any(String) })
    const a1Lot = await ledger({ binId: fx.bins.A1, lotId: fx.lotId })
    expect(a1Lot.body.rows.map((r: { qty: number }) => r.qty).sort((a: number, b: number) => a - b)).toEqual([-6, -1, 40])
    const types = await ledger({ moveType: 'issue,adjustment' })
    expect(types.body.rows.map((r: { moveType: string }) => r.moveType).sort()).toEqual(['adjustment', 'adjustment', 'issue'])
    const doc = await ledger({ docType: 'transfer', docId: transferId })
    expect(doc.body.rows.every((r: { docId: number }) => r.docId === transferId)).toBe(true)
    expect(doc.body.total).toBeGreaterThanOrEqual(2)
    const byUser = all.body.rows.find((r: { moveType: string }) => r.moveType === 'issue')
    expect(byUser.userName).toBe('Test t-warehouse')
  })

  it('filters by date range (a day reaches through its end)', async () => {
    const today = new Date().toISOString().slice(0, 10)
    expect((await ledger({ from: today, to: today })).body.total).toBe((await ledger({})).body.total)
    expect((await ledger({ to: '2001-01-01' })).body.total).toBe(0)
    const later = new Date(Date.now() + 3_600_000).toISOString()
    expect((await ledger({ from: later })).body.total).toBe(0)
  })

  it('pages and sorts on the server without overlaps', async () => {
    const total = (await ledger({})).body.total
    const seen = new Set<string>()
    for (let page = 1; page <= Math.ceil(total / 2); page++) {
      const res = await ledger({ page, pageSize: 2, sort: 'qty', dir: 'asc' })
      expect(res.body).toMatchObject({ page, pageSize: 2, total })
      for (const r of res.body.rows) seen.add(r.id)
    }
    expect(seen.size).toBe(total)
    const asc = (await ledger({ sort: 'qty', dir: 'asc', pageSize: 500 })).body.rows.map((r: { qty: number }) => r.qty)
    expect(asc).toEqual([...asc].sort((a, b) => a - b))
    const desc = (await ledger({ sort: 'qty', dir: 'desc', pageSize: 500 })).body.rows.map((r: { qty: number }) => r.qty)
    expect(desc).toEqual([...asc].reverse())
  })

  it('refuses bad paging, sorting, types and dates with field messages', async () => {
    const res = await ledger({ pageSize: 0, sort: 'price', moveType: 'teleport', from: 'yesterday' })
    expect(res.status).toBe(400)
    for (const f of ['pageSize', 'sort', 'moveType', 'from']) expect(res.body.error.fields, f).toHaveProperty(f)
    const backwards = await ledger({ from: '2025-06-02', to: '2025-06-01' })
    expect(backwards.status).toBe(400)
    expect(backwards.body.error.fields).toHaveProperty('to')
  })
})

async function readWorkbook(agent: supertest.Agent, query: Record<string, unknown>) {
  const res = await agent
    .get('/api/stock/ledger/export')
    .query(query)
    .buffer(true)
    .parse((r, done) => {
      const chunks: Buffer[] = []
      r.on('data', (c: Buffer) => chunks.push(c))
      r.on('end', () => done(null, Buffer.concat(chunks)))
    })
  const wb = new ExcelJS.Workbook()
  if (res.status === 200) await wb.xlsx.load(res.body as Buffer as never)
  return { res, sheet: wb.getWorksheet('Stock movements') }
}

describe('the ledger as a spreadsheet', () => {
  it('writes numbers as numbers, times as dates in the asked zone, and people’s text as string cells, as typed', async () => {
    const buyer = await h.as('buyer')
    // source: IANA tz database — Etc/GMT+5 is UTC−05:00 all year (POSIX-style inverted sign).
    const { res, sheet } = await readWorkbook(buyer, { itemId: fx.itemId, sort: 'at', dir: 'asc', tz: 'Etc/GMT+5' })
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toContain('spreadsheetml')
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="stock-movements-\d{4}-\d{2}-\d{2}\.xlsx"/)
    expect(sheet).toBeDefined()
    const header = (sheet!.getRow(1).values as unknown[]).slice(1)
    expect(header.slice(0, 8)).toEqual(['When', 'Move', 'SKU', 'Item', 'Warehouse', 'Bin', 'Lot', 'Quantity'])
    const col = (name: string) => header.indexOf(name) + 1
    const rows = sheet!.getRows(2, sheet!.rowCount - 1)!
    const page = (await crew.get('/api/stock/ledger').query({ itemId: fx.itemId, sort: 'at', dir: 'asc', pageSize: 500 })).body.rows
    expect(rows).toHaveLength(page.length)
    const first = rows[0]
    expect(typeof first.getCell(col('Quantity')).value).toBe('number')
    expect(first.getCell(col('Quantity')).value).toBe(page[0].qty)
    expect(first.getCell(col('Unit cost')).value).toBe(3.25)
    // The read-only role gets the same moves without what they cost (the cost rule).
    const forViewer = await readWorkbook(await h.as('viewer'), { itemId: fx.itemId, sort: 'at', dir: 'asc', tz: 'Etc/GMT+5' })
    const viewerHeader = (forViewer.sheet!.getRow(1).values as unknown[]).slice(1)
    expect(viewerHeader).toContain('Quantity')
    expect(viewerHeader).not.toContain('Unit cost')
    expect(viewerHeader).not.toContain('Value')
    const when = first.getCell(col('When')).value as Date
    expect(when).toBeInstanceOf(Date)
    expect(when.getTime()).toBe(new Date(page[0].at).getTime() - 5 * 3_600_000)
    const notes = rows.map((r) => r.getCell(col('Note'))).filter((c) => c.value !== null && c.value !== '')
    // source: OWASP "CSV Injection" / ASVS 5.0 1.2.10: a leading = + - @ must never become a formula; a string cell never does.
    expect(notes.map((c) => c.value).sort()).toEqual([`-3 behind the rack`, `=HYPERLINK("http://example.invalid","x")`])
    for (const c of notes) expect(c.type).toBe(ExcelJS.ValueType.String)
    for (const r of rows) r.eachCell((c) => expect(c.type).not.toBe(ExcelJS.ValueType.Formula))
  })

  it('refuses a bad time zone, and an export larger than the limit', async () => {
    const bad = await crew.get('/api/stock/ledger/export').query({ tz: 'Mars/Olympus' })
    expect(bad.status).toBe(400)
    expect(bad.body.error.fields).toHaveProperty('tz')
    const q = ledgerExportQuerySchema.parse({ itemId: String(fx.itemId) })
    await expect(prepareLedgerExport(h.ds, q, true, 1)).rejects.toMatchObject({ status: 400 })
  })
})

describe('manual minimums', () => {
  it('lists one row per warehouse for an item', async () => {
    const res = await crew.get('/api/stock/minimums').query({ itemId: fx.itemId })
    expect(res.status).toBe(200)
    const mine = res.body.filter((r: { warehouseId: number }) => fx.warehouses.some((w) => w.id === r.warehouseId))
    expect(mine.map((r: { minQty: number | null }) => r.minQty).sort()).toEqual([41, null])
  })

  it('refuses bad input with a field message and changes nothing', async () => {
    const w2 = fx.warehouses[1].id
    const before = await h.ds.query('SELECT COUNT(*) AS n FROM item_warehouses WHERE min_qty IS NOT NULL')
    for (const body of [{ minQty: -1 }, { minQty: 'ten' }, { minQty: 2.5 }, {}]) {
      const res = await crew.put(`/api/stock/minimums/${fx.itemId}/${w2}`).set(CSRF).send(body)
      expect(res.status, JSON.stringify(body)).toBe(400)
      expect(res.body.error.fields).toHaveProperty('minQty')
    }
    expect(await h.ds.query('SELECT COUNT(*) AS n FROM item_warehouses WHERE min_qty IS NOT NULL')).toEqual(before)
    expect((await crew.put(`/api/stock/minimums/99999999/${w2}`).set(CSRF).send({ minQty: 3 })).status).toBe(404)
    expect((await (await h.as('viewer')).put(`/api/stock/minimums/${fx.itemId}/${w2}`).set(CSRF).send({ minQty: 3 })).status).toBe(403)
    const cleared = await crew.put(`/api/stock/minimums/${fx.itemId}/${fx.warehouses[0].id}`).set(CSRF).send({ minQty: null })
    expect(cleared.body.minQty).toBeNull()
  })
})

describe('what the forms pick from', () => {
  it('lists warehouses with their bins, and finds items by text or id', async () => {
    const places = await crew.get('/api/stock/places')
    const north = places.body.find((p: { id: number }) => p.id === fx.warehouses[0].id)
    expect(north.bins.map((b: { code: string }) => b.code)).toEqual(['A-01-1', 'A-01-2', 'A-02-1', 'A-02-2', 'A-03-1'])
    const found = await crew.get('/api/stock/item-options').query({ q: fx.sku })
    expect(found.body[0]).toMatchObject({ id: fx.itemId, sku: fx.sku })
    const byId = await crew.get('/api/stock/item-options').query({ ids: String(fx.itemId) })
    expect(byId.body).toEqual([expect.objectContaining({ id: fx.itemId })])
  })

  it('refuses bad picker and minimum filters with field messages', async () => {
    const ids = await crew.get('/api/stock/item-options').query({ ids: 'one,two' })
    expect(ids.status).toBe(400)
    expect(Object.keys(ids.body.error.fields)[0]).toMatch(/^ids/)
    const mins = await crew.get('/api/stock/minimums').query({ itemId: 'x' })
    expect(mins.status).toBe(400)
    expect(mins.body.error.fields).toHaveProperty('itemId')
  })

  it('names what a scanned SKU, GTIN, lot or bin label refers to', async () => {
    // A GTIN-13 stored as printed; a scanner's (01) gives the GTIN-14 with a leading zero (GS1 General
    // Specifications: GTIN-13 in a 14-digit field is zero-padded). Check digit from the shared GS1 code.
    const gtin13 = withCheckDigit(`20${String(parseInt(fx.tag, 16)).padStart(10, '0').slice(-10)}`)
    const itemId = await createItem(h.ds, `GT-${fx.tag}`, { gtin: gtin13 })
    const byGtin = await crew.get('/api/stock/lookup').query({ kind: 'gtin', code: '0' + gtin13 })
    expect(byGtin.status).toBe(200)
    expect(byGtin.body.item.id).toBe(itemId)
    expect((await crew.get('/api/stock/lookup').query({ kind: 'gtin', code: gtin13 })).body.item.id).toBe(itemId)
    // The other way round: stored as GTIN-14 (as the catalog form stores it), scanned from an EAN-13 symbol.
    const stored14 = '0' + withCheckDigit(`21${String(parseInt(fx.tag, 16)).padStart(10, '0').slice(-10)}`)
    const item14 = await createItem(h.ds, `GU-${fx.tag}`, { gtin: stored14 })
    expect((await crew.get('/api/stock/lookup').query({ kind: 'gtin', code: stored14.slice(1) })).body.item.id).toBe(item14)
    expect((await crew.get('/api/stock/lookup').query({ kind: 'gtin', code: '1' + stored14.slice(1) })).status).toBe(404)
    const lot = await crew.get('/api/stock/lookup').query({ kind: 'sku', code: fx.sku, lotCode: fx.lotCode })
    expect(lot.body).toMatchObject({ item: { id: fx.itemId }, lot: { id: fx.lotId } })
    const bin = await crew.get('/api/stock/lookup').query({ kind: 'bin', code: 'A-01-2', warehouseId: fx.warehouses[0].id })
    expect(bin.body.bin).toMatchObject({ id: fx.bins.A2, warehouseId: fx.warehouses[0].id })
    expect((await crew.get('/api/stock/lookup').query({ kind: 'sku', code: 'NO-SUCH-SKU-x' })).status).toBe(404)
    const bad = await crew.get('/api/stock/lookup').query({ kind: 'pallet' })
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['code', 'kind'])
  })
})

describe('stock moves: bad input and refusals write nothing', () => {
  const cases: [string, object, string][] = [
    ['/api/stock/adjustments', { itemId: 1, binId: 1, delta: 4 }, 'reason'],
    ['/api/stock/adjustments', { itemId: 1, binId: 1, delta: -4, reason: 'found' }, 'delta'],
    ['/api/stock/adjustments', { itemId: 1, binId: 1, delta: 2, reason: 'damaged' }, 'delta'],
    ['/api/stock/adjustments', { itemId: 1, binId: 1, delta: 0, reason: 'counted' }, 'delta'],
    ['/api/stock/bin-moves', { itemId: 1, fromBinId: 1, toBinId: 2, qty: 0 }, 'qty'],
    ['/api/stock/issues', { lines: [] }, 'lines'],
    ['/api/stock/transfers', { fromWarehouseId: 1, toWarehouseId: 2, lines: [{ itemId: 1, fromBinId: 1, qty: 1.5 }] }, 'lines.0.qty'],
    ['/api/stock/receipts', { warehouseId: 1, lines: [{ itemId: 1, binId: 1, qty: 1, unitCost: 'cheap' }] }, 'lines.0.unitCost'],
  ]
  it.each(cases)('%s %j → 400 on %s', async (path, body, field) => {
    const before = await ledgerCount(h.ds)
    const res = await move(path, body)
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toHaveProperty([field])
    expect(await ledgerCount(h.ds)).toBe(before)
  })

  it('refuses to issue or adjust stock in transit (409) and unknown items (404, not 500)', async () => {
    const before = await ledgerCount(h.ds)
    const [transit] = await h.ds.query(`SELECT id FROM bins WHERE warehouse_id = ? AND kind = 'transit'`, [fx.warehouses[1].id])
    expect((await move('/api/stock/issues', { lines: [{ itemId: fx.itemId, binId: transit.id, lotId: fx.lotId, qty: 1 }] })).status).toBe(409)
    expect((await move('/api/stock/adjustments', { itemId: fx.itemId, binId: transit.id, lotId: fx.lotId, delta: 1, reason: 'found' })).status).toBe(409)
    const w1 = fx.warehouses[0].id
    expect((await move('/api/stock/receipts', { warehouseId: w1, lines: [{ itemId: 99999999, binId: fx.bins.A1, qty: 1, unitCost: '1.00' }] })).status).toBe(404)
    expect((await move('/api/stock/receipts', { warehouseId: w1, lines: [{ itemId: 99999999, binId: fx.bins.A1, lotCode: 'X1', qty: 1, unitCost: '1.00' }] })).status).toBe(404)
    expect((await move('/api/stock/transfers', {
      fromWarehouseId: w1, toWarehouseId: fx.warehouses[1].id, lines: [{ itemId: 99999999, fromBinId: fx.bins.A1, qty: 1 }],
    })).status).toBe(404)
    expect(await ledgerCount(h.ds)).toBe(before)
  })
})
