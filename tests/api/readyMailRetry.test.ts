// The "order ready" e-mail when the mail server refuses it (server/services/sales/orderReadyMail.ts, POST
// /api/sales-orders/:id/ready-mail) against the real MariaDB and the SMTP mail fake: the failed attempt is
// recorded and shown on the order, a clerk's "send again" while the server is still down fails again (502,
// recorded), and once the server answers the e-mail goes exactly once, however many times it is pressed,
// even twice at once.
import { simpleParser } from 'mailparser'
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startSmtpFake, type SmtpFake } from '../../server/fakes/smtpFake.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows } from '../support/fixtureRows.js'
import { receive } from '../support/pickFixtures.js'
import { pickWholeOrder } from '../support/returnFixtures.js'
import { bookedOrder, createSalesFixture, type SalesFixture } from '../support/salesFixtures.js'

let smtp: SmtpFake | null
let smtpPort: number
let h: ApiHarness
let counter: supertest.Agent
let fx: SalesFixture
let orderId: number
let email: string

const fulfilment = async () => (await counter.get(`/api/sales-orders/${orderId}/fulfilment`)).body
const outbox = (status: 'sent' | 'failed') => countRows(h.ds, 'outbox_messages', 'sales_order_id = ? AND status = ?', [orderId, status])
const again = (agent = counter) => agent.post(`/api/sales-orders/${orderId}/ready-mail`).set(CSRF)

beforeAll(async () => {
  smtp = await startSmtpFake({ port: 0 })
  smtpPort = smtp.port
  h = await startApiHarness({ LUMENYARD_SMTP_PORT: String(smtpPort), LUMENYARD_SMTP_HOST: '127.0.0.1', LUMENYARD_SMTP_SECURE: 'false' })
  counter = await h.as('counter')
  fx = await createSalesFixture(h.ds)
  email = `ready-${fx.tag.toLowerCase()}@contractor.example`
  await h.ds.query('UPDATE customers SET email = ? WHERE id = ?', [email, fx.customerId])
  const crew = await h.as('warehouse')
  await receive(crew, fx.warehouseId, [
    { itemId: fx.block.id, binId: fx.bins['C-01-1'], qty: 120 },
    { itemId: fx.spacers.id, binId: fx.bins['C-01-1'], qty: 300 },
  ])
  orderId = await bookedOrder(h.ds, counter, fx, `M${fx.tag}`)
  // The mail server is down when the pick completes.
  await smtp.close()
  smtp = null
  await pickWholeOrder(counter, crew, orderId)
})
afterAll(async () => {
  await h?.close()
  await smtp?.close()
})

describe('a ready e-mail the mail server refused', () => {
  it('is recorded as failed and shown on the ready order, not marked as mailed', async () => {
    const f = await fulfilment()
    expect(f.status).toBe('ready')
    expect(f.readyMailedAt).toBeNull()
    expect(f.readyMailError).toEqual(expect.any(String))
    expect(f.readyMailError.length).toBeGreaterThan(0)
    expect(await outbox('failed')).toBe(1)
    expect(await outbox('sent')).toBe(0)
    expect(await countRows(h.ds, 'audit_entries', "entity = 'sales_order' AND entity_id = ? AND action = 'sales_order.ready_mail_failed'", [String(orderId)])).toBe(1)
  })

  it('send again while the server is still down: 502 ready_mail_failed, recorded, still not mailed', async () => {
    const res = await again()
    expect(res.status, JSON.stringify(res.body)).toBe(502)
    expect(res.body.error.code).toBe('ready_mail_failed')
    expect(await outbox('failed')).toBe(2)
    expect((await fulfilment()).readyMailedAt).toBeNull()
  })

  it('others may not press it: the warehouse and viewers are refused and nothing is tried', async () => {
    for (const role of ['warehouse', 'viewer', 'buyer'] as const) expect((await again(await h.as(role))).status).toBe(403)
    expect(await outbox('failed')).toBe(2)
  })

  it('once the server answers, pressed twice at once and once more: one e-mail, to the contractor', async () => {
    smtp = await startSmtpFake({ port: smtpPort })
    const [a, b] = await Promise.all([again(), again()])
    expect([a.status, b.status], JSON.stringify([a.body, b.body])).toEqual([200, 200])
    expect([a.body.sent, b.body.sent].sort()).toEqual([false, true])
    const later = await again()
    expect(later.body).toMatchObject({ sent: false, mailedAt: expect.any(String) })
    expect(smtp.messages).toHaveLength(1)
    const mail = await simpleParser(smtp.messages[0].raw)
    expect(mail.to && 'text' in mail.to ? mail.to.text : '').toContain(email)
    expect(await outbox('sent')).toBe(1)
    const f = await fulfilment()
    expect(f.readyMailedAt).toEqual(expect.any(String))
    expect(f.readyMailError).toBeNull()
  })

  it('an order that is not ready is refused (409) and nothing is sent', async () => {
    await counter.post(`/api/sales-orders/${orderId}/cancel`).set(CSRF).send({ reason: 'Job moved to spring' })
    const res = await again()
    expect(res.status).toBe(409)
    expect(res.body.error).toMatchObject({ code: 'sales_order_wrong_status', params: { orderStatus: 'cancelled' } })
    expect(smtp?.messages).toHaveLength(1)
  })
})
