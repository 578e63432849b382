// Opening a count: the bins to visit for a whole warehouse, one aisle or a list of bins, or the items due
// by ABC class (each class on its own interval, A most often) and the bins that hold them.
import type { DataSource, EntityManager } from 'typeorm'
import { dailyCountLoad, isCountDue, ABC_CLASSES } from '../../../shared/counts/countFrequency.js'
import type { AbcClass } from '../../../shared/inventory/abc.js'
import { parseBinCode } from '../../../shared/inventory/walkOrder.js'
import type { CountDuePlan, CountOpenInput, CountScopeDetail } from '../../../shared/schemas/counts.js'
import { Bin } from '../../entities/Bin.js'
import { CycleCount } from '../../entities/CycleCount.js'
import { Warehouse } from '../../entities/Warehouse.js'
import { AppError, problem } from '../../errors.js'
import { inTransaction } from '../../db/transaction.js'
import { audit, type AuditActor } from '../auditService.js'
import { walkConfigOf } from '../picking/pickWalk.js'
import { computeAbc } from '../reorder/reorderLines.js'
import { countSettings } from './countSettings.js'

interface DueItem {
  itemId: number
  abcClass: AbcClass
  lastCountedAt: Date | null
}

async function requireWarehouse(em: EntityManager, id: number): Promise<Warehouse> {
  const wh = await em.findOneBy(Warehouse, { id })
  if (!wh) throw new AppError(404, 'warehouse_not_found', 'That warehouse was not found.')
  if (!wh.active) throw new AppError(409, 'warehouse_inactive', `Warehouse ${wh.code} is not in use.`, { params: { warehouse: wh.code } })
  return wh
}

/** Bins a count may visit: in use, and not the transit bin (stock there is on its way, counted on arrival). */
async function countableBins(em: EntityManager, warehouseId: number): Promise<Bin[]> {
  const bins = await em.findBy(Bin, { warehouseId, active: true })
  return bins.filter((b) => b.kind !== 'transit')
}

/** Stocked items of a warehouse with their class and when each was last counted there (a settled line). */
async function stockedItems(ds: DataSource, warehouseId: number): Promise<DueItem[]> {
  const [stocked, last, abc] = await Promise.all([
    ds.query(
      `SELECT sb.item_id FROM stock_balances sb JOIN bins b ON b.id = sb.bin_id
        WHERE sb.warehouse_id = ? AND b.kind <> 'transit' GROUP BY sb.item_id HAVING SUM(sb.on_hand) > 0`,
      [warehouseId],
    ) as Promise<{ item_id: number }[]>,
    ds.query(
      `SELECT item_id, MAX(counted_at) AS at FROM count_lines WHERE warehouse_id = ? AND status IN ('matched', 'approved') GROUP BY item_id`,
      [warehouseId],
    ) as Promise<{ item_id: number; at: Date }[]>,
    computeAbc(ds),
  ])
  const classOf = new Map(abc.abc.items.map((i) => [Number(i.id), i.abcClass]))
  const lastOf = new Map(last.map((r) => [Number(r.item_id), new Date(r.at)]))
  return stocked.map((r) => ({ itemId: Number(r.item_id), abcClass: classOf.get(Number(r.item_id)) ?? 'C', lastCountedAt: lastOf.get(Number(r.item_id)) ?? null }))
}

const classRank = (c: AbcClass) => ABC_CLASSES.indexOf(c)

/** Due items, A first, then the longest since counted (never counted first). */
async function dueItems(ds: DataSource, warehouseId: number, now = new Date()): Promise<{ all: DueItem[]; due: DueItem[] }> {
  const { intervals } = await countSettings(ds)
  const all = await stockedItems(ds, warehouseId)
  const due = all
    .filter((i) => isCountDue(i.lastCountedAt, intervals[i.abcClass], now))
    .sort((a, b) => classRank(a.abcClass) - classRank(b.abcClass) || (a.lastCountedAt?.getTime() ?? 0) - (b.lastCountedAt?.getTime() ?? 0) || a.itemId - b.itemId)
  return { all, due }
}

export async function countDuePlan(ds: DataSource, warehouseId: number): Promise<CountDuePlan> {
  await requireWarehouse(ds.manager, warehouseId)
  const [{ intervals }, { all, due }] = await Promise.all([countSettings(ds), dueItems(ds, warehouseId)])
  const sizes = { A: 0, B: 0, C: 0 }
  for (const i of all) sizes[i.abcClass]++
  const load = dailyCountLoad(sizes, intervals)
  return {
    warehouseId,
    classes: ABC_CLASSES.map((c) => ({
      abcClass: c, intervalDays: intervals[c], items: sizes[c], due: due.filter((i) => i.abcClass === c).length, perDay: load.perClass[c],
    })),
    perDay: load.total,
  }
}

