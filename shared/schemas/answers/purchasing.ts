// The answers' schemas for the interfaces in shared/schemas/purchasing.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import { PO_STATUSES } from '../purchasing.js'
import type { PoStatus, CompanyProfile, PurchasingSettings } from '../purchasing.js'
import { companyProfileInputShape } from './terms.js'

export const poStatusShape = z.enum(PO_STATUSES) satisfies z.ZodType<PoStatus>

export const companyProfileShape = companyProfileInputShape.extend({
  complete: z.boolean()
}) satisfies z.ZodType<CompanyProfile>

export const purchasingSettingsShape = z.object({
  warehouseSeesCosts: z.boolean(),
  autoCloseOnReceipt: z.boolean()
}) satisfies z.ZodType<PurchasingSettings>
