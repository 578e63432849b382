// Selling prices: price levels, item price rules (quantity breaks, case prices), sales tax per warehouse,
// accounts' terms, and the counter's "how much?". The admin's forms validate with these same schemas.
import { z } from 'zod'
import { seenVersionSchema } from './seenVersion.js'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import type { DocumentTax } from '../pricing/salesTax.js'
import type { ResolvedPrice } from '../pricing/sellingPrice.js'
import { idSchema } from './stock.js'

const trimmed = (v: unknown) => (typeof v === 'string' ? v.trim() : typeof v === 'number' && Number.isFinite(v) ? String(v) : v)
const blankToNull = (v: unknown) => (v === '' || v === undefined ? null : v)

/** A percentage 0–100 with up to 2 decimals, as text. */
export const percentSchema = z.preprocess(
  trimmed,
  z.string().regex(/^\d{1,3}(\.\d{1,2})?$/, issueCode('percent_format')).refine((v) => Number(v) <= 100, issueOf('percent_format')),
)
/** A selling price: up to 8 whole digits and 2 decimals. */
export const priceSchema = z.preprocess(trimmed, z.string().regex(/^\d{1,8}(\.\d{1,2})?$/, issueCode('price_format')))
export const isoDaySchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, issueCode('invalid_date'))
  .refine((v) => !Number.isNaN(Date.parse(v + 'T00:00:00Z')) && new Date(v + 'T00:00:00Z').toISOString().startsWith(v), issueCode('invalid_date'))

export const priceLevelInputSchema = z.object({
  code: z.string().trim().min(2).max(20).regex(/^[A-Za-z0-9-]+$/, issueCode('customer_code_chars')).transform((v) => v.toUpperCase()),
  name: z.string().trim().min(1).max(80),
  percentOff: z.preprocess(blankToNull, percentSchema.nullable()),
  active: z.boolean().default(true),
})
export type PriceLevelInput = z.infer<typeof priceLevelInputSchema>

/** Changing a price level, as the screen loaded it (`version`: a change saved meanwhile is refused). */
export const priceLevelUpdateSchema = priceLevelInputSchema.extend({ version: seenVersionSchema })
export type PriceLevelUpdateInput = z.infer<typeof priceLevelUpdateSchema>

export interface PriceLevelSummary {
  id: number
  code: string
  name: string
  percentOff: string | null
  active: boolean
  accounts: number
  rules: number
  /** Goes up with every change; an edit sends the version it loaded. */
  version: number
}

export const priceRuleInputSchema = z
  .object({
    levelId: z.preprocess(blankToNull, idSchema.nullable()),
    itemId: idSchema,
    minQty: z.coerce.number().int().min(1).max(1_000_000).default(1),
    basis: z.enum(['unit', 'pack']).default('unit'),
    price: z.preprocess(blankToNull, priceSchema.nullable()),
    percentOff: z.preprocess(blankToNull, percentSchema.nullable()),
  })
  .superRefine((v, ctx) => {
    if ((v.price === null) === (v.percentOff === null)) ctx.addIssue({ code: 'custom', path: ['price'], ...issueOf('price_rule_one_of') })
  })
export type PriceRuleInput = z.infer<typeof priceRuleInputSchema>

export const priceRuleQuerySchema = z.object({
  levelId: z.union([z.literal('all'), idSchema]).optional(),
  itemId: idSchema.optional(),
})

export interface PriceRuleSummary {
  id: number
  levelId: number | null
  levelCode: string | null
  itemId: number
  sku: string
  itemName: string
  listPrice: string
  packSize: number
  sellByPack: boolean
  minQty: number
  basis: 'unit' | 'pack'
  price: string | null
  percentOff: string | null
}

export const taxRateInputSchema = z.object({
  ratePercent: z.preprocess(
    trimmed,
    z.string().regex(/^\d{1,2}(\.\d{1,4})?$/, issueCode('tax_rate_format')).refine((v) => Number(v) <= 30, issueOf('tax_rate_format')),
  ),
  label: z.string().trim().max(80).optional().nullable().transform((v) => v || null),
})
export type TaxRateInput = z.infer<typeof taxRateInputSchema>

export interface TaxRateSummary {
  warehouseId: number
  warehouseCode: string
  warehouseName: string
  ratePercent: string | null
  label: string | null
}

export const customerTermsInputSchema = z
  .object({
    priceLevelId: z.preprocess(blankToNull, idSchema.nullable()),
    exemptCertificate: z.preprocess(blankToNull, z.string().trim().min(1).max(40).nullable()),
    exemptUntil: z.preprocess(blankToNull, isoDaySchema.nullable()),
  })
  .superRefine((v, ctx) => {
    if ((v.exemptCertificate === null) !== (v.exemptUntil === null)) {
      ctx.addIssue({ code: 'custom', path: [v.exemptCertificate === null ? 'exemptCertificate' : 'exemptUntil'], ...issueOf('exemption_needs_both') })
    }
  })
export type CustomerTermsInput = z.infer<typeof customerTermsInputSchema>

export interface CustomerTermsSummary {
  customerId: number
  code: string
  name: string
  priceLevelId: number | null
  priceLevelCode: string | null
  exemptCertificate: string | null
  exemptUntil: string | null
}

/** The counter's "how much?": items and quantities for an account (or none: walk-in) at a warehouse. */
export const priceEstimateSchema = z.object({
  customerId: z.preprocess(blankToNull, idSchema.nullable()).default(null),
  warehouseId: idSchema,
  onDay: isoDaySchema.optional(),
  lines: z
    .array(z.object({ itemId: idSchema, qty: z.coerce.number().int().min(1).max(1_000_000) }))
    .min(1)
    .max(500),
})
export type PriceEstimateInput = z.infer<typeof priceEstimateSchema>

export interface PricedLine extends ResolvedPrice {
  itemId: number
  sku: string
  name: string
  /** The quantity asked for (before rounding up to whole cases). */
  askedQty: number
}

export interface PriceEstimate {
  customerId: number | null
  warehouseId: number
  onDay: string
  priceLevelCode: string | null
  lines: PricedLine[]
  subtotal: string
  tax: DocumentTax
  /** Subtotal + tax: what the contractor pays. */
  amountDue: string
}
