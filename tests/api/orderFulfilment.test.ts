// Feature: fulfilling a sales order (server/routes/handoverTickets.ts, the picking service) against the real
// MariaDB and the SMTP mail fake: the order's holds become its pick list's reservation without reserving
// anything twice; confirmations fill qty_picked; completing the pick leaves the order ready, backorders what
// was short and e-mails the contractor once; a signed handover ticket issues its stock exactly once even when
// signed twice or twice at once (the ledger equals the balances after); partial pickups leave the rest on the
// order; the order closes when every line is handed over or cancelled; the PDF carries the signature.
import { execFile } from 'node:child_process'
import { mkdtemp, rm, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { promisify } from 'node:util'
import { randomUUID } from 'node:crypto'
import { simpleParser } from 'mailparser'
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startSmtpFake, type SmtpFake } from '../../server/fakes/smtpFake.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows } from '../support/fixtureRows.js'
import { pdfText } from '../support/pdfText.js'
import { ledgerMismatches, receive } from '../support/pickFixtures.js'
import { signatureDataUrl } from '../support/returnFixtures.js'
import { billFor, createSalesFixture, type SalesFixture } from '../support/salesFixtures.js'

let smtp: SmtpFake
let h: ApiHarness
let counter: supertest.Agent
let crew: supertest.Agent
let viewer: supertest.Agent
let fx: SalesFixture
let orderId: number
let listId: number
let email: string

const fulfilment = async () => (await counter.get(`/api/sales-orders/${orderId}/fulfilment`)).body
const lineOf = (f: { lines: { itemId: number }[] }, itemId: number) => f.lines.find((l) => l.itemId === itemId) as Record<string, number>
async function heldAs(docType: string, itemId: number): Promise<number> {
  const [row]: { q: string | null }[] = await h.ds.query('SELECT SUM(qty) AS q FROM stock_reservations WHERE doc_type = ? AND item_id = ?', [docType, itemId])
  return Number(row.q ?? 0)
}
async function balance(itemId: number): Promise<{ onHand: number; reserved: number }> {
  const [row]: { o: string; r: string }[] = await h.ds.query('SELECT COALESCE(SUM(on_hand), 0) AS o, COALESCE(SUM(reserved), 0) AS r FROM stock_balances WHERE item_id = ?', [itemId])
  return { onHand: Number(row.o), reserved: Number(row.r) }
}
const ticketMoves = (ticketId: number) => countRows(h.ds, 'stock_moves', "doc_type = 'handover_ticket' AND doc_id = ?", [ticketId])
const sign = (ticketId: number, agent = counter, key: string = randomUUID()) =>
  agent.post(`/api/handover-tickets/${ticketId}/sign`).set(CSRF).set('Idempotency-Key', key).send({ signerName: 'Dario Kessel', signature: signatureDataUrl() })

beforeAll(async () => {
  smtp = await startSmtpFake({ port: 0 })
  h = await startApiHarness({ LUMENYARD_SMTP_PORT: String(smtp.port), LUMENYARD_SMTP_HOST: '127.0.0.1', LUMENYARD_SMTP_SECURE: 'false' })
  counter = await h.as('counter')
  crew = await h.as('warehouse')
  viewer = await h.as('viewer')
  fx = await createSalesFixture(h.ds)
  email = `yard-${fx.tag.toLowerCase()}@contractor.example`
  await h.ds.query('UPDATE customers SET email = ?, contact_name = ? WHERE id = ?', [email, 'Marisol Trent', fx.customerId])
  // 100 blocks on the shelf for 120 ordered: 20 cannot be held when the order is booked.
  await receive(crew, fx.warehouseId, [
    { itemId: fx.block.id, binId: fx.bins['C-01-1'], qty: 100 },
    { itemId: fx.spacers.id, binId: fx.bins['C-01-2'], qty: 400 },
  ])
  const bill = await billFor(h.ds, fx, 1, 120)
  const quote = await counter.post('/api/quotes').set(CSRF).send({ bomId: bill, warehouseId: fx.warehouseId })
  expect(quote.status, JSON.stringify(quote.body)).toBe(201)
  await h.ds.query("UPDATE quotes SET status = 'offered', offered_at = NOW() WHERE id = ?", [quote.body.id])
  const order = await counter.post('/api/sales-orders').set(CSRF).send({ quoteId: quote.body.id })
  expect(order.status, JSON.stringify(order.body)).toBe(201)
  orderId = order.body.id
})
afterAll(async () => {
  await h?.close()
  await smtp?.close()
})

