// The stock ledger read back: stock_moves with the names people read (SKU, bin, lot, who), filtered,
// sorted and paged on the server. Sorting is by a whitelisted column, always ending in the move id,
// so pages never overlap or skip a row.
import type { DataSource } from 'typeorm'
import type { MoveType, StockUnit } from '../../shared/catalog.js'
import type { LedgerPage, LedgerQuery, LedgerRow, LedgerSort } from '../../shared/schemas/stockViews.js'
import { SqlWhere } from '../db/sqlWhere.js'
import { pickNumber } from './picking/pickListLocks.js'

export type LedgerFilters = Omit<LedgerQuery, 'page' | 'pageSize'>

const SORT_COLUMNS: Record<LedgerSort, string> = {
  at: 'm.at',
  sku: 'i.sku',
  warehouse: 'w.code',
  bin: 'bn.code',
  lot: 'l.code',
  moveType: 'm.move_type',
  qty: 'm.qty',
  user: 'u.display_name',
  doc: 'm.doc_type, m.doc_id',
}

const DAY = /^\d{4}-\d{2}-\d{2}$/

/** A day means that day in UTC; `to` as a day reaches through its end. */
function bound(value: string, end: boolean): Date {
  if (!DAY.test(value)) return new Date(value)
  const d = new Date(value + 'T00:00:00.000Z')
  if (end) d.setUTCDate(d.getUTCDate() + 1)
  return d
}

/** WHERE over stock_moves m only, so counting needs no joins. */
export function ledgerWhere(f: LedgerFilters): SqlWhere {
  return new SqlWhere()
    .add('m.item_id = ?', [f.itemId], !!f.itemId)
    .add('m.warehouse_id = ?', [f.warehouseId], !!f.warehouseId)
    .add('m.bin_id = ?', [f.binId], !!f.binId)
    .add('m.lot_id = ?', [f.lotId], !!f.lotId)
    .add('m.doc_type = ?', [f.docType], !!f.docType)
    .add('m.doc_id = ?', [f.docId], !!f.docId)
    .add('m.move_type IN (?)', [f.moveType], !!f.moveType?.length)
    .add('m.at >= ?', [f.from && bound(f.from, false)], !!f.from)
    .add('m.at < ?', [f.to && bound(f.to, true)], !!f.to)
}

export function ledgerOrder(f: Pick<LedgerFilters, 'sort' | 'dir'>): string {
  const dir = f.dir === 'asc' ? 'ASC' : 'DESC'
  return SORT_COLUMNS[f.sort].split(', ').map((c) => `${c} ${dir}`).concat(`m.id ${dir}`).join(', ')
}

export const LEDGER_SELECT = `
  SELECT m.id, m.at, m.move_type, m.item_id, i.sku, i.name AS item_name, i.stock_unit, m.warehouse_id, w.code AS warehouse_code,
         m.bin_id, bn.code AS bin_code, m.lot_id, l.code AS lot_code, m.qty, m.unit_cost, m.doc_type, m.doc_id, m.doc_line_id,
         m.reason, m.note, m.batch_id, u.display_name AS user_name, po.number AS po_number, j.name AS job_name
    FROM stock_moves m
    JOIN items i ON i.id = m.item_id
    JOIN warehouses w ON w.id = m.warehouse_id
    JOIN bins bn ON bn.id = m.bin_id
    LEFT JOIN lots l ON l.id = m.lot_id
    LEFT JOIN users u ON u.id = m.user_id
    LEFT JOIN purchase_orders po ON m.doc_type = 'purchase_order' AND po.id = m.doc_id
    LEFT JOIN jobs j ON m.doc_type = 'job' AND j.id = m.doc_id`

export interface LedgerSqlRow {
  id: string; at: Date; move_type: MoveType; item_id: number; sku: string; item_name: string; stock_unit: StockUnit
  warehouse_id: number; warehouse_code: string; bin_id: number; bin_code: string; lot_id: number | null; lot_code: string | null
  qty: number; unit_cost: string | null; doc_type: string | null; doc_id: number | null; doc_line_id: number | null
  reason: string | null; note: string | null; batch_id: string; user_name: string | null; po_number: string | null; job_name: string | null
}

/** What people call the document a move belongs to: the PO's or pick list's number, the job's name (null: none). */
export function documentReference(r: Pick<LedgerSqlRow, 'doc_type' | 'doc_id' | 'po_number' | 'job_name'>): string | null {
  switch (r.doc_type) {
    case 'purchase_order': return r.po_number
    case 'pick_list':
    case 'pick_transfer': return r.doc_id === null ? null : pickNumber(Number(r.doc_id))
    case 'job': return r.job_name
    default: return null
  }
}

export function toLedgerRow(r: LedgerSqlRow): LedgerRow {
  return {
    id: String(r.id), at: new Date(r.at).toISOString(), moveType: r.move_type, itemId: r.item_id, sku: r.sku, itemName: r.item_name,
    stockUnit: r.stock_unit, warehouseId: r.warehouse_id, warehouseCode: r.warehouse_code, binId: r.bin_id, binCode: r.bin_code,
    lotId: r.lot_id, lotCode: r.lot_code, qty: r.qty, unitCost: r.unit_cost, docType: r.doc_type, docId: r.doc_id, docRef: documentReference(r),
    docLineId: r.doc_line_id, reason: r.reason, note: r.note, batchId: r.batch_id, userName: r.user_name,
  }
}

export async function countLedger(ds: DataSource, f: LedgerFilters): Promise<number> {
  const where = ledgerWhere(f)
  const [row] = await ds.query(`SELECT COUNT(*) AS n FROM stock_moves m ${where.sql()}`, where.params)
  return Number(row.n)
}

export async function ledgerPage(ds: DataSource, q: LedgerQuery): Promise<LedgerPage> {
  const where = ledgerWhere(q)
  const offset = (q.page - 1) * q.pageSize
  const [total, rows] = await Promise.all([
    countLedger(ds, q),
    ds.query(`${LEDGER_SELECT} ${where.sql()} ORDER BY ${ledgerOrder(q)} LIMIT ? OFFSET ?`, [...where.params, q.pageSize, offset]) as Promise<LedgerSqlRow[]>,
  ])
  return { rows: rows.map(toLedgerRow), total, page: q.page, pageSize: q.pageSize }
}
