// ABC classes per item, by annual usage value summed over its warehouses (each warehouse's usage at its own
// unit cost), with shared/inventory/abc.ts doing the classifying.
import { annualUsageValue, classifyAbc, type AbcCutoffs, type AbcResult } from '../../../shared/inventory/abc.js'
import { DAYS_PER_YEAR } from '../../../shared/inventory/demand.js'
import { addMoney, type Money } from '../../../shared/money.js'

export interface LineValue {
  itemId: number
  /** This line's annual usage value (see lineAnnualValue). */
  annualValue: Money
}

/** Annual usage = window use ÷ window days × 365, never negative (net returns do not make value). */
export function annualQuantity(windowQty: number, windowDays: number): number {
  return Math.max(0, windowQty) / windowDays * DAYS_PER_YEAR
}

export function lineAnnualValue(windowQty: number, windowDays: number, unitCost: Money): Money {
  return annualUsageValue(annualQuantity(windowQty, windowDays), unitCost)
}

export function classifyItems(lines: readonly LineValue[], cutoffs: AbcCutoffs): AbcResult {
  const perItem = new Map<number, Money[]>()
  for (const l of lines) {
    const list = perItem.get(l.itemId)
    if (list) list.push(l.annualValue)
    else perItem.set(l.itemId, [l.annualValue])
  }
  return classifyAbc([...perItem].map(([id, values]) => ({ id: String(id), annualValue: values.length === 1 ? values[0] : addMoney(...values) })), cutoffs)
}
