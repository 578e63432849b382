// Report arithmetic (shared/reports/): stock value as of a past day replayed from cost-bearing moves,
// turnover and days of supply, and calendar days in a time zone.
import { describe, expect, it } from 'vitest'
import { turnsOf } from '../../shared/reports/stockTurns.js'
import { valueAsOf, type CostBearingMove } from '../../shared/reports/valuationReplay.js'
import { dayEnd, dayStart, daysInclusive, monthsBetween } from '../../shared/reports/zonedDays.js'

// source: Weygandt, Kimmel & Kieso, Accounting Principles, inventory chapter appendix (perpetual inventory,
// moving-average method), Houston Electronics — from memory: 100 @ $10 on hand (Jan 1), bought 200 @ $11
// (Apr 15) and 300 @ $12 (Aug 24), sold 550 (Sep 10), bought 400 @ $13 (Nov 27). The book rounds the average
// to the cent in its table ($11.333, $12.816); we keep four places, as the stock service stores it.
const key = '1|1'
const receipts: { move: CostBearingMove; day: string }[] = [
  { day: '2026-01-01', move: { key, before: 0, qty: 100, unitCost: '10.0000' } },
  { day: '2026-04-15', move: { key, before: 100, qty: 200, unitCost: '11.0000' } },
  { day: '2026-08-24', move: { key, before: 300, qty: 300, unitCost: '12.0000' } },
  // The sale of 550 on Sep 10 moves no cost: only the units on hand change (600 → 50).
  { day: '2026-11-27', move: { key, before: 50, qty: 400, unitCost: '13.0000' } },
]
const upTo = (day: string) => receipts.filter((r) => r.day <= day).map((r) => r.move)

describe('stock value as of a past day', () => {
  it('after the August purchase: 600 units, each blend rounded to four places', () => {
    // April: (100 × 10 + 200 × 11) / 300 = 3,200 / 300 = 10.66666… → 10.6667;
    // August: (300 × 10.6667 + 300 × 12) / 600 = (3,200.01 + 3,600) / 600 = 11.33335 → 11.3334 (half up);
    // 600 × 11.3334 = 6,800.04 (the book, at the cent: $6,800)
    const v = valueAsOf(upTo('2026-08-31'), new Map([[key, 600]])).get(key)
    expect(v).toEqual({ onHand: 600, averageCost: '11.3334', value: '6800.04' })
  })

  it('after the September sale: 50 left at the same average', () => {
    // 50 × 11.3334 = 566.67 (the book: $567)
    expect(valueAsOf(upTo('2026-09-30'), new Map([[key, 50]])).get(key)?.value).toBe('566.67')
  })

  it('at the year end: the November purchase blends with the 50 left', () => {
    // (50 × 11.3334 + 400 × 13) / 450 = (566.67 + 5,200) / 450 = 5,766.67 / 450 = 12.81482… → 12.8148;
    // 450 × 12.8148 = 5,766.66 (the book: $5,767)
    expect(valueAsOf(upTo('2026-12-31'), new Map([[key, 450]])).get(key)).toEqual({ onHand: 450, averageCost: '12.8148', value: '5766.66' })
  })

  it('a receipt into an empty warehouse takes its own cost, whatever came before', () => {
    // Nothing on hand (all issued) before the second receipt: the old 10.00 carries no weight.
    const v = valueAsOf([{ key, before: 0, qty: 5, unitCost: '10.0000' }, { key, before: 0, qty: 4, unitCost: '12.5000' }], new Map([[key, 4]]))
    expect(v.get(key)).toEqual({ onHand: 4, averageCost: '12.5000', value: '50.00' })
  })
})

describe('turnover and days of supply', () => {
  // source: Weygandt, Kimmel & Kieso, Accounting Principles, inventories chapter: inventory turnover = cost of
  // goods sold ÷ average inventory; days in inventory = 365 ÷ inventory turnover.
  it('the year of the example above', () => {
    // Cost of goods sold 550 × 11.3334 = 6,233.37; average inventory (1,000.00 + 5,766.66) / 2 = 3,383.33;
    // turnover 6,233.37 / 3,383.33 = 1.8424; days in inventory 365 / 1.8424 = 198.1.
    const f = turnsOf({ costOfGoods: '6233.37', beginValue: '1000.00', endValue: '5766.66', days: 365 })
    expect(f.averageValue).toBe('3383.33')
    expect(f.turns).toBeCloseTo(1.8424, 4)
    expect(f.annualTurns).toBeCloseTo(1.8424, 4)
    expect(f.daysOfSupply).toBeCloseTo(198.1, 1)
  })

  it('a quarter scales to a year; no stock means no turnover', () => {
    // 900 / ((500 + 700) / 2) = 900 / 600 = 1.5 turns in 91 days → 1.5 × 365 / 91 = 6.02 a year; 91 / 1.5 = 60.67 days
    const q = turnsOf({ costOfGoods: '900.00', beginValue: '500.00', endValue: '700.00', days: 91 })
    expect(q.turns).toBe(1.5)
    expect(q.annualTurns).toBeCloseTo(6.02, 2)
    expect(q.daysOfSupply).toBeCloseTo(60.67, 2)
    expect(turnsOf({ costOfGoods: '0.00', beginValue: '0.00', endValue: '0.00', days: 30 })).toMatchObject({ turns: null, daysOfSupply: null })
  })
})

describe('days in a time zone', () => {
  // from memory: US Central time is UTC−6 in winter and UTC−5 in summer; in 2026 summer time starts on
  // Sunday 8 March at 02:00 and ends on Sunday 1 November at 02:00.
  it('a day starts at local midnight', () => {
    expect(dayStart('2026-01-15', 'America/Chicago').toISOString()).toBe('2026-01-15T06:00:00.000Z')
    expect(dayStart('2026-07-01', 'America/Chicago').toISOString()).toBe('2026-07-01T05:00:00.000Z')
    expect(dayStart('2026-03-08', 'America/Chicago').toISOString()).toBe('2026-03-08T06:00:00.000Z')
    expect(dayEnd('2026-03-08', 'America/Chicago').toISOString()).toBe('2026-03-09T05:00:00.000Z')
    expect(dayStart('2026-07-01', 'UTC').toISOString()).toBe('2026-07-01T00:00:00.000Z')
  })

  it('counts days and splits a range into its months', () => {
    expect(daysInclusive('2026-01-01', '2026-12-31')).toBe(365)
    const months = monthsBetween('2026-01-20', '2026-03-05', 'UTC')
    expect(months.map((m) => [m.month, m.start.toISOString().slice(0, 10), m.end.toISOString().slice(0, 10)])).toEqual([
      ['2026-01', '2026-01-20', '2026-02-01'], ['2026-02', '2026-02-01', '2026-03-01'], ['2026-03', '2026-03-01', '2026-03-06'],
    ])
  })
})
