// The deposit rule on special orders: a PO carrying made-to-order lines of a sales order is not sent to
// the vendor (e-mailed or marked sent) until that order's deposit is paid.
import type { DataSource, EntityManager } from 'typeorm'
import { AppError } from '../../errors.js'

export async function ensureDepositsPaid(db: EntityManager | DataSource, poId: number): Promise<void> {
  const rows: { number: string; deposit_required: string; deposit_paid: string }[] = await db.query(
    `SELECT DISTINCT o.number, o.deposit_required, o.deposit_paid
       FROM sales_order_lines sl JOIN sales_orders o ON o.id = sl.sales_order_id
       JOIN purchase_order_lines pl ON pl.id = sl.po_line_id
      WHERE pl.po_id = ? AND o.status <> 'cancelled' AND o.deposit_paid < o.deposit_required
      ORDER BY o.number`,
    [poId],
  )
  if (rows.length) {
    const [first] = rows
    throw AppError.conflict(
      'deposit_not_paid',
      `The deposit on sales order ${first.number} is not paid (${first.deposit_paid} of ${first.deposit_required}): the special order waits for it.`,
      { params: { order: first.number, required: String(first.deposit_required), paid: String(first.deposit_paid) } },
    )
  }
}
