// Reorder suggestions, policies and accepting: requests the server parses (and forms validate) and the answers.
import { z } from 'zod'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import { ITEM_FAMILIES, type ItemFamily } from '../catalog.js'
import type { AbcClass } from '../inventory/abc.js'
import type { Explanation, ReorderPolicy, ReorderStatus } from '../inventory/reorder.js'
import type { Money } from '../money.js'
import { idSchema } from './stock.js'

export const REORDER_STATUSES = ['orderNow', 'orderSoon', 'overstocked', 'deadStock', 'ok'] as const satisfies readonly ReorderStatus[]
export const ABC_CLASSES = ['A', 'B', 'C'] as const satisfies readonly AbcClass[]
export const POLICY_SCOPES = ['global', 'family', 'abc', 'item_warehouse'] as const
export type PolicyScopeName = (typeof POLICY_SCOPES)[number]
export const REORDER_METHODS = ['eoq', 'orderUpTo'] as const

export const USAGE_WINDOW_DEFAULT_DAYS = 180
export const USAGE_WINDOW_MIN_DAYS = 28
export const USAGE_WINDOW_MAX_DAYS = 730

const windowDaysSchema = z.coerce
  .number()
  .int()
  .min(USAGE_WINDOW_MIN_DAYS)
  .max(USAGE_WINDOW_MAX_DAYS)

export const suggestionQuerySchema = z.object({
  warehouseId: idSchema.optional(),
  vendorId: idSchema.optional(),
  family: z.enum(ITEM_FAMILIES).optional(),
  abc: z.enum(ABC_CLASSES).optional(),
  status: z.enum(REORDER_STATUSES).optional(),
  windowDays: windowDaysSchema.optional(),
})
export type SuggestionQuery = z.infer<typeof suggestionQuerySchema>

export const lineQuerySchema = z.object({ windowDays: windowDaysSchema.optional() })

export const historyQuerySchema = z.object({
  windowDays: windowDaysSchema.optional(),
  horizonDays: z.coerce.number().int().min(0).max(365).optional(),
})

const days = (max: number) => z.number().int().min(0).max(max)
const share = z.number().gt(0).max(1)
const nullable = <T extends z.ZodType>(schema: T) => schema.nullable().optional()

/** Every setting a layer may hold; null or absent inherits from the layer before. */
export const policyFieldsSchema = z.object({
  serviceLevel: nullable(z.number().min(0.5).max(0.999)),
  reviewPeriodDays: nullable(days(365).min(1)),
  costPerOrder: nullable(z.string().trim().regex(/^\d{1,8}(\.\d{1,2})?$/, issueCode('amount_format'))),
  holdingRatePerYear: nullable(z.number().min(0).max(2)),
  method: nullable(z.enum(REORDER_METHODS)),
  soonDays: nullable(days(365)),
  overstockMarginDays: nullable(days(730)),
  deadStockDays: nullable(days(1095).min(1)),
  usageWindowDays: nullable(windowDaysSchema),
  abcCutoffA: nullable(share),
  abcCutoffB: nullable(share),
  overrideReorderPoint: nullable(z.number().int().min(0).max(1_000_000)),
  overrideOrderQty: nullable(z.number().int().min(1).max(1_000_000)),
  overrideReason: nullable(z.string().trim().max(200)),
  note: nullable(z.string().trim().max(200)),
})

const GLOBAL_ONLY = ['usageWindowDays', 'abcCutoffA', 'abcCutoffB'] as const
const OVERRIDES = ['overrideReorderPoint', 'overrideOrderQty'] as const

export const policyUpsertSchema = policyFieldsSchema
  .extend({
    scope: z.enum(POLICY_SCOPES),
    family: z.enum(ITEM_FAMILIES).optional(),
    abcClass: z.enum(ABC_CLASSES).optional(),
    itemId: idSchema.optional(),
    warehouseId: idSchema.optional(),
  })
  .superRefine((v, ctx) => {
    const need = (field: 'family' | 'abcClass' | 'itemId' | 'warehouseId') => {
      if (v[field] === undefined) ctx.addIssue({ code: 'custom', path: [field], ...issueOf('required_for_scope') })
    }
    if (v.scope === 'family') need('family')
    if (v.scope === 'abc') need('abcClass')
    if (v.scope === 'item_warehouse') { need('itemId'); need('warehouseId') }
    if (v.scope !== 'global') {
      for (const f of GLOBAL_ONLY) if (v[f] != null) ctx.addIssue({ code: 'custom', path: [f], ...issueOf('global_policy_only') })
    }
    const overridden = OVERRIDES.filter((f) => v[f] != null)
    if (overridden.length && v.scope !== 'item_warehouse') {
      for (const f of overridden) ctx.addIssue({ code: 'custom', path: [f], ...issueOf('override_item_only') })
    }
    if (overridden.length && !v.overrideReason) {
      ctx.addIssue({ code: 'custom', path: ['overrideReason'], ...issueOf('override_reason_needed') })
    }
    if (v.abcCutoffA != null && v.abcCutoffB != null && v.abcCutoffA > v.abcCutoffB) {
      ctx.addIssue({ code: 'custom', path: ['abcCutoffB'], ...issueOf('abc_cutoffs_order') })
    }
  })
