// The answers' schemas for the interfaces in shared/pricing/sellingPrice.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { PriceSource, PriceBasis, PriceExplanation } from '../../pricing/sellingPrice.js'
import { moneyShape } from './terms.js'

const priceSourceShape = z.union([z.literal('list'), z.literal('level'), z.literal('break'), z.literal('override')]) satisfies z.ZodType<PriceSource>

const priceBasisShape = z.union([z.literal('unit'), z.literal('pack')]) satisfies z.ZodType<PriceBasis>

export const priceExplanationShape = z.object({
  source: priceSourceShape,
  listPrice: moneyShape,
  levelCode: z.string().optional(),
  percentOff: z.string().optional(),
  minQty: z.number().optional(),
  ruleId: z.number().optional(),
  basis: priceBasisShape.optional(),
  allAccounts: z.boolean().optional(),
  overrideReason: z.string().optional(),
  overrideBy: z.string().optional()
}) satisfies z.ZodType<PriceExplanation>
