// Purchase orders against the real app and MariaDB: created from accepted suggestions (grouped by
// vendor and ship-to warehouse), from a job's shower base, or by hand; numbering without gaps under
// concurrency; money as decimal text; the status life with who and when; role and cost rules.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PoDetail } from '../../shared/schemas/purchasingViews.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import {
  BASE_SPEC, count, createPurchasingFixture, jobWithShowerBase, suggestion, type PurchasingFixture,
} from '../support/purchasingFixtures.js'

let h: ApiHarness
let f: PurchasingFixture
beforeAll(async () => {
  h = await startApiHarness()
  f = await createPurchasingFixture(h.ds)
})
afterAll(() => h?.close())

async function manualPo(lines: { itemId: number; packsOrdered: number; unitCost?: string }[], vendorId = f.vendorA): Promise<PoDetail> {
  const buyer = await h.as('buyer')
  const res = await buyer.post('/api/purchase-orders').set(CSRF).send({ vendorId, warehouseId: f.warehouse.id, lines })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body
}

describe('purchase orders from accepted suggestions', () => {
  it('groups by vendor and ship-to warehouse, rounds up to purchase packs and marks the suggestions ordered', async () => {
    const s1 = await suggestion(h.ds, { itemId: f.block.id, warehouseId: f.warehouse.id, vendorId: f.vendorA, qty: 50 })
    const s2 = await suggestion(h.ds, { itemId: f.sealant.id, warehouseId: f.warehouse.id, vendorId: f.vendorA, qty: 5 })
    const s3 = await suggestion(h.ds, { itemId: f.block.id, warehouseId: f.otherWarehouse.id, vendorId: f.vendorA, qty: 30 })
    // No vendor on the suggestion: the item's preferred vendor (B for the sealant) takes it.
    const s4 = await suggestion(h.ds, { itemId: f.sealant.id, warehouseId: f.warehouse.id, vendorId: null, qty: 21, source: 'backorder' })
    const buyer = await h.as('buyer')
    const res = await buyer.post('/api/purchase-orders/from-suggestions').set(CSRF).send({ suggestionIds: [s1, s2, s3, s4] })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const pos = res.body as PoDetail[]
    expect(pos).toHaveLength(3)
    const key = (po: PoDetail) => `${po.vendor.id}:${po.warehouse.id}`
    const byKey = new Map(pos.map((po) => [key(po), po]))
    const a1 = byKey.get(`${f.vendorA}:${f.warehouse.id}`)!
    const a2 = byKey.get(`${f.vendorA}:${f.otherWarehouse.id}`)!
    const b1 = byKey.get(`${f.vendorB}:${f.warehouse.id}`)!
    for (const po of pos) {
      expect(po.status).toBe('draft')
      expect(po.number).toMatch(/^PO-\d{4}-\d{5}$/)
    }
    // 50 wanted, minimum 48, packs of 24 → 3 packs = 72; 5 wanted, minimum 12, packs of 12 → 1 pack (hand computed)
    expect(a1.lines.map((l) => [l.sku, l.packsOrdered, l.packQty, l.qtyOrdered])).toEqual([
      [f.block.sku, 3, 24, 72],
      [f.sealant.sku, 1, 12, 12],
    ])
    // 30 wanted, minimum 48 → 2 packs of 24 = 48
    expect(a2.lines.map((l) => [l.packsOrdered, l.qtyOrdered])).toEqual([[2, 48]])
    // 21 wanted at vendor B, packs of 10 → 3 packs = 30
    expect(b1.lines.map((l) => [l.vendorSku, l.packsOrdered, l.qtyOrdered, l.unitCost])).toEqual([[`NB-${f.tag}-S`, 3, 30, '6.1000']])
    const rows: { id: number; status: string; po_line_id: number; vendor_id: number }[] = await h.ds.query(
      'SELECT id, status, po_line_id, vendor_id FROM purchase_suggestions WHERE id IN (?, ?, ?, ?) ORDER BY id', [s1, s2, s3, s4])
    expect(rows.map((r) => r.status)).toEqual(['ordered', 'ordered', 'ordered', 'ordered'])
    expect(rows.map((r) => r.po_line_id)).toEqual([a1.lines[0].id, a1.lines[1].id, a2.lines[0].id, b1.lines[0].id])
    expect(rows[3].vendor_id).toBe(f.vendorB)
    // the same suggestions can't be ordered twice
    const again = await buyer.post('/api/purchase-orders/from-suggestions').set(CSRF).send({ suggestionIds: [s1] })
    expect(again.status).toBe(409)
  })

  it('refuses a suggestion whose vendor has no price for the item, writing nothing', async () => {
    const s = await suggestion(h.ds, { itemId: f.block.id, warehouseId: f.otherWarehouse.id, vendorId: f.vendorB, qty: 10 })
    const before = await count(h.ds, 'purchase_orders')
    const res = await (await h.as('buyer')).post('/api/purchase-orders/from-suggestions').set(CSRF).send({ suggestionIds: [s] })
    expect(res.status).toBe(409)
    expect(res.body.error.message).toContain(f.block.sku)
    expect(await count(h.ds, 'purchase_orders')).toBe(before)
  })

  it('answers 400 with field messages for bad input and writes nothing', async () => {
    const buyer = await h.as('buyer')
    const before = await count(h.ds, 'purchase_orders')
    const empty = await buyer.post('/api/purchase-orders/from-suggestions').set(CSRF).send({ suggestionIds: [] })
    expect(empty.status).toBe(400)
    expect(empty.body.error.fields).toHaveProperty('suggestionIds')
    const manual = await buyer.post('/api/purchase-orders').set(CSRF).send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.block.id, packsOrdered: 0 }] })
    expect(manual.status).toBe(400)
    expect(manual.body.error.fields).toHaveProperty(['lines.0.packsOrdered'])
    const cost = await buyer.post('/api/purchase-orders').set(CSRF).send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.block.id, packsOrdered: 1, unitCost: '1.23456' }] })
    expect(cost.status).toBe(400)
    expect(cost.body.error.fields).toHaveProperty(['lines.0.unitCost'])
    const huge = await buyer.post('/api/purchase-orders').set(CSRF).send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.block.id, packsOrdered: 90000 }] })
    expect(huge.status).toBe(400)
    expect(await count(h.ds, 'purchase_orders')).toBe(before)
  })
})

