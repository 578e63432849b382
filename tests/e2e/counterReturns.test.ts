// Feature: a return at the counter in a real browser at phone width (412 px), in English and in Spanish. The
// order's goods left through the real path (picked by scanning, a signed pickup ticket); the clerk types what
// comes back, picks the bin and lot, confirms the packs are unopened and sees the money back worked out before
// committing; confirming twice takes one return, and the stock is back in the chosen bin and lot exactly once.
// A refusal from the server (more than left) is shown beside the line in Spanish and changes nothing. The
// admin sets the return window and restocking fee on the selling-prices screen.
import bcrypt from 'bcryptjs'
import type { Page } from 'playwright-core'
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { User } from '../../server/entities/User.js'
import { CSRF, TEST_PASSWORD } from '../support/apiHarness.js'
import { axeFindings, blocking, describeFindings } from '../support/axeCheck.js'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { cutOffInside, sidewaysScroll } from '../support/layoutChecks.js'
import { countRows, receive, signedInAgent } from '../support/pickFixtures.js'
import { handOver } from '../support/returnFixtures.js'
import { bookedOrder, createSalesFixture, type SalesFixture } from '../support/salesFixtures.js'

let h: E2eHarness
let fx: SalesFixture
let admin: supertest.Agent
let orderId: number
let before: Record<string, unknown>

const poll = <T>(read: () => T | Promise<T>) => expect.poll(read, { timeout: 15_000 })
const PHONE = { width: 412, height: 915 }

/** What a bin and lot hold of an item, straight from the balances, and how many return moves put it there. */
async function backIn(itemId: number, bin: string, lot: string | null): Promise<{ onHand: number; moves: number }> {
  const [row]: { q: string | null }[] = await h.ds.query(
    `SELECT SUM(sb.on_hand) AS q FROM stock_balances sb JOIN bins b ON b.id = sb.bin_id LEFT JOIN lots l ON l.id = sb.lot_id
      WHERE sb.item_id = ? AND b.id = ? AND ${lot === null ? 'sb.lot_id IS NULL' : 'l.code = ?'}`,
    lot === null ? [itemId, fx.bins[bin]] : [itemId, fx.bins[bin], lot],
  )
  const moves = await countRows(h.ds, 'stock_moves', "doc_type = 'sales_return' AND item_id = ? AND bin_id = ?", [itemId, fx.bins[bin]])
  return { onHand: Number(row.q ?? 0), moves }
}

async function choose(page: Page, select: string, text: string) {
  // A click on the option while its list is still opening can miss; a person would simply pick it again.
  for (let attempt = 0; attempt < 3; attempt++) {
    if ((await page.locator(`[data-test="${select}"]`).textContent())?.includes(text)) break
    if (!(await page.locator('.el-select-dropdown__item:visible').count())) await page.locator(`[data-test="${select}"]`).click()
    await page.locator('.el-select-dropdown__item:visible').filter({ hasText: text }).first().click()
    await page.waitForTimeout(200)
  }
  await poll(() => page.locator(`[data-test="${select}"]`).textContent()).toContain(text)
  // A list still open (the click landed while it was opening) is closed by clicking beside it, not Escape (that closes the dialog).
  if (await page.locator('.el-select-dropdown__item:visible').count()) await page.locator('[data-test="return-figures"]').click()
  await poll(() => page.locator('.el-select-dropdown__item:visible').count()).toBe(0)
}

