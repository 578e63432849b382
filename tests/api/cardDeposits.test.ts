// A card deposit on a sales order, end to end against the real MariaDB and the local fake of the payment
// provider's API, through its official SDK: one payment intent however often "take card deposit" is pressed,
// no card number accepted by our API, a declined card changes nothing, the provider's signed event settles the
// payment once (deposit_paid in the same write), a forged event is refused, and cancelling refunds the card.
import Stripe from 'stripe'
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { FAKE_CARD_TOKENS, type PayFake } from '../../server/fakes/payFake.js'
import { PAYMENT_WEBHOOK_PATH } from '../../server/routes/payments.js'
import { CSRF, type ApiHarness } from '../support/apiHarness.js'
import { startCardOrder, type CardOrderHarness } from '../support/payFakeHarness.js'
import type { SalesFixture } from '../support/salesFixtures.js'

let h: ApiHarness
let fake: PayFake
let pay: CardOrderHarness
let counter: supertest.Agent
let fx: SalesFixture
let orderId: number
let paymentId: number

async function orderMoney(): Promise<{ deposit_required: string; deposit_paid: string; status: string }> {
  const [row] = await h.ds.query('SELECT deposit_required, deposit_paid, status FROM sales_orders WHERE id = ?', [orderId])
  return row
}
async function cardRows(): Promise<{ id: number; amount: string; status: string; reference: string; provider_event_id: string | null; refunded_amount: string }[]> {
  return h.ds.query("SELECT id, amount, status, reference, provider_event_id, refunded_amount FROM payments WHERE sales_order_id = ? AND method = 'card' ORDER BY id", [orderId])
}
const intentsOfOrder = () => [...fake.intents.values()].filter((i) => i.metadata.salesOrderId === String(orderId))

beforeAll(async () => {
  // startCardOrder: the account's level: 15 % off list, so the base sells at 895.00 × 0.85 = 760.75 (hand-worked).
  pay = await startCardOrder('C')
  ;({ h, fake, counter, fx, orderId } = pay)
})
afterAll(async () => {
  await pay?.close()
})

