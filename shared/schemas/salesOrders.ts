// Sales orders at the counter: made by taking a quote, cancelled while nothing has left (holds released),
// and the payments recorded against them by hand (cash, cheque).
import { z } from 'zod'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import type { PaymentMethod, PaymentStatus, SalesOrderStatus } from '../sales/salesOrderTerms.js'
import { percentSchema, priceSchema } from './pricing.js'
import { idSchema } from './stock.js'

export const salesOrderFromQuoteSchema = z.object({ quoteId: idSchema })

export const salesOrderCancelSchema = z.object({ reason: z.string().trim().min(1).max(200) })

export const salesOrderQuerySchema = z.object({
  status: z.enum(['open', 'all', 'booked', 'ready', 'handed_over', 'cancelled']).default('open'),
  customerId: idSchema.optional(),
  /** Orders waiting on a special order (the buyer's view). */
  specialOnly: z.enum(['true', 'false']).optional().transform((v) => v === 'true'),
  q: z.string().trim().max(80).optional(),
})

/** A payment taken by hand at the counter. A cheque carries its number. */
export const handPaymentSchema = z
  .object({
    method: z.enum(['cash', 'cheque']),
    amount: priceSchema.refine((v) => Number(v) > 0, issueOf('at_least', { min: 0.01 })),
    reference: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.string().trim().max(40).nullable()).default(null),
  })
  .superRefine((v, ctx) => {
    if (v.method === 'cheque' && !v.reference) ctx.addIssue({ code: 'custom', path: ['reference'], ...issueOf('cheque_number_needed') })
  })
export type HandPaymentInput = z.infer<typeof handPaymentSchema>

/**
 * Confirming a card deposit: the token the payment provider gave for the card entered on its side. Never a
 * card number (a token starts with the provider's `pm_` and is not all digits); no other field is taken.
 */
export const cardConfirmSchema = z.object({ cardToken: z.string().trim().regex(/^pm_[A-Za-z0-9_]{3,80}$/, issueCode('card_token_format')) }).strict()

/** The counter's sales policy; a change names only what it changes. */
export const salesSettingsSchema = z
  .object({
    depositPercent: percentSchema,
    /** Days after the order is booked in which unopened goods may come back (0: no returns). */
    returnWindowDays: z.coerce.number().int().min(0).max(365),
    restockingPercent: percentSchema,
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, issueOf('settings_nothing_to_change'))
export interface SalesSettings {
  depositPercent: string
  returnWindowDays: number
  restockingPercent: string
}

export interface SalesOrderLineView {
  id: number
  lineNo: number
  itemId: number
  sku: string
  description: string
  qty: number
  unitPrice: string
  extension: string
  tax: string
  madeToOrder: boolean
  qtyReserved: number
  qtyPicked: number
  qtyHandedOver: number
  qtyReturned: number
  /** The special order's PO line (made-to-order lines), its PO number and status. */
  poLineId: number | null
  poId: number | null
  poNumber: string | null
  poStatus: string | null
}

export interface PaymentView {
  id: number
  method: PaymentMethod
  amount: string
  status: PaymentStatus
  reference: string | null
  recordedBy: string | null
  recordedAt: string
  refundedAmount: string
}

export interface SalesOrderSummary {
  id: number
  number: string
  quoteId: number
  quoteNumber: string
  status: SalesOrderStatus
  customerId: number
  customerName: string
  jobId: number | null
  jobName: string | null
  warehouseId: number
  warehouseCode: string
  total: string
  depositRequired: string
  depositPaid: string
  /** Deposit still to pay before the special order goes to the vendor (0.00 when none or paid). */
  depositDue: string
  createdAt: string
}

export interface SalesOrderDetail extends SalesOrderSummary {
  subtotal: string
  taxAmount: string
  depositPercent: string
  balanceDue: string
  cancelReason: string | null
  cancelledAt: string | null
  createdBy: string | null
  lines: SalesOrderLineView[]
  payments: PaymentView[]
}