beforeAll(async () => {
  h = await startE2e()
  const users = h.ds.getRepository(User)
  if (!(await users.existsBy({ username: 't-counter-es' }))) {
    await users.save(users.create({ username: 't-counter-es', displayName: 'Test mostrador', roles: ['counter'], locale: 'es', active: true, passwordHash: await bcrypt.hash(TEST_PASSWORD, 4) }))
  }
  const crew = await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD)
  const counter = await signedInAgent(h.built.app, 'counter', DEMO_PASSWORD)
  admin = await signedInAgent(h.built.app, 'admin', DEMO_PASSWORD)
  fx = await createSalesFixture(h.ds)
  await h.ds.query("INSERT INTO sales_tax_rates (warehouse_id, rate_percent, label) VALUES (?, '8.2500', 'Test county')", [fx.warehouseId])
  await receive(crew, fx.warehouseId, [
    { itemId: fx.block.id, binId: fx.bins['C-01-1'], qty: 120 },
    { itemId: fx.spacers.id, binId: fx.bins['C-01-1'], qty: 300 },
  ])
  orderId = await bookedOrder(h.ds, counter, fx, `W${fx.tag}`)
  // 60 of the 120 blocks and 200 of the 300 spacers leave on a signed pickup ticket.
  await handOver(counter, crew, orderId, [{ itemId: fx.block.id, qty: 60 }, { itemId: fx.spacers.id, qty: 200 }])
  before = (await admin.get('/api/sales-settings')).body
})
afterAll(async () => {
  if (before) await admin?.patch('/api/sales-settings').set(CSRF).send(before)
  await h?.close()
})

