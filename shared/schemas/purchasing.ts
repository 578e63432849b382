// Purchasing requests (vendors, vendor items, purchase orders, e-mail, receiving, settings). The server
// parses with these; the client's forms validate with the same ones.
import { z } from 'zod'
import { idSchema } from './stock.js'

/** Optional text: blank becomes null, so "clear the field" and "never set" store the same. */
const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `At most ${max} characters`)
    .nullish()
    .transform((v) => (v ? v : null))

const emailSchema = z.email('Enter a valid e-mail address').max(120, 'At most 120 characters')
const daysSchema = z.coerce.number({ error: 'Enter a number of days' }).int('Whole days').min(0, 'Not negative').max(365, 'At most a year')
export const unitCostSchema = z
  .string({ error: 'Enter a cost' })
  .trim()
  .regex(/^\d{1,8}(\.\d{1,4})?$/, 'A cost like 12.50 (up to 4 decimals)')
const isoDate = z.iso.date('A date like 2026-03-31')

export const PO_STATUSES = ['draft', 'approved', 'sent', 'partly_received', 'received', 'closed', 'cancelled'] as const
export type PoStatus = (typeof PO_STATUSES)[number]

// ---- vendors ----

export const vendorCreateSchema = z.object({
  code: z
    .string({ error: 'Enter a code' })
    .trim()
    .min(1, 'Enter a code')
    .max(20, 'At most 20 characters')
    .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, 'Letters, digits and . _ - only'),
  name: z.string({ error: 'Enter a name' }).trim().min(1, 'Enter a name').max(120, 'At most 120 characters'),
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
    .regex(/^[A-Z]{3}$/, 'A three-letter currency code such as USD')
    .default('USD'),
  leadTimeDays: daysSchema.default(14),
  active: z.boolean().default(true),
})
export type VendorCreateInput = z.infer<typeof vendorCreateSchema>

export const vendorUpdateSchema = vendorCreateSchema.partial()
export type VendorUpdateInput = z.infer<typeof vendorUpdateSchema>

export const vendorItemSchema = z.object({
  itemId: idSchema,
  vendorSku: z.string({ error: "Enter the vendor's SKU" }).trim().min(1, "Enter the vendor's SKU").max(40, 'At most 40 characters'),
  packQty: z.coerce.number({ error: 'Enter a pack size' }).int('Whole units').min(1, 'At least 1').max(100_000, 'Too large'),
  minOrderQty: z.coerce.number({ error: 'Enter a minimum' }).int('Whole units').min(1, 'At least 1').max(1_000_000, 'Too large'),
  unitCost: unitCostSchema,
  leadTimeDays: daysSchema.nullish().transform((v) => v ?? null),
  preferred: z.boolean().default(false),
})
export type VendorItemInput = z.infer<typeof vendorItemSchema>
export const vendorItemUpdateSchema = vendorItemSchema.omit({ itemId: true }).partial()
export type VendorItemUpdateInput = z.infer<typeof vendorItemUpdateSchema>

// ---- purchase orders ----

const packsSchema = z.coerce.number({ error: 'Enter packs' }).int('Whole packs').min(1, 'At least one pack').max(100_000, 'Too many packs')

export const poLineInputSchema = z.object({
  itemId: idSchema,
  packsOrdered: packsSchema,
  /** Defaults to the vendor item's pack and cost. */
  packQty: z.coerce.number().int('Whole units').min(1, 'At least 1').max(100_000).optional(),
  unitCost: unitCostSchema.optional(),
  description: z.string().trim().min(1).max(200, 'At most 200 characters').optional(),
})
export type PoLineInput = z.infer<typeof poLineInputSchema>

export const poManualSchema = z.object({
  vendorId: idSchema,
  warehouseId: idSchema,
  expectedDate: isoDate.nullish(),
  notes: optionalText(2000),
  lines: z.array(poLineInputSchema).min(1, 'Add at least one line').max(300, 'At most 300 lines'),
})
export type PoManualInput = z.infer<typeof poManualSchema>

