// Sales orders at the counter: the counter (and admin) takes quotes into orders, cancels them and records
// cash and cheque payments; the warehouse, the buyer (special orders) and viewers read them.
import { salesReturnSchema } from '../../shared/schemas/salesReturns.js'
import { cardConfirmSchema, cardDepositStartSchema, handPaymentSchema, salesOrderCancelSchema, salesOrderFromQuoteSchema, salesOrderQuerySchema, salesSettingsSchema } from '../../shared/schemas/salesOrders.js'
import { actorOf, type AppContext } from '../context.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { stockStep } from '../http/stockRequest.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { cancelCardDeposit, cardDepositState, confirmCardDeposit, refundCardPaymentsIn, startCardDepositIn } from '../services/sales/cardDeposits.js'
import { recordPaymentIn } from '../services/sales/payments.js'
import { listSalesOrders, salesOrderDetail } from '../services/sales/salesOrderRead.js'
import { returnsOf, takeReturnIn } from '../services/sales/returns.js'
import { salesSettings, updateSalesSettings } from '../services/sales/salesSettings.js'
import { cancelSalesOrderIn, takeQuoteIn } from '../services/sales/salesOrderWrite.js'

const readers = allow('admin', 'counter', 'warehouse', 'buyer', 'viewer')
const counter = allow('admin', 'counter')
const id = (raw: string | string[] | undefined) => idParam(raw, 'sales_order_not_found')

export const salesSettingsRoutes = (ctx: AppContext) =>
  defineRoutes('/sales-settings', [
    { method: 'get', path: '/', access: counter, handler: () => salesSettings(ctx.ds) },
    { method: 'patch', path: '/', access: allow('admin'), handler: (req) => updateSalesSettings(ctx.ds, actorOf(req), parseBody(salesSettingsSchema, req.body)) },
  ])

const orderId = (req: { params: Record<string, string | string[] | undefined> }) => id(req.params.id)

export default (ctx: AppContext) =>
  defineRoutes('/sales-orders', [
    { method: 'get', path: '/', access: readers, handler: (req) => listSalesOrders(ctx.ds, parseQuery(salesOrderQuerySchema, req.query)) },
    stockStep(ctx, {
      // Taking a quote: a second submit (or the same Idempotency-Key) answers the order already made.
      path: '/', access: counter, body: salesOrderFromQuoteSchema, status: 201,
      run: async (em, { req, input }) => {
        const made = await takeQuoteIn(em, actorOf(req), input.quoteId)
        return { id: made.orderId, created: made.created }
      },
    }),
    { method: 'get', path: '/:id', access: readers, handler: (req) => salesOrderDetail(ctx.ds, id(req.params.id)) },
    stockStep(ctx, {
      path: '/:id/cancel', access: counter, id: orderId, body: salesOrderCancelSchema,
      // Settled card payments go back through the provider in the same transaction (idempotent refunds).
      run: async (em, { req, input, id: order }) => {
        const done = await cancelSalesOrderIn(em, actorOf(req), order, input.reason)
        return { ...done, refunded: await refundCardPaymentsIn(em, ctx.pay, actorOf(req), order) }
      },
    }),
    { method: 'get', path: '/:id/payments', access: readers, handler: async (req) => (await salesOrderDetail(ctx.ds, id(req.params.id))).payments },
    stockStep(ctx, {
      path: '/:id/payments', access: counter, id: orderId, body: handPaymentSchema, status: 201,
      run: async (em, { req, input, id: order }) => {
        const p = await recordPaymentIn(em, actorOf(req), order, input)
        return { id: p.id, salesOrderId: order, method: p.method, amount: p.amount, status: p.status, reference: p.reference }
      },
    }),
    // Card deposits: the card is entered on the provider's side; Lumenyard starts the payment and confirms it
    // with the provider's token; the provider's signed event settles it (routes/payments.ts).
    stockStep(ctx, {
      path: '/:id/card-deposits', access: counter, id: orderId, body: cardDepositStartSchema, status: 201,
      run: (em, { req, input, id: order }) => startCardDepositIn(em, ctx.pay, actorOf(req), order, input.amount),
    }),
    {
      // The counter follows a card deposit until the provider's signed event has recorded it.
      method: 'get', path: '/:id/card-deposits/:paymentId', access: counter,
      handler: (req) => cardDepositState(ctx.ds, ctx.pay, id(req.params.id), idParam(req.params.paymentId, 'payment_not_found')),
    },
    {
      // The clerk gives up on a card deposit still waiting: the provider cancels it, the row is closed.
      method: 'post', path: '/:id/card-deposits/:paymentId/cancel', access: counter,
      handler: (req) => cancelCardDeposit(ctx.ds, ctx.pay, actorOf(req), id(req.params.id), idParam(req.params.paymentId, 'payment_not_found')),
    },
    {
      method: 'post', path: '/:id/card-deposits/:paymentId/confirm', access: counter,
      handler: (req) => confirmCardDeposit(ctx.ds, ctx.pay, id(req.params.id), idParam(req.params.paymentId, 'payment_not_found'), parseBody(cardConfirmSchema, req.body).cardToken),
    },
    // Returns: goods handed over come back into a bin and lot; money back less the restocking fee, or credit.
    { method: 'get', path: '/:id/returns', access: readers, handler: async (req) => returnsOf(ctx.ds, (await salesOrderDetail(ctx.ds, id(req.params.id))).id) },
    stockStep(ctx, {
      path: '/:id/returns', access: counter, id: orderId, body: salesReturnSchema, status: 201,
      run: (em, { req, input, id: order }) => takeReturnIn(em, ctx.pay, actorOf(req), order, input),
    }),
  ])
