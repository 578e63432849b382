// Feature: sales orders at the counter (server/routes/salesOrders.ts) against the real MariaDB: taking a
// quote books an order that holds exactly the quoted quantities (read back from stock_balances and
// stock_reservations), raises the made-to-order base as a special-order PO line, asks a deposit on that
// line, and keeps the PO from going to the vendor until the deposit is paid; a double submit books one
// order; a cheque needs its number; cancelling releases the holds once.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type supertest from 'supertest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, insertId } from '../support/fixtureRows.js'
import { receive } from '../support/pickFixtures.js'
import { approveAsShown, vendor, vendorItem } from '../support/purchasingFixtures.js'
import { billFor, createSalesFixture, type SalesFixture } from '../support/salesFixtures.js'

let h: ApiHarness
let counter: supertest.Agent
let buyer: supertest.Agent
let fx: SalesFixture
let quoteId: number
let orderId: number
let billId: number

/** Σ reserved of an item in the fixture's warehouse, straight from the balances table. */
async function reservedOf(itemId: number): Promise<number> {
  const [row]: { r: string | null }[] = await h.ds.query('SELECT SUM(reserved) AS r FROM stock_balances WHERE item_id = ? AND warehouse_id = ?', [itemId, fx.warehouseId])
  return Number(row.r ?? 0)
}
async function heldByOrder(id: number, itemId: number): Promise<number> {
  const [row]: { q: string | null }[] = await h.ds.query("SELECT SUM(qty) AS q FROM stock_reservations WHERE doc_type = 'sales_order' AND doc_id = ? AND item_id = ?", [id, itemId])
  return Number(row.q ?? 0)
}

beforeAll(async () => {
  h = await startApiHarness()
  counter = await h.as('counter')
  buyer = await h.as('buyer')
  fx = await createSalesFixture(h.ds)
  // The account's level: 15 % off list, so the base sells at 895.00 × 0.85 = 760.75 (hand-worked).
  const level = await insertId(h.ds, "INSERT INTO price_levels (code, name, percent_off) VALUES (?, 'Contractor', 15)", [`O${fx.tag}`])
  await h.ds.query('INSERT INTO customer_terms (customer_id, price_level_id) VALUES (?, ?)', [fx.customerId, level])
  const v = await vendor(h.ds, `VB${fx.tag}`)
  await vendorItem(h.ds, v, fx.base.id, { sku: `BASE-${fx.tag}`, pack: 1, min: 1, cost: '410.00', preferred: true })
  // Stock in through the stock API: blocks split over two bins (100 + 60), spacers 400.
  const warehouse = await h.as('warehouse')
  await receive(warehouse, fx.warehouseId, [
    { itemId: fx.block.id, binId: fx.bins['C-01-1'], qty: 100 },
    { itemId: fx.block.id, binId: fx.bins['C-01-2'], qty: 60 },
    { itemId: fx.spacers.id, binId: fx.bins['C-01-1'], qty: 400 },
  ])
  const bill = await billFor(h.ds, fx, 1, 120)
  billId = bill
  const quote = await counter.post('/api/quotes').set(CSRF).send({ bomId: bill, warehouseId: fx.warehouseId })
  expect(quote.status, JSON.stringify(quote.body)).toBe(201)
  quoteId = quote.body.id
  // Offered by hand (handed over the counter): the e-mail path is the quotes' own test.
  await h.ds.query("UPDATE quotes SET status = 'offered', offered_at = NOW() WHERE id = ?", [quoteId])
})
afterAll(async () => {
  await h?.close()
})

