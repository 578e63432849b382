// The buyer's intent before it becomes an order, and a draft's life until approval: accepted suggestions
// that can be changed or dismissed, new lines joining the open draft of their vendor and ship-to, an
// approval or edit made on an older view of the order refused, and totals too large for an order refused
// with a clear answer instead of a server error.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PoDetail, SuggestionView } from '../../shared/schemas/purchasingViews.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { createPurchasingFixture, suggestion, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: ApiHarness
let f: PurchasingFixture
beforeAll(async () => {
  h = await startApiHarness()
  f = await createPurchasingFixture(h.ds)
})
afterAll(() => h?.close())

const drafts = async (vendorId: number, warehouseId: number) =>
  Number((await h.ds.query(`SELECT COUNT(*) AS n FROM purchase_orders WHERE status = 'draft' AND vendor_id = ? AND warehouse_id = ? AND job_id IS NULL`, [vendorId, warehouseId]))[0].n)

describe('accepted suggestions before they are ordered', () => {
  it('can be given another quantity or dismissed, and not once ordered', async () => {
    const buyer = await h.as('buyer')
    const id = await suggestion(h.ds, { itemId: f.sealant.id, warehouseId: f.otherWarehouse.id, vendorId: f.vendorB, qty: 40, source: 'backorder' })
    const changed = await buyer.patch(`/api/purchase-orders/suggestions/${id}`).set(CSRF).send({ qty: 25 })
    expect(changed.status, JSON.stringify(changed.body)).toBe(200)
    expect((changed.body as SuggestionView[]).find((s) => s.id === id)).toMatchObject({ qty: 25, packs: 3 }) // 25 in packs of 10 → 3 (hand computed)
    const bad = await buyer.patch(`/api/purchase-orders/suggestions/${id}`).set(CSRF).send({ qty: 0 })
    expect(bad.status).toBe(400)
    expect(bad.body.error.fields).toHaveProperty('qty')
    const dismissed = await buyer.post(`/api/purchase-orders/suggestions/${id}/dismiss`).set(CSRF)
    expect(dismissed.status).toBe(200)
    expect((dismissed.body as SuggestionView[]).some((s) => s.id === id)).toBe(false)
    expect((await h.ds.query('SELECT status, qty FROM purchase_suggestions WHERE id = ?', [id]))[0]).toEqual({ status: 'dismissed', qty: 25 })
    expect((await buyer.patch(`/api/purchase-orders/suggestions/${id}`).set(CSRF).send({ qty: 5 })).body.error.code).toBe('suggestion_dismissed')

    const ordered = await suggestion(h.ds, { itemId: f.block.id, warehouseId: f.otherWarehouse.id, vendorId: f.vendorA, qty: 24, source: 'backorder' })
    expect((await buyer.post('/api/purchase-orders/from-suggestions').set(CSRF).send({ suggestionIds: [ordered] })).status).toBe(201)
    const late = await buyer.post(`/api/purchase-orders/suggestions/${ordered}/dismiss`).set(CSRF)
    expect(late.status).toBe(409)
    expect(late.body.error.code).toBe('suggestion_ordered')
    expect((await (await h.as('warehouse')).patch(`/api/purchase-orders/suggestions/${ordered}`).set(CSRF).send({ qty: 5 })).status).toBe(403)
  })
})

