// Catalog API on the demo database: everyone reads, only the admin changes the catalog; bad input is
// a 400 with a message per field and writes nothing; stock by warehouse, bin and lot matches the
// balances; the spreadsheet export keeps numbers as numbers and user text inert.
import ExcelJS from 'exceljs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { withCheckDigit } from '../../shared/barcode/checkDigit.js'
import type { ItemDetail, ItemPage, ItemRecord, LotRow } from '../../shared/schemas/catalog.js'
import { reserve, releaseReservations } from '../../server/services/stock/stockReservations.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'

let h: ApiHarness
const arrayBufferOf = (b: Buffer) => b.buffer.slice(b.byteOffset, b.byteOffset + b.byteLength) as ArrayBuffer
beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

const run = Date.now().toString(36).toUpperCase()
const sku = (n: string) => `T-CAT-${run}-${n}`
const countBySku = async (s: string) => Number((await h.ds.query('SELECT COUNT(*) AS n FROM items WHERE sku = ?', [s]))[0].n)

function blockBody(n: string, extra: Record<string, unknown> = {}) {
  // source: IRC 2021 R607.3 (a standard unit is at least 3 7/8 in = 98.425 mm thick); face 7 3/4 in = 8 in nominal − 1/4 in (common practice)
  return {
    sku: sku(n), name: `Test 8x8 block ${n}`, family: 'glass_block', stockUnit: 'each', caseQty: 8, palletQty: 320,
    cost: '7.80', listPrice: '13.95', weightKg: '2.858', matchLot: true, nominalSize: '8x8', faceWidthMm: '196.85',
    faceHeightMm: '196.85', depthMm: '98.43', thicknessClass: 'standard', pattern: 'wavy', shape: 'square', ...extra,
  }
}

describe('reading the catalog', () => {
  it('lets a viewer page through the list with filters and a quick search', async () => {
    const viewer = await h.as('viewer')
    const page2 = await viewer.get('/api/items?pageSize=10&page=2&sort=sku')
    expect(page2.status).toBe(200)
    const body = page2.body as ItemPage
    expect(body.rows).toHaveLength(10)
    expect(body.total).toBeGreaterThanOrEqual(140)
    const first = (await viewer.get('/api/items?pageSize=10&page=1&sort=sku')).body as ItemPage
    expect(first.rows.at(-1)!.sku < body.rows[0].sku).toBe(true)

    const filtered = (await viewer.get('/api/items?family=glass_block&size=8x8&pattern=wavy&thickness=standard&pageSize=500')).body as ItemPage
    expect(filtered.rows.length).toBeGreaterThan(2)
    expect(filtered.rows.every((r) => r.nominalSize === '8x8' && r.pattern === 'wavy' && r.thicknessClass === 'standard')).toBe(true)

    const search = (await viewer.get('/api/items?q=wavy%20corner&pageSize=500')).body as ItemPage
    expect(search.rows.length).toBeGreaterThan(0)
    expect(search.rows.every((r) => /wavy/i.test(r.name) && /corner/i.test(r.name))).toBe(true)
  })

  it('finds an item by a scanned GTIN in any length', async () => {
    const [row] = await h.ds.query("SELECT id, gtin FROM items WHERE gtin LIKE '00%' LIMIT 1")
    const gtin12 = String(row.gtin).slice(2) // source: GS1 General Specifications §3.3.2, GTIN-12 is GTIN-14 without the two leading zeros
    const found = (await (await h.as('counter')).get(`/api/items?q=${gtin12}`)).body as ItemPage
    expect(found.rows.map((r) => r.id)).toEqual([Number(row.id)])
  })

  it('refuses bad filters with 400 and field messages', async () => {
    const res = await (await h.as('viewer')).get('/api/items?family=glass&pageSize=0')
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['family', 'pageSize']))
  })

  it('shows stock by warehouse, bin and lot that adds up to the balances', async () => {
    const [busy] = await h.ds.query(
      "SELECT sb.item_id FROM stock_balances sb JOIN items i ON i.id = sb.item_id WHERE i.family = 'glass_block' GROUP BY sb.item_id HAVING COUNT(DISTINCT sb.warehouse_id) > 1 AND SUM(sb.on_hand) > 0 LIMIT 1")
    const res = await (await h.as('buyer')).get(`/api/items/${busy.item_id}`)
    expect(res.status).toBe(200)
    const detail = res.body as ItemDetail
    const balances = await h.ds.query('SELECT warehouse_id, SUM(on_hand) AS q FROM stock_balances WHERE item_id = ? GROUP BY warehouse_id', [busy.item_id])
    for (const b of balances) {
      const wh = detail.warehouses.find((w) => w.warehouseId === Number(b.warehouse_id))!
      expect(wh.onHand).toBe(Number(b.q))
      expect(detail.bins.filter((x) => x.warehouseId === wh.warehouseId).reduce((s, x) => s + x.onHand, 0)).toBe(Number(b.q))
    }
    expect(detail.bins.length).toBeGreaterThan(0)
    expect(detail.bins.every((b) => b.lotCode !== null && b.onHand > 0)).toBe(true)
    expect(detail.vendors.some((v) => v.preferred)).toBe(true)
  })

  it('shows costs to buyers and admins only (the purchasing rule), list prices to everyone', async () => {
    const [row] = await h.ds.query("SELECT id FROM items WHERE sku = 'GB-0808-CL-SQ'")
    const buyer = ((await (await h.as('buyer')).get(`/api/items/${row.id}`)).body as ItemDetail)
    expect(buyer.item.cost).toMatch(/^\d+\.\d{4}$/)
    expect(buyer.warehouses.some((w) => w.avgCost !== null)).toBe(true)
    for (const role of ['counter', 'viewer'] as const) {
      const detail = (await (await h.as(role)).get(`/api/items/${row.id}`)).body as ItemDetail
      expect(detail.item, role).not.toHaveProperty('cost')
      expect(detail.item.listPrice, role).toMatch(/^\d+\.\d{2}$/)
      expect(detail.warehouses.every((w) => !('avgCost' in w)), role).toBe(true)
      expect(detail.vendors.every((v) => !('unitCost' in v)), role).toBe(true)
      const list = (await (await h.as(role)).get('/api/items?pageSize=20')).body as ItemPage
      expect(list.rows.every((r) => !('cost' in r)), role).toBe(true)
    }
  })

  it('answers 404 for an item that does not exist or a bad id', async () => {
    const viewer = await h.as('viewer')
    expect((await viewer.get('/api/items/99999999')).status).toBe(404)
    expect((await viewer.get('/api/items/abc')).status).toBe(404)
  })
})

