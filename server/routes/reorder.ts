// The buyer's reorder screens. Buyer and admin only: the lines carry unit costs and usage values, which the
// read-only role does not see (it sees stock in the Stock area).
import {
  acceptSchema, historyQuerySchema, lineQuerySchema, policyUpsertSchema, suggestionQuerySchema,
} from '../../shared/schemas/reorder.js'
import { actorOf, type AppContext } from '../context.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { runStockRequest } from '../http/stockRequest.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { prepareAccept } from '../services/reorder/acceptSuggestions.js'
import { deletePolicy, listPolicies, savePolicy } from '../services/reorder/policyService.js'
import { abcPareto, lineDetail, reorderChoices, suggestionList } from '../services/reorder/suggestionList.js'

const buyers = allow('admin', 'buyer')

export default (ctx: AppContext) =>
  defineRoutes('/reorder', [
    {
      method: 'get',
      path: '/suggestions',
      access: buyers,
      handler: (req) => suggestionList(ctx.ds, parseQuery(suggestionQuerySchema, req.query)),
    },
    { method: 'get', path: '/choices', access: buyers, handler: () => reorderChoices(ctx.ds) },
    {
      method: 'get',
      path: '/lines/:itemId/:warehouseId',
      access: buyers,
      handler: (req) => {
        const query = parseQuery(lineQuerySchema.extend(historyQuerySchema.shape), req.query)
        return lineDetail(ctx.ds, idParam(req.params.itemId, 'item_not_found'), idParam(req.params.warehouseId, 'warehouse_not_found'), query)
      },
    },
    { method: 'get', path: '/abc', access: buyers, handler: (req) => abcPareto(ctx.ds, parseQuery(lineQuerySchema, req.query).windowDays) },
    {
      method: 'post',
      path: '/accept',
      access: buyers,
      handler: async (req, res) => {
        const input = parseBody(acceptSchema, req.body)
        // The lines are worked out before the transaction; the write takes them in it (Idempotency-Key honoured).
        const write = await prepareAccept(ctx.ds, input)
        return runStockRequest(ctx, req, res, input, (em) => write(em, actorOf(req)), (body) => (body.accepted.length ? 201 : 200))
      },
    },
    { method: 'get', path: '/policies', access: buyers, handler: () => listPolicies(ctx.ds) },
    {
      method: 'post',
      path: '/policies',
      access: buyers,
      handler: (req) => savePolicy(ctx.ds, actorOf(req), parseBody(policyUpsertSchema, req.body)),
    },
    {
      method: 'delete',
      path: '/policies/:id',
      access: buyers,
      handler: (req) => deletePolicy(ctx.ds, actorOf(req), idParam(req.params.id, 'policy_not_found')),
    },
  ])
