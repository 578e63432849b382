// A local stand-in for the hosted card-payment provider's HTTP API, so card deposits can be taken with no
// account anywhere. The app talks to it through the provider's official Node SDK (`stripe`), pointed here by
// host, port and protocol; the fake answers just what Lumenyard uses, as the SDK sends it (form-encoded):
//   POST /v1/payment_intents               create (Idempotency-Key honoured: same key, same answer)
//   GET  /v1/payment_intents/:id           read
//   POST /v1/payment_intents/:id/confirm   confirm with a test card token (the card is entered on the
//                                          provider's side; Lumenyard only ever sees the token)
//   POST /v1/payment_intents/:id/cancel    cancel one not yet paid
//   POST /v1/refunds                       refund all or part of a succeeded payment
//   GET/POST /pay/:id                      the customer's side: a page to pay with one of the test cards, or
//                                          to cancel the payment
// and then delivers the provider's signed event to the app's webhook URL: header `Stripe-Signature:
// t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<body>" under the webhook secret>` (the provider's documented
// signature scheme), retried a few times when the app does not answer 2xx. State lives in memory.
import { createHmac, randomBytes } from 'node:crypto'
import type { Server } from 'node:http'
import express, { type Request, type Response } from 'express'

/** Test card tokens the fake understands (the provider's documented test payment methods). */
export const FAKE_CARD_TOKENS = {
  /** A card that is approved. */
  approved: 'pm_card_visa',
  /** A card the issuer declines. */
  declined: 'pm_card_chargeDeclined',
} as const

export type FakeIntentStatus = 'requires_payment_method' | 'processing' | 'succeeded' | 'canceled'

export interface FakePaymentIntent {
  id: string
  object: 'payment_intent'
  amount: number
  amount_received: number
  currency: string
  status: FakeIntentStatus
  client_secret: string
  description: string | null
  metadata: Record<string, string>
  payment_method: string | null
  payment_method_types: string[]
  latest_charge: string | null
  last_payment_error: { code: string; decline_code?: string; message: string; type: string } | null
  created: number
  livemode: false
}

export interface FakeRefund {
  id: string
  object: 'refund'
  amount: number
  currency: string
  payment_intent: string
  charge: string | null
  status: 'succeeded'
  reason: string | null
  metadata: Record<string, string>
  created: number
}

export interface FakeEvent {
  id: string
  object: 'event'
  type: string
  created: number
  api_version: string | null
  livemode: false
  data: { object: FakePaymentIntent | FakeRefund }
}

export interface FakeDelivery {
  eventId: string
  attempt: number
  status: number | null
  error?: string
  at: Date
}

export interface PayFake {
  port: number
  url: string
  intents: Map<string, FakePaymentIntent>
  refunds: FakeRefund[]
  events: FakeEvent[]
  deliveries: FakeDelivery[]
  /** Every request the fake received, as the SDK sent it (method, path, idempotency key, parsed form). */
  requests: { method: string; path: string; idempotencyKey: string | null; body: Record<string, unknown> }[]
  /** Where events are delivered (the app's webhook route); null keeps them undelivered. */
  webhookUrl: string | null
  /** Sends an event again, as the provider does when it retries (same id, a fresh signature). */
  redeliver(eventId: string): Promise<number | null>
  /** Resolves when every delivery under way has finished (its retries included). */
  settled(): Promise<void>
  close(): Promise<void>
}

export interface PayFakeOptions {
  port: number
  host?: string
  /** The only secret key it accepts (Authorization: Bearer …). */
  secretKey: string
  /** Signs the events it delivers. */
  webhookSecret: string
  webhookUrl?: string | null
  /** Delivery attempts per event (default 3) and the pause before a retry (default 200 ms, doubling). */
  attempts?: number
  retryMs?: number
}

const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`
const now = () => Math.floor(Date.now() / 1000)

/** The provider's signature header for `body` at `timestamp`: HMAC-SHA256 of "t.body", hex. */
export function signPayload(body: string, secret: string, timestamp = now()): string {
  const v1 = createHmac('sha256', secret).update(`${timestamp}.${body}`, 'utf8').digest('hex')
  return `t=${timestamp},v1=${v1}`
}

class ProviderError extends Error {
  constructor(
    readonly status: number,
    readonly type: string,
    message: string,
    readonly extra: Record<string, unknown> = {},
  ) {
    super(message)
  }
}

function stringRecord(value: unknown): Record<string, string> {
  if (!value || typeof value !== 'object') return {}
  return Object.fromEntries(Object.entries(value as Record<string, unknown>).map(([k, v]) => [k, String(v)]))
}

function positiveInteger(value: unknown, param: string): number {
  const text = typeof value === 'string' ? value : ''
  if (!/^[1-9]\d{0,10}$/.test(text)) {
    throw new ProviderError(400, 'invalid_request_error', `Invalid integer: ${param} must be a positive whole number of the currency's smallest unit.`, { param })
  }
  return Number(text)
}

