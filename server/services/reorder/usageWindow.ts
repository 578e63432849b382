// The usage window: the last N calendar days (UTC) up to and including the day the list is computed.
import { dateOfDayNumber, dayNumber } from '../../../shared/inventory/demand.js'
import type { UsageWindow } from '../../../shared/schemas/reorder.js'

export interface WindowBounds extends UsageWindow {
  /** Day numbers (days since 1970-01-01) of the first and the last day. */
  startDay: number
  endDay: number
  /** Whole days in each half for the trend; with an odd window the middle day belongs to neither. */
  half: number
  /** First day of the window's second half, as an ISO date. */
  secondHalfStart: string
  /** First day after the first half. */
  firstHalfEnd: string
}

export function todayUtc(now: Date = new Date()): string {
  return now.toISOString().slice(0, 10)
}

export function usageWindow(days: number, asOf: string = todayUtc()): WindowBounds {
  const endDay = dayNumber(asOf)
  const startDay = endDay - days + 1
  const half = Math.floor(days / 2)
  return {
    start: dateOfDayNumber(startDay),
    end: asOf,
    days,
    startDay,
    endDay,
    half,
    firstHalfEnd: dateOfDayNumber(startDay + half),
    secondHalfStart: dateOfDayNumber(endDay - half + 1),
  }
}

export function addDays(date: string, days: number): string {
  return dateOfDayNumber(dayNumber(date) + days)
}

/** The first instant after the window, for `at < ?` (DATETIME compares with a date as its midnight). */
export const dayAfter = (date: string) => addDays(date, 1)
