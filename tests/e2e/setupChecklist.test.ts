// The first-run checklist in production mode: an administrator lands on it after signing in, sees each
// step done or left as the data says, answers the steps it asks itself (a GS1 prefix refused, then
// accepted; units), and once it is dismissed it neither opens by itself nor shows on the start page.
// At phone width, so nothing is cut off (TRIALS: phone 412 px).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { dismissChecklistAndReload } from '../support/setupSteps.js'

let h: E2eHarness
const KEYS = ['setup.dismissed', 'setup.units_confirmed', 'company.weight_unit', 'company.gs1_prefix']

beforeAll(async () => {
  h = await startE2e({ NODE_ENV: 'production', LUMENYARD_SECURE_COOKIES: 'false' })
  await h.ds.query('DELETE FROM app_settings WHERE setting_key IN (?)', [KEYS])
})
afterAll(async () => {
  await h?.ds.query('DELETE FROM app_settings WHERE setting_key IN (?)', [KEYS])
  await h?.close()
})

describe('first-run checklist (production)', () => {
  it('opens after sign-in, shows each step done or left, takes its answers, and stays away once dismissed', async () => {
    const { page, context } = await h.newPage({ viewport: { width: 412, height: 860 } })
    await h.signIn(page, 'admin')
    await page.locator('[data-test="setup-steps"]').waitFor()
    expect(new URL(page.url()).pathname).toBe('/setup')
    const stateOf = (step: string) => page.locator(`[data-step="${step}"]`).getAttribute('data-done')
    // The demo holds warehouses with bins and items; nobody has answered units or the GS1 prefix yet.
    expect(await stateOf('warehouses')).toBe('true')
    expect(await stateOf('items')).toBe('true')
    expect(await stateOf('units')).toBe('false')
    expect(await stateOf('gs1')).toBe('false')
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(412)

    // source: GS1 General Specifications, GS1 Company Prefix: 4 to 12 digits (a 2-digit one is refused)
    await page.locator('[data-test="setup-gs1-prefix"]').fill('12')
    await page.locator('[data-test="setup-gs1-save"]').click()
    await page.locator('[data-test="setup-gs1-error"]').waitFor()
    expect(await stateOf('gs1')).toBe('false')
    await page.locator('[data-test="setup-gs1-prefix"]').fill('0614141') // GS1's own example prefix (from memory)
    await page.locator('[data-test="setup-gs1-save"]').click()
    await page.locator('[data-step="gs1"][data-done="true"]').waitFor()
    await page.locator('[data-test="setup-units"] label:has-text("Millimetres")').click()
    await page.locator('[data-test="setup-units-save"]').click()
    await page.locator('[data-step="units"][data-done="true"]').waitFor()
    const [prefix] = await h.ds.query("SELECT value FROM app_settings WHERE setting_key = 'company.gs1_prefix'")
    expect(prefix.value).toBe('0614141')
    await h.screenshot(page, 'setup-checklist-phone')

    await dismissChecklistAndReload(page)
    expect(new URL(page.url()).pathname).toBe('/')
    expect(await page.locator('[data-test="setup-link"]').count()).toBe(0)
    await context.close()
  })
})
