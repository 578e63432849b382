// Stock value as of a past day, from the ledger alone: each item and warehouse's moving-average cost is
// replayed through its cost-bearing moves (receipts and transfers in, each blending with what was on hand
// just before it) up to that day, the same rule the stock service applies as moves happen
// (shared/inventory/movingAverage.ts), and the units on hand then are valued at it.
import { applyReceipt, EMPTY_COST_STATE, inventoryValue, type CostState } from '../inventory/movingAverage.js'
import type { Money } from '../money.js'

export interface CostBearingMove {
  /** `${itemId}|${warehouseId}` */
  key: string
  /** Units on hand in the warehouse just before this move. */
  before: number
  qty: number
  unitCost: Money
}

export interface PairValue {
  onHand: number
  averageCost: Money
  value: Money
}

/**
 * `moves` in ledger order within each key; `onHand` the units on hand at the day's end per key.
 * A pair with stock but no cost-bearing move before the day is valued at zero cost (it was never received).
 */
export function valueAsOf(moves: Iterable<CostBearingMove>, onHand: ReadonlyMap<string, number>): Map<string, PairValue> {
  const states = new Map<string, CostState>()
  for (const m of moves) {
    const prior = states.get(m.key) ?? EMPTY_COST_STATE
    states.set(m.key, applyReceipt({ onHand: m.before, averageCost: prior.averageCost }, m.qty, m.unitCost).after)
  }
  const out = new Map<string, PairValue>()
  for (const [key, qty] of onHand) {
    if (qty === 0) continue
    const averageCost = (states.get(key) ?? EMPTY_COST_STATE).averageCost
    out.set(key, { onHand: qty, averageCost, value: inventoryValue({ onHand: qty, averageCost }) })
  }
  return out
}
