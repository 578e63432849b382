// Receipts of a PO as the screens show them, with what a lot label needs (SKU, GTIN, lot code).
import type { DataSource, EntityManager } from 'typeorm'
import type { ReceiptLineView, ReceiptView } from '../../../shared/schemas/purchasingViews.js'
import { AppError } from '../../errors.js'
import { isoInstant } from './sqlValues.js'

type Db = EntityManager | DataSource

interface ReceiptRow { id: number; po_id: number; received_at: Date; received_by_name: string | null; note: string | null }
interface ReceiptLineRow {
  id: number; receipt_id: number; po_line_id: number; item_id: number; sku: string; item_name: string; gtin: string | null
  bin_code: string; lot_id: number | null; lot_code: string | null; qty: number; qty_damaged: number
  variance: ReceiptLineView['variance']; reason: string | null; issued_to_job_id: number | null
}

async function load(db: Db, where: string, param: number): Promise<ReceiptView[]> {
  const receipts: ReceiptRow[] = await db.query(
    `SELECT r.id, r.po_id, r.received_at, u.display_name AS received_by_name, r.note
       FROM po_receipts r LEFT JOIN users u ON u.id = r.received_by WHERE ${where} ORDER BY r.id`,
    [param],
  )
  if (!receipts.length) return []
  const ids = receipts.map((r) => r.id)
  const lines: ReceiptLineRow[] = await db.query(
    `SELECT rl.*, i.sku, i.name AS item_name, i.gtin, b.code AS bin_code, lt.code AS lot_code
       FROM po_receipt_lines rl JOIN items i ON i.id = rl.item_id JOIN bins b ON b.id = rl.bin_id LEFT JOIN lots lt ON lt.id = rl.lot_id
      WHERE rl.receipt_id IN (${ids.map(() => '?').join(',')}) ORDER BY rl.id`,
    ids,
  )
  return receipts.map((r) => ({
    id: r.id,
    poId: r.po_id,
    receivedAt: isoInstant(r.received_at)!,
    receivedBy: r.received_by_name,
    note: r.note,
    lines: lines.filter((l) => l.receipt_id === r.id).map((l) => ({
      id: l.id, poLineId: l.po_line_id, itemId: l.item_id, sku: l.sku, itemName: l.item_name, gtin: l.gtin, binCode: l.bin_code,
      lotId: l.lot_id, lotCode: l.lot_code, qty: l.qty, qtyDamaged: l.qty_damaged, variance: l.variance, reason: l.reason,
      issuedToJobId: l.issued_to_job_id,
    })),
  }))
}

export const receiptsOfPo = (db: Db, poId: number) => load(db, 'r.po_id = ?', poId)

export async function receiptById(db: Db, id: number): Promise<ReceiptView> {
  const [receipt] = await load(db, 'r.id = ?', id)
  if (!receipt) throw AppError.notFound('receipt_not_found', 'That receipt was not found.')
  return receipt
}

/** Bins a receipt may go into: the ship-to warehouse's active bins, receiving bins first. */
export async function receivingBins(db: Db, warehouseId: number): Promise<{ id: number; code: string; kind: string }[]> {
  return db.query(
    `SELECT id, code, kind FROM bins WHERE warehouse_id = ? AND active = 1 AND kind <> 'transit'
      ORDER BY kind = 'receiving' DESC, code`,
    [warehouseId],
  )
}
