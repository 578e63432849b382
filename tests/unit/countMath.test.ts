// Cycle count arithmetic (shared/counts/): ABC count frequency, reconciling moves made during a count,
// accuracy and the review rules.
import { describe, expect, it } from 'vitest'
import { dailyCountLoad, DEFAULT_COUNT_INTERVALS, isCountDue, workingDaysOf } from '../../shared/counts/countFrequency.js'
import { accuracyOf, reconcileCount, varianceValue } from '../../shared/counts/countVariance.js'
import { reviewRefusal } from '../../shared/counts/countReviewRules.js'

describe('count frequency by ABC class', () => {
  // source: Heizer & Render, Operations Management, inventory management chapter, the cycle-counting worked
  // example (a truck maker with 5,000 items) — from memory: 500 A items counted every month (20 working days),
  // 1,750 B items every quarter (60), 2,750 C items every six months (120); items a day 500/20 = 25,
  // 1,750/60 = 29.17 → 29, 2,750/120 = 22.92 → 23; 77 items counted each day.
  it('matches the textbook cycle-counting example: 77 items a day', () => {
    const load = dailyCountLoad({ A: 500, B: 1750, C: 2750 })
    expect(load.perClass).toEqual({ A: 25, B: 29, C: 23 })
    expect(load.total).toBe(77)
  })

  it('defaults are a month, a quarter and six months (20, 60 and 120 working days)', () => {
    expect(DEFAULT_COUNT_INTERVALS).toEqual({ A: 30, B: 90, C: 180 })
    expect([workingDaysOf(30), workingDaysOf(90), workingDaysOf(180)]).toEqual([20, 60, 120])
  })

  it('an item is due when never counted or counted at least its interval ago', () => {
    const now = new Date('2026-12-04T12:00:00Z')
    expect(isCountDue(null, 30, now)).toBe(true)
    expect(isCountDue(new Date('2026-11-04T12:00:00Z'), 30, now)).toBe(true) // exactly 30 days
    expect(isCountDue(new Date('2026-11-05T12:00:00Z'), 30, now)).toBe(false) // 29 days
  })

  it('refuses an interval of zero days', () => {
    expect(() => dailyCountLoad({ A: 1, B: 1, C: 1 }, { A: 0, B: 90, C: 180 })).toThrow(RangeError)
  })
})

describe('a move while the bin is being counted', () => {
  // Arithmetic by hand: 40 on hand when the visit started; a picker took 5 from the bin meanwhile, so the
  // ledger expects 40 − 5 = 35 when the counter enters 33; the variance is 33 − 35 = −2 (two missing),
  // not 33 − 40 = −7 as a count against the frozen snapshot would say.
  it('reconciles the snapshot with the moves since', () => {
    expect(reconcileCount({ snapshot: 40, movesSince: -5, counted: 33 })).toEqual({ expected: 35, variance: -2 })
  })

  it('a receipt into the bin during the count raises the expectation', () => {
    // 12 + 24 received = 36 expected; 36 counted: no variance.
    expect(reconcileCount({ snapshot: 12, movesSince: 24, counted: 36 })).toEqual({ expected: 36, variance: 0 })
  })

  it('refuses a negative or fractional count', () => {
    expect(() => reconcileCount({ snapshot: 4, movesSince: 0, counted: -1 })).toThrow(RangeError)
    expect(() => reconcileCount({ snapshot: 4, movesSince: 0, counted: 1.5 })).toThrow(RangeError)
  })
})

describe('accuracy', () => {
  it('lines right ÷ lines counted, and the value of the variances', () => {
    // By hand: 2 of 4 lines right = 50 %; values −2 × 3.25 = −6.50 and +1 × 10.00 = +10.00;
    // off by |−6.50| + 10.00 = 16.50; net −6.50 + 10.00 = +3.50.
    const figures = accuracyOf([
      { variance: 0, unitCost: '5.0000' },
      { variance: -2, unitCost: '3.2500' },
      { variance: 1, unitCost: '10.0000' },
      { variance: 0, unitCost: '1.0000' },
    ])
    expect(figures).toEqual({ linesCounted: 4, linesRight: 2, accuracy: 0.5, valueOff: '16.50', valueNet: '3.50' })
  })

  it('rounds a variance value half-up to cents', () => {
    // −3 × 11.3333 = −33.9999 → −34.00; 1 × 0.0050 = 0.005 → 0.01
    expect(varianceValue(-3, '11.3333')).toBe('-34.00')
    expect(varianceValue(1, '0.0050')).toBe('0.01')
  })

  it('has no accuracy when nothing was counted', () => {
    expect(accuracyOf([]).accuracy).toBeNull()
  })
})

describe('who may review a count line', () => {
  const counted = { status: 'counted' as const, countedBy: 7 }
  it('the counter may never approve their own count, even as admin', () => {
    expect(reviewRefusal({ userId: 7, roles: ['admin'] }, [], counted, 'approve')).toBe('count_self_approval')
    expect(reviewRefusal({ userId: 8, roles: ['admin'] }, [], counted, 'approve')).toBeNull()
  })
  it('other roles review only when the admin chose them', () => {
    expect(reviewRefusal({ userId: 8, roles: ['warehouse'] }, [], counted, 'approve')).toBe('count_reviewer_role')
    expect(reviewRefusal({ userId: 8, roles: ['warehouse'] }, ['warehouse'], counted, 'approve')).toBeNull()
    expect(reviewRefusal({ userId: 8, roles: ['counter'] }, ['warehouse', 'buyer'], counted, 'recount')).toBe('count_reviewer_role')
  })
  it('asking for your own line to be counted again is allowed; a line not counted yet is not reviewed', () => {
    expect(reviewRefusal({ userId: 7, roles: ['admin'] }, [], counted, 'recount')).toBeNull()
    expect(reviewRefusal({ userId: 8, roles: ['admin'] }, [], { status: 'waiting', countedBy: null }, 'approve')).toBe('count_line_not_counted')
  })
})
