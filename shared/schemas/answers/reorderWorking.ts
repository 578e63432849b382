// The answers' schemas for the interfaces in shared/inventory/reorder.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { PolicyOverride, ReorderStatus, ReorderPolicy, Explanation } from '../../inventory/reorder.js'
import { moneyShape, reorderStepShape } from './terms.js'

const policyOverrideShape = z.object({
  value: z.number(),
  reason: z.string()
}) satisfies z.ZodType<PolicyOverride>

export const reorderStatusShape = z.union([z.literal('orderNow'), z.literal('orderSoon'), z.literal('overstocked'), z.literal('deadStock'), z.literal('ok')]) satisfies z.ZodType<ReorderStatus>

export const reorderPolicyShape = z.object({
  serviceLevel: z.number(),
  leadTimeDays: z.number(),
  leadTimeSdDays: z.number(),
  reviewPeriodDays: z.number(),
  costPerOrder: moneyShape,
  holdingRatePerYear: z.number(),
  method: z.union([z.literal('eoq'), z.literal('orderUpTo')]),
  soonDays: z.number(),
  overstockMarginDays: z.number(),
  deadStockDays: z.number(),
  overrides: z.object({
    safetyStock: policyOverrideShape.optional(),
    reorderPoint: policyOverrideShape.optional(),
    orderQuantity: policyOverrideShape.optional(),
    orderUpToLevel: policyOverrideShape.optional()
  }).optional()
}) satisfies z.ZodType<ReorderPolicy>

export const explanationShape = z.object({
  inputs: z.record(z.string(), z.union([z.number(), z.string()]).nullable()),
  steps: z.array(z.string()),
  words: z.array(reorderStepShape)
}) satisfies z.ZodType<Explanation>
