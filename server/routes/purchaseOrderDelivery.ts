// Getting a purchase order to the vendor and the goods in: e-mail with the sheet attached (buyer),
// and receiving against it with scans (warehouse), posted through the stock service.
import type { Request } from 'express'
import { poSendSchema, receiveSchema } from '../../shared/schemas/purchasing.js'
import type { AppContext } from '../context.js'
import { actorOf } from '../context.js'
import { costsOf } from '../http/costAccess.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { stockStep } from '../http/stockRequest.js'
import { idParam, parseBody } from '../http/validate.js'
import { sendPurchaseOrder } from '../services/purchasing/poMail.js'
import { poDetail } from '../services/purchasing/poRead.js'
import { receiptsOfPo, receivingBins } from '../services/purchasing/poReceipts.js'
import { receivePurchaseOrder } from '../services/purchasing/poReceiving.js'

const poId = (req: Request) => idParam(req.params.id, 'po_not_found')

export default (ctx: AppContext) =>
  defineRoutes('/purchase-orders', [
    {
      method: 'post', path: '/:id/send', access: allow('admin', 'buyer'),
      handler: (req, res) => {
        const input = parseBody(poSendSchema, req.body)
        return sendPurchaseOrder(ctx.ds, ctx.config, actorOf(req), poId(req), input, costsOf(res))
      },
    },
    {
      method: 'get', path: '/:id/receiving', access: allow('admin', 'warehouse'),
      handler: async (req) => {
        const po = await poDetail(ctx.ds, poId(req))
        return { po, bins: await receivingBins(ctx.ds, po.warehouse.id) }
      },
    },
    {
      method: 'get', path: '/:id/receipts', access: allow('admin', 'buyer', 'warehouse'),
      handler: async (req) => {
        const id = poId(req)
        await poDetail(ctx.ds, id)
        return receiptsOfPo(ctx.ds, id)
      },
    },
    stockStep(ctx, {
      path: '/:id/receipts', access: allow('admin', 'warehouse'), id: poId, body: receiveSchema, status: 201,
      run: (em, { req, input, id }) => receivePurchaseOrder(em, actorOf(req), id, input),
    }),
  ])
