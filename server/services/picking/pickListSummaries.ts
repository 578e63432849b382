// Pick lists as lists: the warehouse's open lists, a job's or a bill of materials' lists, with
// their progress in one query; and the saved bills of materials waiting to be picked.
import type { EntityManager } from 'typeorm'
import { pickProgress, type ProgressLine } from '../../../shared/picking/pickProgress.js'
import { OPEN_PICK_STATUSES, type BomForPicking, type PickListStatus, type PickListSummary } from '../../../shared/schemas/picking.js'
import { pickNumber } from './pickListLocks.js'
import { ordersOfBillSql } from './pickPlanContext.js'

export interface SummaryFilter {
  ids?: number[]
  warehouseId?: number
  bomId?: number
  jobId?: number
  status: 'open' | 'all' | PickListStatus
}

interface SummaryRow {
  id: number; status: PickListStatus; bom_id: number | null; revision: number | null; job_id: number | null; job_name: string; customer_name: string | null
  sales_order_id: number | null; so_number: string | null
  wh_id: number; wh_code: string; wh_name: string; created_at: Date; updated_at: Date
  line_count: string; qty: string | null; confirmed: string | null; short: string | null; issued: string | null
}

const nullableId = (v: number | null) => (v === null ? null : Number(v))
const iso = (d: Date | string) => (d instanceof Date ? d.toISOString() : new Date(d).toISOString())

function whereOf(f: SummaryFilter): { sql: string; params: unknown[] } {
  const parts: string[] = []
  const params: unknown[] = []
  if (f.ids) { parts.push('pl.id IN (?)'); params.push(f.ids.length ? f.ids : [0]) }
  if (f.warehouseId) { parts.push('pl.warehouse_id = ?'); params.push(f.warehouseId) }
  if (f.bomId) { parts.push('pl.bom_id = ?'); params.push(f.bomId) }
  if (f.jobId) { parts.push('pl.job_id = ?'); params.push(f.jobId) }
  if (f.status === 'open') { parts.push('pl.status IN (?)'); params.push(OPEN_PICK_STATUSES) }
  else if (f.status !== 'all') { parts.push('pl.status = ?'); params.push(f.status) }
  return { sql: parts.length ? `WHERE ${parts.join(' AND ')}` : '', params }
}

async function transfersWaiting(em: EntityManager, ids: number[]): Promise<Map<number, PickListSummary['transfersWaiting']>> {
  const out = new Map<number, PickListSummary['transfersWaiting']>()
  if (!ids.length) return out
  const rows = (await em.query(
    `SELECT pick_list_id, from_warehouse_id, SUM(qty) AS qty FROM pick_transfer_proposals
      WHERE status = 'proposed' AND pick_list_id IN (?) GROUP BY pick_list_id, from_warehouse_id`,
    [ids],
  )) as { pick_list_id: number; from_warehouse_id: number; qty: string }[]
  for (const r of rows) {
    out.set(Number(r.pick_list_id), [...(out.get(Number(r.pick_list_id)) ?? []), { fromWarehouseId: Number(r.from_warehouse_id), qty: Number(r.qty) }])
  }
  return out
}

/** Each list's lines counted done, short, settled and left by the shared progress rule. */
async function lineStates(em: EntityManager, ids: number[]): Promise<Map<number, PickListSummary['lineStates']>> {
  const byList = new Map<number, ProgressLine[]>()
  if (ids.length) {
    const rows = (await em.query(
      `SELECT pll.pick_list_id, pll.qty, pll.confirmed_qty, pll.short_qty,
              (SELECT COALESCE(SUM(ps.qty), 0) FROM pick_shortages ps WHERE ps.pick_list_line_id = pll.id) AS settled
         FROM pick_list_lines pll WHERE pll.pick_list_id IN (?)`,
      [ids],
    )) as { pick_list_id: number; qty: number; confirmed_qty: number; short_qty: number; settled: string }[]
    for (const r of rows) {
      const line = { qty: Number(r.qty), confirmedQty: Number(r.confirmed_qty), shortQty: Number(r.short_qty), shortResolvedQty: Number(r.settled), stockUnit: '' }
      byList.set(Number(r.pick_list_id), [...(byList.get(Number(r.pick_list_id)) ?? []), line])
    }
  }
  return new Map(ids.map((id) => [id, pickProgress(byList.get(id) ?? []).lines]))
}

