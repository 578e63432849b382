// On-order quantity per item and warehouse: what open purchase orders still bring in.
// Feeds the reorder suggestions' inventory position (on hand + on order − reserved).
import type { EntityManager } from 'typeorm'
import { OPEN_PO_STATUSES } from '../entities/PurchaseOrder.js'

export async function onOrderByItemWarehouse(em: EntityManager): Promise<Map<string, number>> {
  const rows: { item_id: number; warehouse_id: number; qty: string }[] = await em.query(
    `SELECT l.item_id, o.warehouse_id, SUM(l.qty_ordered - l.qty_received) AS qty
       FROM purchase_order_lines l JOIN purchase_orders o ON o.id = l.po_id
      WHERE o.status IN (${OPEN_PO_STATUSES.map(() => '?').join(',')})
      GROUP BY l.item_id, o.warehouse_id
     HAVING qty > 0`,
    OPEN_PO_STATUSES,
  )
  return new Map(rows.map((r) => [`${r.item_id}:${r.warehouse_id}`, Number(r.qty)]))
}
