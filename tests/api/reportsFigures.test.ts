// The owner's and buyer's reports through the API on the real MariaDB: turns and days of supply by family,
// usage by month, dead and slow stock, and vendors' on-time rate and observed lead time. Moves are posted
// through the stock service (and POs through purchasing), then placed on their days in the ledger; every
// figure is worked by hand beside it. Spreadsheets are read back with exceljs. Who may open the reports and
// who sees their values is checked by the role matrix (roleMatrix.ts, with a cost sample for each report).
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { DeadStockReport, TurnsReport, UsageReport, VendorReport } from '../../shared/schemas/reports.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { download, loadWorkbook } from '../support/downloads.js'
import { fxItem, fxWarehouse, tagOf, type FxItem, type FxWarehouse } from '../support/pickFixtures.js'
import { createPurchasingFixture, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: ApiHarness
let admin: supertest.Agent
let wh: FxWarehouse
let block: FxItem
let spacer: FxItem
let slow: FxItem
let quick: FxItem
let f: PurchasingFixture
const DAY = 86_400_000

async function postedAt(at: Date, path: string, body: object, items: number[]): Promise<void> {
  const [mark] = (await h.ds.query('SELECT COALESCE(MAX(id), 0) AS id FROM stock_moves')) as { id: number }[]
  const res = await admin.post(path).set(CSRF).send(body)
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  await h.ds.query('UPDATE stock_moves SET at = ? WHERE id > ? AND item_id IN (?)', [at, mark.id, items])
}
const bin = () => wh.bins['A-01-1']
const receipt = (itemId: number, qty: number, unitCost: string) => ({ warehouseId: wh.id, lines: [{ itemId, binId: bin(), lotId: null, qty, unitCost }] })
const issue = (itemId: number, qty: number) => ({ lines: [{ itemId, binId: bin(), lotId: null, qty }] })

/** A PO for 12 tubes of sealant from vendor A, sent, expected and received on the days given (noon UTC). */
async function deliveredPo(sent: string, expected: string, received: string): Promise<void> {
  const created = await admin.post('/api/purchase-orders').set(CSRF)
    .send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.sealant.id, packsOrdered: 1 }] })
  expect(created.status).toBe(201)
  const po = created.body as { id: number; version: number; lines: { id: number }[] }
  expect((await admin.post(`/api/purchase-orders/${po.id}/approve`).set(CSRF).send({ version: po.version })).status).toBe(200)
  expect((await admin.post(`/api/purchase-orders/${po.id}/mark-sent`).set(CSRF)).status).toBe(200)
  const res = await admin.post(`/api/purchase-orders/${po.id}/receipts`).set(CSRF).send({ lines: [{ poLineId: po.lines[0].id, binId: f.warehouse.bins.a1, qty: 12 }] })
  expect(res.status).toBe(201)
  await h.ds.query('UPDATE purchase_orders SET sent_at = ?, expected_date = ? WHERE id = ?', [new Date(`${sent}T12:00:00Z`), expected, po.id])
  await h.ds.query("UPDATE stock_moves SET at = ? WHERE doc_type = 'purchase_order' AND doc_id = ?", [new Date(`${received}T12:00:00Z`), po.id])
}

