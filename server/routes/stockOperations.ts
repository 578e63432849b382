// Stock-changing requests from the warehouse screens. Each is one transaction through the stock
// service and honours Idempotency-Key.
import type { Request } from 'express'
import {
  adjustmentSchema,
  binMoveSchema,
  issueSchema,
  receiptSchema,
  transferReceiveSchema,
  transferShipSchema,
} from '../../shared/schemas/stock.js'
import type { AppContext } from '../context.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { stockStep } from '../http/stockRequest.js'
import { idParam } from '../http/validate.js'
import { adjust, issue, moveBetweenBins, receive } from '../services/stock/stockService.js'
import { receiveTransfer, shipTransfer } from '../services/stock/stockTransfers.js'
import type { AppliedMoves } from '../services/stock/stockLedger.js'

const movers = allow('admin', 'warehouse')

const summary = (applied: AppliedMoves) => ({
  batchId: applied.batchId,
  moves: applied.moves.map((m) => ({ id: m.id, moveType: m.moveType, itemId: m.itemId, binId: m.binId, lotId: m.lotId, qty: m.qty })),
})

const actor = (req: Request) => ({ userId: req.user!.id })

export default (ctx: AppContext) =>
  defineRoutes('/stock', [
    stockStep(ctx, { path: '/adjustments', access: movers, body: adjustmentSchema, status: 201, run: async (em, { req, input }) => summary(await adjust(em, actor(req), input)) }),
    stockStep(ctx, { path: '/bin-moves', access: movers, body: binMoveSchema, status: 201, run: async (em, { req, input }) => summary(await moveBetweenBins(em, actor(req), input)) }),
    stockStep(ctx, { path: '/issues', access: movers, body: issueSchema, status: 201, smallAnswer: true, run: async (em, { req, input }) => summary(await issue(em, actor(req), input)) }),
    stockStep(ctx, { path: '/receipts', access: movers, body: receiptSchema, status: 201, run: async (em, { req, input }) => summary(await receive(em, actor(req), input)) }),
    stockStep(ctx, { path: '/transfers', access: movers, body: transferShipSchema, status: 201, run: (em, { req, input }) => shipTransfer(em, actor(req), input) }),
    stockStep(ctx, {
      path: '/transfers/:id/receive', access: movers, body: transferReceiveSchema,
      run: (em, { req, input }) => receiveTransfer(em, actor(req), { transferId: idParam(req.params.id, 'transfer_not_found'), lines: input.lines }),
    }),
  ])
