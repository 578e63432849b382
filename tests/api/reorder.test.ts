// Reorder suggestions from usage (server/services/reorder/*): statistics from SQL aggregates checked against
// simple-statistics on the zero-filled series, figures against the shared reorder math, policy layers,
// overrides with reasons, bad input, accepting into purchase_suggestions without duplicates, chart data.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type supertest from 'supertest'
import { mean, sampleStandardDeviation, sum } from 'simple-statistics'
import {
  DEFAULT_REORDER_POLICY, economicOrderQuantity, reorderPointRaw, reorderSuggestion, roundOrderQuantity, safetyStock,
  zForServiceLevel,
} from '../../shared/inventory/reorder.js'
import type { ReorderLine, ReorderLineDetail, SuggestionList } from '../../shared/schemas/reorder.js'
import enReorder from '../../src/i18n/en/reorder.js'
import esReorder from '../../src/i18n/es/reorder.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { createReorderFixture, isoDay, WINDOW_DAYS, type ReorderFixture } from '../support/reorderFixture.js'

let h: ApiHarness
let fx: ReorderFixture
let buyer: supertest.Agent

beforeAll(async () => {
  h = await startApiHarness()
  fx = await createReorderFixture(h.ds)
  buyer = await h.as('buyer')
})
afterAll(() => h?.close())

async function list(query = ''): Promise<SuggestionList> {
  const res = await buyer.get(`/api/reorder/suggestions?warehouseId=${fx.warehouseId}${query}`)
  expect(res.status, JSON.stringify(res.body)).toBe(200)
  return res.body
}
const lineFor = (l: SuggestionList, itemId: number) => l.lines.find((x) => x.itemId === itemId) as ReorderLine
async function detail(itemId = fx.itemId, query = ''): Promise<ReorderLineDetail> {
  const res = await buyer.get(`/api/reorder/lines/${itemId}/${fx.warehouseId}${query}`)
  expect(res.status, JSON.stringify(res.body)).toBe(200)
  return res.body
}
const savePolicy = (body: object) => buyer.post('/api/reorder/policies').set(CSRF).send(body)
const count = async (table: string) => Number((await h.ds.query(`SELECT COUNT(*) AS n FROM ${table}`))[0].n)
const openSuggestions = async () => h.ds.query(
  `SELECT * FROM purchase_suggestions WHERE item_id = ? AND warehouse_id = ? AND status = 'accepted'`, [fx.itemId, fx.warehouseId])

