// The demo yard's calendar: closed on Sundays, quiet on Saturdays, busiest in the building season.

/** Days of history before today. */
export const HISTORY_DAYS = 365

/** Relative trade per weekday, Sunday first (the yard is closed on Sundays). */
const WEEKDAY_TRADE = [0, 1.0, 1.15, 1.1, 1.05, 0.95, 0.45]

export function localMidnight(date: Date): Date {
  const d = new Date(date)
  d.setHours(0, 0, 0, 0)
  return d
}

export function addDays(date: Date, days: number): Date {
  const d = new Date(date)
  d.setDate(d.getDate() + days)
  return d
}

/** The day at a decimal hour, local time: atHour(day, 7.5) is 07:30. */
export function atHour(day: Date, hours: number): Date {
  const d = localMidnight(day)
  d.setMinutes(Math.round(hours * 60))
  return d
}

export const isOpen = (day: Date) => day.getDay() !== 0

/** Weekday × season: building work peaks in early summer and slows in winter. */
export function tradeFactor(day: Date): number {
  const start = new Date(day.getFullYear(), 0, 1)
  const dayOfYear = Math.round((localMidnight(day).getTime() - start.getTime()) / 86_400_000)
  const season = 1 + 0.35 * Math.sin((2 * Math.PI * (dayOfYear - 80)) / 365)
  return WEEKDAY_TRADE[day.getDay()] * season
}

/** YYYY-MM-DD in local time (a DATE column). */
export function dateText(day: Date): string {
  const mm = String(day.getMonth() + 1).padStart(2, '0')
  const dd = String(day.getDate()).padStart(2, '0')
  return `${day.getFullYear()}-${mm}-${dd}`
}

/** YYMMDD, as used in the demo's lot codes. */
export const shortDate = (day: Date) => dateText(day).slice(2).replaceAll('-', '')
