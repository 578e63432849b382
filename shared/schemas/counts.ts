// Cycle counts: what the screens send (parsed by the server with these) and the answers' shapes.
// The handheld's answers never carry an expected quantity: counts are blind.
import { z } from 'zod'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import type { AbcClass } from '../inventory/abc.js'
import { COUNT_REVIEWER_CHOICES, type CountReviewerChoice } from '../counts/countReviewRules.js'
import type { CountBinStatus, CountLineSource, CountLineStatus, CountScope, CountStatus } from '../counts/countTerms.js'
import type { CountIntervals } from '../counts/countFrequency.js'
import { timeZoneParam } from './exportQuery.js'

const blankToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v)
const id = z.coerce.number().int().positive()
const optionalId = z.preprocess(blankToUndefined, id.optional())
const note = z.string().trim().max(200).optional().nullable()
const abcClass = z.enum(['A', 'B', 'C'])

// ---- opening a count ----
const common = { warehouseId: id, note }
export const countOpenSchema = z.discriminatedUnion('scope', [
  z.object({ scope: z.literal('warehouse'), ...common }),
  z.object({ scope: z.literal('aisle'), ...common, aisle: z.string().trim().min(1).max(12) }),
  z.object({ scope: z.literal('bins'), ...common, binIds: z.array(id).min(1).max(500) }),
  z.object({
    scope: z.literal('abc_due'),
    ...common,
    classes: z.array(abcClass).min(1),
    limit: z.coerce.number().int().min(1).max(500).default(50),
  }),
])
export type CountOpenInput = z.infer<typeof countOpenSchema>

export const countsQuerySchema = z.object({
  status: z.preprocess(blankToUndefined, z.enum(['open', 'closed', 'cancelled', 'all']).default('open')),
  warehouseId: optionalId,
})
export type CountsQuery = z.infer<typeof countsQuerySchema>

export const countDueQuerySchema = z.object({ warehouseId: z.preprocess(blankToUndefined, id) })

// ---- the handheld ----
export const countStartBinSchema = z.object({
  /** The bin label as scanned (B:code) or the code typed. */
  binScan: z.string().trim().min(1).max(80),
  /** Carry on a visit someone else started (their phone died, a shift change). */
  takeOver: z.boolean().optional().default(false),
})
export type CountStartBinInput = z.infer<typeof countStartBinSchema>

export const LOT_CODE_PATTERN = /^[A-Za-z0-9._/-]{1,20}$/
export const countEntrySchema = z.object({
  binId: id,
  itemId: id,
  lotCode: z.string().trim().regex(LOT_CODE_PATTERN, issueCode('lot_code_chars')).nullable().optional().default(null),
  qty: z.coerce.number().int().min(0).max(1_000_000),
})
export type CountEntryInput = z.infer<typeof countEntrySchema>

// ---- review ----
export const countReviewSchema = z.object({
  decisions: z.array(z.object({
    lineId: id,
    action: z.enum(['approve', 'recount']),
    note,
  })).min(1).max(500),
})
export type CountReviewInput = z.infer<typeof countReviewSchema>

export const countCancelSchema = z.object({
  reason: z.string().trim().min(1).max(200),
})

export const countSettingsSchema = z.object({
  reviewerRoles: z.array(z.enum(COUNT_REVIEWER_CHOICES)).max(COUNT_REVIEWER_CHOICES.length).optional(),
  intervals: z.object({
    A: z.number().int().min(1).max(730),
    B: z.number().int().min(1).max(730),
    C: z.number().int().min(1).max(730),
  }).optional(),
})
export type CountSettingsInput = z.infer<typeof countSettingsSchema>

// ---- history and accuracy ----
export const countHistoryQuerySchema = z
  .object({ binId: optionalId, itemId: optionalId, warehouseId: optionalId })
  .refine((q) => q.binId !== undefined || q.itemId !== undefined, { path: ['itemId'], ...issueOf('item_or_bin_needed') })
export type CountHistoryQuery = z.infer<typeof countHistoryQuerySchema>

export const countAccuracyQuerySchema = z
  .object({
    from: z.preprocess(blankToUndefined, z.iso.date()),
    to: z.preprocess(blankToUndefined, z.iso.date()),
    warehouseId: optionalId,
    tz: timeZoneParam,
  })
  .refine((q) => q.from <= q.to, { path: ['to'], ...issueOf('ends_before_start') })
