// Pick lists through the API against the real MariaDB: plan, make (reserve), release, confirm by
// scans, short picks, complete (ledger moves, picked_qty), partial completion and a second list,
// cancel, and bad input answered with 400 and nothing written.
// Expected allocations are worked by hand from the documented allocation rules (shared/inventory/allocation.ts:
// one lot when one covers it, oldest such lot; smallest bin first), walking orders from the serpentine rule (common practice).
import { randomUUID } from 'node:crypto'
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

const create = (body: object) => counter.post('/api/pick-lists').set(CSRF).send(body)
const detail = async (id: number) => (await crew.get(`/api/pick-lists/${id}`)).body as PickListDetail
const confirm = (id: number, body: object, key: string | null = randomUUID()) => {
  const req = crew.post(`/api/pick-lists/${id}/confirmations`).set(CSRF)
  return (key ? req.set('Idempotency-Key', key) : req).send(body)
}
const lotCode = (s: PickScenario, which: 'R1' | 'R2' | 'R3') => `${which}${s.tag}`

describe('making a pick list', () => {
  let s: PickScenario
  beforeAll(async () => { s = await pickScenario(h.ds, crew) })

  it('plans from the bill of materials: one lot for the block, FIFO for the spacer, made-to-order lines left out', async () => {
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 45 }, { itemId: s.spacer.id, qty: 120 }, { itemId: s.shower.id, qty: 1, madeToOrder: true }])
    const res = await counter.post('/api/pick-lists/plan').set(CSRF).send({ bomId: bom.bomId, warehouseId: s.main.id })
    expect(res.status).toBe(200)
    const plan = res.body as PickPlan
    // hand-worked: lots 40 (R1) / 100 (R2) / 60 (R3); R2 is the oldest lot covering 45 alone
    expect(plan.lists[0].lines.map((l) => `${l.sku} ${l.binCode} ${l.lotCode} ${l.qty}`)).toEqual([
      `${s.block.sku} A-01-1 ${lotCode(s, 'R2')} 45`, `${s.spacer.sku} A-02-1 null 120`,
    ])
    expect(plan.shortages).toEqual([])
    expect(plan.notPicked).toEqual([expect.objectContaining({ bomLineId: bom.lineIds[2], reason: 'made_to_order' })])
    expect(await countRows(h.ds, 'stock_reservations', 'item_id = ?', [s.block.id])).toBe(0) // a plan reserves nothing
  })

  it('reserves in one go: reserved up, available down; the list starts as a draft with who and when', async () => {
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 35 }])
    const before = await balanceOf(h.ds, s.block.id, s.main.bins['A-03-1'])
    const res = await create({ bomId: bom.bomId, warehouseId: s.main.id })
    expect(res.status).toBe(201)
    const list = await detail(res.body.ids[0])
    expect(list.status).toBe('draft')
    expect(list.history).toEqual([expect.objectContaining({ status: 'draft', by: expect.objectContaining({ name: 'Test t-counter' }) })])
    // hand-worked: R1 (40) covers 35 and is oldest; smallest bin first: B-01-1 10, then A-03-1 25; walked A before B
    expect(list.lines.map((l) => `${l.binCode} ${l.qty}`)).toEqual(['A-03-1 25', 'B-01-1 10'])
    expect(await balanceOf(h.ds, s.block.id, s.main.bins['A-03-1'])).toEqual({ onHand: before.onHand, reserved: before.reserved + 25 })
    expect(await balanceOf(h.ds, s.block.id, s.main.bins['B-01-1'])).toMatchObject({ reserved: 10 })
    expect(await ledgerMismatches(h.ds, [s.block.id])).toEqual([])

    const cancel = await counter.post(`/api/pick-lists/${list.id}/cancel`).set(CSRF).send({ reason: 'Job postponed' })
    expect(cancel.status).toBe(200)
    expect(cancel.body).toMatchObject({ status: 'cancelled', released: 35 })
    expect(await balanceOf(h.ds, s.block.id, s.main.bins['A-03-1'])).toEqual(before)
    const after = await detail(list.id)
    expect(after.history.map((x) => x.status)).toEqual(['draft', 'cancelled'])
    expect((await counter.post(`/api/pick-lists/${list.id}/cancel`).set(CSRF).send({})).body.error.code).toBe('pick_list_status')
  })

  it('refuses bad input with 400 and field messages, writing nothing', async () => {
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 5 }])
    const lists = await countRows(h.ds, 'pick_lists')
    const reservations = await countRows(h.ds, 'stock_reservations')
    const cases: [object, string][] = [
      [{}, 'bomId'],
      [{ bomId: bom.bomId }, 'warehouseId'],
      [{ bomId: bom.bomId, warehouseId: s.main.id, mode: 'everywhere' }, 'mode'],
      [{ bomId: 999999999, warehouseId: s.main.id }, 'bomId'],
      [{ bomId: bom.bomId, warehouseId: 999999999 }, 'warehouseId'],
      [{ bomId: bom.bomId, warehouseId: s.main.id, shortages: [{ bomLineId: bom.lineIds[0], action: 'transfer' }] }, 'shortages.0.fromWarehouseId'],
      [{ bomId: bom.bomId, warehouseId: s.main.id, shortages: [{ bomLineId: bom.lineIds[0], action: 'substitute' }] }, 'shortages.0.substituteItemId'],
      [{ bomId: bom.bomId, warehouseId: s.main.id, shortages: [{ bomLineId: 1, action: 'leave' }, { bomLineId: 1, action: 'backorder' }] }, 'shortages'],
    ]
    for (const [body, field] of cases) {
      const res = await create(body)
      expect(res.status, JSON.stringify(body)).toBe(400)
      expect(res.body.error.fields, JSON.stringify(body)).toHaveProperty([field])
    }
    expect(await countRows(h.ds, 'pick_lists')).toBe(lists)
    expect(await countRows(h.ds, 'stock_reservations')).toBe(reservations)
  })

  it('answers 409 when nothing is left to pick, and 404 for an unknown list', async () => {
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.shower.id, qty: 1, madeToOrder: true }])
    const res = await create({ bomId: bom.bomId, warehouseId: s.main.id })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('nothing_to_pick')
    expect((await crew.get('/api/pick-lists/999999999')).status).toBe(404)
    expect((await crew.get('/api/pick-lists/abc')).status).toBe(404)
  })
})