describe('the pick list starts from the order', () => {
  it('passes the order holds to the pick list: nothing is reserved twice', async () => {
    // Booked: 100 blocks held (all there is) and 3 cases of 100 spacers = 300 (hand-worked from the quote).
    expect(await balance(fx.block.id)).toEqual({ onHand: 100, reserved: 100 })
    const res = await counter.post(`/api/sales-orders/${orderId}/pick-lists`).set(CSRF).set('Idempotency-Key', randomUUID())
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    listId = res.body.pickListId
    expect(res.body.qty).toBe(400)
    // The same units are held, now by the list: balances' reserved unchanged, the order's holds gone.
    expect(await balance(fx.block.id)).toEqual({ onHand: 100, reserved: 100 })
    expect(await balance(fx.spacers.id)).toEqual({ onHand: 400, reserved: 300 })
    expect(await heldAs('pick_list', fx.block.id)).toBe(100)
    expect(await heldAs('sales_order', fx.block.id)).toBe(0)
    // common practice: a balance's reserved equals the sum of its reservation rows
    expect(await ledgerMismatches(h.ds, [fx.block.id, fx.spacers.id])).toEqual([])
    // The order's own view: what went to the list is still held for it, not missing. Of the 120 blocks ordered,
    // 100 are on the list and 20 are short (no more on the shelf); the 300 spacers are all on the list.
    const lines = (await counter.get(`/api/sales-orders/${orderId}`)).body.lines as Record<string, number>[]
    expect(lines.find((l) => l.itemId === fx.block.id)).toMatchObject({ qty: 120, qtyReserved: 0, qtyOnPickList: 100, qtyShort: 20 })
    expect(lines.find((l) => l.itemId === fx.spacers.id)).toMatchObject({ qty: 300, qtyReserved: 0, qtyOnPickList: 300, qtyShort: 0 })
  })

  it('refuses a second list while the first is open, and the buyer or the warehouse cannot send one', async () => {
    const again = await counter.post(`/api/sales-orders/${orderId}/pick-lists`).set(CSRF)
    expect(again.status).toBe(409)
    expect(again.body.error.code).toBe('order_pick_open')
    expect((await (await h.as('buyer')).post(`/api/sales-orders/${orderId}/pick-lists`).set(CSRF)).status).toBe(403)
    expect((await crew.post(`/api/sales-orders/${orderId}/pick-lists`).set(CSRF)).status).toBe(403)
    expect(await countRows(h.ds, 'pick_lists', 'sales_order_id = ?', [orderId])).toBe(1)
  })

  it('fills qty_picked as the warehouse confirms, and the warehouse sees the list', async () => {
    const list = await crew.get(`/api/pick-lists/${listId}`)
    expect(list.status).toBe(200)
    expect(list.body.salesOrderId).toBe(orderId)
    const lines = list.body.lines as { id: number; itemId: number; binCode: string; qty: number }[]
    const blocks = lines.find((l) => l.itemId === fx.block.id)!
    const spacers = lines.find((l) => l.itemId === fx.spacers.id)!
    const confirm = (line: typeof blocks, sku: string, qty: number) =>
      crew.post(`/api/pick-lists/${listId}/confirmations`).set(CSRF).set('Idempotency-Key', randomUUID()).send({ lineId: line.id, binScan: `B:${line.binCode}`, itemScan: sku, qty })
    expect((await confirm(blocks, fx.block.sku, 90)).status).toBe(201)
    expect((await confirm(spacers, fx.spacers.sku, 300)).status).toBe(201)
    const f = await fulfilment()
    expect(lineOf(f, fx.block.id)).toMatchObject({ picked: 90, onPickList: 10 })
    expect(lineOf(f, fx.spacers.id)).toMatchObject({ picked: 300, onPickList: 0 })
    expect(f.status).toBe('booked')
  })
})

