// The answers' schemas for the interfaces in shared/schemas/pricing.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { PriceLevelSummary, PriceRuleSummary, TaxRateSummary, CustomerTermsSummary } from '../pricing.js'

export const priceLevelSummaryShape = z.object({
  id: z.number(),
  code: z.string(),
  name: z.string(),
  percentOff: z.string().nullable(),
  active: z.boolean(),
  accounts: z.number(),
  rules: z.number(),
  version: z.number().int(),
}) satisfies z.ZodType<PriceLevelSummary>

export const priceRuleSummaryShape = z.object({
  id: z.number(),
  levelId: z.number().nullable(),
  levelCode: z.string().nullable(),
  itemId: z.number(),
  sku: z.string(),
  itemName: z.string(),
  listPrice: z.string(),
  packSize: z.number(),
  sellByPack: z.boolean(),
  minQty: z.number(),
  basis: z.union([z.literal('unit'), z.literal('pack')]),
  price: z.string().nullable(),
  percentOff: z.string().nullable()
}) satisfies z.ZodType<PriceRuleSummary>

export const taxRateSummaryShape = z.object({
  warehouseId: z.number(),
  warehouseCode: z.string(),
  warehouseName: z.string(),
  ratePercent: z.string().nullable(),
  label: z.string().nullable()
}) satisfies z.ZodType<TaxRateSummary>

export const customerTermsSummaryShape = z.object({
  customerId: z.number(),
  code: z.string(),
  name: z.string(),
  priceLevelId: z.number().nullable(),
  priceLevelCode: z.string().nullable(),
  exemptCertificate: z.string().nullable(),
  exemptUntil: z.string().nullable()
}) satisfies z.ZodType<CustomerTermsSummary>
