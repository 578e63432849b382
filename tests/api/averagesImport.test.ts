// Averages and minimums import against the real MariaDB: the moving-average cost of a warehouse that holds none
// of an item now, and the minimum set by hand, come in per item and warehouse. A file per refusal changes
// nothing; where the warehouse holds the item its stock's cost stands; the same file committed twice changes
// nothing the second time; a reversal puts back what each line had, and is refused once a line has changed.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, insertId, tagOf } from '../support/fixtureRows.js'
import { createWarehouse } from '../support/stockFixtures.js'

let h: ApiHarness
const tag = tagOf()
const SEAL = `AV-SEAL-${tag}`
const ANCHOR = `AV-ANC-${tag}`
const W1 = `A1${tag}`
const W2 = `A2${tag}`
const ids = { seal: 0, anchor: 0, w1: 0, w2: 0 }

const HEAD = 'SKU,Warehouse,Average cost,Manual minimum'
const csv = (...rows: string[]) => Buffer.from([HEAD, ...rows].join('\r\n') + '\r\n', 'utf8')
const send = async (kind: string, step: 'preview' | 'commit', file: Buffer, name = `${kind}.csv`) =>
  (await h.as('admin')).post(`/api/imports/${kind}/${step}`).set(CSRF).attach('file', file, name)

beforeAll(async () => {
  h = await startApiHarness()
  ids.seal = await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test clear sealant', 'sealant', 'tube', 5)", [SEAL])
  ids.anchor = await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test panel anchor', 'anchor', 'each', 1)", [ANCHOR])
  ids.w1 = (await createWarehouse(h.ds, W1, ['A-01-1'])).id
  ids.w2 = (await createWarehouse(h.ds, W2, ['B-01-1'])).id
  // The sealant is on hand in W1 at 6.10 a tube, through the opening stock import.
  const stock = await send('opening_stock', 'commit', Buffer.from(`SKU,Warehouse,Bin,Lot,Quantity,Unit cost\r\n${SEAL},${W1},A-01-1,,10,6.10\r\n`), 'stock.csv')
  expect(stock.status, JSON.stringify(stock.body).slice(0, 300)).toBe(200)
})
afterAll(() => h?.close())

/** Every line of the test's items: cost and minimum. */
const lines = () => h.ds.query('SELECT item_id, warehouse_id, avg_cost, min_qty FROM item_warehouses WHERE item_id IN (?) ORDER BY item_id, warehouse_id', [[ids.seal, ids.anchor]])

