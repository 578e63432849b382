// Vendors with their items from the business's own sheet, against the real MariaDB: a file per refusal changes
// nothing; a commit adds the new vendors and every vendor item with its pack, minimum, cost and lead time; the
// same file again writes nothing; a reversal takes it all back, and is refused once an order uses a vendor.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, insertId, tagOf } from '../support/fixtureRows.js'
import { createWarehouse } from '../support/stockFixtures.js'

let h: ApiHarness
const tag = tagOf()
const OLD = `VO${tag}` // a vendor already here, already selling TILE
const NEW = `VN${tag}` // a vendor the file adds
const BLK = `VI-BLK-${tag}`
const SEAL = `VI-SEAL-${tag}`
const TILE = `VI-TILE-${tag}`
const ids = { old: 0, blk: 0, seal: 0, tile: 0, wh: 0 }

beforeAll(async () => {
  h = await startApiHarness()
  ids.old = await insertId(h.ds, 'INSERT INTO vendors (code, name) VALUES (?, ?)', [OLD, `Test glassworks ${tag}`])
  for (const [key, sku] of [['blk', BLK], ['seal', SEAL], ['tile', TILE]] as const) {
    ids[key] = await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test vendor item', 'accessory', 'each', 1)", [sku])
  }
  await h.ds.query("INSERT INTO vendor_items (vendor_id, item_id, vendor_sku, pack_qty, min_order_qty, unit_cost, preferred) VALUES (?, ?, 'T-1', 1, 1, 1.0000, 1)", [ids.old, ids.tile])
  ids.wh = (await createWarehouse(h.ds, `VW${tag}`, ['A-01-1'])).id
})
afterAll(() => h?.close())

const HEAD = 'Vendor code,Vendor name,SKU,Vendor SKU,Pack size,Minimum order,Cost per stock unit,Lead time days,Preferred'
const csv = (...rows: string[]) => Buffer.from([HEAD, ...rows].join('\r\n') + '\r\n', 'utf8')
const send = async (step: 'preview' | 'commit', file: Buffer, name = 'vendors.csv') =>
  (await h.as('admin')).post(`/api/imports/vendor_items/${step}`).set(CSRF).attach('file', file, name)

async function state() {
  return {
    vendors: await countRows(h.ds, 'vendors', 'code IN (?)', [[OLD, NEW]]),
    items: await h.ds.query('SELECT vendor_id, item_id, vendor_sku, pack_qty, min_order_qty, unit_cost, lead_time_days, preferred FROM vendor_items WHERE item_id IN (?) ORDER BY vendor_id, item_id', [[ids.blk, ids.seal, ids.tile]]),
    imports: await countRows(h.ds, 'data_imports'),
  }
}

const GOOD = csv(
  `${OLD},,${BLK},GW-880,8,10,4.2500,21,yes`,
  `${NEW},Test blockworks ${tag},${SEAL},BW-SIL,12,2,6.10,,`,
  `${NEW},,${BLK},BW-88,10,1,4.40,30,no`,
)