export type PolicyUpsertInput = z.infer<typeof policyUpsertSchema>

export const acceptSchema = z.object({
  lines: z
    .array(z.object({
      itemId: idSchema,
      warehouseId: idSchema,
      qty: z.number().int().positive().max(1_000_000).optional(),
    }))
    .min(1)
    .max(2000),
})
export type AcceptInput = z.infer<typeof acceptSchema>

// ---- answers ----

export type LeadTimeSource = 'observed' | 'vendorItem' | 'vendor' | 'default'
export type PolicySource = 'default' | PolicyScopeName

export interface ReorderLine {
  key: string
  itemId: number
  sku: string
  name: string
  family: ItemFamily
  warehouseId: number
  warehouseCode: string
  vendorId: number | null
  vendorCode: string | null
  packSize: number
  minimumOrder: number
  abcClass: AbcClass
  onHand: number
  onOrder: number
  reserved: number
  position: number
  meanDaily: number
  sdDaily: number
  annualUsage: number
  unitCost: Money
  annualValue: Money
  lastUsedDate: string | null
  daysSinceLastUse: number | null
  /** Mean daily use in the window's second half ÷ first half; null without use in the first half. */
  trendRatio: number | null
  leadTimeDays: number
  leadTimeSdDays: number
  leadTimeSource: LeadTimeSource
  safetyStock: number
  reorderPoint: number
  eoq: number | null
  lotSize: number
  orderUpToLevel: number | null
  suggestedOrder: number
  daysOfSupply: number | null
  status: ReorderStatus
  /** Accepted suggestions and draft purchase orders not yet counted as on order. */
  pendingQty: number
  openSuggestionId: number | null
  overridden: boolean
  /** Why the line cannot be accepted now, if it cannot. */
  blockedBy: 'noVendor' | 'alreadyAccepted' | 'nothingToOrder' | null
}

export interface UsageWindow {
  start: string
  end: string
  days: number
}

export interface SuggestionList {
  asOf: string
  window: UsageWindow
  /** Days of the window that imported usage history (from before Lumenyard) covers; 0 when none. */
  importedHistoryDays: number
  abcCutoffs: { a: number; b: number }
  counts: Record<ReorderStatus, number>
  lines: ReorderLine[]
}

export interface UsageFigures {
  sum: number
  sumSquares: number
  daysWithUse: number
  firstHalfMean: number
  secondHalfMean: number
  lookbackDays: number
}

export interface LeadTimeFigures {
  source: LeadTimeSource
  meanDays: number
  sdDays: number
  statedDays: number | null
  observations: number
}

export interface ReorderLineDetail {
  window: UsageWindow
  line: ReorderLine
  policy: ReorderPolicy
  policySources: Partial<Record<keyof ReorderPolicy, PolicySource>>
  overrideReason: string | null
  usage: UsageFigures
  leadTime: LeadTimeFigures
  explanation: Explanation
  history: UsageHistory
}

export interface UsageHistory {
  /** Every day of the window, days without use included as 0. */
  daily: { date: string; qty: number }[]
  /** Position from today at the mean rate, over the lead time and the horizon; no receipts assumed. */
  projection: { date: string; position: number }[]
  horizonDays: number
}

export interface ReorderPolicyView {
  id: number
  scope: PolicyScopeName
  family: ItemFamily | null
  abcClass: AbcClass | null
  itemId: number | null
  itemSku: string | null
  warehouseId: number | null
  warehouseCode: string | null
  serviceLevel: number | null
  reviewPeriodDays: number | null
  costPerOrder: Money | null
  holdingRatePerYear: number | null
  method: 'eoq' | 'orderUpTo' | null
  soonDays: number | null
  overstockMarginDays: number | null
  deadStockDays: number | null
  usageWindowDays: number | null
  abcCutoffA: number | null
  abcCutoffB: number | null
  overrideReorderPoint: number | null
  overrideOrderQty: number | null
  overrideReason: string | null
  note: string | null
  updatedBy: string | null
  updatedAt: string
}

export interface AcceptResult {
  accepted: { id: number; itemId: number; warehouseId: number; vendorId: number; qty: number }[]
  skipped: { itemId: number; warehouseId: number; reason: 'noVendor' | 'alreadyAccepted' | 'nothingToOrder' | 'notFound' }[]
}

export interface AbcParetoItem {
  itemId: number
  sku: string
  annualValue: Money
  cumulativePercent: number
  abcClass: AbcClass
}

export interface AbcPareto {
  window: UsageWindow
  cutoffs: { a: number; b: number }
  annualValueTotal: Money
  items: AbcParetoItem[]
  summary: Record<AbcClass, { count: number; annualValue: Money; shareOfItems: number; shareOfValue: number }>
}

export interface ReorderChoices {
  warehouses: { id: number; code: string; name: string }[]
  vendors: { id: number; code: string; name: string }[]
  families: readonly ItemFamily[]
}
