// Feature: the number field (src/components/base/BaseNumberInput.vue) in a real browser, on three forms that
// send quantities: a stock adjustment on the handheld (the warehouse crew, in Spanish), a line of a draft quote
// at the counter and a line of a new purchase order. The trials' bad numbers (0, -3, 1e9, 1000000000, 1,5,
// 7 3/4 and nothing at all) each get a worded problem beside the field, keep what was typed, and nothing is sent: the field is
// never rounded or clamped into a number the person did not write. In Spanish, text that reads two ways (1,500 and
// 1.500: a thousand and a half, or one and a half) is asked about with both readings; a decimal comma is read and
// written back the way the screens write numbers.
import { randomUUID } from 'node:crypto'
import bcrypt from 'bcryptjs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { createStockFixture, type StockFixture } from '../support/stockFixtures.js'
import { createSalesFixture, type SalesFixture } from '../support/salesFixtures.js'
import { TEST_PASSWORD } from '../support/apiHarness.js'
import { TEST_HASH_COST } from '../support/testHashCost.js'
import { User } from '../../server/entities/User.js'

let h: E2eHarness
let stock: StockFixture
let sales: SalesFixture

beforeAll(async () => {
  h = await startE2e()
  stock = await createStockFixture(h.ds)
  sales = await createSalesFixture(h.ds)
  // An admin who works in Spanish (the demo's admin reads English).
  const users = h.ds.getRepository(User)
  if (!(await users.existsBy({ username: 't-admin-es' }))) {
    await users.save(users.create({ username: 't-admin-es', displayName: 'Test admin', roles: ['admin'], locale: 'es', active: true, passwordHash: await bcrypt.hash(TEST_PASSWORD, TEST_HASH_COST) }))
  }
})
afterAll(() => h?.close())

const poll = <T>(read: () => T | Promise<T>) => expect.poll(read, { timeout: 10_000 })

/** Every request that would change something (anything but a GET) the page sends to the API from now on. */
function writes(page: Page): string[] {
  const sent: string[] = []
  page.on('request', (r) => {
    if (r.method() !== 'GET' && new URL(r.url()).pathname.startsWith('/api/')) sent.push(`${r.method()} ${new URL(r.url()).pathname}`)
  })
  return sent
}

/** Types `typed` into the number field `field`, tries to send with `send`, and reads the problem shown beside it. */
async function tryNumber(page: Page, field: string, send: string, typed: string): Promise<string> {
  const input = page.locator(`${field} input`)
  await input.fill(typed)
  await page.locator(send).click()
  const problem = page.locator(`${field} [role="alert"]`)
  await problem.waitFor()
  expect(await input.inputValue()).toBe(typed) // what the person typed stays, unrounded
  return (await problem.textContent())?.trim() ?? ''
}

/** One step for every form: types each text in turn, tries to send, and answers the problem shown for each. */
async function problemsFor(page: Page, field: string, send: string, expected: Record<string, string>): Promise<Record<string, string>> {
  const shown: Record<string, string> = {}
  for (const typed of Object.keys(expected)) shown[typed] = await tryNumber(page, field, send, typed)
  return shown
}

// source: common practice (stock is counted and ordered in whole units from 1); CLDR English number symbols: ","
// only between groups of three digits, so 1,5 is no number; words from src/i18n/en/errors.ts
const ENGLISH_WHOLE_UNITS = {
  '0': 'At least 1',
  '-3': 'At least 1',
  '1,5': 'Can’t read “1,5” as a number. Write digits, like 12 or 12.5.',
  '7 3/4': 'Whole numbers only',
}

