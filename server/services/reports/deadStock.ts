// Dead and slow stock: what sits on the shelves. Dead: on hand, and not issued or picked for at least
// `deadDays` (never, or not since). Slow: used, but at the rate of the last `windowDays` what is on hand
// lasts more than `slowDays`. Valued at today's moving average, largest first.
import type { DataSource } from 'typeorm'
import type { ItemFamily } from '../../../shared/catalog.js'
import { MoneyDecimal } from '../../../shared/money.js'
import type { DeadStockQuery, DeadStockReport, DeadStockRow } from '../../../shared/schemas/reports.js'
import { USAGE_MOVE_TYPES } from '../reorder/usageQueries.js'

export async function deadAndSlowStock(ds: DataSource, q: DeadStockQuery, now = new Date()): Promise<DeadStockReport> {
  const windowStart = new Date(now.getTime() - q.windowDays * 86_400_000)
  const rows: {
    item_id: number; sku: string; name: string; family: ItemFamily; warehouse_id: number; code: string; on_hand: string
    avg_cost: string | null; last_used: Date | null; used: string | null
  }[] = await ds.query(
    `SELECT s.item_id, i.sku, i.name, i.family, s.warehouse_id, w.code, s.on_hand, iw.avg_cost, u.last_used, u.used
       FROM (SELECT sb.item_id, sb.warehouse_id, SUM(sb.on_hand) AS on_hand FROM stock_balances sb
              WHERE sb.on_hand > 0 ${q.warehouseId ? 'AND sb.warehouse_id = ?' : ''} GROUP BY sb.item_id, sb.warehouse_id) s
       JOIN items i ON i.id = s.item_id
       JOIN warehouses w ON w.id = s.warehouse_id
       LEFT JOIN item_warehouses iw ON iw.item_id = s.item_id AND iw.warehouse_id = s.warehouse_id
       LEFT JOIN (SELECT m.item_id, m.warehouse_id, MAX(m.at) AS last_used, SUM(IF(m.at >= ?, -m.qty, 0)) AS used
                    FROM stock_moves m WHERE m.move_type IN (?) GROUP BY m.item_id, m.warehouse_id) u
              ON u.item_id = s.item_id AND u.warehouse_id = s.warehouse_id`,
    [...(q.warehouseId ? [q.warehouseId] : []), windowStart, USAGE_MOVE_TYPES],
  )
  const deadBefore = now.getTime() - q.deadDays * 86_400_000
  const out: DeadStockRow[] = []
  for (const r of rows) {
    const onHand = Number(r.on_hand)
    const used = Math.max(0, Number(r.used ?? 0))
    const last = r.last_used ? new Date(r.last_used) : null
    const daysOfSupply = used > 0 ? onHand / (used / q.windowDays) : null
    const kind = !last || last.getTime() < deadBefore ? 'dead' : daysOfSupply !== null && daysOfSupply > q.slowDays ? 'slow' : null
    if (!kind) continue
    const avgCost = r.avg_cost ?? '0.0000'
    out.push({
      kind, itemId: Number(r.item_id), sku: r.sku, name: r.name, family: r.family, warehouseId: Number(r.warehouse_id), warehouseCode: r.code,
      onHand, lastUsedAt: last ? last.toISOString() : null, usedInWindow: used, daysOfSupply, avgCost,
      stockValue: new MoneyDecimal(avgCost).times(onHand).toDecimalPlaces(2).toFixed(2),
    })
  }
  out.sort((a, b) => Number(b.stockValue) - Number(a.stockValue) || a.sku.localeCompare(b.sku))
  return { deadDays: q.deadDays, slowDays: q.slowDays, windowDays: q.windowDays, rows: out }
}
