// Reports: what the screens send (parsed by the server with these) and the answers' shapes.
import { z } from 'zod'
import { issueOf } from '../errors/zodProblems.js'
import { localDayIn } from '../reports/zonedDays.js'
import { timeZoneParam } from './exportQuery.js'

const blankToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v)
const optionalId = z.preprocess(blankToUndefined, z.coerce.number().int().positive().optional())

/** Stock value as of the end of a day in the reader's time zone: today when no day is given, never a day to come. */
export const stockValuationQuerySchema = z
  .object({ asOf: z.preprocess(blankToUndefined, z.iso.date().optional()), warehouseId: optionalId, tz: timeZoneParam })
  .transform((q, ctx) => {
    const today = localDayIn(q.tz, new Date())
    const asOf = q.asOf ?? today
    if (asOf > today) ctx.addIssue({ code: 'custom', path: ['asOf'], ...issueOf('day_after_today', { today }) })
    return { ...q, asOf }
  })
export type StockValuationQuery = z.infer<typeof stockValuationQuerySchema>
