// The stock screens in a real browser, as the warehouse crew: open the Stock area, adjust an item's
// stock with a reason through the scan field (a keyboard wedge types the label, then Enter), confirm,
// see the new ledger row; the ledger page and the overview; the bin's label sheet; tablet sizes.
import { randomUUID } from 'node:crypto'
import ExcelJS from 'exceljs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { createStockFixture, type StockFixture } from '../support/stockFixtures.js'

let h: E2eHarness
let fx: StockFixture

beforeAll(async () => {
  h = await startE2e()
  fx = await createStockFixture(h.ds)
})
afterAll(() => h?.close())

/** The crew's first receipt of the test item, through the API with the page's own session. */
async function receiveThroughApi(page: Page): Promise<void> {
  const res = await page.request.post('/api/stock/receipts', {
    headers: { 'X-Lumenyard-Request': '1', 'Idempotency-Key': randomUUID() },
    data: { warehouseId: fx.warehouses[0].id, lines: [{ itemId: fx.itemId, binId: fx.bins.A1, lotId: fx.lotId, qty: 24, unitCost: '6.1000' }] },
  })
  expect(res.status()).toBe(201)
}

const onHand = async () => {
  const [row] = await h.ds.query('SELECT on_hand FROM stock_balances WHERE item_id = ? AND bin_id = ? AND lot_id = ?', [fx.itemId, fx.bins.A1, fx.lotId])
  return row?.on_hand as number | undefined
}

/** The page answers over the network and under load: wait up to 10 s (vitest's default poll gives up after 1 s). */
const poll = <T>(read: () => T | Promise<T>) => expect.poll(read, { timeout: 10_000 })

/** A keyboard-wedge scanner: it types the label's text and presses Enter. */
async function scan(page: Page, text: string): Promise<void> {
  const field = page.locator('[data-test="scan"]')
  await field.fill(text)
  await field.press('Enter')
}

