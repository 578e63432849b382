// The stock movements export with no dates chosen: it takes the last 90 local days (a quarter, which the
// server's 20,000-move limit allows in a busy yard) instead of a whole year that is always refused.
import { describe, expect, it } from 'vitest'
import { exportDates } from '../../shared/schemas/stockViews.js'

describe('ledger export dates', () => {
  it('defaults to the 90 local days up to today, midnight to midnight', () => {
    const today = new Date(2026, 11, 4, 15, 30) // 4 December 2026, afternoon, local time
    const range = exportDates(null, today)
    // 4 Dec back 89 days = 6 Sep (Dec 4 → Nov 30: 4, Nov: 30, Oct: 31, Sep 30 → Sep 6: 24; 4 + 30 + 31 + 24 = 89), hand counted
    expect(range).toEqual({ from: new Date(2026, 8, 6).toISOString(), to: new Date(2026, 11, 5).toISOString(), defaulted: true })
  })

  it('keeps the dates a user chose', () => {
    expect(exportDates(['2025-01-01', '2025-03-31'], new Date(2026, 11, 4))).toEqual({
      from: new Date(2025, 0, 1).toISOString(), to: new Date(2025, 3, 1).toISOString(), defaulted: false,
    })
  })
})
