// Sales orders at the counter: made by taking a quote, cancelled while nothing has left (holds released),
// and the payments recorded against them by hand (cash, cheque).
import { z } from 'zod'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import type { PaymentMethod, PaymentStatus, SalesOrderStatus } from '../sales/salesOrderTerms.js'
import { percentSchema, priceSchema } from './pricing.js'
import { newestPageQuery } from './newestPage.js'
import { idSchema } from './stock.js'

export const salesOrderFromQuoteSchema = z.object({ quoteId: idSchema })

export const salesOrderCancelSchema = z.object({ reason: z.string().trim().min(1).max(200) })

export const salesOrderQuerySchema = z.object({
  status: z.enum(['open', 'all', 'booked', 'ready', 'handed_over', 'cancelled']).default('open'),
  customerId: idSchema.optional(),
  /** Orders waiting on a special order (the buyer's view). */
  specialOnly: z.enum(['true', 'false']).optional().transform((v) => v === 'true'),
  q: z.string().trim().max(80).optional(),
  ...newestPageQuery,
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

/**
 * Confirming a card deposit: the token the payment provider gave for the card entered on its side. Never a
 * card number (a token starts with the provider's `pm_` and is not all digits); no other field is taken.
 */
export const cardConfirmSchema = z.object({ cardToken: z.string().trim().regex(/^pm_[A-Za-z0-9_]{3,80}$/, issueCode('card_token_format')) }).strict()

/**
 * Starting a card deposit: the amount the customer pays now, up to the deposit still due; left out, the whole
 * deposit due. Nothing about the card: it is entered on the provider's side.
 */
export const cardDepositStartSchema = z
  .object({ amount: priceSchema.refine((v) => Number(v) > 0, issueOf('at_least', { min: 0.01 })).optional() })
  .strict()
export type CardDepositStartInput = z.infer<typeof cardDepositStartSchema>

/**
 * Where a card deposit stands, as the counter follows it: waiting for the customer on the provider's page,
 * declined (the customer may try another card there), settling (the provider took the card; its signed event is
 * on its way), paid (the event recorded it), cancelled (by the customer or the clerk), refunded.
 */
export const CARD_DEPOSIT_STAGES = ['waiting', 'declined', 'settling', 'paid', 'cancelled', 'refunded'] as const
export type CardDepositStage = (typeof CARD_DEPOSIT_STAGES)[number]

export interface CardDepositState {
  paymentId: number
  salesOrderId: number
  amount: string
  stage: CardDepositStage
  /** The provider's payment intent id (no card detail ever reaches Lumenyard). */
  intentId: string
  /** The provider's page where the customer enters the card; null when the provider gives none. */
  payPageUrl: string | null
  depositPaid: string
  depositDue: string
}

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
  /** Still to pick on the order's open pick list (its hold passed to the list). */
  qtyOnPickList: number
  qtyPicked: number
  qtyHandedOver: number
  qtyReturned: number
  /** Of a stocked line, what nothing holds yet: not at the counter, not on a pick list, not picked, not cancelled. */
  qtyShort: number
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
