// Pick lists: made by the counter from a saved bill of materials, picked by the warehouse with a
// scanner, completed into stock moves. Every state change is a stockStep (one
// transaction, deadlock retry, Idempotency-Key).
import type { Request } from 'express'
import {
  pickCancelSchema, pickCompleteSchema, pickConfirmSchema, pickDiscardSchema, pickCreateSchema, pickListQuerySchema, pickPlanSchema, pickShipSchema,
  pickShortResolveSchema,
} from '../../shared/schemas/picking.js'
import { actorOf, type AppContext } from '../context.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { stockStep } from '../http/stockRequest.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { cancelPickList, releasePickList } from '../services/picking/pickListStates.js'
import { completePickList } from '../services/picking/pickCompletion.js'
import { mailReadyAfterPick } from '../services/sales/orderReadyMail.js'
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
    stockStep(ctx, {
      path: '/', access: counter, body: pickCreateSchema, status: 201,
      run: async (em, { req, input }) => {
        const { ids } = await createPickLists(em, actorOf(req), input)
        return { ids, lists: await pickListSummaries(em, { ids, status: 'all' }) }
      },
    }),
    { method: 'get', path: '/:id', access: readers, handler: (req) => pickListDetail(ctx.ds.manager, listId(req)) },
    stockStep(ctx, {
      path: '/:id/release', access: counter, id: listId,
      run: async (em, { req, id }) => {
        await releasePickList(em, actorOf(req), id)
        return { id, status: 'released' }
      },
    }),
    stockStep(ctx, {
      path: '/:id/cancel', access: counter, id: listId, body: pickCancelSchema,
      run: async (em, { req, input, id }) => ({ id, status: 'cancelled', ...(await cancelPickList(em, actorOf(req), id, input.reason ?? null)) }),
    }),
    stockStep(ctx, {
      // The handheld's own key is required: a resend of the same confirmation is answered, never applied again.
      path: '/:id/confirmations', access: pickers, id: listId, body: pickConfirmSchema, status: 201, keyRequired: true, smallAnswer: true,
      run: (em, { req, input, id, key }) => confirmPick(em, actorOf(req), id, input, key!),
    }),
    stockStep(ctx, {
      path: '/:id/discards', access: pickers, id: listId, body: pickDiscardSchema,
      run: (em, { req, input, id }) => discardConfirmation(em, actorOf(req), id, input),
    }),
    stockStep(ctx, {
      // A line closed short: found on a recount, backordered or substituted (the counter or the warehouse).
      path: '/:id/short-resolutions', access: readers, id: listId, body: pickShortResolveSchema,
      run: (em, { req, input, id }) => resolveShort(em, actorOf(req), id, input),
    }),
    stockStep(ctx, {
      path: '/:id/complete', access: pickers, id: listId, body: pickCompleteSchema,
      run: async (em, { req, input, id }) => ({ id, status: 'picked', ...(await completePickList(em, actorOf(req), id, input)) }),
      // A sales order's list leaves the order ready: the contractor is e-mailed once the pick is committed.
      after: (_body, { req, id }) => mailReadyAfterPick(ctx.ds, ctx.config, actorOf(req), id),
    }),
    stockStep(ctx, {
      path: '/:id/transfers/ship', access: pickers, id: listId, body: pickShipSchema, status: 201,
      run: (em, { req, input, id }) => shipProposedTransfer(em, actorOf(req), id, input.fromWarehouseId),
    }),
  ])
