// Reports: what the screens send (parsed by the server with these) and the answers' shapes.
import { z } from 'zod'
import type { ItemFamily } from '../catalog.js'
import type { Money } from '../money.js'
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

// ---- answers ----
/** One warehouse and family: how many items had stock, the units, and their value (a cost: the cost rule's `stockValue`). */
export interface ValuationGroup {
  warehouseId: number
  warehouseCode: string
  family: ItemFamily
  items: number
  onHand: number
  stockValue: Money
}

export interface ValuationReport {
  asOf: string
  tz: string
  groups: ValuationGroup[]
  warehouses: { warehouseId: number; warehouseCode: string; stockValue: Money }[]
  stockValue: Money
}
