// What a warehouse has available to pick, in the shape allocateStock reads. Transit bins never
// count: stock there is on its way in, not on a shelf.
import type { EntityManager } from 'typeorm'
import type { StockRow } from '../../../shared/inventory/allocation.js'

interface RowData {
  bin_id: number
  bin_code: string
  lot_id: number | null
  lot_code: string | null
  received_at: string | Date | null
  on_hand: number
  available: number
}

// Stock without a lot has no age of its own; it sorts as oldest, so it is used up first.
const NO_LOT_AGE = '1970-01-01'

export async function availableRows(em: EntityManager, itemId: number, warehouseId: number): Promise<StockRow[]> {
  const rows = (await em.query(
    `SELECT sb.bin_id, b.code AS bin_code, sb.lot_id, l.code AS lot_code, l.received_at, sb.on_hand, sb.on_hand - sb.reserved AS available
       FROM stock_balances sb
       JOIN bins b ON b.id = sb.bin_id
       LEFT JOIN lots l ON l.id = sb.lot_id
      WHERE sb.item_id = ? AND sb.warehouse_id = ? AND b.kind <> 'transit' AND b.active = 1 AND sb.on_hand > sb.reserved
      ORDER BY sb.bin_id, sb.lot_id`,
    [itemId, warehouseId],
  )) as RowData[]
  return rows.map((r) => ({
    binId: Number(r.bin_id),
    binCode: r.bin_code,
    lotId: r.lot_id === null ? null : Number(r.lot_id),
    lotCode: r.lot_code,
    receivedAt: r.received_at === null ? NO_LOT_AGE : r.received_at instanceof Date ? r.received_at : String(r.received_at),
    onHand: Number(r.on_hand),
    available: Number(r.available),
  }))
}

/** Available (outside transit bins) per item and warehouse: item id → warehouse id → units. */
export async function availableByWarehouse(em: EntityManager, itemIds: readonly number[]): Promise<Map<number, Map<number, number>>> {
  const out = new Map<number, Map<number, number>>()
  if (!itemIds.length) return out
  const rows = (await em.query(
    `SELECT sb.item_id, sb.warehouse_id, SUM(sb.on_hand - sb.reserved) AS available
       FROM stock_balances sb JOIN bins b ON b.id = sb.bin_id
      WHERE sb.item_id IN (?) AND b.kind <> 'transit' AND b.active = 1
      GROUP BY sb.item_id, sb.warehouse_id`,
    [itemIds],
  )) as { item_id: number; warehouse_id: number; available: string | number }[]
  for (const r of rows) {
    const byWh = out.get(Number(r.item_id)) ?? new Map<number, number>()
    byWh.set(Number(r.warehouse_id), Number(r.available))
    out.set(Number(r.item_id), byWh)
  }
  return out
}
