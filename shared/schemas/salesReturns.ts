// Goods a contractor brings back against a sales order: which handed-over lines, how many (whole packs,
// unopened), into which bin and lot, and how the money goes back (a refund by cash, cheque or the card paid
// with, or a credit on the contractor's account). The counter's form checks with these same schemas.
import { z } from 'zod'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import { idSchema, qtySchema } from './stock.js'

export const RETURN_SETTLEMENTS = ['credit', 'cash', 'cheque', 'card'] as const
export type ReturnSettlement = (typeof RETURN_SETTLEMENTS)[number]

const blankToNull = (v: unknown) => (v === '' || v === undefined ? null : v)

export const returnLineSchema = z.object({
  orderLineId: idSchema,
  qty: qtySchema,
  binId: idSchema,
  lotCode: z.preprocess(blankToNull, z.string().trim().min(1).max(20).regex(/^[A-Za-z0-9._/-]+$/, issueCode('lot_code_chars')).nullable()).default(null),
  /** The clerk has seen the packs sealed, as they left. */
  unopened: z.boolean(),
})

export const salesReturnSchema = z
  .object({
    lines: z.array(returnLineSchema).min(1, issueCode('lines_needed')).max(200),
    settleBy: z.enum(RETURN_SETTLEMENTS),
    /** The cheque's number when the refund is a cheque. */
    reference: z.preprocess(blankToNull, z.string().trim().max(40).nullable()).default(null),
    note: z.preprocess(blankToNull, z.string().trim().max(200).nullable()).default(null),
  })
  .superRefine((v, ctx) => {
    if (v.settleBy === 'cheque' && !v.reference) ctx.addIssue({ code: 'custom', path: ['reference'], ...issueOf('cheque_number_needed') })
    const seen = new Set<number>()
    v.lines.forEach((l, i) => {
      if (seen.has(l.orderLineId)) ctx.addIssue({ code: 'custom', path: ['lines', i, 'orderLineId'], ...issueOf('return_line_twice') })
      seen.add(l.orderLineId)
    })
  })
export type SalesReturnInput = z.infer<typeof salesReturnSchema>

export interface SalesReturnView {
  id: number
  number: string
  salesOrderId: number
  settleBy: ReturnSettlement
  reference: string | null
  goods: string
  tax: string
  restockingPercent: string
  restockingFee: string
  refund: string
  note: string | null
  createdBy: string | null
  createdAt: string
  lines: { orderLineId: number; sku: string; qty: number; goods: string; tax: string; binCode: string; lotCode: string | null }[]
}

/** What taking a return answers: the return, and the contractor's account credit after it. */
export interface ReturnTaken extends SalesReturnView {
  /** The contractor's account credit after this return (a return settled as credit adds to it). */
  accountCredit: string
}

/** The returns policy the admin sets: days after the order is booked, and the fee in percent of the goods. */
export const DEFAULT_RETURN_WINDOW_DAYS = 30 // common practice: 30 days for unopened stock goods
export const DEFAULT_RESTOCKING_PERCENT = '15' // common practice: building suppliers charge 15–25 %