describe('number fields refuse bad numbers beside the field and send nothing', () => {
  it('a stock adjustment on the handheld, in Spanish', { timeout: 60_000 }, async () => {
    const { page, context } = await h.newPage({ viewport: { width: 412, height: 915 } })
    try {
      await h.signInByApi(page, 'warehouse') // the demo's warehouse user reads Spanish
      await page.goto(`/stock/adjust?binId=${stock.bins.A1}&itemId=${stock.itemId}`)
      await page.locator('[data-reason="damaged"]').click()
      const sent = writes(page)
      const field = '[data-test="adjust-qty"]'
      const review = '[data-test="adjust-review"]'
      // source: common practice (a damaged count is a whole number of units from 1); words from src/i18n/es/errors.ts
      // source: CLDR Spanish number symbols (es): the decimal comma, so 1,5 is one and a half, not a whole unit;
      // CLDR es-US, the screens' writing, groups thousands with a comma (1,500) and es with a point (1.500): asked
      const twoWays = (input: string) => `“${input}” se lee de dos maneras, 1500 o 1.5: escriba 1500 sin separador, o 1.5 con punto decimal.`
      const spanish = {
        '0': 'Como mínimo 1',
        '-3': 'Como mínimo 1',
        '1e9': 'No se puede leer “1e9” como número. Escriba cifras, como 12 o 12,5.',
        '1,5': 'Solo números enteros',
        '7 3/4': 'Solo números enteros',
        '1,500': twoWays('1,500'),
        '1.500': twoWays('1.500'),
      }
      expect(await problemsFor(page, field, review, spanish)).toEqual(spanish)
      expect(await page.locator('[data-test="confirm-dialog"]').isVisible()).toBe(false)
      expect(sent).toEqual([])
      // The targets stay big enough for gloves: the field and its − and + buttons at least 44 px tall.
      // source: WCAG 2.2 SC 2.5.8 (24 px minimum) and the 44 px target of SC 2.5.5 the handheld screens keep
      for (const box of [await page.locator(`${field} .el-input__wrapper`).boundingBox(), await page.locator(`${field} button`).first().boundingBox()]) {
        expect(box?.height ?? 0).toBeGreaterThanOrEqual(44)
      }
      // A good number clears the problem and goes on to the confirmation.
      await page.locator(`${field} input`).fill('2')
      await page.locator(`${field} input`).press('Enter')
      await poll(() => page.locator(`${field} [role="alert"]`).count()).toBe(0)
    } finally {
      await context.close()
    }
  })

  it('a draft quote’s line quantity at the counter', { timeout: 30_000 }, async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signInByApi(page, 'counter')
      const made = await page.request.post('/api/quotes', {
        headers: { 'X-Lumenyard-Request': '1', 'Idempotency-Key': randomUUID() },
        data: { customerId: sales.customerId, warehouseId: sales.warehouseId, lines: [{ itemId: sales.block.id, qty: 12 }] },
      })
      expect(made.status()).toBe(201)
      const quote = (await made.json()) as { id: number; lines: { lineNo: number }[] }
      await page.goto(`/counter/quotes/${quote.id}`)
      const field = `[data-test="qty-${quote.lines[0].lineNo}"]`
      await page.locator(`${field} input`).waitFor()
      const sent = writes(page)
      const save = '[data-test="quote-save"]'
      // source: the quote line's own limits (shared/schemas/quotes.ts: whole units from 1 to 1,000,000); words from src/i18n/en/errors.ts
      const quoteLine = {
        ...ENGLISH_WHOLE_UNITS,
        '1000000000': 'At most 1,000,000',
        '1e9': 'Can’t read “1e9” as a number. Write digits, like 12 or 12.5.',
      }
      expect(await problemsFor(page, field, save, quoteLine)).toEqual(quoteLine)
      expect(sent).toEqual([])
      // A clerk's own price of 0 is refused beside the price, as the server would refuse it, and nothing is sent.
      // source: common practice (a line given away at a trade counter is a manager's call)
      await page.locator(`${field} input`).fill('12')
      await page.locator(`input[aria-label="Own price ${sales.block.sku}"]`).fill('0')
      await page.locator(`input[aria-label="Why ${sales.block.sku}"]`).fill('Replaces blocks broken on our truck')
      await page.locator(save).click()
      await poll(() => page.locator('.own .err').first().textContent()).toContain('A line at no charge is an administrator’s call')
      expect(sent).toEqual([])
      const [line]: { qty: number }[] = await h.ds.query('SELECT qty FROM quote_lines WHERE quote_id = ?', [quote.id])
      expect(Number(line.qty)).toBe(12)
    } finally {
      await context.close()
    }
  })

  it('a new purchase order’s packs', { timeout: 30_000 }, async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signInByApi(page, 'buyer')
      await page.goto('/purchasing/orders')
      await page.locator('[data-test="new-order"]').click()
      const dialog = page.locator('.el-dialog:visible')
      await dialog.waitFor()
      const field = '.el-dialog:visible .ly-number'
      const sent = writes(page)
      const create = '[data-test="create-order"]'
      // source: common practice (a vendor ships whole packs, at least one); words from src/i18n/en/errors.ts
      const packs = { ...ENGLISH_WHOLE_UNITS, '': 'Required' }
      expect(await problemsFor(page, field, create, packs)).toEqual(packs)
      expect(await dialog.isVisible()).toBe(true)
      expect(sent).toEqual([])
    } finally {
      await context.close()
    }
  })
})

