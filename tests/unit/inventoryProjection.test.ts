// The chart's stock projection and zero-filled daily series (shared/inventory/stockProjection.ts).
import { describe, expect, it } from 'vitest'
import { projectPosition, zeroFilledDays } from '../../shared/inventory/stockProjection.js'

describe('projectPosition', () => {
  it('falls at the mean daily use over the lead time and the horizon', () => {
    // hand-worked: 60 − 4.2 × t for t = 0 … ⌈2.5⌉ + 2 = 5 → 60, 55.8, 51.6, 47.4, 43.2, 39
    const p = projectPosition({ from: '2025-02-26', position: 60, meanDaily: 4.2, leadTimeDays: 2.5, horizonDays: 2 })
    expect(p.map((d) => d.position)).toEqual([60, 55.8, 51.6, 47.4, 43.2, 39])
    // source: Gregorian calendar (common knowledge): 2025 is not a leap year, so 26 Feb + 3 days is 1 March
    expect(p.map((d) => d.date)).toEqual(['2025-02-26', '2025-02-27', '2025-02-28', '2025-03-01', '2025-03-02', '2025-03-03'])
  })

  it('stays flat without use and rejects nonsense', () => {
    expect(projectPosition({ from: '2025-01-01', position: 7, meanDaily: 0, leadTimeDays: 0, horizonDays: 0 })).toEqual([{ date: '2025-01-01', position: 7 }])
    expect(() => projectPosition({ from: '2025-01-01', position: 7, meanDaily: -1, leadTimeDays: 1, horizonDays: 1 })).toThrow(RangeError)
    expect(() => projectPosition({ from: '2025-01-01', position: 7, meanDaily: 1, leadTimeDays: 1, horizonDays: 1.5 })).toThrow(RangeError)
  })
})

describe('zeroFilledDays', () => {
  it('gives every day, zeros where nothing was used, and adds up repeated dates', () => {
    const days = zeroFilledDays([{ date: '2024-02-28', qty: 3 }, { date: '2024-03-01', qty: 2 }, { date: '2024-03-01', qty: 1 }], '2024-02-27', '2024-03-01')
    // source: Gregorian calendar (common knowledge): 2024 is a leap year, so 29 February exists
    expect(days).toEqual([
      { date: '2024-02-27', qty: 0 }, { date: '2024-02-28', qty: 3 }, { date: '2024-02-29', qty: 0 }, { date: '2024-03-01', qty: 3 },
    ])
  })
})
