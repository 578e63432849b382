// Feature: a counter sale from end to end in a real browser, every step through the screens. The clerk builds
// a quote from the demo's curved shower bill (a curved glass block wall with a made-to-order shower base), e-mails
// it (the SMTP fake gets it with the PDF), books it as a sales order, and takes the card deposit on the base
// through the payment provider's page (the local fake, paid in a second browser as the customer would); the
// warehouse picks the order on the handheld at phone width; the clerk makes the pickup ticket and the contractor
// signs it on the pad. Every unit and cent is checked against the tables: the ticket's lines are the order's,
// the stock left once, the deposit is the admin's percent of the made-to-order line. Screenshots of each step.
import { simpleParser } from 'mailparser'
import type { Page } from 'playwright-core'
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { LOCAL_PAY_SECRET_KEY, LOCAL_PAY_WEBHOOK_SECRET } from '../../server/config.js'
import { startPayFake, type PayFake } from '../../server/fakes/payFake.js'
import { startSmtpFake, type SmtpFake } from '../../server/fakes/smtpFake.js'
import { PAYMENT_WEBHOOK_PATH } from '../../server/routes/payments.js'
import { tagOf } from '../support/fixtureRows.js'
import { DEMO_PASSWORD, startE2e, type E2eHarness } from '../support/browser.js'
import { drawSignature, scan } from '../support/handSteps.js'
import { countRows, ledgerMismatches, receive, signedInAgent } from '../support/pickFixtures.js'
import { companyProfileFixture } from '../support/purchasingFixtures.js'
import { createWarehouse } from '../support/stockFixtures.js'

interface BillLine { itemId: number; sku: string; qty: number; madeToOrder: number }

let h: E2eHarness
let smtp: SmtpFake
let fake: PayFake
let crew: supertest.Agent
let bomId: number
let lines: BillLine[]
let warehouse: { id: number; code: string; bins: Record<string, number> }
/** Where each stocked line's item sits in the test's own yard: bin code → the item's SKU and the bill's quantity. */
const shelf = new Map<string, { sku: string; qty: number; itemId: number }>()
/** Stock received beyond what the bill needs, so a second issue of the same goods would show. */
const SPARE = 10

const poll = <T>(read: () => T | Promise<T>) => expect.poll(read, { timeout: 15_000 })

beforeAll(async () => {
  smtp = await startSmtpFake({ port: 0 })
  fake = await startPayFake({ port: 0, secretKey: LOCAL_PAY_SECRET_KEY, webhookSecret: LOCAL_PAY_WEBHOOK_SECRET, retryMs: 20 })
  h = await startE2e({ LUMENYARD_SMTP_PORT: String(smtp.port), LUMENYARD_SMTP_HOST: '127.0.0.1', LUMENYARD_SMTP_SECURE: 'false', LUMENYARD_PAY_PORT: String(fake.port) })
  fake.webhookUrl = `${h.baseUrl}${PAYMENT_WEBHOOK_PATH}`
  await companyProfileFixture(h.ds)
  const [bill]: { id: number }[] = await h.ds.query(
    `SELECT b.id FROM boms b JOIN jobs j ON j.id = b.job_id WHERE j.name = 'Whitlock primary bath, curved shower' ORDER BY b.revision DESC LIMIT 1`,
  )
  bomId = bill.id
  lines = (await h.ds.query('SELECT item_id AS itemId, sku, qty, made_to_order AS madeToOrder FROM bom_lines WHERE bom_id = ? ORDER BY line_no', [bomId]) as BillLine[])
    .map((l) => ({ ...l, qty: Number(l.qty), madeToOrder: Number(l.madeToOrder) }))
  // A yard of the test's own, one bin per stocked line, so the run never competes with other tests' holds.
  const stocked = lines.filter((l) => !l.madeToOrder)
  const code = `J${tagOf()}`.slice(0, 10)
  const made = await createWarehouse(h.ds, code, stocked.map((_, i) => `J-01-${i + 1}`))
  warehouse = { ...made, code }
  stocked.forEach((l, i) => shelf.set(`J-01-${i + 1}`, { sku: l.sku, qty: l.qty, itemId: l.itemId }))
  crew = await signedInAgent(h.built.app, 'warehouse', DEMO_PASSWORD)
  await receive(crew, warehouse.id, stocked.map((l, i) => ({ itemId: l.itemId, binId: warehouse.bins[`J-01-${i + 1}`], qty: l.qty + SPARE })))
})
afterAll(async () => {
  await h?.close()
  await fake?.close()
  await smtp?.close()
})

