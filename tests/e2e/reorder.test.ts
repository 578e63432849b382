// The buyer's reorder flow in a real browser: open the suggestion list, narrow it to one warehouse, open a
// line's working and charts, accept the suggestion, and find it waiting in purchase_suggestions.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { createReorderFixture, type ReorderFixture } from '../support/reorderFixture.js'

let h: E2eHarness
let fx: ReorderFixture
beforeAll(async () => {
  h = await startE2e()
  fx = await createReorderFixture(h.ds)
})
afterAll(() => h?.close())

describe('reorder suggestions as the buyer', () => {
  it('opens the list and a line’s chart, and accepts the suggestion', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 1400, height: 900 } })
    try {
      await h.signInByApi(page, 'buyer')
      await page.goto('/purchasing/reorder')
      await page.locator('[data-test="reorder-grid"] .ag-row').first().waitFor()
      await page.locator('[data-test="filter-warehouse"]').click()
      await page.getByRole('option', { name: `${fx.warehouseCode} · Test reorder yard ${fx.tag}` }).click()
      const rowId = `[data-test="reorder-grid"] [row-id="${fx.itemId}:${fx.warehouseId}"]`
      const status = page.locator(`${rowId} [col-id="status"]`)
      const pending = page.locator(`${rowId} [col-id="pendingQty"]`)
      await status.waitFor()
      await expect.poll(() => status.textContent()).toBe('Order now')

      await page.locator(`${rowId} [col-id="sku"]`).click()
      const drawer = page.locator('[data-test="reorder-drawer"]')
      await drawer.locator('[data-test="usage-chart"] canvas').waitFor()
      await drawer.locator('[data-test="projection-chart"] canvas').waitFor()
      await expect.poll(() => drawer.locator('[data-test="drawer-steps"]').textContent()).toContain('ROP = d̄·L + SS')
      await h.screenshot(page, 'reorder-drawer')
      await drawer.locator('.el-drawer__close-btn').click()

      await page.locator(`${rowId} .ag-selection-checkbox input`).check()
      await page.locator('[data-test="accept-selected"]').click()
      await page.locator('.el-message--success').waitFor()
      const rows = await h.ds.query(
        `SELECT vendor_id, qty, status, source FROM purchase_suggestions WHERE item_id = ? AND warehouse_id = ?`, [fx.itemId, fx.warehouseId])
      expect(rows).toHaveLength(1)
      expect(rows[0]).toMatchObject({ vendor_id: fx.vendorId, status: 'accepted', source: 'reorder' })
      expect(rows[0].qty).toBeGreaterThan(0)
      // What is accepted counts in the position, so the line leaves "order now"; under "all" it shows as pending.
      await expect.poll(() => page.locator(rowId).count()).toBe(0)
      await page.locator('[data-test="group-all"]').click()
      await expect.poll(() => pending.textContent()).toBe(String(rows[0].qty))
      await h.screenshot(page, 'reorder-accepted')
    } finally {
      await context.close()
    }
  })

  it('sets an override with its reason from a line, and shows the ABC Pareto chart', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 1400, height: 900 } })
    try {
      await h.signInByApi(page, 'buyer')
      await page.goto(`/purchasing/reorder/policies?itemId=${fx.deadItemId}&warehouseId=${fx.warehouseId}`)
      const form = page.locator('[data-test="policy-form"]')
      await form.locator('[data-test="policy-overrideReorderPoint"] input').fill('40')
      await form.locator('[data-test="policy-save"]').click()
      // no reason yet: refused beside the field, nothing saved
      await expect.poll(() => form.textContent()).toContain('Say why the computed figure is set aside')
      await form.locator('[data-test="policy-overrideReason"]').fill('grout for the Quarry Road pool job')
      await form.locator('[data-test="policy-save"]').click()
      await expect.poll(() => page.locator('[data-test="policies-table"]').textContent()).toContain('grout for the Quarry Road pool job')
      const [row] = await h.ds.query('SELECT override_reorder_point, override_reason FROM reorder_policies WHERE item_id = ?', [fx.deadItemId])
      expect(row).toEqual({ override_reorder_point: 40, override_reason: 'grout for the Quarry Road pool job' })
      await page.locator('[data-test="policies-table"] .el-loading-mask').waitFor({ state: 'hidden' })
      await h.screenshot(page, 'reorder-policies')

      await page.goto('/purchasing/reorder/abc')
      await page.locator('[data-test="pareto-chart"] canvas').waitFor()
      await expect.poll(() => page.locator('[data-test="abc-summary"]').textContent()).toMatch(/A: \d+ items/)
      await h.screenshot(page, 'reorder-abc')
    } finally {
      await context.close()
    }
  })
})
