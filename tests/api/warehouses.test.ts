// Warehouses and bins: everyone reads; the admin sets them up; storage bin codes must fit the
// warehouse's aisle-bay-level pattern; a range creates only what is missing; bad input writes nothing.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { BinRow, WarehouseDetail, WarehouseRow } from '../../shared/schemas/warehouses.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'

let h: ApiHarness
beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

const suffix = Date.now().toString(36).slice(-4).toUpperCase()
const binCount = async (warehouseId: number) => Number((await h.ds.query('SELECT COUNT(*) AS n FROM bins WHERE warehouse_id = ?', [warehouseId]))[0].n)

async function newWarehouse(code: string): Promise<WarehouseRow> {
  const res = await (await h.as('admin')).post('/api/warehouses').set(CSRF).send({ code, name: `Test site ${code}`, address: '1 Test Lane' })
  expect(res.status).toBe(201)
  return res.body as WarehouseRow
}

describe('warehouses', () => {
  it('lists the demo warehouses with their bins for a viewer', async () => {
    const viewer = await h.as('viewer')
    const list = (await viewer.get('/api/warehouses')).body as WarehouseRow[]
    const hry = list.find((w) => w.code === 'HRY')!
    expect(hry.bins).toBeGreaterThanOrEqual(40)
    const detail = (await viewer.get(`/api/warehouses/${hry.id}`)).body as WarehouseDetail
    expect(detail.bins).toHaveLength(hry.bins)
    const [stock] = await h.ds.query('SELECT SUM(on_hand) AS q FROM stock_balances WHERE warehouse_id = ?', [hry.id])
    expect(detail.bins.reduce((s, b) => s + b.onHand, 0)).toBe(Number(stock.q))
    expect(detail.bins.filter((b) => b.kind === 'receiving').map((b) => b.code)).toEqual(['RCV'])
    expect((await viewer.get('/api/warehouses/99999999')).status).toBe(404)
  })

  it('lets only the admin create one, and refuses bad codes and patterns with field messages', async () => {
    expect((await (await h.as('warehouse')).post('/api/warehouses').set(CSRF).send({ code: `W${suffix}`, name: 'No' })).status).toBe(403)
    const admin = await h.as('admin')
    const bad = await admin.post('/api/warehouses').set(CSRF).send({ code: 'x', name: '', binPattern: '^[A-Z]+$' })
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['binPattern', 'code', 'name'])
    expect(bad.body.error.fields.binPattern).toEqual({ code: 'bin_pattern_groups', params: { missing: ['aisle', 'bay', 'level'] } })
    const [none] = await h.ds.query("SELECT COUNT(*) AS n FROM warehouses WHERE code = 'X'")
    expect(Number(none.n)).toBe(0)
    await newWarehouse(`W${suffix}`)
    const dup = await admin.post('/api/warehouses').set(CSRF).send({ code: `W${suffix}`, name: 'Again' })
    expect(dup.status).toBe(409)
    expect(dup.body.error.fields.code).toBeDefined()
  })
})