describe('changing the catalog', () => {
  it('lets the admin create an item, normalising the GTIN to 14 digits, with an audit entry', async () => {
    // A fresh GTIN-13 per run, its check digit by GS1 General Specifications §7.9.1 (verified in gs1CheckDigit.test.ts)
    const gtin13 = withCheckDigit(`95${String(Date.now()).slice(-10)}`)
    const res = await (await h.as('admin')).post('/api/items').set(CSRF).send(blockBody('A', { gtin: gtin13 }))
    expect(res.status).toBe(201)
    expect((res.body as ItemRecord).gtin).toBe(`0${gtin13}`)
    const [entry] = await h.ds.query("SELECT action FROM audit_entries WHERE entity = 'item' AND entity_id = ?", [String(res.body.id)])
    expect(entry.action).toBe('item.create')
  })

  it('keeps other roles out and writes nothing', async () => {
    for (const role of ['viewer', 'counter', 'warehouse', 'buyer'] as const) {
      const res = await (await h.as(role)).post('/api/items').set(CSRF).send(blockBody(`R-${role}`))
      expect(res.status, role).toBe(403)
      expect(await countBySku(sku(`R-${role}`))).toBe(0)
    }
  })

  it('refuses bad input with field messages and writes nothing', async () => {
    const gtin = withCheckDigit('084761399901')
    const wrongCheck = gtin.slice(0, -1) + String((Number(gtin.at(-1)) + 1) % 10)
    const res = await (await h.as('admin')).post('/api/items').set(CSRF).send(
      blockBody('BAD', { gtin: wrongCheck, cost: '7,80', palletQty: 321, depthMm: '90' }))
    expect(res.status).toBe(400)
    const fields = res.body.error.fields
    // source: GS1 General Specifications §7.9.1 (mod-10 check digit), computed by withCheckDigit above
    expect(fields.gtin).toEqual({ code: 'check_digit_wrong', params: { label: 'GTIN-13', expected: Number(gtin.at(-1)), actual: Number(wrongCheck.at(-1)) } })
    expect(fields.cost).toEqual({ code: 'cost_format' })
    // source: IRC 2021 R607.3: a standard unit is at least 3 7/8 in (98.425 mm) thick; 90 mm is under it
    expect(fields.depthMm).toEqual({ code: 'standard_block_too_thin', params: { min: 98.425, unit: 'mm' } })
    expect(await countBySku(sku('BAD'))).toBe(0)
    const [cross] = [(await (await h.as('admin')).post('/api/items').set(CSRF).send(blockBody('BAD', { palletQty: 321 }))).body]
    expect(cross.error.fields.palletQty).toEqual({ code: 'pallet_whole_cases', params: { caseQty: 8 } })
    expect(await countBySku(sku('BAD'))).toBe(0)
  })

  it('refuses a SKU that reads as a GTIN and a duplicate SKU', async () => {
    const admin = await h.as('admin')
    const digits = await admin.post('/api/items').set(CSRF).send(blockBody('X', { sku: '123456789012' }))
    expect(digits.status).toBe(400)
    expect(digits.body.error.fields.sku).toEqual({ code: 'sku_like_gtin' })
    await admin.post('/api/items').set(CSRF).send(blockBody('DUP'))
    const again = await admin.post('/api/items').set(CSRF).send(blockBody('DUP'))
    expect(again.status).toBe(409)
    expect(again.body.error.fields.sku).toBeDefined()
  })

  it('updates an item and re-checks the whole item', async () => {
    const admin = await h.as('admin')
    const created = (await admin.post('/api/items').set(CSRF).send(blockBody('UPD'))).body as ItemRecord
    const renamed = await admin.patch(`/api/items/${created.id}`).set(CSRF).send({ version: created.version, name: 'Renamed test block', listPrice: '14.50' })
    expect(renamed.status).toBe(200)
    expect(renamed.body.name).toBe('Renamed test block')
    expect(renamed.body.listPrice).toBe('14.50')
    const bad = await admin.patch(`/api/items/${created.id}`).set(CSRF).send({ version: renamed.body.version, depthMm: '79.38' }) // thin-unit depth on a standard unit
    expect(bad.status).toBe(400)
    expect(bad.body.error.fields.depthMm).toBeDefined()
    const [row] = await h.ds.query('SELECT depth_mm FROM items WHERE id = ?', [created.id])
    expect(row.depth_mm).toBe('98.43')
    expect((await (await h.as('buyer')).patch(`/api/items/${created.id}`).set(CSRF).send({ version: renamed.body.version, name: 'x' })).status).toBe(403)
  })

  it('deactivates with an audit entry, but not while stock is held for a pick list', async () => {
    const admin = await h.as('admin')
    const [held] = await h.ds.query('SELECT item_id, bin_id, lot_id FROM stock_balances WHERE on_hand - reserved >= 2 ORDER BY id LIMIT 1')
    const doc = { docType: 'catalog_test', docId: Date.now() % 1_000_000 }
    await h.ds.transaction((em) => reserve(em, { userId: null }, { doc, lines: [{ itemId: held.item_id, binId: held.bin_id, lotId: held.lot_id, qty: 2 }] }))
    try {
      const refused = await admin.post(`/api/items/${held.item_id}/deactivate`).set(CSRF).send({})
      expect(refused.status).toBe(409)
      expect(refused.body.error.message).toMatch(/held for pick lists/)
    } finally {
      await h.ds.transaction((em) => releaseReservations(em, { userId: null }, doc))
    }
    const created = (await admin.post('/api/items').set(CSRF).send(blockBody('OFF'))).body as ItemRecord
    const off = await admin.post(`/api/items/${created.id}/deactivate`).set(CSRF).send({})
    expect(off.status).toBe(200)
    expect(off.body.active).toBe(false)
    const [entry] = await h.ds.query("SELECT COUNT(*) AS n FROM audit_entries WHERE action = 'item.deactivate' AND entity_id = ?", [String(created.id)])
    expect(Number(entry.n)).toBe(1)
    const listed = (await admin.get(`/api/items?q=${encodeURIComponent(sku('OFF'))}`)).body as ItemPage
    expect(listed.rows).toHaveLength(0) // the list shows active items unless asked
    expect(((await admin.get(`/api/items?active=all&q=${encodeURIComponent(sku('OFF'))}`)).body as ItemPage).rows).toHaveLength(1)
  })
})

