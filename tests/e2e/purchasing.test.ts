// The buyer's and the warehouse's purchasing flow in a real browser: an accepted suggestion becomes
// a PO, is approved, exported, e-mailed (caught by the local mail fake and listed in the admin
// outbox), then received at the dock with typed GS1 scans, and its lot labels come up.
import { readFile } from 'node:fs/promises'
import ExcelJS from 'exceljs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { normalizeGtin } from '../../shared/barcode/checkDigit.js'
import { startSmtpFake, type SmtpFake } from '../../server/fakes/smtpFake.js'
import { startE2e, type E2eHarness } from '../support/browser.js'
import { createPurchasingFixture, suggestion, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: E2eHarness
let smtp: SmtpFake
let f: PurchasingFixture
const smtpPortBefore = process.env.LUMENYARD_SMTP_PORT
const SSCC = '106141411234567897' // source: GS1 logistics label example (from memory); check digit verified in gs1CheckDigit.test.ts

beforeAll(async () => {
  smtp = await startSmtpFake({ port: 0 })
  process.env.LUMENYARD_SMTP_PORT = String(smtp.port)
  h = await startE2e()
  f = await createPurchasingFixture(h.ds)
  // The reorder screen's "accept" writes rows like this one.
  await suggestion(h.ds, { itemId: f.block.id, warehouseId: f.warehouse.id, vendorId: f.vendorA, qty: 60 })
})
afterAll(async () => {
  await h?.close()
  await smtp?.close()
  // The files after this one run in the same process (vitest.config.ts: isolate false).
  if (smtpPortBefore === undefined) delete process.env.LUMENYARD_SMTP_PORT
  else process.env.LUMENYARD_SMTP_PORT = smtpPortBefore
})

describe('purchasing in the browser', () => {
  it('suggestion → PO → export → e-mail → outbox → receiving with scans', async () => {
    const { page, context } = await h.newPage()
    try {
      await h.signInByApi(page, 'buyer')
      await page.goto('/purchasing/ready-to-order')
      const row = page.locator('[data-test="suggestions-table"] tr', { hasText: f.block.sku })
      await row.locator('.el-checkbox').click()
      await page.locator('[data-test="create-orders"]').click()
      await page.waitForURL(/\/purchasing\/orders\/\d+$/)
      const number = ((await page.locator('[data-test="po-number"]').textContent()) ?? '').replace('Purchase order ', '').trim()
      expect(number).toMatch(/^PO-\d{4}-\d{5}$/)
      // 60 wanted, minimum 48, packs of 24 → 3 packs = 72 (hand computed)
      await expect.poll(() => page.locator('[data-test="po-lines"]').textContent()).toContain('72')
      await page.locator('[data-test="approve"]').click()
      await expect.poll(() => page.locator('[data-test="po-status"]').getAttribute('data-status')).toBe('approved')

      const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-test="export-po"]').click()])
      expect(download.suggestedFilename()).toBe(`${number}.xlsx`)
      const book = new ExcelJS.Workbook()
      await book.xlsx.load((await readFile((await download.path())!)) as unknown as ArrayBuffer)
      expect(book.worksheets[0].getCell('A1').value).toBe(`Purchase order ${number}`)
      expect(book.worksheets[0].getCell('G13').value).toBe(72) // the line table starts on row 13, under who orders

      await page.locator('[data-test="send"]').click()
      await page.locator('[data-test="send-mail"]').click()
      // The SMTP exchange and the attachments can take a few seconds on a busy machine.
      await expect.poll(() => page.locator('[data-test="po-status"]').getAttribute('data-status'), { timeout: 15_000 }).toBe('sent')
      expect(smtp.messages.some((m) => m.raw.toString('latin1').includes(`Subject: Purchase order ${number} from`))).toBe(true)
      await page.waitForTimeout(400) // tags zoom in when they appear
      await h.screenshot(page, 'purchasing-po-sent')
    } finally {
      await context.close()
    }

    const admin = await h.newPage()
    try {
      await h.signInByApi(admin.page, 'admin')
      await admin.page.goto('/admin/outbox')
      const entry = admin.page.locator('[data-test="outbox"] tr', { hasText: 'Purchase order' }).first()
      await expect.poll(() => entry.textContent()).toContain('.xlsx')
      expect(await entry.textContent()).toContain('.pdf') // the printable order beside the sheet
      await admin.page.waitForTimeout(400)
      await h.screenshot(admin.page, 'purchasing-outbox')

      // A message the mail server refused: "Send again" sends it (before, the button only reloaded the list).
      const [sent] = await h.ds.query("SELECT id FROM outbox_messages WHERE status = 'sent' ORDER BY id DESC LIMIT 1")
      const copied = await h.ds.query(
        `INSERT INTO outbox_messages (status, from_address, to_address, cc, reply_to, subject, body_text, error, po_id, created_by)
         SELECT 'failed', from_address, to_address, cc, reply_to, subject, body_text, 'The mail server did not answer (test).', po_id, created_by
         FROM outbox_messages WHERE id = ?`, [sent.id])
      const failedId = Number(copied.insertId)
      const before = smtp.messages.length
      await admin.page.locator('[data-test="outbox-refresh"]').click()
      const failed = admin.page.locator('[data-test="outbox"] tr', { hasText: 'did not answer (test)' }).first()
      await failed.locator('[data-test="outbox-send-again"]').click()
      // the new attempt is recorded after the mail server took the message: wait for both
      await expect.poll(() => smtp.messages.length, { timeout: 15_000 }).toBe(before + 1)
      await expect.poll(async () => (await h.ds.query('SELECT status FROM outbox_messages WHERE retry_of = ?', [failedId]))[0]?.status, { timeout: 15_000 }).toBe('sent')
      const [again] = await h.ds.query('SELECT id FROM outbox_messages WHERE retry_of = ?', [failedId])
      await expect.poll(() => failed.textContent()).toContain(`Sent again (message ${again.id})`)
      expect(await failed.locator('[data-test="outbox-send-again"]').count()).toBe(0)
    } finally {
      await admin.context.close()
    }

    const wh = await h.newPage({ viewport: { width: 1100, height: 1000 } })
    try {
      await h.signInByApi(wh.page, 'warehouse')
      await wh.page.goto('/warehouse/receiving')
      await wh.page.locator('[data-test="receiving-list"] a', { hasText: `Vendor VA${f.tag}` }).first().click()
      await wh.page.waitForURL(/\/warehouse\/receiving\/\d+$/)
      const scan = wh.page.locator('[data-test="scan-input"]')
      await scan.fill('B:A-01-1')
      await scan.press('Enter')
      await expect.poll(() => wh.page.locator('[data-test="scan-feedback"]').textContent()).toContain('A-01-1')
      // A pallet label typed from its human-readable line: SSCC, content GTIN, count and lot
      // (GS1 Barcode Syntax Dictionary: (37) goes with (02) on a logistic unit)
      const gtin14 = (normalizeGtin(f.block.gtin!) as { gtin14: string }).gtin14
      await scan.fill(`(00)${SSCC}(02)${gtin14}(37)48(10)R7001`)
      await scan.press('Enter')
      await scan.fill(`(01)${gtin14}(10)R7002`)
      await scan.press('Enter')
      await expect.poll(() => wh.page.locator('[data-test="receipt-row"]').count()).toBe(2)
      // the rest of lot R7002 typed into the row: 1 scanned + 23 = 24
      const qty = wh.page.locator('[data-test="receipt-row"]').nth(1).locator('.ly-number input').first()
      await qty.fill('24')
      await qty.press('Tab')
      await wh.page.locator('[data-test="post-receipt"]').click()
      // Posting the receipt and reading the order back can take seconds on a busy machine.
      await expect.poll(() => wh.page.locator('[data-test="receive-status"]').getAttribute('data-status'), { timeout: 15_000 }).toBe('closed')
      await expect.poll(() => wh.page.locator('[data-test="lot-labels"]').count()).toBe(1)
      await wh.page.waitForTimeout(400)
      await h.screenshot(wh.page, 'purchasing-received')
    } finally {
      await wh.context.close()
    }
    const [line] = await h.ds.query('SELECT qty_received FROM purchase_order_lines WHERE item_id = ? ORDER BY id DESC LIMIT 1', [f.block.id])
    expect(line.qty_received).toBe(72)
    const lots = await h.ds.query('SELECT l.code, SUM(b.on_hand) AS q FROM stock_balances b JOIN lots l ON l.id = b.lot_id WHERE b.item_id = ? GROUP BY l.code ORDER BY l.code', [f.block.id])
    expect(lots).toEqual([{ code: 'R7001', q: '48' }, { code: 'R7002', q: '24' }])
  })
})