describe('usage statistics from the ledger', () => {
  it('match simple-statistics on the zero-filled daily series', async () => {
    const l = await list()
    expect(l.window).toEqual({ start: fx.windowStart, end: isoDay(Date.now()), days: WINDOW_DAYS })
    const line = lineFor(l, fx.itemId)
    // source: simple-statistics (npm) mean and sampleStandardDeviation, an independent implementation, over all
    // 180 days including the ones without use
    expect(line.meanDaily).toBeCloseTo(mean(fx.series), 4)
    expect(line.sdDaily).toBeCloseTo(sampleStandardDeviation(fx.series), 4)
    expect(line.annualUsage).toBeCloseTo(mean(fx.series) * 365, 2)
    // hand-worked: annual value = d̄ × 365 × moving-average cost 3.20, to the cent
    expect(Number(line.annualValue)).toBeCloseTo(Math.round(mean(fx.series) * 365 * 3.2 * 100) / 100, 2)
    const lastIndex = fx.series.findLastIndex((q) => q > 0)
    expect(line.daysSinceLastUse).toBe(WINDOW_DAYS - 1 - lastIndex)
    const half = WINDOW_DAYS / 2
    expect(line.trendRatio).toBeCloseTo(sum(fx.series.slice(half)) / sum(fx.series.slice(0, half)), 3)
    expect(line).toMatchObject({ onHand: fx.onHand, reserved: fx.reserved, onOrder: fx.onOrder, position: fx.onHand + fx.onOrder - fx.reserved })
  })

  it('take the window from the request', async () => {
    const line = lineFor(await list('&windowDays=90'), fx.itemId)
    const last90 = fx.series.slice(WINDOW_DAYS - 90)
    expect(line.meanDaily).toBeCloseTo(mean(last90), 4) // source: simple-statistics
    expect(line.sdDaily).toBeCloseTo(sampleStandardDeviation(last90), 4)
  })

  it('observe lead times from order to first receipt', async () => {
    const d = await detail()
    // source: simple-statistics on the three observed order-to-receipt times (9, 13 and 11 days)
    expect(d.leadTime).toMatchObject({ source: 'observed', observations: 3, statedDays: 12 })
    expect(d.leadTime.meanDays).toBeCloseTo(mean(fx.leadTimes), 6)
    expect(d.leadTime.sdDays).toBeCloseTo(sampleStandardDeviation(fx.leadTimes), 6)
  })

  it('gives the chart every day of the window and a projection at the mean rate', async () => {
    const d = await detail(fx.itemId, '?horizonDays=20')
    expect(d.history.daily.map((x) => x.qty)).toEqual(fx.series)
    expect(d.history.daily[0].date).toBe(fx.windowStart)
    const p = d.history.projection
    expect(p).toHaveLength(Math.ceil(d.line.leadTimeDays) + 20 + 1)
    expect(p[0].position).toBe(d.line.position)
    expect(p[10].position).toBeCloseTo(d.line.position - 10 * mean(fx.series), 1) // hand-worked: position − d̄·t
  })
})