describe('bins', () => {
  it('creates a bin that fits the pattern, and refuses one that does not', async () => {
    const wh = await newWarehouse(`B${suffix}`)
    const admin = await h.as('admin')
    const ok = await admin.post(`/api/warehouses/${wh.id}/bins`).set(CSRF).send({ code: 'a-01-1' })
    expect(ok.status).toBe(201)
    expect((ok.body as BinRow).code).toBe('A-01-1')
    const misfit = await admin.post(`/api/warehouses/${wh.id}/bins`).set(CSRF).send({ code: 'SHELF1' })
    expect(misfit.status).toBe(400)
    expect(misfit.body.error.fields.code).toEqual({ code: 'bin_code_misfit', params: { code: 'SHELF1', warehouse: wh.code } })
    const dock = await admin.post(`/api/warehouses/${wh.id}/bins`).set(CSRF).send({ code: 'DOCK', kind: 'receiving' })
    expect(dock.status).toBe(201) // receiving and staging bins are named freely
    const again = await admin.post(`/api/warehouses/${wh.id}/bins`).set(CSRF).send({ code: 'A-01-1' })
    expect(again.status).toBe(409)
    expect(await binCount(wh.id)).toBe(2)
  })

  it('bulk-creates aisles A–C × bays 1–10 × levels 1–3, skipping codes that exist', async () => {
    const wh = await newWarehouse(`R${suffix}`)
    const admin = await h.as('admin')
    await admin.post(`/api/warehouses/${wh.id}/bins`).set(CSRF).send({ code: 'B-05-2' })
    const range = { aisleFrom: 'A', aisleTo: 'C', bayFrom: 1, bayTo: 10, levelFrom: 1, levelTo: 3 }
    const res = await admin.post(`/api/warehouses/${wh.id}/bins/range`).set(CSRF).send(range)
    expect(res.status).toBe(201)
    expect(res.body).toEqual({ created: 3 * 10 * 3 - 1, skipped: ['B-05-2'] })
    const codes = ((await admin.get(`/api/warehouses/${wh.id}`)).body as WarehouseDetail).bins.map((b) => b.code)
    expect(codes[0]).toBe('A-01-1')
    expect(codes.at(-1)).toBe('C-10-3')
    expect(codes).toHaveLength(90)
    const repeat = await admin.post(`/api/warehouses/${wh.id}/bins/range`).set(CSRF).send(range)
    expect(repeat.body.created).toBe(0)
    expect(await binCount(wh.id)).toBe(90)
  })

  it('refuses a backwards or oversized range and writes nothing', async () => {
    const wh = await newWarehouse(`Z${suffix}`)
    const admin = await h.as('admin')
    const backwards = await admin.post(`/api/warehouses/${wh.id}/bins/range`).set(CSRF).send({ aisleFrom: 'D', aisleTo: 'A', bayFrom: 5, bayTo: 1, levelFrom: 1, levelTo: 2 })
    expect(backwards.status).toBe(400)
    expect(Object.keys(backwards.body.error.fields).sort()).toEqual(['aisleTo', 'bayTo'])
    const huge = await admin.post(`/api/warehouses/${wh.id}/bins/range`).set(CSRF).send({ aisleFrom: 'A', aisleTo: 'Z', bayFrom: 1, bayTo: 99, levelFrom: 1, levelTo: 9 })
    expect(huge.status).toBe(400)
    expect(huge.body.error.fields.bayTo).toEqual({ code: 'bin_range_too_big', params: { max: 2000 } })
    expect(await binCount(wh.id)).toBe(0)
  })

  it('will not take a stocked bin out of use, rename it off-pattern, or touch the transit bin', async () => {
    const admin = await h.as('admin')
    const [stocked] = await h.ds.query("SELECT b.id, b.warehouse_id FROM bins b JOIN stock_balances sb ON sb.bin_id = b.id WHERE b.kind = 'storage' AND sb.on_hand > 0 LIMIT 1")
    const off = await admin.patch(`/api/warehouses/${stocked.warehouse_id}/bins/${stocked.id}`).set(CSRF).send({ active: false })
    expect(off.status).toBe(409)
    const rename = await admin.patch(`/api/warehouses/${stocked.warehouse_id}/bins/${stocked.id}`).set(CSRF).send({ code: 'NOPE' })
    expect(rename.status).toBe(400)
    const [bin] = await h.ds.query('SELECT code, active FROM bins WHERE id = ?', [stocked.id])
    expect(bin.active).toBe(1)
    expect(bin.code).not.toBe('NOPE')
    const [transit] = await h.ds.query("SELECT id, warehouse_id FROM bins WHERE kind = 'transit' LIMIT 1")
    expect((await admin.patch(`/api/warehouses/${transit.warehouse_id}/bins/${transit.id}`).set(CSRF).send({ active: false })).status).toBe(409)
  })

  it('deletes a bin made by mistake, but keeps one with history (take it out of use instead)', async () => {
    const wh = await newWarehouse(`D${suffix}`)
    const admin = await h.as('admin')
    const mistake = (await admin.post(`/api/warehouses/${wh.id}/bins`).set(CSRF).send({ code: 'A-01-9' })).body as BinRow
    const used = (await admin.post(`/api/warehouses/${wh.id}/bins`).set(CSRF).send({ code: 'A-01-1' })).body as BinRow
    // Another warehouse's path can't reach it; other roles can't delete.
    const other = await newWarehouse(`E${suffix}`)
    expect((await admin.delete(`/api/warehouses/${other.id}/bins/${mistake.id}`).set(CSRF)).status).toBe(404)
    expect((await (await h.as('warehouse')).delete(`/api/warehouses/${wh.id}/bins/${mistake.id}`).set(CSRF)).status).toBe(403)
    const gone = await admin.delete(`/api/warehouses/${wh.id}/bins/${mistake.id}`).set(CSRF)
    expect(gone.status).toBe(200)
    expect(await binCount(wh.id)).toBe(1)
    // A bin that ever held stock has movements: it stays on record, refused with bin_used, and nothing changes.
    const [item] = await h.ds.query("SELECT id FROM items WHERE active = 1 AND match_lot = 0 AND made_to_order = 0 LIMIT 1")
    const key = `del-bin-${suffix}`
    const received = await (await h.as('warehouse')).post('/api/stock/adjustments').set(CSRF).set('Idempotency-Key', key)
      .send({ itemId: item.id, binId: used.id, delta: 1, reason: 'found' })
    expect(received.status, JSON.stringify(received.body)).toBeLessThan(300)
    const keep = await admin.delete(`/api/warehouses/${wh.id}/bins/${used.id}`).set(CSRF)
    expect(keep.status).toBe(409)
    expect(keep.body.error.code).toBe('bin_used')
    expect(await binCount(wh.id)).toBe(1)
  })

  it('refuses found stock of an item matched by lot without its lot, and writes nothing', async () => {
    const wh = await newWarehouse(`L${suffix}`)
    const bin = (await (await h.as('admin')).post(`/api/warehouses/${wh.id}/bins`).set(CSRF).send({ code: 'A-01-1' })).body as BinRow
    const [item] = await h.ds.query('SELECT id FROM items WHERE active = 1 AND match_lot = 1 LIMIT 1')
    const res = await (await h.as('warehouse')).post('/api/stock/adjustments').set(CSRF).set('Idempotency-Key', `found-${suffix}`)
      .send({ itemId: item.id, binId: bin.id, delta: 5, reason: 'found' })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('lot_required')
    expect(res.body.error.fields).toHaveProperty('lotId')
    expect(Number((await h.ds.query('SELECT COUNT(*) AS n FROM stock_moves WHERE bin_id = ?', [bin.id]))[0].n)).toBe(0)
  })

  it('refuses a new bin pattern that existing bins do not fit', async () => {
    const admin = await h.as('admin')
    const hry = ((await admin.get('/api/warehouses')).body as WarehouseRow[]).find((w) => w.code === 'HRY')!
    const res = await admin.patch(`/api/warehouses/${hry.id}`).set(CSRF).send({ version: hry.version, binPattern: '^(?<aisle>[A-Z])(?<bay>\\d{3})(?<level>\\d)$' })
    expect(res.status).toBe(400)
    expect(res.body.error.fields.binPattern).toMatchObject({ code: 'bin_pattern_misfits', params: { bins: expect.arrayContaining(['A-01-1']) } })
    const renamed = await admin.patch(`/api/warehouses/${hry.id}`).set(CSRF).send({ version: hry.version, name: 'Harbor Road Yard' })
    expect(renamed.status).toBe(200)
    expect(renamed.body.binPattern).toBe(hry.binPattern)
  })
})
