// Records the walks of every screen need (accessibility, the Spanish screens), made here rather than read from
// the demo so each walk knows what it opens and how they overlap: a released pick list, a quote taken into a
// sales order, a handover ticket waiting for its signature, and an open cycle count.
import { randomUUID } from 'node:crypto'
import { CSRF } from './apiHarness.js'
import { DEMO_PASSWORD, type E2eHarness } from './browser.js'
import { fxBom, pickScenario, releasedPickList, signedInAgent } from './pickFixtures.js'

export async function walkRecords(h: E2eHarness): Promise<void> {
  // A pick list and a cycle count of the walk's own give their screens a record to open.
  const crew = await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD)
  const s = await pickScenario(h.ds, crew)
  const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 16 }, { itemId: s.spacer.id, qty: 10 }])
  const counter = await signedInAgent(h.built.app, 'counter', DEMO_PASSWORD)
  await releasedPickList(counter, bom.bomId, s.main.id)
  // A quote and a sales order: one quote by hand, offered over the counter, then taken. It holds some of
  // the same spacers the walk's pick list needs, in the same warehouse. (The handheld walk opens the first
  // open list, which on the demo is the demo order's list, with a step for its lot.)
  const [{ customerId }] = (await h.ds.query('SELECT MIN(id) AS customerId FROM customers')) as { customerId: number }[]
  await takenQuote(h, counter, customerId, s.main.id, s.spacer.id, 2)
  // A handover ticket: a second order for a few spacers goes to the warehouse, is picked and completed,
  // and its pickup ticket waits for a signature (the first order keeps its holds for the pick screen above).
  await handoverTicket(h, counter, crew, customerId, s.main.id, s.spacer)
  const count = await crew.post('/api/counts').set(CSRF).send({ warehouseId: s.main.id, scope: 'bins', binIds: [s.main.bins['A-03-1']] })
  must('opening a count', count)
}

type Agent = Awaited<ReturnType<typeof signedInAgent>>

function must(what: string, res: { status: number; body: unknown }, status = 201): void {
  if (res.status !== status) throw new Error(`${what} failed: ${res.status} ${JSON.stringify(res.body)}`)
}

/** A quote by hand for one item, offered over the counter and taken: the sales order's id. */
async function takenQuote(h: E2eHarness, counter: Agent, customerId: number, warehouseId: number, itemId: number, qty: number): Promise<number> {
  const quote = await counter.post('/api/quotes').set(CSRF).send({ customerId, warehouseId, lines: [{ itemId, qty }] })
  must('making a quote', quote)
  await h.ds.query("UPDATE quotes SET status = 'offered', offered_at = NOW() WHERE id = ?", [quote.body.id])
  const order = await counter.post('/api/sales-orders').set(CSRF).send({ quoteId: quote.body.id })
  must('taking the quote', order)
  return order.body.id as number
}

async function handoverTicket(h: E2eHarness, counter: Agent, crew: Agent, customerId: number, warehouseId: number, item: { id: number; sku: string }): Promise<void> {
  const orderId = await takenQuote(h, counter, customerId, warehouseId, item.id, 3)
  const sent = await counter.post(`/api/sales-orders/${orderId}/pick-lists`).set(CSRF).set('Idempotency-Key', randomUUID())
  must('sending the order to the warehouse', sent)
  const listId = sent.body.pickListId as number
  const list = await crew.get(`/api/pick-lists/${listId}`)
  must('reading the order\'s pick list', list, 200)
  for (const line of list.body.lines as { id: number; binCode: string; qty: number }[]) {
    must('confirming a pick line', await crew.post(`/api/pick-lists/${listId}/confirmations`).set(CSRF).set('Idempotency-Key', randomUUID())
      .send({ lineId: line.id, binScan: `B:${line.binCode}`, itemScan: item.sku, qty: line.qty }))
  }
  must('completing the pick', await crew.post(`/api/pick-lists/${listId}/complete`).set(CSRF).set('Idempotency-Key', randomUUID()).send({ acceptShort: true }), 200)
  const f = await counter.get(`/api/sales-orders/${orderId}/fulfilment`)
  must('reading the order\'s fulfilment', f, 200)
  const lines = (f.body.lines as { id: number; picked: number }[]).map((l) => ({ salesOrderLineId: l.id, qty: l.picked }))
  must('making the pickup ticket', await counter.post(`/api/sales-orders/${orderId}/tickets`).set(CSRF).set('Idempotency-Key', randomUUID()).send({ kind: 'pickup', lines }))
}
