// The owner reads what the stock was worth at the end of past days: the tile on the purchasing start
// page, figures at moving-average cost worked by hand below, a day kept in the address through a
// reload, another day picked, and the page at phone width.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF } from '../support/apiHarness.js'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { fxItem, fxWarehouse, signedInAgent, tagOf, type FxItem, type FxWarehouse } from '../support/pickFixtures.js'

let h: E2eHarness
let wh: FxWarehouse
let block: FxItem
const tag = tagOf()

beforeAll(async () => {
  h = await startE2e()
  const admin = await signedInAgent(h.built.app, 'admin', DEMO_PASSWORD)
  wh = await fxWarehouse(h.ds, `S${tag}`, ['A-01-1'])
  block = await fxItem(h.ds, `SV-${tag}`)
  for (const [at, qty, unitCost] of [['2026-03-02T15:00:00Z', 100, '10.00'], ['2026-05-04T15:00:00Z', 50, '13.00']] as const) {
    const [mark] = (await h.ds.query('SELECT COALESCE(MAX(id), 0) AS id FROM stock_moves')) as { id: number }[]
    const res = await admin.post('/api/stock/receipts').set(CSRF)
      .send({ warehouseId: wh.id, lines: [{ itemId: block.id, binId: wh.bins['A-01-1'], lotId: null, qty, unitCost }] })
    expect(res.status).toBe(201)
    // Placed on its day in the ledger: the report reads history by the ledger's time.
    await h.ds.query('UPDATE stock_moves SET at = ? WHERE id > ? AND item_id = ?', [new Date(at), mark.id, block.id])
  }
})
afterAll(() => h?.close())

describe('stock value as of a past day', () => {
  it('opens from the purchasing start page, keeps its day through a reload and fits a phone', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 1440, height: 900 } })
    try {
      await h.signInByApi(page, 'admin')
      await page.goto('/purchasing')
      await page.locator('[data-test="tile-purchasing-stock-value"]').click()
      await page.locator('[data-test="valuation-total"]').waitFor()

      await page.goto(`/purchasing/stock-value?asOf=2026-03-31&warehouseId=${wh.id}`)
      // source: moving-average costing, Weygandt, Kimmel & Kieso, Accounting Principles, inventories
      // chapter appendix — 100 received at 10.00 and nothing else yet: 100 × 10.00 = $1,000.00.
      await expect.poll(() => page.locator('[data-test="valuation-total"]').textContent()).toContain('$1,000.00')
      expect(await page.locator('[data-test="valuation-table"]').textContent()).toContain('Glass block')
      await page.reload()
      await expect.poll(() => page.locator('[data-test="valuation-total"]').textContent()).toContain('$1,000.00')

      // Another day: (100 × 10 + 50 × 13) / 150 = 1,650 / 150 = 11.0000; 150 × 11 = $1,650.00.
      const day = page.locator('[data-test="valuation-day"] input')
      await day.fill('2026-05-31')
      await day.press('Enter')
      await expect.poll(() => page.locator('[data-test="valuation-total"]').textContent()).toContain('$1,650.00')
      expect(page.url()).toContain('asOf=2026-05-31')
      await h.screenshot(page, 'stock-value-desktop')

      await page.setViewportSize({ width: 412, height: 915 })
      await expect.poll(() => page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(412)
      // Found on a phone: the table's value column sat behind a sideways scroll. Each group is a card there.
      const card = page.locator('[data-test="valuation-card"]').first()
      expect(await card.isVisible()).toBe(true)
      const box = await card.boundingBox()
      expect(box && box.x + box.width).toBeLessThanOrEqual(412)
      expect(await card.textContent()).toContain('$1,650.00')
      await h.screenshot(page, 'stock-value-phone')
    } finally {
      await context.close()
    }
  })
})
