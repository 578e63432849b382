// Feature: counter sales in a real browser, as a counter clerk on a 412 px phone-width screen in Spanish: a
// quote from the demo's curved shower bill (each price with its source), e-mailed to the contractor (the
// SMTP fake receives it with its PDF), taken by the contractor; the sales order shows the deposit due on the
// made-to-order base and records a cheque for it. Screenshots of the quote and the order.
import { simpleParser } from 'mailparser'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { BrowserContext, Page } from 'playwright-core'
import bcrypt from 'bcryptjs'
import { startSmtpFake, type SmtpFake } from '../../server/fakes/smtpFake.js'
import { User } from '../../server/entities/User.js'
import { blocking, axeFindings, describeFindings } from '../support/axeCheck.js'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { sidewaysScroll } from '../support/layoutChecks.js'
import { companyProfileFixture } from '../support/purchasingFixtures.js'
import { TEST_PASSWORD } from '../support/apiHarness.js'
import { TEST_HASH_COST } from '../support/testHashCost.js'

let h: E2eHarness
let smtp: SmtpFake
let bomId: number

beforeAll(async () => {
  smtp = await startSmtpFake({ port: 0 })
  h = await startE2e({ LUMENYARD_SMTP_PORT: String(smtp.port), LUMENYARD_SMTP_HOST: '127.0.0.1', LUMENYARD_SMTP_SECURE: 'false' })
  await companyProfileFixture(h.ds)
  // A counter clerk who works in Spanish (the demo's clerk reads English).
  const users = h.ds.getRepository(User)
  if (!(await users.existsBy({ username: 't-counter-es' }))) {
    await users.save(users.create({ username: 't-counter-es', displayName: 'Test mostrador', roles: ['counter'], locale: 'es', active: true, passwordHash: await bcrypt.hash(TEST_PASSWORD, TEST_HASH_COST) }))
  }
  const [bill]: { id: number }[] = await h.ds.query(
    `SELECT b.id FROM boms b JOIN jobs j ON j.id = b.job_id WHERE j.name = 'Whitlock primary bath, curved shower' ORDER BY b.revision DESC LIMIT 1`,
  )
  bomId = bill.id
})
afterAll(async () => {
  await h?.close()
  await smtp?.close()
})

/** Whole cents of a decimal text, by string arithmetic (no float): '760.75' → 76075. */
const cents = (text: string) => {
  const [whole, frac = ''] = text.split('.')
  return Number(whole) * 100 + Number((frac + '00').slice(0, 2))
}

