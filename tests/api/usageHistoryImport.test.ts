// Usage history from before Lumenyard: imported, it feeds the reorder statistics exactly as the same use
// recorded as issues does, changes no stock, and the suggestion list says how much of its window it covers.
// Two twin items in one warehouse: A's use comes from the imported sheet, B's from issue moves on the same
// days. Worked by hand below.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { ReorderLine, SuggestionList } from '../../shared/schemas/reorder.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, insertId, tagOf } from '../support/fixtureRows.js'

let h: ApiHarness
const tag = tagOf()
const WH = `UH${tag}`
const DAY_MS = 86_400_000
const todayMs = Date.parse(`${new Date().toISOString().slice(0, 10)}T00:00:00Z`)
const dayAgo = (n: number) => new Date(todayMs - n * DAY_MS).toISOString().slice(0, 10)
// The use: 9 units on each of four days in the (default, 180-day) window.
const USE_DAYS = [10, 40, 70, 100]
const ids = { a: 0, b: 0, wh: 0, bin: 0 }

beforeAll(async () => {
  h = await startApiHarness()
  ids.wh = await insertId(h.ds, 'INSERT INTO warehouses (code, name) VALUES (?, ?)', [WH, `Test history yard ${tag}`])
  ids.bin = await insertId(h.ds, "INSERT INTO bins (warehouse_id, code, kind) VALUES (?, 'A-01-1', 'storage')", [ids.wh])
  const vendor = await insertId(h.ds, 'INSERT INTO vendors (code, name, lead_time_days) VALUES (?, ?, 10)', [`UH${tag}`, `Test glassworks ${tag}`])
  for (const key of ['a', 'b'] as const) {
    const id = await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test panel anchor', 'anchor', 'each', 2.0000)", [`UH${tag}-${key.toUpperCase()}`])
    ids[key] = id
    await h.ds.query(`INSERT INTO vendor_items (vendor_id, item_id, vendor_sku, pack_qty, min_order_qty, unit_cost, lead_time_days, preferred)
                      VALUES (?, ?, ?, 1, 1, 2.0000, 10, 1)`, [vendor, id, `V-${tag}-${key}`])
    await h.ds.query('INSERT INTO item_warehouses (item_id, warehouse_id, avg_cost) VALUES (?, ?, 2.0000)', [id, ids.wh])
  }
  // Both start with 100 on hand a year ago; B's four issues of 9 leave it 64, A (whose use is history) stays 100.
  const move = (at: string, type: string, item: number, qty: number, cost: string | null) =>
    h.ds.query("INSERT INTO stock_moves (at, move_type, item_id, warehouse_id, bin_id, qty, unit_cost, batch_id) VALUES (?, ?, ?, ?, ?, ?, ?, UUID())", [at, type, item, ids.wh, ids.bin, qty, cost])
  for (const id of [ids.a, ids.b]) await move(`${dayAgo(365)} 09:00:00`, 'receipt', id, 100, '2.0000')
  for (const d of USE_DAYS) await move(`${dayAgo(d)} 11:00:00`, 'issue', ids.b, -9, null)
  await h.ds.query('INSERT INTO stock_balances (item_id, warehouse_id, bin_id, on_hand, reserved) VALUES (?, ?, ?, 100, 0), (?, ?, ?, 64, 0)', [ids.a, ids.wh, ids.bin, ids.b, ids.wh, ids.bin])
})
afterAll(() => h?.close())

const csv = (...rows: string[]) => Buffer.from(['SKU,Warehouse,Day,Month,Quantity used', ...rows].join('\n') + '\n', 'utf8')
const lines = async () => {
  const list = (await (await h.as('admin')).get(`/api/reorder/suggestions?warehouseId=${ids.wh}`)).body as SuggestionList
  return { list, a: list.lines.find((l) => l.itemId === ids.a), b: list.lines.find((l) => l.itemId === ids.b) }
}
/** Everything a suggestion says, but which item it is about. */
const figures = (l: ReorderLine | undefined) => {
  if (!l) return null
  const { key: _k, itemId: _i, sku: _s, onHand: _o, position: _p, daysOfSupply: _d, suggestedOrder: _q, status: _st, blockedBy: _b, ...rest } = l
  return rest
}

