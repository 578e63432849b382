// Every problem of a big bad file reachable from the import page in Chromium: the check answers the first page,
// the pager turns to the next ones and to the last (read from the server, where every problem is kept), and the
// column filter shows one column's problems alone; in Spanish the same pages say their words in Spanish.
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { tagOf } from '../support/fixtureRows.js'
import { closeImportPage, rowRange, shownProblemRows } from '../support/importPages.js'
import { sidewaysScroll } from '../support/layoutChecks.js'
import { openInApp } from '../support/routeWalk.js'
import { createOpeningStockTarget } from '../support/stockFixtures.js'

const tag = tagOf()
const SKU = `PP-BLK-${tag}`
const WH = `PP${tag}`
const ROWS = 1_500
let h: E2eHarness
let page: Page
let context: BrowserContext

beforeAll(async () => {
  h = await startE2e()
  await createOpeningStockTarget(h.ds, SKU, WH)
  ;({ page, context } = await h.newPage())
  await h.signIn(page, 'admin')
})
afterAll(() => closeImportPage(h, context))

// Every row is bad: even rows name an unknown SKU, odd rows a negative quantity. Data row i is sheet row i + 2
// (the header is row 1; common practice).
const file = Buffer.from(['SKU,Warehouse,Bin,Lot,Quantity,Unit cost',
  ...Array.from({ length: ROWS }, (_, i) => `${i % 2 ? SKU : `NOPE-${tag}-${i}`},${WH},A-01-1,L-${i},${i % 2 ? -3 : 5},3.1000`)].join('\r\n') + '\r\n', 'utf8')

const shownRows = () => shownProblemRows(page)
const range = rowRange

describe('import problem pages', () => {
  it('pages through every problem of 1,500 bad rows and filters one column', async () => {
    await openInApp(page, '/admin/imports?kind=opening_stock')
    await page.locator('[data-test="import-file"]').setInputFiles({ name: 'all-bad.csv', mimeType: 'text/csv', buffer: file })
    await page.locator('[data-test="import-check"]').click()
    await page.locator('[data-test="import-summary"]').waitFor({ timeout: 30_000 })
    expect(await shownRows()).toEqual(range(2, 51))
    const pages = page.locator('[data-test="import-problem-pages"]')
    expect(await pages.textContent()).toContain('1,500')
    await pages.locator('button.btn-next').click()
    await expect.poll(shownRows, { timeout: 10_000 }).toEqual(range(52, 101))
    // The last page: 1,500 problems at 50 a page end on page 30 with rows 1,452 to 1,501.
    await pages.locator('.el-pager li').last().click()
    await expect.poll(shownRows, { timeout: 10_000 }).toEqual(range(1452, 1501))

    // One column alone: the negative quantities are the odd data rows, sheet rows 3, 5, 7, …
    await page.locator('[data-test="import-problem-column"]').click()
    await page.locator('.el-select-dropdown__item', { hasText: 'Quantity' }).click()
    await expect.poll(shownRows, { timeout: 10_000 }).toEqual(range(3, 101, 2))
    expect(await pages.textContent()).toContain('750')

    // In Spanish the same page speaks Spanish, the problems included.
    await h.ds.query("UPDATE users SET locale = 'es' WHERE username = 'admin'")
    await page.reload()
    await page.locator('[data-test="import-file"]').setInputFiles({ name: 'all-bad.csv', mimeType: 'text/csv', buffer: file })
    await page.locator('[data-test="import-check"]').click()
    await page.locator('[data-test="import-summary"]').waitFor({ timeout: 30_000 })
    await page.locator('[data-test="import-problem-pages"] button.btn-next').click()
    await expect.poll(shownRows, { timeout: 10_000 }).toEqual(range(52, 101))
    // src/i18n/es/golive.ts problemsTitle
    expect(await page.locator('.problems-title').textContent()).toContain('problemas por corregir')
  }, 90_000)

  // The pager on a 412 px phone (a common Android phone's CSS width, as in the team's trials): one line, and
  // every button at least 44 × 44 px with 8 px between neighbours, so a thumb lands on the page it aims at.
  // source: WCAG 2.2 SC 2.5.5 Target Size (Enhanced), 44 × 44 CSS pixels; 8 px between targets is common practice
  it('pages on a 412 px phone with one line of buttons a thumb can hit', async () => {
    const phone = await h.newPage({ viewport: { width: 412, height: 900 } })
    try {
      await h.signInByApi(phone.page, 'admin')
      await phone.page.goto('/admin/imports?kind=opening_stock')
      await phone.page.locator('[data-test="import-file"]').setInputFiles({ name: 'all-bad.csv', mimeType: 'text/csv', buffer: file })
      await phone.page.locator('[data-test="import-check"]').click()
      await phone.page.locator('[data-test="import-summary"]').waitFor({ timeout: 30_000 })
      // Whichever pager the screen shows at this width.
      const pager = phone.page.locator('[data-test="import-problem-pages"]:visible, [data-test="import-problem-pager-narrow"]:visible').first()
      await pager.waitFor()
      const shape = await pager.evaluate((el) => {
        const shown = (e: Element) => (e as HTMLElement).checkVisibility()
        const box = (e: Element) => e.getBoundingClientRect()
        const buttons = Array.from(el.querySelectorAll('button, li')).filter(shown).map(box)
        // Its parts and each button: on one line, every one overlaps every other from top to bottom.
        const parts = [...Array.from(el.children).filter(shown).map(box), ...buttons]
        const gaps = buttons.slice(1).map((b, i) => Math.round(b.left - buttons[i].right))
        return {
          buttons: buttons.length,
          smallest: Math.min(...buttons.map((b) => Math.min(b.width, b.height))),
          oneLine: Math.max(...parts.map((r) => r.top)) < Math.min(...parts.map((r) => r.bottom)),
          closest: Math.min(...gaps),
        }
      })
      expect(shape.buttons).toBeGreaterThanOrEqual(4)
      expect(shape.oneLine, JSON.stringify(shape)).toBe(true)
      expect(shape.smallest, JSON.stringify(shape)).toBeGreaterThanOrEqual(44)
      expect(shape.closest).toBeGreaterThanOrEqual(8)
      expect((await sidewaysScroll(phone.page)).by).toBe(0)
      await h.screenshot(phone.page, 'import-problem-pager-phone')
      // The buttons turn the pages: the next page, then the last (1,500 problems at 50 a page: rows 1,452 to 1,501).
      const rows = () => shownProblemRows(phone.page)
      expect(await rows()).toEqual(range(2, 51))
      await pager.locator('[data-test="pager-next"]').click()
      await expect.poll(rows, { timeout: 10_000 }).toEqual(range(52, 101))
      await pager.locator('[data-test="pager-last"]').click()
      await expect.poll(rows, { timeout: 10_000 }).toEqual(range(1452, 1501))
      expect(await pager.locator('[data-test="pager-next"]').isDisabled()).toBe(true)
    } finally {
      await phone.context.close()
    }
  }, 90_000)
})
