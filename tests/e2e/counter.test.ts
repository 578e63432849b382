// Feature: the Counter in a real browser, as the counter role: start a takeoff for an account, build a
// block shower with a straight run and a curved run, watch the bill update, open one line's explanation,
// see the drawing (screenshots), and save the bill on the job.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import path from 'node:path'
import { SCREENSHOTS, startE2e, type E2eHarness } from '../support/browser.js'

let h: E2eHarness
beforeAll(async () => {
  h = await startE2e()
})
afterAll(() => h?.close())

async function pickOption(page: Page, selectTest: string, typed: string, optionText: string) {
  await page.locator(`[data-test="${selectTest}"]`).click()
  await page.keyboard.type(typed)
  await page.locator('.el-select-dropdown__item:visible', { hasText: optionText }).first().click()
}

/** The input under a data-test wrapper, or the element itself when it is the input. */
async function fillNumber(page: Page, test: string, value: string) {
  const el = page.locator(`[data-test="${test}"]`)
  const input = (await el.evaluate((e) => e.tagName)) === 'INPUT' ? el : el.locator('input')
  await input.fill(value)
  await input.blur()
}

describe('counter: a curved block shower from takeoff to saved bill', () => {
  it('builds the takeoff, explains a line, draws the wall and saves the bill', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 1440, height: 1000 } })
    try {
      await h.signIn(page, 'counter')
      await page.goto('/counter')
      await page.locator('[data-test="recent-jobs"]').waitFor()
      await page.locator('[data-test="start-takeoff"]').click()
      await pickOption(page, 'start-customer', 'Copper', 'COPPERLINE')
      await page.locator('[data-test="start-job-name"]').fill('Whitlock guest bath, curved shower')
      await page.locator('[data-test="start-takeoff-name"]').fill('Guest shower')
      await page.locator('[data-test="start-go"]').click()
      await page.waitForURL(/\/counter\/takeoffs\/\d+/)

      await page.locator('[data-test="add-wall"]').click()
      await pickOption(page, 'wall-0-block', 'GB-0606-WV-SQ', 'GB-0606-WV-SQ')
      await page.locator('[data-test="wall-0-sizing"]').getByText('Block count').click()
      await fillNumber(page, 'wall-0-courses', '13')
      await fillNumber(page, 'segment-0-blocks', '3')
      await page.locator('[data-test="wall-0-add-curved"]').click()
      const radius = page.locator('[data-test="segment-1-radius"]')
      await radius.fill('48"')
      await radius.blur()
      await page.locator('[data-test="wall-0-free-end"]').click()
      await page.locator('[data-test="wall-0-free-top"]').click()
      await page.locator('[data-test="wall-0-wet"]').click()
      await page.locator('[data-test="shower-base-toggle"]').click()

      // 3 straight + 13 on the curve, 13 courses. Small-angle estimate (REFERENCES.md): each 5 3/4 in
      // block with a 1/8 in inside joint turns (5.75 + 0.125) / 48 rad = 7.01°, so 90° takes 12.8 → 13 blocks.
      const summary = page.locator('[data-test="wall-0-summary"]')
      await expect.poll(() => summary.textContent(), { timeout: 10_000 }).toMatch(/16 across × 13 courses = 208 blocks/)
      await expect.poll(() => page.locator('[data-test="qty-arcSpacer"]').count()).toBe(1)
      expect(await page.locator('[data-test="qty-showerBase"]').textContent()).toBe('1')
      await expect.poll(() => page.locator('[data-test="blockers"]').count()).toBe(0)

      // Cautions are never silent: a code section, the curved-panel support caution, and the deferral line.
      const cautions = page.locator('[data-test="cautions"]')
      await expect.poll(() => cautions.textContent()).toMatch(/R607\.4\.4/)
      expect(await page.locator('[data-test="defer"]').textContent()).toMatch(/local building codes/)
      expect(await page.locator('[data-test="install-notes"] li').count()).toBeGreaterThanOrEqual(4)

      const drawing = page.locator('[data-test="wall-drawing"] svg')
      await drawing.first().waitFor()
      expect(await page.locator('[data-test="wall-drawing"] svg g.plan').count()).toBe(1)
      expect(await page.locator('[data-test="wall-drawing"] svg rect[data-course]').count()).toBe(208)
      await drawing.first().scrollIntoViewIfNeeded()
      await h.screenshot(page, 'counter-curved-shower-drawing')

      await page.locator('[data-test="explain-arcSpacer"]').click()
      const explain = page.locator('[data-test="explain-drawer"]')
      await explain.waitFor()
      expect(await page.locator('[data-test="explain-formula"]').textContent()).toMatch(/interiorIntersectionsCurved/)
      // The drawer sits over the page: a viewport shot shows it where a full-page one would not.
      await page.screenshot({ path: path.join(SCREENSHOTS, 'counter-explain-line.png') })
      await page.keyboard.press('Escape')
      await explain.waitFor({ state: 'hidden' })

      await page.locator('[data-test="save-bill"]').click()
      await page.waitForURL(/\/counter\/boms\/\d+/)
      expect(await page.locator('[data-test="bom-title"]').textContent()).toMatch(/revision 1/)
      const bomId = Number(new URL(page.url()).pathname.split('/').pop())
      const rows = await h.ds.query('SELECT role, qty FROM bom_lines WHERE bom_id = ? ORDER BY line_no', [bomId])
      expect(rows.find((r: { role: string }) => r.role === 'showerBase')).toMatchObject({ qty: 1 })
      // 208 cells less 13 end-finish blocks at the free end = 195 × 1.05 (5 % block waste, common practice) = 204.75 → 205;
      // the end blocks 13 × 1.05 = 13.65 → 14.
      expect(rows.find((r: { role: string }) => r.role === 'block').qty).toBe(205)
      expect(rows.find((r: { role: string }) => r.role === 'endBlock').qty).toBe(14)
      // Inch entries shown back in inches to 1/16 (shared/units.ts): the 36 × 48 in base the toggle started with.
      expect(await page.locator('[data-test="base-spec"]').textContent()).toMatch(/36″ wide × 48″ deep/)
      await page.locator('[data-test="wall-drawing"] svg').first().waitFor()
      await h.screenshot(page, 'counter-saved-bill')

      // On paper: no shell and no buttons; the plain bill table, the drawing and the cautions.
      await page.emulateMedia({ media: 'print' })
      expect(await page.locator('aside.rail').isVisible()).toBe(false)
      expect(await page.locator('[data-test="export"]').isVisible()).toBe(false)
      expect(await page.locator('table.paper').isVisible()).toBe(true)
      expect(await page.locator('[data-test="wall-drawing"]').first().isVisible()).toBe(true)
      expect(await page.locator('[data-test="defer"]').isVisible()).toBe(true)
      await h.screenshot(page, 'counter-saved-bill-print')
    } finally {
      await context.close()
    }
  })
})
