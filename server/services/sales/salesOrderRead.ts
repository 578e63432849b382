// Reading sales orders: the list (open ones by default; the buyer's view: those with special orders) and
// one order with its lines (held, picked, handed over, the special order's PO) and its payments.
import { SqlWhere } from '../../db/sqlWhere.js'
import type { DataSource } from 'typeorm'
import { compareMoney, roundMoney, subtractMoney } from '../../../shared/money.js'
import type { PaymentMethod, PaymentStatus, SalesOrderStatus } from '../../../shared/sales/salesOrderTerms.js'
import { balanceDue } from '../../../shared/sales/salesOrderMoney.js'
import type { NewestPage } from '../../../shared/schemas/newestPage.js'
import type { SalesOrderDetail, SalesOrderSummary } from '../../../shared/schemas/salesOrders.js'
import { containsPattern } from '../../db/likePattern.js'
import { AppError } from '../../errors.js'

type Row = Record<string, string | number | null | Date>

const SUMMARY_SQL = `SELECT o.id, o.number, o.quote_id AS quoteId, q.number AS quoteNumber, o.status, o.customer_id AS customerId,
    c.name AS customerName, o.job_id AS jobId, j.name AS jobName, o.warehouse_id AS warehouseId, w.code AS warehouseCode,
    o.subtotal, o.tax_amount AS taxAmount, o.total, o.deposit_percent AS depositPercent, o.deposit_required AS depositRequired,
    o.deposit_paid AS depositPaid, o.cancel_reason AS cancelReason, o.cancelled_at AS cancelledAt, u.display_name AS createdBy, o.created_at AS createdAt
  FROM sales_orders o JOIN quotes q ON q.id = o.quote_id JOIN customers c ON c.id = o.customer_id
  JOIN warehouses w ON w.id = o.warehouse_id LEFT JOIN jobs j ON j.id = o.job_id LEFT JOIN users u ON u.id = o.created_by`

const str = (v: unknown) => (v === null || v === undefined ? null : String(v))
const iso = (v: unknown) => (v === null || v === undefined ? null : new Date(v as Date).toISOString())

/** Deposit still owed: what is asked less what is paid, never below zero. */
function depositDue(required: string, paid: string): string {
  const rest = subtractMoney(required, paid)
  return compareMoney(rest, '0') > 0 ? roundMoney(rest) : '0.00'
}

function toSummary(r: Row): SalesOrderSummary {
  return {
    id: Number(r.id), number: String(r.number), quoteId: Number(r.quoteId), quoteNumber: String(r.quoteNumber),
    status: r.status as SalesOrderStatus, customerId: Number(r.customerId), customerName: String(r.customerName),
    jobId: r.jobId === null ? null : Number(r.jobId), jobName: str(r.jobName), warehouseId: Number(r.warehouseId),
    warehouseCode: String(r.warehouseCode), total: String(r.total), depositRequired: String(r.depositRequired),
    depositPaid: String(r.depositPaid), depositDue: depositDue(String(r.depositRequired), String(r.depositPaid)),
    createdAt: new Date(r.createdAt as Date).toISOString(),
  }
}

export async function listSalesOrders(ds: DataSource, query: { status: string; customerId?: number; specialOnly?: boolean; q?: string } & NewestPage): Promise<SalesOrderSummary[]> {
  const where = new SqlWhere()
  if (query.status === 'open') where.add("o.status IN ('booked', 'ready')")
  else if (query.status !== 'all') where.add('o.status = ?', [query.status])
  if (query.customerId) where.add('o.customer_id = ?', [query.customerId])
  if (query.specialOnly) where.add('EXISTS (SELECT 1 FROM sales_order_lines sl WHERE sl.sales_order_id = o.id AND sl.made_to_order = 1)')
  if (query.q) where.add('(o.number LIKE ? OR q.number LIKE ? OR c.name LIKE ? OR j.name LIKE ?)', Array(4).fill(containsPattern(query.q)))
  if (query.beforeId) where.add('o.id < ?', [query.beforeId])
  const rows: Row[] = await ds.query(`${SUMMARY_SQL} ${where.sql()} ORDER BY o.id DESC LIMIT ?`, [...where.params, query.limit])
  return rows.map(toSummary)
}

export async function salesOrderDetail(ds: DataSource, id: number): Promise<SalesOrderDetail> {
  const [r]: Row[] = await ds.query(`${SUMMARY_SQL} WHERE o.id = ?`, [id])
  if (!r) throw AppError.notFound('sales_order_not_found', 'That sales order was not found.')
  const lines: Row[] = await ds.query(
    `SELECT l.*, i.sku, po.id AS po_id, po.number AS po_number, po.status AS po_status,
            (SELECT COALESCE(SUM(pll.qty - pll.confirmed_qty - pll.short_qty), 0) FROM pick_list_lines pll JOIN pick_lists pl ON pl.id = pll.pick_list_id
              WHERE pll.sales_order_line_id = l.id AND pl.status IN ('draft', 'released', 'picking')) AS on_pick
       FROM sales_order_lines l JOIN items i ON i.id = l.item_id
       LEFT JOIN purchase_order_lines pl ON pl.id = l.po_line_id LEFT JOIN purchase_orders po ON po.id = pl.po_id
      WHERE l.sales_order_id = ? ORDER BY l.line_no`,
    [id],
  )
  const payments: Row[] = await ds.query(
    `SELECT p.*, u.display_name AS recorded_name FROM payments p LEFT JOIN users u ON u.id = p.recorded_by
      WHERE p.sales_order_id = ? ORDER BY p.recorded_at, p.id`,
    [id],
  )
  const summary = toSummary(r)
  const open = summary.status === 'booked' || summary.status === 'ready'
  return {
    ...summary,
    subtotal: String(r.subtotal), taxAmount: String(r.taxAmount), depositPercent: String(r.depositPercent),
    balanceDue: balanceDue(summary.total, summary.depositPaid), cancelReason: str(r.cancelReason), cancelledAt: iso(r.cancelledAt),
    createdBy: str(r.createdBy),
    lines: lines.map((l) => ({
      id: Number(l.id), lineNo: Number(l.line_no), itemId: Number(l.item_id), sku: String(l.sku), description: String(l.description),
      qty: Number(l.qty), unitPrice: String(l.unit_price), extension: String(l.extension), tax: String(l.tax), madeToOrder: Number(l.made_to_order) === 1,
      qtyReserved: Number(l.qty_reserved), qtyOnPickList: Number(l.on_pick), qtyPicked: Number(l.qty_picked), qtyHandedOver: Number(l.qty_handed_over), qtyReturned: Number(l.qty_returned),
      // Units on the order's pick list are held there, not missing: only what nothing holds is short.
      qtyShort: open && Number(l.made_to_order) !== 1
        ? Math.max(0, Number(l.qty) - Number(l.qty_cancelled) - Number(l.qty_reserved) - Number(l.on_pick) - Number(l.qty_picked))
        : 0,
      poLineId: l.po_line_id === null ? null : Number(l.po_line_id), poId: l.po_id === null ? null : Number(l.po_id), poNumber: str(l.po_number), poStatus: str(l.po_status),
    })),
    payments: payments.map((p) => ({
      id: Number(p.id), method: p.method as PaymentMethod, amount: String(p.amount), status: p.status as PaymentStatus, reference: str(p.reference),
      recordedBy: str(p.recorded_name), recordedAt: new Date(p.recorded_at as Date).toISOString(), refundedAmount: String(p.refunded_amount),
    })),
  }
}
