// E-mailing a PO through a real SMTP conversation with the local mail fake: the message is parsed
// with mailparser and its attachment opened with exceljs; every attempt lands in the outbox; a
// failed send leaves the PO unsent with the error shown, and sending again works.
import ExcelJS from 'exceljs'
import { simpleParser } from 'mailparser'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PoDetail } from '../../shared/schemas/purchasingViews.js'
import { startSmtpFake, type SmtpFake } from '../../server/fakes/smtpFake.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { download } from '../support/downloads.js'
import { count, createPurchasingFixture, TEST_COMPANY, vendor, vendorItem, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: ApiHarness
let f: PurchasingFixture
let smtp: SmtpFake
let smtpPort: number
const EVIL = '=HYPERLINK("http://attacker.example","Pay here")'

beforeAll(async () => {
  smtp = await startSmtpFake({ port: 0 })
  smtpPort = smtp.port
  h = await startApiHarness({ LUMENYARD_SMTP_PORT: String(smtpPort), LUMENYARD_SMTP_HOST: '127.0.0.1', LUMENYARD_SMTP_SECURE: 'false' })
  f = await createPurchasingFixture(h.ds)
})
afterAll(async () => {
  await h?.close()
  await smtp?.close()
})

async function approvedPo(vendorId = f.vendorA, itemId = f.sealant.id): Promise<PoDetail> {
  const buyer = await h.as('buyer')
  const res = await buyer.post('/api/purchase-orders').set(CSRF).send({ vendorId, warehouseId: f.warehouse.id, lines: [{ itemId, packsOrdered: 2 }] })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return (await buyer.post(`/api/purchase-orders/${res.body.id}/approve`).set(CSRF).send({ version: res.body.version })).body
}

describe('e-mail to the vendor', () => {
  it('sends the order with its sheet attached; the mail fake receives it and the PO becomes sent', async () => {
    const evilVendor = await vendor(h.ds, `MX${f.tag}`, { name: EVIL, email: `buyer-desk-${f.tag.toLowerCase()}@vendor.example` })
    await vendorItem(h.ds, evilVendor, f.sealant.id, { sku: '@EVL-S', pack: 10, min: 10, cost: '5.5000' })
    const po = await approvedPo(evilVendor)
    const before = smtp.messages.length
    const res = await (await h.as('buyer')).post(`/api/purchase-orders/${po.id}/send`).set(CSRF).send({ cc: ['yard-office@lumenyard.example'], message: 'Please deliver before noon.' })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.po.status).toBe('sent')
    expect(smtp.messages.length).toBe(before + 1)
    const captured = smtp.messages[smtp.messages.length - 1]
    expect(captured.to.sort()).toEqual([`buyer-desk-${f.tag.toLowerCase()}@vendor.example`, 'yard-office@lumenyard.example'].sort())

    const mail = await simpleParser(captured.raw)
    expect(mail.subject).toBe(`Purchase order ${po.number} from ${TEST_COMPANY.legalName}`)
    expect(mail.text).toContain('Please deliver before noon.')
    expect(mail.text).toContain(`Order: ${po.number}`)
    // The printable order and the sheet, side by side.
    expect(mail.attachments.map((a) => a.filename)).toEqual([`${po.number}.pdf`, `${po.number}.xlsx`])
    expect(mail.attachments[0].contentType).toBe('application/pdf')
    const att = mail.attachments[1]
    expect(att.filename).toBe(`${po.number}.xlsx`)
    expect(att.contentType).toBe('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet')
    const book = new ExcelJS.Workbook()
    await book.xlsx.load(att.content as unknown as ArrayBuffer)
    const sheet = book.worksheets[0]
    expect(sheet.name).toBe(po.number)
    expect(sheet.getCell('A1').value).toBe(`Purchase order ${po.number}`)
    // source: OWASP "CSV Injection": a leading = never becomes a formula: it is a string cell, as typed
    expect(sheet.getCell('D4').value).toBe(EVIL)
    expect(sheet.getCell('D4').type).toBe(ExcelJS.ValueType.String)
    expect(sheet.getCell('C13').value).toBe('@EVL-S')
    expect(sheet.getCell('G13').value).toBe(20)
    expect(sheet.getCell('J13').value).toBe(110) // 20 × 5.50

    const outbox = await (await h.as('admin')).get('/api/purchasing/outbox')
    const entry = outbox.body.find((m: { poId: number }) => m.poId === po.id)
    expect(entry).toMatchObject({ status: 'sent', toAddress: `buyer-desk-${f.tag.toLowerCase()}@vendor.example`, cc: 'yard-office@lumenyard.example', error: null })
    const kept = entry.attachments.find((a: { name: string }) => a.name === `${po.number}.xlsx`)
    expect(kept.bytes).toBe(att.content.length)
    const stored = await download(await h.as('admin'), `/api/purchasing/outbox/${entry.id}/attachments/${kept.id}`)
    expect(Buffer.compare(stored.body as Buffer, att.content)).toBe(0)
    expect((await (await h.as('buyer')).get('/api/purchasing/outbox')).status).toBe(403)
  })

  it('leaves the PO unsent with the error shown when the mail server is down, and sending again works', async () => {
    const po = await approvedPo()
    await smtp.close()
    const buyer = await h.as('buyer')
    const failed = await buyer.post(`/api/purchase-orders/${po.id}/send`).set(CSRF).send({})
    expect(failed.status).toBe(502)
    expect(failed.body.error.code).toBe('mail_failed')
    const after = (await buyer.get(`/api/purchase-orders/${po.id}`)).body as PoDetail
    expect(after.status).toBe('approved')
    expect(after.sendError).toBeTruthy()
    expect(after.messages[0]).toMatchObject({ status: 'failed' })
    expect(after.messages[0].error).toBe(after.sendError)

    smtp = await startSmtpFake({ port: smtpPort })
    const again = await buyer.post(`/api/purchase-orders/${po.id}/send`).set(CSRF).send({})
    expect(again.status, JSON.stringify(again.body)).toBe(200)
    expect(again.body.po).toMatchObject({ status: 'sent', sendError: null })
    expect(again.body.po.messages.map((m: { status: string }) => m.status)).toEqual(['sent', 'failed'])
    expect(smtp.messages).toHaveLength(1)
    // a corrected copy can go again once sent; the status stays sent
    const resend = await buyer.post(`/api/purchase-orders/${po.id}/send`).set(CSRF).send({ to: 'second-desk@vendor.example' })
    expect(resend.body.po.status).toBe('sent')
    expect(smtp.messages[1].to).toEqual(['second-desk@vendor.example'])
  })

  it("sends a failed message again from the outbox, exactly as it was, once", async () => {
    const po = await approvedPo()
    const admin = await h.as('admin')
    await smtp.close()
    expect((await admin.post(`/api/purchase-orders/${po.id}/send`).set(CSRF).send({ cc: ['yard-office@lumenyard.example'] })).status).toBe(502)
    const failed = (await admin.get('/api/purchasing/outbox')).body.find((m: { poId: number }) => m.poId === po.id)
    expect(failed).toMatchObject({ status: 'failed', sentAgainAs: null })
    // still down: the retry fails too and is recorded; the failed message may still be sent again
    expect((await admin.post(`/api/purchasing/outbox/${failed.id}/send-again`).set(CSRF)).status).toBe(502)
    const stillDown = (await admin.get('/api/purchasing/outbox')).body.filter((m: { poId: number }) => m.poId === po.id)
    expect(stillDown.map((m: { status: string; retryOf: number | null }) => [m.status, m.retryOf])).toEqual([['failed', failed.id], ['failed', null]])

    smtp = await startSmtpFake({ port: smtpPort })
    const before = smtp.messages.length
    const retryOfRetry = stillDown[0].id
    const sent = await admin.post(`/api/purchasing/outbox/${retryOfRetry}/send-again`).set(CSRF)
    expect(sent.status, JSON.stringify(sent.body)).toBe(200)
    expect(sent.body.po.status).toBe('sent')
    expect(smtp.messages.length).toBe(before + 1)
    const mail = await simpleParser(smtp.messages[smtp.messages.length - 1].raw)
    expect(mail.subject).toBe(`Purchase order ${po.number} from ${TEST_COMPANY.legalName}`)
    expect(mail.cc).toBeTruthy()
    expect(mail.attachments.map((a) => a.filename)).toContain(`${po.number}.xlsx`)
    // a second click: refused, nothing sent twice; a message that went out is not "sent again"
    const twice = await admin.post(`/api/purchasing/outbox/${retryOfRetry}/send-again`).set(CSRF)
    expect(twice.status).toBe(409)
    expect(twice.body.error.code).toBe('already_sent_again')
    const newest = (await admin.get('/api/purchasing/outbox')).body.find((m: { poId: number }) => m.poId === po.id)
    expect((await admin.post(`/api/purchasing/outbox/${newest.id}/send-again`).set(CSRF)).body.error.code).toBe('message_was_sent')
    expect(smtp.messages.length).toBe(before + 1)
  })

  it('validates addresses and refuses drafts, sending nothing', async () => {
    const buyer = await h.as('buyer')
    const po = await approvedPo()
    const outboxBefore = await count(h.ds, 'outbox_messages')
    const mailsBefore = smtp.messages.length
    const bad = await buyer.post(`/api/purchase-orders/${po.id}/send`).set(CSRF).send({ to: 'not-an-address', cc: ['also bad'] })
    expect(bad.status).toBe(400)
    expect(bad.body.error.fields).toHaveProperty('to')
    expect(bad.body.error.fields).toHaveProperty(['cc.0'])
    const noMail = await vendor(h.ds, `NM${f.tag}`, { email: null })
    await vendorItem(h.ds, noMail, f.sealant.id, { sku: 'NM-S', pack: 1, min: 1, cost: '1.0000' })
    const orphan = await approvedPo(noMail)
    const noAddress = await buyer.post(`/api/purchase-orders/${orphan.id}/send`).set(CSRF).send({})
    expect(noAddress.status).toBe(400)
    expect(noAddress.body.error.fields).toHaveProperty('to')
    const draft = await buyer.post('/api/purchase-orders').set(CSRF).send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.sealant.id, packsOrdered: 1 }] })
    expect((await buyer.post(`/api/purchase-orders/${draft.body.id}/send`).set(CSRF).send({})).status).toBe(409)
    expect((await (await h.as('warehouse')).post(`/api/purchase-orders/${po.id}/send`).set(CSRF).send({})).status).toBe(403)
    expect(await count(h.ds, 'outbox_messages')).toBe(outboxBefore)
    expect(smtp.messages.length).toBe(mailsBefore)
  })
})
