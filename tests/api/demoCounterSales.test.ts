// The demo's counter sales (server/demo/demoCounterSales.ts), loaded on the test database's demo (again
// harmlessly when it is there): quotes in each state a newcomer should see, and two sales orders whose
// deposits on the made-to-order base are paid, one in cash and one by card. Checked through the API a
// counter clerk uses, against sums read straight from the tables.
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { loadDemoCounterSales } from '../../server/demo/demoCounterSales.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'

let h: ApiHarness
let counter: supertest.Agent
const DEMO_ACCOUNTS = "(SELECT id FROM customers WHERE code IN ('COPPERLINE', 'BROOKMOOR', 'QUILLFEATHER', 'ALDERCREEK'))"

beforeAll(async () => {
  h = await startApiHarness()
  await loadDemoCounterSales(h.ds.manager, h.ds)
  await loadDemoCounterSales(h.ds.manager, h.ds) // a second load adds nothing
  counter = await h.as('counter')
})
afterAll(() => h?.close())

describe('the demo counter sells', () => {
  it('has quotes drafted, offered, lost with a reason and taken, once', async () => {
    const rows: { status: string; n: string }[] = await h.ds.query(
      `SELECT q.status, COUNT(*) AS n FROM quotes q JOIN customers c ON c.id = q.customer_id WHERE c.code = 'ALDERCREEK' GROUP BY q.status`,
    )
    expect(rows).toEqual([{ status: 'taken', n: '1' }])
    const res = await counter.get('/api/quotes?status=all')
    expect(res.status).toBe(200)
    const statuses = new Set(res.body.map((q: { status: string }) => q.status))
    for (const s of ['draft', 'offered', 'lost', 'taken']) expect(statuses.has(s), s).toBe(true)
  })

  it('has two orders with their base deposit paid, one in cash and one by card, each paid sum read from its payments', async () => {
    const orders: { id: number; deposit_required: string; deposit_paid: string; paid: string; methods: string }[] = await h.ds.query(
      `SELECT o.id, o.deposit_required, o.deposit_paid, SUM(p.amount - p.refunded_amount) AS paid, GROUP_CONCAT(p.method) AS methods
         FROM sales_orders o JOIN payments p ON p.sales_order_id = o.id AND p.status = 'settled'
        WHERE o.customer_id IN ${DEMO_ACCOUNTS} AND o.created_by = (SELECT id FROM users WHERE username = 'counter') GROUP BY o.id ORDER BY o.id`,
    )
    const demo = orders.filter((o) => o.methods === 'cash' || o.methods === 'card')
    expect(demo.map((o) => o.methods).sort()).toEqual(['card', 'cash'])
    for (const o of demo) {
      expect(Number(o.deposit_required)).toBeGreaterThan(0)
      expect(o.deposit_paid).toBe(o.deposit_required)
      expect(o.paid).toBe(o.deposit_paid)
      const detail = await counter.get(`/api/sales-orders/${o.id}`)
      expect(detail.body.depositDue).toBe('0.00')
    }
  })
})