interface Plan {
  binIds: number[]
  itemIds: number[] | null
  detail: CountScopeDetail
}

async function planBins(ds: DataSource, em: EntityManager, wh: Warehouse, input: CountOpenInput): Promise<Plan> {
  const bins = await countableBins(em, wh.id)
  switch (input.scope) {
    case 'warehouse':
      return { binIds: bins.map((b) => b.id), itemIds: null, detail: { bins: bins.length } }
    case 'aisle': {
      const config = walkConfigOf(wh)
      const aisle = input.aisle.toUpperCase()
      const inAisle = bins.filter((b) => parseBinCode(b.code, config)?.aisle === aisle)
      if (!inAisle.length) throw new AppError(422, 'count_aisle_empty', `Warehouse ${wh.code} has no bins in aisle ${aisle}.`, { params: { warehouse: wh.code, aisle }, fields: { aisle: problem('count_aisle_empty', { warehouse: wh.code, aisle }) } })
      return { binIds: inAisle.map((b) => b.id), itemIds: null, detail: { aisle, bins: inAisle.length } }
    }
    case 'bins': {
      const known = new Set(bins.map((b) => b.id))
      const wanted = [...new Set(input.binIds)]
      const stray = wanted.filter((id) => !known.has(id))
      if (stray.length) throw new AppError(400, 'count_bin_not_in_warehouse', `${stray.length} of the bins are not bins of ${wh.code} that can be counted.`, { params: { n: stray.length, warehouse: wh.code }, fields: { binIds: problem('count_bin_not_in_warehouse', { n: stray.length, warehouse: wh.code }) } })
      return { binIds: wanted, itemIds: null, detail: { bins: wanted.length } }
    }
    case 'abc_due': {
      const { due } = await dueItems(ds, wh.id)
      const chosen = due.filter((i) => input.classes.includes(i.abcClass)).slice(0, input.limit)
      if (!chosen.length) throw new AppError(422, 'count_nothing_due', 'No item of these classes is due for a count here.', { fields: { classes: problem('count_nothing_due') } })
      const itemIds = chosen.map((i) => i.itemId)
      const rows: { bin_id: number }[] = await em.query(
        `SELECT DISTINCT sb.bin_id FROM stock_balances sb JOIN bins b ON b.id = sb.bin_id
          WHERE sb.warehouse_id = ? AND sb.item_id IN (?) AND sb.on_hand > 0 AND b.kind <> 'transit' AND b.active = 1`,
        [wh.id, itemIds],
      )
      return { binIds: rows.map((r) => Number(r.bin_id)), itemIds, detail: { classes: [...input.classes].sort(), items: itemIds.length, bins: rows.length } }
    }
  }
}

export async function openCount(ds: DataSource, actor: AuditActor, input: CountOpenInput): Promise<{ id: number }> {
  const wh = await requireWarehouse(ds.manager, input.warehouseId)
  // The plan reads outside the transaction (the ABC classes read the whole ledger); the bins are checked again inside.
  const plan = await planBins(ds, ds.manager, wh, input)
  if (!plan.binIds.length) throw new AppError(422, 'count_no_bins', `Warehouse ${wh.code} has no bins to count.`, { params: { warehouse: wh.code } })
  return inTransaction(ds, async (em) => {
    const count = await em.save(em.create(CycleCount, {
      warehouseId: wh.id, scope: input.scope, scopeDetail: JSON.stringify(plan.detail), itemsOnly: plan.itemIds !== null,
      status: 'open', note: input.note ?? null, createdBy: actor.userId,
    }))
    if (plan.itemIds) {
      await em.query(`INSERT INTO count_items (count_id, item_id) VALUES ${plan.itemIds.map(() => '(?, ?)').join(', ')}`, plan.itemIds.flatMap((i) => [count.id, i]))
    }
    await em.query(`INSERT INTO count_bins (count_id, bin_id) VALUES ${plan.binIds.map(() => '(?, ?)').join(', ')}`, plan.binIds.flatMap((b) => [count.id, b]))
    await audit(em, actor, 'count.open', 'cycle_count', count.id, { warehouse: wh.code, scope: input.scope, ...plan.detail })
    return { id: count.id }
  })
}