describe('taking a quote', () => {
  it('a draft quote cannot be taken (409, no order)', async () => {
    const draft = await counter.post('/api/quotes').set(CSRF).send({ customerId: fx.customerId, warehouseId: fx.warehouseId, lines: [{ itemId: fx.block.id, qty: 2 }] })
    const res = await counter.post('/api/sales-orders').set(CSRF).send({ quoteId: draft.body.id })
    expect(res.status).toBe(409)
    expect(res.body.error).toMatchObject({ code: 'quote_wrong_status', params: { quoteStatus: 'draft' } })
    expect(await countRows(h.ds, 'sales_orders', 'quote_id = ?', [draft.body.id])).toBe(0)
  })

  it('submitted twice at once books one order, holding exactly the quoted 120 blocks and 300 spacers', async () => {
    const [a, b] = await Promise.all([
      counter.post('/api/sales-orders').set(CSRF).send({ quoteId }),
      counter.post('/api/sales-orders').set(CSRF).send({ quoteId }),
    ])
    expect([a.status, b.status], JSON.stringify([a.body, b.body])).toEqual([201, 201])
    expect(a.body.id).toBe(b.body.id)
    expect([a.body.created, b.body.created].sort()).toEqual([false, true])
    orderId = a.body.id
    expect(await countRows(h.ds, 'sales_orders', 'quote_id = ?', [quoteId])).toBe(1)
    // 120 blocks asked; 250 spacers quoted as 3 cases of 100 = 300 (the quote's own figures).
    expect(await reservedOf(fx.block.id)).toBe(120)
    expect(await reservedOf(fx.spacers.id)).toBe(300)
    expect(await heldByOrder(orderId, fx.block.id)).toBe(120)
    expect(await heldByOrder(orderId, fx.spacers.id)).toBe(300)
    // The base is made to order: nothing of it is held.
    expect(await heldByOrder(orderId, fx.base.id)).toBe(0)
    const quote = await counter.get(`/api/quotes/${quoteId}`)
    expect(quote.body.status).toBe('taken')
    // the quote names the one order it became (the counter's quote screen links to it)
    expect(quote.body.salesOrderId).toBe(orderId)
  })

  it('a third submit later answers the same order and holds nothing more', async () => {
    const again = await counter.post('/api/sales-orders').set(CSRF).send({ quoteId })
    expect(again.body).toMatchObject({ id: orderId, created: false })
    expect(await reservedOf(fx.block.id)).toBe(120)
  })

  it('the order carries the lines, their holds and the deposit: 50 % of 760.75 = 380.375 → 380.38', async () => {
    const res = await counter.get(`/api/sales-orders/${orderId}`)
    expect(res.status).toBe(200)
    expect(res.body.number).toMatch(/^SO-\d{4}-\d{5}$/)
    // The buyer's list of orders waiting on special orders finds it; a search by its number too.
    const specials = await buyer.get('/api/sales-orders?specialOnly=true')
    expect(specials.body.map((o: { id: number }) => o.id)).toContain(orderId)
    const found = await counter.get(`/api/sales-orders?q=${res.body.number}`)
    expect(found.body.map((o: { id: number }) => o.id)).toEqual([orderId])
    const [block, spacers, base] = res.body.lines
    expect(block).toMatchObject({ qty: 120, qtyReserved: 120, madeToOrder: false, poLineId: null })
    expect(spacers).toMatchObject({ qty: 300, qtyReserved: 300 })
    expect(base).toMatchObject({ qty: 1, qtyReserved: 0, madeToOrder: true, extension: '760.75', poStatus: 'draft' })
    // Deposit on made-to-order lines, default 50 %, rounded half up to the cent (common practice).
    expect(res.body).toMatchObject({ depositPercent: '50.00', depositRequired: '380.38', depositPaid: '0.00', depositDue: '380.38', status: 'booked' })
    // The lines' tax parts add up to the document's tax.
    const taxSum = res.body.lines.reduce((s: number, l: { tax: string }) => s + Math.round(Number(l.tax) * 100), 0)
    expect(taxSum).toBe(Math.round(Number(res.body.taxAmount) * 100))
  })

  it('the made-to-order base raised a special-order PO line of the order, one unit at the vendor', async () => {
    const [line]: { po_id: number; item_id: number; qty_ordered: number; bom_line_id: number | null }[] = await h.ds.query(
      'SELECT pl.po_id, pl.item_id, pl.qty_ordered, pl.bom_line_id FROM sales_order_lines sl JOIN purchase_order_lines pl ON pl.id = sl.po_line_id WHERE sl.sales_order_id = ?',
      [orderId],
    )
    expect(line).toMatchObject({ item_id: fx.base.id, qty_ordered: 1 })
    expect(line.bom_line_id).not.toBeNull()
  })
})

