// A card the customer confirms on the provider's side after the clerk cancelled its order: the provider's
// signed event arrives for an order that takes no money, so Lumenyard refunds all of it through the SDK at
// once and records the payment as refunded, once, however often the event (or another event for the same
// payment) is delivered. Real MariaDB, the local fake of the provider's API.
import Stripe from 'stripe'
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { LOCAL_PAY_SECRET_KEY, LOCAL_PAY_WEBHOOK_SECRET } from '../../server/config.js'
import { FAKE_CARD_TOKENS, signPayload, type PayFake } from '../../server/fakes/payFake.js'
import { PAYMENT_WEBHOOK_PATH } from '../../server/routes/payments.js'
import { CSRF, type ApiHarness } from '../support/apiHarness.js'
import { countRows } from '../support/fixtureRows.js'
import { startPayHarness, type PayHarness } from '../support/payFakeHarness.js'
import { bookedOrder, createSalesFixture } from '../support/salesFixtures.js'

let pay: PayHarness
let h: ApiHarness
let fake: PayFake
let counter: supertest.Agent
let orderId: number
let intentId: string

const refundsOf = (id: string) => fake.refunds.filter((r) => r.payment_intent === id).map((r) => r.amount)
const lateRefundAudits = () => countRows(h.ds, 'audit_entries', "action = 'payment.refund' AND entity = 'sales_order' AND entity_id = ?", [String(orderId)])

beforeAll(async () => {
  pay = await startPayHarness()
  ;({ h, fake } = pay)
  counter = await h.as('counter')
  const fx = await createSalesFixture(h.ds)
  orderId = await bookedOrder(h.ds, counter, fx, `L${fx.tag}`)
})
afterAll(async () => {
  await pay?.close()
})

describe('a card paid after its order was cancelled', () => {
  it('is refunded in full through the provider and recorded as refunded', async () => {
    const started = await counter.post(`/api/sales-orders/${orderId}/card-deposits`).set(CSRF)
    expect(started.status, JSON.stringify(started.body)).toBe(201)
    intentId = started.body.intentId
    const cancel = await counter.post(`/api/sales-orders/${orderId}/cancel`).set(CSRF).send({ reason: 'Contractor went elsewhere' })
    expect(cancel.status, JSON.stringify(cancel.body)).toBe(200)
    expect(cancel.body.refunded).toBe('0.00') // nothing was paid yet

    // The customer finishes paying on the provider's side, as on its hosted page (the provider's own API).
    const customerSide = new Stripe(LOCAL_PAY_SECRET_KEY, { host: '127.0.0.1', port: fake.port, protocol: 'http' })
    const paid = await customerSide.paymentIntents.confirm(intentId, { payment_method: FAKE_CARD_TOKENS.approved })
    expect(paid.status).toBe('succeeded')
    await fake.settled()

    // 50 % of 760.75 = 380.375 → 380.38 half-up (hand-worked); 38038 cents (source: ISO 4217, USD has 2 minor digits)
    expect(refundsOf(intentId)).toEqual([38038])
    const rows = await h.ds.query("SELECT status, amount, refunded_amount FROM payments WHERE sales_order_id = ? AND method = 'card'", [orderId])
    expect(rows).toEqual([{ status: 'refunded', amount: '380.38', refunded_amount: '380.38' }])
    const [order] = await h.ds.query('SELECT status, deposit_paid FROM sales_orders WHERE id = ?', [orderId])
    expect(order).toEqual({ status: 'cancelled', deposit_paid: '0.00' })
    const [event] = await h.ds.query("SELECT outcome FROM payment_events WHERE object_id = ? AND type = 'payment_intent.succeeded'", [intentId])
    expect(event.outcome).toBe('refunded_late')
    expect(await lateRefundAudits()).toBe(1)
  })

  it('a replayed event refunds nothing more', async () => {
    const event = fake.events.find((e) => e.type === 'payment_intent.succeeded' && e.data.object.id === intentId)!
    expect(await fake.redeliver(event.id)).toBe(200)
    expect(await fake.redeliver(event.id)).toBe(200)
    expect(refundsOf(intentId)).toEqual([38038])
    expect(await lateRefundAudits()).toBe(1)
  })

  it('another event for the same payment (a new event id) refunds nothing more', async () => {
    const original = fake.events.find((e) => e.type === 'payment_intent.succeeded' && e.data.object.id === intentId)!
    const body = JSON.stringify({ ...original, id: `${original.id}_again` })
    // The provider's documented signature scheme, signed with our webhook secret (source: the provider's webhook docs)
    const res = await h.agent().post(PAYMENT_WEBHOOK_PATH).set('Content-Type', 'application/json').set('Stripe-Signature', signPayload(body, LOCAL_PAY_WEBHOOK_SECRET)).send(body)
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.duplicate).toBe(false)
    expect(refundsOf(intentId)).toEqual([38038])
    expect(await countRows(h.ds, 'payments', 'sales_order_id = ?', [orderId])).toBe(1)
    expect(await lateRefundAudits()).toBe(1)
  })
})
