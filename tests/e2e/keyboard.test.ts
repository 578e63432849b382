// The main flows with the keyboard alone, as someone who cannot use a mouse works: Tab to reach a control,
// Enter or Space to use it, arrow keys in lists. Every control on the way must be reachable and never hidden
// under a sticky bar; after each page change focus starts at the new page's heading.
// source: W3C WCAG 2.2 SC 2.1.1 Keyboard, SC 2.4.1 Bypass Blocks, SC 2.4.3 Focus Order, SC 2.4.11 Focus Not Obscured (Minimum)
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { focused, tabTo } from '../support/keyboard.js'
import { settle } from '../support/routeWalk.js'
import { fxBom, pickScenario, releasedPickList, signedInAgent } from '../support/pickFixtures.js'

let h: E2eHarness
beforeAll(async () => {
  h = await startE2e()
})
afterAll(() => h?.close())

async function signInByKeyboard(page: Page, username: string) {
  await page.goto('/sign-in')
  await tabTo(page, '[data-test="username"]')
  await page.keyboard.type(username)
  await tabTo(page, '[data-test="password"]')
  await page.keyboard.type(DEMO_PASSWORD)
  await page.keyboard.press('Enter')
  await page.locator('[data-test="greeting"]').waitFor()
}

/** Enter on the focused link or button, then the page it leads to has loaded and focus sits on its heading. */
async function enterTo(page: Page, url: RegExp) {
  await page.keyboard.press('Enter')
  await page.waitForURL(url)
  await expect.poll(() => page.evaluate(() => document.activeElement?.tagName)).toBe('H1')
}

/** Opens an Element Plus select from the keyboard (if typing has not opened it) and takes its first option. */
async function chooseFirst(page: Page) {
  const options = page.locator('.el-select-dropdown__item:visible')
  if (!(await options.count())) await page.keyboard.press('ArrowDown')
  await options.first().waitFor()
  if (!(await page.locator('.el-select-dropdown__item.is-hovering:visible').count())) await page.keyboard.press('ArrowDown')
  await page.locator('.el-select-dropdown__item.is-hovering:visible').first().waitFor()
  await page.keyboard.press('Enter')
  await options.first().waitFor({ state: 'hidden' })
}

