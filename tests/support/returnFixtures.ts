// Goods leaving an order through the real path, for return and ready-mail tests: the counter sends the order
// to the warehouse (its holds become the pick list's), the warehouse confirms every line by scanning and
// completes the list (the order is ready), and a pickup ticket of the chosen quantities is made and signed on
// the pad (the stock leaves through the stock service then). Nothing is written straight into the tables.
import { randomUUID } from 'node:crypto'
import { PNG } from 'pngjs'
import type supertest from 'supertest'
import { CSRF } from './apiHarness.js'

/** A signature as a tablet's pad would send it: a 300 × 100 PNG with a stroke across (PNG encoded by pngjs, not by the app). */
export function signatureDataUrl(): string {
  const png = new PNG({ width: 300, height: 100 })
  for (let x = 20; x < 280; x++) {
    const y = 50 + Math.round(20 * Math.sin(x / 20))
    const i = (y * 300 + x) * 4
    png.data[i + 3] = 255 // black, opaque
  }
  return `data:image/png;base64,${PNG.sync.write(png).toString('base64')}`
}

const ok = (what: string, res: supertest.Response, status = [200, 201]) => {
  if (!status.includes(res.status)) throw new Error(`${what}: ${res.status} ${JSON.stringify(res.body)}`)
  return res.body
}

/** The order goes to the warehouse and every held unit is picked by scanning; the list completed. Answers the list id. */
export async function pickWholeOrder(counter: supertest.Agent, crew: supertest.Agent, orderId: number): Promise<number> {
  const sent = ok('send to pick', await counter.post(`/api/sales-orders/${orderId}/pick-lists`).set(CSRF).set('Idempotency-Key', randomUUID()))
  const listId = Number(sent.pickListId)
  const list = ok('pick list', await crew.get(`/api/pick-lists/${listId}`)) as { lines: { id: number; sku: string; binCode: string; lotCode: string | null; qty: number }[] }
  for (const line of list.lines) {
    ok('confirm', await crew.post(`/api/pick-lists/${listId}/confirmations`).set(CSRF).set('Idempotency-Key', randomUUID())
      .send({ lineId: line.id, binScan: `B:${line.binCode}`, itemScan: line.sku, lotScan: line.lotCode, qty: line.qty }))
  }
  ok('complete', await crew.post(`/api/pick-lists/${listId}/complete`).set(CSRF).set('Idempotency-Key', randomUUID()).send({ acceptShort: true }))
  return listId
}

/** A pickup ticket of `lines` (item → quantity) made at the counter and signed. Answers each item's order line id. */
export async function signedPickup(counter: supertest.Agent, orderId: number, lines: { itemId: number; qty: number }[]): Promise<Map<number, number>> {
  const f = ok('fulfilment', await counter.get(`/api/sales-orders/${orderId}/fulfilment`)) as { lines: { id: number; itemId: number }[] }
  const lineIds = new Map(f.lines.map((l) => [l.itemId, l.id]))
  const made = ok('ticket', await counter.post(`/api/sales-orders/${orderId}/tickets`).set(CSRF).set('Idempotency-Key', randomUUID()).send({
    kind: 'pickup', lines: lines.map((l) => ({ salesOrderLineId: lineIds.get(l.itemId), qty: l.qty })),
  }))
  ok('sign', await counter.post(`/api/handover-tickets/${made.id}/sign`).set(CSRF).set('Idempotency-Key', randomUUID()).send({ signerName: 'Dario Kessel', signature: signatureDataUrl() }))
  return lineIds
}

/** Pick the whole order, then hand over `lines` on one signed pickup ticket. Answers each item's order line id. */
export async function handOver(counter: supertest.Agent, crew: supertest.Agent, orderId: number, lines: { itemId: number; qty: number }[]): Promise<Map<number, number>> {
  await pickWholeOrder(counter, crew, orderId)
  return signedPickup(counter, orderId, lines)
}
