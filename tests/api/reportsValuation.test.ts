// Stock valuation as of a past day, through the API on the real MariaDB: receipts and an issue posted
// through the stock service, then placed on their days in the ledger, and the report read back as of
// days between them. Each figure is the moving-average arithmetic worked by hand beside it. Who may
// open the report (owner and buyer) and who sees its values are checked by the role matrix (roleMatrix.ts).
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { ValuationReport } from '../../shared/schemas/reports.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { fxItem, fxWarehouse, tagOf, type FxItem, type FxWarehouse } from '../support/pickFixtures.js'

let h: ApiHarness
let admin: supertest.Agent
let wh: FxWarehouse
let annex: FxWarehouse
let block: FxItem
let spacer: FxItem

/** The id of the last ledger row so far: moves posted after it are the ones to place on a day. */
async function ledgerMark(): Promise<number> {
  const [row] = (await h.ds.query('SELECT COALESCE(MAX(id), 0) AS id FROM stock_moves')) as { id: number }[]
  return Number(row.id)
}

/** Posts a stock operation, then moves its ledger rows to `at` (the report reads history by the ledger's time). */
async function postedAt(at: string, path: string, body: object): Promise<void> {
  const mark = await ledgerMark()
  const res = await admin.post(path).set(CSRF).send(body)
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  await h.ds.query('UPDATE stock_moves SET at = ? WHERE id > ? AND item_id IN (?)', [new Date(at), mark, [block.id, spacer.id]])
}

const receipt = (w: FxWarehouse, itemId: number, qty: number, unitCost: string) =>
  ({ warehouseId: w.id, lines: [{ itemId, binId: Object.values(w.bins)[0], lotId: null, qty, unitCost }] })

async function valuation(query: string, agent = admin): Promise<supertest.Response> {
  return agent.get(`/api/reports/stock-valuation?${query}`)
}
const groupOf = (r: ValuationReport, w: FxWarehouse, family: string) =>
  r.groups.find((g) => g.warehouseId === w.id && g.family === family)

beforeAll(async () => {
  h = await startApiHarness()
  admin = await h.as('admin')
  const tag = tagOf()
  wh = await fxWarehouse(h.ds, `V${tag}`, ['A-01-1'])
  annex = await fxWarehouse(h.ds, `W${tag}`, ['A-01-1'])
  block = await fxItem(h.ds, `VB-${tag}`)
  spacer = await fxItem(h.ds, `VS-${tag}`, { family: 'spacer' })
  // source: Weygandt, Kimmel & Kieso, Accounting Principles, inventories chapter appendix (perpetual
  // inventory, moving-average method) — from memory: 100 @ $10 on hand, bought 200 @ $11 and 300 @ $12,
  // sold 550, bought 400 @ $13. Posted in that order, each on its day (noon UTC).
  await postedAt('2026-01-01T12:00:00Z', '/api/stock/receipts', receipt(wh, block.id, 100, '10.00'))
  await postedAt('2026-04-15T12:00:00Z', '/api/stock/receipts', receipt(wh, block.id, 200, '11.00'))
  await postedAt('2026-08-24T12:00:00Z', '/api/stock/receipts', receipt(wh, block.id, 300, '12.00'))
  // 10 spacers into the annex at 23:30 on 31 August in Chicago, which is already 1 September in UTC
  // (from memory: US Central summer time is UTC−5).
  await postedAt('2026-09-01T04:30:00Z', '/api/stock/receipts', receipt(annex, spacer.id, 10, '2.50'))
  await postedAt('2026-09-10T12:00:00Z', '/api/stock/issues',
    { lines: [{ itemId: block.id, binId: Object.values(wh.bins)[0], lotId: null, qty: 550 }] })
  await postedAt('2026-11-27T12:00:00Z', '/api/stock/receipts', receipt(wh, block.id, 400, '13.00'))
})
afterAll(async () => {
  await h?.close()
})

describe('stock value as of a past day', () => {
  it('before the first receipt there is nothing to value', async () => {
    const res = await valuation(`asOf=2025-12-31&warehouseId=${wh.id}`)
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ asOf: '2025-12-31', groups: [], stockValue: '0.00' })
  })

  it('after the August purchase: 600 blocks at the blended average', async () => {
    // April: (100 × 10 + 200 × 11) / 300 = 10.66666… → 10.6667 (four places, half up, as stored);
    // August: (300 × 10.6667 + 300 × 12) / 600 = 6,800.01 / 600 = 11.33335 → 11.3334; 600 × 11.3334 = 6,800.04.
    const body = (await valuation(`asOf=2026-08-31&warehouseId=${wh.id}`)).body as ValuationReport
    expect(groupOf(body, wh, 'glass_block')).toMatchObject({ items: 1, onHand: 600, stockValue: '6800.04' })
    expect(body.stockValue).toBe('6800.04')
  })

  it('the day ends at midnight where the reader is', async () => {
    // The spacers came in at 23:30 on 31 August in Chicago: counted as of that day there, not in UTC.
    const utc = (await valuation(`asOf=2026-08-31&warehouseId=${annex.id}`)).body as ValuationReport
    expect(utc.groups).toEqual([])
    const chicago = (await valuation(`asOf=2026-08-31&warehouseId=${annex.id}&tz=America/Chicago`)).body as ValuationReport
    // 10 × 2.50 = 25.00
    expect(groupOf(chicago, annex, 'spacer')).toMatchObject({ onHand: 10, stockValue: '25.00' })
  })

  it('after the September sale: 50 left at the same average', async () => {
    // The sale moves no cost: 50 × 11.3334 = 566.67 (566.670).
    const body = (await valuation(`asOf=2026-09-30&warehouseId=${wh.id}`)).body as ValuationReport
    expect(groupOf(body, wh, 'glass_block')).toMatchObject({ onHand: 50, stockValue: '566.67' })
  })

  it('today: the November purchase blended with the 50 left, by warehouse and family', async () => {
    // (50 × 11.3334 + 400 × 13) / 450 = 5,766.67 / 450 = 12.81482… → 12.8148; 450 × 12.8148 = 5,766.66.
    const body = (await valuation('')).body as ValuationReport
    expect(groupOf(body, wh, 'glass_block')).toMatchObject({ onHand: 450, stockValue: '5766.66' })
    expect(groupOf(body, annex, 'spacer')).toMatchObject({ onHand: 10, stockValue: '25.00' })
    expect(body.warehouses.find((w) => w.warehouseId === wh.id)?.stockValue).toBe('5766.66')
    // The replay agrees with the average the stock service keeps as moves happen.
    const [row] = (await h.ds.query('SELECT avg_cost FROM item_warehouses WHERE item_id = ? AND warehouse_id = ?', [block.id, wh.id])) as { avg_cost: string }[]
    expect(row.avg_cost).toBe('12.8148')
  })

  it('refuses a day to come and a time zone it does not know, with their codes', async () => {
    const future = await valuation('asOf=2999-01-01')
    expect(future.status).toBe(400)
    expect(JSON.stringify(future.body)).toContain('day_after_today')
    const zone = await valuation('asOf=2026-08-31&tz=Mars/Olympus')
    expect(zone.status).toBe(400)
    expect(JSON.stringify(zone.body)).toContain('time_zone_unknown')
  })
})