describe('vendors with their items import', () => {
  it('refuses each bad file with the problem named on its row, and writes nothing', async () => {
    const before = await state()
    // One file per refusal, each with one bad row after a good one (common practice: a failed import changes nothing).
    const cases: [string, string, string][] = [
      ['unknown SKU', `${OLD},,NOPE-${tag},X-1,1,1,1.00,,`, 'sku_not_in_catalog'],
      ['new vendor without a name', `VZ${tag},,${SEAL},X-1,1,1,1.00,,`, 'import_vendor_name_needed'],
      ['vendor already selling the item', `${OLD},,${TILE},X-1,1,1,1.00,,`, 'import_vendor_item_exists'],
      ['a second preferred vendor', `${NEW},Test blockworks ${tag},${TILE},X-1,1,1,1.00,,yes`, 'import_preferred_taken'],
      ['pack size 0', `${OLD},,${SEAL},X-1,0,1,1.00,,`, 'at_least'],
      ['negative cost', `${OLD},,${SEAL},X-1,1,1,-2,,`, 'cost_format'],
      ['missing vendor SKU', `${OLD},,${SEAL},,1,1,1.00,,`, 'required'],
      ['bad vendor code', `V Z!,Name,${SEAL},X-1,1,1,1.00,,`, 'vendor_code_chars'],
    ]
    for (const [label, row, code] of cases) {
      const res = await send('commit', csv(`${OLD},,${BLK},GW-1,1,1,1.00,,`, row), `${label}.csv`)
      expect(res.status, label).toBe(422)
      expect(res.body.error.code, label).toBe('import_invalid')
      expect(Object.values(res.body.error.fields).map((p) => (p as { code: string }).code), label).toContain(code)
      expect(res.body.error.fields['2'], label).toBeUndefined()
    }
    expect(await state()).toEqual(before)
  })

  it('adds the new vendor and every item once, the same file again changes nothing, and a reversal takes it back', async () => {
    const before = await state()
    const check = await send('preview', GOOD)
    expect(check.status, JSON.stringify(check.body)).toBe(200)
    expect(check.body).toMatchObject({ total: 3, ready: 3, errorRows: 0 })
    expect(await state()).toEqual(before)

    const done = await send('commit', GOOD)
    expect(done.status, JSON.stringify(done.body)).toBe(200)
    expect(done.body.record.summary).toEqual({ vendorItems: 3, vendors: 1 })
    const [added] = await h.ds.query('SELECT id, name, lead_time_days FROM vendors WHERE code = ?', [NEW])
    expect(added.name).toBe(`Test blockworks ${tag}`)
    const rows = (await state()).items as Record<string, unknown>[]
    // The sheet's own figures, as typed.
    expect(rows).toContainEqual({ vendor_id: ids.old, item_id: ids.blk, vendor_sku: 'GW-880', pack_qty: 8, min_order_qty: 10, unit_cost: '4.2500', lead_time_days: 21, preferred: 1 })
    expect(rows).toContainEqual({ vendor_id: added.id, item_id: ids.seal, vendor_sku: 'BW-SIL', pack_qty: 12, min_order_qty: 2, unit_cost: '6.1000', lead_time_days: null, preferred: 0 })
    expect(rows).toContainEqual({ vendor_id: added.id, item_id: ids.blk, vendor_sku: 'BW-88', pack_qty: 10, min_order_qty: 1, unit_cost: '4.4000', lead_time_days: 30, preferred: 0 })

    const afterFirst = await state()
    const again = await send('commit', GOOD, 'vendors-again.csv')
    expect(again.status).toBe(200)
    expect(again.body.repeated).toBe(true)
    expect(await state()).toEqual(afterFirst)

    const reversed = await (await h.as('admin')).post(`/api/imports/${done.body.record.id}/reverse`).set(CSRF)
    expect(reversed.status, JSON.stringify(reversed.body)).toBe(200)
    expect(await state()).toEqual({ ...before, imports: before.imports + 1 })
  })

  it('is no longer reversed whole once an order goes to a vendor it added', async () => {
    const done = await send('commit', GOOD, 'vendors-third.csv')
    expect(done.status, JSON.stringify(done.body)).toBe(200)
    const [added] = await h.ds.query('SELECT id FROM vendors WHERE code = ?', [NEW])
    const po = await (await h.as('buyer')).post('/api/purchase-orders').set(CSRF).send({ vendorId: added.id, warehouseId: ids.wh, lines: [{ itemId: ids.seal, packsOrdered: 1 }] })
    expect(po.status, JSON.stringify(po.body)).toBe(201)
    const before = await state()
    const refused = await (await h.as('admin')).post(`/api/imports/${done.body.record.id}/reverse`).set(CSRF)
    expect(refused.status).toBe(409)
    expect(refused.body.error.code).toBe('import_records_in_use')
    expect(await state()).toEqual(before)
  })
})
