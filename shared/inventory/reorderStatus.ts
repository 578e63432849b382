// The status of a stock line against its reorder figures. Checked in this order, first match wins:
//   deadStock   unreserved stock and no use for deadStockDays (or no use known): reordering it would be waste,
//               so it wins even when the position is low;
//   orderNow    position ≤ ROP (when there is a ROP to protect), or any negative position (backorders);
//   orderSoon   position ≤ ROP + d̄ × soonDays: it will reach the ROP within soonDays at the mean rate;
//   overstocked position > ceiling + d̄ × overstockMarginDays, where the ceiling is the highest position the
//               policy itself can produce (see policyCeiling), so a line is never called overstocked right after
//               following our own suggestion;
//   ok          otherwise.
import { roundUpToPack } from './packs.js'
import type { DemandInput, ReorderPolicy, ReorderStatus, StockPosition } from './reorder.js'
import type { Working } from './reorderWords.js'

export interface CeilingInput {
  reorderPoint: number
  orderUpToLevel: number | null
  lotSize: number
  method: ReorderPolicy['method']
  packSize: number
  minimumOrder: number
}

/**
 * Highest inventory position reachable by ordering what reorderSuggestion suggests.
 * eoq: an order is placed at position ≤ ROP and is the lot size, or the need rounded up to packs → ROP + max(Q, pack).
 * orderUpTo: T (at least ROP + 1) plus pack rounding, or the minimum order placed at the ROP.
 */
export function policyCeiling(c: CeilingInput): number {
  if (c.method === 'eoq') return c.reorderPoint + Math.max(c.lotSize, c.packSize)
  const minimumRounded = c.minimumOrder > 0 ? roundUpToPack(Math.ceil(c.minimumOrder), c.packSize) : 0
  const target = Math.max(c.orderUpToLevel ?? 0, c.reorderPoint + 1)
  return Math.max(target + c.packSize - 1, c.reorderPoint + minimumRounded)
}

export interface ClassifyInput {
  position: number
  stock: StockPosition
  demand: DemandInput
  policy: ReorderPolicy
  reorderPoint: number
  ceiling: number
}

/** The line's status; appends the deciding comparison to `steps`. */
export function classifyLine(c: ClassifyInput, steps?: Working): ReorderStatus {
  const { position, stock, demand, policy, reorderPoint: rop } = c
  const free = stock.onHand - stock.reserved
  const idle = demand.daysSinceLastUse
  if (free > 0 && (idle === null || idle >= policy.deadStockDays)) {
    if (idle === null) steps?.add('deadNoUse', { free, limit: policy.deadStockDays })
    else steps?.add('deadIdle', { free, idle, limit: policy.deadStockDays })
    return 'deadStock'
  }
  if (position < 0 || (rop > 0 && position <= rop)) {
    steps?.add('orderNow', { position, rop })
    return 'orderNow'
  }
  const soonLimit = rop + demand.meanDaily * policy.soonDays
  if (demand.meanDaily > 0 && position <= soonLimit) {
    steps?.add('orderSoon', { position, days: policy.soonDays, limit: soonLimit.toFixed(2) })
    return 'orderSoon'
  }
  const overLimit = c.ceiling + Math.ceil(demand.meanDaily * policy.overstockMarginDays)
  if (position > overLimit) {
    steps?.add('overstocked', { position, ceiling: c.ceiling, days: policy.overstockMarginDays, limit: overLimit })
    return 'overstocked'
  }
  steps?.add('ok', { rop, position, limit: overLimit })
  return 'ok'
}
