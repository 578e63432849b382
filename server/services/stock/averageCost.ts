// Moving-average unit cost per item and warehouse, updated on every receipt (and transfer in).
// The item_warehouses row is locked first, then the warehouse's on-hand read with a locking read,
// so two receipts of one item into one warehouse apply one after the other.
import type { EntityManager } from 'typeorm'
import { applyReceipt } from '../../../shared/inventory/movingAverage.js'
import { ItemWarehouse } from '../../entities/ItemWarehouse.js'
import { AppError } from '../../errors.js'

export async function lockItemWarehouse(em: EntityManager, itemId: number, warehouseId: number): Promise<ItemWarehouse> {
  // ON DUPLICATE KEY UPDATE takes an exclusive lock on an existing row; INSERT IGNORE took a shared one, and two
  // receipts holding it both waited to upgrade to FOR UPDATE: a deadlock on every concurrent receipt or transfer-in.
  await em.query(
    'INSERT INTO item_warehouses (item_id, warehouse_id, avg_cost) VALUES (?, ?, 0) ON DUPLICATE KEY UPDATE avg_cost = avg_cost',
    [itemId, warehouseId],
  ).catch((err: { errno?: number; driverError?: { errno?: number } }) => {
    // 1452: the item (or warehouse) does not exist; answer 404, not a failed lookup's 500.
    if ((err?.errno ?? err?.driverError?.errno) === 1452) throw AppError.notFound(`Item ${itemId} or warehouse ${warehouseId}`)
    throw err
  })
  return em.findOneOrFail(ItemWarehouse, { where: { itemId, warehouseId }, lock: { mode: 'pessimistic_write' } })
}

async function warehouseOnHand(em: EntityManager, itemId: number, warehouseId: number): Promise<number> {
  // FORCE INDEX: left to itself the optimizer may scan a small table, and the shared locks then cover the
  // item's balances in every warehouse, so transfers in deadlocked with bin moves at the shipping end.
  const [row] = await em.query(
    'SELECT COALESCE(SUM(on_hand), 0) AS qty FROM stock_balances FORCE INDEX (ix_balance_item_wh) WHERE item_id = ? AND warehouse_id = ? LOCK IN SHARE MODE',
    [itemId, warehouseId],
  )
  return Number(row.qty)
}

/**
 * Call before the receipt's moves are applied: the average blends the stock already there.
 * `pendingQty`: units of this item and warehouse taken in earlier in the same operation whose moves
 * are not applied yet (a receipt with two lines of one item), so the second line blends with the first.
 */
export async function averageInReceipt(
  em: EntityManager,
  itemId: number,
  warehouseId: number,
  qty: number,
  unitCost: string,
  pendingQty = 0,
): Promise<string> {
  const row = await lockItemWarehouse(em, itemId, warehouseId)
  const onHand = (await warehouseOnHand(em, itemId, warehouseId)) + pendingQty
  const step = applyReceipt({ onHand, averageCost: row.avgCost }, qty, unitCost)
  await em.update(ItemWarehouse, { itemId, warehouseId }, { avgCost: step.after.averageCost })
  return step.after.averageCost
}

export async function currentAverage(em: EntityManager, itemId: number, warehouseId: number): Promise<string> {
  const row = await em.findOneBy(ItemWarehouse, { itemId, warehouseId })
  return row ? row.avgCost : '0.0000'
}