describe('picking by scanner and completing', () => {
  let s: PickScenario
  let id: number
  let blockLine: number
  let spacerLine: number
  let bomLines: number[]
  beforeAll(async () => {
    s = await pickScenario(h.ds, crew)
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 45 }, { itemId: s.spacer.id, qty: 120 }])
    bomLines = bom.lineIds
    const res = await create({ bomId: bom.bomId, warehouseId: s.main.id })
    id = res.body.ids[0]
    const list = await detail(id)
    blockLine = list.lines.find((l) => l.sku === s.block.sku)!.id
    spacerLine = list.lines.find((l) => l.sku === s.spacer.sku)!.id
  })
  const good = () => ({ lineId: blockLine, binScan: 'B:A-01-1', itemScan: `(02)${s.block.gtin}(37)8(10)${lotCode(s, 'R2')}`, qty: 8 })

  it('refuses confirmations on a draft, then releases once', async () => {
    expect((await confirm(id, good())).body.error.code).toBe('pick_list_status')
    const rel = await counter.post(`/api/pick-lists/${id}/release`).set(CSRF).send({})
    expect(rel.status).toBe(200)
    expect((await counter.post(`/api/pick-lists/${id}/release`).set(CSRF).send({})).status).toBe(409)
  })

  it('refuses a wrong bin, item, lot or an over-pick with 409 and records nothing', async () => {
    const wrong: [object, string][] = [
      [{ ...good(), binScan: 'B:A-02-1' }, 'wrong_bin'],
      [{ ...good(), itemScan: s.spacer.sku }, 'wrong_item'],
      // source: GS1 General Specifications, AI (01) GTIN + (10) lot; the lot is another production run
      [{ ...good(), itemScan: `(01)${s.block.gtin}(10)${lotCode(s, 'R1')}` }, 'wrong_lot'],
      [{ ...good(), qty: 46 }, 'over_pick'],
    ]
    for (const [body, code] of wrong) {
      const res = await confirm(id, body)
      expect(res.status, code).toBe(409)
      expect(res.body.error.code).toBe(code)
    }
    expect((await confirm(id, good(), null)).status).toBe(400) // no Idempotency-Key
    expect((await confirm(id, { ...good(), qty: 0 })).status).toBe(400) // nothing taken, not closed short
    expect((await confirm(id, { ...good(), lineId: 999999 })).status).toBe(400)
    expect(await countRows(h.ds, 'pick_confirmations', 'pick_list_id = ?', [id])).toBe(0)
    expect((await detail(id)).status).toBe('released')
  })

  it('records a good confirmation once, even when the handheld sends it again', async () => {
    const key = randomUUID()
    const first = await confirm(id, good(), key)
    expect(first.status).toBe(201)
    expect(first.body).toMatchObject({ confirmedQty: 8, remaining: 37, listStatus: 'picking' })
    const again = await confirm(id, good(), key)
    expect(again.status).toBe(201)
    expect(again.headers['idempotent-replayed']).toBe('true')
    expect(again.body.confirmationId).toBe(first.body.confirmationId)
    expect(await countRows(h.ds, 'pick_confirmations', 'pick_list_id = ?', [id])).toBe(1)
    const list = await detail(id)
    expect(list.history.map((x) => x.status)).toEqual(['draft', 'released', 'picking'])
    expect(list.lines.find((l) => l.id === blockLine)).toMatchObject({ confirmedQty: 8, remaining: 37 })
  })

  it('takes the rest by SKU and lot label, and a short pick with its reason', async () => {
    const rest = await confirm(id, { lineId: blockLine, binScan: 'b:a-01-1', itemScan: s.block.gtin, lotScan: lotCode(s, 'R2'), qty: 37 })
    expect(rest.status).toBe(201)
    expect(rest.body.remaining).toBe(0)
    expect((await confirm(id, { ...good(), qty: 1 })).body.error.code).toBe('over_pick')
    const short = await confirm(id, { lineId: spacerLine, binScan: 'B:A-02-1', itemScan: s.spacer.sku, qty: 100, shortReason: 'damaged' })
    expect(short.status).toBe(201)
    expect(short.body).toMatchObject({ confirmedQty: 100, shortQty: 20, remaining: 0 })
    const line = (await detail(id)).lines.find((l) => l.id === spacerLine)!
    expect(line.shortReasons).toEqual(['damaged'])
  })

  it('completes: one pick move per confirmation, reservations gone, bill of materials picked', async () => {
    const onHand = (await balanceOf(h.ds, s.block.id, s.main.bins['A-01-1'])).onHand
    const res = await crew.post(`/api/pick-lists/${id}/complete`).set(CSRF).send({})
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ status: 'picked', issued: 145, moves: 3, released: 20 })
    const moves = await h.ds.query(`SELECT move_type, qty, doc_line_id FROM stock_moves WHERE doc_type = 'pick_list' AND doc_id = ? ORDER BY id`, [id])
    expect(moves.map((m: { move_type: string; qty: number }) => `${m.move_type} ${m.qty}`)).toEqual(['pick -8', 'pick -37', 'pick -100'])
    expect(await balanceOf(h.ds, s.block.id, s.main.bins['A-01-1'])).toEqual({ onHand: onHand - 45, reserved: 0 })
    expect(await countRows(h.ds, 'stock_reservations', "doc_type = 'pick_list' AND doc_id = ?", [id])).toBe(0)
    const picked = await h.ds.query('SELECT id, picked_qty FROM bom_lines WHERE id IN (?) ORDER BY id', [bomLines])
    expect(picked.map((r: { picked_qty: number }) => r.picked_qty)).toEqual([45, 100])
    expect(await ledgerMismatches(h.ds, [s.block.id, s.spacer.id])).toEqual([])
    const list = await detail(id)
    expect(list.history.map((x) => x.status)).toEqual(['draft', 'released', 'picking', 'picked'])
    expect(list.confirmations.every((c) => c.issued)).toBe(true)
    expect((await crew.post(`/api/pick-lists/${id}/complete`).set(CSRF).send({})).body.error.code).toBe('pick_list_status')
    expect((await counter.post(`/api/pick-lists/${id}/cancel`).set(CSRF).send({})).status).toBe(409)
  })
})

