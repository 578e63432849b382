// Following a card deposit from the counter, against the real MariaDB and the local fake of the payment
// provider's API (its official SDK): a part of the deposit may be taken (never more than is due), the counter
// reads where the payment stands (waiting, declined, cancelled by the customer, paid) with the provider's page
// to show the customer, and a payment the customer cancels on that page is closed once by the provider's
// signed event, so another can be started. Other roles are refused (tests/api/roleMatrix.ts).
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PayFake } from '../../server/fakes/payFake.js'
import { cardDepositStateShape } from '../../shared/schemas/answers/salesOrders.js'
import { CSRF, type ApiHarness } from '../support/apiHarness.js'
import { startCardOrder, type CardOrderHarness } from '../support/payFakeHarness.js'

let h: ApiHarness
let fake: PayFake
let pay: CardOrderHarness
let counter: supertest.Agent
let orderId: number

const start = (body: object = {}) => counter.post(`/api/sales-orders/${orderId}/card-deposits`).set(CSRF).send(body)
const state = (paymentId: number) => counter.get(`/api/sales-orders/${orderId}/card-deposits/${paymentId}`)
/** What the customer does on the provider's page: a form post with the button they pressed. */
async function onCustomerPage(intentId: string, card: string): Promise<void> {
  const res = await fetch(`${fake.url}/pay/${intentId}`, { method: 'POST', body: new URLSearchParams({ card }), redirect: 'manual' })
  expect(res.status).toBe(303)
  await fake.settled()
}
async function cardRows(): Promise<{ id: number; amount: string; status: string }[]> {
  return h.ds.query("SELECT id, amount, status FROM payments WHERE sales_order_id = ? AND method = 'card' ORDER BY id", [orderId])
}
const depositPaid = async () => ((await h.ds.query('SELECT deposit_paid FROM sales_orders WHERE id = ?', [orderId])) as { deposit_paid: string }[])[0].deposit_paid

beforeAll(async () => {
  // startCardOrder: the account's level: 15 % off list, so the base sells at 895.00 × 0.85 = 760.75; the deposit is 50 % of it,
  // 380.375 → 380.38 rounded half up to the cent (hand-worked; the admin's default percent).
  pay = await startCardOrder('F')
  ;({ h, fake, counter, orderId } = pay)
})
afterAll(async () => {
  await pay?.close()
})

