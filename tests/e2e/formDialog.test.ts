// The one form-dialog shell (src/components/base/FormDialog.vue) in a real browser, on the counter's
// new-account dialog: a save with the network gone is refused inside the dialog, in its own alert region,
// and changes nothing; two presses of Save in the same instant send one request and make one account;
// Escape closes the dialog and the focus is back on the button that opened it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Request } from 'playwright-core'
import en from '../../src/i18n/en/errors.js'
import { startE2e, type E2eHarness } from '../support/browser.js'

let h: E2eHarness
beforeAll(async () => {
  h = await startE2e()
})
afterAll(() => h?.close())

const accounts = async (code: string) => Number(((await h.ds.query('SELECT COUNT(*) AS n FROM customers WHERE code = ?', [code])) as { n: number }[])[0].n)

describe('a form dialog', () => {
  it('says an offline refusal inside itself, sends one request for a double press, and hands the focus back', async () => {
    const { page, context } = await h.newPage()
    const code = `DLG${Date.now() % 1e9}`
    try {
      await h.signInByApi(page, 'counter')
      await page.goto('/counter/customers')
      const opener = page.locator('[data-test="new-customer"]')
      await opener.click()
      const dialog = page.locator('.el-overlay-dialog .el-dialog').first()
      await dialog.waitFor()
      await page.locator('[data-test="customer-code"]').fill(code)
      await page.locator('[data-test="customer-name"]').fill('Harbour Tile & Glass Block')

      // source: WCAG 2.2 SC 4.1.3 Status Messages (a problem is announced without moving the focus: role="alert")
      await context.setOffline(true)
      await page.locator('[data-test="save-customer"]').click()
      const alert = dialog.locator('[role="alert"]')
      await expect.poll(() => alert.textContent()).toBe(en.network)
      await context.setOffline(false)
      expect(await accounts(code)).toBe(0)

      // common practice: a second press while the first request is on its way sends nothing more. Both presses
      // land before the page can redraw the button as busy (two clicks in one task).
      const posts: string[] = []
      const onRequest = (r: Request) => void (r.method() === 'POST' && new URL(r.url()).pathname === '/api/customers' && posts.push(r.url()))
      page.on('request', onRequest)
      await page.evaluate(() => {
        const save = document.querySelector<HTMLButtonElement>('[data-test="save-customer"]')!
        save.click()
        save.click()
      })
      await dialog.waitFor({ state: 'hidden' })
      await page.locator('.el-message--success').waitFor()
      page.off('request', onRequest)
      expect(posts).toHaveLength(1)
      expect(await accounts(code)).toBe(1)

      // source: WAI-ARIA Authoring Practices 1.2, Dialog (Modal) Pattern: Escape closes, focus returns to the opener
      await opener.click()
      await dialog.waitFor()
      await page.keyboard.press('Escape')
      await dialog.waitFor({ state: 'hidden' })
      expect(await page.evaluate(() => document.activeElement?.getAttribute('data-test'))).toBe('new-customer')
    } finally {
      await context.close()
    }
  })
})
