// Card payments through the provider's official SDK (`stripe`) against the local fake of its HTTP API, and
// the app's webhook: the provider's signature is checked with the SDK, a bad one is refused with nothing
// recorded, and an event received twice is recorded once (keyed by the provider's event id).
import { createHmac, randomBytes } from 'node:crypto'
import Stripe from 'stripe'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ConfigError, loadConfig, LOCAL_PAY_SECRET_KEY, LOCAL_PAY_WEBHOOK_SECRET } from '../../server/config.js'
import { AppError } from '../../server/errors.js'
import { FAKE_CARD_TOKENS, type PayFake } from '../../server/fakes/payFake.js'
import { PAYMENT_WEBHOOK_PATH } from '../../server/routes/payments.js'
import { createPayProvider } from '../../server/services/payments/payProvider.js'
import type { ApiHarness } from '../support/apiHarness.js'
import { startPayHarness, type PayHarness } from '../support/payFakeHarness.js'

let h: ApiHarness
let fake: PayFake
let pay: PayHarness
const tag = randomBytes(4).toString('hex')
// Used only for its documented test helper (generateTestHeaderString); it never sends a request.
const sdk = new Stripe('sk_test_unused')

beforeAll(async () => {
  pay = await startPayHarness()
  ;({ h, fake } = pay)
})
afterAll(async () => {
  await pay?.close()
})

async function eventRows(eventId: string): Promise<{ type: string; amount: string | null; currency: string | null; deliveries: number; object_id: string | null }[]> {
  return h.ds.query('SELECT type, amount, currency, deliveries, object_id FROM payment_events WHERE provider_event_id = ?', [eventId])
}

function eventBody(id: string, amountMinor = 5000) {
  return JSON.stringify({
    id,
    object: 'event',
    type: 'payment_intent.succeeded',
    created: Math.floor(Date.now() / 1000),
    livemode: false,
    data: { object: { id: `pi_${id}`, object: 'payment_intent', amount: amountMinor, amount_received: amountMinor, currency: 'usd', status: 'succeeded' } },
  })
}

function postEvent(body: string, signature: string | null) {
  const req = h.agent().post(PAYMENT_WEBHOOK_PATH).set('Content-Type', 'application/json')
  if (signature !== null) req.set('Stripe-Signature', signature)
  return req.send(body)
}

