// Everything out from the admin's import page in Chromium: the bar shows a true percentage (the server counts the
// rows it will write, then reports how many it has written) and reaches 100 % before the zip is saved; a second
// click while it runs starts no second export, and a reload afterwards offers the kept file. A reload while it
// runs finds the same export again and follows it to 100 % and the saved zip.
import { readFile } from 'node:fs/promises'
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { unzipEntries } from '../support/downloads.js'
import { countRows } from '../support/fixtureRows.js'
import { openInApp } from '../support/routeWalk.js'

let h: E2eHarness
let page: Page
let context: BrowserContext

beforeAll(async () => {
  h = await startE2e()
  ;({ page, context } = await h.newPage())
  await h.signIn(page, 'admin')
})
afterAll(async () => {
  await context?.close()
  await h?.close()
})

describe('everything out', () => {
  it('shows a percentage that reaches 100 % and saves the zip; a second click starts nothing, a reload offers the kept file', async () => {
    const exports = () => countRows(h.ds, 'audit_entries', "action = 'business.export'")
    const before = await exports()
    await openInApp(page, '/admin/imports')
    const button = page.locator('[data-test="everything-out-download"]')
    // Element Plus puts role="progressbar" and aria-valuenow on the bar's own element.
    const bar = page.locator('[data-test="everything-out-bar"]')
    const saved = page.waitForEvent('download', { timeout: 120_000 })
    await button.click()
    // A second click while it runs starts nothing (the button is held, and the server answers the running export).
    await button.click({ force: true, timeout: 2_000 }).catch(() => undefined)
    const seen: number[] = []
    let done = false
    void saved.then(() => { done = true })
    while (!done) {
      const now = await bar.getAttribute('aria-valuenow', { timeout: 500 }).catch(() => null)
      if (now !== null) seen.push(Number(now))
      await page.waitForTimeout(100)
    }
    const download = await saved
    expect(download.suggestedFilename()).toMatch(/^lumenyard-everything-\d{4}-\d{2}-\d{2}\.zip$/)
    // The bar stands at 100 % beside the saved file's name; the percentages seen never went back.
    await expect.poll(() => bar.getAttribute('aria-valuenow')).toBe('100')
    expect(seen).toEqual([...seen].sort((a, b) => a - b))
    // One export was written, whole: a zip whose first entry is the README.
    expect(await exports()).toBe(before + 1)
    const entries = await unzipEntries(await readFile((await download.path())!))
    expect([...entries.keys()][0]).toBe('README.xlsx')
    expect(entries.has('moves.xlsx')).toBe(true)
    // After a reload the finished file is offered again, and nothing new is exported.
    await page.reload()
    await page.locator('[data-test="everything-out-waiting"]').waitFor()
    expect(await exports()).toBe(before + 1)
  }, 300_000)

  it('a reload in the middle of the export finds the same export, follows it to 100 % and saves the zip', async () => {
    const exports = () => countRows(h.ds, 'audit_entries', "action = 'business.export'")
    const before = await exports()
    await openInApp(page, '/admin/imports')
    // The ledger held by another connection keeps the export at its first step (counting its rows) until released,
    // so the reload surely lands while it runs.
    const holder = h.ds.createQueryRunner()
    await holder.connect()
    let held = true
    try {
      await holder.query('LOCK TABLES stock_moves WRITE')
      await page.locator('[data-test="everything-out-download"]').click()
      await page.locator('[data-test="everything-out-progress"]').waitFor()
      const [started] = await h.ds.query("SELECT id, state FROM business_export_jobs ORDER BY started_at DESC LIMIT 1")
      expect(started.state).toBe('running')
      await page.reload()
      // After the reload the page shows the running export again (no new one is started).
      await page.locator('[data-test="everything-out-progress"]').waitFor()
      expect(Number((await h.ds.query("SELECT COUNT(*) AS n FROM business_export_jobs WHERE started_at >= (SELECT started_at FROM business_export_jobs WHERE id = ?)", [started.id]))[0].n)).toBe(1)
      const saved = page.waitForEvent('download', { timeout: 120_000 })
      await holder.query('UNLOCK TABLES')
      held = false
      const download = await saved
      await expect.poll(() => page.locator('[data-test="everything-out-bar"]').getAttribute('aria-valuenow')).toBe('100')
      const [after] = await h.ds.query('SELECT id, state FROM business_export_jobs ORDER BY started_at DESC LIMIT 1')
      expect([after.id, after.state]).toEqual([started.id, 'ready'])
      expect(await exports()).toBe(before + 1)
      const entries = await unzipEntries(await readFile((await download.path())!))
      expect([...entries.keys()][0]).toBe('README.xlsx')
    } finally {
      if (held) await holder.query('UNLOCK TABLES').catch(() => undefined)
      await holder.release()
    }
  }, 300_000)
})