describe('averages and minimums import', () => {
  it('refuses each bad file with the problem on its row, and writes nothing', async () => {
    const before = { lines: await lines(), imports: await countRows(h.ds, 'data_imports') }
    // One file per refusal, each with the bad row after a good one.
    const good = `${SEAL},${W2},5.75,`
    const cases: [string, string, string, string][] = [
      ['unknown SKU', `NOPE-${tag},${W2},1.00,`, 'SKU', 'sku_not_in_catalog'],
      ['unknown warehouse', `${ANCHOR},NOPE${tag},1.00,`, 'Warehouse', 'import_warehouse_unknown'],
      ['negative cost', `${ANCHOR},${W2},-1.00,`, 'Average cost', 'not_negative'],
      ['cost past 4 decimals', `${ANCHOR},${W2},1.00005,`, 'Average cost', 'decimal_places'],
      ['cost not a number', `${ANCHOR},${W2},1.5x,`, 'Average cost', 'cell_number'],
      ['missing cost', `${ANCHOR},${W2},,4`, 'Average cost', 'required'],
      ['negative minimum', `${ANCHOR},${W2},1.00,-4`, 'Manual minimum', 'at_least'],
      ['fractional minimum', `${ANCHOR},${W2},1.00,2.5`, 'Manual minimum', 'cell_whole_number'],
      ['the same item and warehouse twice', `${SEAL},${W2.toLowerCase()},5.80,`, '-', 'import_row_repeated'],
      // W1 holds the sealant at 6.10: its average comes from that stock, and the answer says so.
      ['a cost other than the stock carries', `${SEAL},${W1},7.00,4`, 'Average cost', 'import_average_from_stock'],
    ]
    for (const [name, row, column, code] of cases) {
      const preview = await send('averages', 'preview', csv(good, row), `${name}.csv`)
      expect(preview.status, name).toBe(200)
      const errors = (preview.body.rows as { row: number; errors: { column: string | null; problem: { code: string } }[] }[])
        .flatMap((r) => r.errors.map((e) => `${r.row} ${e.column ?? '-'} ${e.problem.code}`))
      expect(errors, name).toEqual([`3 ${column} ${code}`])
      const commit = await send('averages', 'commit', csv(good, row), `${name}.csv`)
      expect(commit.status, name).toBe(422)
      expect(commit.body.error.code, name).toBe('import_invalid')
    }
    const fromStock = await send('averages', 'preview', csv(`${SEAL},${W1},7.00,4`))
    expect(fromStock.body.rows[0].errors[0].problem.params).toMatchObject({ sku: SEAL, warehouse: W1, cost: '6.1000' })
    expect({ lines: await lines(), imports: await countRows(h.ds, 'data_imports') }).toEqual(before)
  })

  it('brings averages and minimums in once, keeps the stock\'s cost, refuses a line already set, and reverses', async () => {
    const before = await lines()
    // W1 holds the sealant at 6.10: the same cost reads (written as 6.1), and only its minimum is set. W2 holds
    // none: its earlier average comes in. The anchor's W2 line has a cost of 0 and no minimum: nothing to write.
    const file = csv(`${SEAL},${W1},6.1,12`, `${SEAL},${W2},5.75,`, `${ANCHOR},${W1},0.8125,40`, `${ANCHOR},${W2},0,`)
    const done = await send('averages', 'commit', file)
    expect(done.status, JSON.stringify(done.body).slice(0, 400)).toBe(200)
    expect(done.body).toMatchObject({ ready: 3, skipped: 1 })
    expect(done.body.record.summary).toEqual({ lines: 3, averages: 2, minimums: 2 })
    const after = [
      { item_id: ids.seal, warehouse_id: ids.w1, avg_cost: '6.1000', min_qty: 12 },
      { item_id: ids.seal, warehouse_id: ids.w2, avg_cost: '5.7500', min_qty: null },
      { item_id: ids.anchor, warehouse_id: ids.w1, avg_cost: '0.8125', min_qty: 40 },
    ]
    expect(await lines()).toEqual(after)
    // The reorder screen values the W2 sealant line at its own earlier average, not the item's standard cost
    // (common practice: a warehouse's moving-average cost is the unit cost of its stock line).
    const line = await (await h.as('buyer')).get(`/api/reorder/lines/${ids.seal}/${ids.w2}`)
    expect(line.status).toBe(200)
    expect(line.body.line.unitCost).toBe('5.7500')

    // The same file again changes nothing, and says so.
    const again = await send('averages', 'commit', file)
    expect(again.status).toBe(200)
    expect(again.body.repeated).toBe(true)
    expect(await lines()).toEqual(after)
    // A line already set is refused in a new file, with what to do instead.
    const taken = await send('averages', 'preview', csv(`${SEAL},${W2},5.80,`, `${ANCHOR},${W1},0.8125,50`))
    expect(taken.body.rows.flatMap((r: { errors: { problem: { code: string } }[] }) => r.errors.map((e) => e.problem.code))).toEqual(['import_code_exists', 'import_code_exists'])

    // A minimum changed since blocks the reversal; put back, the reversal restores the lines as they were.
    await h.ds.query('UPDATE item_warehouses SET min_qty = 41 WHERE item_id = ? AND warehouse_id = ?', [ids.anchor, ids.w1])
    const refused = await (await h.as('admin')).post(`/api/imports/${done.body.record.id}/reverse`).set(CSRF)
    expect(refused.status).toBe(409)
    expect(refused.body.error).toMatchObject({ code: 'import_records_in_use', params: { code: `${ANCHOR} ${W1}` } })
    await h.ds.query('UPDATE item_warehouses SET min_qty = 40 WHERE item_id = ? AND warehouse_id = ?', [ids.anchor, ids.w1])
    const reversed = await (await h.as('admin')).post(`/api/imports/${done.body.record.id}/reverse`).set(CSRF)
    expect(reversed.status, JSON.stringify(reversed.body)).toBe(200)
    expect(await lines()).toEqual(before)
  })

  it('refuses other roles', async () => {
    for (const role of ['counter', 'buyer', 'warehouse', 'viewer'] as const) {
      expect((await (await h.as(role)).post('/api/imports/averages/commit').set(CSRF).attach('file', csv(`${SEAL},${W2},5.75,`), 'a.csv')).status, role).toBe(403)
    }
  })
})
