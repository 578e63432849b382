// Every screen in Spanish, for every role: a Spanish-speaking user of each role opens each screen the client's
// router knows (the walk of tests/support/routeWalk.ts: each screen once, by the role that uses it; the warehouse
// crew's on a 412 px phone), the main dialogs open, and the buyer's reorder drawer with its working and inputs.
// On each, no English message of the app (where the Spanish differs), no raw message key and no library default
// English may be visible (tests/support/spanishText.ts), and no text box's hint may be cut off (the Spanish is
// the longer of the two: "Número de vale o de p…" reads as nothing).
// common practice: a person who chose Spanish reads Spanish on every screen, errors and empty states included.
import bcrypt from 'bcryptjs'
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Role } from '../../shared/roles.js'
import { User } from '../../server/entities/User.js'
import { TEST_PASSWORD } from '../support/apiHarness.js'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { byRole, MAIN_DIALOGS, openInApp, RouteSamples, routeTable, settle, type WalkRoute } from '../support/routeWalk.js'
import { placeholdersCutOff } from '../support/layoutChecks.js'
import { screenText } from '../support/spanishText.js'
import { walkRecords } from '../support/walkRecords.js'
import { TEST_HASH_COST } from '../support/testHashCost.js'

// The read-only role has no screen of its own: every screen it opens is walked by a role that uses it.
const ROLES: readonly Role[] = ['warehouse', 'counter', 'buyer', 'admin']
const spanishUser = (role: Role) => `t-walk-${role}-es`
const OPEN_DIALOG = '.el-overlay-dialog .el-dialog'

let h: E2eHarness
let groups: Map<Role | 'signed-out', WalkRoute[]>
let samples: RouteSamples
beforeAll(async () => {
  h = await startE2e()
  await walkRecords(h)
  const users = h.ds.getRepository(User)
  const passwordHash = await bcrypt.hash(TEST_PASSWORD, TEST_HASH_COST)
  for (const role of ROLES) {
    if (!(await users.existsBy({ username: spanishUser(role) }))) {
      await users.save(users.create({ username: spanishUser(role), displayName: `Prueba ${role}`, roles: [role], locale: 'es', active: true, passwordHash }))
    }
  }
  samples = new RouteSamples(h.ds)
})
afterAll(() => h?.close())

async function problemsOn(page: Page, where: string, out: string[]): Promise<void> {
  const text = await screenText(page)
  for (const e of text.english) out.push(`${where}: English "${e}"`)
  for (const k of text.keys) out.push(`${where}: raw key ${k}`)
}

/** The buyer's reorder list, then one line's drawer: its working and the table of inputs behind it. */
async function reorderDrawer(page: Page, out: string[]): Promise<void> {
  await openInApp(page, '/purchasing/reorder')
  const sku = page.locator('[data-test="reorder-grid"] .ag-row [col-id="sku"]').first()
  await sku.waitFor()
  await sku.click()
  const drawer = page.locator('[data-test="reorder-drawer"]')
  await drawer.locator('[data-test="drawer-inputs"] tbody tr').first().waitFor()
  await settle(page)
  // source: Silver, Pyke & Thomas, "Inventory and Production Management in Supply Chains", 4th ed., ch. 6 (the
  // reorder point reads mean daily use, lead time and on-hand stock): the inputs name those figures
  const names = await drawer.locator('[data-test="drawer-inputs"] tbody tr td:first-child').allTextContents()
  expect(names.length).toBeGreaterThan(10)
  await problemsOn(page, 'reorder drawer', out)
  await page.keyboard.press('Escape')
  await drawer.locator('.el-drawer').waitFor({ state: 'hidden' }).catch(() => undefined)
}

describe('every screen in Spanish', () => {
  it.each(ROLES)('the %s role reads only Spanish on its screens and dialogs', async (role) => {
    const phone = role === 'warehouse'
    const context = await h.browser.newContext({ baseURL: h.baseUrl, locale: 'es-US', reducedMotion: 'reduce', viewport: phone ? { width: 412, height: 915 } : { width: 1366, height: 900 } })
    const page = await context.newPage()
    page.setDefaultTimeout(15_000)
    const problems: string[] = []
    let visited = 0
    try {
      await h.signIn(page, spanishUser(role), TEST_PASSWORD)
      groups ??= byRole(await routeTable(page))
      for (const route of groups.get(role) ?? []) {
        const path = await samples.pathFor(route)
        await openInApp(page, path)
        await samples.harvest(page)
        await problemsOn(page, `${route.name} (${path})`, problems)
        for (const cut of await placeholdersCutOff(page, 'input[placeholder], textarea[placeholder]')) problems.push(`${route.name} (${path}): hint cut off, ${cut}`)
        visited++
        const opener = MAIN_DIALOGS[route.name]
        if (opener) {
          for (const c of opener) await page.locator(c).first().click()
          const dialog = page.locator(OPEN_DIALOG).first()
          await dialog.waitFor()
          await settle(page)
          await problemsOn(page, `${route.name} dialog`, problems)
          await page.keyboard.press('Escape')
          await dialog.waitFor({ state: 'hidden' })
        }
      }
      if (role === 'buyer') await reorderDrawer(page, problems)
    } finally {
      await context.close()
    }
    expect(visited).toBeGreaterThan(0)
    expect(problems).toEqual([])
  }, 300_000) // a walk of every screen of a role, on a shared machine
})