describe('following a card deposit', () => {
  it('refuses more than the deposit due, beside the amount, and charges nothing', async () => {
    for (const amount of ['380.39', '1000000000', '0', '-5', '1,5', '7 3/4']) {
      const res = await start({ amount })
      expect(res.status, `${amount}: ${JSON.stringify(res.body)}`).toBeGreaterThanOrEqual(400)
      expect(res.body.error.fields?.amount?.code, amount).toBeTruthy()
    }
    const over = await start({ amount: '380.39' })
    expect(over.status).toBe(409)
    expect(over.body.error).toMatchObject({ code: 'payment_over_balance', params: { due: '380.38' } })
    expect(await cardRows()).toEqual([])
    expect(fake.requests.filter((r) => r.path === '/v1/payment_intents')).toHaveLength(0)
  })

  it('takes part of the deposit and shows the provider\'s page while the customer pays', async () => {
    const res = await start({ amount: '100.00' })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const intent = fake.intents.get(res.body.intentId)!
    expect(intent.amount).toBe(10000) // 100.00 USD in cents (source: ISO 4217, USD has 2 minor digits)
    expect(res.body.payPageUrl).toBe(`${fake.url}/pay/${intent.id}`)
    const read = await state(res.body.paymentId)
    expect(read.status).toBe(200)
    expect(cardDepositStateShape.parse(read.body)).toMatchObject({ stage: 'waiting', amount: '100.00', payPageUrl: `${fake.url}/pay/${intent.id}`, depositDue: '380.38' })
    // The page the customer sees asks for that amount and offers to cancel.
    const page = await (await fetch(`${fake.url}/pay/${intent.id}`)).text()
    expect(page).toContain('Pay 100.00 USD')
    expect(page).toContain('Cancel this payment')
  })

  it('a declined card reads declined; the customer cancelling closes the payment once', async () => {
    const [row] = await cardRows()
    const intentId = ((await state(row.id)).body as { intentId: string }).intentId
    await onCustomerPage(intentId, 'pm_card_chargeDeclined')
    expect((await state(row.id)).body.stage).toBe('declined')
    expect(await cardRows()).toEqual([{ id: row.id, amount: '100.00', status: 'pending' }])

    await onCustomerPage(intentId, 'cancel')
    expect(fake.intents.get(intentId)!.status).toBe('canceled')
    const read = await state(row.id)
    expect(read.body).toMatchObject({ stage: 'cancelled', payPageUrl: null })
    expect(await cardRows()).toEqual([{ id: row.id, amount: '100.00', status: 'failed' }])
    const event = fake.events.find((e) => e.type === 'payment_intent.canceled' && e.data.object.id === intentId)!
    expect(await fake.redeliver(event.id)).toBe(200)
    const audited: { n: number }[] = await h.ds.query("SELECT COUNT(*) AS n FROM audit_entries WHERE action = 'payment.card_cancel' AND entity_id = ?", [String(orderId)])
    expect(Number(audited[0].n)).toBe(1)
    expect(await depositPaid()).toBe('0.00')
  })

  it('the clerk cancels a payment still waiting: the provider cancels it first, the row closes once', async () => {
    const res = await start({ amount: '50.00' })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const cancel = () => counter.post(`/api/sales-orders/${orderId}/card-deposits/${res.body.paymentId}/cancel`).set(CSRF).send({})
    const done = await cancel()
    expect(done.status, JSON.stringify(done.body)).toBe(200)
    expect(done.body).toMatchObject({ stage: 'cancelled', amount: '50.00', payPageUrl: null })
    expect(fake.intents.get(res.body.intentId)!.status).toBe('canceled')
    await fake.settled()
    // The provider's own cancel event arrives after: acknowledged, nothing closed twice.
    const again = await cancel()
    expect(again.status).toBe(409)
    expect(again.body.error.code).toBe('payment_not_pending')
    expect((await cardRows()).map((r) => [r.amount, r.status])).toEqual([['100.00', 'failed'], ['50.00', 'failed']])
    const audited: { n: number }[] = await h.ds.query("SELECT COUNT(*) AS n FROM audit_entries WHERE action = 'payment.card_cancel' AND entity_id = ?", [String(orderId)])
    expect(Number(audited[0].n)).toBe(2)
    // The customer's page no longer takes the card.
    expect(await (await fetch(`${fake.url}/pay/${res.body.intentId}`)).text()).toContain('Payment cancelled')
  })

  it('another payment for the whole deposit is paid on the page and reads paid once the event lands', async () => {
    const res = await start({})
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.amount).toBe('380.38')
    await onCustomerPage(res.body.intentId, 'pm_card_visa')
    const read = await state(res.body.paymentId)
    expect(read.body).toMatchObject({ stage: 'paid', amount: '380.38', depositPaid: '380.38', depositDue: '0.00', payPageUrl: null })
    expect((await cardRows()).map((r) => r.status)).toEqual(['failed', 'failed', 'settled'])
    expect(await depositPaid()).toBe('380.38')
  })

  it('answers not found for a payment of another order or a bad id', async () => {
    const [row] = await cardRows()
    expect((await counter.get(`/api/sales-orders/${orderId + 100000}/card-deposits/${row.id}`)).status).toBe(404)
    const bad = await counter.get(`/api/sales-orders/${orderId}/card-deposits/abc`)
    expect(bad.status).toBe(404)
    expect(bad.body.error.code).toBe('payment_not_found')
  })
})