describe('deposit before the special order goes out', () => {
  let poId: number
  it('the PO is approved but refused as sent while the deposit is unpaid (409 deposit_not_paid)', async () => {
    const [row]: { po_id: number }[] = await h.ds.query('SELECT pl.po_id FROM sales_order_lines sl JOIN purchase_order_lines pl ON pl.id = sl.po_line_id WHERE sl.sales_order_id = ?', [orderId])
    poId = row.po_id
    expect((await approveAsShown(buyer, poId)).status).toBe(200)
    const refused = await buyer.post(`/api/purchase-orders/${poId}/mark-sent`).set(CSRF).send({})
    expect(refused.status).toBe(409)
    expect(refused.body.error).toMatchObject({ code: 'deposit_not_paid', params: { required: '380.38', paid: '0.00' } })
    const [po]: { status: string }[] = await h.ds.query('SELECT status FROM purchase_orders WHERE id = ?', [poId])
    expect(po.status).toBe('approved')
  })

  it('a cheque needs its number; bad amounts are refused; nothing is recorded', async () => {
    const noNumber = await counter.post(`/api/sales-orders/${orderId}/payments`).set(CSRF).send({ method: 'cheque', amount: '380.38' })
    expect(noNumber.status).toBe(400)
    expect(noNumber.body.error.fields.reference.code).toBe('cheque_number_needed')
    for (const amount of ['0', '-5', '1,5', '7 3/4', '1e9']) {
      const bad = await counter.post(`/api/sales-orders/${orderId}/payments`).set(CSRF).send({ method: 'cash', amount })
      expect(bad.status, amount).toBe(400)
    }
    const over = await counter.post(`/api/sales-orders/${orderId}/payments`).set(CSRF).send({ method: 'cash', amount: '99999999.00' })
    expect(over.status).toBe(409)
    expect(over.body.error.code).toBe('payment_over_balance')
    expect(await countRows(h.ds, 'payments', 'sales_order_id = ?', [orderId])).toBe(0)
  })

  it('a cheque for the deposit is recorded (deposit_paid in the same write) and the PO may then be sent', async () => {
    const viewer = await h.as('viewer')
    expect((await viewer.post(`/api/sales-orders/${orderId}/payments`).set(CSRF).send({ method: 'cash', amount: '1.00' })).status).toBe(403)
    const paid = await counter.post(`/api/sales-orders/${orderId}/payments`).set(CSRF).set('Idempotency-Key', `pay-${fx.tag}-1`).send({ method: 'cheque', amount: '380.38', reference: '004211' })
    expect(paid.status, JSON.stringify(paid.body)).toBe(201)
    // The same key again records nothing more.
    const replay = await counter.post(`/api/sales-orders/${orderId}/payments`).set(CSRF).set('Idempotency-Key', `pay-${fx.tag}-1`).send({ method: 'cheque', amount: '380.38', reference: '004211' })
    expect(replay.body.id).toBe(paid.body.id)
    const [order]: { deposit_paid: string }[] = await h.ds.query('SELECT deposit_paid FROM sales_orders WHERE id = ?', [orderId])
    expect(order.deposit_paid).toBe('380.38')
    const detail = await counter.get(`/api/sales-orders/${orderId}`)
    expect(detail.body).toMatchObject({ depositDue: '0.00', payments: [{ method: 'cheque', amount: '380.38', reference: '004211', status: 'settled' }] })
    const sent = await buyer.post(`/api/purchase-orders/${poId}/mark-sent`).set(CSRF).send({})
    expect(sent.status, JSON.stringify(sent.body)).toBe(200)
    expect(sent.body.status).toBe('sent')
  })
})