describe('counter sales on a phone-width screen', () => {
  it('quotes the curved shower bill, e-mails it, takes it and records a cheque deposit', { timeout: 120_000 }, async () => {
    // With reduced motion the theme ends every transition at once, so axe reads a notice's colours as they
    // settle, not half-way through its fade (which read as 3.2:1 on a slow run).
    const context: BrowserContext = await h.browser.newContext({ baseURL: h.baseUrl, locale: 'es-US', viewport: { width: 412, height: 915 }, reducedMotion: 'reduce' })
    const page: Page = await context.newPage()
    page.setDefaultTimeout(15_000)
    try {
      await h.signInByApi(page, 't-counter-es', TEST_PASSWORD)
      await page.goto(`/counter/boms/${bomId}`)
      await page.locator('[data-test="quote-bill"]').click()
      await page.waitForURL(/\/counter\/quotes\/new\?bomId=/)
      await page.locator('[data-test="quote-warehouse"]').click()
      await page.locator('.el-select-dropdown__item:visible').first().click()
      await page.locator('[data-test="quote-terms"]').fill('Anticipo del 50 % sobre el plato hecho a medida.')
      await page.locator('[data-test="quote-create"]').click()
      await page.waitForURL(/\/counter\/quotes\/\d+$/)
      const quoteId = Number(/quotes\/(\d+)/.exec(page.url())![1])

      // Every line says where its price comes from, in Spanish; the caution on heavy goods and wet areas shows.
      const sources = page.locator('[data-test="price-source"]')
      await expect.poll(() => sources.count(), { timeout: 15_000 }).toBeGreaterThan(2)
      for (const s of await sources.allTextContents()) expect(s.trim()).toMatch(/precio de lista|nivel|desde|cambiado/)
      await expect.poll(() => page.locator('[data-test="quote-caution"]').textContent(), { timeout: 15_000 }).toMatch(/código de edificación local/)
      expect(await page.locator('[data-test="quote-status"]').textContent()).toMatch(/Borrador/)
      expect((await sidewaysScroll(page)).by).toBe(0)
      const quoteFindings = blocking(await axeFindings(page, 'quote'))
      expect(quoteFindings, describeFindings(quoteFindings)).toEqual([])
      await h.screenshot(page, 'counter-quote-phone')

      // E-mailed to the contractor through the mail fake, with the quote as PDF.
      const before = smtp.messages.length
      await page.locator('[data-test="quote-email"]').click()
      await expect.poll(() => page.locator('[data-test="mail-to"]').inputValue(), { timeout: 15_000 }).toBe('dana@copperline.example')
      await page.locator('[data-test="mail-send"]').click()
      await expect.poll(() => page.locator('[data-test="quote-status"]').getAttribute('data-status'), { timeout: 15_000 }).toBe('offered')
      expect(smtp.messages.length).toBe(before + 1)
      const mail = await simpleParser(smtp.messages[smtp.messages.length - 1].raw)
      expect(mail.to && 'text' in mail.to ? mail.to.text : '').toContain('dana@copperline.example')
      expect(mail.attachments.map((a) => a.contentType)).toEqual(['application/pdf'])

      // Taken: a confirmation first, then the order page.
      await page.locator('[data-test="quote-take"]').click()
      await page.locator('.el-message-box__btns .el-button--primary').click()
      await page.waitForURL(/\/counter\/sales-orders\/\d+$/)
      const orderId = Number(/sales-orders\/(\d+)/.exec(page.url())![1])
      // The deposit: 50 % of the made-to-order base's amount, rounded half up to the cent (common practice),
      // worked here from the quote's own line in whole cents.
      const [base]: { extension: string }[] = await h.ds.query('SELECT extension FROM quote_lines WHERE quote_id = ? AND made_to_order = 1', [quoteId])
      const dueCents = Math.floor((cents(String(base.extension)) * 50 + 50) / 100)
      const due = `${Math.floor(dueCents / 100)}.${String(dueCents % 100).padStart(2, '0')}`
      await expect.poll(() => page.locator('[data-test="order-deposit"]').getAttribute('data-due'), { timeout: 15_000 }).toBe(due)
      expect(await page.locator('[data-test="order-status"]').textContent()).toMatch(/Registrado/)
      const orderFindings = blocking(await axeFindings(page, 'sales order'))
      expect(orderFindings, describeFindings(orderFindings)).toEqual([])

      // A cheque without its number is refused beside the field, in Spanish; with it, the deposit is paid.
      await page.locator('[data-test="payment-record"]').click()
      await expect.poll(() => page.locator('[data-test="payment-form"]').textContent(), { timeout: 15_000 }).toMatch(/número del cheque/)
      await page.locator('[data-test="payment-reference"]').fill('004211')
      expect(await page.locator('[data-test="payment-amount"]').inputValue()).toBe(due)
      await page.locator('[data-test="payment-record"]').click()
      await expect.poll(() => page.locator('[data-test="order-deposit"]').getAttribute('data-due'), { timeout: 15_000 }).toBe('0.00')
      await expect.poll(() => page.locator('[data-test="order-payments"] li').count(), { timeout: 15_000 }).toBe(1)
      const [row]: { deposit_paid: string }[] = await h.ds.query('SELECT deposit_paid FROM sales_orders WHERE id = ?', [orderId])
      expect(row.deposit_paid).toBe(due)
      const [cheque]: { method: string; reference: string }[] = await h.ds.query('SELECT method, reference FROM payments WHERE sales_order_id = ?', [orderId])
      expect(cheque).toEqual({ method: 'cheque', reference: '004211' })
      expect((await sidewaysScroll(page)).by).toBe(0)
      await h.screenshot(page, 'counter-sales-order-phone')
    } catch (err) {
      await h.screenshot(page, 'counter-sales-failed')
      throw err
    } finally {
      await context.close()
    }
  })
})