describe('keyboard only', () => {
  it('counter: signs in, skips to the content, opens a recent job, takes its takeoff to a bill and a pick list', async () => {
    const { page, context } = await h.newPage()
    try {
      await signInByKeyboard(page, 'counter')
      // The first Tab on a signed-in page reaches the skip link, which moves focus to the main content.
      await page.keyboard.press('Tab')
      expect(await page.evaluate(() => document.activeElement?.classList.contains('ly-skip-link'))).toBe(true)
      expect(await page.locator('.ly-skip-link').boundingBox().then((b) => b && b.y >= 0)).toBe(true)
      await page.keyboard.press('Enter')
      expect(await page.evaluate(() => document.activeElement?.id)).toBe('main')

      await tabTo(page, 'a[data-area="counter"]', { back: true })
      await enterTo(page, /\/counter$/)
      // The demo's first job with a takeoff, found by name in the counter's list of jobs.
      const [job] = (await h.ds.query('SELECT id, name FROM jobs WHERE id = (SELECT MIN(job_id) FROM takeoffs)')) as { id: number; name: string }[]
      await tabTo(page, 'a[href="/counter/jobs"]')
      await enterTo(page, /\/counter\/jobs$/)
      await tabTo(page, '[data-test="job-search"]')
      await page.keyboard.type(job.name)
      await page.locator(`[data-test="jobs-table"] a[data-test="job-${job.id}"]`).waitFor()
      await settle(page)
      await tabTo(page, `[data-test="jobs-table"] a[data-test="job-${job.id}"]`)
      await enterTo(page, /\/counter\/jobs\/\d+$/)
      await tabTo(page, '[data-test^="open-takeoff-"]')
      await page.keyboard.press('Enter')
      await page.waitForURL(/\/counter\/takeoffs\/\d+$/)
      await page.locator('[data-test="save-bill"]:not([disabled])').waitFor()
      await tabTo(page, '[data-test="save-bill"]', { max: 200 })
      await enterTo(page, /\/counter\/boms\/\d+$/)
      await tabTo(page, '[data-test="make-pick-list"]')
      await enterTo(page, /\/counter\/picking\/new\/\d+$/)
      await tabTo(page, '[data-test="plan-warehouse"]')
      await chooseFirst(page)
      await page.locator('[data-test="plan-create"]:not([disabled])').waitFor()
      await tabTo(page, '[data-test="plan-create"]', { max: 200 })
      await page.keyboard.press('Enter')
      await page.waitForURL(/\/counter\/pick-lists\/\d+$/)
      await page.locator('[data-test="pick-list-status"]').waitFor()
    } finally {
      await context.close()
    }
  })

  it('buyer: opens a purchase order from its list, then creates and approves a new one', async () => {
    const { page, context } = await h.newPage()
    try {
      await signInByKeyboard(page, 'buyer')
      await tabTo(page, 'a[data-area="purchasing"]')
      await enterTo(page, /\/purchasing$/)
      await tabTo(page, '[data-test="tile-purchasing-orders"]')
      await enterTo(page, /\/purchasing\/orders$/)
      await tabTo(page, '[data-test="orders-table"] a[data-test^="po-"]')
      await enterTo(page, /\/purchasing\/orders\/\d+$/)
      await page.goBack()
      await page.locator('[data-test="orders-table"]').waitFor()

      await tabTo(page, '[data-test="new-order"]')
      await page.keyboard.press('Enter')
      await page.locator('.el-overlay-dialog .el-dialog').waitFor()
      await tabTo(page, '[data-test="new-vendor"]')
      await chooseFirst(page)
      await tabTo(page, '[data-test="new-warehouse"]')
      await chooseFirst(page)
      await tabTo(page, '[data-test="item-picker"]')
      await page.keyboard.type('GB')
      await chooseFirst(page)
      await tabTo(page, '[data-test="create-order"]')
      await page.keyboard.press('Enter')
      await page.waitForURL(/\/purchasing\/orders\/\d+$/)
      await expect.poll(() => page.locator('[data-test="po-status"]').getAttribute('data-status')).toBe('draft')
      await tabTo(page, '[data-test="approve"]')
      await page.keyboard.press('Enter')
      await expect.poll(() => page.locator('[data-test="po-status"]').getAttribute('data-status')).toBe('approved')
    } finally {
      await context.close()
    }
  })

  it('warehouse, on a phone: opens a pick list and confirms a line with the scanner and Enter', async () => {
    const s = await pickScenario(h.ds, await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD))
    // hand-worked: spacer 10 from A-02-1 comes first on the walk (as in pickHandheld.test.ts), then the block from A-03-1
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.block.id, qty: 16 }, { itemId: s.spacer.id, qty: 10 }])
    const listId = await releasedPickList(await signedInAgent(h.built.app, 'counter', DEMO_PASSWORD), bom.bomId, s.main.id)
    const { page, context } = await h.newPage({ viewport: { width: 412, height: 900 } })
    try {
      await signInByKeyboard(page, 'warehouse')
      // On a phone the areas sit in a drawer behind the menu button.
      await tabTo(page, '.burger')
      await page.keyboard.press('Enter')
      await tabTo(page, '.nav-drawer a[data-area="warehouse"]')
      await enterTo(page, /\/warehouse$/)
      // The drawer fades out after the link is followed; Tab only once it has gone, as a person would.
      await page.locator('.el-overlay.is-drawer').waitFor({ state: 'hidden' })
      await tabTo(page, `[data-test="pick-${listId}"]`, { max: 120 })
      await page.keyboard.press('Enter')
      await page.waitForURL(new RegExp(`/warehouse/pick/${listId}$`))
      await expect.poll(() => page.locator('[data-test="line-bin"]').textContent()).toBe('A-02-1')
      // The scan box holds the focus: a keyboard-wedge scanner types and ends with Enter.
      expect(await focused(page)).toBe('scan-input')
      for (const scan of ['B:A-02-1', s.spacer.sku, '10']) {
        await page.keyboard.type(scan)
        await page.keyboard.press('Enter')
      }
      await expect.poll(() => page.locator('[data-test="line-bin"]').textContent()).toBe('A-03-1')
    } finally {
      await context.close()
    }
  })
})