describe('stock screens for the warehouse crew', () => {
  it('adjusts an item’s stock with a reason and shows the new ledger row', async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signInByApi(page, 'warehouse')
      await receiveThroughApi(page)
      await page.goto('/stock')
      await page.locator('[data-test="home-adjust"]').waitFor()
      await h.screenshot(page, 'stock-home-warehouse')

      await page.goto(`/stock/adjust?binId=${fx.bins.A1}`)
      await poll(() => page.locator('[data-test="adjust-bin"]').textContent()).toContain('A-01-1')
      // Our lot label: "L:" + SKU + "|" + lot code (shared/barcode/scan.ts) fills item and lot at once.
      await scan(page, `L:${fx.sku}|${fx.lotCode}`)
      await poll(() => page.locator('[data-test="scan-message"]').textContent()).toContain(fx.lotCode)
      await poll(() => page.locator('[data-test="adjust-here"]').textContent()).toMatch(/24 uds\. en mano/) // the warehouse demo user reads Spanish

      // Bad input first: no reason chosen is refused beside the field, nothing is sent.
      await page.locator('[data-test="adjust-review"]').click()
      await poll(() => page.locator('.el-form-item.is-error').count()).toBeGreaterThan(0)
      expect(await onHand()).toBe(24)

      // An impossible change is refused beside the quantity, in Spanish, before any confirmation.
      await page.locator('[data-reason="damaged"]').click()
      await page.locator('[data-test="adjust-qty"] input').fill('99999')
      await page.locator('[data-test="adjust-review"]').click()
      // source: CLDR Spanish number format, "." groups thousands from five digits (checked with Node's Intl)
      await poll(() => page.locator('.el-form-item__error').first().textContent()).toContain('Solo hay 24 uds. en esta ubicación: no pueden salir 99.999 uds.')
      expect(await page.locator('[data-test="confirm-dialog"]').isVisible()).toBe(false)
      expect(await onHand()).toBe(24)

      await page.locator('[data-test="adjust-qty"] input').fill('3')
      await page.locator('[data-test="adjust-note"]').fill('Two chipped, one cracked')
      await page.locator('[data-test="adjust-review"]').click()
      const dialog = page.locator('[data-test="confirm-dialog"]')
      await dialog.waitFor()
      await poll(() => dialog.textContent()).toMatch(/24 uds\.\s*→\s*21 uds\. \(-3\)/)
      await h.screenshot(page, 'stock-adjust-confirm')
      // A double click on confirm must apply once: same submission, same Idempotency-Key.
      await page.locator('[data-test="confirm-submit"]').dblclick()
      await poll(onHand).toBe(21)

      const row = page.locator('[data-test="ledger-grid"] .ag-row').filter({ hasText: 'Two chipped, one cracked' })
      await h.screenshot(page, 'stock-adjust-after')
      await row.first().waitFor()
      expect(await row.count()).toBe(1)
      expect(await row.first().textContent()).toMatch(/-3/)
      expect(await row.first().textContent()).toMatch(/Damaged|Dañado/)
      await h.screenshot(page, 'stock-adjust-done')
      const [moves] = await h.ds.query(`SELECT COUNT(*) AS n FROM stock_moves WHERE item_id = ? AND reason = 'damaged'`, [fx.itemId])
      expect(Number(moves.n)).toBe(1)
    } finally {
      await context.close()
    }
  })

  it('shows the ledger filtered by item from the address, and the overview', async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signInByApi(page, 'warehouse')
      await page.goto(`/stock/ledger?itemId=${fx.itemId}`)
      await poll(() => page.locator('[data-test="ledger-grid"] .ag-row').count()).toBe(2) // the receipt and the adjustment
      await h.screenshot(page, 'stock-ledger-item')
      // The spreadsheet of what is on screen: the same two moves, quantities as numbers.
      const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-test="ledger-export"]').click()])
      expect(download.suggestedFilename()).toMatch(/^stock-movements-\d{4}-\d{2}-\d{2}\.xlsx$/)
      const wb = new ExcelJS.Workbook()
      await wb.xlsx.readFile(await download.path())
      const sheet = wb.getWorksheet('Stock movements')!
      expect(sheet.rowCount).toBe(3)
      expect([sheet.getRow(2).getCell(8).value, sheet.getRow(3).getCell(8).value]).toEqual([-3, 24])
      await page.goto('/stock/overview')
      await page.locator('[data-test="overview-quick"]').fill(fx.sku)
      const line = page.locator('[data-test="overview-grid"] .ag-row').filter({ hasText: fx.sku })
      await line.first().waitFor()
      expect(await line.first().textContent()).toContain('21')
      // The crew sets a minimum right in the grid; 21 free is below 30, so the line is flagged low.
      await line.first().locator('[col-id="minQty"]').click()
      await line.first().locator('[col-id="minQty"] input').fill('30')
      await line.first().locator('[col-id="minQty"] input').press('Enter')
      await poll(async () => (await h.ds.query('SELECT min_qty FROM item_warehouses WHERE item_id = ? AND warehouse_id = ?', [fx.itemId, fx.warehouses[0].id]))[0]?.min_qty).toBe(30)
      await poll(() => line.first().locator('[col-id="low"]').textContent()).toMatch(/^(Low|Bajo)$/)
      await h.screenshot(page, 'stock-overview')
    } finally {
      await context.close()
    }
  })

  it('opens the bin’s label sheet from the bins page', async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signInByApi(page, 'warehouse')
      await page.goto(`/stock/bins?warehouseId=${fx.warehouses[0].id}`)
      await page.locator(`[data-bin="A-01-1"]`).waitFor()
      await h.screenshot(page, 'stock-bins')
      // The label sheet is the catalog screens' route /stock/labels (kind=bin&warehouseId&ids).
      await page.locator('[data-test="bins-labels"]').click()
      await page.waitForURL(/\/stock\/labels\?/)
      // Only A-01-1 holds stock, so the sheet carries its one label.
      await poll(() => page.locator('[data-test="labels-count"]').textContent()).toMatch(/\b1\b/)
      expect(new URL(page.url()).searchParams.get('ids')).toBe(String(fx.bins.A1))
      await h.screenshot(page, 'stock-bin-labels')
    } finally {
      await context.close()
    }
  })

  it('ships a transfer by scanning, then puts it away at the other warehouse', async () => {
    const { page, context } = await h.newPage()
    const [w1, w2] = fx.warehouses
    const pick = async (select: string, text: string) => {
      await page.locator(`[data-test="${select}"]`).click()
      await page.locator('.el-select-dropdown__item:visible').filter({ hasText: text }).first().click()
      await poll(() => page.locator('.el-select-dropdown__item:visible').count()).toBe(0) // closed, not still fading
    }
    try {
      await h.signInByApi(page, 'warehouse')
      await page.goto('/stock/transfers')
      await page.locator('[data-test="transfer-ship"]').click()
      await pick('ship-from', w1.code)
      await pick('ship-to', w2.code)
      // Two labels in quick succession, as a scanner delivers them: both are read, in order.
      await scan(page, 'B:A-01-1')
      await scan(page, `L:${fx.sku}|${fx.lotCode}`)
      await poll(() => page.locator('[data-test="ship-dialog"] [data-test="scan-message"]').textContent()).toContain(fx.lotCode)
      const before = (await onHand())!
      await poll(() => page.locator('[data-line="0"]').textContent()).toMatch(new RegExp(`${before} (here|aquí)`))
      await page.locator('[data-line="0"] .ly-number input').fill('4')
      await h.screenshot(page, 'stock-transfer-ship-form')
      await page.locator('[data-test="ship-review"]').click()
      await page.locator('[data-test="confirm-dialog"]').filter({ hasText: w2.code }).waitFor()
      await h.screenshot(page, 'stock-transfer-ship-confirm')
      await page.locator('[data-test="confirm-submit"]').click()
      await poll(onHand).toBe(before - 4)
      const [transfer] = await h.ds.query('SELECT id FROM transfers WHERE from_warehouse_id = ? ORDER BY id DESC LIMIT 1', [w1.id])
      const card = page.locator(`[data-transfer="${transfer.id}"]`)
      await card.waitFor()
      await card.locator('[data-test="transfer-receive"]').click()
      const receive = page.locator('[data-test="receive-dialog"]')
      await receive.waitFor()
      await receive.locator('[data-test="scan"]').fill('B:B-01-1')
      await receive.locator('[data-test="scan"]').press('Enter')
      await poll(() => receive.locator('[data-test="receive-bin-0"]').textContent()).toContain('B-01-1')
      await receive.locator('[data-test="receive-review"]').click()
      await page.locator('[data-test="confirm-submit"]:visible').click()
      await poll(async () => (await h.ds.query('SELECT status FROM transfers WHERE id = ?', [transfer.id]))[0].status).toBe('received')
      const [putAway] = await h.ds.query('SELECT on_hand FROM stock_balances WHERE item_id = ? AND bin_id = ? AND lot_id = ?', [fx.itemId, fx.bins.B1, fx.lotId])
      expect(putAway.on_hand).toBe(4)
      await page.locator('[data-test="transfer-status"] label').nth(1).click()
      await card.waitFor()
      await h.screenshot(page, 'stock-transfers-received')
    } finally {
      await context.close()
    }
  })

  it('works on a warehouse tablet: controls at least 44 px tall', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 800, height: 1100 } })
    try {
      await h.signInByApi(page, 'warehouse')
      await page.goto(`/stock/move?fromBinId=${fx.bins.A1}&itemId=${fx.itemId}`)
      await page.locator('[data-test="move-review"]').waitFor()
      // source: WCAG 2.2 success criterion 2.5.5 Target Size (Enhanced): at least 44 by 44 CSS pixels.
      const heights = await page.locator('.stock-form .el-select__wrapper, .stock-form .el-input__wrapper, .stock-actions button, .scan .el-input__wrapper')
        .evaluateAll((els) => els.map((e) => Math.round(e.getBoundingClientRect().height)))
      expect(heights.length).toBeGreaterThan(4)
      expect(Math.min(...heights)).toBeGreaterThanOrEqual(44)
      const width = await page.evaluate(() => document.documentElement.scrollWidth)
      expect(width).toBeLessThanOrEqual(800) // no sideways scrolling
      await h.screenshot(page, 'stock-move-tablet')
    } finally {
      await context.close()
    }
  })
})
