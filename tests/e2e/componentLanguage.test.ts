// A Spanish user meets no English from the component libraries: the paginated ledger, its date picker, a
// search that finds nothing, the stock grid's filter menu and the grid left empty. The English words looked for
// are the libraries' own English locale files (Element Plus's `en`, AG Grid's AG_GRID_LOCALE_EN), less the
// words that are the same in their Spanish files.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { AG_GRID_LOCALE_EN, AG_GRID_LOCALE_ES } from '@ag-grid-community/locale'
import elEn from 'element-plus/es/locale/lang/en'
import elEs from 'element-plus/es/locale/lang/es'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { openInApp } from '../support/routeWalk.js'

type Tree = { [k: string]: string | Tree }
function leaves(tree: Tree, prefix = ''): Map<string, string> {
  const out = new Map<string, string>()
  for (const [k, v] of Object.entries(tree)) {
    if (typeof v === 'string') out.set(prefix + k, v)
    else for (const [kk, vv] of leaves(v, `${prefix}${k}.`)) out.set(kk, vv)
  }
  return out
}
/** English strings that differ from the Spanish one under the same key, as patterns ({total} matches anything). */
function englishOnly(en: Tree, es: Tree): RegExp[] {
  const spanish = leaves(es)
  return [...leaves(en)]
    .filter(([k, v]) => v.trim().length > 2 && spanish.get(k) !== v)
    .map(([, v]) => new RegExp(`^${v.trim().replace(/[.*+?^$()|[\]\\]/g, '\\$&').replace(/\{\w+\}/g, '.*')}$`))
}
const ENGLISH = [
  ...englishOnly(elEn as unknown as Tree, elEs as unknown as Tree),
  ...englishOnly(AG_GRID_LOCALE_EN as unknown as Tree, AG_GRID_LOCALE_ES as unknown as Tree),
]

/** Every text, label and placeholder shown inside the matched parts of the page. */
async function wordsIn(page: Page, selector: string): Promise<string[]> {
  return page.evaluate((sel) => {
    const out: string[] = []
    for (const part of Array.from(document.querySelectorAll(sel))) {
      for (const el of [part, ...Array.from(part.querySelectorAll('*'))]) {
        if (!(el as HTMLElement).checkVisibility?.()) continue
        for (const a of ['aria-label', 'placeholder', 'title']) if (el.getAttribute(a)) out.push(el.getAttribute(a)!)
        for (const n of Array.from(el.childNodes)) if (n.nodeType === Node.TEXT_NODE && n.textContent!.trim()) out.push(n.textContent!.trim())
      }
    }
    return out
  }, selector)
}
const english = (words: string[]) => words.filter((w) => ENGLISH.some((re) => re.test(w)))

let h: E2eHarness
beforeAll(async () => {
  h = await startE2e()
})
afterAll(() => h?.close())

describe('the component libraries speak the user\'s language', () => {
  it('shows a Spanish user no English in pagination, date picker, an empty search, a grid menu and an empty grid', async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signIn(page, 'warehouse') // the demo's warehouse user works in Spanish
      expect(await page.evaluate(() => document.documentElement.lang)).toBe('es')

      await openInApp(page, '/stock/movements')
      const pager = await wordsIn(page, '[data-test="ledger-pager"]')
      expect(pager.length).toBeGreaterThan(0)
      expect(english(pager), 'pagination').toEqual([])

      await page.locator('.el-date-editor').first().click()
      await page.locator('.el-picker-panel').first().waitFor()
      const picker = await wordsIn(page, '.el-picker-panel')
      expect(picker.length).toBeGreaterThan(7)
      expect(english(picker), 'date picker').toEqual([])
      await page.keyboard.press('Escape')

      await page.locator('[data-test="item-select"] input').fill('zzqx-nothing')
      await page.locator('.el-select-dropdown__empty').first().waitFor()
      const empty = await wordsIn(page, '.el-select-dropdown__empty')
      expect(english(empty), 'a search that finds nothing').toEqual([])
      const es = leaves(elEs as unknown as Tree)
      expect(empty.filter((w) => w === es.get('el.select.noMatch') || w === es.get('el.select.noData'))).toHaveLength(1)
      await page.keyboard.press('Escape')

      // The stock grid: a column's filter menu, then a search that leaves it empty (the grid's own "no rows").
      await openInApp(page, '/stock/overview')
      await page.locator('.ag-header-cell[col-id="sku"] .ag-header-cell-filter-button, .ag-header-cell[col-id="sku"] .ag-header-cell-menu-button').first().click()
      await page.locator('.ag-filter').first().waitFor()
      const menu = await wordsIn(page, '.ag-popup')
      expect(menu.length).toBeGreaterThan(0)
      expect(english(menu), 'grid filter menu').toEqual([])
      await page.keyboard.press('Escape')
      await page.locator('[data-test="overview-search"]').fill('zzqx-nothing')
      await page.locator('.ag-overlay-no-rows-center').first().waitFor()
      const noRows = await wordsIn(page, '.ag-overlay')
      expect(noRows).toContain(AG_GRID_LOCALE_ES.noRowsToShow)
      expect(english(noRows), 'an empty grid').toEqual([])

    } finally {
      await context.close()
    }
  })

  it('shows the sign-in page in the browser\'s language until someone signs in', async () => {
    const context = await h.browser.newContext({ baseURL: h.baseUrl, locale: 'es-MX' })
    try {
      const page = await context.newPage()
      await page.goto('/sign-in')
      await page.locator('[data-test="username"]').waitFor()
      await expect.poll(() => page.evaluate(() => document.documentElement.lang)).toBe('es')
    } finally {
      await context.close()
    }
  })
})
