// Moving-average unit cost per item and warehouse, updated on every receipt (and transfer in).
// The item_warehouses row is locked first, then the warehouse's on-hand read with a locking read,
// so two receipts of one item into one warehouse apply one after the other.
import type { EntityManager } from 'typeorm'
import { applyReceipt } from '../../../shared/inventory/movingAverage.js'
import { ItemWarehouse } from '../../entities/ItemWarehouse.js'

export async function lockItemWarehouse(em: EntityManager, itemId: number, warehouseId: number): Promise<ItemWarehouse> {
  await em.query('INSERT IGNORE INTO item_warehouses (item_id, warehouse_id, avg_cost) VALUES (?, ?, 0)', [itemId, warehouseId])
  return em.findOneOrFail(ItemWarehouse, { where: { itemId, warehouseId }, lock: { mode: 'pessimistic_write' } })
}

async function warehouseOnHand(em: EntityManager, itemId: number, warehouseId: number): Promise<number> {
  const [row] = await em.query(
    'SELECT COALESCE(SUM(on_hand), 0) AS qty FROM stock_balances WHERE item_id = ? AND warehouse_id = ? LOCK IN SHARE MODE',
    [itemId, warehouseId],
  )
  return Number(row.qty)
}

/** Call before the receipt's moves are applied: the average blends the stock already there. */
export async function averageInReceipt(
  em: EntityManager,
  itemId: number,
  warehouseId: number,
  qty: number,
  unitCost: string,
): Promise<string> {
  const row = await lockItemWarehouse(em, itemId, warehouseId)
  const onHand = await warehouseOnHand(em, itemId, warehouseId)
  const step = applyReceipt({ onHand, averageCost: row.avgCost }, qty, unitCost)
  await em.update(ItemWarehouse, { itemId, warehouseId }, { avgCost: step.after.averageCost })
  return step.after.averageCost
}

export async function currentAverage(em: EntityManager, itemId: number, warehouseId: number): Promise<string> {
  const row = await em.findOneBy(ItemWarehouse, { itemId, warehouseId })
  return row ? row.avgCost : '0.0000'
}
