// The shared words of answers (statuses, kinds, units, money, problems) as schemas, for the answer shapes beside
// this file. Each is built from the list the rest of the code declares, so a new status is accepted everywhere.
import { z } from 'zod'
import { AUDIT_KINDS } from '../../audit/auditKinds.js'
import { BIN_KINDS, ITEM_FAMILIES, MOVE_TYPES, STOCK_UNITS } from '../../catalog.js'
import { COUNT_REVIEWER_CHOICES } from '../../counts/countReviewRules.js'
import { COUNT_BIN_STATUSES, COUNT_LINE_SOURCES, COUNT_LINE_STATUSES, COUNT_SCOPES, COUNT_STATUSES } from '../../counts/countTerms.js'
import type { ErrorCode, ErrorParams, RowProblem } from '../../errors/errorCodes.js'
import { REORDER_STEPS_EN, type ReorderStep } from '../../inventory/reorderWords.js'
import type { HandlingCaution } from '../../picking/handling.js'
import { HANDOVER_KINDS, HANDOVER_STATUSES } from '../../sales/handoverTerms.js'
import { QUOTE_STATUSES } from '../../sales/quoteStatus.js'
import { PAYMENT_METHODS, PAYMENT_STATUSES, SALES_ORDER_STATUSES } from '../../sales/salesOrderTerms.js'

export { materialRuleSchema as materialRuleShape } from '../takeoff.js'
export { deadStockQuerySchema as deadStockQueryShape } from '../reports.js'

/** A record named by its code and name (a warehouse, a vendor) beside its id. */
export const codedRefShape = z.object({ id: z.number(), code: z.string(), name: z.string() })

/**
 * A cost in an answer that callers without cost access also read: the API leaves every cost field out for them
 * (COST_FIELDS in server/services/costVisibility.ts), so it may be absent. An answer only buyers and admins read
 * keeps its costs required, so a missing one is still caught.
 */
export const withheldCost = <T extends z.ZodType>(shape: T) => shape.optional()

/** Money travels as a decimal string ("12.50"). */
export const moneyShape = z.string().regex(/^-?\d+(\.\d+)?$/)
export const abcClassShape = z.enum(['A', 'B', 'C'])
export const auditKindShape = z.enum(AUDIT_KINDS)
export const binKindShape = z.enum(BIN_KINDS)
export const itemFamilyShape = z.enum(ITEM_FAMILIES)
export const moveTypeShape = z.enum(MOVE_TYPES)
export const stockUnitShape = z.enum(STOCK_UNITS)
export const countBinStatusShape = z.enum(COUNT_BIN_STATUSES)
export const countLineSourceShape = z.enum(COUNT_LINE_SOURCES)
export const countLineStatusShape = z.enum(COUNT_LINE_STATUSES)
export const countReviewerChoiceShape = z.enum(COUNT_REVIEWER_CHOICES)
export const countScopeShape = z.enum(COUNT_SCOPES)
export const countStatusShape = z.enum(COUNT_STATUSES)
export const countIntervalsShape = z.object({ A: z.number(), B: z.number(), C: z.number() })
export const quoteStatusShape = z.enum(QUOTE_STATUSES)
export const salesOrderStatusShape = z.enum(SALES_ORDER_STATUSES)
export const paymentMethodShape = z.enum(PAYMENT_METHODS)
export const paymentStatusShape = z.enum(PAYMENT_STATUSES)
export const handoverKindShape = z.enum(HANDOVER_KINDS)
export const handoverStatusShape = z.enum(HANDOVER_STATUSES)
export const handlingCautionShape = z.enum(['team_lift', 'use_cart', 'pallet_equipment', 'glass_edges']) satisfies z.ZodType<HandlingCaution>

export const errorCodeShape = z.string() as z.ZodType<ErrorCode>
export const errorParamsShape = z.record(
  z.string(),
  z.union([z.string(), z.number(), z.boolean(), z.null(), z.array(z.string())]),
) satisfies z.ZodType<ErrorParams>
export const rowProblemShape = z.object({
  column: z.string().nullable(),
  problem: z.object({ code: errorCodeShape, params: errorParamsShape.optional() }),
}) satisfies z.ZodType<RowProblem>
export const reorderStepShape = z.object({
  k: z.enum(Object.keys(REORDER_STEPS_EN) as [keyof typeof REORDER_STEPS_EN]),
  p: z.record(z.string(), z.union([z.string(), z.number()])).optional(),
}) satisfies z.ZodType<ReorderStep>
