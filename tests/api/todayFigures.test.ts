// The start page's day at a glance through the API on the real MariaDB. The test database holds other
// files' rows too, so each figure is checked two ways: against a count written here in plain SQL, and by the
// change a fixture of known size makes (one more late order, 75.00 more spend…). Each figure's list is
// asked with the figure's own filter and must hold as many rows. Who gets which panel, and that money
// reaches only the roles the cost rule allows, close the file.
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { TodayAnswer, TodayFigure, TodayPanelName } from '../../shared/schemas/today.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { insertId } from '../support/fixtureRows.js'
import { createPurchasingFixture, jobWithShowerBase, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: ApiHarness
let admin: supertest.Agent
let f: PurchasingFixture
const DAY = 86_400_000
const isoDay = (offsetDays: number) => new Date(Date.now() + offsetDays * DAY).toISOString().slice(0, 10)
const COST_KEYS = ['stockValue', 'spendValue']

async function today(agent: supertest.Agent): Promise<TodayAnswer> {
  const res = await agent.get('/api/today?tz=UTC')
  expect(res.status, JSON.stringify(res.body)).toBe(200)
  return res.body as TodayAnswer
}
function figure(a: TodayAnswer, panel: TodayPanelName, name: TodayFigure['name'], warehouseCode?: string): TodayFigure {
  const found = a.panels.find((p) => p.panel === panel)?.figures.find((x) => x.name === name && (!warehouseCode || x.warehouseCode === warehouseCode))
  if (!found) throw new Error(`no ${panel}.${name} in ${JSON.stringify(a)}`)
  return found
}
const sqlCount = async (sql: string, params: unknown[] = []) => Number(((await h.ds.query(sql, params)) as { n: string }[])[0].n)

/** A purchase order for one 12-tube pack of sealant from vendor A at 6.25 a tube, moved to `status` with the dates given. */
async function order(status: 'approved' | 'sent', expected: string, sentAt?: Date): Promise<number> {
  const created = await admin.post('/api/purchase-orders').set(CSRF)
    .send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.sealant.id, packsOrdered: 1 }] })
  expect(created.status, JSON.stringify(created.body)).toBe(201)
  const id = (created.body as { id: number }).id
  expect((await admin.post(`/api/purchase-orders/${id}/approve`).set(CSRF).send({ version: created.body.version })).status).toBe(200)
  if (status === 'sent') expect((await admin.post(`/api/purchase-orders/${id}/mark-sent`).set(CSRF)).status).toBe(200)
  await h.ds.query('UPDATE purchase_orders SET expected_date = ?, sent_at = COALESCE(?, sent_at) WHERE id = ?', [expected, sentAt ?? null, id])
  return id
}

beforeAll(async () => {
  h = await startApiHarness()
  admin = await h.as('admin')
  f = await createPurchasingFixture(h.ds)
})
afterAll(async () => {
  await h?.close()
})

describe('the counter panel', () => {
  it('counts bills waiting to be picked, lists being picked and special orders due within a week, each as its list does', async () => {
    const counter = await h.as('counter')
    const before = await today(counter)
    // Two jobs with a bill of 120 stocked blocks and a made-to-order shower base: one due in 3 days, one in 30.
    const soon = await jobWithShowerBase(h.ds, f, isoDay(3))
    await jobWithShowerBase(h.ds, f, isoDay(30))
    const [bom] = (await h.ds.query('SELECT id FROM boms WHERE job_id = ?', [soon.jobId])) as { id: number }[]
    await insertId(h.ds, "INSERT INTO pick_lists (bom_id, job_id, warehouse_id, status) VALUES (?, ?, ?, 'picking')", [bom.id, soon.jobId, f.warehouse.id])
    const after = await today(counter)
    expect(after.panels.map((p) => p.panel)).toEqual(['counter'])

    // Both new bills wait (the list being picked holds no lines yet); one more list is under way; one job is due within 7 days.
    expect(figure(after, 'counter', 'jobsToPick').count).toBe(figure(before, 'counter', 'jobsToPick').count! + 2)
    expect(figure(after, 'counter', 'picksUnderWay').count).toBe(figure(before, 'counter', 'picksUnderWay').count! + 1)
    expect(figure(after, 'counter', 'specialOrdersDue').count).toBe(figure(before, 'counter', 'specialOrdersDue').count! + 1)
    expect(figure(after, 'counter', 'picksUnderWay').count).toBe(await sqlCount("SELECT COUNT(*) AS n FROM pick_lists WHERE status = 'picking'"))

    // The figure's link: the jobs list with the same filter holds the soon job and not the later one, as many rows as the figure.
    const due = figure(after, 'counter', 'specialOrdersDue')
    expect(due.query.specialDueBy).toBe(isoDay(7)) // common practice: a week's notice for a made-to-order part
    const listed = await counter.get(`/api/jobs?${new URLSearchParams({ ...due.query, limit: '200' })}`)
    expect(listed.status).toBe(200)
    const ids = (listed.body as { id: number }[]).map((j) => j.id)
    expect(ids).toContain(soon.jobId)
    expect(ids.length).toBe(due.count)
  })
})

