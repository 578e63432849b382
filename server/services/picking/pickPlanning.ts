// Plans pick lists for a bill of materials: each stocked line allocated to bins and lots with
// allocateStock over what a warehouse has available (one lot per job where one lot covers it),
// in one warehouse or split over several, and what is still short.
import type { EntityManager } from 'typeorm'
import { allocateStock, type StockRow } from '../../../shared/inventory/allocation.js'
import { walkOrder } from '../../../shared/inventory/walkOrder.js'
import type { PickMode, PickPlan, PlannedShortage } from '../../../shared/schemas/picking.js'
import type { Item } from '../../entities/Item.js'
import { loadPlanContext, type PlanBomLine, type PlanContext } from './pickPlanContext.js'
import { availableByWarehouse, availableRows } from './pickStockRows.js'
import { walkConfigOf } from './pickWalk.js'

export interface AllocatedLine {
  bomLineId: number
  itemId: number
  substituteForItemId: number | null
  warehouseId: number
  binId: number
  binCode: string
  lotId: number | null
  lotCode: string | null
  qty: number
}

export interface ShortLine {
  bomLine: PlanBomLine
  item: Item
  shortage: number
}

export interface Plan {
  ctx: PlanContext
  mode: PickMode
  allocated: AllocatedLine[]
  shortages: ShortLine[]
  notPicked: PickPlan['notPicked']
  explanation: PickPlan['explanation']
}

/** Available rows per warehouse and item, used up as the plan allocates, so two lines of one item never share units. */
export class StockPool {
  private rows = new Map<string, StockRow[]>()
  constructor(private em: EntityManager) {}

  async take(itemId: number, warehouseId: number, qty: number, matchLot: boolean) {
    const key = `${warehouseId}:${itemId}`
    const rows = this.rows.get(key) ?? (await availableRows(this.em, itemId, warehouseId))
    this.rows.set(key, rows)
    const result = allocateStock(qty, rows, { matchLot })
    for (const line of result.lines) {
      const row = rows.find((r) => r.binId === line.binId && r.lotId === line.lotId)!
      row.available -= line.qty
    }
    return result
  }
}

function skipReason(line: PlanBomLine, item: Item | undefined): PickPlan['notPicked'][number]['reason'] | null {
  if (line.madeToOrder || item?.madeToOrder) return 'made_to_order'
  if (line.itemId === null || !item) return 'no_item'
  if (line.remaining === 0) return 'done'
  return null
}

async function allocateBomLine(pool: StockPool, plan: Plan, line: PlanBomLine, item: Item): Promise<void> {
  const warehouses = plan.mode === 'split' ? plan.ctx.warehouses : [plan.ctx.warehouse]
  let rest = line.remaining
  const notes: string[] = []
  for (const wh of warehouses) {
    if (rest === 0) break
    const result = await pool.take(item.id, wh.id, rest, item.matchLot)
    if (result.allocated === 0 && wh.id !== plan.ctx.warehouse.id) continue
    notes.push(`${wh.code}: ${result.explanation.join('; ')}`)
    for (const l of result.lines) {
      plan.allocated.push({
        bomLineId: line.id, itemId: item.id, substituteForItemId: null, warehouseId: wh.id,
        binId: Number(l.binId), binCode: l.binCode, lotId: l.lotId === null ? null : Number(l.lotId), lotCode: l.lotCode, qty: l.qty,
      })
    }
    rest -= result.allocated
  }
  if (rest > 0) plan.shortages.push({ bomLine: line, item, shortage: rest })
  plan.explanation.push({ bomLineId: line.id, lines: notes })
}

/** The plan only: reads, reserves nothing. `locking` when a list is about to be made from it. */
export async function planPick(
  em: EntityManager,
  input: { bomId: number; warehouseId: number; mode: PickMode },
  opts: { locking: boolean } = { locking: false },
): Promise<{ plan: Plan; pool: StockPool }> {
  const ctx = await loadPlanContext(em, input.bomId, input.warehouseId, opts)
  const plan: Plan = { ctx, mode: input.mode, allocated: [], shortages: [], notPicked: [], explanation: [] }
  const pool = new StockPool(em)
  for (const line of ctx.lines) {
    const item = line.itemId === null ? undefined : ctx.items.get(line.itemId)
    const skip = skipReason(line, item)
    if (skip) {
      plan.notPicked.push({ bomLineId: line.id, description: line.description, qty: line.qty, reason: skip })
      continue
    }
    await allocateBomLine(pool, plan, line, item!)
  }
  return { plan, pool }
}

