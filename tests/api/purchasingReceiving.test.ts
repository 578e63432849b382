// Receiving against purchase orders: lots and bins, partial, short, over and damaged lines, the
// moving-average cost, made-to-order lines issued straight to their job, the status moving on,
// idempotent retries and concurrent submissions.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PoDetail, ReceiveResult } from '../../shared/schemas/purchasingViews.js'
import { receive } from '../../server/services/stock/stockService.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { count, createPurchasingFixture, jobWithShowerBase, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: ApiHarness
let f: PurchasingFixture
beforeAll(async () => {
  h = await startApiHarness()
  f = await createPurchasingFixture(h.ds)
})
afterAll(() => h?.close())

let keySeq = 0
const newKey = () => `rcv-${f.tag}-${Date.now()}-${++keySeq}`

async function sentPo(lines: { itemId: number; packsOrdered: number }[]): Promise<PoDetail> {
  const buyer = await h.as('buyer')
  const created = await buyer.post('/api/purchase-orders').set(CSRF).send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines })
  expect(created.status, JSON.stringify(created.body)).toBe(201)
  await buyer.post(`/api/purchase-orders/${created.body.id}/approve`).set(CSRF).send({ version: created.body.version })
  const sent = await buyer.post(`/api/purchase-orders/${created.body.id}/mark-sent`).set(CSRF)
  expect(sent.body.status).toBe('sent')
  return sent.body
}

async function post(poId: number, body: object, key = newKey()) {
  return (await h.as('warehouse')).post(`/api/purchase-orders/${poId}/receipts`).set(CSRF).set('Idempotency-Key', key).send(body)
}

async function onHand(itemId: number, binId: number): Promise<number> {
  const [row] = await h.ds.query('SELECT COALESCE(SUM(on_hand), 0) AS q FROM stock_balances WHERE item_id = ? AND bin_id = ?', [itemId, binId])
  return Number(row.q)
}

async function lineState(lineId: number) {
  const [row] = await h.ds.query('SELECT qty_received, qty_damaged FROM purchase_order_lines WHERE id = ?', [lineId])
  return { received: Number(row.qty_received), damaged: Number(row.qty_damaged) }
}

