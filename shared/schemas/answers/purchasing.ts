// The answers' schemas for the interfaces in shared/schemas/purchasing.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import { PO_STATUSES } from '../purchasing.js'
import type { PoStatus, CompanyProfile, PurchasingSettings } from '../purchasing.js'

export const poStatusShape = z.enum(PO_STATUSES) satisfies z.ZodType<PoStatus>

/**
 * The profile as stored, not as an admin must enter it: before anyone fills it in (a first run) its names are
 * empty and `complete` is false, which the input schema would refuse.
 */
export const companyProfileShape = z.object({
  legalName: z.string(),
  billToAddress: z.string(),
  shipToAddress: z.string().nullable(),
  phone: z.string().nullable(),
  email: z.string().nullable(),
  replyTo: z.string().nullable(),
  taxNumber: z.string().nullable(),
  documentUnit: z.enum(['in', 'mm']),
  complete: z.boolean()
}) satisfies z.ZodType<CompanyProfile>

export const purchasingSettingsShape = z.object({
  warehouseSeesCosts: z.boolean(),
  autoCloseOnReceipt: z.boolean()
}) satisfies z.ZodType<PurchasingSettings>