describe('the warehouse panel', () => {
  it('counts open pick lists, deliveries expected today, open counts and confirmations waiting on handhelds', async () => {
    const crew = await h.as('warehouse')
    const before = await today(crew)
    await order('sent', isoDay(0))
    await order('sent', isoDay(1))
    await insertId(h.ds, "INSERT INTO cycle_counts (warehouse_id, scope, status) VALUES (?, 'bins', 'open')", [f.warehouse.id])
    const device = `today-${f.tag}`
    expect((await crew.put(`/api/devices/${device}/outbox`).set(CSRF).send({ waiting: 3, refused: 0 })).status).toBe(200)
    const after = await today(crew)

    expect(figure(after, 'warehouse', 'deliveriesToday').count).toBe(figure(before, 'warehouse', 'deliveriesToday').count! + 1)
    expect(figure(after, 'warehouse', 'countsOpen').count).toBe(figure(before, 'warehouse', 'countsOpen').count! + 1)
    expect(figure(after, 'warehouse', 'deviceOutbox').count).toBe(figure(before, 'warehouse', 'deviceOutbox').count! + 3)
    expect(figure(after, 'warehouse', 'openPickLists').count).toBe(await sqlCount("SELECT COUNT(*) AS n FROM pick_lists WHERE status IN ('draft', 'released', 'picking')"))
    expect(figure(after, 'warehouse', 'countsOpen').count).toBe(await sqlCount("SELECT COUNT(*) AS n FROM cycle_counts WHERE status = 'open'"))
    expect(figure(after, 'warehouse', 'deliveriesToday').count).toBe(await sqlCount(
      "SELECT COUNT(*) AS n FROM purchase_orders WHERE status IN ('sent', 'partly_received') AND expected_date = ?", [isoDay(0)]))

    const deliveries = figure(after, 'warehouse', 'deliveriesToday')
    const listed = await crew.get(`/api/purchase-orders?${new URLSearchParams(deliveries.query)}`)
    expect(listed.status).toBe(200)
    expect((listed.body as unknown[]).length).toBe(deliveries.count)
    expect(JSON.stringify(after)).not.toMatch(/stockValue|spendValue/)
  })
})

describe('the buyer panel', () => {
  it('counts late orders, orders due this week and this month\'s spend, and agrees with the reorder list', async () => {
    const buyer = await h.as('buyer')
    const before = await today(buyer)
    await order('approved', isoDay(-2))
    await order('approved', isoDay(0))
    const firstOfMonth = new Date(`${isoDay(0).slice(0, 8)}01T12:00:00Z`)
    await order('sent', isoDay(10), firstOfMonth)
    const after = await today(buyer)

    expect(figure(after, 'buyer', 'ordersLate').count).toBe(figure(before, 'buyer', 'ordersLate').count! + 1)
    expect(figure(after, 'buyer', 'ordersDueThisWeek').count).toBe(figure(before, 'buyer', 'ordersDueThisWeek').count! + 1)
    // One pack of 12 tubes at 6.25 = 75.00 more spend (arithmetic by hand); the approved ones are not placed yet.
    const spendBefore = Number(figure(before, 'buyer', 'spendThisMonth').spendValue)
    expect(Number(figure(after, 'buyer', 'spendThisMonth').spendValue)).toBeCloseTo(spendBefore + 75, 2)
    const monthStart = new Date(`${isoDay(0).slice(0, 8)}01T00:00:00Z`)
    const [spend] = (await h.ds.query(
      "SELECT COALESCE(SUM(total), 0) AS t FROM purchase_orders WHERE status IN ('sent', 'partly_received', 'received', 'closed') AND sent_at >= ?", [monthStart])) as { t: string }[]
    expect(figure(after, 'buyer', 'spendThisMonth').spendValue).toBe(Number(spend.t).toFixed(2))
    expect(figure(after, 'buyer', 'ordersLate').count).toBe(await sqlCount(
      "SELECT COUNT(*) AS n FROM purchase_orders WHERE status IN ('approved', 'sent', 'partly_received') AND expected_date < ?", [isoDay(0)]))

    for (const name of ['ordersLate', 'ordersDueThisWeek', 'spendThisMonth'] as const) {
      const fig = figure(after, 'buyer', name)
      const listed = await buyer.get(`/api/purchase-orders?${new URLSearchParams(fig.query)}`)
      expect(listed.status, name).toBe(200)
      expect((listed.body as unknown[]).length, name).toBe(fig.count)
    }
    const reorder = await buyer.get('/api/reorder/suggestions')
    expect(reorder.status).toBe(200)
    expect(figure(after, 'buyer', 'orderNow').count).toBe((reorder.body as { counts: { orderNow: number } }).counts.orderNow)
  })
})