export const poFromSuggestionsSchema = z.object({
  suggestionIds: z.array(idSchema).min(1, 'Choose at least one suggestion').max(500, 'At most 500 at once'),
})
export type PoFromSuggestionsInput = z.infer<typeof poFromSuggestionsSchema>

/** A new quantity for an accepted suggestion, in stock units (rounded up to packs when ordered). */
export const suggestionUpdateSchema = z.object({
  qty: z.coerce.number({ error: 'Enter a quantity' }).int('Whole units').min(1, 'At least 1').max(1_000_000, 'At most 1,000,000'),
})
export type SuggestionUpdateInput = z.infer<typeof suggestionUpdateSchema>

export const poFromJobSchema = z.object({
  jobId: idSchema,
  warehouseId: idSchema,
  /** Without a vendor, each item's preferred vendor. */
  vendorId: idSchema.nullish(),
  /** Without ids, every made-to-order line of the job's latest bill of materials still to order. */
  bomLineIds: z.array(idSchema).max(200).optional(),
})
export type PoFromJobInput = z.infer<typeof poFromJobSchema>

/** The order's version as the screen showed it: a change made meanwhile is refused (409 po_changed). */
const seenVersionSchema = z.number({ error: 'The version the order was read at' }).int().positive().optional()

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

export const poApproveSchema = z.object({ version: seenVersionSchema })

export const poSendSchema = z.object({
  /** Defaults to the vendor's e-mail. */
  to: z
    .union([emailSchema, z.literal('')])
    .optional()
    .transform((v) => (v ? v : undefined)),
  cc: z.array(emailSchema).max(5, 'At most 5 copies').default([]),
  message: optionalText(2000),
})
export type PoSendInput = z.infer<typeof poSendSchema>

export const poListQuerySchema = z.object({
  status: z
    .string()
    .optional()
    .transform((v) => (v ? v.split(',') : []))
    .pipe(z.array(z.enum(PO_STATUSES, { error: 'Unknown status' }))),
  vendorId: idSchema.optional(),
  q: z.string().trim().max(60).optional(),
})

export const poExportQuerySchema = z.object({
  ids: z
    .string({ error: 'Choose purchase orders' })
    .transform((v) => v.split(',').map((s) => Number(s)))
    .pipe(z.array(z.number().int('Not an order').positive('Not an order')).min(1, 'Choose purchase orders').max(200, 'At most 200 at once')),
})

// ---- receiving ----

export const lotCodeSchema = z
  .string()
  .trim()
  .min(1)
  .max(20, 'At most 20 characters')
  .regex(/^[A-Za-z0-9._/-]+$/, 'Letters, digits and . _ / - only')

export const receiveLineSchema = z
  .object({
    poLineId: idSchema,
    binId: idSchema,
    lotCode: lotCodeSchema.nullish().transform((v) => v ?? null),
    /** Good units into stock. */
    qty: z.coerce.number({ error: 'Enter a quantity' }).int('Whole units').min(0, 'Not negative').max(1_000_000),
    /** Arrived damaged, refused: not stocked, still owed. */
    damagedQty: z.coerce.number().int('Whole units').min(0, 'Not negative').max(1_000_000).default(0),
    reason: optionalText(200),
  })
  .refine((l) => l.qty + l.damagedQty > 0, { path: ['qty'], message: 'Enter what arrived' })
  .refine((l) => l.damagedQty === 0 || !!l.reason, { path: ['reason'], message: 'Say what was damaged' })
export type ReceiveLineInput = z.infer<typeof receiveLineSchema>

export const receiveSchema = z.object({
  lines: z.array(receiveLineSchema).min(1, 'Add at least one line').max(500, 'At most 500 lines'),
  note: optionalText(200),
})
export type ReceiveInput = z.infer<typeof receiveSchema>

// ---- settings ----

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
