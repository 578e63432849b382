// A draft purchase order's edits in a real browser: removing a line asks first, and approving with
// edits on screen that were never saved asks to save them, then approves what the screen shows
// (before, the approval went through with the old quantities and the edits were silently dropped).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { createPurchasingFixture, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: E2eHarness
let f: PurchasingFixture
beforeAll(async () => {
  h = await startE2e()
  f = await createPurchasingFixture(h.ds)
})
afterAll(() => h?.close())

describe('a draft purchase order on screen', () => {
  it('asks before removing a line and saves unsaved edits before approving', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 1440, height: 900 } })
    try {
      await h.signIn(page, 'buyer')
      const created = await page.evaluate(async (body) => {
        const res = await fetch('/api/purchase-orders', {
          method: 'POST', credentials: 'same-origin', body: JSON.stringify(body),
          headers: { 'Content-Type': 'application/json', 'X-Lumenyard-Request': '1' },
        })
        return (await res.json()) as { id: number }
      }, { vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.block.id, packsOrdered: 2 }, { itemId: f.sealant.id, packsOrdered: 1 }] })
      await page.goto(`/purchasing/orders/${created.id}`)
      const rows = page.locator('[data-test="po-lines"] tbody tr')
      await expect.poll(() => rows.count()).toBe(2)

      // Remove line: the question comes first; "Cancel" keeps the line.
      await rows.nth(1).locator('[data-test="remove-line"]').click()
      const box = page.locator('.el-message-box')
      await expect.poll(() => box.textContent()).toContain(f.sealant.sku)
      await box.locator('button', { hasText: 'Cancel' }).click()
      expect(await rows.count()).toBe(2)
      await rows.nth(1).locator('[data-test="remove-line"]').click()
      await box.locator('.el-button--primary').click()
      await expect.poll(() => rows.count()).toBe(1)

      // 2 packs → 5 packs typed, not saved; approve asks, and approves 5 packs of 24 = 120 units.
      const packs = rows.first().locator('.el-input-number input').first()
      await packs.fill('5')
      await packs.press('Tab')
      await expect.poll(() => page.locator('[data-test="unsaved-note"]').isVisible()).toBe(true)
      await page.locator('[data-test="approve"]').click()
      await expect.poll(() => box.textContent()).toContain('not saved')
      await h.screenshot(page, 'po-approve-unsaved')
      await box.locator('button', { hasText: 'Cancel' }).click()
      expect(await page.locator('[data-test="po-status"]').getAttribute('data-status')).toBe('draft')
      await page.locator('[data-test="approve"]').click()
      await box.locator('.el-button--primary').click()
      await expect.poll(() => page.locator('[data-test="po-status"]').getAttribute('data-status')).toBe('approved')
      const lines = await h.ds.query('SELECT packs_ordered, qty_ordered FROM purchase_order_lines WHERE po_id = ?', [created.id])
      expect(lines).toEqual([{ packs_ordered: 5, qty_ordered: 120 }]) // vendor A's pack of 24 (fixture) × 5
    } finally {
      await context.close()
    }
  })
})
