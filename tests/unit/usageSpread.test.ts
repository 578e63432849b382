// A month's use spread over its days (shared/inventory/usageSpread.ts), hand-worked.
import { describe, expect, it } from 'vitest'
import { daysInMonth, spreadOverMonth } from '../../shared/inventory/usageSpread.js'

describe('spreadOverMonth', () => {
  it('keeps the month total, giving the remainder to the first days', () => {
    // April has 30 days: 31 units → 2 on the 1st, 1 on each other day.
    const april = spreadOverMonth('2026-04', 31)
    expect(april).toHaveLength(30)
    expect(april[0]).toEqual({ date: '2026-04-01', qty: 2 })
    expect(april.slice(1).every((d) => d.qty === 1)).toBe(true)
    expect(april.at(-1)!.date).toBe('2026-04-30')
    // 2028 is a leap year (Gregorian rule: divisible by 4, not a century): February has 29 days.
    expect(daysInMonth('2028-02')).toBe(29)
    expect(spreadOverMonth('2028-02', 58).map((d) => d.qty)).toEqual(Array(29).fill(2))
    // Fewer units than days: only the first days get one.
    expect(spreadOverMonth('2026-12', 3)).toEqual([{ date: '2026-12-01', qty: 1 }, { date: '2026-12-02', qty: 1 }, { date: '2026-12-03', qty: 1 }])
    expect(spreadOverMonth('2026-12', 0)).toEqual([])
  })

  it('refuses what is not a month or a whole quantity', () => {
    expect(() => spreadOverMonth('2026-13', 1)).toThrow(RangeError)
    expect(() => spreadOverMonth('2026-04', 1.5)).toThrow(RangeError)
    expect(() => spreadOverMonth('2026-04', -1)).toThrow(RangeError)
  })
})