describe('lots', () => {
  it('lists an item’s lots and lets the warehouse crew note a tint, nobody else but the admin', async () => {
    const [item] = await h.ds.query("SELECT item_id FROM lots GROUP BY item_id HAVING COUNT(*) > 2 LIMIT 1")
    const lots = (await (await h.as('viewer')).get(`/api/items/${item.item_id}/lots`)).body as LotRow[]
    expect(lots.length).toBeGreaterThan(2)
    const dates = lots.map((l) => l.receivedAt)
    expect([...dates].sort().reverse()).toEqual(dates)
    const lot = lots[0]
    const ok = await (await h.as('warehouse')).patch(`/api/items/${item.item_id}/lots/${lot.id}`).set(CSRF).send({ tintNote: 'Greener than the last run' })
    expect(ok.status).toBe(200)
    expect(ok.body.tintNote).toBe('Greener than the last run')
    expect((await (await h.as('counter')).patch(`/api/items/${item.item_id}/lots/${lot.id}`).set(CSRF).send({ tintNote: 'x' })).status).toBe(403)
    const long = await (await h.as('admin')).patch(`/api/items/${item.item_id}/lots/${lot.id}`).set(CSRF).send({ tintNote: 'x'.repeat(121) })
    expect(long.status).toBe(400)
    expect(long.body.error.fields.tintNote).toEqual({ code: 'too_long', params: { max: 120 } })
    const [after] = await h.ds.query('SELECT tint_note FROM lots WHERE id = ?', [lot.id])
    expect(after.tint_note).toBe('Greener than the last run')
    expect((await (await h.as('admin')).patch(`/api/items/${Number(item.item_id) + 100000}/lots/${lot.id}`).set(CSRF).send({ tintNote: 'y' })).status).toBe(404)
  })
})

