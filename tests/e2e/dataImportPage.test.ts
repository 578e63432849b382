// The go-live import page (Go-live → imports) in Chromium, tried the way a new supplier uses it: an opening
// stock file checked and committed with a double click, files that are not what the page asks for (not a
// spreadsheet, the wrong columns, empty), a refused reversal, a Spanish reader, a 412 px phone and the keyboard alone.
// Each trial checks the database too: a refused file changes nothing, a commit writes once.
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { CSRF } from '../support/apiHarness.js'
import { signedInAgent } from '../support/pickFixtures.js'
import { countRows, insertId, tagOf } from '../support/fixtureRows.js'
import { focused, tabTo } from '../support/keyboard.js'
import { sidewaysScroll } from '../support/layoutChecks.js'
import { openInApp } from '../support/routeWalk.js'
import { createWarehouse } from '../support/stockFixtures.js'

const tag = tagOf()
const W = `GL${tag}`
const ITEMS = 200
const BINS = 101
let h: E2eHarness
let page: Page
let context: BrowserContext
const itemIds: number[] = []
let binIds: Record<string, number> = {}

beforeAll(async () => {
  h = await startE2e()
  // 200 items × 101 bins: room for 20,000 distinct opening-stock rows besides the small files.
  const bins = Array.from({ length: BINS }, (_, i) => `R-${String(i + 1).padStart(3, '0')}`)
  binIds = (await createWarehouse(h.ds, W, bins)).bins
  for (let i = 0; i < ITEMS; i++) {
    itemIds.push(await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, ?, 'spacer', 'each', 0)", [sku(i), `Test joint spacer ${i}`]))
  }
  ;({ page, context } = await h.newPage())
  await h.signIn(page, 'admin')
})
afterAll(async () => {
  await h?.ds.query("UPDATE users SET locale = 'en' WHERE username = 'admin'").catch(() => undefined)
  await context?.close()
  await h?.close()
})

function sku(i: number) {
  return `GL-SP${String(i).padStart(3, '0')}-${tag}`
}
const HEAD = 'SKU,Warehouse,Bin,Lot,Quantity,Unit cost'
/** An opening-stock sheet as CSV: `rows` rows, item by item across the bins, each a different quantity. */
function sheet(rows: number, from = 0): Buffer {
  const lines = [HEAD]
  for (let k = from; k < from + rows; k++) lines.push(`${sku(k % ITEMS)},${W},R-${String(Math.floor(k / ITEMS) + 1).padStart(3, '0')},,${(k % 7) + 1},0.12`)
  return Buffer.from(lines.join('\r\n') + '\r\n', 'utf8')
}
const onHand = async () => {
  const [row] = (await h.ds.query('SELECT COALESCE(SUM(on_hand), 0) AS n FROM stock_balances WHERE item_id IN (?)', [itemIds])) as { n: string }[]
  return Number(row.n)
}
const imports = () => countRows(h.ds, 'data_imports')
const poll = <T>(read: () => T | Promise<T>, timeout = 10_000) => expect.poll(read, { timeout })

async function choose(file: { name: string; mimeType: string; buffer: Buffer }) {
  await page.locator('[data-test="import-file"]').setInputFiles(file)
}
const csvFile = (name: string, buffer: Buffer) => ({ name, mimeType: 'text/csv', buffer })