describe('reorder figures', () => {
  it('agree with the shared reorder math on independent statistics', async () => {
    const line = lineFor(await list(), fx.itemId)
    const d = mean(fx.series) // source: simple-statistics
    const sd = sampleStandardDeviation(fx.series)
    const L = mean(fx.leadTimes)
    const sL = sampleStandardDeviation(fx.leadTimes)
    const ss = safetyStock({ z: zForServiceLevel(0.95), meanDaily: d, sdDaily: sd, leadTimeDays: L, leadTimeSdDays: sL })
    expect(line.safetyStock).toBeCloseTo(ss, 2)
    expect(line.reorderPoint).toBe(Math.ceil(reorderPointRaw(d, L, ss)))
    const eoq = economicOrderQuantity({ annualDemand: d * 365, costPerOrder: 25, holdingCostPerUnit: 0.25 * 3.2 })!
    expect(line.eoq).toBeCloseTo(eoq, 2)
    expect(line.lotSize).toBe(roundOrderQuantity(eoq, { packSize: 48, minimumOrder: 96 }))
    const expected = reorderSuggestion({
      demand: { meanDaily: d, sdDaily: sd, daysSinceLastUse: line.daysSinceLastUse },
      stock: { onHand: fx.onHand, onOrder: fx.onOrder, reserved: fx.reserved }, unitCost: '3.2000',
      policy: { ...DEFAULT_REORDER_POLICY, leadTimeDays: L, leadTimeSdDays: sL }, vendor: { packSize: 48, minimumOrder: 96 },
    })
    expect(line.status).toBe('orderNow')
    expect(line).toMatchObject({ status: expected.status, suggestedOrder: expected.suggestedOrder, vendorId: fx.vendorId, blockedBy: null })
  })

  it('explain themselves with the numbers filled in', async () => {
    const d = await detail()
    const text = d.explanation.steps.join('\n')
    expect(text).toContain(`d̄ = Σx / n = ${sum(fx.series)} / ${WINDOW_DAYS} = ${mean(fx.series).toFixed(2)}`)
    expect(text).toContain('SS = z·√(L·σd² + d̄²·σL²) = 1.6449 × √(11 × ')
    expect(text).toContain(`ROP = d̄·L + SS = ${mean(fx.series).toFixed(2)} × 11 + `)
    expect(d.explanation.inputs).toMatchObject({ onHand: fx.onHand, onOrder: fx.onOrder, reserved: fx.reserved, windowDays: WINDOW_DAYS })
    // common practice: a screen words every figure the working read in the reader's language; each name the
    // answer gives has its words in English and Spanish (the drawer showed the server's English names before)
    for (const name of Object.keys(d.explanation.inputs)) {
      expect(enReorder.inputs, name).toHaveProperty([name])
      expect(esReorder.inputs, name).toHaveProperty([name])
    }
    expect(esReorder.inputs.onHand).not.toBe(enReorder.inputs.onHand)
    expect(d.leadTime.source).toBe('observed')
    // the working a screen lists as it is carries no internal codes (a lead time "from vendorItem")
    expect(Object.values(d.explanation.inputs)).not.toContain('observed')
    expect(JSON.stringify(d.explanation)).not.toMatch(/vendorItem|purchase_order/)
    expect(d.usage).toMatchObject({ sum: sum(fx.series), sumSquares: sum(fx.series.map((q) => q * q)) })
  })

  it('flag dead stock, looking back as far as the longest dead-stock limit', async () => {
    let l = await list()
    expect(lineFor(l, fx.deadItemId)).toMatchObject({ status: 'deadStock', daysSinceLastUse: null })
    expect(lineFor(l, fx.oldUseItemId)).toMatchObject({ status: 'deadStock', daysSinceLastUse: null })
    const saved = await savePolicy({ scope: 'family', family: 'accessory', deadStockDays: 300 })
    expect(saved.status).toBe(200)
    l = await list()
    expect(lineFor(l, fx.oldUseItemId)).toMatchObject({
      daysSinceLastUse: fx.oldUseDaysAgo, lastUsedDate: isoDay(Date.now() - fx.oldUseDaysAgo * 86_400_000),
    })
    expect(lineFor(l, fx.oldUseItemId).status).not.toBe('deadStock')
    expect((await buyer.delete(`/api/reorder/policies/${saved.body.id}`).set(CSRF)).status).toBe(200)
  })

  it('group and filter the lines', async () => {
    const l = await list()
    expect(lineFor(l, fx.noVendorItemId)).toMatchObject({ status: 'orderNow', vendorId: null, blockedBy: 'noVendor', leadTimeSource: 'default' })
    expect(l.counts.orderNow).toBeGreaterThanOrEqual(2)
    expect((await list('&status=deadStock')).lines.map((x) => x.itemId).sort()).toEqual([fx.deadItemId, fx.oldUseItemId].sort())
    expect((await list(`&vendorId=${fx.vendorId}`)).lines.map((x) => x.itemId)).toEqual([fx.itemId])
    expect((await list('&family=grout')).lines.map((x) => x.itemId)).toEqual([fx.deadItemId])
    const abc = lineFor(l, fx.itemId).abcClass
    expect((await list(`&abc=${abc}`)).lines.some((x) => x.itemId === fx.itemId)).toBe(true)
  })
})

