// How much may arrive against a PO line. Short is always fine (the rest stays on order); over is
// accepted only with a reason and up to a tolerance, so a miscount can't double a receipt.
import { problem, type Problem } from '../errors/errorCodes.js'

/** How a receipt line differs from what was still open: more, less, or partly damaged. */
export type ReceiptVariance = 'over' | 'short' | 'damaged'

/** Over-receipt tolerance: 10 % of the ordered quantity, rounded up (at least one unit). common practice */
export const OVER_RECEIPT_SHARE = 0.1

export function overReceiptAllowance(qtyOrdered: number): number {
  return Math.max(1, Math.ceil(qtyOrdered * OVER_RECEIPT_SHARE))
}

export interface LineReceiptCheck {
  qtyOrdered: number
  /** Good units received before this receipt. */
  qtyReceived: number
  /** Good units in this receipt. */
  qty: number
  damagedQty: number
  hasReason: boolean
}

export type LineReceiptVerdict =
  | { ok: true; variance: ReceiptVariance | null }
  | { ok: false; field: 'qty' | 'reason'; message: string; problem: Problem }

/** Checks one PO line's share of a receipt (all of its entries added up). */
export function checkLineReceipt(c: LineReceiptCheck): LineReceiptVerdict {
  const open = Math.max(0, c.qtyOrdered - c.qtyReceived)
  const after = c.qtyReceived + c.qty
  if (after > c.qtyOrdered) {
    const limit = c.qtyOrdered + overReceiptAllowance(c.qtyOrdered)
    if (after > limit) {
      const max = Math.max(0, limit - c.qtyReceived)
      return { ok: false, field: 'qty', message: `Only ${max} more can be received (${open} open plus the over-receipt allowance).`, problem: problem('over_receipt', { max }) }
    }
    if (!c.hasReason) return { ok: false, field: 'reason', message: `More than the ${open} still open: say why`, problem: problem('over_receipt_reason', { open }) }
    return { ok: true, variance: 'over' }
  }
  if (c.damagedQty > 0) return { ok: true, variance: 'damaged' }
  return { ok: true, variance: c.qty < open ? 'short' : null }
}