describe('when the pick is complete', () => {
  it('the order is ready, the short blocks are backordered, nothing is issued, and the contractor is e-mailed once', async () => {
    const before = smtp.messages.length
    const key = randomUUID()
    const done = await crew.post(`/api/pick-lists/${listId}/complete`).set(CSRF).set('Idempotency-Key', key).send({ acceptShort: true })
    expect(done.status, JSON.stringify(done.body)).toBe(200)
    // Replayed completion: same answer, no second e-mail.
    expect((await crew.post(`/api/pick-lists/${listId}/complete`).set(CSRF).set('Idempotency-Key', key).send({ acceptShort: true })).status).toBe(200)
    const f = await fulfilment()
    expect(f.status).toBe('ready')
    // 120 ordered − 90 picked = 30 backordered (hand-worked); 90 picked wait at the counter.
    expect(lineOf(f, fx.block.id)).toMatchObject({ picked: 90, waiting: 90, backordered: 30, handedOver: 0 })
    expect(await countRows(h.ds, 'purchase_suggestions', "item_id = ? AND source = 'backorder' AND qty = 30", [fx.block.id])).toBe(1)
    // Still on the shelf, held for the order: on hand 100, reserved 90 (the 10 not found given back).
    expect(await balance(fx.block.id)).toEqual({ onHand: 100, reserved: 90 })
    expect(await heldAs('order_picked', fx.block.id)).toBe(90)
    expect(await countRows(h.ds, 'stock_moves', "doc_type = 'pick_list' AND doc_id = ?", [listId])).toBe(0)
    expect(smtp.messages.length).toBe(before + 1)
    const mail = await simpleParser(smtp.messages[smtp.messages.length - 1].raw)
    expect(mail.to && 'text' in mail.to ? mail.to.text : '').toContain(email)
    expect(mail.subject).toContain(f.orderNumber)
    expect(mail.text).toContain('backordered')
    expect(mail.text).toMatch(/two people/)
    expect(await countRows(h.ds, 'outbox_messages', "sales_order_id = ? AND status = 'sent'", [orderId])).toBe(1)
  })
})

