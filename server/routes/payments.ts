// The payment provider's webhook: public (the provider has no session) but signed. The body arrives raw
// (app.ts mounts express.raw on this path before the JSON parser) because the signature covers the exact
// bytes; a bad or missing signature answers 400 and records nothing.
import type { AppContext } from '../context.js'
import { defineRoutes } from '../http/routeTable.js'
import { receiveProviderEvent } from '../services/payments/paymentEvents.js'

export const PAYMENT_WEBHOOK_PATH = '/api/payments/webhook'

export default (ctx: AppContext) =>
  defineRoutes('/payments', [
    {
      method: 'post',
      path: '/webhook',
      access: 'public',
      handler: async (req) => {
        const raw = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0)
        const event = ctx.pay.verifyEvent(raw, req.get('stripe-signature'))
        const receipt = await receiveProviderEvent(ctx.ds, event, ctx.payEventHandlers)
        ctx.logger.info({ event: receipt.eventId, type: receipt.type, duplicate: receipt.duplicate, outcome: receipt.outcome }, 'payment provider event')
        return { received: true, duplicate: receipt.duplicate }
      },
    },
  ])
