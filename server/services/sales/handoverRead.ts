// Reading fulfilment: per order line how far it got (held, on a pick list, picked and waiting, on open
// tickets, handed over, backordered, cancelled), the order's pick lists and tickets; one ticket with its
// lines by bin and lot, weights and handling cautions; the open tickets the warehouse dispatches.
import { SqlWhere } from '../../db/sqlWhere.js'
import type { DataSource } from 'typeorm'
import { lineHandling } from '../../../shared/picking/handling.js'
import type { HandoverKind, HandoverStatus } from '../../../shared/sales/handoverTerms.js'
import type { SalesOrderStatus } from '../../../shared/sales/salesOrderTerms.js'
import type { FulfilmentLine, OrderFulfilment, TicketDetail, TicketSummary } from '../../../shared/schemas/handover.js'
import { NEWEST_PAGE_MAX, type NewestPage } from '../../../shared/schemas/newestPage.js'
import type { PickListStatus } from '../../../shared/schemas/picking.js'
import { Decimal } from 'decimal.js'
import { containsPattern } from '../../db/likePattern.js'
import { AppError } from '../../errors.js'
import { pickNumber } from '../picking/pickListLocks.js'

type Row = Record<string, string | number | null | Date>
const str = (v: unknown) => (v === null || v === undefined ? null : String(v))
const iso = (v: unknown) => (v === null || v === undefined ? null : new Date(v as Date).toISOString())

const SUMMARY_SQL = `SELECT t.id, t.number, t.sales_order_id, o.number AS order_number, c.name AS customer_name, j.name AS job_name, t.kind, t.status,
    t.created_at, t.signed_at, (SELECT COALESCE(SUM(tl.qty), 0) FROM handover_ticket_lines tl WHERE tl.ticket_id = t.id) AS qty
  FROM handover_tickets t JOIN sales_orders o ON o.id = t.sales_order_id JOIN customers c ON c.id = o.customer_id LEFT JOIN jobs j ON j.id = o.job_id`

function toSummary(r: Row): TicketSummary {
  return {
    id: Number(r.id), number: String(r.number), salesOrderId: Number(r.sales_order_id), orderNumber: String(r.order_number),
    customerName: String(r.customer_name), jobName: str(r.job_name), kind: r.kind as HandoverKind, status: r.status as HandoverStatus,
    qty: Number(r.qty), createdAt: iso(r.created_at)!, signedAt: iso(r.signed_at),
  }
}

export async function listTickets(ds: DataSource, query: { status: string; orderId?: number; q?: string } & Partial<NewestPage>): Promise<TicketSummary[]> {
  const where = new SqlWhere()
  if (query.status !== 'all') where.add('t.status = ?', [query.status])
  if (query.orderId) where.add('t.sales_order_id = ?', [query.orderId])
  if (query.q) where.add('(t.number LIKE ? OR o.number LIKE ? OR c.name LIKE ?)', Array(3).fill(containsPattern(query.q)))
  if (query.beforeId) where.add('t.id < ?', [query.beforeId])
  // An order's own tickets come whole; the dispatch list a page at a time.
  const page = query.orderId ? { sql: '', params: [] } : { sql: 'LIMIT ?', params: [query.limit ?? NEWEST_PAGE_MAX] }
  const rows: Row[] = await ds.query(`${SUMMARY_SQL} ${where.sql()} ORDER BY t.id DESC ${page.sql}`, [...where.params, ...page.params])
  return rows.map(toSummary)
}

