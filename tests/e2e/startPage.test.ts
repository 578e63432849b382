// Each role opens Lumenyard to its day: the start page's panel on a phone (412 px), a figure's number
// checked against the database counted here, one figure clicked through to its list opened with the same
// filter, and the tiles' empty state. Screenshots go with the other browser tests' (test-results/screenshots).
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF } from '../support/apiHarness.js'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { axeFindings, blocking, describeFindings } from '../support/axeCheck.js'
import { sidewaysScroll } from '../support/layoutChecks.js'
import { signedInAgent } from '../support/pickFixtures.js'
import { createPurchasingFixture, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: E2eHarness
let f: PurchasingFixture
const PHONE = { width: 412, height: 915 }
const today = () => new Date().toISOString().slice(0, 10)
const sqlCount = async (sql: string, params: unknown[] = []) => Number(((await h.ds.query(sql, params)) as { n: string }[])[0].n)

beforeAll(async () => {
  h = await startE2e()
  f = await createPurchasingFixture(h.ds)
  // One order sent and expected today, one approved and expected two days ago: something to receive and something late.
  const admin = await signedInAgent(h.built.app, 'admin', DEMO_PASSWORD)
  for (const [expected, send] of [[today(), true], [new Date(Date.now() - 2 * 86_400_000).toISOString().slice(0, 10), false]] as const) {
    const res = await admin.post('/api/purchase-orders').set(CSRF).send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.sealant.id, packsOrdered: 1 }] })
    expect(res.status).toBe(201)
    const id = (res.body as { id: number }).id
    expect((await admin.post(`/api/purchase-orders/${id}/approve`).set(CSRF).send({ version: res.body.version })).status).toBe(200)
    if (send) expect((await admin.post(`/api/purchase-orders/${id}/mark-sent`).set(CSRF)).status).toBe(200)
    await h.ds.query('UPDATE purchase_orders SET expected_date = ? WHERE id = ?', [expected, id])
  }
})
afterAll(() => h?.close())

async function openStart(page: Page, username: string, panel: string): Promise<void> {
  await h.signIn(page, username)
  await page.locator(`[data-today-panel="${panel}"]`).waitFor()
  expect((await sidewaysScroll(page)).by).toBe(0)
  // Warehouse tablets and phones: every tile is a target of at least 44 × 44 px (WCAG 2.2, 2.5.8 asks 24; common practice 44).
  const boxes = await page.locator('[data-figure]').evaluateAll((els) => els.map((e) => e.getBoundingClientRect()).map((r) => ({ w: r.width, h: r.height, right: r.right })))
  expect(boxes.length).toBeGreaterThan(2)
  for (const b of boxes) {
    expect(b.h).toBeGreaterThanOrEqual(44)
    expect(b.right).toBeLessThanOrEqual(PHONE.width)
  }
}
const figureText = (page: Page, name: string) => page.locator(`[data-figure="${name}"]`).first().textContent()

