// Daily demand statistics from sparse usage (only the days that had use), counting the days with no use as zeros:
// leaving them out would overstate the mean and understate the variation that safety stock must cover.

/** Calendar dates as 'YYYY-MM-DD'; quantities in the stock unit. */
export type DailyUsage = Readonly<Record<string, number>> | ReadonlyArray<{ date: string; qty: number }>

export interface DateWindow {
  /** First day, inclusive, 'YYYY-MM-DD'. */
  start: string
  /** Last day, inclusive, 'YYYY-MM-DD'. */
  end: string
}

export interface SumsInput {
  days: number
  sum: number
  sumSquares: number
}

export interface SpreadStats {
  days: number
  mean: number
  /** Divides by n − 1; 0 when n < 2. */
  varianceSample: number
  /** Divides by n. */
  variancePopulation: number
  sdSample: number
  sdPopulation: number
}

export interface DemandTrend {
  /** Least-squares slope of daily usage against day number (units per day, per day). */
  slopePerDay: number
  firstHalfMean: number
  secondHalfMean: number
  /** secondHalfMean / firstHalfMean; null when the first half had no use. */
  halfRatio: number | null
}

export interface DemandStats extends SpreadStats {
  window: DateWindow
  totalQty: number
  daysWithUse: number
  /** mean × 365: the yearly rate the window implies. */
  annualUsage: number
  /** Last day of positive net use up to the window's end, including usage given from before the window. */
  lastUsedDate: string | null
  /** Days from the last use to the window's end; null when no use is known. */
  daysSinceLastUse: number | null
  trend: DemandTrend
}

export const DAYS_PER_YEAR = 365
const MS_PER_DAY = 86_400_000
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/

/** Day number (days since 1970-01-01) of an ISO calendar date; UTC so time zones and DST never shift it. */
export function dayNumber(date: string): number {
  const m = ISO_DATE.exec(date)
  if (!m) throw new RangeError(`expected a date as YYYY-MM-DD, got ${JSON.stringify(date)}`)
  const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])]
  const ms = Date.UTC(year, month - 1, day)
  const check = new Date(ms)
  if (check.getUTCMonth() !== month - 1 || check.getUTCDate() !== day) throw new RangeError(`no such date: ${date}`)
  return ms / MS_PER_DAY
}

/** ISO date of a day number. */
export function dateOfDayNumber(day: number): string {
  return new Date(day * MS_PER_DAY).toISOString().slice(0, 10)
}

/** Number of calendar days in the window, both ends included. */
export function windowDays(window: DateWindow): number {
  const days = dayNumber(window.end) - dayNumber(window.start) + 1
  if (days < 1) throw new RangeError(`window ends (${window.end}) before it starts (${window.start})`)
  return days
}

/** Mean and variances from n, Σx and Σx² (the server's SQL aggregates). Tiny negative float residue is clamped to 0. */
export function statsFromSums({ days, sum, sumSquares }: SumsInput): SpreadStats {
  if (!Number.isSafeInteger(days) || days < 1) throw new RangeError(`days must be a positive integer, got ${days}`)
  if (!Number.isFinite(sum) || !Number.isFinite(sumSquares) || sumSquares < 0) {
    throw new RangeError('sum and sumSquares must be finite, sumSquares ≥ 0')
  }
  const mean = sum / days
  const squaredDeviations = Math.max(0, sumSquares - (sum * sum) / days)
  return spread(days, mean, squaredDeviations)
}

function spread(days: number, mean: number, squaredDeviations: number): SpreadStats {
  const variancePopulation = squaredDeviations / days
  const varianceSample = days > 1 ? squaredDeviations / (days - 1) : 0
  return {
    days, mean, varianceSample, variancePopulation,
    sdSample: Math.sqrt(varianceSample),
    sdPopulation: Math.sqrt(variancePopulation),
  }
}

/** Mean and spread of a plain list (e.g. observed lead times in days, for σL). */
export function statsOfValues(values: readonly number[]): SpreadStats {
  if (values.length === 0) throw new RangeError('no values')
  const mean = values.reduce((a, b) => a + b, 0) / values.length
  return spread(values.length, mean, values.reduce((a, x) => a + (x - mean) ** 2, 0))
}