async function substitutesFor(em: EntityManager, item: Item, warehouseId: number): Promise<PlannedShortage['substitutes']> {
  const rows = (await em.query(
    `SELECT i.id, i.sku, i.name, SUM(sb.on_hand - sb.reserved) AS available
       FROM items i
       JOIN stock_balances sb ON sb.item_id = i.id
       JOIN bins b ON b.id = sb.bin_id
      WHERE i.family = ? AND i.id <> ? AND i.active = 1 AND i.made_to_order = 0
        AND sb.warehouse_id = ? AND b.kind <> 'transit' AND b.active = 1
      GROUP BY i.id, i.sku, i.name, i.nominal_size
     HAVING available > 0
      ORDER BY (i.nominal_size <=> ?) DESC, available DESC, i.sku
      LIMIT 8`,
    [item.family, item.id, warehouseId, item.nominalSize],
  )) as { id: number; sku: string; name: string; available: string }[]
  return rows.map((r) => ({ itemId: Number(r.id), sku: r.sku, name: r.name, available: Number(r.available) }))
}

async function backordered(em: EntityManager, bomLineIds: number[]): Promise<Map<number, number>> {
  if (!bomLineIds.length) return new Map()
  const rows = (await em.query(
    `SELECT bom_line_id, SUM(qty) AS qty FROM pick_shortages WHERE bom_line_id IN (?) AND action = 'backorder' GROUP BY bom_line_id`,
    [bomLineIds],
  )) as { bom_line_id: number; qty: string }[]
  return new Map(rows.map((r) => [Number(r.bom_line_id), Number(r.qty)]))
}

/** The plan as the counter sees it, with the choices each shortage offers. */
export async function planView(em: EntityManager, plan: Plan): Promise<PickPlan> {
  const { ctx } = plan
  const byWarehouse = new Map(ctx.warehouses.map((w) => [w.id, w]))
  const lists = ctx.warehouses
    .map((wh) => ({ wh, lines: plan.allocated.filter((a) => a.warehouseId === wh.id) }))
    .filter((l) => l.lines.length > 0 || l.wh.id === ctx.warehouse.id)
    .map(({ wh, lines }) => ({
      warehouse: { id: wh.id, code: wh.code, name: wh.name },
      lines: walkOrder(lines, walkConfigOf(wh)).map((a) => {
        const item = ctx.items.get(a.itemId)!
        return { bomLineId: a.bomLineId, itemId: a.itemId, sku: item.sku, itemName: item.name, binCode: a.binCode, lotCode: a.lotCode, qty: a.qty }
      }),
    }))
  const elsewhere = await availableByWarehouse(em, plan.shortages.map((s) => s.item.id))
  const earlier = await backordered(em, plan.shortages.map((s) => s.bomLine.id))
  const shortages: PlannedShortage[] = []
  for (const s of plan.shortages) {
    const others = [...(elsewhere.get(s.item.id) ?? new Map<number, number>())]
      .filter(([whId, qty]) => whId !== ctx.warehouse.id && qty > 0 && byWarehouse.has(whId) && plan.mode === 'single')
      .map(([whId, available]) => ({ warehouseId: whId, code: byWarehouse.get(whId)!.code, name: byWarehouse.get(whId)!.name, available }))
    shortages.push({
      bomLineId: s.bomLine.id, itemId: s.item.id, sku: s.item.sku, description: s.bomLine.description,
      requested: s.bomLine.remaining, shortage: s.shortage, elsewhere: others,
      substitutes: await substitutesFor(em, s.item, ctx.warehouse.id), backordered: earlier.get(s.bomLine.id) ?? 0,
    })
  }
  return {
    bom: { id: ctx.bom.id, revision: ctx.bom.revision, jobId: ctx.job.id, jobName: ctx.job.name, customerName: ctx.customerName },
    mode: plan.mode, lists, shortages, notPicked: plan.notPicked, explanation: plan.explanation,
  }
}
