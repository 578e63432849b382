// The session ends under a half-filled form (idle timeout, signed out in another tab): the person signs in again
// over the page and the form is still there, instead of being sent to the sign-in page and losing it. A wrong
// password is refused in the same place; "someone else" leaves the page for the sign-in page.
// source: WCAG 2.2 SC 2.2.5 Re-authenticating (AAA): when an authenticated session expires, the user can continue
// the activity without loss of data after re-authenticating.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { BrowserContext } from 'playwright-core'
import { axeFindings, blocking, describeFindings } from '../support/axeCheck.js'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'

let h: E2eHarness
beforeAll(async () => {
  h = await startE2e()
})
afterAll(() => h?.close())

const accounts = async (code: string) => Number(((await h.ds.query('SELECT COUNT(*) AS n FROM customers WHERE code = ?', [code])) as { n: number }[])[0].n)

/** Ends this browser's session on the server, as the idle timeout or a sign-out elsewhere would. */
async function endSession(context: BrowserContext) {
  const cookie = (await context.cookies()).find((c) => c.name.startsWith('lumenyard'))
  const sid = decodeURIComponent(cookie!.value).replace(/^s:/, '').replace(/\.[^.]*$/, '')
  expect(await h.ds.query('DELETE FROM sessions WHERE session_id = ?', [sid])).toMatchObject({ affectedRows: 1 })
}

describe('a session that ends under a form', () => {
  it('is resumed over the page with the form as it was; a wrong password is refused there', async () => {
    const { page, context } = await h.newPage()
    const code = `RSM${Date.now() % 1e9}`
    try {
      await h.signIn(page, 'counter')
      await page.goto('/counter/customers')
      await page.locator('[data-test="new-customer"]').click()
      await page.locator('[data-test="customer-code"]').fill(code)
      await page.locator('[data-test="customer-name"]').fill('Quarry Lane Glass & Tile')
      await endSession(context)

      await page.locator('[data-test="save-customer"]').click()
      const resume = page.locator('[data-test="session-resume"]')
      await resume.waitFor()
      expect(new URL(page.url()).pathname).toBe('/counter/customers')
      expect(await accounts(code)).toBe(0)
      await h.screenshot(page, 'session-resume')
      // source: axe-core, WCAG 2.2 AA rules: no critical or serious finding with the dialog open
      const findings = blocking(await axeFindings(page, 'session resume dialog'))
      expect(findings, describeFindings(findings)).toEqual([])

      // Only its two buttons close it: Escape would otherwise leave the page signed out with nothing said.
      await page.locator('[data-test="resume-password"]').press('Escape')
      await page.waitForTimeout(400)
      expect(await resume.isVisible()).toBe(true)

      await page.locator('[data-test="resume-password"]').fill('not-the-password')
      await page.keyboard.press('Enter')
      await expect.poll(() => resume.locator('.el-form-item__error').count()).toBe(1)
      await expect.poll(() => resume.isVisible()).toBe(true)

      await page.locator('[data-test="resume-password"]').fill(DEMO_PASSWORD)
      await page.locator('[data-test="resume-submit"]').click()
      await resume.waitFor({ state: 'hidden' })
      // What was typed is still in the form; the same Save now makes the account, once.
      expect(await page.locator('[data-test="customer-code"]').inputValue()).toBe(code)
      expect(await page.locator('[data-test="customer-name"]').inputValue()).toBe('Quarry Lane Glass & Tile')
      await page.locator('[data-test="save-customer"]').click()
      await page.locator('.el-message--success').waitFor()
      expect(await accounts(code)).toBe(1)
    } finally {
      await context.close()
    }
  })

  it('offers to sign in as someone else, which leaves the page for the sign-in page', async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signIn(page, 'counter')
      await page.goto('/counter/customers')
      await page.locator('[data-test="new-customer"]').waitFor()
      await endSession(context)
      await page.locator('[data-test="new-customer"]').click()
      await page.locator('[data-test="save-customer"]').click()
      await page.locator('[data-test="session-resume"]').waitFor()
      await page.locator('[data-test="resume-other"]').click()
      await page.waitForURL(/\/sign-in\?next=/)
    } finally {
      await context.close()
    }
  })
})