describe('dead stock at the edges of the window and of the look-back', () => {
  // Hand-worked dates: the window is the 180 days up to today (UTC), so its first day is 179 days ago and the
  // day before it 180 days ago; a 300-day dead-stock limit looks back to 299 days ago (the 300 days up to today).
  // Days since last use count from that day to today. common practice: net use per day (a pick reversed on the
  // same day is no use).
  it('finds the last use on either side of the window start, and nothing past the look-back', async () => {
    const tag = `E${fx.tag}`
    const whId = Number((await h.ds.query('INSERT INTO warehouses (code, name) VALUES (?, ?)', [tag, `Test edge yard ${tag}`])).insertId)
    const binId = Number((await h.ds.query(`INSERT INTO bins (warehouse_id, code, kind) VALUES (?, 'A-01-1', 'storage')`, [whId])).insertId)
    const day = (daysAgo: number, hour: number) => isoDay(Date.now() - daysAgo * 86_400_000) + ` ${String(hour).padStart(2, '0')}:00:00`
    // [name, moves as (days ago, hour, type, qty)]
    const cases: [string, [number, number, string, number][]][] = [
      ['dayBefore', [[180, 23, 'issue', -2]]],
      ['firstDay', [[179, 0, 'issue', -2]]],
      ['reversed', [[200, 9, 'issue', -4], [190, 9, 'pick', -3], [190, 16, 'pick', 3]]],
      ['lookbackEdge', [[299, 12, 'issue', -1]]],
      ['pastLookback', [[300, 12, 'issue', -1]]],
    ]
    const ids: Record<string, number> = {}
    for (const [name, moves] of cases) {
      const id = Number((await h.ds.query(`INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, ?, 'anchor', 'each', 1.0000)`,
        [`${tag}-${name}`, `Test anchor ${name}`])).insertId)
      ids[name] = id
      // A receipt long before the look-back brings the line to 10 on hand after its moves, so the ledger still
      // explains the balance (other tests check that over the whole database).
      const opening: [number, number, string, number] = [400, 8, 'receipt', 10 - moves.reduce((sum, m) => sum + m[3], 0)]
      for (const [ago, hour, type, qty] of [opening, ...moves]) {
        await h.ds.query(`INSERT INTO stock_moves (at, move_type, item_id, warehouse_id, bin_id, qty, batch_id) VALUES (?, ?, ?, ?, ?, ?, UUID())`,
          [day(ago, hour), type, id, whId, binId, qty])
      }
      await h.ds.query('INSERT INTO stock_balances (item_id, warehouse_id, bin_id, on_hand, reserved) VALUES (?, ?, ?, 10, 0)', [id, whId, binId])
    }
    const lines = async () => {
      const res = await buyer.get(`/api/reorder/suggestions?warehouseId=${whId}`)
      expect(res.status, JSON.stringify(res.body)).toBe(200)
      return (name: string) => (res.body as SuggestionList).lines.find((l) => l.itemId === ids[name])!
    }
    // The default limit (180 days) is the window itself: nothing before it is read.
    let line = await lines()
    expect(line('firstDay')).toMatchObject({ daysSinceLastUse: 179, lastUsedDate: fx.windowStart })
    expect(line('firstDay').status).not.toBe('deadStock')
    for (const name of ['dayBefore', 'reversed', 'lookbackEdge', 'pastLookback']) {
      expect(line(name), name).toMatchObject({ daysSinceLastUse: null, status: 'deadStock' })
    }
    const saved = await savePolicy({ scope: 'family', family: 'anchor', deadStockDays: 300 })
    expect(saved.status).toBe(200)
    try {
      line = await lines()
      expect(line('dayBefore')).toMatchObject({ daysSinceLastUse: 180, lastUsedDate: isoDay(Date.now() - 180 * 86_400_000) })
      expect(line('firstDay')).toMatchObject({ daysSinceLastUse: 179 })
      expect(line('reversed')).toMatchObject({ daysSinceLastUse: 200 })
      expect(line('lookbackEdge')).toMatchObject({ daysSinceLastUse: 299 })
      expect(line('lookbackEdge').status).not.toBe('deadStock')
      expect(line('pastLookback')).toMatchObject({ daysSinceLastUse: null, status: 'deadStock' })
      // One line's own figures (the drawer) read the same last use.
      const one = await buyer.get(`/api/reorder/lines/${ids.reversed}/${whId}`)
      expect(one.status).toBe(200)
      expect((one.body as ReorderLineDetail).line.daysSinceLastUse).toBe(200)
    } finally {
      expect((await buyer.delete(`/api/reorder/policies/${saved.body.id}`).set(CSRF)).status).toBe(200)
    }
  })
})