describe('receiving a PO', () => {
  it('posts partial receipts into bins and lots, blends the moving-average cost, and moves the PO on', async () => {
    // 60 on hand at 2.0000 before the order arrives
    await h.ds.transaction((em) => receive(em, { userId: null }, { warehouseId: f.warehouse.id, lines: [{ itemId: f.block.id, binId: f.warehouse.bins.a2, qty: 60, unitCost: '2.0000' }] }))
    const po = await sentPo([{ itemId: f.block.id, packsOrdered: 3 }, { itemId: f.sealant.id, packsOrdered: 1 }]) // 72 blocks at 2.50, 12 tubes
    const [block, sealant] = po.lines
    const context = await (await h.as('warehouse')).get(`/api/purchase-orders/${po.id}/receiving`)
    expect(context.status).toBe(200)
    expect(context.body.bins.map((b: { code: string }) => b.code)).toEqual(['DOCK', 'A-01-1', 'A-01-2'])
    expect(context.body.po.lines[0]).not.toHaveProperty('unitCost')

    const first = await post(po.id, { lines: [{ poLineId: block.id, binId: f.warehouse.bins.a1, lotCode: 'R2611', qty: 40 }] })
    expect(first.status, JSON.stringify(first.body)).toBe(201)
    const result = first.body as ReceiveResult
    expect(result.status).toBe('partly_received')
    expect(result.receipt.lines[0]).toMatchObject({ sku: f.block.sku, gtin: f.block.gtin, lotCode: 'R2611', binCode: 'A-01-1', qty: 40, variance: 'short' })
    expect(await onHand(f.block.id, f.warehouse.bins.a1)).toBe(40)
    // Perpetual moving average (method: Weygandt, Kimmel & Kieso, Accounting Principles, inventory chapter;
    // numbers ours): (60 × 2.00 + 40 × 2.50) / 100 = 2.20
    const [iw] = await h.ds.query('SELECT avg_cost FROM item_warehouses WHERE item_id = ? AND warehouse_id = ?', [f.block.id, f.warehouse.id])
    expect(iw.avg_cost).toBe('2.2000')
    const [lot] = await h.ds.query('SELECT vendor_id FROM lots WHERE item_id = ? AND code = ?', [f.block.id, 'R2611'])
    expect(lot.vendor_id).toBe(f.vendorA)
    const moves = await h.ds.query(`SELECT doc_type, doc_id, doc_line_id, qty, unit_cost FROM stock_moves WHERE doc_type = 'purchase_order' AND doc_id = ?`, [po.id])
    expect(moves).toEqual([{ doc_type: 'purchase_order', doc_id: po.id, doc_line_id: block.id, qty: 40, unit_cost: '2.5000' }])
    // The partial delivery is on the order's history at once, with who took it and what came in.
    const partly = (await (await h.as('buyer')).get(`/api/purchase-orders/${po.id}`)).body as PoDetail
    expect(partly.timeline.filter((t) => t.event === 'delivery')).toEqual([expect.objectContaining({ by: 'Test t-warehouse', qty: 40, damaged: 0 })])

    // the rest, split over two lots and bins, plus all the sealant: complete → received → closed
    const rest = await post(po.id, { lines: [
      { poLineId: block.id, binId: f.warehouse.bins.a1, lotCode: 'R2611', qty: 20 },
      { poLineId: block.id, binId: f.warehouse.bins.dock, lotCode: 'R2612', qty: 12 },
      { poLineId: sealant.id, binId: f.warehouse.bins.dock, qty: 12 },
    ] })
    expect(rest.status, JSON.stringify(rest.body)).toBe(201)
    expect(rest.body.status).toBe('closed')
    const detail = (await (await h.as('buyer')).get(`/api/purchase-orders/${po.id}`)).body as PoDetail
    expect(detail.timeline.map((t) => t.event)).toEqual(['created', 'approved', 'sent', 'delivery', 'delivery', 'received', 'closed'])
    expect(detail.timeline.find((t) => t.event === 'received')!.by).toBe('Test t-warehouse')
    expect(detail.lines.map((l) => l.qtyReceived)).toEqual([72, 12])
    const receipts = await (await h.as('buyer')).get(`/api/purchase-orders/${po.id}/receipts`)
    expect(receipts.body).toHaveLength(2)
    expect((await post(po.id, { lines: [{ poLineId: sealant.id, binId: f.warehouse.bins.dock, qty: 1 }] })).status).toBe(409)
  })

  it('needs a lot code for lot-tracked items and a bin of the ship-to warehouse; bad input writes nothing', async () => {
    const po = await sentPo([{ itemId: f.block.id, packsOrdered: 2 }])
    const lineId = po.lines[0].id
    const before = await count(h.ds, 'stock_moves')
    const noLot = await post(po.id, { lines: [{ poLineId: lineId, binId: f.warehouse.bins.a1, qty: 5 }] })
    expect(noLot.status).toBe(400)
    expect(noLot.body.error.fields).toHaveProperty(['lines.0.lotCode'])
    const farBin = await post(po.id, { lines: [{ poLineId: lineId, binId: f.otherWarehouse.bin, lotCode: 'R1', qty: 5 }] })
    expect(farBin.status).toBe(400)
    const nothing = await post(po.id, { lines: [{ poLineId: lineId, binId: f.warehouse.bins.a1, lotCode: 'R1', qty: 0 }] })
    expect(nothing.status).toBe(400)
    expect(nothing.body.error.fields).toHaveProperty(['lines.0.qty'])
    const badLot = await post(po.id, { lines: [{ poLineId: lineId, binId: f.warehouse.bins.a1, lotCode: 'R 1;', qty: 1 }] })
    expect(badLot.status).toBe(400)
    expect(await count(h.ds, 'stock_moves')).toBe(before)
    expect(await lineState(lineId)).toEqual({ received: 0, damaged: 0 })
    const draftPo = await (await h.as('buyer')).post('/api/purchase-orders').set(CSRF).send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.sealant.id, packsOrdered: 1 }] })
    expect((await post(draftPo.body.id, { lines: [{ poLineId: draftPo.body.lines[0].id, binId: f.warehouse.bins.a1, qty: 1 }] })).status).toBe(409)
  })

  it('records damaged units with a reason: not stocked, still owed; over-receipt needs a reason and stays within 10 %', async () => {
    const po = await sentPo([{ itemId: f.sealant.id, packsOrdered: 5 }]) // 60 tubes
    const lineId = po.lines[0].id
    const noReason = await post(po.id, { lines: [{ poLineId: lineId, binId: f.warehouse.bins.a1, qty: 50, damagedQty: 4 }] })
    expect(noReason.status).toBe(400)
    expect(noReason.body.error.fields).toHaveProperty(['lines.0.reason'])
    const damaged = await post(po.id, { lines: [{ poLineId: lineId, binId: f.warehouse.bins.a1, qty: 50, damagedQty: 4, reason: 'Crushed carton' }] })
    expect(damaged.status).toBe(201)
    expect(damaged.body.receipt.lines[0]).toMatchObject({ qty: 50, qtyDamaged: 4, variance: 'damaged', reason: 'Crushed carton' })
    expect(await lineState(lineId)).toEqual({ received: 50, damaged: 4 })
    expect(await onHand(f.sealant.id, f.warehouse.bins.a1)).toBe(50)
    expect(damaged.body.status).toBe('partly_received')

    // allowance: ceil(10 % of 60) = 6, so at most 66 in all (common practice tolerance, our rule)
    const overNoReason = await post(po.id, { lines: [{ poLineId: lineId, binId: f.warehouse.bins.a1, qty: 14 }] })
    expect(overNoReason.status).toBe(400)
    expect(overNoReason.body.error.fields).toHaveProperty(['lines.0.reason'])
    const tooMuch = await post(po.id, { lines: [{ poLineId: lineId, binId: f.warehouse.bins.a1, qty: 17, reason: 'Vendor sent extra' }] })
    expect(tooMuch.status).toBe(409)
    expect(tooMuch.body.error.code).toBe('over_receipt')
    const over = await post(po.id, { lines: [{ poLineId: lineId, binId: f.warehouse.bins.a1, qty: 16, reason: 'Vendor sent a spare carton' }] })
    expect(over.status, JSON.stringify(over.body)).toBe(201)
    expect(over.body.receipt.lines[0].variance).toBe('over')
    expect(await lineState(lineId)).toEqual({ received: 66, damaged: 4 })
  })

  it("issues a made-to-order shower base straight to its job: received, never on hand", async () => {
    const { jobId } = await jobWithShowerBase(h.ds, f, '2031-02-01')
    const buyer = await h.as('buyer')
    const [po] = (await buyer.post('/api/purchase-orders/from-job').set(CSRF).send({ jobId, warehouseId: f.warehouse.id, vendorId: f.vendorA })).body as PoDetail[]
    await buyer.post(`/api/purchase-orders/${po.id}/approve`).set(CSRF).send({ version: po.version })
    await buyer.post(`/api/purchase-orders/${po.id}/mark-sent`).set(CSRF)
    const res = await post(po.id, { lines: [{ poLineId: po.lines[0].id, binId: f.warehouse.bins.dock, qty: 1 }] })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.receipt.lines[0].issuedToJobId).toBe(jobId)
    expect(res.body.status).toBe('closed')
    expect(await onHand(f.base.id, f.warehouse.bins.dock)).toBe(0)
    const moves = await h.ds.query('SELECT move_type, qty, doc_type, doc_id FROM stock_moves WHERE item_id = ? ORDER BY id', [f.base.id])
    expect(moves).toEqual([
      { move_type: 'receipt', qty: 1, doc_type: 'purchase_order', doc_id: po.id },
      { move_type: 'issue', qty: -1, doc_type: 'job', doc_id: jobId },
    ])
    const lines = await (await h.as('counter')).get(`/api/jobs/${jobId}/purchase-lines`)
    expect(lines.body.lines[0]).toMatchObject({ qtyOrdered: 1, qtyReceived: 1, status: 'closed' })
  })

  it('stays received until the buyer closes it when automatic closing is off', async () => {
    const admin = await h.as('admin')
    await admin.patch('/api/purchasing/settings').set(CSRF).send({ autoCloseOnReceipt: false })
    try {
      const po = await sentPo([{ itemId: f.sealant.id, packsOrdered: 1 }])
      const res = await post(po.id, { lines: [{ poLineId: po.lines[0].id, binId: f.warehouse.bins.dock, qty: 12 }] })
      expect(res.body.status).toBe('received')
      const closed = await (await h.as('buyer')).post(`/api/purchase-orders/${po.id}/close`).set(CSRF).send({ reason: 'Invoice matched' })
      expect(closed.body.status).toBe('closed')
    } finally {
      await admin.patch('/api/purchasing/settings').set(CSRF).send({ autoCloseOnReceipt: true })
    }
  })

  it('only the warehouse and admin receive', async () => {
    const po = await sentPo([{ itemId: f.sealant.id, packsOrdered: 1 }])
    const body = { lines: [{ poLineId: po.lines[0].id, binId: f.warehouse.bins.dock, qty: 1 }] }
    expect((await (await h.as('buyer')).post(`/api/purchase-orders/${po.id}/receipts`).set(CSRF).send(body)).status).toBe(403)
    expect((await (await h.as('counter')).post(`/api/purchase-orders/${po.id}/receipts`).set(CSRF).send(body)).status).toBe(403)
    expect(await lineState(po.lines[0].id)).toEqual({ received: 0, damaged: 0 })
  })
})

