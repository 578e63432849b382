// Purchasing requests (vendors, vendor items, purchase orders, e-mail, receiving, settings). The server
// parses with these; the client's forms validate with the same ones.
import { z } from 'zod'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import { idSchema } from './stock.js'
import { timeZoneParam } from './exportQuery.js'
import { seenVersionSchema } from './seenVersion.js'

/** Optional text: blank becomes null, so "clear the field" and "never set" store the same. */
const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max)
    .nullish()
    .transform((v) => (v ? v : null))

const emailSchema = z.email().max(120)
const daysSchema = z.coerce.number().int().min(0).max(365)
export const unitCostSchema = z
  .string()
  .trim()
  .regex(/^\d{1,8}(\.\d{1,4})?$/, issueCode('cost_format'))
const isoDate = z.iso.date()

export const PO_STATUSES = ['draft', 'approved', 'sent', 'partly_received', 'received', 'closed', 'cancelled'] as const
export type PoStatus = (typeof PO_STATUSES)[number]

// ---- vendors ----

export const vendorCreateSchema = z.object({
  code: z
    .string()
    .trim()
    .min(1)
    .max(20)
    .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, issueCode('vendor_code_chars')),
  name: z.string().trim().min(1).max(120),
  contactName: optionalText(80),
  email: z
    .union([emailSchema, z.literal(''), z.null()])
    .optional()
    .transform((v) => (v ? v : null)),
  phone: optionalText(40),
  address: optionalText(200),
  terms: optionalText(40),
  currency: z
    .string()
    .trim()
    .regex(/^[A-Z]{3}$/, issueCode('currency_code'))
    .default('USD'),
  leadTimeDays: daysSchema.default(14),
  active: z.boolean().default(true),
})
export type VendorCreateInput = z.infer<typeof vendorCreateSchema>

/** Changing a vendor, as the screen loaded it (`version`: a change saved meanwhile is refused). */
export const vendorUpdateSchema = vendorCreateSchema.partial().extend({ version: seenVersionSchema })
export type VendorUpdateInput = z.infer<typeof vendorUpdateSchema>

export const vendorItemSchema = z.object({
  itemId: idSchema,
  vendorSku: z.string().trim().min(1).max(40),
  packQty: z.coerce.number().int().min(1).max(100_000),
  minOrderQty: z.coerce.number().int().min(1).max(1_000_000),
  unitCost: unitCostSchema,
  leadTimeDays: daysSchema.nullish().transform((v) => v ?? null),
  preferred: z.boolean().default(false),
})
export type VendorItemInput = z.infer<typeof vendorItemSchema>
/** Changing what a vendor sells, as the screen loaded it (`version`: a change saved meanwhile is refused). */
export const vendorItemUpdateSchema = vendorItemSchema.omit({ itemId: true }).partial().extend({ version: seenVersionSchema })
export type VendorItemUpdateInput = z.infer<typeof vendorItemUpdateSchema>

// ---- purchase orders ----

const packsSchema = z.coerce.number().int().min(1).max(100_000)

export const poLineInputSchema = z.object({
  itemId: idSchema,
  packsOrdered: packsSchema,
  /** Defaults to the vendor item's pack and cost. */
  packQty: z.coerce.number().int().min(1).max(100_000).optional(),
  unitCost: unitCostSchema.optional(),
  description: z.string().trim().min(1).max(200).optional(),
})
export type PoLineInput = z.infer<typeof poLineInputSchema>

export const poManualSchema = z.object({
  vendorId: idSchema,
  warehouseId: idSchema,
  expectedDate: isoDate.nullish(),
  notes: optionalText(2000),
  lines: z.array(poLineInputSchema).min(1).max(300),
})
export type PoManualInput = z.infer<typeof poManualSchema>

export const poFromSuggestionsSchema = z.object({
  suggestionIds: z.array(idSchema).min(1).max(500),
})
export type PoFromSuggestionsInput = z.infer<typeof poFromSuggestionsSchema>

/** A new quantity for an accepted suggestion, in stock units (rounded up to packs when ordered). */
export const suggestionUpdateSchema = z.object({
  qty: z.coerce.number().int().min(1).max(1_000_000),
})
export type SuggestionUpdateInput = z.infer<typeof suggestionUpdateSchema>

export const poFromJobSchema = z.object({
  jobId: idSchema,
  /** Without one, the job's warehouse (where its latest pick list is picked). */
  warehouseId: idSchema.nullish(),
  /** Without a vendor, each item's preferred vendor. */
  vendorId: idSchema.nullish(),
  /** Without ids, every made-to-order line of the job's latest bill of materials still to order. */
  bomLineIds: z.array(idSchema).max(200).optional(),
})
export type PoFromJobInput = z.infer<typeof poFromJobSchema>


