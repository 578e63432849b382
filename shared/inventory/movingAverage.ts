// Perpetual moving-average unit cost, kept per item and warehouse.
// Rounding rule: the average is stored to 4 decimal places of currency (half-up) after every receipt,
// and the next receipt starts from that stored average (as the database column would hold it).
// Extended values of issues are rounded half-up to cents.
import { MoneyDecimal, isMoney, multiplyMoney, roundMoney, type Money } from '../money.js'

export const AVERAGE_COST_DECIMALS = 4

export interface CostState {
  onHand: number
  /** Unit cost, 4 decimal places, e.g. '11.3333'. */
  averageCost: Money
}

export type CostMove =
  | { kind: 'receipt'; qty: number; unitCost: Money }
  | { kind: 'issue'; qty: number }

export interface CostStep {
  move: CostMove
  before: CostState
  after: CostState
  /** Receipts: qty × unit cost; issues: qty × average at the time, both to cents. */
  extendedCost: Money
  explanation: string
}

export const EMPTY_COST_STATE: CostState = { onHand: 0, averageCost: '0.0000' }

function checkQty(qty: number): void {
  if (!Number.isSafeInteger(qty) || qty <= 0) throw new RangeError(`quantity must be a positive integer, got ${qty}`)
}

/**
 * new average = (onHand × average + qty × unitCost) / (onHand + qty).
 * When nothing (or less than nothing) is on hand the old average carries no value, so the receipt's cost is taken.
 */
export function applyReceipt(state: CostState, qty: number, unitCost: Money): CostStep {
  checkQty(qty)
  if (!isMoney(unitCost, AVERAGE_COST_DECIMALS) || unitCost.startsWith('-')) {
    throw new RangeError(`unit cost must be a non-negative amount with ≤ ${AVERAGE_COST_DECIMALS} places, got ${unitCost}`)
  }
  const move: CostMove = { kind: 'receipt', qty, unitCost }
  const extendedCost = roundMoney(multiplyMoney(unitCost, qty))
  const onHand = state.onHand + qty
  if (state.onHand <= 0) {
    const averageCost = roundMoney(unitCost, AVERAGE_COST_DECIMALS)
    return {
      move, before: state, after: { onHand, averageCost }, extendedCost,
      explanation: `nothing on hand before: average = receipt cost ${averageCost}`,
    }
  }
  const oldValue = new MoneyDecimal(state.averageCost).times(state.onHand)
  const total = oldValue.plus(new MoneyDecimal(unitCost).times(qty))
  const averageCost = total.dividedBy(onHand).toDecimalPlaces(AVERAGE_COST_DECIMALS).toFixed(AVERAGE_COST_DECIMALS)
  return {
    move, before: state, after: { onHand, averageCost }, extendedCost,
    explanation:
      `average = (${state.onHand} × ${state.averageCost} + ${qty} × ${unitCost}) / (${state.onHand} + ${qty})` +
      ` = ${total.toFixed()} / ${onHand} = ${averageCost}`,
  }
}

/** Issues leave the average unchanged; their cost is qty × average. Issuing more than is on hand is refused. */
export function applyIssue(state: CostState, qty: number): CostStep {
  checkQty(qty)
  if (qty > state.onHand) throw new RangeError(`cannot issue ${qty}: only ${state.onHand} on hand`)
  const extendedCost = roundMoney(multiplyMoney(state.averageCost, qty))
  return {
    move: { kind: 'issue', qty },
    before: state,
    after: { onHand: state.onHand - qty, averageCost: state.averageCost },
    extendedCost,
    explanation: `issue cost = ${qty} × ${state.averageCost} = ${extendedCost}; average unchanged`,
  }
}

/** Replays one item-and-warehouse's moves in order, returning every step. */
export function replayCostMoves(moves: readonly CostMove[], start: CostState = EMPTY_COST_STATE): CostStep[] {
  const steps: CostStep[] = []
  let state = start
  for (const move of moves) {
    const step = move.kind === 'receipt' ? applyReceipt(state, move.qty, move.unitCost) : applyIssue(state, move.qty)
    steps.push(step)
    state = step.after
  }
  return steps
}

export interface KeyedCostMove {
  itemId: string | number
  warehouseId: string | number
  move: CostMove
}

/** Final state per item and warehouse (key `${itemId}|${warehouseId}`); each pair averages on its own. */
export function averageCostsByItemWarehouse(moves: readonly KeyedCostMove[]): Map<string, CostState> {
  const states = new Map<string, CostState>()
  for (const { itemId, warehouseId, move } of moves) {
    const key = `${itemId}|${warehouseId}`
    const state = states.get(key) ?? EMPTY_COST_STATE
    const step = move.kind === 'receipt' ? applyReceipt(state, move.qty, move.unitCost) : applyIssue(state, move.qty)
    states.set(key, step.after)
  }
  return states
}

/** Value of the stock at the stored average, to cents. */
export function inventoryValue(state: CostState): Money {
  return roundMoney(multiplyMoney(state.averageCost, state.onHand))
}
