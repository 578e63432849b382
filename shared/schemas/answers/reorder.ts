// The answers' schemas for the interfaces in shared/schemas/reorder.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import { POLICY_SCOPES } from '../reorder.js'
import type { PolicyScopeName, LeadTimeSource, PolicySource, UsageWindow, UsageFigures, LeadTimeFigures, UsageHistory, AcceptResult, ReorderChoices, ReorderLine, SuggestionList, ReorderLineDetail, ReorderPolicyView, AbcParetoItem, AbcPareto } from '../reorder.js'
import { abcClassShape, codedRefShape, itemFamilyShape, moneyShape } from './terms.js'
import { explanationShape, reorderPolicyShape, reorderStatusShape } from './reorderWorking.js'

const policyScopeNameShape = z.enum(POLICY_SCOPES) satisfies z.ZodType<PolicyScopeName>

const leadTimeSourceShape = z.union([z.literal('observed'), z.literal('vendorItem'), z.literal('vendor'), z.literal('default')]) satisfies z.ZodType<LeadTimeSource>

const policySourceShape = z.union([z.literal('default'), policyScopeNameShape]) satisfies z.ZodType<PolicySource>

/** The ABC cut-offs: where class A ends and where class B ends. */
const abcCutoffsShape = z.object({
  a: z.number(),
  b: z.number()
})

const usageWindowShape = z.object({
  start: z.string(),
  end: z.string(),
  days: z.number()
}) satisfies z.ZodType<UsageWindow>

const usageFiguresShape = z.object({
  sum: z.number(),
  sumSquares: z.number(),
  daysWithUse: z.number(),
  firstHalfMean: z.number(),
  secondHalfMean: z.number(),
  lookbackDays: z.number()
}) satisfies z.ZodType<UsageFigures>

const leadTimeFiguresShape = z.object({
  source: leadTimeSourceShape,
  meanDays: z.number(),
  sdDays: z.number(),
  statedDays: z.number().nullable(),
  observations: z.number()
}) satisfies z.ZodType<LeadTimeFigures>

const usageHistoryShape = z.object({
  daily: z.array(z.object({
    date: z.string(),
    qty: z.number()
  })),
  projection: z.array(z.object({
    date: z.string(),
    position: z.number()
  })),
  horizonDays: z.number()
}) satisfies z.ZodType<UsageHistory>

export const acceptResultShape = z.object({
  accepted: z.array(z.object({
    id: z.number(),
    itemId: z.number(),
    warehouseId: z.number(),
    vendorId: z.number(),
    qty: z.number()
  })),
  skipped: z.array(z.object({
    itemId: z.number(),
    warehouseId: z.number(),
    reason: z.union([z.literal('noVendor'), z.literal('alreadyAccepted'), z.literal('nothingToOrder'), z.literal('notFound')])
  }))
}) satisfies z.ZodType<AcceptResult>

export const reorderChoicesShape = z.object({
  warehouses: z.array(codedRefShape),
  vendors: z.array(codedRefShape),
  families: z.array(itemFamilyShape)
}) satisfies z.ZodType<ReorderChoices>

const reorderLineShape = z.object({
  key: z.string(),
  itemId: z.number(),
  sku: z.string(),
  name: z.string(),
  family: itemFamilyShape,
  warehouseId: z.number(),
  warehouseCode: z.string(),
  vendorId: z.number().nullable(),
  vendorCode: z.string().nullable(),
  packSize: z.number(),
  minimumOrder: z.number(),
  abcClass: abcClassShape,
  onHand: z.number(),
  onOrder: z.number(),
  reserved: z.number(),
  position: z.number(),
  meanDaily: z.number(),
  sdDaily: z.number(),
  annualUsage: z.number(),
  unitCost: moneyShape,
  annualValue: moneyShape,
  lastUsedDate: z.string().nullable(),
  daysSinceLastUse: z.number().nullable(),
  trendRatio: z.number().nullable(),
  leadTimeDays: z.number(),
  leadTimeSdDays: z.number(),
  leadTimeSource: leadTimeSourceShape,
  safetyStock: z.number(),
  reorderPoint: z.number(),
  eoq: z.number().nullable(),
  lotSize: z.number(),
  orderUpToLevel: z.number().nullable(),
  suggestedOrder: z.number(),
  daysOfSupply: z.number().nullable(),
  status: reorderStatusShape,
  pendingQty: z.number(),
  openSuggestionId: z.number().nullable(),
  overridden: z.boolean(),
  blockedBy: z.union([z.literal('noVendor'), z.literal('alreadyAccepted'), z.literal('nothingToOrder')]).nullable()
}) satisfies z.ZodType<ReorderLine>

export const suggestionListShape = z.object({
  asOf: z.string(),
  window: usageWindowShape,
  importedHistoryDays: z.number(),
  abcCutoffs: abcCutoffsShape,
  counts: z.record(reorderStatusShape, z.number()),
  lines: z.array(reorderLineShape)
}) satisfies z.ZodType<SuggestionList>

export const reorderLineDetailShape = z.object({
  window: usageWindowShape,
  line: reorderLineShape,
  policy: reorderPolicyShape,
  policySources: z.record(z.string(), policySourceShape),
  overrideReason: z.string().nullable(),
  usage: usageFiguresShape,
  leadTime: leadTimeFiguresShape,
  explanation: explanationShape,
  history: usageHistoryShape
}) satisfies z.ZodType<ReorderLineDetail>

export const reorderPolicyViewShape = z.object({
  id: z.number(),
  scope: policyScopeNameShape,
  family: itemFamilyShape.nullable(),
  abcClass: abcClassShape.nullable(),
  itemId: z.number().nullable(),
  itemSku: z.string().nullable(),
  warehouseId: z.number().nullable(),
  warehouseCode: z.string().nullable(),
  serviceLevel: z.number().nullable(),
  reviewPeriodDays: z.number().nullable(),
  costPerOrder: moneyShape.nullable(),
  holdingRatePerYear: z.number().nullable(),
  method: z.union([z.literal('eoq'), z.literal('orderUpTo')]).nullable(),
  soonDays: z.number().nullable(),
  overstockMarginDays: z.number().nullable(),
  deadStockDays: z.number().nullable(),
  usageWindowDays: z.number().nullable(),
  abcCutoffA: z.number().nullable(),
  abcCutoffB: z.number().nullable(),
  overrideReorderPoint: z.number().nullable(),
  overrideOrderQty: z.number().nullable(),
  overrideReason: z.string().nullable(),
  note: z.string().nullable(),
  updatedBy: z.string().nullable(),
  updatedAt: z.string()
}) satisfies z.ZodType<ReorderPolicyView>

const abcParetoItemShape = z.object({
  itemId: z.number(),
  sku: z.string(),
  annualValue: moneyShape,
  cumulativePercent: z.number(),
  abcClass: abcClassShape
}) satisfies z.ZodType<AbcParetoItem>

export const abcParetoShape = z.object({
  window: usageWindowShape,
  cutoffs: abcCutoffsShape,
  annualValueTotal: moneyShape,
  items: z.array(abcParetoItemShape),
  summary: z.record(abcClassShape, z.object({
    count: z.number(),
    annualValue: moneyShape,
    shareOfItems: z.number(),
    shareOfValue: z.number()
  }))
}) satisfies z.ZodType<AbcPareto>