describe('go-live import page', () => {
  it('checks and commits an opening-stock file once, however often commit is pressed', async () => {
    await openInApp(page, '/admin/imports?kind=opening_stock')
    const before = { stock: await onHand(), imports: await imports() }
    await choose(csvFile('opening-small.csv', sheet(30)))
    await page.locator('[data-test="import-check"]').click()
    await poll(() => page.locator('[data-test="import-summary"]').textContent()).toContain('30')
    const commit = page.locator('[data-test="import-commit"]')
    await commit.dblclick()
    await commit.click({ force: true }).catch(() => undefined)
    // sum of (k % 7) + 1 for k = 0…29, worked by hand: 4 runs of 1…7 (112) and 1 + 2 (3)
    await poll(() => onHand()).toBe(before.stock + 115)
    await poll(() => imports()).toBe(before.imports + 1)
    // The page is ready for the next file: nothing to commit until a file is checked again.
    await poll(() => commit.isDisabled()).toBe(true)
    expect(await onHand()).toBe(before.stock + 115)
  })

  it('refuses a file that is not a spreadsheet, one with the wrong columns and an empty one, changing nothing', async () => {
    await openInApp(page, '/admin/imports?kind=opening_stock')
    const before = { stock: await onHand(), imports: await imports() }
    const bad = [
      { name: 'photo.xlsx', mimeType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', buffer: Buffer.from('\x89PNG\r\n\x1a\n not a workbook', 'binary') },
      csvFile('columns.csv', Buffer.from('Item,Where,How many\r\nX,Y,3\r\n', 'utf8')),
      csvFile('empty.csv', Buffer.alloc(0)),
    ]
    for (const file of bad) {
      await choose(file)
      await page.locator('[data-test="import-check"]').click()
      const failure = page.locator('[data-test="import-failure"]')
      await failure.waitFor()
      // The failure is worded, not a code or a stack: a sentence with letters in it.
      expect(await failure.textContent(), file.name).toMatch(/\p{L}{3,}.*\p{L}{3,}/u)
      expect(await failure.textContent(), file.name).not.toMatch(/sheet_|Error:|at \w+ \(/)
      expect(await page.locator('[data-test="import-commit"]').isDisabled(), file.name).toBe(true)
    }
    expect(await onHand()).toBe(before.stock)
    expect(await imports()).toBe(before.imports)
  })

  it('keeps the list of imports when a reversal is refused, and says why beside it', async () => {
    // The small file's stock moved since (one spacer written off): taking the import back is refused.
    const admin = await signedInAgent(h.built.app, 'admin', DEMO_PASSWORD)
    const moved = await admin.post('/api/stock/adjustments').set(CSRF).set('Idempotency-Key', `gl-${tag}`)
      .send({ itemId: itemIds[0], binId: binIds['R-001'], lotId: null, delta: -1, reason: 'damaged', note: null })
    expect(moved.status).toBe(201)
    await openInApp(page, '/admin/imports?kind=opening_stock')
    const before = { stock: await onHand(), imports: await countRows(h.ds, 'data_imports', 'reversed_at IS NULL') }
    await page.locator('[data-test="import-reverse"]').first().click()
    await page.locator('.el-message-box__btns .el-button--primary').click()
    await page.locator('[data-test="import-reverse-failure"]').waitFor()
    expect(await page.locator('[data-test="import-history"]').isVisible()).toBe(true)
    expect(await onHand()).toBe(before.stock)
    expect(await countRows(h.ds, 'data_imports', 'reversed_at IS NULL')).toBe(before.imports)
  })

  it('reads in Spanish, errors included', async () => {
    await h.ds.query("UPDATE users SET locale = 'es' WHERE username = 'admin'")
    await context.clearCookies()
    await h.signIn(page, 'admin')
    await openInApp(page, '/admin/imports?kind=opening_stock')
    expect(await page.locator('h1').first().textContent()).toBe('Traer sus datos')
    await choose(csvFile('columnas.csv', Buffer.from('Item,Where,How many\r\nX,Y,3\r\n', 'utf8')))
    await page.locator('[data-test="import-check"]').click()
    const failure = page.locator('[data-test="import-failure"]')
    await failure.waitFor()
    // src/i18n/es/errors.ts, sheet_columns
    expect(await failure.textContent()).toContain('Las columnas no coinciden con la plantilla')
    await h.ds.query("UPDATE users SET locale = 'en' WHERE username = 'admin'")
    await context.clearCookies()
    await h.signIn(page, 'admin')
  })

  it('fits a 412 px phone: no sideways scroll, every control on the screen', async () => {
    await page.setViewportSize({ width: 412, height: 900 })
    try {
      await openInApp(page, '/admin/imports?kind=opening_stock')
      await choose(csvFile('opening-phone.csv', sheet(5, 20_030)))
      await page.locator('[data-test="import-check"]').click()
      await page.locator('[data-test="import-summary"]').waitFor()
      // source: WCAG 2.2 SC 1.4.10 Reflow (tables scroll inside their own box, which the measure leaves out)
      const over = await sidewaysScroll(page)
      expect(over.culprits, `${over.by} px`).toEqual([])
      const outside = await page.evaluate(() => Array.from(document.querySelectorAll('[data-test^="import-"]'))
        .filter((el) => { const r = el.getBoundingClientRect(); return r.width > 0 && (r.left < -1 || r.right > innerWidth + 1) })
        .map((el) => el.getAttribute('data-test')))
      expect(outside).toEqual([])
    } finally {
      await page.setViewportSize({ width: 1280, height: 860 })
    }
  })

  it('works by keyboard alone: the kind, the file, check and commit', async () => {
    // The kind after opening stock: one arrow key back reaches it.
    await openInApp(page, '/admin/imports?kind=averages')
    const before = { stock: await onHand(), imports: await imports() }
    // source: WCAG 2.2 SC 2.1.1 Keyboard: the kind is chosen with the arrow keys, the file control takes focus
    await page.locator('h1').first().focus()
    await tabTo(page, '[data-test="import-kind"]')
    await page.keyboard.press('ArrowLeft')
    await poll(() => page.evaluate(() => location.search)).toContain('opening_stock')
    await tabTo(page, '[data-test="import-file"]')
    // The system's file chooser can't be driven; the file is handed to the focused control.
    await choose(csvFile('opening-keys.csv', sheet(3, 20_040)))
    await tabTo(page, '[data-test="import-check"]')
    await page.keyboard.press('Enter')
    await page.locator('[data-test="import-summary"]').waitFor()
    await tabTo(page, '[data-test="import-commit"]')
    expect(await focused(page)).toBe('import-commit')
    await page.keyboard.press('Enter')
    await page.keyboard.press('Enter')
    await poll(() => imports()).toBe(before.imports + 1)
    // k = 20040, 20041, 20042: 20,040 mod 7 = 6, so (k % 7) + 1 = 7, 1, 2, worked by hand
    await poll(() => onHand()).toBe(before.stock + 10)
  })
})