beforeAll(async () => {
  h = await startApiHarness()
  admin = await h.as('admin')
  const tag = tagOf()
  wh = await fxWarehouse(h.ds, `R${tag}`, ['A-01-1'])
  block = await fxItem(h.ds, `RB-${tag}`)
  spacer = await fxItem(h.ds, `RS-${tag}`, { family: 'spacer' })
  slow = await fxItem(h.ds, `RW-${tag}`, { family: 'grout' })
  quick = await fxItem(h.ds, `RQ-${tag}`, { family: 'grout' })
  // Turns and usage: 100 blocks at $10.00 in January, 40 issued in February, 20 in March, 50 more at $13.00
  // on 20 March. 10 spacers at $2.00 in January, never used.
  await postedAt(new Date('2026-01-05T12:00:00Z'), '/api/stock/receipts', receipt(block.id, 100, '10.00'), [block.id])
  await postedAt(new Date('2026-01-05T12:00:00Z'), '/api/stock/receipts', receipt(spacer.id, 10, '2.00'), [spacer.id])
  await postedAt(new Date('2026-02-10T12:00:00Z'), '/api/stock/issues', issue(block.id, 40), [block.id])
  await postedAt(new Date('2026-03-15T12:00:00Z'), '/api/stock/issues', issue(block.id, 20), [block.id])
  await postedAt(new Date('2026-03-20T12:00:00Z'), '/api/stock/receipts', receipt(block.id, 50, '13.00'), [block.id])
  // Dead and slow, against today: 1,000 grout bags 100 days ago, 10 used 10 days ago (slow); 100 of another
  // grout 100 days ago, 90 used 5 days ago (neither).
  const now = Date.now()
  await postedAt(new Date(now - 100 * DAY), '/api/stock/receipts', receipt(slow.id, 1000, '8.00'), [slow.id])
  await postedAt(new Date(now - 10 * DAY), '/api/stock/issues', issue(slow.id, 10), [slow.id])
  await postedAt(new Date(now - 100 * DAY), '/api/stock/receipts', receipt(quick.id, 100, '8.00'), [quick.id])
  await postedAt(new Date(now - 5 * DAY), '/api/stock/issues', issue(quick.id, 90), [quick.id])
  // Vendors: one order on time (sent 1 March, expected 10 March, arrived 9 March), one late (sent 1 April,
  // expected 8 April, arrived 12 April).
  f = await createPurchasingFixture(h.ds)
  await deliveredPo('2026-03-01', '2026-03-10', '2026-03-09')
  await deliveredPo('2026-04-01', '2026-04-08', '2026-04-12')
})
afterAll(async () => {
  await h?.close()
})

describe('turns and days of supply by family', () => {
  it('February and March: the textbook ratios from values replayed by hand', async () => {
    const res = await admin.get(`/api/reports/turns?from=2026-02-01&to=2026-03-31&warehouseId=${wh.id}&tz=UTC`)
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    const body = res.body as TurnsReport
    // 1 February – 31 March 2026: 28 + 31 = 59 days.
    expect(body.days).toBe(59)
    const blocks = body.families.find((r) => r.family === 'glass_block')!
    // Begin (end of 31 January): 100 × 10.00 = 1,000.00. Usage: (40 + 20) × 10.00 = 600.00.
    // End: 40 left at 10.00, then 50 at 13.00: (40 × 10 + 50 × 13) / 90 = 1,050 / 90 = 11.66666… → 11.6667;
    // 90 × 11.6667 = 1,050.003 → 1,050.00. Average inventory (1,000.00 + 1,050.00) / 2 = 1,025.00.
    expect(blocks).toMatchObject({ usedQty: 60, usageValue: '600.00', beginValue: '1000.00', endValue: '1050.00', averageValue: '1025.00' })
    // source: Weygandt, Kimmel & Kieso, Accounting Principles, inventories chapter: inventory turnover = cost of
    // goods sold ÷ average inventory; days in inventory = days in the period ÷ turnover.
    // 600 / 1,025 = 0.58537 turns in 59 days; 59 / 0.58537 = 100.79 days; a year's rate 0.58537 × 365 / 59 = 3.6213.
    expect(blocks.turns).toBeCloseTo(0.58537, 4)
    expect(blocks.daysOfSupply).toBeCloseTo(100.79, 1)
    expect(blocks.annualTurns).toBeCloseTo(3.6213, 3)
    // Spacers never used: no turns, no days of supply (nothing goes out), value 10 × 2.00 both ends.
    expect(body.families.find((r) => r.family === 'spacer')).toMatchObject({ usedQty: 0, beginValue: '20.00', endValue: '20.00', turns: 0, daysOfSupply: null })
    expect(body.total).toMatchObject({ usageValue: '600.00', beginValue: '1020.00', endValue: '1070.00', averageValue: '1045.00' })
  })

  it('refuses a period that ends before it starts, or one to come', async () => {
    expect((await admin.get('/api/reports/turns?from=2026-03-01&to=2026-02-01')).body.error.fields).toHaveProperty('to')
    expect((await admin.get('/api/reports/turns?from=2026-03-01&to=2999-01-01')).status).toBe(400)
    expect((await admin.get('/api/reports/usage?from=2020-01-01&to=2026-01-01')).body.error.fields.from.code).toBe('period_too_long')
  })
})

