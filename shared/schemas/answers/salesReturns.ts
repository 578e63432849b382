// The answers' schemas for the interfaces in shared/schemas/salesReturns.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import { RETURN_SETTLEMENTS } from '../salesReturns.js'
import type { ReturnSettlement, ReturnTaken, SalesReturnView } from '../salesReturns.js'

const returnSettlementShape = z.enum(RETURN_SETTLEMENTS) satisfies z.ZodType<ReturnSettlement>

export const salesReturnViewShape = z.object({
  id: z.number(),
  number: z.string(),
  salesOrderId: z.number(),
  settleBy: returnSettlementShape,
  reference: z.string().nullable(),
  goods: z.string(),
  tax: z.string(),
  restockingPercent: z.string(),
  restockingFee: z.string(),
  refund: z.string(),
  note: z.string().nullable(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  lines: z.array(z.object({
    orderLineId: z.number(),
    sku: z.string(),
    qty: z.number(),
    goods: z.string(),
    tax: z.string(),
    binCode: z.string(),
    lotCode: z.string().nullable()
  }))
}) satisfies z.ZodType<SalesReturnView>

/** What taking a return answers: the return, and the contractor's account credit after it. */
export const returnTakenShape = salesReturnViewShape.extend({ accountCredit: z.string() }) satisfies z.ZodType<ReturnTaken>