describe('PO numbers', () => {
  it('are consecutive with no gaps or repeats when many are created at once', async () => {
    const buyer = await h.as('buyer')
    const results = await Promise.all(
      Array.from({ length: 8 }, () =>
        buyer.post('/api/purchase-orders').set(CSRF).send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.sealant.id, packsOrdered: 1 }] })),
    )
    expect(results.map((r) => r.status)).toEqual(Array(8).fill(201))
    const seqs = results.map((r) => Number((r.body as PoDetail).number.slice(-5))).sort((a, b) => a - b)
    expect(new Set(seqs).size).toBe(8)
    expect(seqs[7] - seqs[0]).toBe(7)
  })
})

describe('money', () => {
  it('keeps costs and totals as decimal text: each line rounded half-up to cents, the order the sum of its lines', async () => {
    // Rounding each line to cents before adding: common practice (invoice lines). Values hand computed.
    const po = await manualPo([{ itemId: f.sealant.id, packsOrdered: 7, unitCost: '1.2345' }, { itemId: f.block.id, packsOrdered: 3, unitCost: '0.3333' }])
    // the block's pack is 24: 3 packs × 24 = 72 units × 0.3333 = 23.9976 → 24.00; sealant pack 12: 84 × 1.2345 = 103.698 → 103.70
    expect(po.lines.map((l) => [l.qtyOrdered, l.unitCost, l.lineTotal])).toEqual([[84, '1.2345', '103.70'], [72, '0.3333', '24.00']])
    expect(po.orderTotal).toBe('127.70')
    const [row] = await h.ds.query('SELECT total FROM purchase_orders WHERE id = ?', [po.id])
    expect(row.total).toBe('127.70')
  })
})