describe('handover tickets', () => {
  let ticketId: number

  it('refuses bad quantities and more than is waiting, writing nothing', async () => {
    const tickets = await countRows(h.ds, 'handover_tickets', 'sales_order_id = ?', [orderId])
    for (const qty of [0, -3, 1e9, '1,5', '7 3/4']) {
      const res = await counter.post(`/api/sales-orders/${orderId}/tickets`).set(CSRF).send({ kind: 'pickup', lines: [{ salesOrderLineId: lineOf(await fulfilment(), fx.block.id).id, qty }] })
      expect(res.status, String(qty)).toBe(400)
    }
    const over = await counter.post(`/api/sales-orders/${orderId}/tickets`).set(CSRF).send({ kind: 'pickup', lines: [{ salesOrderLineId: lineOf(await fulfilment(), fx.block.id).id, qty: 91 }] })
    expect(over.status).toBe(409)
    expect(over.body.error).toMatchObject({ code: 'ticket_over', params: { sku: fx.block.sku, left: 90 } })
    const noAddress = await counter.post(`/api/sales-orders/${orderId}/tickets`).set(CSRF).send({ kind: 'delivery', lines: [{ salesOrderLineId: lineOf(await fulfilment(), fx.block.id).id, qty: 1 }] })
    expect(noAddress.status).toBe(400)
    expect((await viewer.post(`/api/sales-orders/${orderId}/tickets`).set(CSRF).send({ kind: 'pickup', lines: [] })).status).toBe(403)
    expect(await countRows(h.ds, 'handover_tickets', 'sales_order_id = ?', [orderId])).toBe(tickets)
  })

  it('a partial pickup: 50 of 90 blocks and all spacers; signed twice at once, the stock leaves once', async () => {
    const f = await fulfilment()
    const made = await counter.post(`/api/sales-orders/${orderId}/tickets`).set(CSRF).set('Idempotency-Key', randomUUID()).send({
      kind: 'pickup', lines: [{ salesOrderLineId: lineOf(f, fx.block.id).id, qty: 50 }, { salesOrderLineId: lineOf(f, fx.spacers.id).id, qty: 300 }],
    })
    expect(made.status, JSON.stringify(made.body)).toBe(201)
    ticketId = made.body.id
    const detail = await crew.get(`/api/handover-tickets/${ticketId}`)
    expect(detail.status).toBe(200)
    // 50 blocks × 2.7 kg = 135.0 kg (hand-worked from the fixture's unit weight).
    expect(detail.body.lines.find((l: { sku: string }) => l.sku === fx.block.sku)).toMatchObject({ qty: 50, binCode: 'C-01-1', totalKg: '135.0' })
    // Not a PNG: refused, the ticket stays open (PNG specification: the 8-byte signature 89 50 4E 47 0D 0A 1A 0A).
    const bad = await counter.post(`/api/handover-tickets/${ticketId}/sign`).set(CSRF).send({ signerName: 'X', signature: `data:image/png;base64,${Buffer.from('GIF89a'.repeat(20)).toString('base64')}` })
    expect(bad.status).toBe(400)
    expect(bad.body.error.code).toBe('signature_invalid')
    // The counter and the warehouse tablet sign at the same moment, with different keys.
    const [a, b] = await Promise.all([sign(ticketId, counter), sign(ticketId, crew)])
    expect([a.status, b.status], JSON.stringify([a.body, b.body])).toEqual([200, 200])
    expect([a.body.replayed, b.body.replayed].sort()).toEqual([false, true])
    expect(a.body.issued + b.body.issued).toBe(350)
    expect(await ticketMoves(ticketId)).toBe(2)
    // And once more later, same key as none before: still two moves.
    expect((await sign(ticketId)).body.replayed).toBe(true)
    expect(await ticketMoves(ticketId)).toBe(2)
    // common practice (perpetual inventory): on hand equals the sum of the ledger's moves, reserved the sum of holds
    expect(await ledgerMismatches(h.ds, [fx.block.id, fx.spacers.id])).toEqual([])
    expect(await balance(fx.block.id)).toEqual({ onHand: 50, reserved: 40 })
    expect(await balance(fx.spacers.id)).toEqual({ onHand: 100, reserved: 0 })
    const after = await fulfilment()
    expect(lineOf(after, fx.block.id)).toMatchObject({ handedOver: 50, waiting: 40, backordered: 30 })
    expect(after.status).toBe('ready') // 40 blocks still wait
  })

  it('prints the ticket with lots, weights, the lifting caution and the signature image', async () => {
    const res = await viewer.get(`/api/handover-tickets/${ticketId}/pdf`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = []
      r.on('data', (c: Buffer) => chunks.push(c))
      r.on('end', () => cb(null, Buffer.concat(chunks)))
    })
    expect(res.status).toBe(200)
    const text = (await pdfText(res.body as Buffer)).replace(/\s+/g, ' ')
    expect(text).toContain(`Pickup ticket HT-${String(ticketId).padStart(5, '0')}`)
    expect(text).toContain('135.0 kg')
    expect(text).toContain('Dario Kessel')
    expect(text).toMatch(/23 kg is lifted by two people/)
    // poppler's pdfimages lists the embedded images: the 300 × 100 signature is one of them.
    const dir = await mkdtemp(path.join(tmpdir(), 'ly-ticket-'))
    try {
      await writeFile(path.join(dir, 't.pdf'), res.body as Buffer)
      const { stdout } = await promisify(execFile)('pdfimages', ['-list', path.join(dir, 't.pdf')])
      expect(stdout).toMatch(/\s300\s+100\s/)
    } finally {
      await rm(dir, { recursive: true, force: true })
    }
  })

  it('the rest is picked up on a second ticket; the order waits for its backorder, and closes when the rest is cancelled', async () => {
    const f = await fulfilment()
    const made = await counter.post(`/api/sales-orders/${orderId}/tickets`).set(CSRF).send({ kind: 'delivery', deliverTo: '14 Larkfield Row, Brightcourse', lines: [{ salesOrderLineId: lineOf(f, fx.block.id).id, qty: 40 }] })
    expect(made.status).toBe(201)
    expect((await sign(made.body.id, crew)).status).toBe(200)
    const waiting = await fulfilment()
    expect(waiting.status).toBe('booked') // 30 blocks backordered, the made-to-order base not in yet
    expect(lineOf(waiting, fx.block.id)).toMatchObject({ handedOver: 90, waiting: 0, backordered: 30 })
    for (const itemId of [fx.block.id, fx.base.id]) {
      const res = await counter.post(`/api/sales-orders/${orderId}/lines/${lineOf(waiting, itemId).id}/cancel-rest`).set(CSRF)
      expect(res.status, JSON.stringify(res.body)).toBe(200)
    }
    const closed = await fulfilment()
    expect(closed.status).toBe('handed_over')
    expect(lineOf(closed, fx.block.id)).toMatchObject({ cancelled: 30, backordered: 0 })
    expect(await balance(fx.block.id)).toEqual({ onHand: 10, reserved: 0 })
    expect(await ledgerMismatches(h.ds, [fx.block.id, fx.spacers.id])).toEqual([])
  })
})