/** Changing a draft order, as the screen loaded it (`version`: a change saved meanwhile is refused). */
export const poUpdateSchema = z.object({
  version: seenVersionSchema,
  expectedDate: isoDate.nullish(),
  notes: optionalText(2000),
  lines: z
    .array(z.object({ id: idSchema, packsOrdered: packsSchema.optional(), unitCost: unitCostSchema.optional() }))
    .max(300)
    .optional(),
})
export type PoUpdateInput = z.infer<typeof poUpdateSchema>

export const poReasonSchema = z.object({ reason: optionalText(200) })

/** Approving the order the screen showed (`version`): an order changed meanwhile is not approved unseen. */
export const poApproveSchema = z.object({ version: seenVersionSchema })

export const poSendSchema = z.object({
  /** Defaults to the vendor's e-mail. */
  to: z
    .union([emailSchema, z.literal('')])
    .optional()
    .transform((v) => (v ? v : undefined)),
  cc: z.array(emailSchema).max(5).default([]),
  message: optionalText(2000),
})
export type PoSendInput = z.infer<typeof poSendSchema>

const poListDay = z.preprocess((v) => (v === '' ? undefined : v), z.iso.date().optional())

export const poListQuerySchema = z.object({
  status: z
    .string()
    .optional()
    .transform((v) => (v ? v.split(',') : []))
    .pipe(z.array(z.enum(PO_STATUSES))),
  vendorId: idSchema.optional(),
  q: z.string().trim().max(60).optional(),
  /** Expected between these days (inclusive); the start page's late and due figures link here with them. */
  expectedFrom: poListDay,
  expectedTo: poListDay,
  /** Sent between these days (inclusive) in the reader's time zone `tz`: the month's spend. */
  sentFrom: poListDay,
  sentTo: poListDay,
  tz: timeZoneParam,
})
export type PoListQuery = z.infer<typeof poListQuerySchema>

export const poExportQuerySchema = z.object({
  ids: z
    .string()
    .transform((v) => v.split(',').map((s) => Number(s)))
    .pipe(z.array(z.number().int().positive()).min(1).max(200)),
})

// ---- receiving ----

export const lotCodeSchema = z
  .string()
  .trim()
  .min(1)
  .max(20)
  .regex(/^[A-Za-z0-9._/-]+$/, issueCode('lot_code_chars'))

export const receiveLineSchema = z
  .object({
    poLineId: idSchema,
    binId: idSchema,
    lotCode: lotCodeSchema.nullish().transform((v) => v ?? null),
    /** Good units into stock. */
    qty: z.coerce.number().int().min(0).max(1_000_000),
    /** Arrived damaged, refused: not stocked, still owed. */
    damagedQty: z.coerce.number().int().min(0).max(1_000_000).default(0),
    reason: optionalText(200),
  })
  .refine((l) => l.qty + l.damagedQty > 0, { path: ['qty'], ...issueOf('enter_what_arrived') })
  .refine((l) => l.damagedQty === 0 || !!l.reason, { path: ['reason'], ...issueOf('damage_reason_needed') })
export type ReceiveLineInput = z.infer<typeof receiveLineSchema>

export const receiveSchema = z.object({
  lines: z.array(receiveLineSchema).min(1).max(500),
  note: optionalText(200),
})
export type ReceiveInput = z.infer<typeof receiveSchema>

// ---- settings ----

/**
 * Who orders, printed on every purchase order (sheet, PDF, e-mail): the company, where vendors bill and
 * deliver, and where replies go. The document unit is how lengths (a shower base's size) are written.
 */
export const companyProfileSchema = z.object({
  legalName: z.string().trim().min(1, issueCode('company_name_needed')).max(160),
  billToAddress: z.string().trim().min(1, issueCode('bill_to_needed')).max(400),
  shipToAddress: optionalText(400),
  phone: optionalText(40),
  email: z.union([emailSchema, z.literal('')]).nullish().transform((v) => v || null),
  replyTo: z.union([emailSchema, z.literal('')]).nullish().transform((v) => v || null),
  taxNumber: optionalText(40),
  documentUnit: z.enum(['in', 'mm'], { error: issueCode('length_unit_choice') }),
})
export type CompanyProfileInput = z.infer<typeof companyProfileSchema>
export interface CompanyProfile extends CompanyProfileInput {
  /** False until an admin fills it in: documents then say the profile is missing rather than print blanks. */
  complete: boolean
}

export const purchasingSettingsSchema = z.object({
  /** Warehouse crew see unit costs and totals on purchase orders. */
  warehouseSeesCosts: z.boolean().optional(),
  /** The receipt that completes a PO also closes it; off: it stays received until the buyer closes it. */
  autoCloseOnReceipt: z.boolean().optional(),
})
export type PurchasingSettingsInput = z.infer<typeof purchasingSettingsSchema>
export interface PurchasingSettings {
  warehouseSeesCosts: boolean
  autoCloseOnReceipt: boolean
}
