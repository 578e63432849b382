// What the buyer's screens read: the suggestion list with its filters, one line's working, its usage chart
// data and the ABC Pareto series.
import type { DataSource } from 'typeorm'
import type { ReorderStatus } from '../../../shared/inventory/reorder.js'
import { ITEM_FAMILIES } from '../../../shared/catalog.js'
import {
  REORDER_STATUSES, type AbcPareto, type ReorderChoices, type ReorderLine, type ReorderLineDetail, type SuggestionList,
  type SuggestionQuery, type UsageWindow,
} from '../../../shared/schemas/reorder.js'
import { projectPosition, zeroFilledDays } from '../../../shared/inventory/stockProjection.js'
import { AppError } from '../../errors.js'
import { computeAbc, computeReorderLines } from './reorderLines.js'
import { dailyUsage, historyDaysInWindow } from './usageQueries.js'

const STATUS_ORDER: Record<ReorderStatus, number> = { orderNow: 0, orderSoon: 1, deadStock: 2, overstocked: 3, ok: 4 }

function byUrgency(a: ReorderLine, b: ReorderLine): number {
  return STATUS_ORDER[a.status] - STATUS_ORDER[b.status]
    || (a.daysOfSupply ?? Infinity) - (b.daysOfSupply ?? Infinity)
    || (a.sku < b.sku ? -1 : a.sku > b.sku ? 1 : a.warehouseCode < b.warehouseCode ? -1 : 1)
}

const windowOf = (w: UsageWindow): UsageWindow => ({ start: w.start, end: w.end, days: w.days })

export async function suggestionList(ds: DataSource, query: SuggestionQuery): Promise<SuggestionList> {
  const computed = await computeReorderLines(ds, { windowDays: query.windowDays })
  const matching = computed.lines.map((c) => c.line).filter((l) =>
    (query.warehouseId === undefined || l.warehouseId === query.warehouseId)
    && (query.vendorId === undefined || l.vendorId === query.vendorId)
    && (query.family === undefined || l.family === query.family)
    && (query.abc === undefined || l.abcClass === query.abc))
  const counts = Object.fromEntries(REORDER_STATUSES.map((s) => [s, 0])) as Record<ReorderStatus, number>
  for (const l of matching) counts[l.status] += 1
  const lines = (query.status ? matching.filter((l) => l.status === query.status) : matching).sort(byUrgency)
  const importedHistoryDays = await historyDaysInWindow(ds.manager, computed.window)
  return { asOf: computed.window.end, window: windowOf(computed.window), importedHistoryDays, abcCutoffs: computed.cutoffs, counts, lines }
}

export const DEFAULT_HORIZON_DAYS = 30

export async function lineDetail(
  ds: DataSource,
  itemId: number,
  warehouseId: number,
  opts: { windowDays?: number; horizonDays?: number } = {},
): Promise<ReorderLineDetail> {
  const computed = await computeReorderLines(ds, { windowDays: opts.windowDays, only: [{ itemId, warehouseId }], explain: true })
  const found = computed.lines[0]
  if (!found) throw AppError.notFound('reorder_line_not_found', 'That item is not stocked in that warehouse.')
  const { line } = found
  const horizonDays = opts.horizonDays ?? DEFAULT_HORIZON_DAYS
  const daily = await dailyUsage(ds.manager, itemId, warehouseId, computed.window)
  const history = {
    daily: zeroFilledDays(daily, computed.window.start, computed.window.end),
    projection: projectPosition({
      from: computed.window.end, position: line.position, meanDaily: line.meanDaily, leadTimeDays: line.leadTimeDays, horizonDays,
    }),
    horizonDays,
  }
  return {
    window: windowOf(computed.window),
    line: found.line,
    policy: found.effective.policy,
    policySources: found.effective.sources,
    overrideReason: found.effective.overrideReason,
    usage: found.usage,
    leadTime: found.leadTime,
    explanation: found.explanation,
    history,
  }
}

export async function abcPareto(ds: DataSource, windowDays?: number): Promise<AbcPareto> {
  const computed = await computeAbc(ds, windowDays)
  const skus = new Map<number, string>(
    (await ds.query('SELECT id, sku FROM items') as { id: number; sku: string }[]).map((r) => [r.id, r.sku]),
  )
  const items = computed.abc.items.map((i) => ({
    itemId: Number(i.id), sku: skus.get(Number(i.id)) ?? i.id, annualValue: i.annualValue,
    cumulativePercent: Math.round(i.cumulativeShare * 10000) / 100, abcClass: i.abcClass,
  }))
  // Sums of cost go out under the cost rule's names (services/costVisibility.ts).
  const summary = Object.fromEntries(Object.entries(computed.abc.summary).map(([c, { value, ...rest }]) => [c, { ...rest, annualValue: value }]))
  return { window: windowOf(computed.window), cutoffs: computed.cutoffs, annualValueTotal: computed.abc.total, items, summary: summary as AbcPareto['summary'] }
}

export async function reorderChoices(ds: DataSource): Promise<ReorderChoices> {
  const [warehouses, vendors] = await Promise.all([
    ds.query('SELECT id, code, name FROM warehouses WHERE active = 1 ORDER BY code'),
    ds.query('SELECT id, code, name FROM vendors WHERE active = 1 ORDER BY code'),
  ])
  return { warehouses, vendors, families: ITEM_FAMILIES }
}