describe('policies', () => {
  it('merge global, family, ABC class and item layers, showing where each value came from', async () => {
    const before = await detail()
    expect(before.policySources.serviceLevel).toBe('default')
    const fam = await savePolicy({ scope: 'family', family: 'glass_block', serviceLevel: 0.98 })
    expect(fam.status).toBe(200)
    const cls = await savePolicy({ scope: 'abc', abcClass: before.line.abcClass, costPerOrder: '40.00' })
    let d = await detail()
    expect(d.policy).toMatchObject({ serviceLevel: 0.98, costPerOrder: '40.00' })
    expect(d.policySources).toMatchObject({ serviceLevel: 'family', costPerOrder: 'abc' })
    expect(d.explanation.steps).toContain(`z = Φ⁻¹(0.98) = ${zForServiceLevel(0.98).toFixed(4)}`)
    const own = await savePolicy({ scope: 'item_warehouse', itemId: fx.itemId, warehouseId: fx.warehouseId, serviceLevel: 0.99, note: 'atrium job' })
    expect(own.body).toMatchObject({ scope: 'item_warehouse', itemSku: fx.sku, warehouseCode: fx.warehouseCode, updatedBy: 'Test t-buyer' })
    d = await detail()
    expect(d.policySources.serviceLevel).toBe('item_warehouse')
    // saving the same target again replaces it: one row per target
    const again = await savePolicy({ scope: 'item_warehouse', itemId: fx.itemId, warehouseId: fx.warehouseId, serviceLevel: 0.97 })
    expect(again.body.id).toBe(own.body.id)
    expect((await buyer.get('/api/reorder/policies')).body.filter((p: { itemId: number }) => p.itemId === fx.itemId)).toHaveLength(1)
    const audits = await h.ds.query(`SELECT action FROM audit_entries WHERE entity = 'reorder_policy' AND entity_id = ? ORDER BY id`, [String(own.body.id)])
    expect(audits.map((a: { action: string }) => a.action)).toEqual(['reorder.policy.create', 'reorder.policy.update'])
    for (const p of [fam, cls, own]) expect((await buyer.delete(`/api/reorder/policies/${p.body.id}`).set(CSRF)).status).toBe(200)
    expect((await detail()).policySources.serviceLevel).toBe('default')
  })

  it('take an override only with a reason, and show it in the working', async () => {
    const target = { scope: 'item_warehouse', itemId: fx.itemId, warehouseId: fx.warehouseId }
    const rows = await count('reorder_policies')
    const refused = await savePolicy({ ...target, overrideReorderPoint: 500 })
    expect(refused.status).toBe(400)
    expect(refused.body.error.fields.overrideReason).toBeTruthy()
    const blank = await savePolicy({ ...target, overrideReorderPoint: 500, overrideReason: '   ' })
    expect(blank.status).toBe(400)
    expect(await count('reorder_policies')).toBe(rows)
    const ok = await savePolicy({ ...target, overrideReorderPoint: 500, overrideReason: 'held for the Harbour Lane atrium' })
    expect(ok.status).toBe(200)
    const d = await detail()
    expect(d.line).toMatchObject({ reorderPoint: 500, overridden: true, status: 'orderNow' })
    expect(d.overrideReason).toBe('held for the Harbour Lane atrium')
    expect(d.explanation.steps).toContain('ROP = 500 (override: held for the Harbour Lane atrium)')
    await buyer.delete(`/api/reorder/policies/${ok.body.id}`).set(CSRF)
  })
})