describe('the status life of a PO', () => {
  it('draft → approved → sent → closed, each with who and when and an audit entry; drafts only are edited', async () => {
    const buyer = await h.as('buyer')
    const po = await manualPo([{ itemId: f.sealant.id, packsOrdered: 2 }])
    const edited = await buyer.patch(`/api/purchase-orders/${po.id}`).set(CSRF).send({ version: po.version, expectedDate: '2031-05-04', notes: 'Call before delivery', lines: [{ id: po.lines[0].id, packsOrdered: 4 }] })
    expect(edited.status).toBe(200)
    expect(edited.body).toMatchObject({ expectedDate: '2031-05-04', notes: 'Call before delivery' })
    expect(edited.body.lines[0]).toMatchObject({ packsOrdered: 4, qtyOrdered: 48, lineTotal: '300.00' }) // 48 × 6.25
    expect(edited.body.orderTotal).toBe('300.00')

    const warehouse = await h.as('warehouse')
    expect((await warehouse.post(`/api/purchase-orders/${po.id}/approve`).set(CSRF)).status).toBe(403)
    const approved = await buyer.post(`/api/purchase-orders/${po.id}/approve`).set(CSRF).send({ version: edited.body.version })
    expect(approved.status).toBe(200)
    expect(approved.body.status).toBe('approved')
    expect((await buyer.patch(`/api/purchase-orders/${po.id}`).set(CSRF).send({ version: approved.body.version, notes: 'late edit' })).status).toBe(409)
    expect((await buyer.post(`/api/purchase-orders/${po.id}/approve`).set(CSRF).send({ version: approved.body.version })).status).toBe(409)
    const sent = await buyer.post(`/api/purchase-orders/${po.id}/mark-sent`).set(CSRF)
    expect(sent.body.status).toBe('sent')
    const closed = await buyer.post(`/api/purchase-orders/${po.id}/close`).set(CSRF).send({ reason: 'Vendor discontinued the tube size' })
    expect(closed.body.status).toBe('closed')
    const timeline = closed.body.timeline as PoDetail['timeline']
    expect(timeline.map((t) => t.event)).toEqual(['created', 'approved', 'sent', 'closed'])
    expect(timeline.every((t) => t.by === 'Test t-buyer' && !Number.isNaN(Date.parse(t.at)))).toBe(true)
    expect(timeline[3].note).toBe('Vendor discontinued the tube size')
    const audits: { action: string }[] = await h.ds.query(`SELECT action FROM audit_entries WHERE entity = 'purchase_order' AND entity_id = ? ORDER BY id`, [String(po.id)])
    expect(audits.map((a) => a.action)).toEqual(['po.create', 'po.update', 'po.approved', 'po.sent', 'po.closed'])
  })

  it('cancelling gives the suggestions back, and removing a draft line does too', async () => {
    const buyer = await h.as('buyer')
    // New lines join the open draft of their vendor and ship-to: start this order on its own.
    await h.ds.query(`UPDATE purchase_orders SET status = 'cancelled' WHERE status = 'draft' AND vendor_id = ? AND warehouse_id = ?`, [f.vendorA, f.warehouse.id])
    const s1 = await suggestion(h.ds, { itemId: f.block.id, warehouseId: f.warehouse.id, vendorId: f.vendorA, qty: 24 })
    const s2 = await suggestion(h.ds, { itemId: f.sealant.id, warehouseId: f.warehouse.id, vendorId: f.vendorA, qty: 12 })
    const [po] = (await buyer.post('/api/purchase-orders/from-suggestions').set(CSRF).send({ suggestionIds: [s1, s2] })).body as PoDetail[]
    const sealantLine = po.lines.find((l) => l.itemId === f.sealant.id)!
    const removed = await buyer.delete(`/api/purchase-orders/${po.id}/lines/${sealantLine.id}`).set(CSRF)
    expect(removed.body.lines).toHaveLength(1)
    expect(removed.body.orderTotal).toBe('120.00') // 48 × 2.50 (minimum 48)
    const [back] = await h.ds.query('SELECT status, po_line_id FROM purchase_suggestions WHERE id = ?', [s2])
    expect(back).toEqual({ status: 'accepted', po_line_id: null })
    await buyer.post(`/api/purchase-orders/${po.id}/approve`).set(CSRF).send({ version: removed.body.version })
    const cancelled = await buyer.post(`/api/purchase-orders/${po.id}/cancel`).set(CSRF).send({ reason: 'Ordered by phone instead' })
    expect(cancelled.body.status).toBe('cancelled')
    expect(cancelled.body.cancelReason).toBe('Ordered by phone instead')
    const [first] = await h.ds.query('SELECT status, po_line_id FROM purchase_suggestions WHERE id = ?', [s1])
    expect(first).toEqual({ status: 'accepted', po_line_id: null })
    expect((await buyer.post(`/api/purchase-orders/${po.id}/approve`).set(CSRF).send({ version: cancelled.body.version })).status).toBe(409)
  })

  it('on cancel, joins a suggestion accepted meanwhile for the same item and warehouse instead of opening a second one', async () => {
    const buyer = await h.as('buyer')
    const old = await suggestion(h.ds, { itemId: f.sealant.id, warehouseId: f.otherWarehouse.id, vendorId: f.vendorA, qty: 12 })
    const [po] = (await buyer.post('/api/purchase-orders/from-suggestions').set(CSRF).send({ suggestionIds: [old] })).body as PoDetail[]
    const fresh = await suggestion(h.ds, { itemId: f.sealant.id, warehouseId: f.otherWarehouse.id, vendorId: f.vendorA, qty: 5 })
    expect((await buyer.post(`/api/purchase-orders/${po.id}/cancel`).set(CSRF).send({})).status).toBe(200)
    const rows = await h.ds.query('SELECT id, status, qty FROM purchase_suggestions WHERE id IN (?, ?) ORDER BY id', [old, fresh])
    expect(rows).toEqual([{ id: old, status: 'dismissed', qty: 12 }, { id: fresh, status: 'accepted', qty: 17 }])
  })
})