describe('a counter sale from the curved shower bill to a signed pickup ticket', () => {
  // A whole sale in one browser (six screens, two roles, the payment fake): minutes on a busy 2-core machine.
  it('quote, e-mail, booking, card deposit, handheld pick and signed ticket, every unit and cent accounted for', { timeout: 240_000 }, async () => {
    const { page, context } = await h.newPage()
    let shotPage: Page = page
    try {
      // 1. The quote from the bill, in the test's yard.
      await h.signInByApi(page, 'counter')
      await page.goto(`/counter/boms/${bomId}`)
      await page.locator('[data-test="quote-bill"]').click()
      await page.waitForURL(/\/counter\/quotes\/new\?bomId=/)
      await page.locator('[data-test="quote-warehouse"]').click()
      await page.locator('.el-select-dropdown__item:visible', { hasText: warehouse.code }).click()
      await page.locator('[data-test="quote-create"]').click()
      await page.waitForURL(/\/counter\/quotes\/\d+$/)
      const quoteId = Number(/quotes\/(\d+)/.exec(page.url())![1])
      await poll(() => page.locator('[data-test="quote-status"]').getAttribute('data-status')).toBe('draft')
      await h.screenshot(page, 'journey-1-quote')
      const quoteLines: { item_id: number; qty: number; extension: string; made_to_order: number }[] =
        await h.ds.query('SELECT item_id, qty, extension, made_to_order FROM quote_lines WHERE quote_id = ? ORDER BY line_no', [quoteId])
      expect(quoteLines.map((l) => [l.item_id, Number(l.qty)])).toEqual(lines.map((l) => [l.itemId, l.qty]))
      // The base: SB-3636-CRV lists at 455.00 in the demo catalog; Copperline is on the demo's contractor level,
      // 10 % off list: 455.00 × 0.90 = 409.50 for the one unit (hand-worked).
      expect(quoteLines.filter((l) => Number(l.made_to_order)).map((l) => String(l.extension))).toEqual(['409.50'])

      // 2. E-mailed to the contractor through the mail fake, with the quote as a PDF.
      const mailsBefore = smtp.messages.length
      await page.locator('[data-test="quote-email"]').click()
      await poll(() => page.locator('[data-test="mail-to"]').inputValue()).toBe('dana@copperline.example')
      await page.locator('[data-test="mail-send"]').click()
      await poll(() => page.locator('[data-test="quote-status"]').getAttribute('data-status')).toBe('offered')
      expect(smtp.messages.length).toBe(mailsBefore + 1)
      const mail = await simpleParser(smtp.messages[smtp.messages.length - 1].raw)
      expect(mail.to && 'text' in mail.to ? mail.to.text : '').toContain('dana@copperline.example')
      expect(mail.attachments.map((a) => a.contentType)).toEqual(['application/pdf'])
      expect(mail.attachments[0].content.subarray(0, 5).toString('latin1')).toBe('%PDF-') // source: ISO 32000-1 §7.5.2, the file header
      await h.screenshot(page, 'journey-2-quote-offered')

      // 3. Accepted: the sales order, its deposit on the made-to-order base.
      await page.locator('[data-test="quote-take"]').click()
      await page.locator('.el-message-box__btns .el-button--primary').click()
      await page.waitForURL(/\/counter\/sales-orders\/\d+$/)
      const orderId = Number(/sales-orders\/(\d+)/.exec(page.url())![1])
      // Deposit: 50 % (the admin's setting, default) of the made-to-order lines: 409.50 × 0.50 = 204.75 (hand-worked).
      const [{ percent }]: { percent: string }[] = await h.ds.query('SELECT deposit_percent AS percent FROM sales_orders WHERE id = ?', [orderId])
      expect(String(percent)).toMatch(/^50(\.0+)?$/)
      await poll(() => page.locator('[data-test="order-deposit"]').getAttribute('data-due')).toBe('204.75')
      await h.screenshot(page, 'journey-3-order')

      // 4. The card deposit: the customer pays on the provider's page in a browser of their own.
      expect(await page.locator('[data-test="card-amount"]').inputValue()).toBe('204.75')
      await page.locator('[data-test="card-start"]').click()
      const href = await page.locator('[data-test="card-page-link"]').getAttribute('href')
      const phone = await h.browser.newContext({ viewport: { width: 390, height: 844 } })
      try {
        const customer = await phone.newPage()
        shotPage = customer
        await customer.goto(href!)
        expect(await customer.locator('h1').textContent()).toBe('Pay 204.75 USD')
        await customer.getByRole('button', { name: /approved/ }).click()
        await customer.getByRole('status').waitFor()
        await h.screenshot(customer, 'journey-4-customer-paid')
      } finally {
        shotPage = page
        await phone.close()
      }
      await poll(() => page.locator('[data-test="card-deposit"]').getAttribute('data-stage')).toBe('paid')
      await poll(() => page.locator('[data-test="order-deposit"]').getAttribute('data-due')).toBe('0.00')
      const [money]: { deposit_required: string; deposit_paid: string }[] = await h.ds.query('SELECT deposit_required, deposit_paid FROM sales_orders WHERE id = ?', [orderId])
      expect(money).toEqual({ deposit_required: '204.75', deposit_paid: '204.75' })
      expect(await countRows(h.ds, 'payments', "sales_order_id = ? AND method = 'card' AND status = 'settled' AND amount = '204.75'", [orderId])).toBe(1)
      await h.screenshot(page, 'journey-5-deposit-paid')

      // 5. Sent to the warehouse.
      await page.locator('[data-test="order-send-pick"]').click()
      await page.locator('[data-test="order-pick-lists"]').waitFor()
      const [list]: { id: number }[] = await h.ds.query('SELECT id FROM pick_lists WHERE sales_order_id = ?', [orderId])

      // 6. The warehouse picks it on the handheld at phone width: bin, item, quantity for each line it is walked to.
      const hand = await h.newPage({ viewport: { width: 412, height: 915 } })
      shotPage = hand.page
      try {
        await h.signInByApi(hand.page, 'warehouse')
        await hand.page.goto(`/warehouse/pick/${list.id}`)
        for (let n = 0; n < shelf.size; n++) {
          const binText = (await hand.page.locator('[data-test="line-bin"]').textContent())!.trim()
          const goods = shelf.get(binText)
          expect(goods, `walked to ${binText}`).toBeDefined()
          await scan(hand.page, `B:${binText}`)
          await poll(() => hand.page.locator('[data-test="step"]').getAttribute('data-step')).toBe('item')
          await scan(hand.page, goods!.sku)
          await poll(() => hand.page.locator('[data-test="step"]').getAttribute('data-step')).toBe('qty')
          await scan(hand.page, String(goods!.qty))
          if (n < shelf.size - 1) await poll(() => hand.page.locator('[data-test="line-bin"]').textContent()).not.toBe(binText)
        }
        await hand.page.locator('[data-test="all-done"]').waitFor()
        await h.screenshot(hand.page, 'journey-6-handheld-picked')
        await hand.page.locator('[data-test="complete"]').click()
        await poll(async () => (await h.ds.query('SELECT status FROM sales_orders WHERE id = ?', [orderId]))[0].status).toBe('ready')
      } finally {
        shotPage = page
        await hand.context.close()
      }

      // 7. The pickup ticket, signed on the pad; the stock leaves once.
      await page.reload()
      await page.locator('[data-test="order-ready"]').waitFor()
      await page.locator('[data-test="ticket-new-pickup"]').click()
      await page.locator('[data-test="ticket-dialog"]').waitFor()
      await page.locator('[data-test="ticket-make"]').click()
      await page.waitForURL(/\/counter\/tickets\/\d+$/)
      const ticketId = Number(/tickets\/(\d+)/.exec(page.url())![1])
      await page.locator('[data-test="ticket-signer"]').fill('Dana Whitlock')
      await drawSignature(page)
      await poll(() => page.locator('[data-test="ticket-sign"]').isDisabled()).toBe(false)
      await page.locator('[data-test="ticket-sign"]').dblclick()
      await poll(() => page.locator('[data-test="ticket-status"]').getAttribute('data-status')).toBe('signed')
      await page.locator('[data-test="ticket-signature"]').waitFor()
      await h.screenshot(page, 'journey-7-ticket-signed')

      // The ticket's lines are the order's stocked lines, unit for unit; the base waits for its special order.
      const orderLines: { id: number; item_id: number; qty: number; made_to_order: number }[] =
        await h.ds.query('SELECT id, item_id, qty, made_to_order FROM sales_order_lines WHERE sales_order_id = ? ORDER BY line_no', [orderId])
      const ticketLines: { sales_order_line_id: number; qty: number }[] =
        await h.ds.query('SELECT sales_order_line_id, SUM(qty) AS qty FROM handover_ticket_lines WHERE ticket_id = ? GROUP BY sales_order_line_id ORDER BY sales_order_line_id', [ticketId])
      const expected = orderLines.filter((l) => !Number(l.made_to_order)).map((l) => ({ sales_order_line_id: l.id, qty: Number(l.qty) }))
      expect(ticketLines.map((l) => ({ sales_order_line_id: l.sales_order_line_id, qty: Number(l.qty) }))).toEqual(expected)
      expect(orderLines.map((l) => [l.item_id, Number(l.qty)])).toEqual(lines.map((l) => [l.itemId, l.qty]))
      // Each item left the yard once: what was received less the bill's quantity remains, the ledger agrees.
      for (const [bin, goods] of shelf) {
        const [bal]: { on_hand: number; reserved: number }[] = await h.ds.query('SELECT on_hand, reserved FROM stock_balances WHERE bin_id = ? AND item_id = ?', [warehouse.bins[bin], goods.itemId])
        expect({ sku: goods.sku, onHand: Number(bal.on_hand), reserved: Number(bal.reserved) }).toEqual({ sku: goods.sku, onHand: SPARE, reserved: 0 })
      }
      expect(await countRows(h.ds, 'stock_moves', "doc_type = 'handover_ticket' AND doc_id = ?", [ticketId])).toBe(shelf.size)
      expect(await ledgerMismatches(h.ds, [...shelf.values()].map((g) => g.itemId))).toEqual([])
    } catch (err) {
      await h.screenshot(shotPage, 'journey-failed')
      throw err
    } finally {
      await context.close()
    }
  })
})
