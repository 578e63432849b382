// Buying and set-up screens in a real browser, signed in once as the admin:
// - a draft purchase order: removing a line asks first, and approving with edits on screen that were never
//   saved asks to save them, then approves what the screen shows (before, the approval went through with the
//   old quantities and the edits were silently dropped);
// - warehouses: after creating a warehouse, a range of bins goes to the new one even when the previous
//   warehouse's answer arrives last (before, 30 bins landed in the previously chosen warehouse); the dialog
//   names its warehouse; taking a bin out of use and deleting one ask first.
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { createPurchasingFixture, type PurchasingFixture } from '../support/purchasingFixtures.js'

// Screens on a loaded machine can take seconds to answer: wait for conditions, long enough.
const poll = <T>(read: () => Promise<T> | T) => expect.poll(read, { timeout: 30_000 })

let h: E2eHarness
let f: PurchasingFixture
let page: Page
let context: BrowserContext
beforeAll(async () => {
  h = await startE2e()
  f = await createPurchasingFixture(h.ds)
  ;({ page, context } = await h.newPage({ viewport: { width: 1440, height: 900 } }))
  await h.signIn(page, 'admin')
})
afterAll(async () => {
  await context?.close()
  await h?.close()
})

describe('a draft purchase order on screen', () => {
  it('asks before removing a line and saves unsaved edits before approving', async () => {
    const created = await page.evaluate(async (body) => {
      const res = await fetch('/api/purchase-orders', {
        method: 'POST', credentials: 'same-origin', body: JSON.stringify(body),
        headers: { 'Content-Type': 'application/json', 'X-Lumenyard-Request': '1' },
      })
      return (await res.json()) as { id: number }
    }, { vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.block.id, packsOrdered: 2 }, { itemId: f.sealant.id, packsOrdered: 1 }] })
    await page.goto(`/purchasing/orders/${created.id}`)
    const rows = page.locator('[data-test="po-lines"] tbody tr')
    await poll(() => rows.count()).toBe(2)

    // Remove line: the question comes first; "Cancel" keeps the line.
    await rows.nth(1).locator('[data-test="remove-line"]').click()
    const box = page.locator('.el-message-box')
    await poll(() => box.textContent()).toContain(f.sealant.sku)
    await box.locator('button', { hasText: 'Cancel' }).click()
    expect(await rows.count()).toBe(2)
    await rows.nth(1).locator('[data-test="remove-line"]').click()
    await box.locator('.el-button--primary').click()
    await poll(() => rows.count()).toBe(1)

    // 2 packs → 5 packs typed, not saved; approve asks, and approves 5 packs of 24 = 120 units.
    const packs = rows.first().locator('.el-input-number input').first()
    await packs.fill('5')
    await packs.press('Tab')
    await poll(() => page.locator('[data-test="unsaved-note"]').isVisible()).toBe(true)
    await page.locator('[data-test="approve"]').click()
    await poll(() => box.textContent()).toContain('not saved')
    await h.screenshot(page, 'po-approve-unsaved')
    await box.locator('button', { hasText: 'Cancel' }).click()
    expect(await page.locator('[data-test="po-status"]').getAttribute('data-status')).toBe('draft')
    await page.locator('[data-test="approve"]').click()
    await box.locator('.el-button--primary').click()
    await poll(() => page.locator('[data-test="po-status"]').getAttribute('data-status')).toBe('approved')
    const lines = await h.ds.query('SELECT packs_ordered, qty_ordered FROM purchase_order_lines WHERE po_id = ?', [created.id])
    expect(lines).toEqual([{ packs_ordered: 5, qty_ordered: 120 }]) // vendor A's pack of 24 (fixture) × 5
  })
})

describe('warehouses and bins on screen', () => {
  it('puts a range of bins in the warehouse just created, names it, and asks before taking out or deleting', async () => {
    const box = page.locator('.el-message-box')
    const binsOf = async (id: number) => Number((await h.ds.query('SELECT COUNT(*) AS n FROM bins WHERE warehouse_id = ?', [id]))[0].n)
    await page.goto(`/stock/warehouses?warehouse=${f.warehouse.id}`)
    await page.locator('[data-test="bins-table"]').waitFor()
    // The previously chosen warehouse's answer comes back slowly, after the new warehouse's.
    await page.route(`**/api/warehouses/${f.warehouse.id}`, async (route) => {
      await new Promise((r) => setTimeout(r, 1500))
      await route.continue()
    })
    const code = `N${f.tag}`
    await page.locator('[data-test="wh-add"]').click()
    await page.locator('[data-test="wh-code"]').fill(code)
    await page.locator('[data-test="wh-name"]').fill(`Yard ${code}`)
    await page.locator('[data-test="wh-save"]').click()
    await page.waitForURL(/warehouse=\d+/)
    await page.waitForTimeout(2000) // let the slow, older answer arrive
    await page.locator('[data-test="bins-range"]').click()
    await poll(() => page.locator('.el-dialog__title', { hasText: 'Range of bins' }).textContent()).toContain(code)
    await page.locator('[data-test="range-save"]').click()
    const [created] = await h.ds.query('SELECT id FROM warehouses WHERE code = ?', [code])
    // The form's default range, A–C × 1–10 × 1–3 = 90 bins, all in the new warehouse; the fixture's keeps its 3.
    await poll(() => binsOf(created.id)).toBe(90)
    expect(await binsOf(f.warehouse.id)).toBe(3)
    await page.unroute(`**/api/warehouses/${f.warehouse.id}`)

    const first = page.locator('[data-test="bins-table"] tbody tr').first()
    // The list reloads after the range; on a busy machine that takes a while.
    await poll(() => page.locator('.el-loading-mask:visible').count()).toBe(0)
    await first.locator('[data-test="bin-take-out"]').click({ timeout: 30_000 })
    await poll(() => box.textContent()).toContain('A-01-1')
    await box.locator('button', { hasText: 'Cancel' }).click()
    const [bin] = await h.ds.query("SELECT id, active FROM bins WHERE warehouse_id = ? AND code = 'A-01-1'", [created.id])
    expect(bin.active).toBe(1)
    await first.locator('[data-test="bin-delete"]').click()
    await box.locator('.el-button--primary').click()
    await poll(() => binsOf(created.id)).toBe(89)
    await h.screenshot(page, 'warehouse-bins-after-delete')
  })
})