describe('partial completion and a second list for the rest', () => {
  it('stops a completion with open lines, completes it short on request, and picks the rest on a new list', async () => {
    const s = await pickScenario(h.ds, crew)
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.spacer.id, qty: 120 }])
    const first = (await create({ bomId: bom.bomId, warehouseId: s.main.id, release: true })).body.ids[0]
    const line = (await detail(first)).lines[0]
    expect((await confirm(first, { lineId: line.id, binScan: 'B:A-02-1', itemScan: s.spacer.sku, qty: 70 })).status).toBe(201)
    const bad = await crew.post(`/api/pick-lists/${first}/complete`).set(CSRF).send({ acceptShort: 'yes' })
    expect(bad.status).toBe(400)
    expect(bad.body.error.fields).toHaveProperty('acceptShort')
    expect((await counter.post(`/api/pick-lists/${first}/complete`).set(CSRF).send({})).status).toBe(403) // the counter does not issue stock
    const stopped = await crew.post(`/api/pick-lists/${first}/complete`).set(CSRF).send({})
    expect(stopped.status).toBe(409)
    expect(stopped.body.error.code).toBe('lines_open')
    const done = await crew.post(`/api/pick-lists/${first}/complete`).set(CSRF).send({ acceptShort: true })
    expect(done.body).toMatchObject({ issued: 70, closedShort: 50, released: 50 })
    expect((await detail(first)).lines[0].shortReasons).toEqual(['not_picked'])

    const plan = (await counter.post('/api/pick-lists/plan').set(CSRF).send({ bomId: bom.bomId, warehouseId: s.main.id })).body as PickPlan
    expect(plan.lists[0].lines.map((l) => l.qty)).toEqual([50]) // 120 − 70 picked
    const second = (await create({ bomId: bom.bomId, warehouseId: s.main.id, release: true })).body.ids[0]
    const line2 = (await detail(second)).lines[0]
    expect(line2.qty).toBe(50)
    expect((await confirm(second, { lineId: line2.id, binScan: 'B:A-02-1', itemScan: s.spacer.sku, qty: 50 })).status).toBe(201)
    expect((await crew.post(`/api/pick-lists/${second}/complete`).set(CSRF).send({})).status).toBe(200)
    const [row] = await h.ds.query('SELECT picked_qty FROM bom_lines WHERE id = ?', [bom.lineIds[0]])
    expect(row.picked_qty).toBe(120)
    expect((await create({ bomId: bom.bomId, warehouseId: s.main.id })).body.error.code).toBe('nothing_to_pick')
  })
})

