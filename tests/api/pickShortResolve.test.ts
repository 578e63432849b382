// Settling a line closed short, against the real MariaDB: a backorder for purchasing, a recount that
// puts units back on the line, a substitute allocated and held at once; the line stays short until
// every missing unit is settled, and the ledger after completion has one issue per confirmation.
// Settling a shortage by backorder or substitute, and a recount returning found units to picking, is
// common practice in warehouse order picking; every figure below is worked by hand from the fixture
// (10 blocks GB8W wanted from bin B-02-1, 40 there).
import { randomUUID } from 'node:crypto'
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { lineProgress } from '../../shared/picking/pickProgress.js'
import type { PickLineView, PickListDetail } from '../../shared/schemas/picking.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, fxBom, fxItem, ledgerMismatches, pickLedgerCheck, pickScenario, receive, releasedPickList, type PickScenario } from '../support/pickFixtures.js'

let h: ApiHarness
let crew: supertest.Agent
let counter: supertest.Agent
let s: PickScenario
let listId: number
let line: PickLineView
let bomId: number
beforeAll(async () => {
  h = await startApiHarness()
  crew = await h.as('warehouse')
  counter = await h.as('counter')
  s = await pickScenario(h.ds, crew)
  const bom = await fxBom(h.ds, s.tag, [{ itemId: s.altBlock.id, qty: 10 }])
  bomId = bom.bomId
  listId = await releasedPickList(counter, bom.bomId, s.main.id)
  line = (await detail()).lines[0]
})
afterAll(() => h?.close())

async function detail(): Promise<PickListDetail> {
  return (await crew.get(`/api/pick-lists/${listId}`)).body as PickListDetail
}
/** The list as the warehouse's start page reads it: lines done, short, settled and left. */
const lineStates = async () => (await crew.get(`/api/pick-lists?bomId=${bomId}&status=all`)).body[0].lineStates
const lineNow = async (id = line.id) => (await detail()).lines.find((l) => l.id === id)!
const confirm = (body: object) => crew.post(`/api/pick-lists/${listId}/confirmations`).set(CSRF).set('Idempotency-Key', randomUUID()).send(body)
const resolve = (agent: supertest.Agent, body: object) =>
  agent.post(`/api/pick-lists/${listId}/short-resolutions`).set(CSRF).set('Idempotency-Key', randomUUID()).send(body)
const altScan = { binScan: 'B:B-02-1' }

