// The answers' schemas for the interfaces in shared/reports/stockTurns.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { TurnsFigures } from '../../reports/stockTurns.js'
import { moneyShape } from './terms.js'

export const turnsFiguresShape = z.object({
  averageValue: moneyShape,
  turns: z.number().nullable(),
  annualTurns: z.number().nullable(),
  daysOfSupply: z.number().nullable()
}) satisfies z.ZodType<TurnsFigures>
