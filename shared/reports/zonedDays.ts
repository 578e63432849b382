// Calendar days and months in a time zone, as instants: reports take days as the reader sees them
// (a stock value "as of 30 June" in Chicago ends at midnight there, not in London).

const DAY_MS = 86_400_000

function offsetAt(instant: number, zone: string): number {
  const f = new Intl.DateTimeFormat('en-US', { timeZone: zone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit' })
  const p = Object.fromEntries(f.formatToParts(new Date(instant)).map((x) => [x.type, x.value]))
  const wall = Date.UTC(Number(p.year), Number(p.month) - 1, Number(p.day), Number(p.hour), Number(p.minute), Number(p.second))
  return wall - Math.floor(instant / 1000) * 1000
}

/** The instant a calendar day (YYYY-MM-DD) begins in the zone. */
export function dayStart(day: string, zone: string): Date {
  const guess = Date.parse(`${day}T00:00:00Z`)
  if (Number.isNaN(guess)) throw new RangeError(`not a day: ${day}`)
  let at = guess - offsetAt(guess, zone)
  // A change of offset between the guess and the answer (a daylight-saving day): settle on the answer's own offset.
  at = guess - offsetAt(at, zone)
  return new Date(at)
}

/** The instant the day after `day` begins: the end (exclusive) of `day`. */
export function dayEnd(day: string, zone: string): Date {
  return dayStart(addDays(day, 1), zone)
}

export function addDays(day: string, n: number): string {
  return new Date(Date.parse(`${day}T00:00:00Z`) + n * DAY_MS).toISOString().slice(0, 10)
}

/** Whole calendar days from `from` to `to`, both included. */
export function daysInclusive(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / DAY_MS) + 1
}

/** The months (YYYY-MM) a day range touches, each with the instants it begins and ends in the zone, clipped to the range. */
export function monthsBetween(from: string, to: string, zone: string): { month: string; start: Date; end: Date }[] {
  const out: { month: string; start: Date; end: Date }[] = []
  let first = from
  while (first <= to) {
    const [y, m] = first.split('-').map(Number)
    const nextMonth = new Date(Date.UTC(y, m, 1)).toISOString().slice(0, 10)
    const last = nextMonth <= to ? addDays(nextMonth, -1) : to
    out.push({ month: first.slice(0, 7), start: dayStart(first, zone), end: dayEnd(last, zone) })
    first = nextMonth
  }
  return out
}

/** A function giving the calendar day (YYYY-MM-DD) an instant falls on in the zone; one formatter for many rows. */
export function localDayOf(zone: string): (at: Date) => string {
  const format = new Intl.DateTimeFormat('en-CA', { timeZone: zone, year: 'numeric', month: '2-digit', day: '2-digit' })
  return (at) => format.format(at)
}

/** The calendar day (YYYY-MM-DD) an instant falls on in the zone. */
export function localDayIn(zone: string, at: Date): string {
  return localDayOf(zone)(at)
}
