// Usage by family and month: units issued and picked, and their cost (each move at the moving average
// it went out at), in the reader's calendar months. One aggregate joined to the months' bounds.
import type { DataSource } from 'typeorm'
import type { ItemFamily } from '../../../shared/catalog.js'
import { monthsBetween } from '../../../shared/reports/zonedDays.js'
import { USAGE_MOVE_TYPES } from '../reorder/usageQueries.js'
import type { PeriodQuery, UsageReport } from '../../../shared/schemas/reports.js'

export async function usageByMonth(ds: DataSource, q: PeriodQuery): Promise<UsageReport> {
  const months = monthsBetween(q.from, q.to, q.tz)
  const bounds = months.map(() => 'SELECT ? AS month, ? AS starts, ? AS ends').join(' UNION ALL ')
  const rows: { month: string; family: ItemFamily; qty: string; value: string }[] = await ds.query(
    `SELECT b.month, i.family, SUM(-m.qty) AS qty, SUM(ROUND(-m.qty * COALESCE(m.unit_cost, 0), 2)) AS value
       FROM (${bounds}) b
       JOIN stock_moves m ON m.at >= b.starts AND m.at < b.ends AND m.move_type IN (?) ${q.warehouseId ? 'AND m.warehouse_id = ?' : ''}
       JOIN items i ON i.id = m.item_id
      GROUP BY b.month, i.family ORDER BY b.month, i.family`,
    [...months.flatMap((m) => [m.month, m.start, m.end]), USAGE_MOVE_TYPES, ...(q.warehouseId ? [q.warehouseId] : [])],
  )
  return {
    from: q.from, to: q.to, months: months.map((m) => m.month),
    cells: rows.map((r) => ({ month: r.month, family: r.family, qty: Number(r.qty), usageValue: Number(r.value).toFixed(2) })),
  }
}