export async function pickListSummaries(em: EntityManager, filter: SummaryFilter): Promise<PickListSummary[]> {
  const where = whereOf(filter)
  const rows = (await em.query(
    `SELECT pl.id, pl.status, pl.bom_id, b.revision, pl.job_id, COALESCE(j.name, so.number) AS job_name, c.name AS customer_name,
            pl.sales_order_id, so.number AS so_number,
            w.id AS wh_id, w.code AS wh_code, w.name AS wh_name, pl.created_at, pl.updated_at,
            COUNT(pll.id) AS line_count, SUM(pll.qty) AS qty, SUM(pll.confirmed_qty) AS confirmed,
            SUM(pll.short_qty) AS short, SUM(pll.issued_qty) AS issued
       FROM pick_lists pl
       LEFT JOIN boms b ON b.id = pl.bom_id
       LEFT JOIN jobs j ON j.id = pl.job_id
       LEFT JOIN sales_orders so ON so.id = pl.sales_order_id
       LEFT JOIN customers c ON c.id = COALESCE(so.customer_id, j.customer_id)
       JOIN warehouses w ON w.id = pl.warehouse_id
       LEFT JOIN pick_list_lines pll ON pll.pick_list_id = pl.id
      ${where.sql}
      GROUP BY pl.id
      ORDER BY pl.id DESC
      LIMIT 300`,
    where.params,
  )) as SummaryRow[]
  const waiting = await transfersWaiting(em, rows.map((r) => Number(r.id)))
  const states = await lineStates(em, rows.map((r) => Number(r.id)))
  return rows.map((r) => ({
    id: Number(r.id), number: pickNumber(Number(r.id)), status: r.status, bomId: nullableId(r.bom_id), bomRevision: nullableId(r.revision),
    jobId: nullableId(r.job_id), jobName: r.job_name ?? '', customerName: r.customer_name ?? '',
    salesOrderId: nullableId(r.sales_order_id), salesOrderNumber: r.so_number,
    warehouse: { id: Number(r.wh_id), code: r.wh_code, name: r.wh_name },
    lineCount: Number(r.line_count), lineStates: states.get(Number(r.id))!, qty: Number(r.qty ?? 0), confirmedQty: Number(r.confirmed ?? 0), shortQty: Number(r.short ?? 0),
    issuedQty: Number(r.issued ?? 0), transfersWaiting: waiting.get(Number(r.id)) ?? [], createdAt: iso(r.created_at), updatedAt: iso(r.updated_at),
  }))
}

/** Saved bills of materials, newest first, with how much of their stocked lines is picked or on open lists. */
export async function bomsForPicking(em: EntityManager): Promise<BomForPicking[]> {
  const rows = (await em.query(
    `SELECT b.id, b.revision, b.job_id, j.name AS job_name, c.name AS customer_name, b.created_at,
            COUNT(bl.id) AS line_count, COALESCE(SUM(bl.qty), 0) AS qty, COALESCE(SUM(bl.picked_qty), 0) AS picked,
            (SELECT COALESCE(SUM(pll.qty - pll.short_qty), 0) FROM pick_list_lines pll JOIN pick_lists pl ON pl.id = pll.pick_list_id
              WHERE pl.bom_id = b.id AND pl.status IN (?)) AS open_qty
       FROM boms b
       JOIN jobs j ON j.id = b.job_id
       LEFT JOIN customers c ON c.id = j.customer_id
       LEFT JOIN bom_lines bl ON bl.bom_id = b.id AND bl.item_id IS NOT NULL AND bl.made_to_order = 0
      WHERE b.revision = (SELECT MAX(b2.revision) FROM boms b2 WHERE b2.job_id = b.job_id)
        AND NOT EXISTS (SELECT 1 ${ordersOfBillSql('b.id')})
      GROUP BY b.id
      ORDER BY b.created_at DESC, b.id DESC
      LIMIT 200`,
    [OPEN_PICK_STATUSES],
  )) as { id: number; revision: number; job_id: number; job_name: string; customer_name: string | null; created_at: Date; line_count: string; qty: string; picked: string; open_qty: string }[]
  return rows.map((r) => ({
    bomId: Number(r.id), revision: Number(r.revision), jobId: Number(r.job_id), jobName: r.job_name, customerName: r.customer_name ?? '',
    createdAt: iso(r.created_at), lines: Number(r.line_count), qty: Number(r.qty), pickedQty: Number(r.picked), openQty: Number(r.open_qty),
  }))
}
