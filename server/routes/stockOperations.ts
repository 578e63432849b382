// Stock-changing requests from the warehouse screens. Each is one transaction through the stock
// service and honours Idempotency-Key.
import type { EntityManager } from 'typeorm'
import type { z } from 'zod'
import {
  adjustmentSchema,
  binMoveSchema,
  issueSchema,
  receiptSchema,
  transferReceiveSchema,
  transferShipSchema,
} from '../../shared/schemas/stock.js'
import type { AppContext } from '../context.js'
import { allow, defineRoutes, type RouteSpec } from '../http/routeTable.js'
import { runStockRequest } from '../http/stockRequest.js'
import { idParam, parseBody } from '../http/validate.js'
import { adjust, issue, moveBetweenBins, receive, type StockActor } from '../services/stock/stockService.js'
import { receiveTransfer, shipTransfer } from '../services/stock/stockTransfers.js'
import type { AppliedMoves } from '../services/stock/stockLedger.js'

const movers = allow('admin', 'warehouse')

const summary = (applied: AppliedMoves) => ({
  batchId: applied.batchId,
  moves: applied.moves.map((m) => ({ id: m.id, moveType: m.moveType, itemId: m.itemId, binId: m.binId, lotId: m.lotId, qty: m.qty })),
})

/** A POST that parses its body with the shared schema and runs one stock operation. */
function stockPost<S extends z.ZodType>(
  ctx: AppContext,
  path: string,
  schema: S,
  operation: (em: EntityManager, actor: StockActor, input: z.infer<S>, params: Record<string, string>) => Promise<unknown>,
  status = 201,
): RouteSpec {
  return {
    method: 'post',
    path,
    access: movers,
    handler: (req, res) => {
      const input = parseBody(schema, req.body)
      const params = req.params as Record<string, string>
      return runStockRequest(ctx, req, res, input, (em) => operation(em, { userId: req.user!.id }, input, params), status)
    },
  }
}

export default (ctx: AppContext) =>
  defineRoutes('/stock', [
    stockPost(ctx, '/adjustments', adjustmentSchema, async (em, actor, input) => summary(await adjust(em, actor, input))),
    stockPost(ctx, '/bin-moves', binMoveSchema, async (em, actor, input) => summary(await moveBetweenBins(em, actor, input))),
    stockPost(ctx, '/issues', issueSchema, async (em, actor, input) => summary(await issue(em, actor, input))),
    stockPost(ctx, '/receipts', receiptSchema, async (em, actor, input) => summary(await receive(em, actor, input))),
    stockPost(ctx, '/transfers', transferShipSchema, (em, actor, input) => shipTransfer(em, actor, input)),
    stockPost(
      ctx,
      '/transfers/:id/receive',
      transferReceiveSchema,
      (em, actor, input, params) => receiveTransfer(em, actor, { transferId: idParam(params.id, 'transfer_not_found'), lines: input.lines }),
      200,
    ),
  ])
