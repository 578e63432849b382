// Pick lists: made by the counter from a saved bill of materials, picked by the warehouse with a
// scanner, completed into stock moves. Every state change runs through runStockRequest (one
// transaction, deadlock retry, Idempotency-Key).
import type { Request } from 'express'
import {
  pickCancelSchema, pickCompleteSchema, pickConfirmSchema, pickDiscardSchema, pickCreateSchema, pickListQuerySchema, pickPlanSchema, pickShipSchema,
  pickShortResolveSchema,
} from '../../shared/schemas/picking.js'
import { actorOf, type AppContext } from '../context.js'
import { AppError } from '../errors.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { runStockRequest } from '../http/stockRequest.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { cancelPickList, releasePickList } from '../services/picking/pickListStates.js'
import { completePickList } from '../services/picking/pickCompletion.js'
import { confirmPick } from '../services/picking/pickConfirmations.js'
import { discardConfirmation } from '../services/picking/pickDiscards.js'
import { createPickLists } from '../services/picking/pickListCreate.js'
import { pickListDetail } from '../services/picking/pickListDetail.js'
import { bomsForPicking, pickListSummaries } from '../services/picking/pickListSummaries.js'
import { planPick, planView } from '../services/picking/pickPlanning.js'
import { resolveShort } from '../services/picking/pickShortResolve.js'
import { shipProposedTransfer } from '../services/picking/pickTransfers.js'

const readers = allow('admin', 'counter', 'warehouse')
const counter = allow('admin', 'counter')
const pickers = allow('admin', 'warehouse')
const listId = (req: Request) => idParam(req.params.id, 'pick_list_not_found')

/** Scanner confirmations must carry the key the handheld made with them, so a resend never counts twice. */
function confirmationKey(req: Request): string {
  const key = req.get('idempotency-key')
  if (!key) throw AppError.badRequest('idempotency_key_required', 'A confirmation needs an Idempotency-Key header.')
  return key
}

export default (ctx: AppContext) =>
  defineRoutes('/pick-lists', [
    { method: 'get', path: '/', access: readers, handler: (req) => pickListSummaries(ctx.ds.manager, parseQuery(pickListQuerySchema, req.query)) },
    { method: 'get', path: '/boms', access: counter, handler: () => bomsForPicking(ctx.ds.manager) },
    {
      method: 'post',
      path: '/plan',
      access: counter,
      handler: async (req) => {
        const input = parseBody(pickPlanSchema, req.body)
        const { plan } = await planPick(ctx.ds.manager, input)
        return planView(ctx.ds.manager, plan)
      },
    },
    {
      method: 'post',
      path: '/',
      access: counter,
      handler: (req, res) => {
        const input = parseBody(pickCreateSchema, req.body)
        return runStockRequest(ctx, req, res, input, async (em) => {
          const { ids } = await createPickLists(em, actorOf(req), input)
          return { ids, lists: await pickListSummaries(em, { ids, status: 'all' }) }
        }, 201)
      },
    },
    { method: 'get', path: '/:id', access: readers, handler: (req) => pickListDetail(ctx.ds.manager, listId(req)) },
    {
      method: 'post',
      path: '/:id/release',
      access: counter,
      handler: (req, res) => {
        const id = listId(req)
        return runStockRequest(ctx, req, res, null, async (em) => {
          await releasePickList(em, actorOf(req), id)
          return { id, status: 'released' }
        })
      },
    },
    {
      method: 'post',
      path: '/:id/cancel',
      access: counter,
      handler: (req, res) => {
        const id = listId(req)
        const { reason } = parseBody(pickCancelSchema, req.body)
        return runStockRequest(ctx, req, res, { reason }, async (em) => ({ id, status: 'cancelled', ...(await cancelPickList(em, actorOf(req), id, reason ?? null)) }))
      },
    },
    {
      method: 'post',
      path: '/:id/confirmations',
      access: pickers,
      handler: (req, res) => {
        const id = listId(req)
        const input = parseBody(pickConfirmSchema, req.body)
        const key = confirmationKey(req)
        return runStockRequest(ctx, req, res, input, (em) => confirmPick(em, actorOf(req), id, input, key), 201)
      },
    },
    {
      method: 'post',
      path: '/:id/discards',
      access: pickers,
      handler: (req, res) => {
        const id = listId(req)
        const input = parseBody(pickDiscardSchema, req.body)
        return runStockRequest(ctx, req, res, input, (em) => discardConfirmation(em, actorOf(req), id, input))
      },
    },
    {
      // A line closed short: found on a recount, backordered or substituted (the counter or the warehouse).
      method: 'post',
      path: '/:id/short-resolutions',
      access: readers,
      handler: (req, res) => {
        const id = listId(req)
        const input = parseBody(pickShortResolveSchema, req.body)
        return runStockRequest(ctx, req, res, input, (em) => resolveShort(em, actorOf(req), id, input))
      },
    },
    {
      method: 'post',
      path: '/:id/complete',
      access: pickers,
      handler: (req, res) => {
        const id = listId(req)
        const input = parseBody(pickCompleteSchema, req.body)
        return runStockRequest(ctx, req, res, input, async (em) => ({ id, status: 'picked', ...(await completePickList(em, actorOf(req), id, input)) }))
      },
    },
    {
      method: 'post',
      path: '/:id/transfers/ship',
      access: pickers,
      handler: (req, res) => {
        const id = listId(req)
        const { fromWarehouseId } = parseBody(pickShipSchema, req.body)
        return runStockRequest(ctx, req, res, { fromWarehouseId }, (em) => shipProposedTransfer(em, actorOf(req), id, fromWarehouseId), 201)
      },
    },
  ])
