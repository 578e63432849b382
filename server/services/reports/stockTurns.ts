// Turns and days of supply by family over a period: the cost of what left (issues and picks, each at the
// moving-average cost it went out at) against the average of the stock value at the start and at the end
// (both replayed from the ledger, stockValuation.ts).
import type { DataSource } from 'typeorm'
import type { ItemFamily } from '../../../shared/catalog.js'
import { addMoney, type Money } from '../../../shared/money.js'
import { turnsOf } from '../../../shared/reports/stockTurns.js'
import type { PeriodQuery, TurnsFigureRow, TurnsReport, TurnsRow } from '../../../shared/schemas/reports.js'
import { addDays, dayEnd, dayStart, daysInclusive } from '../../../shared/reports/zonedDays.js'
import { USAGE_MOVE_TYPES } from '../reorder/usageQueries.js'
import { itemFacts, valuedPairs } from './stockValuation.js'

function sumByFamily(values: { family: ItemFamily; value: Money }[]): Map<ItemFamily, Money> {
  const out = new Map<ItemFamily, Money[]>()
  for (const v of values) out.set(v.family, [...(out.get(v.family) ?? []), v.value])
  return new Map([...out].map(([f, list]) => [f, addMoney(...list)]))
}

export async function stockTurns(ds: DataSource, q: PeriodQuery): Promise<TurnsReport> {
  const days = daysInclusive(q.from, q.to)
  const whFilter = q.warehouseId ? 'AND m.warehouse_id = ?' : ''
  const [begin, end, used] = await Promise.all([
    valuedPairs(ds, { asOf: addDays(q.from, -1), tz: q.tz, warehouseId: q.warehouseId }),
    valuedPairs(ds, { asOf: q.to, tz: q.tz, warehouseId: q.warehouseId }),
    ds.query(
      `SELECT i.family, SUM(-m.qty) AS qty, SUM(ROUND(-m.qty * COALESCE(m.unit_cost, 0), 2)) AS value
         FROM stock_moves m JOIN items i ON i.id = m.item_id
        WHERE m.move_type IN (?) AND m.at >= ? AND m.at < ? ${whFilter}
        GROUP BY i.family`,
      [USAGE_MOVE_TYPES, dayStart(q.from, q.tz), dayEnd(q.to, q.tz), ...(q.warehouseId ? [q.warehouseId] : [])],
    ) as Promise<{ family: ItemFamily; qty: string; value: string }[]>,
  ])
  const facts = await itemFacts(ds, [...new Set([...begin, ...end].map((p) => p.itemId))])
  const familyOf = (id: number) => facts.get(id)?.family ?? 'accessory'
  const beginBy = sumByFamily(begin.map((p) => ({ family: familyOf(p.itemId), value: p.value })))
  const endBy = sumByFamily(end.map((p) => ({ family: familyOf(p.itemId), value: p.value })))
  const usedBy = new Map(used.map((r) => [r.family, { qty: Number(r.qty), value: Number(r.value).toFixed(2) }]))
  const families = [...new Set([...beginBy.keys(), ...endBy.keys(), ...usedBy.keys()])].sort()
  const figures = (usedQty: number, usageValue: Money, beginValue: Money, endValue: Money): TurnsFigureRow => ({
    usedQty, usageValue, beginValue, endValue, ...turnsOf({ costOfGoods: usageValue, beginValue, endValue, days }),
  })
  const rows: TurnsRow[] = families.map((family) => ({
    family, ...figures(usedBy.get(family)?.qty ?? 0, usedBy.get(family)?.value ?? '0.00', beginBy.get(family) ?? '0.00', endBy.get(family) ?? '0.00'),
  }))
  const total = rows.length
    ? figures(rows.reduce((a, r) => a + r.usedQty, 0), addMoney(...rows.map((r) => r.usageValue)), addMoney(...rows.map((r) => r.beginValue)), addMoney(...rows.map((r) => r.endValue)))
    : null
  return { from: q.from, to: q.to, days, families: rows, total }
}
