// The answers' schemas for the interfaces in shared/schemas/reports.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { VendorRow, VendorReport, ValuationGroup, ValuationReport, TurnsFigureRow, TurnsRow, TurnsReport, DeadStockRow, DeadStockReport, UsageCell, UsageReport } from '../reports.js'
import { deadStockQueryShape, itemFamilyShape, moneyShape } from './terms.js'
import { turnsFiguresShape } from './stockTurns.js'

const vendorRowShape = z.object({
  vendorId: z.number(),
  code: z.string(),
  name: z.string(),
  orders: z.number(),
  withDate: z.number(),
  onTime: z.number(),
  onTimeRate: z.number().nullable(),
  leadDaysMean: z.number().nullable(),
  leadDaysMin: z.number().nullable(),
  leadDaysMax: z.number().nullable(),
  statedLeadDays: z.number()
}) satisfies z.ZodType<VendorRow>

export const vendorReportShape = z.object({
  from: z.string(),
  to: z.string(),
  vendors: z.array(vendorRowShape)
}) satisfies z.ZodType<VendorReport>

const valuationGroupShape = z.object({
  warehouseId: z.number(),
  warehouseCode: z.string(),
  family: itemFamilyShape,
  items: z.number(),
  onHand: z.number(),
  stockValue: moneyShape
}) satisfies z.ZodType<ValuationGroup>

export const valuationReportShape = z.object({
  asOf: z.string(),
  tz: z.string(),
  groups: z.array(valuationGroupShape),
  warehouses: z.array(z.object({
    warehouseId: z.number(),
    warehouseCode: z.string(),
    stockValue: moneyShape
  })),
  stockValue: moneyShape
}) satisfies z.ZodType<ValuationReport>

const turnsFigureRowShape = turnsFiguresShape.extend({
  usedQty: z.number(),
  usageValue: moneyShape,
  beginValue: moneyShape,
  endValue: moneyShape
}) satisfies z.ZodType<TurnsFigureRow>

const turnsRowShape = turnsFigureRowShape.extend({
  family: itemFamilyShape
}) satisfies z.ZodType<TurnsRow>

export const turnsReportShape = z.object({
  from: z.string(),
  to: z.string(),
  days: z.number(),
  families: z.array(turnsRowShape),
  total: turnsFigureRowShape.nullable()
}) satisfies z.ZodType<TurnsReport>

const deadStockRowShape = z.object({
  kind: z.union([z.literal('dead'), z.literal('slow')]),
  itemId: z.number(),
  sku: z.string(),
  name: z.string(),
  family: itemFamilyShape,
  warehouseId: z.number(),
  warehouseCode: z.string(),
  onHand: z.number(),
  lastUsedAt: z.string().nullable(),
  usedInWindow: z.number(),
  daysOfSupply: z.number().nullable(),
  avgCost: z.string(),
  stockValue: moneyShape
}) satisfies z.ZodType<DeadStockRow>

export const deadStockReportShape = deadStockQueryShape.omit({ 'warehouseId': true }).extend({
  rows: z.array(deadStockRowShape)
}) satisfies z.ZodType<DeadStockReport>

const usageCellShape = z.object({
  month: z.string(),
  family: itemFamilyShape,
  qty: z.number(),
  usageValue: moneyShape
}) satisfies z.ZodType<UsageCell>

export const usageReportShape = z.object({
  from: z.string(),
  to: z.string(),
  months: z.array(z.string()),
  cells: z.array(usageCellShape)
}) satisfies z.ZodType<UsageReport>