export async function ticketDetail(ds: DataSource, id: number): Promise<TicketDetail> {
  const [r]: Row[] = await ds.query(
    `${SUMMARY_SQL.replace('SELECT t.id,', `SELECT w.code AS warehouse_code, t.deliver_to, t.note, t.signer_name, su.display_name AS signed_name,
       cu.display_name AS created_name, t.signature_png IS NOT NULL AS has_signature, t.id,`)}
      JOIN warehouses w ON w.id = o.warehouse_id LEFT JOIN users su ON su.id = t.signed_by LEFT JOIN users cu ON cu.id = t.created_by
     WHERE t.id = ?`,
    [id],
  )
  if (!r) throw AppError.notFound('ticket_not_found', 'That handover ticket was not found.')
  const lines: Row[] = await ds.query(
    `SELECT tl.id, tl.sales_order_line_id, sl.line_no, tl.item_id, i.sku, i.name, i.family, i.stock_unit, i.weight_kg, i.case_qty, i.pallet_qty,
            b.code AS bin_code, l.code AS lot_code, tl.qty
       FROM handover_ticket_lines tl JOIN sales_order_lines sl ON sl.id = tl.sales_order_line_id JOIN items i ON i.id = tl.item_id
       JOIN bins b ON b.id = tl.bin_id LEFT JOIN lots l ON l.id = tl.lot_id
      WHERE tl.ticket_id = ? ORDER BY sl.line_no, tl.id`,
    [id],
  )
  let total = new Decimal(0)
  const views = lines.map((l) => {
    const handling = lineHandling({
      qty: Number(l.qty), weightKg: String(l.weight_kg ?? '0'), caseQty: l.case_qty === null ? null : Number(l.case_qty),
      palletQty: l.pallet_qty === null ? null : Number(l.pallet_qty), family: String(l.family),
    })
    total = total.plus(handling.totalKg)
    return {
      id: Number(l.id), salesOrderLineId: Number(l.sales_order_line_id), lineNo: Number(l.line_no), itemId: Number(l.item_id), sku: String(l.sku),
      itemName: String(l.name), family: String(l.family), stockUnit: String(l.stock_unit), binCode: String(l.bin_code), lotCode: str(l.lot_code),
      qty: Number(l.qty), totalKg: handling.totalKg, cautions: handling.cautions,
    }
  })
  return {
    ...toSummary(r), warehouseCode: String(r.warehouse_code), deliverTo: str(r.deliver_to), note: str(r.note), signerName: str(r.signer_name),
    signedBy: str(r.signed_name), createdBy: str(r.created_name), hasSignature: Number(r.has_signature) === 1, lines: views,
    totalKg: total.toFixed(1), heavy: views.some((v) => v.cautions.some((c) => c === 'team_lift' || c === 'pallet_equipment')),
  }
}

export async function ticketSignature(ds: DataSource, id: number): Promise<Buffer> {
  const [r]: { png: Buffer | null }[] = await ds.query('SELECT signature_png AS png FROM handover_tickets WHERE id = ?', [id])
  if (!r?.png) throw AppError.notFound('ticket_not_found', 'That ticket has no signature.')
  return r.png
}

export async function orderFulfilment(ds: DataSource, orderId: number): Promise<OrderFulfilment> {
  const [o]: Row[] = await ds.query('SELECT id, number, status, ready_at, ready_mailed_at FROM sales_orders WHERE id = ?', [orderId])
  if (!o) throw AppError.notFound('sales_order_not_found', 'That sales order was not found.')
  const lines: Row[] = await ds.query(
    `SELECT sl.*, i.sku,
            (SELECT COALESCE(SUM(pll.qty - pll.confirmed_qty - pll.short_qty), 0) FROM pick_list_lines pll JOIN pick_lists pl ON pl.id = pll.pick_list_id
              WHERE pll.sales_order_line_id = sl.id AND pl.status IN ('draft', 'released', 'picking')) AS on_pick,
            (SELECT COALESCE(SUM(tl.qty), 0) FROM handover_ticket_lines tl JOIN handover_tickets t ON t.id = tl.ticket_id
              WHERE tl.sales_order_line_id = sl.id AND t.status = 'open') AS on_tickets
       FROM sales_order_lines sl JOIN items i ON i.id = sl.item_id WHERE sl.sales_order_id = ? ORDER BY sl.line_no`,
    [orderId],
  )
  const lists: Row[] = await ds.query('SELECT id, status FROM pick_lists WHERE sales_order_id = ? ORDER BY id', [orderId])
  // A ready order not yet mailed shows why its last attempt failed (the outbox keeps every attempt).
  const [failed]: Row[] = o.status === 'ready' && !o.ready_mailed_at
    ? await ds.query("SELECT error FROM outbox_messages WHERE sales_order_id = ? AND status = 'failed' ORDER BY id DESC LIMIT 1", [orderId])
    : []
  return {
    orderId, orderNumber: String(o.number), status: o.status as SalesOrderStatus, readyAt: iso(o.ready_at), readyMailedAt: iso(o.ready_mailed_at),
    readyMailError: failed ? String(failed.error ?? '') : null,
    lines: lines.map((l): FulfilmentLine => {
      const picked = Number(l.qty_picked)
      const handedOver = Number(l.qty_handed_over)
      const onOpenTickets = Number(l.on_tickets)
      return {
        id: Number(l.id), lineNo: Number(l.line_no), itemId: Number(l.item_id), sku: String(l.sku), description: String(l.description),
        qty: Number(l.qty), madeToOrder: Number(l.made_to_order) === 1, held: Number(l.qty_reserved), onPickList: Number(l.on_pick),
        picked, handedOver, waiting: picked - handedOver - onOpenTickets, onOpenTickets,
        backordered: Number(l.qty_backordered), cancelled: Number(l.qty_cancelled),
      }
    }),
    pickLists: lists.map((l) => ({ id: Number(l.id), number: pickNumber(Number(l.id)), status: l.status as PickListStatus })),
    tickets: await listTickets(ds, { status: 'all', orderId }),
  }
}
