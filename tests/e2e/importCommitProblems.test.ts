// An import refused on its way: a file checks clean, then its bin is taken out of use before the import runs, so
// the commit finds a problem on every row and writes nothing. The page then shows every problem the commit found,
// paged and filtered like a check's (they are kept under the commit's run), not only the first five rows of its
// message; in Spanish too. Chromium against the real app and MariaDB.
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { countRows, tagOf } from '../support/fixtureRows.js'
import { closeImportPage, rowRange, shownProblemRows } from '../support/importPages.js'
import { openInApp } from '../support/routeWalk.js'
import { createOpeningStockTarget } from '../support/stockFixtures.js'

const tag = tagOf()
const SKU = `CP-BLK-${tag}`
const WH = `CP${tag}`
const ROWS = 1_200
let h: E2eHarness
let page: Page
let context: BrowserContext
let itemId = 0

beforeAll(async () => {
  h = await startE2e()
  itemId = await createOpeningStockTarget(h.ds, SKU, WH)
  ;({ page, context } = await h.newPage())
  await h.signIn(page, 'admin')
})
afterAll(() => closeImportPage(h, context))

// Every row good at the check: the lot-matched block, each row its own lot (data row i is sheet row i + 2, the header
// being row 1; common practice).
const file = Buffer.from(['SKU,Warehouse,Bin,Lot,Quantity,Unit cost',
  ...Array.from({ length: ROWS }, (_, i) => `${SKU},${WH},A-01-1,L-${i},5,3.1000`)].join('\r\n') + '\r\n', 'utf8')

const shownRows = () => shownProblemRows(page)
const range = rowRange
const binInUse = (active: 0 | 1) => h.ds.query('UPDATE bins b JOIN warehouses w ON w.id = b.warehouse_id SET b.active = ? WHERE w.code = ?', [active, WH])

/** Checks the file (clean), takes the bin out of use, then imports: the commit is refused for every row. */
async function checkThenCommitAfterChange(): Promise<void> {
  await binInUse(1)
  await page.locator('[data-test="import-file"]').setInputFiles({ name: 'opening.csv', mimeType: 'text/csv', buffer: file })
  await page.locator('[data-test="import-check"]').click()
  await page.locator('[data-test="import-summary"]').waitFor({ timeout: 30_000 })
  await expect.poll(() => page.locator('[data-test="import-commit"]').isEnabled(), { timeout: 10_000 }).toBe(true)
  await binInUse(0)
  await page.locator('[data-test="import-commit"]').click()
  await page.locator('[data-test="import-commit-found"]').waitFor({ timeout: 30_000 })
}

describe('an import refused on its way', () => {
  it('shows every problem the commit found, paged and filtered, in English and Spanish', async () => {
    await openInApp(page, '/admin/imports?kind=opening_stock')
    await checkThenCommitAfterChange()
    expect(await shownRows()).toEqual(range(2, 51))
    const pages = page.locator('[data-test="import-problem-pages"]')
    // 1,200 rows, one problem each (the bin is out of use). Written the US way, as the page's number formats are
    // for both languages (source: CLDR en-US / es-US grouping, as Intl.NumberFormat gives it).
    expect(await page.locator('[data-test="import-problem-total"]').textContent()).toBe(`${new Intl.NumberFormat('en-US').format(ROWS)} problems in all`)
    expect(await page.locator('[data-test="import-problem-total"]').textContent()).toContain('1,200')
    await pages.locator('button.btn-next').click()
    await expect.poll(shownRows, { timeout: 10_000 }).toEqual(range(52, 101))
    // The last page: 1,200 problems at 50 a page end on page 24, sheet rows 1,152 to 1,201.
    await pages.locator('.el-pager li').last().click()
    await expect.poll(shownRows, { timeout: 10_000 }).toEqual(range(1152, 1201))
    // One column alone: every problem is the bin's.
    await page.locator('[data-test="import-problem-column"]').click()
    await page.locator('.el-select-dropdown__item', { hasText: 'Bin' }).click()
    await expect.poll(shownRows, { timeout: 10_000 }).toEqual(range(2, 51))
    // Nothing came in, and the import cannot be sent again until the file is checked again.
    expect(await countRows(h.ds, 'stock_moves', 'item_id = ?', [itemId])).toBe(0)
    expect(await page.locator('[data-test="import-commit"]').isEnabled()).toBe(false)

    await h.ds.query("UPDATE users SET locale = 'es' WHERE username = 'admin'")
    await page.reload()
    await checkThenCommitAfterChange()
    // src/i18n/es/golive.ts pagerTotal and commitFound.
    expect(await page.locator('[data-test="import-problem-total"]').textContent()).toBe(`${new Intl.NumberFormat('es-US').format(ROWS)} problemas en total`)
    expect(await page.locator('[data-test="import-commit-found"]').textContent()).toContain('no se importó nada')
    await page.locator('[data-test="import-problem-pages"] button.btn-next').click()
    await expect.poll(shownRows, { timeout: 10_000 }).toEqual(range(52, 101))
    expect(await countRows(h.ds, 'stock_moves', 'item_id = ?', [itemId])).toBe(0)
  }, 90_000)
})
