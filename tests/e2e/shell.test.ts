// Sign in as each demo role in a real browser, see that role's navigation, sign out.
// The expected areas per role are the design in shared/roles.ts (AREA_ROLES), restated here so a
// change to either side shows up.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startE2e, type E2eHarness } from '../support/browser.js'

let h: E2eHarness
beforeAll(async () => {
  h = await startE2e()
})
afterAll(() => h?.close())

const EXPECTED_NAV: Record<string, string[]> = {
  admin: ['home', 'stock', 'counter', 'warehouse', 'purchasing', 'admin'],
  counter: ['home', 'stock', 'counter'],
  warehouse: ['home', 'stock', 'warehouse'],
  buyer: ['home', 'stock', 'purchasing'],
  viewer: ['home', 'stock'],
}

describe('the shell for each role', () => {
  for (const [role, areas] of Object.entries(EXPECTED_NAV)) {
    it(`${role}: signs in, sees only its areas, signs out`, async () => {
      const { page, context } = await h.newPage()
      try {
        await h.signIn(page, role)
        const nav = await page.locator('aside [data-area]').evaluateAll((els) => els.map((e) => e.getAttribute('data-area')))
        expect(nav).toEqual(areas)
        await h.screenshot(page, `shell-${role}`)
        await page.locator('[data-test="user-menu"]').click()
        await page.locator('[data-test="sign-out"]').click()
        await page.waitForURL(/\/sign-in/)
        // Signed out: a protected page sends us back to sign-in.
        await page.goto('/profile')
        await page.waitForURL(/\/sign-in/)
        expect(page.url()).toContain('/sign-in')
      } finally {
        await context.close()
      }
    })
  }

  it('keeps a role out of a page it may not use', async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signIn(page, 'viewer')
      await page.goto('/admin/users')
      await page.waitForURL((url) => url.pathname === '/')
      expect(new URL(page.url()).pathname).toBe('/')
    } finally {
      await context.close()
    }
  })

  it('shows a clear message for a wrong password', async () => {
    const { page, context } = await h.newPage()
    try {
      await page.goto('/sign-in')
      await page.locator('[data-test="username"]').fill('counter')
      await page.locator('[data-test="password"]').fill('not-the-password')
      await page.locator('[data-test="sign-in"]').click()
      await expect.poll(() => page.locator('[data-test="sign-in-error"]').textContent()).toMatch(/not right/)
    } finally {
      await context.close()
    }
  })

  it('works on a warehouse tablet: the menu opens from the top bar', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 800, height: 1100 } })
    try {
      await h.signIn(page, 'warehouse')
      await page.locator('button.burger').click()
      await page.locator('.nav-drawer [data-area="warehouse"]').click()
      await page.waitForURL(/\/warehouse/)
      await h.screenshot(page, 'shell-tablet-warehouse')
      expect(page.url()).toContain('/warehouse')
    } finally {
      await context.close()
    }
  })

  it('opens the account menu from the keyboard, and Escape brings focus back to its button', async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signIn(page, 'counter')
      // The menu's code comes when the button is first wanted: no drop-down is on the page before that.
      expect(await page.locator('.el-dropdown-menu').count()).toBe(0)
      await page.locator('[data-test="user-menu"]').focus()
      await page.keyboard.press('Enter')
      // source: WAI-ARIA Authoring Practices 1.2, Menu Button pattern: Enter opens the menu and moves focus into it;
      // Escape closes it and returns focus to the button.
      await page.locator('[data-test="sign-out"]').waitFor()
      await expect.poll(() => page.evaluate(() => !!document.activeElement?.closest('.el-dropdown-menu'))).toBe(true)
      await page.keyboard.press('Escape')
      await page.locator('[data-test="sign-out"]').waitFor({ state: 'hidden' })
      await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('data-test'))).toBe('user-menu')
      // Opened again from the keyboard, the menu signs out with Enter on its item.
      await page.keyboard.press('Enter')
      await page.locator('[data-test="sign-out"]').waitFor()
      await page.locator('[data-test="sign-out"]').focus()
      await page.keyboard.press('Enter')
      await page.waitForURL(/\/sign-in/)
    } finally {
      await context.close()
    }
  })
})