export type CountAccuracyQuery = z.infer<typeof countAccuracyQuerySchema>

// ---- answers ----
/** What the screens put after the scope in a count's title (in the reader's language). */
export interface CountScopeDetail {
  aisle?: string
  bins?: number
  classes?: AbcClass[]
  items?: number
}

export interface CountSettings {
  reviewerRoles: CountReviewerChoice[]
  intervals: CountIntervals
}

export interface CountSummary {
  id: number
  warehouse: { id: number; code: string; name: string }
  scope: CountScope
  scopeDetail: CountScopeDetail
  status: CountStatus
  note: string | null
  createdBy: string | null
  createdAt: string
  closedAt: string | null
  binCounts: { total: number; done: number }
  lineCounts: { waiting: number; toReview: number; settled: number }
  /** Σ |variance value| of the lines counted so far; absent for roles that do not see costs. */
  valueOff?: string
}

export interface CountLineView {
  id: number
  binId: number
  binCode: string
  itemId: number
  sku: string
  itemName: string
  stockUnit: string
  lotId: number | null
  lotCode: string | null
  attempt: number
  source: CountLineSource
  status: CountLineStatus
  /** Figures from the ledger: null until the line is counted (nobody sees what a waiting line expects). */
  snapshotQty: number | null
  movesSince: number | null
  expectedQty: number | null
  countedQty: number | null
  variance: number | null
  /** Absent for roles that do not see costs. */
  unitCost?: string | null
  varianceValue?: string | null
  countedBy: string | null
  countedById: number | null
  countedAt: string | null
  reviewedBy: string | null
  reviewedAt: string | null
  reviewNote: string | null
  moveId: string | null
  pickListId: number | null
}

export interface CountDetail extends CountSummary {
  bins: { binId: number; binCode: string; status: CountBinStatus; visits: number; startedBy: string | null; finishedAt: string | null }[]
  lines: CountLineView[]
  /** The moves made in a line's bin × item × lot between its snapshot and its count (shown on review). */
  movesDuring: Record<number, { id: string; at: string; moveType: string; qty: number; by: string | null }[]>
  /** May the viewer approve or ask for recounts here (lines they counted themselves excepted)? */
  canReview: boolean
}

/** What the counter's phone sees: bins and items, never quantities the ledger holds. */
export interface HandheldBinRow {
  binId: number
  binCode: string
  status: CountBinStatus
  startedBy: string | null
}

export interface HandheldCountBin extends HandheldBinRow {
  /** Items the counter is asked to count here (items-only counts and recounts); empty means "everything in the bin". */
  asked: { itemId: number; sku: string; itemName: string; lotCode: string | null }[]
  /** What the counter entered so far in this visit. */
  entered: { lineId: number; itemId: number; sku: string; itemName: string; lotCode: string | null; qty: number }[]
}

export interface HandheldCount {
  id: number
  warehouse: { id: number; code: string; name: string }
  scope: CountScope
  scopeDetail: CountScopeDetail
  status: CountStatus
  itemsOnly: boolean
  /** In walking order. */
  bins: HandheldBinRow[]
  /** The bin this person is counting now, if any. */
  current: HandheldCountBin | null
}

export interface CountDueClass {
  abcClass: AbcClass
  intervalDays: number
  items: number
  due: number
  /** Items of this class to count per working day to keep the interval. */
  perDay: number
}

export interface CountDuePlan {
  warehouseId: number
  classes: CountDueClass[]
  perDay: number
}

export interface CountHistoryRow {
  lineId: number
  countId: number
  scope: CountScope
  warehouseCode: string
  binCode: string
  sku: string
  itemName: string
  lotCode: string | null
  attempt: number
  status: CountLineStatus
  expectedQty: number | null
  countedQty: number | null
  variance: number | null
  varianceValue?: string | null
  countedBy: string | null
  countedAt: string | null
  reviewedBy: string | null
}

export interface CountAccuracyRow {
  warehouseId: number
  warehouseCode: string
  /** YYYY-MM in the asked time zone. */
  month: string
  linesCounted: number
  linesRight: number
  accuracy: number | null
  valueOff?: string
  valueNet?: string
}