describe('a line closed short', () => {
  it('stays short until a backorder, a recount and a substitute settle every missing unit', async () => {
    const lotScan = `L:${s.altBlock.sku}|W1${s.tag}`
    expect((await confirm({ lineId: line.id, binScan: altScan.binScan, itemScan: lotScan, qty: 4, shortReason: 'damaged' })).status).toBe(201)
    let now = await lineNow()
    expect({ short: now.shortQty, resolved: now.shortResolvedQty, state: lineProgress(now) }).toEqual({ short: 6, resolved: 0, state: 'short' })
    expect(await lineStates()).toEqual({ total: 1, done: 0, short: 1, resolved: 0, left: 0 })

    // The counter backorders 2 of the 6: purchasing gets an accepted backorder suggestion.
    const suggestions = await countRows(h.ds, 'purchase_suggestions', `item_id = ? AND source = 'backorder'`, [s.altBlock.id])
    const back = await resolve(counter, { lineId: line.id, action: 'backorder', qty: 2 })
    expect(back.status).toBe(200)
    expect(back.body).toMatchObject({ action: 'backorder', qty: 2, shortQty: 6, shortResolvedQty: 2, remaining: 0 })
    const [suggestion] = await h.ds.query(`SELECT qty, status, warehouse_id FROM purchase_suggestions WHERE item_id = ? AND source = 'backorder' ORDER BY id DESC LIMIT 1`, [s.altBlock.id])
    expect(suggestion).toEqual({ qty: 2, status: 'accepted', warehouse_id: s.main.id })
    expect(await countRows(h.ds, 'purchase_suggestions', `item_id = ? AND source = 'backorder'`, [s.altBlock.id])).toBe(suggestions + 1)
    now = await lineNow()
    expect(lineProgress(now)).toBe('short') // 4 still open
    expect(now.shortResolutions).toEqual([{ action: 'backorder', qty: 2, sku: null }])

    // A recount of the bin found 3 after all: they go back on the line and are picked.
    const found = await resolve(crew, { lineId: line.id, action: 'recount', qty: 3 })
    expect(found.body).toMatchObject({ action: 'recount', shortQty: 3, shortResolvedQty: 2, remaining: 3 })
    expect((await confirm({ lineId: line.id, binScan: altScan.binScan, itemScan: lotScan, qty: 3 })).status).toBe(201)
    now = await lineNow()
    expect({ confirmed: now.confirmedQty, short: now.shortQty, state: lineProgress(now) }).toEqual({ confirmed: 7, short: 3, state: 'short' })

    // The last missing unit: a block of the same kind and unit from this warehouse, held at once.
    const sub = await resolve(counter, { lineId: line.id, action: 'substitute', qty: 1, substituteItemId: s.block.id })
    expect(sub.status).toBe(200)
    expect(sub.body.addedLineIds).toHaveLength(1)
    const added = await lineNow(sub.body.addedLineIds[0])
    // hand-worked: the oldest lot first (R1, received 2025-01-10; first in, first out, common practice); 1 unit
    expect({ sku: added.sku, qty: added.qty, lot: added.lotCode, substituteFor: added.substituteFor?.sku })
      .toEqual({ sku: s.block.sku, qty: 1, lot: `R1${s.tag}`, substituteFor: s.altBlock.sku })
    const [held] = await h.ds.query(`SELECT qty FROM stock_reservations WHERE doc_type = 'pick_list' AND doc_id = ? AND doc_line_id = ?`, [listId, added.id])
    expect(Number(held.qty)).toBe(1)
    now = await lineNow()
    expect({ resolved: now.shortResolvedQty, state: lineProgress(now) }).toEqual({ resolved: 3, state: 'resolved' })
    const audits = await countRows(h.ds, 'audit_entries', `action = 'pick_line.short_resolve' AND entity_id = ?`, [String(listId)])
    expect(audits).toBe(3)

    // Nothing left to settle: refused, and nothing written.
    const again = await resolve(counter, { lineId: line.id, action: 'backorder', qty: 1 })
    expect(again.status).toBe(409)
    expect(again.body.error.code).toBe('short_settled')

    expect((await confirm({ lineId: added.id, binScan: `B:${added.binCode}`, itemScan: s.block.sku, lotScan: `R1${s.tag}`, qty: 1 })).status).toBe(201)
    // hand-worked: the substitute line picked in full, the short line settled
    expect(await lineStates()).toEqual({ total: 2, done: 1, short: 0, resolved: 1, left: 0 })
    expect((await crew.post(`/api/pick-lists/${listId}/complete`).set(CSRF).send({ acceptShort: false })).status).toBe(200)
    expect(await pickLedgerCheck(h.ds, listId)).toEqual({ taken: [4, 3, 1], problems: [] })
    expect(await ledgerMismatches(h.ds, [s.block.id, s.altBlock.id])).toEqual([])
  })

  it('refuses what cannot settle it, changing nothing', async () => {
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.altBlock.id, qty: 5 }])
    const id = await releasedPickList(counter, bom.bomId, s.main.id)
    const l = ((await crew.get(`/api/pick-lists/${id}`)).body as PickListDetail).lines[0]
    const post = (body: object) => crew.post(`/api/pick-lists/${id}/short-resolutions`).set(CSRF).set('Idempotency-Key', randomUUID()).send(body)
    const written = async () => [
      await countRows(h.ds, 'pick_shortages', 'pick_list_id = ?', [id]), await countRows(h.ds, 'pick_list_lines', 'pick_list_id = ?', [id]),
      await countRows(h.ds, 'audit_entries', `action = 'pick_line.short_resolve' AND entity_id = ?`, [String(id)]),
    ]
    const before = await written()
    // Not short yet.
    expect((await post({ lineId: l.id, action: 'backorder', qty: 1 })).body.error.code).toBe('short_settled')
    await crew.post(`/api/pick-lists/${id}/confirmations`).set(CSRF).set('Idempotency-Key', randomUUID())
      .send({ lineId: l.id, binScan: 'B:B-02-1', qty: 0, shortReason: 'not_found' })
    const cases: [object, string][] = [
      [{ lineId: l.id, action: 'backorder', qty: 6 }, 'qty'], // only 5 short
      [{ lineId: l.id, action: 'backorder', qty: 0 }, 'qty'],
      [{ lineId: l.id, action: 'backorder', qty: 1.5 }, 'qty'],
      [{ lineId: l.id, action: 'guess', qty: 1 }, 'action'],
      [{ lineId: l.id, action: 'substitute', qty: 1 }, 'substituteItemId'],
      [{ lineId: l.id, action: 'substitute', qty: 1, substituteItemId: s.spacer.id }, 'substituteItemId'], // another kind of item
      [{ lineId: l.id, action: 'substitute', qty: 1, substituteItemId: s.altBlock.id }, 'substituteItemId'], // itself
      [{ lineId: 999999999, action: 'backorder', qty: 1 }, 'lineId'],
    ]
    for (const [body, field] of cases) {
      const res = await post(body)
      expect(res.status, JSON.stringify(body)).toBe(400)
      expect(Object.keys(res.body.error.fields ?? {}), JSON.stringify(body)).toContain(field)
    }
    // A substitute of the right kind with only 2 free here: refused whole, nothing held or added.
    const thin = await fxItem(h.ds, `GB8T-${s.tag}`, { nominalSize: '8x8' })
    await receive(crew, s.main.id, [{ itemId: thin.id, binId: s.main.bins['C-01-1'], qty: 2 }])
    const tooMany = await post({ lineId: l.id, action: 'substitute', qty: 5, substituteItemId: thin.id })
    expect(tooMany.status).toBe(409)
    expect(tooMany.body.error.code).toBe('substitute_short')
    expect(await written()).toEqual(before)
    expect(await countRows(h.ds, 'stock_reservations', 'item_id = ?', [thin.id])).toBe(0)
  })

  it('takes a backorder after the list is completed, but no more units to pick', async () => {
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.spacer.id, qty: 8 }])
    const id = await releasedPickList(counter, bom.bomId, s.main.id)
    const l = ((await crew.get(`/api/pick-lists/${id}`)).body as PickListDetail).lines[0]
    await crew.post(`/api/pick-lists/${id}/confirmations`).set(CSRF).set('Idempotency-Key', randomUUID())
      .send({ lineId: l.id, binScan: 'B:A-02-1', itemScan: s.spacer.sku, qty: 5 })
    expect((await crew.post(`/api/pick-lists/${id}/complete`).set(CSRF).send({ acceptShort: true })).status).toBe(200)
    const post = (body: object) => counter.post(`/api/pick-lists/${id}/short-resolutions`).set(CSRF).set('Idempotency-Key', randomUUID()).send(body)
    const recount = await post({ lineId: l.id, action: 'recount', qty: 3 })
    expect(recount.status).toBe(409)
    expect(recount.body.error.code).toBe('pick_list_status')
    const back = await post({ lineId: l.id, action: 'backorder', qty: 3 })
    expect(back.status).toBe(200)
    expect(back.body).toMatchObject({ shortQty: 3, shortResolvedQty: 3, remaining: 0 })
  })
})