describe('returns at the counter', () => {
  it('the admin sets the window and the fee; bad numbers are refused beside the field', { timeout: 60_000 }, async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signInByApi(page, 'admin')
      const audited = () => countRows(h.ds, 'audit_entries', "action = 'settings.update' AND entity = 'app_settings' AND entity_id = 'sales'")
      const auditsBefore = await audited()
      await page.goto('/admin/selling-prices')
      await page.getByRole('tab', { name: 'Deposits and returns' }).click()
      await page.locator('[data-test="policy-window"]').fill('1,5')
      await page.locator('[data-test="policy-save"]').click()
      await poll(() => page.locator('[data-test="sales-policy"] .el-form-item__error').count()).toBeGreaterThan(0)
      expect(await audited()).toBe(auditsBefore)
      await page.locator('[data-test="policy-window"]').fill('45')
      await page.locator('[data-test="policy-restocking"]').fill('20')
      await page.locator('[data-test="policy-save"]').click()
      await poll(async () => (await admin.get('/api/sales-settings')).body).toMatchObject({ returnWindowDays: 45, restockingPercent: '20' })
      expect(await audited()).toBe(auditsBefore + 1)
    } finally {
      await context.close()
    }
  })

  it('the tax tab: every rate field is named, a bad rate is refused beside its own field, and nothing is saved', { timeout: 45_000 }, async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signInByApi(page, 'admin')
      const [w]: { code: string }[] = await h.ds.query('SELECT code FROM warehouses WHERE id = ?', [fx.warehouseId])
      const rateNow = async () => (await h.ds.query('SELECT rate_percent AS r FROM sales_tax_rates WHERE warehouse_id = ?', [fx.warehouseId]))[0].r
      await page.goto('/admin/selling-prices')
      await page.getByRole('tab', { name: 'Sales tax by location' }).click()
      const rate = page.locator(`[data-test="tax-rate-${w.code}"]`)
      // The stored 8.2500 shows as the rate it is, without the storage's trailing zeros.
      await poll(() => rate.inputValue()).toBe('8.25')
      // source: WCAG 2.2 SC 1.3.1 Info and Relationships and SC 4.1.2 Name, Role, Value (axe-core rule "label")
      const findings = blocking(await axeFindings(page, 'selling prices, tax tab'))
      expect(findings, describeFindings(findings)).toEqual([])
      expect(await rate.getAttribute('aria-label')).toContain(w.code)
      // Each bad figure gets its own words beside the field, not only a notice naming no field (common practice).
      for (const bad of ['1e9', '-5', '1,5', '7 3/4']) {
        await rate.fill(bad)
        await page.locator(`[data-test="tax-save-${w.code}"]`).click()
        await poll(() => page.locator(`[data-test="tax-rate-problem-${w.code}"]`).textContent()).toMatch(/30 %/)
        expect(await rate.getAttribute('aria-invalid')).toBe('true')
      }
      expect(await rateNow()).toBe('8.2500')
    } finally {
      await context.close()
    }
  })

  it('in English at 412 px: 24 blocks back into C-01-2, lot BACK-1, as credit; confirmed twice, taken once', { timeout: 90_000 }, async () => {
    await admin.patch('/api/sales-settings').set(CSRF).send({ returnWindowDays: 30, restockingPercent: '15' })
    const { page, context } = await h.newPage({ viewport: PHONE })
    try {
      await h.signInByApi(page, 'counter')
      await page.goto(`/counter/sales-orders/${orderId}`)
      await page.locator('[data-test="return-new"]').click()
      await page.locator('[data-test="return-dialog"]').waitFor()
      expect(await page.locator(`[data-test="return-line-${fx.block.sku}"]`).textContent()).toContain('up to 60')
      await page.locator(`[data-test="return-qty-${fx.block.sku}"]`).fill('24')
      await choose(page, `return-bin-${fx.block.sku}`, 'C-01-2')
      await page.locator(`[data-test="return-lot-${fx.block.sku}"]`).fill('BACK-1')
      await page.locator(`[data-test="return-unopened-${fx.block.sku}"]`).click()
      // Hand-worked: 24.99 × 0.85 = 21.2415 → 21.24 each; goods 21.24 × 24 = 509.76. The line's tax 120 × 21.24 =
      // 2548.80 × 8.25 % = 210.276 → 210.28, its share 210.28 × 24 / 120 = 42.056 → 42.06. Fee 15 % of 509.76 =
      // 76.464 → 76.46. Back 509.76 + 42.06 − 76.46 = 475.36, half-up to the cent at each figure (Streamlined
      // Sales and Use Tax Agreement §324 rounding rule, from memory).
      await poll(() => page.locator('[data-test="return-figures"]').getAttribute('data-refund')).toBe('475.36')
      expect(await page.locator('[data-test="return-figure-refund"]').textContent()).toContain('475.36')
      expect((await sidewaysScroll(page)).by).toBe(0)
      // Nor is anything in the dialog cut off at its edge (common practice: no cut-off field at 412 px).
      expect(await cutOffInside(page, '[data-test="return-dialog"]')).toEqual([])
      await h.screenshot(page, 'return-dialog-phone-en')
      await page.locator('[data-test="return-confirm"]').dblclick()
      await page.locator('[data-test="return-dialog"]').waitFor({ state: 'hidden' })
      await poll(() => backIn(fx.block.id, 'C-01-2', 'BACK-1')).toEqual({ onHand: 24, moves: 1 })
      expect(await countRows(h.ds, 'sales_returns', 'sales_order_id = ?', [orderId])).toBe(1)
      const receipt = page.locator('[data-test^="return-RT-"]').first()
      expect(await receipt.getAttribute('data-refund')).toBe('475.36')
      const [credit]: { total: string }[] = await h.ds.query('SELECT SUM(amount) AS total FROM account_credits WHERE customer_id = ?', [fx.customerId])
      expect(credit.total).toBe('475.36')
      await h.screenshot(page, 'return-receipt-phone-en')
      // Printed, the receipt goes on paper alone: at the moment of printing (print media), the order's title and
      // the navigation are not visible and the receipt is (common practice: a receipt is its own document).
      await page.emulateMedia({ media: 'print' })
      await page.evaluate(() => {
        const seen = (sel: string) => [...document.querySelectorAll(sel)].some((e) => getComputedStyle(e).visibility === 'visible' && e.getClientRects().length > 0)
        ;(window as unknown as { lyPrinted: unknown }).lyPrinted = null
        window.print = () => {
          ;(window as unknown as { lyPrinted: unknown }).lyPrinted = { receipt: seen('[data-test^="return-RT-"] td'), order: seen('h1'), nav: seen('nav a') }
        }
      })
      // The print button itself stays off paper, so it is pressed as an event rather than by a pointer.
      await page.locator(`[data-test="return-print-${(await receipt.getAttribute('data-test'))!.slice('return-'.length)}"]`).dispatchEvent('click')
      await poll(() => page.evaluate(() => (window as unknown as { lyPrinted: unknown }).lyPrinted)).toEqual({ receipt: true, order: false, nav: false })
      await page.emulateMedia({ media: 'screen' })
    } finally {
      await context.close()
    }
  })

  it('in Spanish at 412 px: too many refused beside the line, then a case of spacers back by cheque', { timeout: 90_000 }, async () => {
    const { page, context } = await h.newPage({ viewport: PHONE })
    try {
      await h.signInByApi(page, 't-counter-es', TEST_PASSWORD)
      await page.goto(`/counter/sales-orders/${orderId}`)
      // The fixture's account has no e-mail address: the failed ready e-mail is said in Spanish, not in the log's words.
      expect(await page.locator('[data-test="ready-mail-failed"]').textContent()).toMatch(/no tiene correo electrónico/)
      await page.locator('[data-test="return-new"]').click()
      await page.locator('[data-test="return-dialog"]').waitFor()
      // 60 blocks left, 24 came back: 36 may still come back; 37 is refused by the server, in Spanish.
      expect(await page.locator(`[data-test="return-line-${fx.block.sku}"]`).textContent()).toContain('hasta 36')
      await page.locator(`[data-test="return-qty-${fx.block.sku}"]`).fill('37')
      await choose(page, `return-bin-${fx.block.sku}`, 'C-01-2')
      await page.locator(`[data-test="return-unopened-${fx.block.sku}"]`).click()
      await page.locator('[data-test="return-confirm"]').click()
      await poll(() => page.locator(`[data-test="return-line-${fx.block.sku}"] .el-form-item__error`).textContent()).toMatch(/como máximo 36/)
      expect(await countRows(h.ds, 'sales_returns', 'sales_order_id = ?', [orderId])).toBe(1)
      await page.locator(`[data-test="return-qty-${fx.block.sku}"]`).fill('')
      // One case of 100 spacers into C-01-2 with no lot, by cheque 004512.
      await page.locator(`[data-test="return-qty-${fx.spacers.sku}"]`).fill('100')
      // The refusal named the first line sent (the blocks); with other lines chosen it is not shown under the spacers.
      expect(await page.locator(`[data-test="return-line-${fx.spacers.sku}"] .el-form-item__error`).count()).toBe(0)
      await choose(page, `return-bin-${fx.spacers.sku}`, 'C-01-2')
      await page.locator(`[data-test="return-unopened-${fx.spacers.sku}"]`).click()
      await page.locator('[data-test="return-settle-cheque"]').click()
      await page.locator('[data-test="return-reference"]').fill('004512')
      // Hand-worked: 0.45 × 0.85 = 0.3825 → 0.38 each; 100 → 38.00. The spacer line 300 × 0.38 = 114.00, tax
      // 8.25 % = 9.405 → 9.41, a third 3.1366… → 3.14. Fee 15 % of 38.00 = 5.70. Back 38.00 + 3.14 − 5.70 = 35.44.
      await poll(() => page.locator('[data-test="return-figures"]').getAttribute('data-refund')).toBe('35.44')
      expect(await page.locator('[data-test="return-dialog"]').textContent()).toMatch(/Reembolso con cheque/)
      expect((await sidewaysScroll(page)).by).toBe(0)
      expect(await cutOffInside(page, '[data-test="return-dialog"]')).toEqual([])
      const findings = blocking(await axeFindings(page, 'return dialog'))
      expect(findings, describeFindings(findings)).toEqual([])
      await h.screenshot(page, 'return-dialog-phone-es')
      await page.locator('[data-test="return-confirm"]').click()
      await page.locator('[data-test="return-dialog"]').waitFor({ state: 'hidden' })
      await poll(() => backIn(fx.spacers.id, 'C-01-2', null)).toEqual({ onHand: 100, moves: 1 })
      expect(await countRows(h.ds, 'sales_returns', "sales_order_id = ? AND settle_by = 'cheque' AND reference = '004512' AND refund = '35.44'", [orderId])).toBe(1)
      await poll(() => page.locator('[data-test="order-returns"]').textContent()).toMatch(/Devolución RT-/)
    } finally {
      await context.close()
    }
  })
})
