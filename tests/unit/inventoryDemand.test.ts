// Daily demand statistics from sparse usage (shared/inventory/demand.ts).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import {
  linearRegression, mean, sampleStandardDeviation, sampleVariance, standardDeviation, variance,
} from 'simple-statistics'
import { dateOfDayNumber, dayNumber, demandStats, statsFromSums, statsOfValues, windowDays } from '../../shared/inventory/demand.js'

const close = (a: number, b: number, tol = 1e-9) => expect(Math.abs(a - b)).toBeLessThanOrEqual(tol * Math.max(1, Math.abs(b)))

describe('dates', () => {
  it('counts window days inclusively, across a leap day', () => {
    // source: Gregorian calendar (common knowledge): 2024 is a leap year, 2023 is not
    expect(windowDays({ start: '2024-01-01', end: '2024-12-31' })).toBe(366)
    expect(windowDays({ start: '2023-01-01', end: '2023-12-31' })).toBe(365)
    expect(windowDays({ start: '2024-02-28', end: '2024-03-01' })).toBe(3)
    expect(dateOfDayNumber(dayNumber('2024-02-29'))).toBe('2024-02-29')
    expect(() => dayNumber('2023-02-29')).toThrow(RangeError)
    expect(() => dayNumber('2024-2-1')).toThrow(RangeError)
    expect(() => windowDays({ start: '2024-03-02', end: '2024-03-01' })).toThrow(RangeError)
  })
})

describe('demandStats: hand-worked', () => {
  // 10-day window, use on 3 days: series 0,4,0,0,6,0,0,0,2,0 (hand-expanded)
  const usage = { '2025-03-02': 4, '2025-03-05': 6, '2025-03-09': 2, '2025-02-20': 9, '2025-03-20': 5 }
  const s = demandStats(usage, { start: '2025-03-01', end: '2025-03-10' })

  it('counts the days without use', () => {
    // hand-worked: Σx = 12, n = 10, mean 1.2; Σx² = 16+36+4 = 56; SS = 56 − 12²/10 = 41.6
    expect(s.days).toBe(10)
    expect(s.totalQty).toBe(12)
    expect(s.daysWithUse).toBe(3)
    close(s.mean, 1.2)
    close(s.variancePopulation, 4.16)
    close(s.varianceSample, 41.6 / 9)
    close(s.annualUsage, 1.2 * 365)
  })

  it('agrees with simple-statistics on the expanded series', () => {
    // source: simple-statistics (npm) as an independent reference
    const series = [0, 4, 0, 0, 6, 0, 0, 0, 2, 0]
    close(s.mean, mean(series))
    close(s.sdPopulation, standardDeviation(series))
    close(s.sdSample, sampleStandardDeviation(series))
  })

  it('finds the last use and a trend', () => {
    expect(s.lastUsedDate).toBe('2025-03-09')
    expect(s.daysSinceLastUse).toBe(1)
    // hand-worked halves: days 0–4 sum 10 → 2.0/day, days 5–9 sum 2 → 0.4/day, ratio 0.2
    close(s.trend.firstHalfMean, 2)
    close(s.trend.secondHalfMean, 0.4)
    close(s.trend.halfRatio!, 0.2)
    // hand-worked slope: Σt·x = 1·4 + 4·6 + 8·2 = 44, Σt = 45, Σt² = 285 → (10·44 − 45·12)/(10·285 − 45²) = −100/825
    close(s.trend.slopePerDay, -100 / 825)
  })

  it('looks before the window for the last use, never after it', () => {
    const earlier = demandStats({ '2025-01-15': 3, '2025-04-01': 8 }, { start: '2025-03-01', end: '2025-03-10' })
    expect(earlier.totalQty).toBe(0)
    expect(earlier.lastUsedDate).toBe('2025-01-15')
    expect(earlier.daysSinceLastUse).toBe(54) // 16 days left of January + 28 of February + 10 of March
    expect(demandStats({}, { start: '2025-03-01', end: '2025-03-10' }).lastUsedDate).toBeNull()
  })

  it('accepts an array with repeated dates and ignores net-zero days as use', () => {
    const r = demandStats([{ date: '2025-03-03', qty: 5 }, { date: '2025-03-03', qty: -5 }, { date: '2025-03-01', qty: 2 }],
      { start: '2025-03-01', end: '2025-03-04' })
    expect(r.totalQty).toBe(2)
    expect(r.daysWithUse).toBe(1)
    expect(r.lastUsedDate).toBe('2025-03-01')
    expect(r.trend.halfRatio).toBe(0)
  })
})

