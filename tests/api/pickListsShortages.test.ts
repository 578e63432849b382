// What a warehouse lacks: the plan offers a transfer from another warehouse, a backorder for the
// buyer or a substitute; a split spreads the list over warehouses. Real MariaDB, through the API.
// Quantities are hand-worked from the fixture's stock (pickFixtures.ts: 200 blocks at M, 50 at O, 40 of the second block at M).
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PickListDetail, PickPlan } from '../../shared/schemas/picking.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { balanceOf, countRows, fxBom, ledgerMismatches, pickScenario, type PickScenario } from '../support/pickFixtures.js'

let h: ApiHarness
let counter: supertest.Agent
let crew: supertest.Agent
beforeAll(async () => {
  h = await startApiHarness()
  counter = await h.as('counter')
  crew = await h.as('warehouse')
})
afterAll(() => h?.close())

const plan = async (body: object) => (await counter.post('/api/pick-lists/plan').set(CSRF).send(body)).body as PickPlan
const create = (body: object) => counter.post('/api/pick-lists').set(CSRF).send(body)
const detail = async (id: number) => (await crew.get(`/api/pick-lists/${id}`)).body as PickListDetail

describe('shortages', () => {
  let s: PickScenario
  let bomId: number
  let lineId: number
  beforeAll(async () => {
    s = await pickScenario(h.ds, crew)
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 250 }])
    bomId = bom.bomId
    lineId = bom.lineIds[0]
  })

  it('lists the shortage with its choices: the other warehouse and a substitute of the same family', async () => {
    const p = await plan({ bomId, warehouseId: s.main.id })
    expect(p.lists[0].lines.reduce((a, l) => a + l.qty, 0)).toBe(200)
    expect(p.shortages).toHaveLength(1)
    expect(p.shortages[0]).toMatchObject({ bomLineId: lineId, requested: 250, shortage: 50, backordered: 0 })
    expect(p.shortages[0].elsewhere).toEqual([{ warehouseId: s.other.id, code: s.other.code, name: expect.any(String), available: 50 }])
    expect(p.shortages[0].substitutes).toEqual([{ itemId: s.altBlock.id, sku: s.altBlock.sku, name: expect.any(String), available: 40 }])
  })

  it('proposes a transfer: the other warehouse holds the units, shipping moves them into transit', async () => {
    const res = await create({ bomId, warehouseId: s.main.id, shortages: [{ bomLineId: lineId, action: 'transfer', fromWarehouseId: s.other.id }] })
    expect(res.status).toBe(201)
    const id = res.body.ids[0]
    const list = await detail(id)
    expect(list.shortages).toEqual([expect.objectContaining({ action: 'transfer', qty: 50, detail: s.other.code })])
    expect(list.transfers).toEqual([expect.objectContaining({ qty: 50, status: 'proposed', binCode: 'A-01-1', lotCode: `R3${s.tag}` })])
    expect(await balanceOf(h.ds, s.block.id, s.other.bins['A-01-1'])).toEqual({ onHand: 50, reserved: 50 })

    const ship = await crew.post(`/api/pick-lists/${id}/transfers/ship`).set(CSRF).send({ fromWarehouseId: s.other.id })
    expect(ship.status).toBe(201)
    expect(ship.body.qty).toBe(50)
    expect(await balanceOf(h.ds, s.block.id, s.other.bins['A-01-1'])).toEqual({ onHand: 0, reserved: 0 })
    const [transit] = await h.ds.query(
      `SELECT sb.on_hand FROM stock_balances sb JOIN bins b ON b.id = sb.bin_id WHERE sb.item_id = ? AND b.warehouse_id = ? AND b.kind = 'transit'`, [s.block.id, s.main.id])
    expect(transit.on_hand).toBe(50)
    expect((await detail(id)).transfers[0]).toMatchObject({ status: 'shipped', transferId: ship.body.transferId })
    expect((await crew.post(`/api/pick-lists/${id}/transfers/ship`).set(CSRF).send({ fromWarehouseId: s.other.id })).body.error.code).toBe('nothing_to_ship')
    expect((await crew.post(`/api/pick-lists/${id}/transfers/ship`).set(CSRF).send({})).status).toBe(400)
    expect(await ledgerMismatches(h.ds, [s.block.id])).toEqual([])
    await counter.post(`/api/pick-lists/${id}/cancel`).set(CSRF).send({})
  })

  it('backorders the shortage for the buyer as an accepted purchase suggestion', async () => {
    const res = await create({ bomId, warehouseId: s.main.id, shortages: [{ bomLineId: lineId, action: 'backorder' }] })
    expect(res.status).toBe(201)
    const rows = await h.ds.query(`SELECT qty, status, source, warehouse_id FROM purchase_suggestions WHERE item_id = ?`, [s.block.id])
    expect(rows).toEqual([{ qty: 50, status: 'accepted', source: 'backorder', warehouse_id: s.main.id }])
    // The 200 on the list are held; the 50 are still to come, and the next plan says they are on backorder.
    expect((await plan({ bomId, warehouseId: s.main.id })).shortages).toEqual([expect.objectContaining({ shortage: 50, backordered: 50 })])
    const cancel = await counter.post(`/api/pick-lists/${res.body.ids[0]}/cancel`).set(CSRF).send({})
    expect(cancel.body.released).toBe(200)
  })

  it('picks a substitute the counter chose; what it cannot cover stays open', async () => {
    const res = await create({ bomId, warehouseId: s.main.id, shortages: [{ bomLineId: lineId, action: 'substitute', substituteItemId: s.altBlock.id }] })
    expect(res.status).toBe(201)
    const list = await detail(res.body.ids[0])
    const subs = list.lines.filter((l) => l.substituteFor)
    expect(subs.map((l) => `${l.sku} ${l.binCode} ${l.qty} for ${l.substituteFor!.sku}`)).toEqual([`${s.altBlock.sku} B-02-1 40 for ${s.block.sku}`])
    expect(list.shortages.map((x) => `${x.action} ${x.qty}`)).toEqual(['substitute 40', 'leave 10'])
    const bad = await create({ bomId, warehouseId: s.main.id, shortages: [{ bomLineId: lineId, action: 'substitute', substituteItemId: s.shower.id }] })
    expect(bad.status).toBe(400)
    expect(bad.body.error.fields).toHaveProperty(['shortages.0.substituteItemId'])
    await counter.post(`/api/pick-lists/${list.id}/cancel`).set(CSRF).send({})
  })

  it('refuses a transfer from the picking warehouse itself', async () => {
    const before = await countRows(h.ds, 'pick_lists')
    const res = await create({ bomId, warehouseId: s.main.id, shortages: [{ bomLineId: lineId, action: 'transfer', fromWarehouseId: s.main.id }] })
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toHaveProperty(['shortages.0.fromWarehouseId'])
    expect(await countRows(h.ds, 'pick_lists')).toBe(before)
  })
})

