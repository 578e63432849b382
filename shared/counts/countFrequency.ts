// How often each ABC class is counted, and how many items that puts in front of the counters a day.
// Defaults follow Heizer & Render, Operations Management, inventory management chapter (cycle counting):
// A items every month, B items every quarter, C items every six months, with a month taken as 20 working days.
import type { AbcClass } from '../inventory/abc.js'

export const ABC_CLASSES: readonly AbcClass[] = ['A', 'B', 'C']

/** Days between counts of an item, per class (calendar days: a month, a quarter, six months). */
export type CountIntervals = Record<AbcClass, number>
export const DEFAULT_COUNT_INTERVALS: CountIntervals = { A: 30, B: 90, C: 180 }

/** The book counts a month as 20 working days: calendar days × 20/30. */
export function workingDaysOf(calendarDays: number): number {
  return (calendarDays * 20) / 30
}

/**
 * Items to count per working day: Σ over classes of items in the class ÷ working days between its counts.
 * Each class's share is rounded to whole items, as the book's worked example does.
 */
export function dailyCountLoad(itemsPerClass: Record<AbcClass, number>, intervals: CountIntervals = DEFAULT_COUNT_INTERVALS): { perClass: Record<AbcClass, number>; total: number } {
  const perClass = {} as Record<AbcClass, number>
  for (const c of ABC_CLASSES) {
    const days = workingDaysOf(intervals[c])
    if (!(days > 0)) throw new RangeError(`class ${c}: the interval must be more than zero days`)
    perClass[c] = Math.round(itemsPerClass[c] / days)
  }
  return { perClass, total: perClass.A + perClass.B + perClass.C }
}

const DAY_MS = 86_400_000

/** Due when never counted, or when the last count is at least the class's interval ago. */
export function isCountDue(lastCountedAt: Date | null, intervalDays: number, now: Date): boolean {
  if (lastCountedAt === null) return true
  return now.getTime() - lastCountedAt.getTime() >= intervalDays * DAY_MS
}