interface WindowUsage {
  byOffset: Map<number, number>
  /** Last day number with positive use on or before the window's end, looking before the window too. */
  lastUseDay: number | null
}

/** Usage inside the window, summed per day offset (0 = window start). Duplicate dates add up. */
function usageByOffset(usage: DailyUsage, window: DateWindow): WindowUsage {
  const start = dayNumber(window.start)
  const days = windowDays(window)
  const entries: Array<readonly [string, number]> = Array.isArray(usage)
    ? (usage as ReadonlyArray<{ date: string; qty: number }>).map((u) => [u.date, u.qty] as const)
    : Object.entries(usage as Readonly<Record<string, number>>)
  const byOffset = new Map<number, number>()
  const totalsBefore = new Map<number, number>()
  for (const [date, qty] of entries) {
    if (!Number.isFinite(qty)) throw new RangeError(`usage on ${date} is not a number`)
    const offset = dayNumber(date) - start
    if (offset >= days) continue
    const target = offset < 0 ? totalsBefore : byOffset
    target.set(offset, (target.get(offset) ?? 0) + qty)
  }
  // Net positive days only: a day whose issues were all returned is not a day of use.
  let lastOffset: number | null = null
  for (const [offset, qty] of [...byOffset, ...totalsBefore]) {
    if (qty > 0 && (lastOffset === null || offset > lastOffset)) lastOffset = offset
  }
  return { byOffset, lastUseDay: lastOffset === null ? null : start + lastOffset }
}

/** Slope by least squares over day offsets 0…n−1; the zero days only enter through the closed-form Σt and Σt². */
function leastSquaresSlope(days: number, total: number, byOffset: Map<number, number>): number {
  if (days < 2) return 0
  let sumTX = 0
  for (const [t, qty] of byOffset) sumTX += t * qty
  const sumT = (days * (days - 1)) / 2
  const sumTT = ((days - 1) * days * (2 * days - 1)) / 6
  return (days * sumTX - sumT * total) / (days * sumTT - sumT * sumT)
}

/** First half: offsets [0, ⌊n/2⌋); second half: [⌈n/2⌉, n). With an odd n the middle day belongs to neither. */
function halves(days: number, byOffset: Map<number, number>): Omit<DemandTrend, 'slopePerDay'> {
  const half = Math.floor(days / 2)
  if (half === 0) return { firstHalfMean: 0, secondHalfMean: 0, halfRatio: null }
  let first = 0
  let second = 0
  for (const [t, qty] of byOffset) {
    if (t < half) first += qty
    else if (t >= days - half) second += qty
  }
  const firstHalfMean = first / half
  const secondHalfMean = second / half
  return { firstHalfMean, secondHalfMean, halfRatio: first === 0 ? null : secondHalfMean / firstHalfMean }
}

/** Daily demand statistics over the window from sparse daily totals. */
export function demandStats(usage: DailyUsage, window: DateWindow): DemandStats {
  const days = windowDays(window)
  const { byOffset, lastUseDay } = usageByOffset(usage, window)
  let totalQty = 0
  let daysWithUse = 0
  for (const qty of byOffset.values()) {
    totalQty += qty
    if (qty > 0) daysWithUse += 1
  }
  const mean = totalQty / days
  // Two passes (mean first) for accuracy; each empty day adds mean² to the squared deviations.
  let squaredDeviations = (days - byOffset.size) * mean * mean
  for (const qty of byOffset.values()) squaredDeviations += (qty - mean) ** 2
  return {
    ...spread(days, mean, squaredDeviations),
    window,
    totalQty,
    daysWithUse,
    annualUsage: mean * DAYS_PER_YEAR,
    lastUsedDate: lastUseDay === null ? null : dateOfDayNumber(lastUseDay),
    daysSinceLastUse: lastUseDay === null ? null : dayNumber(window.end) - lastUseDay,
    trend: { slopePerDay: leastSquaresSlope(days, totalQty, byOffset), ...halves(days, byOffset) },
  }
}