describe('usage by family and month', () => {
  it('units and their cost in each month the period touches', async () => {
    const body = (await admin.get(`/api/reports/usage?from=2026-01-01&to=2026-03-31&warehouseId=${wh.id}&tz=UTC`)).body as UsageReport
    expect(body.months).toEqual(['2026-01', '2026-02', '2026-03'])
    // February 40 × 10.00 = 400.00; March 20 × 10.00 = 200.00; nothing in January.
    expect(body.cells).toEqual([
      { month: '2026-02', family: 'glass_block', qty: 40, usageValue: '400.00' },
      { month: '2026-03', family: 'glass_block', qty: 20, usageValue: '200.00' },
    ])
  })
})

describe('dead and slow stock', () => {
  it('what was never used, and what lasts far longer than the limit at its recent use', async () => {
    const body = (await admin.get(`/api/reports/dead-stock?warehouseId=${wh.id}&deadDays=180&slowDays=180&windowDays=180`)).body as DeadStockReport
    const row = (id: number) => body.rows.find((r) => r.itemId === id)
    // Spacers: received in January, never used: dead; 10 × 2.00 = 20.00.
    expect(row(spacer.id)).toMatchObject({ kind: 'dead', onHand: 10, lastUsedAt: null, stockValue: '20.00' })
    // Slow grout: 990 left, 10 used in 180 days: 990 / (10 / 180) = 17,820 days > 180; 990 × 8.00 = 7,920.00.
    expect(row(slow.id)).toMatchObject({ kind: 'slow', onHand: 990, usedInWindow: 10, stockValue: '7920.00' })
    expect(row(slow.id)!.daysOfSupply).toBeCloseTo(17_820, 6)
    // Quick grout: 10 left, 90 used: 10 / (90 / 180) = 20 days: neither dead nor slow.
    expect(row(quick.id)).toBeUndefined()
    // Largest value first.
    expect(body.rows.map((r) => Number(r.stockValue))).toEqual([...body.rows.map((r) => Number(r.stockValue))].sort((a, b) => b - a))
  })
})

describe('vendors on time and lead time', () => {
  it('one order of two on time; lead times from sending to the first delivery', async () => {
    const body = (await admin.get(`/api/reports/vendors?from=2026-03-01&to=2026-04-30&warehouseId=${f.warehouse.id}&tz=UTC`)).body as VendorReport
    const a = body.vendors.find((v) => v.vendorId === f.vendorA)
    // On time 1 of 2 = 0.5; lead 8 days (1 → 9 March) and 11 days (1 → 12 April): mean 9.5, least 8, most 11.
    expect(a).toMatchObject({ orders: 2, withDate: 2, onTime: 1, onTimeRate: 0.5, leadDaysMean: 9.5, leadDaysMin: 8, leadDaysMax: 11 })
  })
})

describe('spreadsheets', () => {
  it('turns and usage read back with exceljs hold the figures of the screen', async () => {
    const res = await download(admin, `/api/reports/turns/export?from=2026-02-01&to=2026-03-31&warehouseId=${wh.id}&tz=UTC&lang=en`)
    expect(res.status).toBe(200)
    const book = await loadWorkbook(res.body as Buffer)
    const turns = book.worksheets[0]
    const header = turns.getRow(1).values as unknown[]
    const blocksRow = turns.getRows(2, turns.rowCount - 1)!.find((r) => r.getCell(1).value === 'Glass block')!
    const cell = (name: string) => blocksRow.getCell(header.indexOf(name)).value
    expect(cell('Cost of what was used')).toBe(600)
    expect(cell('Average stock value')).toBe(1025)
    expect(Number(cell('Turns'))).toBeCloseTo(0.58537, 4)
    expect(Number(cell('Days of supply'))).toBeCloseTo(100.79, 1)
    const usage = await loadWorkbook((await download(admin, `/api/reports/usage/export?from=2026-01-01&to=2026-03-31&warehouseId=${wh.id}&tz=UTC&lang=es`)).body as Buffer)
    const uRow = usage.worksheets[0].getRow(2)
    expect(uRow.getCell(1).value).toBe('Bloque de vidrio')
  })
})