describe('bad input', () => {
  it('answers 400 with field messages and writes nothing', async () => {
    const before = [await count('reorder_policies'), await count('purchase_suggestions')]
    const gets: Array<[string, string]> = [['abc=D', 'abc'], ['windowDays=5', 'windowDays'], ['warehouseId=north', 'warehouseId'], ['status=soon', 'status']]
    for (const [q, field] of gets) {
      const res = await buyer.get(`/api/reorder/suggestions?${q}`)
      expect(res.status, q).toBe(400)
      expect(res.body.error.fields[field], q).toBeTruthy()
    }
    const posts: Array<[object, string]> = [
      [{ scope: 'family', serviceLevel: 0.9 }, 'family'],
      [{ scope: 'global', serviceLevel: 1.2 }, 'serviceLevel'],
      [{ scope: 'abc', abcClass: 'A', usageWindowDays: 90 }, 'usageWindowDays'],
      [{ scope: 'family', family: 'grout', overrideOrderQty: 10, overrideReason: 'x' }, 'overrideOrderQty'],
      [{ scope: 'item_warehouse', itemId: 999999999, warehouseId: fx.warehouseId, serviceLevel: 0.9 }, 'itemId'],
      [{ scope: 'global', abcCutoffA: 0.9, abcCutoffB: 0.8 }, 'abcCutoffB'],
      [{ scope: 'global' }, '_'],
    ]
    for (const [body, field] of posts) {
      const res = await savePolicy(body)
      expect(res.status, JSON.stringify(body)).toBe(400)
      expect(res.body.error.fields[field], JSON.stringify(res.body)).toBeTruthy()
    }
    const line = { itemId: fx.itemId, warehouseId: fx.warehouseId }
    const accepts: Array<[object, string]> = [
      [{ lines: [] }, 'lines'],
      [{ lines: [{ ...line, qty: 50 }] }, 'lines.0.qty'], // not whole packs of 48
      [{ lines: [{ ...line, qty: 48 }] }, 'lines.0.qty'], // below the vendor's minimum of 96
      [{ lines: [line, line] }, 'lines.1'],
      [{ lines: [{ ...line, qty: -96 }] }, 'lines.0.qty'],
    ]
    for (const [body, field] of accepts) {
      const res = await buyer.post('/api/reorder/accept').set(CSRF).send(body)
      expect(res.status, JSON.stringify(body)).toBe(400)
      expect(res.body.error.fields[field], JSON.stringify(res.body)).toBeTruthy()
    }
    expect([await count('reorder_policies'), await count('purchase_suggestions')]).toEqual(before)
  })

  it('keeps the read-only role out: the lines carry costs', async () => {
    expect((await (await h.as('viewer')).get('/api/reorder/suggestions')).status).toBe(403)
  })
})