describe('walking order', () => {
  it('sorts lines along the warehouse path, and follows a changed aisle order and direction', async () => {
    const s = await pickScenario(h.ds, crew)
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 200 }, { itemId: s.altBlock.id, qty: 10 }, { itemId: s.spacer.id, qty: 10 }])
    const id = (await create({ bomId: bom.bomId, warehouseId: s.main.id })).body.ids[0]
    const bins = async () => (await detail(id)).lines.map((l) => l.binCode)
    // serpentine over A, B, C: A ascending, B descending, C ascending (hand-worked)
    expect(await bins()).toEqual(['A-01-1', 'A-02-1', 'A-03-1', 'B-02-1', 'B-01-1', 'C-01-1'])
    await h.ds.query(`UPDATE warehouses SET walk_direction = 'oneWay' WHERE id = ?`, [s.main.id])
    expect(await bins()).toEqual(['A-01-1', 'A-02-1', 'A-03-1', 'B-01-1', 'B-02-1', 'C-01-1'])
    await h.ds.query(`UPDATE warehouses SET walk_direction = 'serpentine', aisle_order = 'C,A,B' WHERE id = ?`, [s.main.id])
    expect(await bins()).toEqual(['C-01-1', 'A-03-1', 'A-02-1', 'A-01-1', 'B-01-1', 'B-02-1'])
    const wh = (await crew.get('/api/picking/warehouses')).body.find((w: { id: number }) => w.id === s.main.id)
    expect(wh).toMatchObject({ aisleOrder: ['C', 'A', 'B'], walkDirection: 'serpentine', aisles: ['A', 'B', 'C'], openPickLists: 1 })
    expect(wh.sampleBins.slice(0, 2)).toEqual(['C-01-1', 'A-03-1'])
  })
})

describe('lists per warehouse and per bill of materials', () => {
  it('lists open pick lists of a warehouse and filters by status', async () => {
    const s = await pickScenario(h.ds, crew)
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.spacer.id, qty: 10 }])
    const id = (await create({ bomId: bom.bomId, warehouseId: s.main.id, release: true })).body.ids[0]
    const open = await crew.get(`/api/pick-lists?warehouseId=${s.main.id}`)
    expect(open.body.map((l: { id: number }) => l.id)).toEqual([id])
    expect(open.body[0]).toMatchObject({ status: 'released', lineCount: 1, qty: 10, warehouse: { code: s.main.code } })
    expect((await crew.get(`/api/pick-lists?warehouseId=${s.main.id}&status=picked`)).body).toEqual([])
    expect((await crew.get('/api/pick-lists?status=lost')).status).toBe(400)
    const boms = (await counter.get('/api/pick-lists/boms')).body
    expect(boms.find((b: { bomId: number }) => b.bomId === bom.bomId)).toMatchObject({ qty: 10, pickedQty: 0, openQty: 10 })
  })
})
