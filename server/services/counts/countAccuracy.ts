// Inventory record accuracy by warehouse and month: lines right ÷ lines counted, and the value the records
// were off by. Counted lines that stand (matched or approved; a recounted attempt gives way to the next)
// fall in the month of their count in the reader's time zone.
import type { DataSource } from 'typeorm'
import { accuracyOf } from '../../../shared/counts/countVariance.js'
import type { CountAccuracyQuery, CountAccuracyRow } from '../../../shared/schemas/counts.js'
import { localDayOf } from '../../../shared/reports/zonedDays.js'

const DAY_MS = 86_400_000

export async function countAccuracy(ds: DataSource, q: CountAccuracyQuery): Promise<CountAccuracyRow[]> {
  // A day either side covers every time zone; the exact days are kept below.
  const from = new Date(new Date(`${q.from}T00:00:00Z`).getTime() - DAY_MS)
  const to = new Date(new Date(`${q.to}T00:00:00Z`).getTime() + 2 * DAY_MS)
  const rows: { warehouse_id: number; code: string; counted_at: Date; variance: number; unit_cost: string | null }[] = await ds.query(
    `SELECT l.warehouse_id, w.code, l.counted_at, l.variance, l.unit_cost
       FROM count_lines l JOIN warehouses w ON w.id = l.warehouse_id
      WHERE l.status IN ('matched', 'approved') AND l.counted_at >= ? AND l.counted_at < ? ${q.warehouseId ? 'AND l.warehouse_id = ?' : ''}`,
    q.warehouseId ? [from, to, q.warehouseId] : [from, to],
  )
  const dayOf = localDayOf(q.tz)
  const groups = new Map<string, { warehouseId: number; code: string; month: string; lines: { variance: number; unitCost: string | null }[] }>()
  for (const r of rows) {
    const day = dayOf(new Date(r.counted_at))
    if (day < q.from || day > q.to) continue
    const month = day.slice(0, 7)
    const key = `${r.warehouse_id}|${month}`
    const g = groups.get(key) ?? { warehouseId: Number(r.warehouse_id), code: r.code, month, lines: [] }
    g.lines.push({ variance: Number(r.variance), unitCost: r.unit_cost })
    groups.set(key, g)
  }
  return [...groups.values()]
    .sort((a, b) => a.code.localeCompare(b.code) || a.month.localeCompare(b.month))
    .map((g) => {
      const f = accuracyOf(g.lines)
      return {
        warehouseId: g.warehouseId, warehouseCode: g.code, month: g.month, linesCounted: f.linesCounted, linesRight: f.linesRight, accuracy: f.accuracy,
        valueOff: f.valueOff, valueNet: f.valueNet,
      }
    })
}
