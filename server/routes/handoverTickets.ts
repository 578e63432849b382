// Fulfilling sales orders: the counter sends an order to the warehouse as a pick list, takes the rest of a
// backordered line off, and makes handover tickets (pickup or delivery); the warehouse sees open tickets at
// dispatch and signs them with the counter; viewers read. The buyer sees orders (special orders), not tickets.
import { ticketCreateSchema, ticketQuerySchema, ticketSignSchema } from '../../shared/schemas/handover.js'
import { actorOf, type AppContext } from '../context.js'
import { sendDownload } from '../http/fileResponse.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { stockStep } from '../http/stockRequest.js'
import { idParam, parseQuery } from '../http/validate.js'
import { cancelLineRest, sendOrderToPick } from '../services/sales/fulfilment.js'
import { PDF_TYPE, ticketPdfFile } from '../services/sales/handoverPdf.js'
import { listTickets, orderFulfilment, ticketDetail, ticketSignature } from '../services/sales/handoverRead.js'
import { createTicket, signTicket, voidTicket } from '../services/sales/handoverTickets.js'
import { sendReadyAgain } from '../services/sales/orderReadyMail.js'

const counter = allow('admin', 'counter')
const ticketReaders = allow('admin', 'counter', 'warehouse', 'viewer')
const signers = allow('admin', 'counter', 'warehouse')
const orderReaders = allow('admin', 'counter', 'warehouse', 'buyer', 'viewer')
type Req = { params: Record<string, string | string[] | undefined> }
const orderId = (req: Req) => idParam(req.params.id, 'sales_order_not_found')
const ticketId = (req: Req) => idParam(req.params.id, 'ticket_not_found')

export const orderFulfilmentRoutes = (ctx: AppContext) =>
  defineRoutes('/sales-orders', [
    { method: 'get', path: '/:id/fulfilment', access: orderReaders, handler: (req) => orderFulfilment(ctx.ds, orderId(req)) },
    stockStep(ctx, {
      path: '/:id/pick-lists', access: counter, id: orderId, status: 201,
      run: (em, { req, id }) => sendOrderToPick(em, actorOf(req), id),
    }),
    stockStep(ctx, {
      path: '/:id/lines/:lineId/cancel-rest', access: counter, id: orderId,
      run: (em, { req, id }) => cancelLineRest(em, actorOf(req), id, idParam(req.params.lineId, 'sales_line_not_found')),
    }),
    // The ready e-mail once more, after a failed attempt (sent once: a success keeps the order's claim).
    { method: 'post', path: '/:id/ready-mail', access: counter, handler: (req) => sendReadyAgain(ctx.ds, ctx.config, actorOf(req), orderId(req)) },
    stockStep(ctx, {
      path: '/:id/tickets', access: counter, id: orderId, body: ticketCreateSchema, status: 201,
      run: (em, { req, input, id }) => createTicket(em, actorOf(req), id, input),
    }),
  ])

export default (ctx: AppContext) =>
  defineRoutes('/handover-tickets', [
    { method: 'get', path: '/', access: ticketReaders, handler: (req) => listTickets(ctx.ds, parseQuery(ticketQuerySchema, req.query)) },
    { method: 'get', path: '/:id', access: ticketReaders, handler: (req) => ticketDetail(ctx.ds, ticketId(req)) },
    {
      method: 'get', path: '/:id/pdf', access: ticketReaders,
      handler: async (req, res) => sendDownload(res, { ...(await ticketPdfFile(ctx.ds, ticketId(req))), type: PDF_TYPE }),
    },
    {
      method: 'get', path: '/:id/signature', access: ticketReaders,
      handler: async (req, res) => {
        const png = await ticketSignature(ctx.ds, ticketId(req))
        res.set('Cache-Control', 'private, no-store').type('image/png').send(png)
      },
    },
    stockStep(ctx, {
      // Signed twice, or by two tablets at once: the stock leaves once (the order and ticket locks, and the key).
      path: '/:id/sign', access: signers, id: ticketId, body: ticketSignSchema,
      run: (em, { req, input, id }) => signTicket(em, actorOf(req), id, input),
    }),
    stockStep(ctx, {
      path: '/:id/void', access: counter, id: ticketId,
      run: (em, { req, id }) => voidTicket(em, actorOf(req), id),
    }),
  ])