async function fetchXlsx(role: 'buyer' | 'viewer', path: string) {
  return (await h.as(role)).get(path).buffer(true).parse((r, done) => {
    const chunks: Buffer[] = []
    r.on('data', (c: Buffer) => chunks.push(c))
    r.on('end', () => done(null, Buffer.concat(chunks)))
  })
}

describe('spreadsheet export', () => {
  it('writes numbers as numbers and formula-like text as string cells, as typed (OWASP CSV Injection)', async () => {
    const admin = await h.as('admin')
    await admin.post('/api/items').set(CSRF).send(blockBody('XLS', { name: '=HYPERLINK("http://example.invalid","open")', description: '@SUM(A1:A9)' }))
    const res = await fetchXlsx('buyer', `/api/items/export.xlsx?q=${encodeURIComponent(sku('XLS'))}`)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toMatch(/spreadsheetml/)
    const book = new ExcelJS.Workbook()
    await book.xlsx.load(arrayBufferOf(res.body as Buffer))
    const sheet = book.getWorksheet('Items')!
    const headers = (sheet.getRow(1).values as unknown[]).slice(1)
    expect(headers.slice(0, 3)).toEqual(['SKU', 'Name', 'Family'])
    const row = sheet.getRow(2)
    const col = (name: string) => row.getCell(headers.indexOf(name) + 1)
    expect(col('SKU').value).toBe(sku('XLS'))
    expect(col('Name').value).toBe('=HYPERLINK("http://example.invalid","open")')
    expect(col('Name').type).toBe(ExcelJS.ValueType.String)
    expect(col('Description').value).toBe('@SUM(A1:A9)')
    expect(col('Description').type).toBe(ExcelJS.ValueType.String)
    expect(col('Cost').value).toBe(7.8)
    expect(col('Case qty').value).toBe(8)
    expect(sheet.rowCount).toBe(2)
    const viewerBook = new ExcelJS.Workbook()
    await viewerBook.xlsx.load(arrayBufferOf((await fetchXlsx('viewer', `/api/items/export.xlsx?q=${encodeURIComponent(sku('XLS'))}`)).body as Buffer))
    const viewerHeaders = (viewerBook.getWorksheet('Items')!.getRow(1).values as unknown[]).slice(1)
    expect(viewerHeaders).toContain('List price')
    expect(viewerHeaders).not.toContain('Cost') // costs stay with buyers and admins
  })
})