describe('demandStats against simple-statistics (property)', () => {
  // source: simple-statistics mean / variance / sampleVariance / linearRegression on the zero-filled series
  const usageArb = fc.record({
    days: fc.integer({ min: 2, max: 400 }),
    uses: fc.array(fc.record({ offset: fc.nat(399), qty: fc.integer({ min: 1, max: 500 }) }), { maxLength: 60 }),
  })
  it('matches on the expanded series', () => {
    fc.assert(fc.property(usageArb, ({ days, uses }) => {
      const start = dayNumber('2024-06-01')
      const window = { start: dateOfDayNumber(start), end: dateOfDayNumber(start + days - 1) }
      const series = new Array<number>(days).fill(0)
      const sparse: Record<string, number> = {}
      for (const u of uses) {
        if (u.offset >= days) continue
        series[u.offset] += u.qty
        const d = dateOfDayNumber(start + u.offset)
        sparse[d] = (sparse[d] ?? 0) + u.qty
      }
      const s = demandStats(sparse, window)
      close(s.mean, mean(series))
      close(s.variancePopulation, variance(series), 1e-8)
      close(s.varianceSample, sampleVariance(series), 1e-8)
      close(s.trend.slopePerDay, linearRegression(series.map((x, t) => [t, x])).m, 1e-7)
      const fromSums = statsFromSums({ days, sum: series.reduce((a, b) => a + b, 0), sumSquares: series.reduce((a, b) => a + b * b, 0) })
      close(fromSums.mean, s.mean)
      close(fromSums.variancePopulation, s.variancePopulation, 1e-7)
      close(fromSums.sdSample, sampleStandardDeviation(series), 1e-6)
    }))
  })
})

describe('statsFromSums and statsOfValues', () => {
  it('computes from SQL-style aggregates', () => {
    // hand-worked: 5 days, Σx = 10, Σx² = 30 → mean 2, SS = 30 − 20 = 10, s² = 2.5, σ² = 2
    const r = statsFromSums({ days: 5, sum: 10, sumSquares: 30 })
    expect(r).toMatchObject({ days: 5, mean: 2, varianceSample: 2.5, variancePopulation: 2 })
    expect(statsFromSums({ days: 1, sum: 7, sumSquares: 49 }).varianceSample).toBe(0)
    expect(() => statsFromSums({ days: 0, sum: 0, sumSquares: 0 })).toThrow(RangeError)
  })

  it('clamps float residue instead of returning a negative variance', () => {
    // constant series 0.1 × 3: Σx² − (Σx)²/n is a few ulps off zero in floats
    const r = statsFromSums({ days: 3, sum: 0.1 + 0.1 + 0.1, sumSquares: 0.01 + 0.01 + 0.01 })
    expect(r.variancePopulation).toBeGreaterThanOrEqual(0)
    expect(r.sdSample).toBeLessThan(1e-7)
  })

  it('summarises lead times against simple-statistics', () => {
    const leadTimes = [9, 12, 14, 10, 15]
    const r = statsOfValues(leadTimes)
    close(r.mean, mean(leadTimes)) // source: simple-statistics
    close(r.sdSample, sampleStandardDeviation(leadTimes))
  })
})