describe('accepting suggestions', () => {
  const line = () => ({ itemId: fx.itemId, warehouseId: fx.warehouseId })
  const accept = (body: object, key?: string) => {
    const req = buyer.post('/api/reorder/accept').set(CSRF)
    return (key ? req.set('Idempotency-Key', key) : req).send(body)
  }

  it('counts what is already coming: an accepted backorder of 100 raises the position, and accepting orders only the rest', async () => {
    const before = lineFor(await list(), fx.itemId)
    // A pick list's shortage waits as an accepted backorder suggestion for the same item and warehouse.
    const backorder = Number((await h.ds.query(
      `INSERT INTO purchase_suggestions (item_id, warehouse_id, vendor_id, qty, status, source) VALUES (?, ?, ?, 100, 'accepted', 'backorder')`,
      [fx.itemId, fx.warehouseId, fx.vendorId])).insertId)
    try {
      const after = lineFor(await list(), fx.itemId)
      expect(after.pendingQty).toBe(before.pendingQty + 100)
      expect(after.position).toBe(before.position + 100)
      const working = await detail()
      expect(working.explanation.steps.join('\n')).toContain(`+ ${after.pendingQty} − ${after.reserved} = ${after.position}`)
      // The line asks for no more than the policy wants on top of what is coming; accepting takes exactly that.
      const res = await accept({ lines: [line()] })
      expect(res.status).toBe(after.suggestedOrder > 0 ? 201 : 200)
      const accepted = res.body.accepted.reduce((n: number, a: { qty: number }) => n + a.qty, 0)
      expect(accepted).toBe(after.suggestedOrder)
      const last = lineFor(await list(), fx.itemId)
      expect(last.pendingQty).toBe(before.pendingQty + 100 + accepted)
    } finally {
      await h.ds.query(`UPDATE purchase_suggestions SET status = 'dismissed' WHERE item_id = ? AND warehouse_id = ? AND status = 'accepted'`, [fx.itemId, fx.warehouseId])
      expect(backorder).toBeGreaterThan(0)
    }
  })

  it('writes one accepted row for the preferred vendor with its working', async () => {
    const expected = lineFor(await list(), fx.itemId)
    const res = await accept({ lines: [line(), { itemId: fx.noVendorItemId, warehouseId: fx.warehouseId }] })
    expect(res.status).toBe(201)
    expect(res.body.accepted).toEqual([{ id: expect.any(Number), ...line(), vendorId: fx.vendorId, qty: expected.suggestedOrder }])
    expect(res.body.skipped).toEqual([{ itemId: fx.noVendorItemId, warehouseId: fx.warehouseId, reason: 'noVendor' }])
    const [row] = await openSuggestions()
    expect(row).toMatchObject({ vendor_id: fx.vendorId, qty: expected.suggestedOrder, source: 'reorder', status: 'accepted' })
    const explanation = JSON.parse(row.explanation)
    expect(explanation.figures.reorderPoint).toBe(expected.reorderPoint)
    expect(explanation.steps.join('\n')).toContain('ROP = d̄·L + SS')
    const after = lineFor(await list(), fx.itemId)
    expect(after).toMatchObject({ pendingQty: expected.suggestedOrder, openSuggestionId: row.id, blockedBy: 'alreadyAccepted' })
  })

  it('does not duplicate when accepted again, even twice at once', async () => {
    const again = await accept({ lines: [line()] })
    expect(again.status).toBe(200)
    expect(again.body).toEqual({ accepted: [], skipped: [{ ...line(), reason: 'alreadyAccepted' }] })
    await h.ds.query(`UPDATE purchase_suggestions SET status = 'ordered' WHERE item_id = ? AND warehouse_id = ?`, [fx.itemId, fx.warehouseId])
    const both = await Promise.all([accept({ lines: [{ ...line(), qty: 96 }] }), accept({ lines: [{ ...line(), qty: 96 }] })])
    expect(both.map((r) => r.body.accepted.length).sort()).toEqual([0, 1])
    expect(await openSuggestions()).toHaveLength(1)
  })

  it('replays the first answer for the same Idempotency-Key', async () => {
    await h.ds.query(`UPDATE purchase_suggestions SET status = 'ordered' WHERE item_id = ? AND warehouse_id = ?`, [fx.itemId, fx.warehouseId])
    const key = `reorder-test-${fx.tag}`
    const first = await accept({ lines: [{ ...line(), qty: 144 }] }, key)
    expect(first.status).toBe(201)
    const replay = await accept({ lines: [{ ...line(), qty: 144 }] }, key)
    expect(replay.status).toBe(201)
    expect(replay.headers['idempotent-replayed']).toBe('true')
    expect(replay.body).toEqual(first.body)
    expect(await openSuggestions()).toHaveLength(1)
  })
})

describe('ABC Pareto series', () => {
  it('ranks by annual usage value and ends at 100 %', async () => {
    const res = await buyer.get('/api/reorder/abc')
    expect(res.status).toBe(200)
    const items = res.body.items as Array<{ itemId: number; annualValue: string; cumulativePercent: number; abcClass: string }>
    const values = items.map((i) => Number(i.annualValue))
    expect(values).toEqual([...values].sort((a, b) => b - a))
    expect(items.at(-1)!.cumulativePercent).toBeCloseTo(100, 6)
    const mine = items.find((i) => i.itemId === fx.itemId)!
    expect(Number(mine.annualValue)).toBeCloseTo(Math.round(mean(fx.series) * 365 * 3.2 * 100) / 100, 2) // hand-worked, as above
    expect(mine.abcClass).toBe(lineFor(await list(), fx.itemId).abcClass)
    expect(res.body.cutoffs).toEqual({ a: 0.8, b: 0.95 }) // source: Heizer & Render rule of thumb (shared/inventory/abc.ts)
  })
})