describe('split across warehouses', () => {
  it('takes what the chosen warehouse lacks from the next one, one pick list per warehouse', async () => {
    const s = await pickScenario(h.ds, crew)
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 230 }, { itemId: s.spacer.id, qty: 600 }])
    const p = await plan({ bomId: bom.bomId, warehouseId: s.main.id, mode: 'split' })
    const totals = p.lists.map((l) => `${l.warehouse.code} ${l.lines.map((x) => `${x.sku === s.block.sku ? 'block' : 'spacer'} ${x.qty}`).join(', ')}`)
    // hand-worked: M's 200 blocks in all three lots and its 500 spacers, in walking order (A-01-1, A-02-1, A-03-1, B-01-1, C-01-1);
    // the rest from O: 30 blocks (A-01-1) and 100 spacers (A-02-1)
    expect(totals).toEqual([`${s.main.code} block 100, spacer 500, block 30, block 10, block 60`, `${s.other.code} block 30, spacer 100`])
    const res = await create({ bomId: bom.bomId, warehouseId: s.main.id, mode: 'split' })
    expect(res.status).toBe(201)
    expect(res.body.lists.map((l: { warehouse: { code: string }; qty: number }) => `${l.warehouse.code} ${l.qty}`).sort())
      .toEqual([`${s.main.code} 700`, `${s.other.code} 130`].sort())
    expect(await balanceOf(h.ds, s.block.id, s.other.bins['A-01-1'])).toEqual({ onHand: 50, reserved: 30 })
  })
})