describe('the provider SDK against the local fake', () => {
  it('creates a payment intent in cents; the same idempotency key twice makes one intent', async () => {
    const pay = createPayProvider(h.config.pay)
    const before = fake.intents.size
    const key = `deposit-${tag}-1`
    const first = await pay.createIntent({ amountMinor: 12345, description: 'Deposit, order SO-TEST', metadata: { salesOrderId: '1' }, idempotencyKey: key })
    const again = await pay.createIntent({ amountMinor: 12345, description: 'Deposit, order SO-TEST', metadata: { salesOrderId: '1' }, idempotencyKey: key })
    expect(again.id).toBe(first.id)
    expect(fake.intents.size).toBe(before + 1)
    expect(first.status).toBe('requires_payment_method')
    // The SDK sends form-encoded parameters (the provider's API reference: application/x-www-form-urlencoded).
    const sent = fake.requests.filter((r) => r.path === '/v1/payment_intents' && r.idempotencyKey === key)
    expect(sent).toHaveLength(2)
    expect(sent[0].body).toMatchObject({ amount: '12345', currency: 'usd', metadata: { salesOrderId: '1' } })
  })

  it('confirms with the approved test card and the fake delivers the signed event, recorded once', async () => {
    const pay = createPayProvider(h.config.pay)
    const intent = await pay.createIntent({ amountMinor: 12345, description: 'Deposit', metadata: {}, idempotencyKey: `deposit-${tag}-2` })
    const done = await pay.confirmIntent(intent.id, FAKE_CARD_TOKENS.approved, `confirm-${tag}-2`)
    expect(done.status).toBe('succeeded')
    await fake.settled()
    const event = fake.events.find((e) => e.type === 'payment_intent.succeeded' && e.data.object.id === intent.id)
    expect(event).toBeDefined()
    expect(fake.deliveries.filter((d) => d.eventId === event!.id).map((d) => d.status)).toEqual([200])
    const rows = await eventRows(event!.id)
    // 12345 cents = 123.45 dollars (source: ISO 4217, USD has 2 minor digits)
    expect(rows).toEqual([{ type: 'payment_intent.succeeded', amount: '123.45', currency: 'usd', deliveries: 1, object_id: intent.id }])

    // The provider retries an event: the second delivery is acknowledged and changes nothing.
    expect(await fake.redeliver(event!.id)).toBe(200)
    expect((await eventRows(event!.id)).map((r) => r.deliveries)).toEqual([2])
  })

  it('a declined card answers card_declined and the intent stays unpaid', async () => {
    const pay = createPayProvider(h.config.pay)
    const intent = await pay.createIntent({ amountMinor: 5000, description: 'Deposit', metadata: {}, idempotencyKey: `deposit-${tag}-3` })
    const err = await pay.confirmIntent(intent.id, FAKE_CARD_TOKENS.declined, `confirm-${tag}-3`).catch((e: unknown) => e)
    expect(err).toBeInstanceOf(AppError)
    expect((err as AppError).code).toBe('card_declined')
    expect((err as AppError).status).toBe(422)
    expect(fake.intents.get(intent.id)!.status).toBe('requires_payment_method')
  })

  it('refunds part of a payment; more than is left is refused', async () => {
    const pay = createPayProvider(h.config.pay)
    const intent = await pay.createIntent({ amountMinor: 10000, description: 'Deposit', metadata: {}, idempotencyKey: `deposit-${tag}-4` })
    await pay.confirmIntent(intent.id, FAKE_CARD_TOKENS.approved, `confirm-${tag}-4`)
    const refund = await pay.refund({ intentId: intent.id, amountMinor: 2500, idempotencyKey: `refund-${tag}-4`, metadata: {} })
    expect(refund.amount).toBe(2500)
    expect(refund.status).toBe('succeeded')
    const over = await pay.refund({ intentId: intent.id, amountMinor: 7501, idempotencyKey: `refund-${tag}-5`, metadata: {} }).catch((e: unknown) => e)
    expect((over as AppError).code).toBe('payment_provider_failed')
    expect(fake.refunds.filter((r) => r.payment_intent === intent.id).map((r) => r.amount)).toEqual([2500])
  })

  it('a wrong secret key is refused by the provider and reported as its failure', async () => {
    const pay = createPayProvider({ ...h.config.pay, secretKey: 'sk_test_not_the_key' })
    const err = await pay.createIntent({ amountMinor: 100, description: 'x', metadata: {}, idempotencyKey: `deposit-${tag}-6` }).catch((e: unknown) => e)
    expect((err as AppError).code).toBe('payment_provider_failed')
    expect((err as AppError).status).toBe(502)
  })
})

describe('the webhook', () => {
  it("signs as the provider documents: HMAC-SHA256 of 't.payload', header t=…,v1=…", () => {
    // source: the provider's webhook guide, "Verify signatures manually": signed_payload = timestamp + "." + body,
    // HMAC with SHA-256 under the endpoint's signing secret, hex; header "t=<timestamp>,v1=<signature>"
    const body = eventBody(`evt_scheme_${tag}`)
    const timestamp = 1_700_000_000
    const expected = createHmac('sha256', LOCAL_PAY_WEBHOOK_SECRET).update(`${timestamp}.${body}`).digest('hex')
    expect(sdk.webhooks.generateTestHeaderString({ payload: body, secret: LOCAL_PAY_WEBHOOK_SECRET, timestamp })).toBe(`t=${timestamp},v1=${expected}`)
  })

  it('records a signed event once, however often it arrives (no session, no app header needed)', async () => {
    const id = `evt_once_${tag}`
    const body = eventBody(id, 4321)
    const signature = sdk.webhooks.generateTestHeaderString({ payload: body, secret: h.config.pay.webhookSecret })
    const first = await postEvent(body, signature)
    expect(first.status, JSON.stringify(first.body)).toBe(200)
    expect(first.body).toEqual({ received: true, duplicate: false })
    const replay = await postEvent(body, signature)
    expect(replay.status).toBe(200)
    expect(replay.body).toEqual({ received: true, duplicate: true })
    const rows = await eventRows(id)
    expect(rows).toHaveLength(1)
    expect(rows[0]).toMatchObject({ amount: '43.21', deliveries: 2 }) // 4321 cents (ISO 4217: USD 2 minor digits)
  })

  it('refuses a signature made with another secret, and records nothing', async () => {
    const id = `evt_badsecret_${tag}`
    const body = eventBody(id)
    const res = await postEvent(body, sdk.webhooks.generateTestHeaderString({ payload: body, secret: 'whsec_someone_else' }))
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('payment_signature_invalid')
    expect(await eventRows(id)).toEqual([])
  })

  it('refuses a body changed after signing, a missing signature and a stale timestamp', async () => {
    const id = `evt_tampered_${tag}`
    const signed = eventBody(id, 100)
    const signature = sdk.webhooks.generateTestHeaderString({ payload: signed, secret: h.config.pay.webhookSecret })
    const tampered = await postEvent(signed.replace('"amount":100', '"amount":999999'), signature)
    expect(tampered.status).toBe(400)
    expect(tampered.body.error.code).toBe('payment_signature_invalid')

    const unsigned = await postEvent(signed, null)
    expect(unsigned.status).toBe(400)
    expect(unsigned.body.error.code).toBe('payment_signature_invalid')

    // The SDK's default tolerance is 300 seconds (source: the provider's webhook guide, "preventing replay
    // attacks": five minutes by default); a signature ten minutes old is refused even with the right secret.
    const stale = sdk.webhooks.generateTestHeaderString({ payload: signed, secret: h.config.pay.webhookSecret, timestamp: Math.floor(Date.now() / 1000) - 600 })
    const old = await postEvent(signed, stale)
    expect(old.status).toBe(400)
    expect(await eventRows(id)).toEqual([])
  })
})