describe('usage history import', () => {
  it('refuses a row without a day or month, a day to come, and an unknown item, writing nothing', async () => {
    const res = await (await h.as('admin')).post('/api/imports/usage_history/commit').set(CSRF).attach('file', csv(
      `UH${tag}-A,${WH},,,5`,
      `UH${tag}-A,${WH},${dayAgo(-3)},,5`,
      `NOPE-${tag},${WH},${dayAgo(3)},,5`,
    ), 'usage.csv')
    expect(res.status).toBe(422)
    expect(Object.values(res.body.error.fields).map((p) => (p as { code: string }).code)).toEqual(['import_usage_day_or_month', 'day_after_today', 'sku_not_in_catalog'])
    expect(await countRows(h.ds, 'usage_history', 'item_id = ?', [ids.a])).toBe(0)
  })

  it('gives the same reorder figures as the same use recorded as issues, moves no stock, and says how much of the window it covers', async () => {
    const moves = await countRows(h.ds, 'stock_moves', 'item_id = ?', [ids.a])
    const res = await (await h.as('admin')).post('/api/imports/usage_history/commit').set(CSRF)
      .attach('file', csv(...USE_DAYS.map((d) => `UH${tag}-A,${WH},${dayAgo(d)},,9`)), 'usage.csv')
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.record.summary).toEqual({ lines: 4, units: 36, days: 4 })
    expect(await countRows(h.ds, 'stock_moves', 'item_id = ?', [ids.a])).toBe(moves) // history, never stock moves

    const { list, a, b } = await lines()
    // Hand-worked over the 180-day window, the empty days counting as 0 (textbook demand statistics,
    // Heizer & Render, Operations Management, inventory chapter): d̄ = 36 ÷ 180 = 0.2 a day;
    // Σx² = 4 × 81 = 324, squared deviations 324 − 36² ÷ 180 = 316.8, sample σ = √(316.8 ÷ 179) = 1.3304.
    expect(a!.meanDaily).toBeCloseTo(0.2, 10)
    expect(a!.sdDaily).toBeCloseTo(1.3304, 4)
    expect(a!.lastUsedDate).toBe(dayAgo(10))
    expect(figures(a)).toEqual(figures(b))
    expect(a!.reorderPoint).toBeGreaterThan(0)
    // The history spans day 100 ago to day 10 ago: 91 days of the window.
    expect(list.importedHistoryDays).toBe(91)
  })

  it('refuses usage for a day or month already held, naming the rows, and writes nothing', async () => {
    const held = await countRows(h.ds, 'usage_history', 'item_id = ?', [ids.a])
    expect(held).toBe(4)
    const month = dayAgo(40).slice(0, 7)
    // Row 2: a day already imported; row 3: a month holding an imported day; row 4: a day not held (fine alone).
    const res = await (await h.as('admin')).post('/api/imports/usage_history/commit').set(CSRF)
      .attach('file', csv(`UH${tag}-A,${WH},${dayAgo(10)},,5`, `UH${tag}-A,${WH},,${month},30`, `UH${tag}-A,${WH},${dayAgo(200)},,2`), 'usage-again.csv')
    expect(res.status).toBe(422)
    expect(res.body.error.code).toBe('import_invalid')
    expect(res.body.error.fields['2']).toMatchObject({ code: 'import_usage_overlap', params: { sku: `UH${tag}-A`, warehouse: WH, period: dayAgo(10) } })
    expect(res.body.error.fields['3']).toMatchObject({ code: 'import_usage_overlap', params: { period: month } })
    expect(res.body.error.fields['4']).toBeUndefined()
    expect(await countRows(h.ds, 'usage_history', 'item_id = ?', [ids.a])).toBe(held)
    // The check says the same, row by row, before any commit.
    const preview = await (await h.as('admin')).post('/api/imports/usage_history/preview').set(CSRF)
      .attach('file', csv(`UH${tag}-A,${WH},${dayAgo(70)},,5`), 'usage-again.csv')
    expect(preview.body.errorRows).toBe(1)
    expect(preview.body.rows[0].errors[0]).toMatchObject({ column: 'Day', problem: { code: 'import_usage_overlap' } })
  })

  it('is gone from the statistics once its import is reversed', async () => {
    const [record] = await h.ds.query("SELECT id FROM data_imports WHERE kind = 'usage_history' AND live_checksum IS NOT NULL ORDER BY id DESC LIMIT 1")
    const res = await (await h.as('admin')).post(`/api/imports/${record.id}/reverse`).set(CSRF)
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(await countRows(h.ds, 'usage_history', 'import_id = ?', [record.id])).toBe(0)
    const { a, b } = await lines()
    expect(a?.meanDaily ?? 0).toBe(0)
    expect(b!.meanDaily).toBeCloseTo(0.2, 10)
  })
})
