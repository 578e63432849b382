// The hook the pick service calls when a picker finds an item "not in the bin": it asks for a count of
// that bin × item × lot in the warehouse's one open short-pick count. And the handheld outbox reports.
// Real MariaDB; the pick list is made through the API as the counter makes it.
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PickListDetail } from '../../shared/schemas/picking.js'
import { inTransaction } from '../../server/db/transaction.js'
import { requestCountForShortPick } from '../../server/services/counts/countShortPick.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, fxBom, pickScenario, releasedPickList, type PickScenario } from '../support/pickFixtures.js'

let h: ApiHarness
let crew: supertest.Agent
let s: PickScenario
let list: PickListDetail
beforeAll(async () => {
  h = await startApiHarness()
  crew = await h.as('warehouse')
  s = await pickScenario(h.ds, crew)
  const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 30 }, { itemId: s.spacer.id, qty: 20 }])
  const id = await releasedPickList(await h.as('counter'), bom.bomId, s.main.id)
  list = (await crew.get(`/api/pick-lists/${id}`)).body as PickListDetail
})
afterAll(() => h?.close())

const ask = (line: PickListDetail['lines'][number], userId: number | null = null) =>
  inTransaction(h.ds, (em) => requestCountForShortPick(em, { userId }, {
    pickListId: list.id, pickListLineId: line.id, binId: line.binId, itemId: line.itemId, lotId: line.lotId,
  }))

describe('count requested by a short pick', () => {
  it('opens the warehouse short-pick count with a waiting line for that bin, item and lot', async () => {
    const blockLine = list.lines.find((l) => l.itemId === s.block.id)!
    const answer = await ask(blockLine)
    expect(answer.created).toBe(true)
    const [count] = await h.ds.query('SELECT * FROM cycle_counts WHERE id = ?', [answer.countId])
    expect(count).toMatchObject({ warehouse_id: s.main.id, scope: 'short_pick', status: 'open', items_only: 1 })
    const [line] = await h.ds.query('SELECT * FROM count_lines WHERE id = ?', [answer.lineId])
    expect(line).toMatchObject({
      count_id: answer.countId, bin_id: blockLine.binId, item_id: s.block.id, lot_id: blockLine.lotId, status: 'waiting',
      source: 'short_pick', pick_list_id: list.id, pick_list_line_id: blockLine.id, attempt: 1,
    })
    // Not visited yet: the snapshot is taken when the counter starts the bin, never before.
    expect(line.snapshot_qty).toBeNull()
    const [bin] = await h.ds.query('SELECT status FROM count_bins WHERE count_id = ? AND bin_id = ?', [answer.countId, blockLine.binId])
    expect(bin.status).toBe('waiting')
    expect(await countRows(h.ds, 'count_items', 'count_id = ? AND item_id = ?', [answer.countId, s.block.id])).toBe(1)
    expect(await countRows(h.ds, 'audit_entries', "action = 'count.open' AND entity_id = ?", [String(answer.countId)])).toBe(1)
  })

  it('asking again while the line waits adds nothing; another bin joins the same count', async () => {
    const blockLine = list.lines.find((l) => l.itemId === s.block.id)!
    const first = await ask(blockLine)
    expect(first.created).toBe(false)
    const spacerLine = list.lines.find((l) => l.itemId === s.spacer.id)!
    const second = await ask(spacerLine)
    expect(second).toMatchObject({ countId: first.countId, created: true })
    expect(await countRows(h.ds, 'count_lines', 'count_id = ?', [first.countId])).toBe(2)
    expect(await countRows(h.ds, 'cycle_counts', "warehouse_id = ? AND scope = 'short_pick' AND status = 'open'", [s.main.id])).toBe(1)
  })

  it('two short picks at once in a warehouse without a count open one count between them', async () => {
    const other = await pickScenario(h.ds, crew)
    const bom = await fxBom(h.ds, other.tag, [{ itemId: other.block.id, qty: 120 }, { itemId: other.spacer.id, qty: 20 }])
    const id = await releasedPickList(await h.as('counter'), bom.bomId, other.main.id)
    const detail = (await crew.get(`/api/pick-lists/${id}`)).body as PickListDetail
    expect(detail.lines.length).toBeGreaterThanOrEqual(2)
    const answers = await Promise.all(detail.lines.map((l) => inTransaction(h.ds, (em) => requestCountForShortPick(em, { userId: null }, {
      pickListId: id, pickListLineId: l.id, binId: l.binId, itemId: l.itemId, lotId: l.lotId,
    }))))
    expect(new Set(answers.map((a) => a.countId)).size).toBe(1)
    expect(answers.every((a) => a.created)).toBe(true)
    expect(await countRows(h.ds, 'cycle_counts', "warehouse_id = ? AND scope = 'short_pick'", [other.main.id])).toBe(1)
  })
})

describe('handheld outbox reports', () => {
  const device = `dev-${Date.now().toString(36)}-a`

  it('a device reports what waits and what was refused; the summary lists it until its outbox is empty', async () => {
    const put = await crew.put(`/api/devices/${device}/outbox`).set(CSRF)
      .send({ waiting: 3, refused: 1, oldestWaitingAt: '2026-12-01T09:30:00.000Z', warehouseId: s.main.id })
    expect(put.status).toBe(200)
    const summary = await crew.get(`/api/devices/outbox?warehouseId=${s.main.id}`)
    expect(summary.status).toBe(200)
    expect(summary.body.devices).toEqual([expect.objectContaining({ deviceId: device, waiting: 3, refused: 1, warehouseCode: s.main.code, oldestWaitingAt: '2026-12-01T09:30:00.000Z' })])
    expect(summary.body).toMatchObject({ waiting: 3, refused: 1 })

    await crew.put(`/api/devices/${device}/outbox`).set(CSRF).send({ waiting: 0, refused: 0, warehouseId: s.main.id }).expect(200)
    const after = await crew.get(`/api/devices/outbox?warehouseId=${s.main.id}`)
    expect(after.body.devices).toEqual([])
  })

  it('refuses a bad device id or counts and writes nothing', async () => {
    const before = await countRows(h.ds, 'device_outbox_reports')
    const badId = await crew.put('/api/devices/x/outbox').set(CSRF).send({ waiting: 1, refused: 0 })
    expect(badId.status).toBe(400)
    expect(badId.body.error.code).toBe('device_id_invalid')
    const badBody = await crew.put(`/api/devices/${device}-b/outbox`).set(CSRF).send({ waiting: -1, refused: 0.5 })
    expect(badBody.status).toBe(400)
    expect(Object.keys(badBody.body.error.fields)).toEqual(expect.arrayContaining(['waiting', 'refused']))
    const noWarehouse = await crew.put(`/api/devices/${device}-c/outbox`).set(CSRF).send({ waiting: 1, refused: 0, warehouseId: 999999999 })
    expect(noWarehouse.status).toBe(400)
    expect(await countRows(h.ds, 'device_outbox_reports')).toBe(before)
  })
})
