// The answers' schemas for the interfaces in shared/schemas/quotes.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { QuoteLineView, QuoteSummary, QuoteDetail } from '../quotes.js'
import { priceExplanationShape } from './sellingPrice.js'
import { quoteStatusShape } from './terms.js'
import { documentTaxShape } from './salesTax.js'

const quoteLineViewShape = z.object({
  id: z.number(),
  lineNo: z.number(),
  itemId: z.number(),
  sku: z.string(),
  description: z.string(),
  askedQty: z.number(),
  qty: z.number(),
  packs: z.number().nullable(),
  packSize: z.number(),
  stockUnit: z.string(),
  unitPrice: z.string(),
  packPrice: z.string().nullable(),
  extension: z.string(),
  madeToOrder: z.boolean(),
  weightKg: z.string(),
  bomLineId: z.number().nullable(),
  explanation: priceExplanationShape
}) satisfies z.ZodType<QuoteLineView>

export const quoteSummaryShape = z.object({
  id: z.number(),
  number: z.string(),
  revision: z.number(),
  status: quoteStatusShape,
  customerId: z.number(),
  customerName: z.string(),
  jobId: z.number().nullable(),
  jobName: z.string().nullable(),
  bomId: z.number().nullable(),
  bomRevision: z.number().nullable(),
  warehouseId: z.number(),
  warehouseCode: z.string(),
  quotedOn: z.string(),
  validUntil: z.string(),
  subtotal: z.string(),
  taxAmount: z.string(),
  amountDue: z.string(),
  createdAt: z.string()
}) satisfies z.ZodType<QuoteSummary>

export const quoteDetailShape = quoteSummaryShape.extend({
  version: z.number(),
  customerEmail: z.string().nullable(),
  contactName: z.string().nullable(),
  terms: z.string().nullable(),
  notes: z.string().nullable(),
  lostReason: z.string().nullable(),
  offeredAt: z.string().nullable(),
  takenAt: z.string().nullable(),
  priceLevelCode: z.string().nullable(),
  salesOrderId: z.number().nullable(),
  tax: documentTaxShape,
  revisions: z.array(z.object({
    id: z.number(),
    revision: z.number(),
    status: quoteStatusShape,
    amountDue: z.string()
  })),
  lines: z.array(quoteLineViewShape),
  weightKg: z.string()
}) satisfies z.ZodType<QuoteDetail>