describe('the start page per role on a phone', () => {
  it('the warehouse crew (in Spanish) sees deliveries expected today and opens them as the receiving list', async () => {
    const { page, context } = await h.newPage({ viewport: PHONE })
    try {
      await openStart(page, 'warehouse', 'warehouse')
      expect(await page.locator('[data-today-panel="warehouse"] h3').textContent()).toBe('En el almacén')
      const expected = await sqlCount("SELECT COUNT(*) AS n FROM purchase_orders WHERE status IN ('sent', 'partly_received') AND expected_date = ?", [today()])
      expect(expected).toBeGreaterThan(0)
      expect(await figureText(page, 'deliveriesToday')).toContain(`${expected}Entregas esperadas hoy`)
      const openCounts = await sqlCount("SELECT COUNT(*) AS n FROM cycle_counts WHERE status = 'open'")
      if (openCounts) expect(await figureText(page, 'countsOpen')).toContain(String(openCounts))
      else expect(await figureText(page, 'countsOpen')).toBe('Ningún conteo abierto')
      await h.screenshot(page, 'start-warehouse-phone')
      // source: WCAG 2.2 AA through axe-core's rules; no critical or serious finding on the start page
      const serious = blocking(await axeFindings(page, 'start page (warehouse, phone)'))
      expect(serious, describeFindings(serious)).toEqual([])

      await page.locator('[data-figure="deliveriesToday"]').click()
      await page.waitForURL(/\/warehouse\/receiving\?/)
      expect(page.url()).toContain(`expectedFrom=${today()}`)
      await page.locator('[data-test="list-filter"]').waitFor()
      await expect.poll(() => page.locator('[data-test="receiving-list"] li').count()).toBe(expected)
      await page.locator('[data-test="list-filter-clear"]').click()
      await expect.poll(() => page.locator('[data-test="list-filter"]').count()).toBe(0)
    } finally {
      await context.close()
    }
  })

  it('the buyer sees late orders and opens them as the purchase orders expected before today', async () => {
    const { page, context } = await h.newPage({ viewport: PHONE })
    try {
      await openStart(page, 'buyer', 'buyer')
      const late = await sqlCount("SELECT COUNT(*) AS n FROM purchase_orders WHERE status IN ('approved', 'sent', 'partly_received') AND expected_date < ?", [today()])
      expect(late).toBeGreaterThan(0)
      expect(await figureText(page, 'ordersLate')).toContain(`${late}Orders late`)
      expect(await figureText(page, 'spendThisMonth')).toMatch(/\$[\d,]+\.\d\d/)
      await h.screenshot(page, 'start-buyer-phone')
      await page.locator('[data-figure="ordersLate"]').click()
      await page.waitForURL(/\/purchasing\/orders\?/)
      await page.locator('[data-test="list-filter"]').waitFor()
      await expect.poll(() => page.locator('[data-test="orders-table"] .el-table__body tr').count()).toBe(Math.min(late, 500))
    } finally {
      await context.close()
    }
  })

  it('the counter sees the jobs and picks of the day and opens the lists being picked', async () => {
    const { page, context } = await h.newPage({ viewport: PHONE })
    try {
      await openStart(page, 'counter', 'counter')
      const picking = await sqlCount("SELECT COUNT(*) AS n FROM pick_lists WHERE status = 'picking'")
      const text = await figureText(page, 'picksUnderWay')
      expect(text).toBe(picking ? `${picking}Pick lists being picked` : 'No list is being picked')
      await h.screenshot(page, 'start-counter-phone')
      await page.locator('[data-figure="picksUnderWay"]').click()
      await page.waitForURL(/\/counter\/picking\?status=picking/)
      await page.locator('[data-test="list-filter"]').waitFor()
      await expect.poll(() => page.locator('[data-test="lists-table"] .el-table__body tr').count()).toBe(picking)
    } finally {
      await context.close()
    }
  })

  it('the owner sees stock value per warehouse, accuracy, low and dead stock, and opens the month\'s accuracy', async () => {
    const { page, context } = await h.newPage({ viewport: PHONE })
    try {
      await openStart(page, 'admin', 'owner')
      const warehouses = await sqlCount('SELECT COUNT(*) AS n FROM warehouses WHERE active = 1')
      expect(await page.locator('[data-figure="stockValue"]').count()).toBe(warehouses)
      await h.screenshot(page, 'start-owner-phone')
      await page.locator('[data-figure="accuracy"]').click()
      await page.waitForURL(/\/warehouse\/counts\?.*month=\d{4}-\d{2}/)
      await page.locator('[data-test="count-accuracy"]').waitFor()
    } finally {
      await context.close()
    }
  })

  it('says so in words when a figure is zero, and the read-only role keeps its area cards', async () => {
    const { page, context } = await h.newPage({ viewport: PHONE })
    try {
      // The answer's numbers are the API test's business; here only how a zero reads on screen.
      await page.route('**/api/today?*', (route) => route.fulfill({ json: { day: today(), panels: [{ panel: 'counter', figures: [
        { name: 'jobsToPick', count: 0, query: { toPick: '1' } }, { name: 'picksUnderWay', count: 0, query: { status: 'picking' } },
        { name: 'specialOrdersDue', count: 0, query: { specialDueBy: today() } },
      ] }] } }))
      await openStart(page, 'counter', 'counter')
      expect(await figureText(page, 'jobsToPick')).toBe('No job waits to be picked')
      expect(await figureText(page, 'specialOrdersDue')).toBe('No special order due')
    } finally {
      await context.close()
    }
    const viewer = await h.newPage({ viewport: PHONE })
    try {
      await h.signIn(viewer.page, 'viewer')
      await viewer.page.locator('[data-area-card="stock"]').waitFor()
      expect(await viewer.page.locator('[data-test="today"]').count()).toBe(0)
    } finally {
      await viewer.context.close()
    }
  })
})