describe('the open draft of a vendor and ship-to', () => {
  it('takes new lines instead of a second draft: same item adds packs, a new item adds a line', async () => {
    const buyer = await h.as('buyer')
    const first = await suggestion(h.ds, { itemId: f.block.id, warehouseId: f.warehouse.id, vendorId: f.vendorA, qty: 50, source: 'backorder' })
    const [po] = (await buyer.post('/api/purchase-orders/from-suggestions').set(CSRF).send({ suggestionIds: [first] })).body as PoDetail[]
    expect(po.lines.map((l) => [l.sku, l.qtyOrdered])).toEqual([[f.block.sku, 72]]) // 50 → packs of 24, minimum 48 → 3 packs = 72
    const more = await suggestion(h.ds, { itemId: f.block.id, warehouseId: f.warehouse.id, vendorId: f.vendorA, qty: 10, source: 'backorder' })
    const other = await suggestion(h.ds, { itemId: f.sealant.id, warehouseId: f.warehouse.id, vendorId: f.vendorA, qty: 12, source: 'backorder' })
    const res = await buyer.post('/api/purchase-orders/from-suggestions').set(CSRF).send({ suggestionIds: [more, other] })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const [joined] = res.body as PoDetail[]
    expect(joined.id).toBe(po.id)
    // 10 more → 48 minimum → 2 packs, added to the 3 already there: 5 packs = 120; the sealant joins as line 2
    expect(joined.lines.map((l) => [l.lineNo, l.sku, l.qtyOrdered])).toEqual([[1, f.block.sku, 120], [2, f.sealant.sku, 12]])
    expect(await drafts(f.vendorA, f.warehouse.id)).toBe(1)
    const rows = await h.ds.query('SELECT status, po_line_id FROM purchase_suggestions WHERE id IN (?, ?, ?) ORDER BY id', [first, more, other])
    expect(rows.map((r: { status: string }) => r.status)).toEqual(['ordered', 'ordered', 'ordered'])
    expect(rows[0].po_line_id).toBe(rows[1].po_line_id)
  })

  it('is one draft even when two requests race for it', async () => {
    const buyer = await h.as('buyer')
    const admin = await h.as('admin')
    const a = await suggestion(h.ds, { itemId: f.sealant.id, warehouseId: f.otherWarehouse.id, vendorId: f.vendorB, qty: 10, source: 'backorder' })
    const b = await suggestion(h.ds, { itemId: f.sealant.id, warehouseId: f.otherWarehouse.id, vendorId: f.vendorB, qty: 10, source: 'backorder' })
    const both = await Promise.all([
      buyer.post('/api/purchase-orders/from-suggestions').set(CSRF).send({ suggestionIds: [a] }),
      admin.post('/api/purchase-orders/from-suggestions').set(CSRF).send({ suggestionIds: [b] }),
    ])
    expect(both.map((r) => r.status)).toEqual([201, 201])
    expect(await drafts(f.vendorB, f.otherWarehouse.id)).toBe(1)
  })
})

describe('a draft seen in two places', () => {
  async function draft(): Promise<PoDetail> {
    const res = await (await h.as('buyer')).post('/api/purchase-orders').set(CSRF)
      .send({ vendorId: f.vendorB, warehouseId: f.warehouse.id, lines: [{ itemId: f.sealant.id, packsOrdered: 1 }] })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    return res.body
  }

  it('refuses to approve an order that changed after the approver read it', async () => {
    const buyer = await h.as('buyer')
    const seen = await draft()
    const edited = await buyer.patch(`/api/purchase-orders/${seen.id}`).set(CSRF).send({ version: seen.version, lines: [{ id: seen.lines[0].id, packsOrdered: 4 }] })
    expect(edited.status, JSON.stringify(edited.body)).toBe(200)
    expect(edited.body.version).toBeGreaterThan(seen.version)
    const stale = await buyer.post(`/api/purchase-orders/${seen.id}/approve`).set(CSRF).send({ version: seen.version })
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('changed_meanwhile')
    expect((await buyer.get(`/api/purchase-orders/${seen.id}`)).body.status).toBe('draft')
    const current = await buyer.post(`/api/purchase-orders/${seen.id}/approve`).set(CSRF).send({ version: edited.body.version })
    expect(current.status).toBe(200)
    expect(current.body).toMatchObject({ status: 'approved' })
    expect(current.body.lines[0].qtyOrdered).toBe(40) // the 4 packs of 10 saved, not the 1 first read
  })

  it('refuses the second of two tabs saving the same draft, and keeps the first', async () => {
    const buyer = await h.as('buyer')
    const seen = await draft()
    const tabA = await buyer.patch(`/api/purchase-orders/${seen.id}`).set(CSRF).send({ version: seen.version, lines: [{ id: seen.lines[0].id, packsOrdered: 2 }] })
    expect(tabA.status).toBe(200)
    const tabB = await buyer.patch(`/api/purchase-orders/${seen.id}`).set(CSRF).send({ version: seen.version, lines: [{ id: seen.lines[0].id, packsOrdered: 9 }] })
    expect(tabB.status).toBe(409)
    expect(tabB.body.error.code).toBe('changed_meanwhile')
    expect((await buyer.get(`/api/purchase-orders/${seen.id}`)).body.lines[0].packsOrdered).toBe(2)
  })

  it('refuses an edit or an approval that does not say which version it was made on (400), writing nothing', async () => {
    const buyer = await h.as('buyer')
    const seen = await draft()
    const edit = await buyer.patch(`/api/purchase-orders/${seen.id}`).set(CSRF).send({ lines: [{ id: seen.lines[0].id, packsOrdered: 6 }] })
    expect(edit.status).toBe(400)
    expect(edit.body.error.fields.version).toBeTruthy()
    const approve = await buyer.post(`/api/purchase-orders/${seen.id}/approve`).set(CSRF).send({})
    expect(approve.status).toBe(400)
    expect(approve.body.error.fields.version).toBeTruthy()
    const [row] = await h.ds.query('SELECT status, version FROM purchase_orders WHERE id = ?', [seen.id])
    expect(row.status).toBe('draft')
    expect(Number(row.version)).toBe(seen.version)
    expect((await buyer.get(`/api/purchase-orders/${seen.id}`)).body.lines[0].packsOrdered).toBe(1)
  })
})