describe('the made-to-order base arrives', () => {
  it('received on its PO through the warehouse, it is held for the order (not issued), audited, and no one else can take it', async () => {
    const [line]: { id: number; po_id: number; po_line_id: number }[] = await h.ds.query(
      'SELECT sl.id, pl.po_id, sl.po_line_id FROM sales_order_lines sl JOIN purchase_order_lines pl ON pl.id = sl.po_line_id WHERE sl.sales_order_id = ?', [orderId],
    )
    const warehouse = await h.as('warehouse')
    const res = await warehouse.post(`/api/purchase-orders/${line.po_id}/receipts`).set(CSRF).set('Idempotency-Key', `base-${fx.tag}`)
      .send({ lines: [{ poLineId: line.po_line_id, binId: fx.bins['C-01-2'], qty: 1, lotCode: 'MADE-1' }] })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    // On the shelf, one unit, and all of it held for this order's line (common practice: a special order is the
    // customer's goods from the day it arrives).
    const [bal]: { on_hand: number; reserved: number }[] = await h.ds.query('SELECT SUM(on_hand) AS on_hand, SUM(reserved) AS reserved FROM stock_balances WHERE item_id = ?', [fx.base.id])
    expect({ onHand: Number(bal.on_hand), reserved: Number(bal.reserved) }).toEqual({ onHand: 1, reserved: 1 })
    expect(await heldByOrder(orderId, fx.base.id)).toBe(1)
    const [ol]: { qty_reserved: number }[] = await h.ds.query('SELECT qty_reserved FROM sales_order_lines WHERE id = ?', [line.id])
    expect(Number(ol.qty_reserved)).toBe(1)
    expect(await countRows(h.ds, 'stock_moves', "item_id = ? AND move_type = 'issue'", [fx.base.id])).toBe(0)
    expect(await countRows(h.ds, 'audit_entries', "action = 'sales_order.special_held' AND entity_id = ?", [String(orderId)])).toBe(1)
    // Nothing of it is free: the stock levels count it held, so no other list can reserve it.
    const levels = await counter.get(`/api/stock/levels?itemId=${fx.base.id}&warehouseId=${fx.warehouseId}`)
    const row = levels.body.rows.find((r: { itemId: number }) => r.itemId === fx.base.id)
    expect(row).toMatchObject({ onHand: 1, reserved: 1, available: 0 })
  })
})

describe('a pick list from the bill the order was sold from', () => {
  // common practice: one set of goods is held once; the order's own pick list carries its holds, so a second
  // list straight from the bill would reserve the same blocks again.
  it('is refused (409 bill_on_sales_order, naming the order), plans nothing and holds nothing more', async () => {
    const [order]: { number: string }[] = await h.ds.query('SELECT number FROM sales_orders WHERE id = ?', [orderId])
    const lists = await countRows(h.ds, 'pick_lists', 'bom_id = ?', [billId])
    const held = await reservedOf(fx.block.id)
    const plan = await counter.post('/api/pick-lists/plan').set(CSRF).send({ bomId: billId, warehouseId: fx.warehouseId })
    expect(plan.status, JSON.stringify(plan.body)).toBe(409)
    expect(plan.body.error).toMatchObject({ code: 'bill_on_sales_order', params: { order: order.number, orderId } })
    const made = await counter.post('/api/pick-lists').set(CSRF).set('Idempotency-Key', `sold-${fx.tag}`).send({ bomId: billId, warehouseId: fx.warehouseId })
    expect(made.status, JSON.stringify(made.body)).toBe(409)
    expect(made.body.error.code).toBe('bill_on_sales_order')
    expect(await countRows(h.ds, 'pick_lists', 'bom_id = ?', [billId])).toBe(lists)
    expect(await reservedOf(fx.block.id)).toBe(held)
    // The bill's page names the order, so the clerk goes there instead.
    const bom = await counter.get(`/api/boms/${billId}`)
    expect(bom.body.salesOrder).toEqual({ id: orderId, number: order.number })
    const offered = await counter.get('/api/pick-lists/boms')
    expect(offered.body.map((b: { bomId: number }) => b.bomId)).not.toContain(billId)
  })
})

