// Reading purchase orders for the screens: list, detail with lines, timeline and mail attempts.
// Costs are always in the answer; the cost rule (services/costVisibility.ts) leaves them out for callers who may not see them.
import type { DataSource, EntityManager } from 'typeorm'
import type { PoListQuery, PoStatus } from '../../../shared/schemas/purchasing.js'
import { dayEnd, dayStart } from '../../../shared/reports/zonedDays.js'
import { SqlWhere } from '../../db/sqlWhere.js'
import type { PoDetail, PoLineView, PoSummary, PoTimelineEntry } from '../../../shared/schemas/purchasingViews.js'
import { lineTotal } from '../../../shared/purchasing/poMoney.js'
import { parseSpec, specText } from '../../../shared/purchasing/specText.js'
import { AppError } from '../../errors.js'
import { listOutbox } from './outboxRead.js'
import { containsPattern } from '../../db/likePattern.js'
import { isoDay as dateOnly, isoInstant as iso } from './sqlValues.js'

type Db = EntityManager | DataSource


const SUMMARY_SQL = `SELECT o.*, v.code AS v_code, v.name AS v_name, v.email AS v_email, v.contact_name AS v_contact, v.phone AS v_phone,
    v.address AS v_address, v.terms AS v_terms, w.code AS w_code, w.name AS w_name, w.address AS w_address,
    j.name AS j_name, j.due_date AS j_due, (SELECT COUNT(*) FROM purchase_order_lines l WHERE l.po_id = o.id) AS line_count
  FROM purchase_orders o JOIN vendors v ON v.id = o.vendor_id JOIN warehouses w ON w.id = o.warehouse_id LEFT JOIN jobs j ON j.id = o.job_id`

type PoRow = Record<string, unknown> & { id: number; number: string; status: PoStatus; total: string }

function summaryOf(r: PoRow): PoSummary {
  const summary = summaryFields(r)
  const due = summary.job?.dueDate
  const open = !['received', 'closed', 'cancelled'].includes(summary.status)
  return { ...summary, arrivesAfterDue: !!(open && due && summary.expectedDate && summary.expectedDate > due) }
}

function summaryFields(r: PoRow): PoSummary {
  return {
    id: r.id,
    number: r.number,
    status: r.status,
    vendor: { id: r.vendor_id as number, code: r.v_code as string, name: r.v_name as string },
    warehouse: { id: r.warehouse_id as number, code: r.w_code as string, name: r.w_name as string },
    job: r.job_id ? { id: r.job_id as number, name: r.j_name as string, dueDate: dateOnly(r.j_due as string | null) } : null,
    currency: r.currency as string,
    expectedDate: dateOnly(r.expected_date as string | null),
    createdAt: iso(r.created_at as Date)!,
    lineCount: Number(r.line_count),
    orderTotal: r.total,
    version: Number(r.version),
    arrivesAfterDue: false,
  }
}

export type PoFilter = Pick<PoListQuery, 'status' | 'vendorId' | 'q' | 'expectedFrom' | 'expectedTo' | 'sentFrom' | 'sentTo'> & { tz?: string }

/**
 * The list's filter as SQL over `purchase_orders o` (with `vendors v` and `jobs j` joined for the search).
 * The start page counts its purchasing figures with this same filter, so a figure and its list agree.
 */
export function poFilterSql(filter: PoFilter): { sql: string; params: unknown[] } {
  const tz = filter.tz ?? 'UTC'
  const where = new SqlWhere()
    .add(`o.status IN (${filter.status.map(() => '?').join(',')})`, filter.status, filter.status.length > 0)
    .add('o.vendor_id = ?', [filter.vendorId], !!filter.vendorId)
    .add('o.expected_date >= ?', [filter.expectedFrom], !!filter.expectedFrom)
    .add('o.expected_date <= ?', [filter.expectedTo], !!filter.expectedTo)
    .add('o.sent_at >= ?', [filter.sentFrom && dayStart(filter.sentFrom, tz)], !!filter.sentFrom)
    .add('o.sent_at < ?', [filter.sentTo && dayEnd(filter.sentTo, tz)], !!filter.sentTo)
  if (filter.q) {
    const like = containsPattern(filter.q)
    where.add('(o.number LIKE ? OR v.name LIKE ? OR j.name LIKE ?)', [like, like, like])
  }
  return { sql: where.sql(), params: where.params }
}

export async function listPurchaseOrders(db: Db, filter: PoFilter): Promise<PoSummary[]> {
  const where = poFilterSql(filter)
  const rows: PoRow[] = await db.query(`${SUMMARY_SQL} ${where.sql} ORDER BY o.id DESC LIMIT 500`, where.params)
  return rows.map(summaryOf)
}

interface LineRow {
  id: number; line_no: number; item_id: number; sku: string; item_name: string; gtin: string | null; stock_unit: string
  made_to_order: number; match_lot: number; vendor_sku: string | null; description: string; spec_json: string | null
  bom_line_id: number | null; pack_qty: number; packs_ordered: number; qty_ordered: number; qty_received: number
  qty_damaged: number; unit_cost: string
}

