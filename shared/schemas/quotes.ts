// Quotes at the counter: written from a bill of materials (any revision) or by hand, priced through the
// account's selling terms (shared/pricing/), offered by e-mail, revised, taken or lost.
import { z } from 'zod'
import { issueOf } from '../errors/zodProblems.js'
import type { DocumentTax } from '../pricing/salesTax.js'
import type { PriceExplanation } from '../pricing/sellingPrice.js'
import type { QuoteStatus } from '../sales/quoteStatus.js'
import { isoDaySchema, priceSchema } from './pricing.js'
import { newestPageQuery } from './newestPage.js'
import { idSchema } from './stock.js'
import { seenVersionSchema } from './seenVersion.js'

const blankToNull = (v: unknown) => (v === '' || v === undefined ? null : v)
const text = (max: number) => z.preprocess(blankToNull, z.string().trim().max(max).nullable()).transform((v) => v || null)

export const quoteLineInputSchema = z
  .object({
    itemId: idSchema,
    qty: z.coerce.number().int().min(1).max(1_000_000),
    /** A clerk's own unit price: needs the reason (it is printed nowhere, kept with the line). */
    unitPrice: z.preprocess(blankToNull, priceSchema.nullable()).default(null),
    overrideReason: text(200).default(null),
    bomLineId: z.preprocess(blankToNull, idSchema.nullable()).default(null),
  })
  .superRefine((v, ctx) => {
    if (v.unitPrice !== null && !v.overrideReason) ctx.addIssue({ code: 'custom', path: ['overrideReason'], ...issueOf('override_reason_needed') })
  })
export type QuoteLineInput = z.infer<typeof quoteLineInputSchema>

const quoteTerms = {
  warehouseId: idSchema,
  validUntil: isoDaySchema.optional(),
  terms: text(1000).default(null),
  notes: text(2000).default(null),
}

/** A new quote: from a saved bill (its lines, any revision) or from lines typed by hand. */
export const quoteCreateSchema = z
  .object({
    customerId: z.preprocess(blankToNull, idSchema.nullable()).default(null),
    jobId: z.preprocess(blankToNull, idSchema.nullable()).default(null),
    bomId: z.preprocess(blankToNull, idSchema.nullable()).default(null),
    lines: z.array(quoteLineInputSchema).max(500).default([]),
    ...quoteTerms,
  })
  .superRefine((v, ctx) => {
    if (v.bomId === null && v.customerId === null && v.jobId === null) ctx.addIssue({ code: 'custom', path: ['customerId'], ...issueOf('required') })
    if (v.bomId === null && v.lines.length === 0) ctx.addIssue({ code: 'custom', path: ['lines'], ...issueOf('too_few', { min: 1 }) })
  })
export type QuoteCreateInput = z.infer<typeof quoteCreateSchema>

/** Changing a draft: its lines, location, validity and terms, all at once, as the screen loaded it (`version`). */
export const quoteUpdateSchema = z.object({ version: seenVersionSchema, lines: z.array(quoteLineInputSchema).min(1).max(500), ...quoteTerms })
export type QuoteUpdateInput = z.infer<typeof quoteUpdateSchema>

export const quoteSendSchema = z.object({
  to: z.preprocess(blankToNull, z.email().max(200).nullable()).default(null),
  message: text(2000).default(null),
})
export type QuoteSendInput = z.infer<typeof quoteSendSchema>

export const quoteLoseSchema = z.object({ reason: z.string().trim().min(1).max(200) })

export const quoteQuerySchema = z.object({
  status: z.enum(['draft', 'offered', 'taken', 'lapsed', 'lost', 'replaced', 'open', 'all']).default('open'),
  customerId: idSchema.optional(),
  q: z.string().trim().max(80).optional(),
  ...newestPageQuery,
})

export interface QuoteLineView {
  id: number
  lineNo: number
  itemId: number
  sku: string
  description: string
  askedQty: number
  qty: number
  packs: number | null
  packSize: number
  stockUnit: string
  unitPrice: string
  packPrice: string | null
  extension: string
  madeToOrder: boolean
  weightKg: string
  bomLineId: number | null
  explanation: PriceExplanation
}

export interface QuoteSummary {
  id: number
  number: string
  revision: number
  status: QuoteStatus
  customerId: number
  customerName: string
  jobId: number | null
  jobName: string | null
  bomId: number | null
  bomRevision: number | null
  warehouseId: number
  warehouseCode: string
  quotedOn: string
  validUntil: string
  subtotal: string
  taxAmount: string
  amountDue: string
  createdAt: string
}

export interface QuoteDetail extends QuoteSummary {
  /** Goes up with every save of the draft; a save sends the version it loaded. */
  version: number
  customerEmail: string | null
  contactName: string | null
  terms: string | null
  notes: string | null
  lostReason: string | null
  offeredAt: string | null
  takenAt: string | null
  priceLevelCode: string | null
  /** The sales order this quote became when it was taken (a quote makes at most one). */
  salesOrderId: number | null
  tax: DocumentTax
  /** Every revision of this quote number, oldest first. */
  revisions: { id: number; revision: number; status: QuoteStatus; amountDue: string }[]
  lines: QuoteLineView[]
  /** Total weight of what is quoted, in kg (heavy sections: plan the handling). */
  weightKg: string
}
