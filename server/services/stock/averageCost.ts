// Moving-average unit cost per item and warehouse, blended by every move that brings stock into a
// warehouse at a cost (a receipt, a transfer in). applyMoves locks the cost rows first, exclusively and
// sorted, then the item's whole balance group in that warehouse in the one balance order (see
// balanceLocks.ts), so the on hand the average blends with cannot change under it and nothing waits
// to upgrade a shared lock.
import type { EntityManager } from 'typeorm'
import type { MoveType } from '../../../shared/catalog.js'
import { applyReceipt } from '../../../shared/inventory/movingAverage.js'
import { ItemWarehouse } from '../../entities/ItemWarehouse.js'
import { AppError } from '../../errors.js'
import { groupKey, type WarehouseGroup } from './balanceLocks.js'

/** Moves that blend their unit cost into the receiving warehouse's average. */
export const COSTED_IN: ReadonlySet<MoveType> = new Set<MoveType>(['receipt', 'transfer_in', 'opening'])

/** Creates missing cost rows and locks them all exclusively, in (item, warehouse) order. Returns the averages. */
export async function lockCostRows(em: EntityManager, groups: readonly WarehouseGroup[]): Promise<Map<string, string>> {
  const sorted = [...groups].sort((a, b) => a.itemId - b.itemId || a.warehouseId - b.warehouseId)
  if (!sorted.length) return new Map()
  // ON DUPLICATE KEY UPDATE takes an exclusive lock on an existing row (INSERT IGNORE took a shared one).
  await em.query(
    `INSERT INTO item_warehouses (item_id, warehouse_id, avg_cost) VALUES ${sorted.map(() => '(?, ?, 0)').join(', ')} ON DUPLICATE KEY UPDATE avg_cost = avg_cost`,
    sorted.flatMap((g) => [g.itemId, g.warehouseId]),
  ).catch((err: { errno?: number; driverError?: { errno?: number } }) => {
    // 1452: the item (or warehouse) does not exist; answer 404, not a failed lookup's 500.
    if ((err?.errno ?? err?.driverError?.errno) === 1452) throw AppError.notFound('item_or_warehouse_not_found', 'That item or warehouse was not found.')
    throw err
  })
  // Already locked by the insert; a locking read sees the latest committed average, not a snapshot.
  const rows: { item_id: number; warehouse_id: number; avg_cost: string }[] = await em.query(
    `SELECT item_id, warehouse_id, avg_cost FROM item_warehouses WHERE (item_id, warehouse_id) IN (${sorted.map(() => '(?, ?)').join(', ')}) FOR UPDATE`,
    sorted.flatMap((g) => [g.itemId, g.warehouseId]),
  )
  return new Map(rows.map((r) => [groupKey({ itemId: r.item_id, warehouseId: r.warehouse_id }), r.avg_cost]))
}

/**
 * Blends the costed moves, in order, into the averages: each move sees the on hand before the operation
 * plus what earlier moves of the same operation brought in. Writes the changed averages.
 */
export async function blendAverages(
  em: EntityManager,
  averages: Map<string, string>,
  groupOnHand: Map<string, number>,
  moves: readonly { itemId: number; warehouseId: number; qty: number; unitCost: string }[],
): Promise<void> {
  const onHand = new Map(groupOnHand)
  const changed = new Set<string>()
  for (const m of moves) {
    const gk = groupKey(m)
    const step = applyReceipt({ onHand: onHand.get(gk) ?? 0, averageCost: averages.get(gk) ?? '0.0000' }, m.qty, m.unitCost)
    averages.set(gk, step.after.averageCost)
    onHand.set(gk, step.after.onHand)
    changed.add(gk)
  }
  await writeAverages(em, [...changed].map((gk) => [gk, averages.get(gk)!]))
}

/** Writes averages keyed by groupKey, many rows per statement (the rows are locked already). */
export async function writeAverages(em: EntityManager, averages: readonly (readonly [string, string])[]): Promise<void> {
  for (let i = 0; i < averages.length; i += 1000) {
    const chunk = averages.slice(i, i + 1000)
    await em.query(
      `INSERT INTO item_warehouses (item_id, warehouse_id, avg_cost) VALUES ${chunk.map(() => '(?, ?, ?)').join(', ')} ON DUPLICATE KEY UPDATE avg_cost = VALUES(avg_cost)`,
      chunk.flatMap(([gk, avg]) => [...gk.split(':').map(Number), avg]),
    )
  }
}

export async function currentAverage(em: EntityManager, itemId: number, warehouseId: number): Promise<string> {
  const row = await em.findOneBy(ItemWarehouse, { itemId, warehouseId })
  return row ? row.avgCost : '0.0000'
}