describe('costs by role', () => {
  it('hides unit costs and totals from the warehouse unless the admin allows them', async () => {
    const po = await manualPo([{ itemId: f.sealant.id, packsOrdered: 1, unitCost: '7.7777' }])
    const warehouse = await h.as('warehouse')
    const hidden = await warehouse.get(`/api/purchase-orders/${po.id}`)
    expect(hidden.status).toBe(200)
    expect(hidden.body).not.toHaveProperty('orderTotal')
    expect(hidden.body.lines[0]).not.toHaveProperty('unitCost')
    expect(hidden.body.lines[0]).not.toHaveProperty('lineTotal')
    expect(JSON.stringify(hidden.body)).not.toContain('7.7777')
    const list = await warehouse.get('/api/purchase-orders')
    expect(list.body.every((p: object) => !('orderTotal' in p))).toBe(true)
    expect((await warehouse.get(`/api/purchase-orders/${po.id}/export`)).status).toBe(403)
    expect((await (await h.as('counter')).get(`/api/purchase-orders/${po.id}`)).status).toBe(403)

    const admin = await h.as('admin')
    expect((await (await h.as('buyer')).patch('/api/purchasing/settings').set(CSRF).send({ warehouseSeesCosts: true })).status).toBe(403)
    const on = await admin.patch('/api/purchasing/settings').set(CSRF).send({ warehouseSeesCosts: true })
    expect(on.body).toMatchObject({ warehouseSeesCosts: true })
    try {
      const shown = await warehouse.get(`/api/purchase-orders/${po.id}`)
      expect(shown.body.lines[0].unitCost).toBe('7.7777')
      expect(shown.body.orderTotal).toBe('93.33') // 12 × 7.7777 = 93.3324 → 93.33
    } finally {
      await admin.patch('/api/purchasing/settings').set(CSRF).send({ warehouseSeesCosts: false })
    }
    const bad = await admin.patch('/api/purchasing/settings').set(CSRF).send({ warehouseSeesCosts: 'sometimes' })
    expect(bad.status).toBe(400)
  })
})

describe('special orders from a job', () => {
  it("turns the job's shower base into a PO line tied to the job, with its dimensions, and the counter sees it against the due date", async () => {
    const { jobId, bomLineId } = await jobWithShowerBase(h.ds, f, '2020-01-15')
    const buyer = await h.as('buyer')
    const open = await buyer.get('/api/purchase-orders/special-orders')
    expect(open.body.some((j: { jobId: number }) => j.jobId === jobId)).toBe(true)
    const res = await buyer.post('/api/purchase-orders/from-job').set(CSRF).send({ jobId, warehouseId: f.warehouse.id, vendorId: f.vendorA })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const [po] = res.body as PoDetail[]
    expect(po.job).toMatchObject({ id: jobId, dueDate: '2020-01-15' })
    expect(po.lines).toHaveLength(1)
    const line = po.lines[0]
    expect(line).toMatchObject({ itemId: f.base.id, bomLineId, qtyOrdered: 1, unitCost: '395.0000', madeToOrder: true })
    expect(line.spec).toEqual(BASE_SPEC)
    // 1219 mm = 47 63/64 in → 48 in at 1/16; 914 mm = 35.98 in → 36 in (NIST SP 811: 1 in = 25.4 mm)
    expect(line.specText).toContain('48 in × 36 in (width × depth)')
    expect(line.specText).toContain('drain 24 in from left, 18 in from back')
    // The description names what is built and leaves every size to the specification (no catalog size to contradict it).
    expect(line.description).toBe('Shower base for tiling, made to order, to the specification on this line')
    expect(po.arrivesAfterDue).toBe(true) // due 2020-01-15, expected weeks from today
    const [bl] = await h.ds.query('SELECT ordered_qty FROM bom_lines WHERE id = ?', [bomLineId])
    expect(bl.ordered_qty).toBe(1)
    expect((await buyer.post('/api/purchase-orders/from-job').set(CSRF).send({ jobId, warehouseId: f.warehouse.id })).status).toBe(409)

    const counter = await h.as('counter')
    const lines = await counter.get(`/api/jobs/${jobId}/purchase-lines`)
    expect(lines.status).toBe(200)
    expect(lines.body.job).toMatchObject({ id: jobId, dueDate: '2020-01-15' })
    expect(lines.body.toOrder).toEqual([])
    expect(lines.body.lines).toEqual([
      expect.objectContaining({ poId: po.id, poNumber: po.number, qtyOrdered: 1, qtyReceived: 0, late: true }),
    ])
    expect((await (await h.as('warehouse')).get(`/api/jobs/${jobId}/purchase-lines`)).status).toBe(403)
  })
})
