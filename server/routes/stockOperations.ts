// Stock-changing requests from the warehouse screens. Each is one transaction through the stock
// service and honours Idempotency-Key.
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
import { runStockRequest } from '../http/stockRequest.js'
import { idParam, parseBody } from '../http/validate.js'
import { adjust, issue, moveBetweenBins, receive } from '../services/stock/stockService.js'
import { receiveTransfer, shipTransfer } from '../services/stock/stockTransfers.js'
import type { AppliedMoves } from '../services/stock/stockLedger.js'

const movers = allow('admin', 'warehouse')

const summary = (applied: AppliedMoves) => ({
  batchId: applied.batchId,
  moves: applied.moves.map((m) => ({ id: m.id, moveType: m.moveType, itemId: m.itemId, binId: m.binId, lotId: m.lotId, qty: m.qty })),
})

export default (ctx: AppContext) =>
  defineRoutes('/stock', [
    {
      method: 'post',
      path: '/adjustments',
      access: movers,
      handler: (req, res) => {
        const input = parseBody(adjustmentSchema, req.body)
        return runStockRequest(ctx, req, res, async (em) => summary(await adjust(em, { userId: req.user!.id }, input)), 201)
      },
    },
    {
      method: 'post',
      path: '/bin-moves',
      access: movers,
      handler: (req, res) => {
        const input = parseBody(binMoveSchema, req.body)
        return runStockRequest(ctx, req, res, async (em) => summary(await moveBetweenBins(em, { userId: req.user!.id }, input)), 201)
      },
    },
    {
      method: 'post',
      path: '/issues',
      access: movers,
      handler: (req, res) => {
        const input = parseBody(issueSchema, req.body)
        return runStockRequest(ctx, req, res, async (em) => summary(await issue(em, { userId: req.user!.id }, input)), 201)
      },
    },
    {
      method: 'post',
      path: '/receipts',
      access: movers,
      handler: (req, res) => {
        const input = parseBody(receiptSchema, req.body)
        return runStockRequest(ctx, req, res, async (em) => summary(await receive(em, { userId: req.user!.id }, input)), 201)
      },
    },
    {
      method: 'post',
      path: '/transfers',
      access: movers,
      handler: (req, res) => {
        const input = parseBody(transferShipSchema, req.body)
        return runStockRequest(ctx, req, res, async (em) => {
          const { transfer, lines } = await shipTransfer(em, { userId: req.user!.id }, input)
          return { transfer, lines }
        }, 201)
      },
    },
    {
      method: 'post',
      path: '/transfers/:id/receive',
      access: movers,
      handler: (req, res) => {
        const id = idParam(req.params.id, 'That transfer')
        const input = parseBody(transferReceiveSchema, req.body)
        return runStockRequest(ctx, req, res, (em) => receiveTransfer(em, { userId: req.user!.id }, { transferId: id, lines: input.lines }))
      },
    },
  ])
