// PO money: a line's total is its unit cost (per stock unit, up to 4 decimals) × stock units, rounded
// half-up to cents; the order's total is the sum of the rounded line totals, as an invoice adds up.
import { addMoney, MoneyDecimal, multiplyMoney, roundMoney, type Money } from '../money.js'

export function lineTotal(unitCost: Money, qtyOrdered: number): Money {
  return roundMoney(multiplyMoney(unitCost, qtyOrdered))
}

export function orderTotal(lines: readonly { unitCost: Money; qtyOrdered: number }[]): Money {
  return roundMoney(addMoney('0', ...lines.map((l) => lineTotal(l.unitCost, l.qtyOrdered))))
}

/** The largest order total the purchase_orders.total column (DECIMAL(14,2)) holds. */
export const MAX_ORDER_TOTAL = '999999999999.99'

/** Whether an order total fits its column. */
export const orderTotalFits = (total: Money): boolean => new MoneyDecimal(total).lte(MAX_ORDER_TOTAL)

/** Stock units one PO line may hold (a sanity bound well inside the INT columns). */
export const MAX_LINE_QTY = 1_000_000

/** Packs to order for a wanted quantity: at least the minimum order, rounded up to whole packs. */
export function packsFor(wantedQty: number, packQty: number, minOrderQty = 1): number {
  if (!Number.isSafeInteger(wantedQty) || wantedQty < 1) throw new RangeError(`wanted quantity must be a positive integer, got ${wantedQty}`)
  if (!Number.isSafeInteger(packQty) || packQty < 1) throw new RangeError(`pack size must be a positive integer, got ${packQty}`)
  return Math.ceil(Math.max(wantedQty, minOrderQty) / packQty)
}

/** PO numbers: PO-<year>-<5-digit sequence>, e.g. PO-2026-00042. */
export function formatPoNumber(year: number, sequence: number): string {
  if (!Number.isSafeInteger(sequence) || sequence < 1) throw new RangeError(`sequence must be a positive integer, got ${sequence}`)
  return `PO-${year}-${String(sequence).padStart(5, '0')}`
}
