// The answers' schemas for the interfaces in shared/schemas/counts.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { CountAccuracyRow, CountScopeDetail, CountSettings, CountSummary, CountLineView, CountDetail, HandheldBinRow, HandheldCountBin, HandheldCount, CountDueClass, CountDuePlan, CountHistoryRow } from '../counts.js'
import { abcClassShape, codedRefShape, countBinStatusShape, countIntervalsShape, countLineSourceShape, countLineStatusShape, countReviewerChoiceShape, countScopeShape, countStatusShape, withheldCost } from './terms.js'

export const countAccuracyRowShape = z.object({
  warehouseId: z.number(),
  warehouseCode: z.string(),
  month: z.string(),
  linesCounted: z.number(),
  linesRight: z.number(),
  accuracy: z.number().nullable(),
  valueOff: withheldCost(z.string()),
  valueNet: withheldCost(z.string())
}) satisfies z.ZodType<CountAccuracyRow>

const countScopeDetailShape = z.object({
  aisle: z.string().optional(),
  bins: z.number().optional(),
  classes: z.array(abcClassShape).optional(),
  items: z.number().optional()
}) satisfies z.ZodType<CountScopeDetail>

export const countSettingsShape = z.object({
  reviewerRoles: z.array(countReviewerChoiceShape),
  intervals: countIntervalsShape
}) satisfies z.ZodType<CountSettings>

export const countSummaryShape = z.object({
  id: z.number(),
  warehouse: codedRefShape,
  scope: countScopeShape,
  scopeDetail: countScopeDetailShape,
  status: countStatusShape,
  note: z.string().nullable(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  closedAt: z.string().nullable(),
  binCounts: z.object({
    total: z.number(),
    done: z.number()
  }),
  lineCounts: z.object({
    waiting: z.number(),
    toReview: z.number(),
    settled: z.number()
  }),
  valueOff: withheldCost(z.string())
}) satisfies z.ZodType<CountSummary>

const countLineViewShape = z.object({
  id: z.number(),
  binId: z.number(),
  binCode: z.string(),
  itemId: z.number(),
  sku: z.string(),
  itemName: z.string(),
  stockUnit: z.string(),
  lotId: z.number().nullable(),
  lotCode: z.string().nullable(),
  attempt: z.number(),
  source: countLineSourceShape,
  status: countLineStatusShape,
  snapshotQty: z.number().nullable(),
  movesSince: z.number().nullable(),
  expectedQty: z.number().nullable(),
  countedQty: z.number().nullable(),
  variance: z.number().nullable(),
  unitCost: withheldCost(z.string().nullable()),
  varianceValue: withheldCost(z.string().nullable()),
  countedBy: z.string().nullable(),
  countedById: z.number().nullable(),
  countedAt: z.string().nullable(),
  reviewedBy: z.string().nullable(),
  reviewedAt: z.string().nullable(),
  reviewNote: z.string().nullable(),
  moveId: z.string().nullable(),
  pickListId: z.number().nullable()
}) satisfies z.ZodType<CountLineView>

export const countDetailShape = countSummaryShape.extend({
  bins: z.array(z.object({
    binId: z.number(),
    binCode: z.string(),
    status: countBinStatusShape,
    visits: z.number(),
    startedBy: z.string().nullable(),
    finishedAt: z.string().nullable()
  })),
  lines: z.array(countLineViewShape),
  movesDuring: z.record(z.number(), z.array(z.object({
    id: z.string(),
    at: z.string(),
    moveType: z.string(),
    qty: z.number(),
    by: z.string().nullable()
  }))),
  canReview: z.boolean()
}) satisfies z.ZodType<CountDetail>

const handheldBinRowShape = z.object({
  binId: z.number(),
  binCode: z.string(),
  status: countBinStatusShape,
  startedBy: z.string().nullable()
}) satisfies z.ZodType<HandheldBinRow>

const handheldCountBinShape = handheldBinRowShape.extend({
  asked: z.array(z.object({
    itemId: z.number(),
    sku: z.string(),
    itemName: z.string(),
    lotCode: z.string().nullable()
  })),
  entered: z.array(z.object({
    lineId: z.number(),
    itemId: z.number(),
    sku: z.string(),
    itemName: z.string(),
    lotCode: z.string().nullable(),
    qty: z.number()
  }))
}) satisfies z.ZodType<HandheldCountBin>

export const handheldCountShape = z.object({
  id: z.number(),
  warehouse: codedRefShape,
  scope: countScopeShape,
  scopeDetail: countScopeDetailShape,
  status: countStatusShape,
  itemsOnly: z.boolean(),
  bins: z.array(handheldBinRowShape),
  current: handheldCountBinShape.nullable()
}) satisfies z.ZodType<HandheldCount>

const countDueClassShape = z.object({
  abcClass: abcClassShape,
  intervalDays: z.number(),
  items: z.number(),
  due: z.number(),
  perDay: z.number()
}) satisfies z.ZodType<CountDueClass>

export const countDuePlanShape = z.object({
  warehouseId: z.number(),
  classes: z.array(countDueClassShape),
  perDay: z.number()
}) satisfies z.ZodType<CountDuePlan>

export const countHistoryRowShape = z.object({
  lineId: z.number(),
  countId: z.number(),
  scope: countScopeShape,
  warehouseCode: z.string(),
  binCode: z.string(),
  sku: z.string(),
  itemName: z.string(),
  lotCode: z.string().nullable(),
  attempt: z.number(),
  status: countLineStatusShape,
  expectedQty: z.number().nullable(),
  countedQty: z.number().nullable(),
  variance: z.number().nullable(),
  varianceValue: withheldCost(z.string().nullable()),
  countedBy: z.string().nullable(),
  countedAt: z.string().nullable(),
  reviewedBy: z.string().nullable()
}) satisfies z.ZodType<CountHistoryRow>