describe('retries and races', () => {
  it('replays a retried submission with the same Idempotency-Key instead of receiving twice', async () => {
    const po = await sentPo([{ itemId: f.sealant.id, packsOrdered: 2 }])
    const body = { lines: [{ poLineId: po.lines[0].id, binId: f.warehouse.bins.a2, qty: 10 }] }
    const key = newKey()
    const first = await post(po.id, body, key)
    const again = await post(po.id, body, key)
    expect(first.status).toBe(201)
    expect(again.status).toBe(201)
    expect(again.headers['idempotent-replayed']).toBe('true')
    expect(again.body).toEqual(first.body)
    expect(await lineState(po.lines[0].id)).toEqual({ received: 10, damaged: 0 })
    const reused = await post(po.id, { lines: [{ ...body.lines[0], qty: 11 }] }, key)
    expect(reused.status).toBe(422)
  })

  it('applies the same key sent twice at once only once', async () => {
    const po = await sentPo([{ itemId: f.sealant.id, packsOrdered: 2 }])
    const body = { lines: [{ poLineId: po.lines[0].id, binId: f.warehouse.bins.a2, qty: 7 }] }
    const key = newKey()
    const before = await onHand(f.sealant.id, f.warehouse.bins.a2)
    const both = await Promise.all([post(po.id, body, key), post(po.id, body, key)])
    // the second waits on the first's key and then answers with its stored reply (or asks to retry)
    expect(both.filter((r) => r.status === 201).length).toBeGreaterThanOrEqual(1)
    expect(both.every((r) => r.status === 201 || r.status === 409)).toBe(true)
    expect(await lineState(po.lines[0].id)).toEqual({ received: 7, damaged: 0 })
    expect(await onHand(f.sealant.id, f.warehouse.bins.a2)).toBe(before + 7)
    expect(await h.ds.query('SELECT COUNT(*) AS n FROM po_receipts WHERE po_id = ?', [po.id])).toEqual([{ n: '1' }])
  })

  it('lets only one of two submissions racing for the last open units through', async () => {
    const po = await sentPo([{ itemId: f.sealant.id, packsOrdered: 1 }]) // 12 open, allowance 2
    const lineId = po.lines[0].id
    const body = { lines: [{ poLineId: lineId, binId: f.warehouse.bins.a2, qty: 12 }] }
    const results = await Promise.all([post(po.id, body), post(po.id, body), post(po.id, body)])
    expect(results.map((r) => r.status).sort()).toEqual([201, 409, 409])
    expect(await lineState(lineId)).toEqual({ received: 12, damaged: 0 })
    // with a reason, racing over-receipts still can't pass the allowance (12 + 2)
    const po2 = await sentPo([{ itemId: f.sealant.id, packsOrdered: 1 }])
    const over = { lines: [{ poLineId: po2.lines[0].id, binId: f.warehouse.bins.a2, qty: 7, reason: 'Extra on the pallet' }] }
    const raced = await Promise.all([post(po2.id, over), post(po2.id, over), post(po2.id, over)])
    expect(raced.map((r) => r.status).sort()).toEqual([201, 201, 409])
    expect(await lineState(po2.lines[0].id)).toEqual({ received: 14, damaged: 0 })
  })
})
