// Reports: what the screens send (parsed by the server with these) and the answers' shapes.
import { z } from 'zod'
import type { ItemFamily } from '../catalog.js'
import type { Money } from '../money.js'
import { issueOf } from '../errors/zodProblems.js'
import { DEFAULT_REORDER_POLICY } from '../inventory/reorder.js'
import type { TurnsFigures } from '../reports/stockTurns.js'
import { addDays, localDayIn, monthsBetween } from '../reports/zonedDays.js'
import { timeZoneParam } from './exportQuery.js'

const blankToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v)
const optionalId = z.preprocess(blankToUndefined, z.coerce.number().int().positive().optional())

/** Stock value as of the end of a day in the reader's time zone: today when no day is given, never a day to come. */
export const stockValuationQuerySchema = z
  .object({ asOf: z.preprocess(blankToUndefined, z.iso.date().optional()), warehouseId: optionalId, tz: timeZoneParam })
  .transform((q, ctx) => {
    const today = localDayIn(q.tz, new Date())
    const asOf = q.asOf ?? today
    if (asOf > today) ctx.addIssue({ code: 'custom', path: ['asOf'], ...issueOf('day_after_today', { today }) })
    return { ...q, asOf }
  })
export type StockValuationQuery = z.infer<typeof stockValuationQuerySchema>

/** The longest period a report covers (usage by month draws one column per month). */
export const MAX_REPORT_MONTHS = 36
const optionalDay = z.preprocess(blankToUndefined, z.iso.date().optional())

/**
 * A period of whole days in the reader's time zone, both included: the last 365 days to today when none is
 * given; never a day to come, never backwards, at most MAX_REPORT_MONTHS months.
 */
export const periodQuerySchema = z
  .object({ from: optionalDay, to: optionalDay, warehouseId: optionalId, tz: timeZoneParam })
  .transform((q, ctx) => {
    const today = localDayIn(q.tz, new Date())
    const to = q.to ?? today
    const from = q.from ?? addDays(to, -364)
    if (to > today) ctx.addIssue({ code: 'custom', path: ['to'], ...issueOf('day_after_today', { today }) })
    else if (from > to) ctx.addIssue({ code: 'custom', path: ['to'], ...issueOf('ends_before_start') })
    else if (monthsBetween(from, to, 'UTC').length > MAX_REPORT_MONTHS) ctx.addIssue({ code: 'custom', path: ['from'], ...issueOf('period_too_long', { max: MAX_REPORT_MONTHS }) })
    return { ...q, from, to }
  })
export type PeriodQuery = z.infer<typeof periodQuerySchema>

const days = (min: number, max: number, fallback: number) => z.preprocess(blankToUndefined, z.coerce.number().int().min(min).max(max).default(fallback))

/** Dead: on hand and not used for `deadDays`; slow: what is on hand lasts more than `slowDays` at the use of the last `windowDays`. */
export const deadStockQuerySchema = z.object({
  deadDays: days(30, 3650, DEFAULT_REORDER_POLICY.deadStockDays),
  slowDays: days(30, 3650, 180),
  windowDays: days(30, 730, 180),
  warehouseId: optionalId,
})
export type DeadStockQuery = z.infer<typeof deadStockQuerySchema>

/** A report's spreadsheet: the same query, with the reader's language for its words. */
export const reportLang = z.preprocess(blankToUndefined, z.enum(['en', 'es']).default('en'))

// ---- answers ----
/** One warehouse and family: how many items had stock, the units, and their value (a cost: the cost rule's `stockValue`). */
export interface ValuationGroup {
  warehouseId: number
  warehouseCode: string
  family: ItemFamily
  items: number
  onHand: number
  stockValue: Money
}

export interface ValuationReport {
  asOf: string
  tz: string
  groups: ValuationGroup[]
  warehouses: { warehouseId: number; warehouseCode: string; stockValue: Money }[]
  stockValue: Money
}

export interface TurnsFigureRow extends Omit<TurnsFigures, 'averageValue'> {
  usedQty: number
  /** Costs (the cost rule's names): what left at its moving-average cost, the stock value at the start and end, their average. */
  usageValue: Money
  beginValue: Money
  endValue: Money
  averageValue: Money
}

export interface TurnsRow extends TurnsFigureRow {
  family: ItemFamily
}

export interface TurnsReport {
  from: string
  to: string
  days: number
  families: TurnsRow[]
  total: TurnsFigureRow | null
}

export interface DeadStockRow {
  kind: 'dead' | 'slow'
  itemId: number
  sku: string
  name: string
  family: ItemFamily
  warehouseId: number
  warehouseCode: string
  onHand: number
  lastUsedAt: string | null
  usedInWindow: number
  /** On hand ÷ daily use over the window; null when not used in it. */
  daysOfSupply: number | null
  avgCost: string
  stockValue: Money
}

export interface DeadStockReport extends Omit<DeadStockQuery, 'warehouseId'> {
  rows: DeadStockRow[]
}

export interface UsageCell {
  month: string
  family: ItemFamily
  qty: number
  usageValue: Money
}

export interface UsageReport {
  from: string
  to: string
  months: string[]
  cells: UsageCell[]
}

export interface VendorRow {
  vendorId: number
  code: string
  name: string
  orders: number
  /** Orders with an expected date: the ones on-time is measured on. */
  withDate: number
  onTime: number
  onTimeRate: number | null
  leadDaysMean: number | null
  leadDaysMin: number | null
  leadDaysMax: number | null
  statedLeadDays: number
}

export interface VendorReport {
  from: string
  to: string
  vendors: VendorRow[]
}
