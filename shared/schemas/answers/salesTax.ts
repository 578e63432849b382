// The answers' schemas for the interfaces in shared/pricing/salesTax.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { DocumentTax } from '../../pricing/salesTax.js'
import { moneyShape } from './terms.js'

export const documentTaxShape = z.object({
  ratePercent: z.string(),
  taxable: moneyShape,
  exactTax: z.string(),
  tax: moneyShape,
  exemptCertificate: z.string().optional(),
  exemptUntil: z.string().optional(),
  noRate: z.boolean().optional()
}) satisfies z.ZodType<DocumentTax>
