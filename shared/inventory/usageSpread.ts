// Usage known only by the month, spread over the month's days in whole units: the month's total is kept
// exactly, the remainder going one unit each to the first days (a month of 31 units over 30 days: the 1st
// gets 2, every other day 1).
import { dateOfDayNumber, dayNumber } from './demand.js'

export function daysInMonth(month: string): number {
  const [y, m] = month.split('-').map(Number)
  return new Date(Date.UTC(y, m, 0)).getUTCDate()
}

export function spreadOverMonth(month: string, qty: number): { date: string; qty: number }[] {
  if (!/^\d{4}-(0[1-9]|1[0-2])$/.test(month)) throw new RangeError(`expected a month as YYYY-MM, got ${JSON.stringify(month)}`)
  if (!Number.isSafeInteger(qty) || qty < 0) throw new RangeError(`quantity must be a non-negative integer, got ${qty}`)
  const n = daysInMonth(month)
  const first = dayNumber(`${month}-01`)
  const base = Math.floor(qty / n)
  const rest = qty % n
  const days: { date: string; qty: number }[] = []
  for (let i = 0; i < n; i++) {
    const q = base + (i < rest ? 1 : 0)
    if (q > 0) days.push({ date: dateOfDayNumber(first + i), qty: q })
  }
  return days
}
