// What each warehouse can still promise of an item: on hand less reserved, summed over its bins and
// lots, leaving out transit bins (stock on its way is not on the shelf yet).
import type { EntityManager } from 'typeorm'
import type { LineAvailability } from '../../../shared/schemas/counter.js'
import { Warehouse } from '../../entities/Warehouse.js'

export async function availabilityFor(em: EntityManager, itemIds: number[]): Promise<Map<number, LineAvailability>> {
  const ids = [...new Set(itemIds)]
  const out = new Map<number, LineAvailability>()
  if (ids.length === 0) return out
  const warehouses = await em.find(Warehouse, { where: { active: true }, order: { code: 'ASC' } })
  const rows: { itemId: number; warehouseId: number; available: string }[] = await em.query(
    `SELECT sb.item_id AS itemId, sb.warehouse_id AS warehouseId, SUM(sb.on_hand - sb.reserved) AS available
     FROM stock_balances sb JOIN bins b ON b.id = sb.bin_id
     WHERE b.kind <> 'transit' AND sb.item_id IN (${ids.map(() => '?').join(',')})
     GROUP BY sb.item_id, sb.warehouse_id`,
    ids,
  )
  const found = new Map(rows.map((r) => [`${r.itemId}|${r.warehouseId}`, Number(r.available)]))
  for (const itemId of ids) {
    const per = warehouses.map((w) => ({ warehouseId: w.id, code: w.code, name: w.name, available: found.get(`${itemId}|${w.id}`) ?? 0 }))
    out.set(itemId, { itemId, warehouses: per, total: per.reduce((s, w) => s + w.available, 0) })
  }
  return out
}
