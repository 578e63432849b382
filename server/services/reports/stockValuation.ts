// Stock value by warehouse and family at moving-average cost as of the end of any day, from the ledger:
// one query gives, for every move that blends a cost (receipts and transfers in, stock/averageCost.ts)
// up to that day, the units the warehouse held just before it (a running sum over the item and
// warehouse's moves in ledger order); another the units on hand at the day's end. The average is
// replayed in Node (shared/reports/valuationReplay.ts).
import type { DataSource } from 'typeorm'
import type { ItemFamily } from '../../../shared/catalog.js'
import { addMoney, type Money } from '../../../shared/money.js'
import { valueAsOf, type CostBearingMove, type PairValue } from '../../../shared/reports/valuationReplay.js'
import { dayEnd } from '../../../shared/reports/zonedDays.js'
import type { StockValuationQuery, ValuationGroup, ValuationReport } from '../../../shared/schemas/reports.js'
import { COSTED_IN } from '../stock/averageCost.js'

export type ValuationQuery = StockValuationQuery

export interface ValuedPair extends PairValue {
  itemId: number
  warehouseId: number
}

/** Every item × warehouse with units on hand at the end of `asOf`, valued at its average then. */
export async function valuedPairs(ds: DataSource, q: ValuationQuery): Promise<ValuedPair[]> {
  const end = dayEnd(q.asOf, q.tz)
  const whFilter = q.warehouseId ? 'AND m.warehouse_id = ?' : ''
  const params = q.warehouseId ? [end, q.warehouseId] : [end]
  const [costMoves, onHandRows] = await Promise.all([
    ds.query(
      `SELECT t.item_id, t.warehouse_id, t.qty, t.unit_cost, t.before_qty FROM (
         SELECT m.item_id, m.warehouse_id, m.move_type, m.qty, m.unit_cost, m.at, m.id,
                SUM(m.qty) OVER (PARTITION BY m.item_id, m.warehouse_id ORDER BY m.at, m.id ROWS UNBOUNDED PRECEDING) - m.qty AS before_qty
           FROM stock_moves m WHERE m.at < ? ${whFilter}
       ) t
       WHERE t.move_type IN (?) AND t.unit_cost IS NOT NULL
       ORDER BY t.item_id, t.warehouse_id, t.at, t.id`,
      [...params, [...COSTED_IN]],
    ) as Promise<{ item_id: number; warehouse_id: number; qty: number; unit_cost: string; before_qty: string }[]>,
    ds.query(
      `SELECT m.item_id, m.warehouse_id, SUM(m.qty) AS on_hand FROM stock_moves m WHERE m.at < ? ${whFilter}
        GROUP BY m.item_id, m.warehouse_id HAVING on_hand <> 0`,
      params,
    ) as Promise<{ item_id: number; warehouse_id: number; on_hand: string }[]>,
  ])
  const moves: CostBearingMove[] = costMoves.map((r) => ({
    key: `${r.item_id}|${r.warehouse_id}`, before: Number(r.before_qty), qty: Number(r.qty), unitCost: r.unit_cost,
  }))
  const onHand = new Map(onHandRows.map((r) => [`${r.item_id}|${r.warehouse_id}`, Number(r.on_hand)]))
  return [...valueAsOf(moves, onHand)].map(([key, v]) => {
    const [itemId, warehouseId] = key.split('|').map(Number)
    return { itemId, warehouseId, ...v }
  })
}

export interface ItemFacts {
  sku: string
  name: string
  family: ItemFamily
  stockUnit: string
}

export async function itemFacts(ds: DataSource, ids: readonly number[]): Promise<Map<number, ItemFacts>> {
  if (!ids.length) return new Map()
  const rows: { id: number; sku: string; name: string; family: ItemFamily; stock_unit: string }[] = await ds.query(
    'SELECT id, sku, name, family, stock_unit FROM items WHERE id IN (?)', [ids],
  )
  return new Map(rows.map((r) => [Number(r.id), { sku: r.sku, name: r.name, family: r.family, stockUnit: r.stock_unit }]))
}

export async function warehouseCodes(ds: DataSource): Promise<Map<number, string>> {
  const rows: { id: number; code: string }[] = await ds.query('SELECT id, code FROM warehouses')
  return new Map(rows.map((r) => [Number(r.id), r.code]))
}

export async function stockValuation(ds: DataSource, q: ValuationQuery): Promise<ValuationReport> {
  const pairs = await valuedPairs(ds, q)
  const [items, codes] = await Promise.all([itemFacts(ds, [...new Set(pairs.map((p) => p.itemId))]), warehouseCodes(ds)])
  const groups = new Map<string, ValuationGroup & { values: Money[] }>()
  for (const p of pairs) {
    const family = items.get(p.itemId)?.family ?? 'accessory'
    const key = `${p.warehouseId}|${family}`
    const g = groups.get(key) ?? { warehouseId: p.warehouseId, warehouseCode: codes.get(p.warehouseId) ?? '?', family, items: 0, onHand: 0, stockValue: '0.00', values: [] }
    g.items++
    g.onHand += p.onHand
    g.values.push(p.value)
    groups.set(key, g)
  }
  const list = [...groups.values()]
    .map(({ values, ...g }) => ({ ...g, stockValue: values.length ? addMoney(...values) : '0.00' }))
    .sort((a, b) => a.warehouseCode.localeCompare(b.warehouseCode) || a.family.localeCompare(b.family))
  const byWarehouse = new Map<number, Money[]>()
  for (const g of list) byWarehouse.set(g.warehouseId, [...(byWarehouse.get(g.warehouseId) ?? []), g.stockValue])
  return {
    asOf: q.asOf,
    tz: q.tz,
    groups: list,
    warehouses: [...byWarehouse].map(([id, values]) => ({ warehouseId: id, warehouseCode: codes.get(id) ?? '?', stockValue: addMoney(...values) }))
      .sort((a, b) => a.warehouseCode.localeCompare(b.warehouseCode)),
    stockValue: list.length ? addMoney(...list.map((g) => g.stockValue)) : '0.00',
  }
}
