// An import's check followed from the server in Chromium: the bar shows how many of the file's rows the server
// has checked, and a reload in the middle of the check finds the same check again (no second one), follows it to
// its end and shows its answer, which can be imported without choosing the file again (the server kept it); a
// reload in the middle of that commit finds it again and follows it to what it wrote, once for a double click.
import { createHash } from 'node:crypto'
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { tagOf } from '../support/fixtureRows.js'
import { openInApp } from '../support/routeWalk.js'
import { createOpeningStockTarget } from '../support/stockFixtures.js'

const tag = tagOf()
const SKU = `IP-BLK-${tag}`
const WH = `IP${tag}`
const ROWS = 6_000
let h: E2eHarness
let page: Page
let context: BrowserContext

beforeAll(async () => {
  h = await startE2e()
  await createOpeningStockTarget(h.ds, SKU, WH)
  ;({ page, context } = await h.newPage())
  await h.signIn(page, 'admin')
})
afterAll(async () => {
  await context?.close()
  await h?.close()
})

const file = Buffer.from(['SKU,Warehouse,Bin,Lot,Quantity,Unit cost',
  ...Array.from({ length: ROWS }, (_, i) => `${SKU},${WH},A-01-1,RUN-${String(i).padStart(5, '0')},${(i % 9) + 1},3.1000`)].join('\r\n') + '\r\n', 'utf8')
const checksum = createHash('sha256').update(file).digest('hex')
const runsOfFile = async () => Number((await h.ds.query('SELECT COUNT(*) AS n FROM data_import_runs WHERE checksum = ?', [checksum]))[0].n)

describe('import progress', () => {
  it('finds a check still running after a reload, follows it to its answer, and starts no second check', async () => {
    await openInApp(page, '/admin/imports?kind=opening_stock')
    await page.locator('[data-test="import-file"]').setInputFiles({ name: 'opening-large.csv', mimeType: 'text/csv', buffer: file })
    // The bins held by another connection keep the check at its first chunk until released, so the reload surely
    // lands while it runs.
    const holder = h.ds.createQueryRunner()
    await holder.connect()
    let held = true
    try {
      await holder.query('LOCK TABLES bins WRITE')
      const check = page.locator('[data-test="import-check"]')
      await check.click()
      // A second press while it runs starts nothing (the button is held; the server would follow the first check).
      await check.click({ force: true, timeout: 1_000 }).catch(() => undefined)
      await expect.poll(async () => (await h.ds.query("SELECT state FROM data_import_runs WHERE checksum = ? ORDER BY started_at DESC LIMIT 1", [checksum]))[0]?.state, { timeout: 30_000 }).toBe('running')
      await page.reload()
      const text = page.locator('[data-test="import-run-text"]')
      await text.waitFor({ timeout: 15_000 })
      // src/i18n/en/golive.ts runFound, runChecked: the file's name and its rows counted before the check read them.
      expect(await text.textContent()).toContain('opening-large.csv')
      expect(await text.textContent()).toContain('6,000')
      const bar = page.locator('[data-test="import-bar"]')
      const seen: number[] = [Number(await bar.getAttribute('aria-valuenow'))]
      await holder.query('UNLOCK TABLES')
      held = false
      const summary = page.locator('[data-test="import-summary"]')
      while (!(await summary.isVisible())) {
        const now = await bar.getAttribute('aria-valuenow', { timeout: 200 }).catch(() => null)
        if (now !== null) seen.push(Number(now))
        await page.waitForTimeout(100)
      }
      expect(seen).toEqual([...seen].sort((a, b) => a - b))
      expect(Math.max(...seen)).toBeLessThan(100)
      // The answer of the check started before the reload: every row, all good; one check of the file in all.
      expect(await summary.textContent()).toContain('6,000')
      expect(await runsOfFile()).toBe(1)
      // The server kept the checked file: it can be imported without choosing it again (the page lost it in the reload).
      expect(await page.locator('[data-test="import-commit"]').isDisabled()).toBe(false)
      expect(await page.locator('[data-test="import-choose-again"]').count()).toBe(0)
    } finally {
      if (held) await holder.query('UNLOCK TABLES').catch(() => undefined)
      await holder.release()
    }
  }, 120_000)

  it('finds a commit still running after a reload, follows it to what it wrote, and commits once for a double click', async () => {
    // Continues from the check above: its answer is on the page, the file kept on the server.
    const commitButton = page.locator('[data-test="import-commit"]')
    expect(await commitButton.isDisabled()).toBe(false)
    const records = async () => Number((await h.ds.query('SELECT COUNT(*) AS n FROM data_imports WHERE checksum = ?', [checksum]))[0].n)
    const onHand = async () => Number((await h.ds.query('SELECT COALESCE(SUM(b.on_hand), 0) AS n FROM stock_balances b JOIN items i ON i.id = b.item_id WHERE i.sku = ?', [SKU]))[0].n)
    const holder = h.ds.createQueryRunner()
    await holder.connect()
    let held = true
    try {
      // The bins held by another connection keep the commit at its check until released.
      await holder.query('LOCK TABLES bins WRITE')
      await commitButton.click()
      await commitButton.click({ force: true, timeout: 1_000 }).catch(() => undefined)
      await expect.poll(async () => (await h.ds.query("SELECT state FROM data_import_runs WHERE checksum = ? AND step = 'commit' ORDER BY started_at DESC LIMIT 1", [checksum]))[0]?.state, { timeout: 30_000 }).toBe('running')
      await page.reload()
      const text = page.locator('[data-test="import-run-text"]')
      await text.waitFor({ timeout: 15_000 })
      expect(await text.textContent()).toContain('opening-large.csv')
      // src/i18n/en/golive.ts committing
      expect(await page.locator('[data-test="import-progress"]').textContent()).toContain('Importing')
      await holder.query('UNLOCK TABLES')
      held = false
      // What it wrote, once the commit ends: 6,000 lines; the quantities (i mod 9) + 1 over 6,000 rows repeat
      // 1…9 (sum 45) 666 times and then 1…6 (sum 21): 29,991 blocks (arithmetic series).
      const message = page.locator('.el-message--success')
      await message.waitFor({ timeout: 60_000 })
      expect(await message.textContent()).toContain('29,991')
      expect(await records()).toBe(1)
      expect(await onHand()).toBe(29_991)
      // One commit run for the two presses and the reload.
      expect(Number((await h.ds.query("SELECT COUNT(*) AS n FROM data_import_runs WHERE checksum = ? AND step = 'commit'", [checksum]))[0].n)).toBe(1)
    } finally {
      if (held) await holder.query('UNLOCK TABLES').catch(() => undefined)
      await holder.release()
    }
  }, 120_000)
})
