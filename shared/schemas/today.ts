// The day at a glance on the start page: for each of the signed-in person's roles a panel of figures,
// each with the filter of the list it stands for. Money goes out under the cost rule's names only
// (`stockValue`, `spendValue`), so it never reaches a role that may not see costs.
import { z } from 'zod'
import { timeZoneParam } from './exportQuery.js'

export const todayQuerySchema = z.object({ tz: timeZoneParam })
export type TodayQuery = z.infer<typeof todayQuerySchema>

/** Whose work a panel shows: the counter, the warehouse crew, the buyer, the owner (administrators). */
export const TODAY_PANELS = ['counter', 'warehouse', 'buyer', 'owner'] as const
export type TodayPanelName = (typeof TODAY_PANELS)[number]

export const TODAY_FIGURES = [
  'jobsToPick', 'picksUnderWay', 'specialOrdersDue',
  'openPickLists', 'deliveriesToday', 'countsOpen', 'deviceOutbox',
  'orderNow', 'ordersLate', 'ordersDueThisWeek', 'spendThisMonth',
  'stockValue', 'accuracy', 'lowStock', 'deadStock',
] as const
export type TodayFigureName = (typeof TODAY_FIGURES)[number]

export interface TodayFigure {
  name: TodayFigureName
  /** How many (jobs, lists, orders, lines…); absent for a figure that is only a value or a ratio. */
  count?: number
  /** Stock value of one warehouse (a cost). */
  stockValue?: string
  /** What the orders sent this month come to (a cost). */
  spendValue?: string
  /** Lines counted right ÷ lines counted this month; null when nothing was counted. */
  accuracy?: number | null
  /** The warehouse a per-warehouse figure belongs to. */
  warehouseCode?: string
  /** The filter of the list the figure links to (the list's own query parameters). */
  query: Record<string, string>
}

export interface TodayPanel {
  panel: TodayPanelName
  figures: TodayFigure[]
}

export interface TodayAnswer {
  /** The reader's day (YYYY-MM-DD in `tz`). */
  day: string
  panels: TodayPanel[]
}
