// The one door to the hosted card-payment provider: its official Node SDK (`stripe`), pointed by config at
// the provider's API or, outside production, at the local fake (server/fakes/payFake.ts). Card details are
// entered on the provider's side; Lumenyard sends amounts and our own references and gets ids and statuses.
import Stripe from 'stripe'
import type { AppConfig } from '../../config.js'
import { AppError } from '../../errors.js'

export type ProviderEvent = Stripe.Event
export type ProviderIntent = Stripe.PaymentIntent
export type ProviderRefund = Stripe.Refund

export interface PayProvider {
  readonly currency: string
  createIntent(input: { amountMinor: number; description: string; metadata: Record<string, string>; idempotencyKey: string }): Promise<ProviderIntent>
  confirmIntent(intentId: string, cardToken: string, idempotencyKey: string): Promise<ProviderIntent>
  retrieveIntent(intentId: string): Promise<ProviderIntent>
  /** Cancels an intent the customer has not paid (the clerk gives up waiting); refused once it is paid. */
  cancelIntent(intentId: string, idempotencyKey: string): Promise<ProviderIntent>
  refund(input: { intentId: string; amountMinor: number; idempotencyKey: string; metadata: Record<string, string> }): Promise<ProviderRefund>
  /** Where the customer pays this intent on the provider's side, when the provider is the local fake (else null). */
  customerPageUrl(intentId: string): string | null
  /** The event the provider signed, or a 400 `payment_signature_invalid` when the signature does not hold. */
  verifyEvent(rawBody: Buffer | string, signatureHeader: string | undefined): ProviderEvent
}

/** The SDK's errors as our codes: a declined card is the customer's answer, anything else the provider's trouble. */
export function providerFailure(err: unknown): AppError {
  if (err instanceof Stripe.errors.StripeCardError) {
    const reason = err.decline_code ?? err.code ?? 'declined'
    return AppError.unprocessable('card_declined', `The card was declined (${reason}).`)
  }
  if (err instanceof Stripe.errors.StripeConnectionError) {
    return AppError.of(502, 'payment_provider_unreachable', 'The payment provider could not be reached; nothing was charged.')
  }
  const message = err instanceof Error ? err.message : String(err)
  return AppError.of(502, 'payment_provider_failed', `The payment provider refused the request: ${message}`)
}

async function call<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work()
  } catch (err) {
    throw providerFailure(err)
  }
}

/** Every call refused with `card_payments_off`: production without the provider's keys takes no cards. */
function payProviderOff(currency: string): PayProvider {
  const off = (): never => {
    throw AppError.conflict('card_payments_off', 'Card payments are not set up here (the provider keys are not configured); record cash or cheque instead.')
  }
  return { currency, createIntent: off, confirmIntent: off, retrieveIntent: off, cancelIntent: off, refund: off, verifyEvent: off, customerPageUrl: () => null }
}

export function createPayProvider(config: AppConfig['pay']): PayProvider {
  if (!config.enabled) return payProviderOff(config.currency)
  const sdk = new Stripe(config.secretKey, {
    ...(config.api ? { host: config.api.host, port: config.api.port, protocol: config.api.protocol } : {}),
    maxNetworkRetries: 2, // retried with the same Idempotency-Key, so a retry never charges twice
    timeout: 20_000,
    appInfo: { name: 'Lumenyard' },
  })
  return {
    currency: config.currency,
    createIntent: ({ amountMinor, description, metadata, idempotencyKey }) =>
      call(() => sdk.paymentIntents.create(
        { amount: amountMinor, currency: config.currency, description, metadata, allowed_payment_method_types: ['card'] },
        { idempotencyKey },
      )),
    confirmIntent: (intentId, cardToken, idempotencyKey) =>
      call(() => sdk.paymentIntents.confirm(intentId, { payment_method: cardToken }, { idempotencyKey })),
    retrieveIntent: (intentId) => call(() => sdk.paymentIntents.retrieve(intentId)),
    cancelIntent: (intentId, idempotencyKey) => call(() => sdk.paymentIntents.cancel(intentId, {}, { idempotencyKey })),
    customerPageUrl: (intentId) => (config.localFake && config.api ? `${config.api.protocol}://${config.api.host}:${config.api.port}/pay/${encodeURIComponent(intentId)}` : null),
    refund: ({ intentId, amountMinor, idempotencyKey, metadata }) =>
      call(() => sdk.refunds.create({ payment_intent: intentId, amount: amountMinor, reason: 'requested_by_customer', metadata }, { idempotencyKey })),
    verifyEvent(rawBody, signatureHeader) {
      if (!signatureHeader) throw AppError.badRequest('payment_signature_invalid', 'The provider event carries no signature header.')
      try {
        // Five minutes of tolerance against replays of an old signature (the SDK's default).
        return sdk.webhooks.constructEvent(rawBody, signatureHeader, config.webhookSecret)
      } catch (err) {
        const reason = err instanceof Error ? err.message : String(err)
        throw AppError.badRequest('payment_signature_invalid', `The provider event's signature does not hold: ${reason}`)
      }
    },
  }
}
