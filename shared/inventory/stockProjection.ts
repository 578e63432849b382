// A plain projection of the inventory position for the buyer's chart: today's position falling at the mean
// daily demand, with no receipts, day by day over the lead time plus a horizon. It shows when the line
// crosses its reorder point and safety stock if nothing is ordered; it is not a forecast.
import { dateOfDayNumber, dayNumber } from './demand.js'

export interface ProjectionInput {
  /** 'YYYY-MM-DD': day 0. */
  from: string
  position: number
  meanDaily: number
  leadTimeDays: number
  horizonDays: number
}

export interface ProjectedDay {
  date: string
  position: number
}

/** Days 0 … ⌈L⌉ + horizon; position(t) = position − d̄·t, to two decimals (it is drawn, not stored). */
export function projectPosition({ from, position, meanDaily, leadTimeDays, horizonDays }: ProjectionInput): ProjectedDay[] {
  if (!(meanDaily >= 0) || !(leadTimeDays >= 0) || !Number.isInteger(horizonDays) || horizonDays < 0) {
    throw new RangeError('mean daily demand and lead time must be ≥ 0 and the horizon a whole number of days ≥ 0')
  }
  const start = dayNumber(from)
  const days = Math.ceil(leadTimeDays) + horizonDays
  const out: ProjectedDay[] = []
  for (let t = 0; t <= days; t++) {
    out.push({ date: dateOfDayNumber(start + t), position: Math.round((position - meanDaily * t) * 100) / 100 })
  }
  return out
}

/** Sparse daily totals → one entry per day from start to end inclusive, 0 where nothing was used. */
export function zeroFilledDays(daily: ReadonlyArray<{ date: string; qty: number }>, start: string, end: string): { date: string; qty: number }[] {
  const byDate = new Map<string, number>()
  for (const d of daily) byDate.set(d.date, (byDate.get(d.date) ?? 0) + d.qty)
  const out: { date: string; qty: number }[] = []
  for (let day = dayNumber(start); day <= dayNumber(end); day++) {
    const date = dateOfDayNumber(day)
    out.push({ date, qty: byDate.get(date) ?? 0 })
  }
  return out
}

/**
 * A value axis that always shows the levels drawn on the chart (reorder point, safety stock), not only the
 * data: a level above the highest position or below zero would otherwise be cut off.
 */
export function levelsInView(extent: { min: number; max: number }, levels: readonly number[]): { min: number; max: number } {
  const low = Math.min(0, extent.min, ...levels)
  const high = Math.max(extent.max, ...levels)
  // A little room above the top line so its label stays inside the plot.
  const pad = (high - low) * 0.08 || 1
  return { min: low < 0 ? low - pad : low, max: high + pad }
}
