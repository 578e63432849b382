// The owner's reports and the audit trail in the browser: a report picked, its spreadsheet downloaded and
// read back with exceljs; the report chooser on a phone (412 px), where the tabs used to run off the side;
// the audit trail filtered by person and kind.
import ExcelJS from 'exceljs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF } from '../support/apiHarness.js'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { sidewaysScroll } from '../support/layoutChecks.js'
import { fxItem, fxWarehouse, signedInAgent, tagOf, type FxItem, type FxWarehouse } from '../support/pickFixtures.js'

let h: E2eHarness
let wh: FxWarehouse
let grout: FxItem
const tag = tagOf()

beforeAll(async () => {
  h = await startE2e()
  const admin = await signedInAgent(h.built.app, 'admin', DEMO_PASSWORD)
  wh = await fxWarehouse(h.ds, `D${tag}`, ['A-01-1'])
  grout = await fxItem(h.ds, `DG-${tag}`, { family: 'grout' })
  // 10 bags at 6.00 then 5 at 9.00, never used: dead stock worth (60.00 + 45.00) = 105.00 at the moving average 7.00.
  const res = await admin.post('/api/stock/receipts').set(CSRF).send({ warehouseId: wh.id, lines: [
    { itemId: grout.id, binId: wh.bins['A-01-1'], lotId: null, qty: 10, unitCost: '6.00' },
    { itemId: grout.id, binId: wh.bins['A-01-1'], lotId: null, qty: 5, unitCost: '9.00' },
  ] })
  expect(res.status).toBe(201)
})
afterAll(() => h?.close())

describe('reports', () => {
  it('opens, picks the dead stock report for one warehouse and exports it to a spreadsheet that reads back', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 1280, height: 860 } })
    try {
      await h.signInByApi(page, 'admin')
      await page.goto(`/purchasing/reports?warehouseId=${wh.id}`)
      await page.locator('[data-test="report-tabs"] .el-tabs__item', { hasText: 'Dead and slow stock' }).click()
      await page.waitForURL(/tab=dead-stock/)
      await expect.poll(() => page.locator('[data-test="report-table"]').textContent()).toContain(grout.sku)
      expect(await page.locator('[data-test="report-table"]').textContent()).toContain('$105.00')
      const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-test="report-export"]').click()])
      const book = new ExcelJS.Workbook()
      await book.xlsx.readFile(await download.path())
      const sheet = book.worksheets[0]
      const rows: unknown[][] = []
      sheet.eachRow((row) => rows.push((row.values as unknown[]).slice(1)))
      const header = rows.findIndex((r) => r.includes('SKU'))
      expect(header).toBeGreaterThanOrEqual(0)
      const line = rows.find((r) => r.includes(grout.sku))
      expect(line).toBeDefined()
      // source: moving-average cost, (10 × 6.00 + 5 × 9.00) ÷ 15 = 7.00 a bag; 15 × 7.00 = 105.00 (arithmetic by hand)
      expect(line![rows[header].indexOf('Value')]).toBe(105)
      expect(line![rows[header].indexOf('On hand')]).toBe(15)
      expect(line![rows[header].indexOf('Kind')]).toBe('Dead')
    } finally {
      await context.close()
    }
  })

  it('on a phone offers the reports in a chooser, none cut off, and the page never scrolls sideways', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 412, height: 915 } })
    try {
      await h.signInByApi(page, 'admin')
      await page.goto('/purchasing/reports')
      await page.locator('[data-test="report-choice"]').waitFor()
      // Found on a phone: the tab strip ran past the edge and the last reports sat behind a sideways scroll.
      expect(await page.locator('[data-test="report-tabs"]').isVisible()).toBe(false)
      const box = await page.locator('[data-test="report-choice"]').boundingBox()
      expect(box && box.x >= 0 && box.x + box.width <= 412).toBe(true)
      expect(box!.height).toBeGreaterThanOrEqual(40)
      await expect.poll(async () => (await sidewaysScroll(page)).culprits.join(', ') || 'none').toBe('none')
      for (const name of ['Usage by month', 'Vendors on time']) {
        await page.locator('[data-test="report-choice"]').click()
        await page.locator('.el-select-dropdown__item:visible', { hasText: name }).click()
        await page.locator('[data-test="report-choice"]').filter({ hasText: name }).waitFor()
        await expect.poll(async () => (await sidewaysScroll(page)).culprits.join(', ') || 'none').toBe('none')
      }
      expect(page.url()).toContain('tab=vendors')
      await h.screenshot(page, 'reports-phone')
    } finally {
      await context.close()
    }
  })
})

describe('audit trail', () => {
  it('filters by person and kind: only that person\'s sign-ins are listed', async () => {
    const crew = await h.newPage()
    try {
      await h.signIn(crew.page, 'warehouse') // Tomás Reyes signs in: an entry of kind sign-in
    } finally {
      await crew.context.close()
    }
    const { page, context } = await h.newPage({ viewport: { width: 1280, height: 860 } })
    try {
      await h.signInByApi(page, 'admin')
      // Today's entries only (the days filter is in the address), so the page doesn't first merge a year of ledger.
      const day = new Date().toISOString().slice(0, 10)
      await page.goto(`/admin/audit?from=${day}&to=${day}`)
      await page.locator('[data-test="audit-entries"], [data-test="audit-empty"]').first().waitFor()
      await page.locator('[data-test="audit-person"]').click()
      await page.locator('.el-select-dropdown__item:visible', { hasText: 'Tomás Reyes' }).click()
      await page.locator('[data-test="audit-kind"]').click()
      await page.locator('.el-select-dropdown__item:visible', { hasText: 'Sign-ins' }).click()
      await page.keyboard.press('Escape')
      await page.waitForURL(/kind=sign_in/)
      await expect.poll(async () => {
        const kinds = await page.locator('[data-test="audit-entry"]').evaluateAll((els) => els.map((e) => e.className))
        const people = await page.locator('[data-test="audit-entry"] .who').allTextContents()
        return kinds.length > 0 && kinds.every((k) => k.includes('kind-sign_in')) && people.every((p) => p === 'Tomás Reyes')
      }).toBe(true)
      expect(page.url()).toMatch(/userId=\d+/)
      await h.screenshot(page, 'audit-filtered')
    } finally {
      await context.close()
    }
  })
})