describe('configuration', () => {
  const required = { LUMENYARD_DB_PASSWORD: 'x', LUMENYARD_SESSION_SECRET: 'y'.repeat(32) }

  it('outside production, the SDK points at the local fake on LUMENYARD_PAY_PORT', () => {
    const config = loadConfig({ ...required, NODE_ENV: 'development', LUMENYARD_PAY_PORT: '4343' })
    expect(config.pay.api).toEqual({ host: '127.0.0.1', port: 4343, protocol: 'http' })
    expect(config.pay.localFake).toBe(true)
  })

  it('production takes no cards without the provider keys, and refuses one key alone or the fake\'s', async () => {
    const off = loadConfig({ ...required, NODE_ENV: 'production' })
    expect(off.pay.enabled).toBe(false)
    expect(off.pay.localFake).toBe(false)
    // a supplier that takes no cards still starts; the card routes say so with a code the screens word
    const provider = createPayProvider(off.pay)
    await expect((async () => provider.createIntent({ amountMinor: 100, description: 'x', metadata: {}, idempotencyKey: 'k' }))())
      .rejects.toMatchObject({ status: 409, code: 'card_payments_off' })
    expect(() => provider.verifyEvent('{}', 't=1,v1=x')).toThrow(expect.objectContaining({ code: 'card_payments_off' }))
    expect(() => loadConfig({ ...required, NODE_ENV: 'production', LUMENYARD_PAY_SECRET_KEY: 'sk_live_from_env' })).toThrow(ConfigError)
    expect(() => loadConfig({ ...required, NODE_ENV: 'production', LUMENYARD_PAY_SECRET_KEY: 'sk_live_from_env' })).toThrow(/LUMENYARD_PAY_WEBHOOK_SECRET/)
    expect(() => loadConfig({ ...required, NODE_ENV: 'production', LUMENYARD_PAY_WEBHOOK_SECRET: 'whsec_from_env' })).toThrow(/LUMENYARD_PAY_SECRET_KEY/)
    expect(() => loadConfig({ ...required, NODE_ENV: 'production', LUMENYARD_PAY_SECRET_KEY: LOCAL_PAY_SECRET_KEY, LUMENYARD_PAY_WEBHOOK_SECRET: 'whsec_real_one' }))
      .toThrow(/local fake/)
    const live = loadConfig({ ...required, NODE_ENV: 'production', LUMENYARD_PAY_SECRET_KEY: 'sk_live_from_env', LUMENYARD_PAY_WEBHOOK_SECRET: 'whsec_from_env' })
    expect(live.pay.enabled).toBe(true)
    expect(live.pay.api).toBeUndefined() // the provider's own API
    expect(live.pay.localFake).toBe(false)
  })
})
