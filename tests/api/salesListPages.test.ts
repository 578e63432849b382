// Feature: the counter's document lists (quotes, sales orders, handover tickets) read a page at a time, newest
// first, against the real MariaDB: `limit` caps a page, `beforeId` (the last id shown) asks for the next one, so
// walking the pages returns every row once, in order, whatever was written meanwhile; `q` finds a document by
// number or account on the server. A yard with 20,000 quotes opens its list on one page instead of all of them.
// A bad limit or cursor is refused with 400 and the field named.
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { insertId } from '../support/fixtureRows.js'
import { createSalesFixture, type SalesFixture } from '../support/salesFixtures.js'

let h: ApiHarness
let counter: supertest.Agent
let crew: supertest.Agent
let fx: SalesFixture
const quoteIds: number[] = []
const orderIds: number[] = []
const ticketIds: number[] = []

beforeAll(async () => {
  h = await startApiHarness()
  counter = await h.as('counter')
  crew = await h.as('warehouse')
  fx = await createSalesFixture(h.ds)
  // Seven quotes of this test's own account, made as the counter makes them; five become orders (rows written
  // straight, as a busy year leaves them) and each order one open ticket.
  for (let i = 0; i < 7; i++) {
    const q = await counter.post('/api/quotes').set(CSRF).send({ customerId: fx.customerId, warehouseId: fx.warehouseId, lines: [{ itemId: fx.block.id, qty: i + 1 }] })
    expect(q.status, JSON.stringify(q.body)).toBe(201)
    quoteIds.push(q.body.id)
  }
  for (const [i, quoteId] of quoteIds.slice(0, 5).entries()) {
    await h.ds.query("UPDATE quotes SET status = 'taken', taken_at = NOW() WHERE id = ?", [quoteId])
    const orderId = await insertId(
      h.ds,
      `INSERT INTO sales_orders (number, quote_id, customer_id, job_id, warehouse_id, status, subtotal, tax_amount, total, deposit_percent, deposit_required, deposit_paid)
       VALUES (?, ?, ?, NULL, ?, 'booked', '10.00', '0.00', '10.00', '50.00', '0.00', '0.00')`,
      [`SO-T${fx.tag}-${i}`, quoteId, fx.customerId, fx.warehouseId],
    )
    orderIds.push(orderId)
    ticketIds.push(await insertId(h.ds, "INSERT INTO handover_tickets (number, sales_order_id, kind, status) VALUES (?, ?, 'pickup', 'open')", [`HT-T${fx.tag}-${i}`, orderId]))
  }
})
afterAll(async () => {
  await h?.close()
})

/** Every page of a list, following `beforeId` from the last row of each full page. */
async function walk(agent: supertest.Agent, path: string, limit: number): Promise<number[][]> {
  const pages: number[][] = []
  let beforeId: number | undefined
  // Bounded: a server that ignored the cursor would answer the same full page for ever.
  while (pages.length < 10) {
    const res = await agent.get(`${path}&limit=${limit}${beforeId ? `&beforeId=${beforeId}` : ''}`)
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    const ids = (res.body as { id: number }[]).map((r) => r.id)
    pages.push(ids)
    if (ids.length < limit) return pages
    beforeId = ids.at(-1)
  }
  return pages
}
const newestFirst = (ids: number[]) => [...ids].sort((a, b) => b - a)

describe('document lists a page at a time', () => {
  it('quotes: pages of 3 walk all 7 of the account, newest first, none twice', async () => {
    const pages = await walk(counter, `/api/quotes?status=all&q=${fx.tag}`, 3)
    expect(pages.map((p) => p.length)).toEqual([3, 3, 1])
    expect(pages.flat()).toEqual(newestFirst(quoteIds))
  })

  it('sales orders: pages of 2 walk all 5, newest first', async () => {
    const pages = await walk(counter, `/api/sales-orders?status=all&q=${fx.tag}`, 2)
    expect(pages.map((p) => p.length)).toEqual([2, 2, 1])
    expect(pages.flat()).toEqual(newestFirst(orderIds))
  })

  it('handover tickets: found by the account, pages of 4 walk all 5 for the warehouse', async () => {
    const pages = await walk(crew, `/api/handover-tickets?status=open&q=${fx.tag}`, 4)
    expect(pages.map((p) => p.length)).toEqual([4, 1])
    expect(pages.flat()).toEqual(newestFirst(ticketIds))
    // One ticket by its own number.
    const one = await crew.get(`/api/handover-tickets?status=all&q=HT-T${fx.tag}-3`)
    expect(one.body.map((t: { id: number }) => t.id)).toEqual([ticketIds[3]])
  })

  it('refuses a page size of 0, over 500 or not a number, and a cursor that is not an id', async () => {
    for (const bad of ['limit=0', 'limit=501', 'limit=1e9', 'limit=1,5', 'beforeId=-3']) {
      for (const path of ['/api/quotes', '/api/sales-orders', '/api/handover-tickets']) {
        const res = await counter.get(`${path}?status=all&${bad}`)
        expect(res.status, `${path} ${bad}`).toBe(400)
        expect(Object.keys(res.body.error.fields ?? {}), `${path} ${bad}`).toEqual([bad.split('=')[0]])
      }
    }
  })
})
