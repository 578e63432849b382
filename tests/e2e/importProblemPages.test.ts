// Every problem of a big bad file reachable from the import page in Chromium: the check answers the first page,
// the pager turns to the next ones and to the last (read from the server, where every problem is kept), and the
// column filter shows one column's problems alone; in Spanish the same pages say their words in Spanish.
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { tagOf } from '../support/fixtureRows.js'
import { closeImportPage, rowRange, shownProblemRows } from '../support/importPages.js'
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
})