describe('taking a card deposit', () => {
  it('pressed twice at once makes one payment intent for the deposit due, in cents', async () => {
    // 50 % of 760.75 = 380.375 → 380.38, rounded half-up to the cent (hand-worked; the admin's default percent)
    expect((await orderMoney()).deposit_required).toBe('380.38')
    const [a, b] = await Promise.all([
      counter.post(`/api/sales-orders/${orderId}/card-deposits`).set(CSRF),
      counter.post(`/api/sales-orders/${orderId}/card-deposits`).set(CSRF),
    ])
    expect([a.status, b.status], JSON.stringify([a.body, b.body])).toEqual([201, 201])
    expect(a.body.paymentId).toBe(b.body.paymentId)
    paymentId = a.body.paymentId
    expect(intentsOfOrder()).toHaveLength(1)
    expect(intentsOfOrder()[0].amount).toBe(38038) // 380.38 USD in cents (source: ISO 4217, USD has 2 minor digits)
    expect(a.body).toMatchObject({ amount: '380.38', status: 'pending', intentId: intentsOfOrder()[0].id })
    expect(await cardRows()).toHaveLength(1)
    expect((await orderMoney()).deposit_paid).toBe('0.00') // pending counts for nothing
  })

  it('refuses a card number or any card field: only the provider\'s token is taken', async () => {
    const number = await counter.post(`/api/sales-orders/${orderId}/card-deposits/${paymentId}/confirm`).set(CSRF).send({ cardToken: '4242424242424242' })
    expect(number.status).toBe(400)
    expect(number.body.error.fields.cardToken.code).toBe('card_token_format')
    const extra = await counter.post(`/api/sales-orders/${orderId}/card-deposits/${paymentId}/confirm`).set(CSRF).send({ cardToken: FAKE_CARD_TOKENS.approved, cardNumber: '4242424242424242', cvc: '123' })
    expect(extra.status).toBe(400)
    expect(intentsOfOrder()[0].status).toBe('requires_payment_method')
    expect(fake.requests.some((r) => JSON.stringify(r.body).includes('4242424242424242'))).toBe(false)
  })

  it('a declined card answers card_declined and records nothing', async () => {
    const res = await counter.post(`/api/sales-orders/${orderId}/card-deposits/${paymentId}/confirm`).set(CSRF).send({ cardToken: FAKE_CARD_TOKENS.declined })
    expect(res.status).toBe(422)
    expect(res.body.error.code).toBe('card_declined')
    await fake.settled()
    expect((await cardRows()).map((r) => r.status)).toEqual(['pending'])
    expect((await orderMoney()).deposit_paid).toBe('0.00')
  })

  it('the approved card is settled by the provider\'s signed event, once, with deposit_paid', async () => {
    const res = await counter.post(`/api/sales-orders/${orderId}/card-deposits/${paymentId}/confirm`).set(CSRF).send({ cardToken: FAKE_CARD_TOKENS.approved })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.providerStatus).toBe('succeeded')
    await fake.settled()
    const event = fake.events.find((e) => e.type === 'payment_intent.succeeded' && e.data.object.id === intentsOfOrder()[0].id)!
    const rows = await cardRows()
    expect(rows).toMatchObject([{ id: paymentId, amount: '380.38', status: 'settled', provider_event_id: event.id }])
    expect((await orderMoney()).deposit_paid).toBe('380.38')

    // The provider sends the same event again: acknowledged, nothing recorded twice.
    expect(await fake.redeliver(event.id)).toBe(200)
    expect(await cardRows()).toHaveLength(1)
    expect((await orderMoney()).deposit_paid).toBe('380.38')
    const [audited] = await h.ds.query("SELECT COUNT(*) AS n FROM audit_entries WHERE action = 'payment.record' AND entity = 'sales_order' AND entity_id = ?", [String(orderId)])
    expect(Number(audited.n)).toBe(1)
  })

  it('a forged event (not signed with our secret) settles nothing', async () => {
    const body = JSON.stringify({
      id: `evt_forged_${fx.tag}`, object: 'event', type: 'payment_intent.succeeded', created: Math.floor(Date.now() / 1000),
      data: { object: { id: 'pi_forged', object: 'payment_intent', amount: 99900, amount_received: 99900, currency: 'usd', status: 'succeeded', metadata: { salesOrderId: String(orderId) } } },
    })
    const forged = new Stripe('sk_test_unused').webhooks.generateTestHeaderString({ payload: body, secret: 'whsec_guessed' })
    const res = await h.agent().post(PAYMENT_WEBHOOK_PATH).set('Content-Type', 'application/json').set('Stripe-Signature', forged).send(body)
    expect(res.status).toBe(400)
    expect(await cardRows()).toHaveLength(1)
    expect((await orderMoney()).deposit_paid).toBe('380.38')
  })

  it('a paid deposit cannot be started again', async () => {
    const res = await counter.post(`/api/sales-orders/${orderId}/card-deposits`).set(CSRF)
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('deposit_already_paid')
    expect(intentsOfOrder()).toHaveLength(1)
  })

  it('cancelling the order refunds the card through the provider and records it', async () => {
    const res = await counter.post(`/api/sales-orders/${orderId}/cancel`).set(CSRF).send({ reason: 'Contractor changed the design' })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.refunded).toBe('380.38')
    const intent = intentsOfOrder()[0]
    expect(fake.refunds.filter((r) => r.payment_intent === intent.id).map((r) => r.amount)).toEqual([38038])
    expect(await cardRows()).toMatchObject([{ status: 'refunded', refunded_amount: '380.38' }])
    expect(await orderMoney()).toMatchObject({ deposit_paid: '0.00', status: 'cancelled' })
  })
})