function lineOf(r: LineRow): PoLineView {
  const spec = parseSpec(r.spec_json)
  return {
    id: r.id, lineNo: r.line_no, itemId: r.item_id, sku: r.sku, itemName: r.item_name, gtin: r.gtin, stockUnit: r.stock_unit,
    madeToOrder: !!Number(r.made_to_order), matchLot: !!Number(r.match_lot), vendorSku: r.vendor_sku, description: r.description,
    spec, specText: specText(spec), bomLineId: r.bom_line_id, packQty: r.pack_qty, packsOrdered: r.packs_ordered,
    qtyOrdered: r.qty_ordered, qtyReceived: r.qty_received, qtyDamaged: r.qty_damaged,
    unitCost: r.unit_cost, lineTotal: lineTotal(r.unit_cost, r.qty_ordered),
  }
}

export async function poLines(db: Db, poId: number): Promise<PoLineView[]> {
  const rows: LineRow[] = await db.query(
    `SELECT l.*, i.sku, i.name AS item_name, i.gtin, i.stock_unit, i.made_to_order, i.match_lot
       FROM purchase_order_lines l JOIN items i ON i.id = l.item_id WHERE l.po_id = ? ORDER BY l.line_no`,
    [poId],
  )
  return rows.map(lineOf)
}

const STEP_ORDER: Record<PoTimelineEntry['event'], number> = { created: 0, approved: 1, sent: 2, delivery: 3, received: 4, closed: 5, cancelled: 5 }

async function timelineOf(db: Db, r: PoRow): Promise<PoTimelineEntry[]> {
  const steps: [PoTimelineEntry['event'], string, string, string | null][] = [
    ['created', 'created_at', 'created_by', null],
    ['approved', 'approved_at', 'approved_by', null],
    ['sent', 'sent_at', 'sent_by', null],
    ['received', 'received_at', 'received_by', null],
    ['closed', 'closed_at', 'closed_by', 'close_reason'],
    ['cancelled', 'cancelled_at', 'cancelled_by', 'cancel_reason'],
  ]
  const ids = [...new Set(steps.map(([, , by]) => r[by]).filter((v): v is number => typeof v === 'number'))]
  const users: { id: number; display_name: string }[] = ids.length
    ? await db.query(`SELECT id, display_name FROM users WHERE id IN (${ids.map(() => '?').join(',')})`, ids)
    : []
  const names = new Map(users.map((u) => [u.id, u.display_name]))
  const stamped: PoTimelineEntry[] = steps
    .filter(([, at]) => r[at])
    .map(([event, at, by, note]) => ({
      event,
      at: iso(r[at] as Date)!,
      by: names.get(r[by] as number) ?? null,
      ...(note ? { note: (r[note] as string | null) ?? null } : {}),
    }))
  // Every delivery, the partial ones too: what came in, when and who took it.
  const receipts: { received_at: Date; by_name: string | null; qty: string; damaged: string }[] = await db.query(
    `SELECT rc.received_at, u.display_name AS by_name, SUM(rl.qty) AS qty, SUM(rl.qty_damaged) AS damaged
       FROM po_receipts rc JOIN po_receipt_lines rl ON rl.receipt_id = rc.id LEFT JOIN users u ON u.id = rc.received_by
      WHERE rc.po_id = ? GROUP BY rc.id, rc.received_at, u.display_name ORDER BY rc.id`,
    [r.id],
  )
  const deliveries: PoTimelineEntry[] = receipts.map((d) => ({
    event: 'delivery', at: iso(d.received_at)!, by: d.by_name, qty: Number(d.qty), damaged: Number(d.damaged),
  }))
  // The order's life is one way, so its steps read in that order (clock stamps of one transaction can tie
  // or differ by a second either way); deliveries sit between sending and "received in full", oldest first.
  return [...stamped, ...deliveries].sort((a, b) => STEP_ORDER[a.event] - STEP_ORDER[b.event] || a.at.localeCompare(b.at))
}

export async function poDetail(db: Db, id: number): Promise<PoDetail> {
  const [r]: PoRow[] = await db.query(`${SUMMARY_SQL} WHERE o.id = ?`, [id])
  if (!r) throw AppError.notFound('po_not_found', 'That purchase order was not found.')
  const base = summaryOf(r)
  return {
    ...base,
    vendor: { ...base.vendor, email: r.v_email as string | null, contactName: r.v_contact as string | null, phone: r.v_phone as string | null,
      address: r.v_address as string | null, terms: r.v_terms as string | null },
    warehouse: { ...base.warehouse, address: r.w_address as string | null },
    notes: r.notes as string | null,
    sendError: r.send_error as string | null,
    closeReason: r.close_reason as string | null,
    cancelReason: r.cancel_reason as string | null,
    timeline: await timelineOf(db, r),
    lines: await poLines(db, id),
    messages: (await listOutbox(db, { poId: id })).map(({ bodyText: _body, ...m }) => m),
  }
}