describe('cancelling', () => {
  it('releases the holds once: a second cancel is refused and changes nothing', async () => {
    const warehouse = await h.as('warehouse')
    expect((await warehouse.get(`/api/sales-orders/${orderId}`)).status).toBe(200)
    expect((await warehouse.post(`/api/sales-orders/${orderId}/cancel`).set(CSRF).send({ reason: 'x' })).status).toBe(403)
    expect((await counter.post(`/api/sales-orders/${orderId}/cancel`).set(CSRF).send({ reason: ' ' })).status).toBe(400)
    const res = await counter.post(`/api/sales-orders/${orderId}/cancel`).set(CSRF).send({ reason: 'Contractor postponed the job' })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    // 120 blocks + 300 spacers held at booking, and the base held when it arrived: 421.
    expect(res.body.released).toBe(421)
    expect(await reservedOf(fx.block.id)).toBe(0)
    expect(await reservedOf(fx.spacers.id)).toBe(0)
    const again = await counter.post(`/api/sales-orders/${orderId}/cancel`).set(CSRF).send({ reason: 'Again' })
    expect(again.status).toBe(409)
    expect(again.body.error).toMatchObject({ code: 'sales_order_wrong_status', params: { orderStatus: 'cancelled' } })
    expect(await reservedOf(fx.block.id)).toBe(0)
    // On hand never moved: holding and releasing are not stock moves.
    const [onHand]: { q: string }[] = await h.ds.query('SELECT SUM(on_hand) AS q FROM stock_balances WHERE item_id = ? AND warehouse_id = ?', [fx.block.id, fx.warehouseId])
    expect(Number(onHand.q)).toBe(160)
    expect(await countRows(h.ds, 'audit_entries', "entity = 'sales_order' AND entity_id = ? AND action IN ('sales_order.create', 'payment.record', 'sales_order.cancel')", [String(orderId)])).toBe(3)
    // Once the order is cancelled it holds nothing, and the bill may be picked on a list of its own again.
    const plan = await counter.post('/api/pick-lists/plan').set(CSRF).send({ bomId: billId, warehouseId: fx.warehouseId })
    expect(plan.status, JSON.stringify(plan.body)).toBe(200)
    expect((await counter.get(`/api/boms/${billId}`)).body.salesOrder).toBeNull()
    expect((await counter.get('/api/pick-lists/boms')).body.map((b: { bomId: number }) => b.bomId)).toContain(billId)
  })
})

describe('the deposit setting', () => {
  it('the admin sets it (a percent 0–100, two decimals); the counter reads it and cannot change it', async () => {
    const admin = await h.as('admin')
    const before = await counter.get('/api/sales-settings')
    expect(before.status).toBe(200)
    for (const bad of ['101', '-1', '1,5', 'half']) {
      expect((await admin.patch('/api/sales-settings').set(CSRF).send({ depositPercent: bad })).status, bad).toBe(400)
    }
    expect((await counter.patch('/api/sales-settings').set(CSRF).send({ depositPercent: '40' })).status).toBe(403)
    const set = await admin.patch('/api/sales-settings').set(CSRF).send({ depositPercent: '40' })
    expect(set.body).toMatchObject({ depositPercent: '40' })
    expect((await counter.get('/api/sales-settings')).body).toMatchObject({ depositPercent: '40' })
    await admin.patch('/api/sales-settings').set(CSRF).send({ depositPercent: before.body.depositPercent })
  })
})