describe('totals too large for their column', () => {
  it('answers 400 for a new order and 409 for an edit, never 500, and writes nothing', async () => {
    const buyer = await h.as('buyer')
    // 1,000,000 units × 99,999,999.9999 ≈ 1e14, past the 999,999,999,999.99 a DECIMAL(14,2) total holds (MariaDB docs, DECIMAL)
    const huge = await buyer.post('/api/purchase-orders').set(CSRF)
      .send({ vendorId: f.vendorB, warehouseId: f.warehouse.id, lines: [{ itemId: f.sealant.id, packsOrdered: 100_000, unitCost: '99999999.9999' }] })
    expect(huge.status).toBe(400)
    expect(huge.body.error.code).toBe('order_total_too_large')
    const ok = await buyer.post('/api/purchase-orders').set(CSRF)
      .send({ vendorId: f.vendorB, warehouseId: f.otherWarehouse.id, lines: [{ itemId: f.sealant.id, packsOrdered: 1, unitCost: '99999999.9999' }] })
    expect(ok.status).toBe(201)
    const grow = await buyer.patch(`/api/purchase-orders/${ok.body.id}`).set(CSRF).send({ version: ok.body.version, lines: [{ id: ok.body.lines[0].id, packsOrdered: 100_000 }] })
    expect(grow.status).toBe(409)
    expect(grow.body.error.code).toBe('order_total_too_large')
    expect((await buyer.get(`/api/purchase-orders/${ok.body.id}`)).body.lines[0].packsOrdered).toBe(1)
  })

  it('answers 409 when a receipt would take a bin past what a balance can hold', async () => {
    const crew = await h.as('warehouse')
    const first = await crew.post('/api/stock/receipts').set(CSRF)
      .send({ warehouseId: f.warehouse.id, lines: [{ itemId: f.sealant.id, binId: f.warehouse.bins.a2, qty: 1, unitCost: '1.0000' }] })
    expect(first.status, JSON.stringify(first.body)).toBe(201)
    // A balance column is a signed 32-bit INT: at most 2,147,483,647 (MariaDB docs, INT)
    await h.ds.query('UPDATE stock_balances SET on_hand = 2147483000 WHERE item_id = ? AND bin_id = ?', [f.sealant.id, f.warehouse.bins.a2])
    const moves = Number((await h.ds.query('SELECT COUNT(*) AS n FROM stock_moves WHERE item_id = ?', [f.sealant.id]))[0].n)
    const over = await crew.post('/api/stock/receipts').set(CSRF)
      .send({ warehouseId: f.warehouse.id, lines: [{ itemId: f.sealant.id, binId: f.warehouse.bins.a2, qty: 1000, unitCost: '1.0000' }] })
    expect(over.status).toBe(409)
    expect(over.body.error.code).toBe('value_out_of_range')
    expect(Number((await h.ds.query('SELECT COUNT(*) AS n FROM stock_moves WHERE item_id = ?', [f.sealant.id]))[0].n)).toBe(moves)
    await h.ds.query('UPDATE stock_balances SET on_hand = 1 WHERE item_id = ? AND bin_id = ?', [f.sealant.id, f.warehouse.bins.a2])
  })
})
