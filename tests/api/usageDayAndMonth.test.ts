// Usage history given for one item, warehouse and month both as a month total and by a day of that month counts
// the day's use twice: the later row is refused, in one file (either order) and against an earlier import that
// brought the month in as a total (whose days without a unit hold no row), in the check and the commit alike, and
// the reorder statistics read the month once. Real MariaDB; worked by hand below.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { SuggestionList } from '../../shared/schemas/reorder.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, insertId, tagOf } from '../support/fixtureRows.js'

let h: ApiHarness
const tag = tagOf()
const WH = `UD${tag}`
const SKU = `UD${tag}-A`
const DAY_MS = 86_400_000
const todayMs = Date.parse(`${new Date().toISOString().slice(0, 10)}T00:00:00Z`)
const dayAgo = (n: number) => new Date(todayMs - n * DAY_MS).toISOString().slice(0, 10)
/** A month wholly past and wholly inside the default 180-day window: the one holding the day 60 days ago. */
const MONTH = dayAgo(60).slice(0, 7)
const ids = { item: 0, wh: 0 }

beforeAll(async () => {
  h = await startApiHarness()
  ids.wh = await insertId(h.ds, 'INSERT INTO warehouses (code, name) VALUES (?, ?)', [WH, `Test history yard ${tag}`])
  const bin = await insertId(h.ds, "INSERT INTO bins (warehouse_id, code, kind) VALUES (?, 'A-01-1', 'storage')", [ids.wh])
  const vendor = await insertId(h.ds, 'INSERT INTO vendors (code, name, lead_time_days) VALUES (?, ?, 10)', [`UD${tag}`, `Test glassworks ${tag}`])
  ids.item = await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test panel anchor', 'anchor', 'each', 2.0000)", [SKU])
  await h.ds.query(`INSERT INTO vendor_items (vendor_id, item_id, vendor_sku, pack_qty, min_order_qty, unit_cost, lead_time_days, preferred)
                    VALUES (?, ?, ?, 1, 1, 2.0000, 10, 1)`, [vendor, ids.item, `V-${tag}`])
  await h.ds.query('INSERT INTO item_warehouses (item_id, warehouse_id, avg_cost) VALUES (?, ?, 2.0000)', [ids.item, ids.wh])
  await h.ds.query("INSERT INTO stock_moves (at, move_type, item_id, warehouse_id, bin_id, qty, unit_cost, batch_id) VALUES (?, 'receipt', ?, ?, ?, 100, 2.0000, UUID())",
    [`${dayAgo(365)} 09:00:00`, ids.item, ids.wh, bin])
  await h.ds.query('INSERT INTO stock_balances (item_id, warehouse_id, bin_id, on_hand, reserved) VALUES (?, ?, ?, 100, 0)', [ids.item, ids.wh, bin])
})
afterAll(() => h?.close())

const csv = (...rows: string[]) => Buffer.from(['SKU,Warehouse,Day,Month,Quantity used', ...rows].join('\n') + '\n', 'utf8')
const send = async (step: 'preview' | 'commit', file: Buffer) => (await h.as('admin')).post(`/api/imports/usage_history/${step}`).set(CSRF).attach('file', file, `usage-${Math.random()}.csv`)
/** Every problem of every row a check answered, as [row, column, code]. */
const checked = (body: { rows: { row: number; errors: { column: string | null; problem: { code: string } }[] }[] }) =>
  body.rows.flatMap((r) => r.errors.map((e) => [r.row, e.column, e.problem.code]))
const meanDaily = async () => {
  const list = (await (await h.as('admin')).get(`/api/reorder/suggestions?warehouseId=${ids.wh}`)).body as SuggestionList
  return list.lines.find((l) => l.itemId === ids.item)?.meanDaily ?? 0
}

describe('usage given by the day and by the month', () => {
  it('refuses the later of a day row and a month row of the same month in one file, either order, checked and committed alike', async () => {
    const day = `${MONTH}-15`
    for (const [first, second, column] of [[`${SKU},${WH},${day},,5`, `${SKU},${WH},,${MONTH},30`, 'Month'], [`${SKU},${WH},,${MONTH},30`, `${SKU},${WH},${day},,5`, 'Day']]) {
      const file = csv(first, second)
      const check = await send('preview', file)
      expect(check.status, JSON.stringify(check.body)).toBe(200)
      // Row 3 gives the month the other way from row 2 (common practice: one month's use is counted once).
      expect(checked(check.body)).toEqual([[3, column, 'import_usage_day_and_month']])
      expect(check.body.rows.find((r: { row: number }) => r.row === 3).errors[0].problem.params).toEqual({ sku: SKU, warehouse: WH, month: MONTH, row: 2 })
      const commit = await send('commit', file)
      expect(commit.status).toBe(422)
      expect(commit.body.error.fields).toEqual({ 3: { code: 'import_usage_day_and_month', params: { sku: SKU, warehouse: WH, month: MONTH, row: 2 } } })
      expect(await countRows(h.ds, 'usage_history', 'item_id = ?', [ids.item])).toBe(0)
    }
  })

  it('refuses a day of a month an earlier import gave as a total, even a day its spread left without a unit, and counts the month once', async () => {
    // 3 units for the month spread in whole units go to its first three days (1st, 2nd, 3rd): the 15th holds no row.
    const month = await send('commit', csv(`${SKU},${WH},,${MONTH},3`))
    expect(month.status, JSON.stringify(month.body)).toBe(200)
    expect(await countRows(h.ds, 'usage_history', 'item_id = ? AND day = ?', [ids.item, `${MONTH}-15`])).toBe(0)
    // Hand-worked: 3 units over the 180-day window (empty days count as 0) is 3 ÷ 180 = 0.0167 a day (the API gives 4 decimals)
    // (textbook demand statistics, Heizer & Render, Operations Management, inventory chapter).
    expect(await meanDaily()).toBeCloseTo(3 / 180, 4)

    const file = csv(`${SKU},${WH},${MONTH}-15,,5`)
    const check = await send('preview', file)
    expect(checked(check.body)).toEqual([[2, 'Day', 'import_usage_month_held']])
    const commit = await send('commit', file)
    expect(commit.status).toBe(422)
    expect(commit.body.error.fields).toEqual({ 2: { code: 'import_usage_month_held', params: { sku: SKU, warehouse: WH, month: MONTH } } })
    // The month is still read once: 3 units, not 3 + 5.
    expect(await meanDaily()).toBeCloseTo(3 / 180, 4)
  })
})
