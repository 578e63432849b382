// A new supplier's first afternoon, in production mode on an empty database: the first administrator (made
// the way `npm run create-admin` makes one) signs in and lands on the getting-started checklist, where every
// step is left; names the company, chooses units, adds a warehouse with generated bins and brings its
// contractor accounts in from a sheet, and each of those steps then shows done. Dismissed, the checklist no
// longer opens by itself, and it is still reached from the page where data is brought in.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createUser } from '../../server/services/userService.js'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { databaseNamed, dropDatabases, freshDatabase } from '../support/freshDatabase.js'
import { dismissChecklistAndReload } from '../support/setupSteps.js'

const DB = databaseNamed('first_run')
const PASSWORD = 'kiln-lantern-harbour-42'
let h: E2eHarness

beforeAll(async () => {
  await freshDatabase(DB, {
    then: async (ds) => {
      await createUser(ds, { userId: null }, { username: 'noor', displayName: 'Noor Halvorsen', roles: ['admin'], password: PASSWORD, email: '' })
    },
  })
  h = await startE2e({ NODE_ENV: 'production', LUMENYARD_SECURE_COOKIES: 'false', LUMENYARD_DB_NAME: DB })
}, 120_000)
afterAll(async () => {
  await h?.close()
  await dropDatabases(DB)
})

describe('first run on an empty database (production)', () => {
  it('lands the first administrator on the checklist, marks each finished step done, and can be dismissed and reached again', async () => {
    const { page, context } = await h.newPage()
    await h.signIn(page, 'noor', PASSWORD)
    await page.locator('[data-test="setup-steps"]').waitFor()
    expect(new URL(page.url()).pathname).toBe('/setup')
    const done = (step: string) => page.locator(`[data-step="${step}"]`).getAttribute('data-done')
    const steps = await page.locator('[data-step]').evaluateAll((els) => els.map((e) => `${e.getAttribute('data-step')}:${e.getAttribute('data-done')}`))
    // Nothing is set up on an empty installation.
    expect(steps).toEqual(['company', 'units', 'warehouses', 'gs1', 'items', 'opening_stock', 'vendors', 'accounts', 'purchase_orders', 'usage_history'].map((s) => `${s}:false`))

    // The company: the details every document carries.
    await page.locator('[data-test="setup-open-company"]').click()
    await page.locator('[data-test="company-legalName"]').fill('Brightcourse Glass Supply LLC')
    await page.locator('[data-test="company-phone"]').fill('555-0172')
    await page.locator('[data-test="company-billToAddress"]').fill('40 Lantern Yard\nMillbrook')
    await page.locator('[data-test="company-save"]').click()
    await page.locator('[data-test="company-missing"]').waitFor({ state: 'detached' })
    await page.goBack()
    await page.locator('[data-step="company"][data-done="true"]').waitFor()

    // Units, answered on the checklist itself.
    await page.locator('[data-test="setup-units"] label:has-text("Millimetres")').click()
    await page.locator('[data-test="setup-units"] label:has-text("Kilograms")').click()
    await page.locator('[data-test="setup-units-save"]').click()
    await page.locator('[data-step="units"][data-done="true"]').waitFor()

    // One warehouse, and its bins from the generator (its default block, A–C × 1–10 × 1–3).
    await page.locator('[data-test="setup-open-warehouses"]').click()
    await page.locator('[data-test="wh-add"]').click()
    await page.locator('[data-test="wh-code"]').fill('MILL')
    await page.locator('[data-test="wh-name"]').fill('Millbrook yard')
    await page.locator('[data-test="wh-save"]').click()
    await page.waitForURL(/warehouse=\d+/)
    await page.locator('[data-test="bins-range"]').click()
    await page.locator('[data-test="range-save"]').click()
    await page.locator('[data-test="bins-table"] tbody tr').first().waitFor()
    await page.goto('/setup')
    await page.locator('[data-step="warehouses"][data-done="true"]').waitFor()
    const [bins] = await h.ds.query("SELECT COUNT(*) AS n FROM bins b JOIN warehouses w ON w.id = b.warehouse_id WHERE w.code = 'MILL' AND b.kind = 'storage'")
    expect(Number(bins.n)).toBe(3 * 10 * 3)

    // One import: the contractor accounts, from a sheet, through the page every import shares.
    await page.locator('[data-test="setup-open-accounts"]').click()
    await page.locator('[data-test="import-file"]').setInputFiles({
      name: 'accounts.csv', mimeType: 'text/csv',
      buffer: Buffer.from('Account code,Name,Contact,E-mail\nHLM-01,Harbor Lane Masonry,Ines Calder,ines@harborlane.example\n', 'utf8'),
    })
    await page.locator('[data-test="import-check"]').click()
    await page.locator('[data-test="import-summary"]').waitFor()
    await page.locator('[data-test="import-commit"]').click()
    // What came in is told in rows of accounts (a stock import tells units; an accounts sheet has none).
    await page.locator('.el-message--success', { hasText: 'Imported 1 row.' }).waitFor()
    await expect.poll(async () => Number((await h.ds.query('SELECT COUNT(*) AS n FROM customers'))[0].n), { timeout: 15_000 }).toBe(1)
    await page.locator('[data-test="imports-setup-link"]').click()
    await page.locator('[data-step="accounts"][data-done="true"]').waitFor()
    expect(await page.locator('[data-step="accounts"]').textContent()).toMatch(/\b1 account(?!s)/)
    for (const step of ['company', 'units', 'warehouses', 'accounts']) expect(await done(step), step).toBe('true')
    expect(await done('opening_stock')).toBe('false')
    await h.screenshot(page, 'first-run-checklist')

    // Dismissed: the start page no longer sends anyone here, and there is no reminder on it.
    await dismissChecklistAndReload(page)
    expect(new URL(page.url()).pathname).toBe('/')
    expect(await page.locator('[data-test="setup-link"]').count()).toBe(0)
    // Still reached from where data is brought in, with every step as it was.
    await page.goto('/admin/imports')
    await page.locator('[data-test="imports-setup-link"]').click()
    await page.locator('[data-step="accounts"][data-done="true"]').waitFor()
    expect(await done('company')).toBe('true')
    await context.close()
  })
})