describe('a decimal typed in Spanish', () => {
  it('reads the decimal comma and writes it back as the screens write numbers; asks about 1,500', { timeout: 30_000 }, async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signInByApi(page, 't-admin-es', TEST_PASSWORD)
      await page.goto('/counter/settings')
      await page.locator('#tab-figures').click()
      const field = '[data-test="figure-groutDepthMm"]'
      const input = page.locator(`${field} input`)
      await input.waitFor()
      const sent = writes(page)
      // source: CLDR es: 1,5 is one and a half; CLDR es-US (the Spanish screens' writing, checked with Node's Intl:
      // es-US 1.5 → "1.5") writes it with a point, so the field shows what it read
      await input.fill('1,5')
      await input.press('Tab')
      await poll(() => input.inputValue()).toBe('1.5')
      expect(await page.locator(`${field} [role="alert"]`).count()).toBe(0)
      // source: CLDR es-US groups thousands with a comma (1,500 = 1500), CLDR es reads 1,500 as one and a half
      await input.fill('1,500')
      await input.press('Tab')
      await poll(() => page.locator(`${field} [role="alert"]`).textContent()).toBe('“1,500” se lee de dos maneras, 1500 o 1.5: escriba 1500 sin separador, o 1.5 con punto decimal.')
      expect(await input.inputValue()).toBe('1,500')
      expect(sent).toEqual([])
    } finally {
      await context.close()
    }
  })
})

describe('the admin’s sales tax rates read as percentages', () => {
  it('shows 7.1875 and 6.5 to the precision set, in English and in Spanish', { timeout: 60_000 }, async () => {
    // source: hand-chosen rates with four and one significant decimals (DECIMAL(7,4) keeps 7.1875 and 6.5000)
    await h.ds.query('REPLACE INTO sales_tax_rates (warehouse_id, rate_percent) VALUES (?, ?), (?, ?)', [sales.warehouseId, '7.1875', stock.warehouses[0].id, '6.5000'])
    const [{ code: salesCode }]: { code: string }[] = await h.ds.query('SELECT code FROM warehouses WHERE id = ?', [sales.warehouseId])
    const stockCode = stock.warehouses[0].code
    // source: CLDR percent patterns for en-US and es-US, both "#,##0%" with a decimal point (the screens write
    // numbers the US way in both languages; checked with Node's Intl: es-US 0.071875 → "7.1875%")
    for (const [user, password, tab, heading] of [
      ['admin', undefined, 'Sales tax by location', 'Charged now'],
      ['t-admin-es', TEST_PASSWORD, 'Impuesto por sede', 'Se cobra ahora'],
    ] as const) {
      const { page, context } = await h.newPage()
      try {
        await h.signInByApi(page, user, password)
        await page.goto('/admin/selling-prices')
        await page.getByRole('tab', { name: tab }).click()
        const charged = (code: string) => page.locator(`[data-test="tax-charged-${code}"]`)
        const normal = async (code: string) => ((await charged(code).textContent()) ?? '').replace(/\s/g, ' ').trim()
        await poll(() => normal(salesCode)).toBe('7.1875%')
        expect(await normal(stockCode)).toBe('6.5%')
        expect(await page.locator('[data-test="tax-table"]').textContent()).toContain(heading)
        expect(await page.locator(`[data-test="tax-rate-${salesCode}"]`).inputValue()).toBe('7.1875')
        expect(await page.locator(`[data-test="tax-rate-${stockCode}"]`).inputValue()).toBe('6.5')
      } finally {
        await context.close()
      }
    }
  })
})