describe('the owner panel', () => {
  it('values stock per warehouse at moving-average cost, counts low and dead stock, and works accuracy from counted lines', async () => {
    const before = await today(admin)
    // 10 tubes at 6.00 then 5 at 9.00: moving average (60.00 + 45.00) ÷ 15 = 7.00, value 105.00.
    // source: weighted-average (moving-average) perpetual inventory costing, any cost accounting text
    const res = await admin.post('/api/stock/receipts').set(CSRF).send({ warehouseId: f.warehouse.id, lines: [
      { itemId: f.sealant.id, binId: f.warehouse.bins.a1, lotId: null, qty: 10, unitCost: '6.00' },
      { itemId: f.sealant.id, binId: f.warehouse.bins.a1, lotId: null, qty: 5, unitCost: '9.00' },
    ] })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    await h.ds.query('UPDATE item_warehouses SET min_qty = 100 WHERE item_id = ? AND warehouse_id = ?', [f.sealant.id, f.warehouse.id])
    const after = await today(admin)

    expect(figure(after, 'owner', 'stockValue', f.warehouse.code).stockValue).toBe('105.00')
    expect(figure(after, 'owner', 'stockValue', f.warehouse.code).query).toEqual({ warehouseId: String(f.warehouse.id) })
    // 15 on hand, none free of a 100 minimum: low. Never issued: dead.
    expect(figure(after, 'owner', 'lowStock').count).toBe(figure(before, 'owner', 'lowStock').count! + 1)
    expect(figure(after, 'owner', 'deadStock').count).toBe(figure(before, 'owner', 'deadStock').count! + 1)

    const monthStart = new Date(`${isoDay(0).slice(0, 8)}01T00:00:00Z`)
    const [acc] = (await h.ds.query(
      "SELECT COUNT(*) AS counted, COALESCE(SUM(variance = 0), 0) AS rightLines FROM count_lines WHERE status IN ('matched', 'approved') AND counted_at >= ?",
      [monthStart])) as { counted: string; rightLines: string }[]
    const accuracy = figure(after, 'owner', 'accuracy')
    expect(accuracy.count).toBe(Number(acc.counted))
    // source: inventory record accuracy = records right ÷ records counted (APICS dictionary's definition)
    expect(accuracy.accuracy).toBe(Number(acc.counted) ? Number(acc.rightLines) / Number(acc.counted) : null)
  })
})

describe('who sees which panel', () => {
  it('gives each role its panel, several roles each of theirs, the read-only role none, and money only under the cost rule', async () => {
    expect((await today(await h.as('viewer'))).panels).toEqual([])
    const both = await today(await h.as('buyer', 'warehouse'))
    expect(both.panels.map((p) => p.panel).sort()).toEqual(['buyer', 'warehouse'])
    const owner = await today(admin)
    expect(owner.panels.map((p) => p.panel)).toEqual(['owner'])
    expect(owner.day).toBe(isoDay(0))
    for (const role of ['counter', 'warehouse'] as const) {
      const text = JSON.stringify(await today(await h.as(role)))
      for (const key of COST_KEYS) expect(text, `${role} ${key}`).not.toContain(`"${key}"`)
    }
    expect(JSON.stringify(both)).toContain('"spendValue"')
  })

  it('refuses a time zone that does not exist and answers 401 signed out', async () => {
    const bad = await admin.get('/api/today?tz=Nowhere/Atlantis')
    expect(bad.status).toBe(400)
    expect((await h.agent().get('/api/today')).status).toBe(401)
  })
})