const escapeHtml = (t: string) => t.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`)
const formatMinor = (minor: number, currency: string) => `${(minor / 100).toFixed(2)} ${currency.toUpperCase()}`
const customerPage = (title: string, body: string) =>
  `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${escapeHtml(title)}</title>
  <style>body{font-family:sans-serif;max-width:28rem;margin:2rem auto;padding:0 1rem}button{display:block;width:100%;min-height:3rem;margin:.75rem 0;font-size:1rem}</style></head>
  <body><p>Local test payment page (no real card is charged)</p><h1>${escapeHtml(title)}</h1>${body}</body></html>`

export async function startPayFake(opts: PayFakeOptions): Promise<PayFake> {
  const intents = new Map<string, FakePaymentIntent>()
  const refunds: FakeRefund[] = []
  const events: FakeEvent[] = []
  const deliveries: FakeDelivery[] = []
  const requests: PayFake['requests'] = []
  const answered = new Map<string, { fingerprint: string; status: number; body: unknown }>()
  const pending = new Set<Promise<unknown>>()
  const attempts = opts.attempts ?? 3
  const retryMs = opts.retryMs ?? 200

  const fake = {} as PayFake

  async function deliverOnce(event: FakeEvent, attempt: number): Promise<number | null> {
    const url = fake.webhookUrl
    if (!url) return null
    const body = JSON.stringify(event, null, 2)
    try {
      const res = await fetch(url, {
        method: 'POST',
        headers: { 'content-type': 'application/json; charset=utf-8', 'stripe-signature': signPayload(body, opts.webhookSecret), 'user-agent': 'LumenyardPayFake/1.0' },
        body,
        signal: AbortSignal.timeout(10_000),
      })
      await res.arrayBuffer()
      deliveries.push({ eventId: event.id, attempt, status: res.status, at: new Date() })
      return res.status
    } catch (err) {
      deliveries.push({ eventId: event.id, attempt, status: null, error: err instanceof Error ? err.message : String(err), at: new Date() })
      return null
    }
  }

  function track<T>(p: Promise<T>): Promise<T> {
    pending.add(p)
    void p.finally(() => pending.delete(p))
    return p
  }

  function emit(type: string, object: FakePaymentIntent | FakeRefund) {
    const event: FakeEvent = { id: newId('evt'), object: 'event', type, created: now(), api_version: null, livemode: false, data: { object: structuredClone(object) } }
    events.push(event)
    track((async () => {
      for (let attempt = 1; attempt <= attempts; attempt++) {
        const status = await deliverOnce(event, attempt)
        if (status === null && !fake.webhookUrl) return
        if (status !== null && status >= 200 && status < 300) return
        if (attempt < attempts) await new Promise((r) => setTimeout(r, retryMs * 2 ** (attempt - 1)))
      }
    })())
  }

  const app = express()
  app.disable('x-powered-by')
  app.use(express.urlencoded({ extended: true, limit: '64kb' }))
  app.use((req, _res, next) => {
    requests.push({ method: req.method, path: req.path, idempotencyKey: req.get('idempotency-key') ?? null, body: { ...(req.body ?? {}) } })
    next()
  })
  // The customer's side: a plain page where the person paying picks one of the fake's test cards (the real
  // provider shows its own card form here). No key needed, as on the provider's hosted page.
  app.get('/pay/:id', (req, res) => {
    const intent = intents.get(String(req.params.id))
    if (!intent) return res.status(404).type('html').send(customerPage('Payment not found', '<p>No payment with this reference.</p>'))
    res.type('html').send(customerPage(`Pay ${formatMinor(intent.amount, intent.currency)}`, intent.status === 'succeeded'
      ? '<p role="status">Paid. You can hand the device back.</p>'
      : intent.status === 'canceled' ? '<p role="status">Payment cancelled. Nothing was charged.</p>'
      : `<p>${escapeHtml(intent.description ?? '')}</p>${intent.last_payment_error ? '<p role="alert">That card was declined. Try another.</p>' : ''}
        <form method="post"><button name="card" value="${FAKE_CARD_TOKENS.approved}">Pay with the test card that is approved</button>
        <button name="card" value="${FAKE_CARD_TOKENS.declined}">Try the test card that is declined</button>
        <button name="card" value="cancel">Cancel this payment</button></form>`))
  })
  app.post('/pay/:id', (req, res) => {
    const intent = intents.get(String(req.params.id))
    try {
      const card = (req.body as Record<string, unknown>).card
      if (intent && intent.status !== 'succeeded' && intent.status !== 'canceled') {
        if (card === 'cancel') cancel(intent)
        else confirmWith(intent, card)
      }
    } catch (err) {
      if (!(err instanceof ProviderError)) throw err
    }
    res.redirect(303, `/pay/${encodeURIComponent(String(req.params.id))}`)
  })
  app.use((req, _res, next) => {
    const auth = req.get('authorization') ?? ''
    if (auth !== `Bearer ${opts.secretKey}`) {
      return next(new ProviderError(401, 'invalid_request_error', 'Invalid API Key provided.'))
    }
    next()
  })

  /** A POST with an Idempotency-Key answers the first answer again; the same key with other parameters is refused. */
  function idempotent(work: (req: Request) => { status: number; body: unknown }) {
    return (req: Request, res: Response) => {
      const key = req.get('idempotency-key')
      const fingerprint = `${req.path} ${JSON.stringify(req.body ?? {})}`
      if (key) {
        const before = answered.get(key)
        if (before) {
          if (before.fingerprint !== fingerprint) {
            throw new ProviderError(400, 'idempotency_error', 'Keys for idempotent requests can only be used with the same parameters they were first used with.')
          }
          res.set('idempotent-replayed', 'true')
          return res.status(before.status).json(before.body)
        }
      }
      let out: { status: number; body: unknown }
      try {
        out = work(req)
      } catch (err) {
        if (!(err instanceof ProviderError)) throw err
        out = { status: err.status, body: { error: { type: err.type, message: err.message, ...err.extra } } }
      }
      if (key) answered.set(key, { fingerprint, ...out })
      res.status(out.status).json(out.body)
    }
  }

  function intentOf(id: string): FakePaymentIntent {
    const intent = intents.get(id)
    if (!intent) throw new ProviderError(404, 'invalid_request_error', `No such payment_intent: '${id}'`, { code: 'resource_missing', param: 'intent' })
    return intent
  }

  app.post('/v1/payment_intents', idempotent((req) => {
    const body = req.body as Record<string, unknown>
    const amount = positiveInteger(body.amount, 'amount')
    const currency = typeof body.currency === 'string' && /^[a-z]{3}$/.test(body.currency) ? body.currency : null
    if (!currency) throw new ProviderError(400, 'invalid_request_error', 'Missing required param: currency.', { param: 'currency' })
    const id = newId('pi')
    const asked = body.allowed_payment_method_types ?? body.payment_method_types
    const types = Array.isArray(asked) ? asked.map(String) : ['card']
    const intent: FakePaymentIntent = {
      id,
      object: 'payment_intent',
      amount,
      amount_received: 0,
      currency,
      status: 'requires_payment_method',
      client_secret: `${id}_secret_${randomBytes(8).toString('hex')}`,
      description: typeof body.description === 'string' ? body.description : null,
      metadata: stringRecord(body.metadata),
      payment_method: null,
      payment_method_types: types,
      latest_charge: null,
      last_payment_error: null,
      created: now(),
      livemode: false,
    }
    intents.set(id, intent)
    emit('payment_intent.created', intent)
    return { status: 200, body: intent }
  }))

  app.get('/v1/payment_intents/:id', (req, res) => {
    res.json(intentOf(String(req.params.id)))
  })

  /** Confirms an intent with a test card token, as the provider does when the customer pays on its side. */
  function confirmWith(intent: FakePaymentIntent, token: unknown): { status: number; body: unknown } {
    if (intent.status === 'succeeded' || intent.status === 'canceled') {
      throw new ProviderError(400, 'invalid_request_error', `This PaymentIntent's status is ${intent.status}; it cannot be confirmed.`, { code: 'payment_intent_unexpected_state' })
    }
    if (token === FAKE_CARD_TOKENS.approved) {
      intent.status = 'succeeded'
      intent.amount_received = intent.amount
      intent.payment_method = newId('pm')
      intent.latest_charge = newId('ch')
      intent.last_payment_error = null
      emit('payment_intent.succeeded', intent)
      return { status: 200, body: intent }
    }
    if (token === FAKE_CARD_TOKENS.declined) {
      const error = { type: 'card_error', code: 'card_declined', decline_code: 'generic_decline', message: 'Your card was declined.' }
      intent.status = 'requires_payment_method'
      intent.last_payment_error = error
      emit('payment_intent.payment_failed', intent)
      return { status: 402, body: { error: { ...error, payment_intent: intent } } }
    }
    throw new ProviderError(400, 'invalid_request_error', 'No such PaymentMethod: the fake knows only its test card tokens.', { code: 'resource_missing', param: 'payment_method' })
  }

  /** Cancels an intent not yet paid (the customer on the provider's page, or the merchant through the API). */
  function cancel(intent: FakePaymentIntent): { status: number; body: unknown } {
    if (intent.status === 'succeeded' || intent.status === 'canceled') {
      throw new ProviderError(400, 'invalid_request_error', `This PaymentIntent's status is ${intent.status}; it cannot be canceled.`, { code: 'payment_intent_unexpected_state' })
    }
    intent.status = 'canceled'
    emit('payment_intent.canceled', intent)
    return { status: 200, body: intent }
  }

  app.post('/v1/payment_intents/:id/cancel', idempotent((req) => cancel(intentOf(String(req.params.id)))))

  app.post('/v1/payment_intents/:id/confirm', idempotent((req) => confirmWith(intentOf(String(req.params.id)), (req.body as Record<string, unknown>).payment_method)))

  app.post('/v1/refunds', idempotent((req) => {
    const body = req.body as Record<string, unknown>
    const intent = intentOf(typeof body.payment_intent === 'string' ? body.payment_intent : '')
    if (intent.status !== 'succeeded') {
      throw new ProviderError(400, 'invalid_request_error', 'This PaymentIntent has no successful charge to refund.', { code: 'charge_not_refundable' })
    }
    const refunded = refunds.filter((r) => r.payment_intent === intent.id).reduce((sum, r) => sum + r.amount, 0)
    const left = intent.amount_received - refunded
    const amount = body.amount === undefined ? left : positiveInteger(body.amount, 'amount')
    if (amount <= 0 || amount > left) {
      throw new ProviderError(400, 'invalid_request_error', `Refund amount (${amount}) is greater than the unrefunded amount (${left}).`, { code: 'amount_too_large', param: 'amount' })
    }
    const refund: FakeRefund = {
      id: newId('re'),
      object: 'refund',
      amount,
      currency: intent.currency,
      payment_intent: intent.id,
      charge: intent.latest_charge,
      status: 'succeeded',
      reason: typeof body.reason === 'string' ? body.reason : null,
      metadata: stringRecord(body.metadata),
      created: now(),
    }
    refunds.push(refund)
    emit('refund.created', refund)
    return { status: 200, body: refund }
  }))

  app.use((req, _res, next) => next(new ProviderError(404, 'invalid_request_error', `Unrecognized request URL (${req.method}: ${req.path}).`)))
  app.use((err: unknown, _req: Request, res: Response, _next: (e?: unknown) => void) => {
    const e = err instanceof ProviderError ? err : new ProviderError(500, 'api_error', 'The local payment fake failed.')
    res.status(e.status).json({ error: { type: e.type, message: e.message, ...e.extra } })
  })

  const host = opts.host ?? '127.0.0.1'
  const server: Server = await new Promise((resolve, reject) => {
    const fail = (err: NodeJS.ErrnoException) =>
      reject(err.code === 'EADDRINUSE' ? new Error(`Port ${opts.port} on ${host} is already in use: set LUMENYARD_PAY_PORT to run the card-payment fake on another port.`) : err)
    const s = app.listen(opts.port, host, (err?: Error) => (err ? fail(err) : resolve(s)))
    s.once('error', fail)
  })
  const address = server.address()
  const port = typeof address === 'object' && address ? address.port : opts.port

  Object.assign(fake, {
    port,
    url: `http://${host}:${port}`,
    intents,
    refunds,
    events,
    deliveries,
    requests,
    webhookUrl: opts.webhookUrl ?? null,
    redeliver: (eventId: string) => {
      const event = events.find((e) => e.id === eventId)
      if (!event) throw new Error(`The payment fake sent no event ${eventId}.`)
      return track(deliverOnce(event, deliveries.filter((d) => d.eventId === eventId).length + 1))
    },
    settled: async () => {
      while (pending.size) await Promise.allSettled([...pending])
    },
    close: async () => {
      await fake.settled()
      await new Promise<void>((resolve) => {
        server.close(() => resolve())
        server.closeAllConnections()
      })
    },
  } satisfies Omit<PayFake, never>)
  return fake
}
