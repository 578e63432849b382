// Sales orders at the counter: the counter (and admin) takes quotes into orders, cancels them and records
// cash and cheque payments; the warehouse, the buyer (special orders) and viewers read them.
import type { Request, Response } from 'express'
import type { EntityManager } from 'typeorm'
import type { z } from 'zod'
import { handPaymentSchema, salesOrderCancelSchema, salesOrderFromQuoteSchema, salesOrderQuerySchema, salesSettingsSchema } from '../../shared/schemas/salesOrders.js'
import { actorOf, type AppContext } from '../context.js'
import { runStockRequest } from '../http/stockRequest.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { recordPaymentIn } from '../services/sales/payments.js'
import { listSalesOrders, salesOrderDetail } from '../services/sales/salesOrderRead.js'
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

export default (ctx: AppContext) => {
  /** A change to one order, in one transaction under the request's Idempotency-Key. */
  const onOrder = <S extends z.ZodType, T>(
    req: Request, res: Response, schema: S, work: (em: EntityManager, actor: ReturnType<typeof actorOf>, orderId: number, input: z.infer<S>) => Promise<T>, status = 200,
  ) => {
    const orderId = id(req.params.id)
    const input = parseBody(schema, req.body)
    const actor = actorOf(req)
    return runStockRequest(ctx, req, res, input, (em) => work(em, actor, orderId, input), status)
  }
  return defineRoutes('/sales-orders', [
    { method: 'get', path: '/', access: readers, handler: (req) => listSalesOrders(ctx.ds, parseQuery(salesOrderQuerySchema, req.query)) },
    {
      method: 'post',
      path: '/',
      access: counter,
      // Taking a quote: a second submit (or the same Idempotency-Key) answers the order already made.
      handler: async (req, res) => {
        const input = parseBody(salesOrderFromQuoteSchema, req.body)
        const actor = actorOf(req)
        await runStockRequest(ctx, req, res, input, async (em) => {
          const made = await takeQuoteIn(em, actor, input.quoteId)
          return { id: made.orderId, created: made.created }
        }, 201)
      },
    },
    { method: 'get', path: '/:id', access: readers, handler: (req) => salesOrderDetail(ctx.ds, id(req.params.id)) },
    {
      method: 'post',
      path: '/:id/cancel',
      access: counter,
      handler: (req, res) => onOrder(req, res, salesOrderCancelSchema, (em, actor, orderId, input) => cancelSalesOrderIn(em, actor, orderId, input.reason)),
    },
    { method: 'get', path: '/:id/payments', access: readers, handler: async (req) => (await salesOrderDetail(ctx.ds, id(req.params.id))).payments },
    {
      method: 'post',
      path: '/:id/payments',
      access: counter,
      handler: (req, res) => onOrder(req, res, handPaymentSchema, async (em, actor, orderId, input) => {
        const p = await recordPaymentIn(em, actor, orderId, input)
        return { id: p.id, salesOrderId: orderId, method: p.method, amount: p.amount, status: p.status, reference: p.reference }
      }, 201),
    },
  ])
}
