// The catalog in a real browser: the admin finds an item with the quick search, opens it and sees
// its stock by bin and lot; then opens a bin label sheet, whose first label ZXing (an independent
// decoder) reads back as the bin's code.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { decodePng } from '../support/decodePng.js'
import { startE2e, type E2eHarness } from '../support/browser.js'

let h: E2eHarness
beforeAll(async () => {
  h = await startE2e()
})
afterAll(() => h?.close())

describe('catalog screens', () => {
  it('finds an item by quick search, opens it and shows stock by bin and lot', async () => {
    const [target] = await h.ds.query(`
      SELECT i.id, i.sku, i.name FROM items i JOIN stock_balances sb ON sb.item_id = i.id
      WHERE i.family = 'glass_block' AND i.active = 1 AND sb.on_hand > 0 AND sb.lot_id IS NOT NULL
      GROUP BY i.id ORDER BY COUNT(*) DESC, i.id LIMIT 1`)
    const balances = await h.ds.query(`
      SELECT bn.code AS bin, l.code AS lot, sb.on_hand FROM stock_balances sb JOIN bins bn ON bn.id = sb.bin_id
      JOIN lots l ON l.id = sb.lot_id WHERE sb.item_id = ? AND sb.on_hand > 0`, [target.id])
    const { page, context } = await h.newPage()
    try {
      await h.signInByApi(page, 'admin')
      await page.goto('/stock/items')
      await page.locator('[data-test="catalog-grid"] .ag-row').first().waitFor()
      await page.locator('[data-test="catalog-search"]').fill(target.sku)
      const skuCell = page.locator('[data-test="catalog-grid"] .sku-cell').filter({ hasText: new RegExp(`^${target.sku}$`) })
      await expect.poll(() => page.locator('[data-test="catalog-grid"] .sku-cell').count()).toBeLessThanOrEqual(3)
      await h.screenshot(page, 'catalog-quick-search')
      await skuCell.click()
      await page.waitForURL(new RegExp(`/stock/items/${target.id}$`))
      await expect.poll(() => page.locator('[data-test="item-sku"]').textContent()).toBe(target.sku)
      await page.locator('[data-test="item-stock-bins"]').waitFor()
      const lotsShown = await page.locator('[data-test="item-stock-bins"] [data-test="bin-lot"]').allTextContents()
      expect(lotsShown.sort()).toEqual(balances.map((b: { lot: string }) => b.lot).sort())
      const binsText = await page.locator('[data-test="item-stock-bins"]').textContent()
      for (const b of balances) expect(binsText).toContain(b.bin)
      await h.screenshot(page, 'catalog-item-stock')
    } finally {
      await context.close()
    }
  })

  it('prints a bin label sheet whose labels scan back to their bins', async () => {
    const [wh] = await h.ds.query("SELECT id FROM warehouses WHERE code = 'HRY'")
    const bins = await h.ds.query("SELECT code FROM bins WHERE warehouse_id = ? AND kind <> 'transit' ORDER BY code", [wh.id])
    const context = await h.browser.newContext({ baseURL: h.baseUrl, viewport: { width: 1100, height: 1400 }, deviceScaleFactor: 2 })
    const page = await context.newPage()
    try {
      await h.signInByApi(page, 'admin')
      await page.goto('/stock/warehouses')
      await page.locator('[data-test="wh-HRY"]').click()
      await page.locator('[data-test="bin-labels-link"]').click()
      await page.waitForURL(/\/stock\/labels\?/)
      await page.locator('[data-test="label"]').first().waitFor()
      expect(await page.locator('[data-test="label"]').count()).toBe(bins.length)
      expect(await page.locator('[data-test="label-page"]').count()).toBe(Math.ceil(bins.length / 30)) // 30 labels per letter sheet
      await page.locator('aside.rail').waitFor({ state: 'detached', timeout: 1000 }).catch(() => undefined)
      expect(await page.locator('aside.rail').count()).toBe(0) // printed without the app's shell
      await h.screenshot(page, 'catalog-bin-labels')
      // Barcodes are drawn at their printed size (a module is about one screen pixel): zoom in to read one off the screen.
      await page.evaluate(() => { document.body.style.zoom = '4' })
      const png = await page.locator('[data-test="label"] [data-barcode] svg').first().screenshot()
      // source: ZXing (@zxing/library), an independent Code 128 decoder
      expect(decodePng(png, 'code128')).toBe(`B:${bins[0].code}`)
    } finally {
      await context.close()
    }
  })
})
