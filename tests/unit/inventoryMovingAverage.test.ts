// Perpetual moving-average unit cost (shared/inventory/movingAverage.ts).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { Decimal } from 'decimal.js'
import {
  applyIssue, applyReceipt, averageCostsByItemWarehouse, EMPTY_COST_STATE, inventoryValue, replayCostMoves,
  type CostMove,
} from '../../shared/inventory/movingAverage.js'

// source: Weygandt, Kimmel & Kieso, Accounting Principles, inventory chapter appendix (perpetual inventory,
// moving-average method), Houston Electronics' Astro condensers — from memory. The book's table, as recalled:
//   Jan 1  beginning   100 @ $10              → 100 units, $1,000, average $10.000
//   Apr 15 purchase    200 @ $11              → 300 units, $3,200, average $10.667
//   Aug 24 purchase    300 @ $12              → 600 units, $6,800, average $11.333
//   Sep 10 sale        550 @ $11.333 = $6,233 →  50 units,   $567
//   Nov 27 purchase    400 @ $13              → 450 units, $5,767, average $12.816
// Internal consistency by hand: 1,000 + 2,200 = 3,200; 3,200 + 3,600 = 6,800; 6,800 / 600 = 11.3333;
// 550 × 11.3333 = 6,233.3 → $6,233; 6,800 − 6,233 = 567; 567 + 5,200 = 5,767; 5,767 / 450 = 12.8156 → 12.816.
// Cost of goods sold + ending inventory = 6,233 + 5,767 = 12,000 = cost of goods available (1,000+2,200+3,600+5,200).
const houston: CostMove[] = [
  { kind: 'receipt', qty: 100, unitCost: '10.00' },
  { kind: 'receipt', qty: 200, unitCost: '11.00' },
  { kind: 'receipt', qty: 300, unitCost: '12.00' },
  { kind: 'issue', qty: 550 },
  { kind: 'receipt', qty: 400, unitCost: '13.00' },
]

describe('moving average: textbook example', () => {
  const steps = replayCostMoves(houston)

  it('follows our 4-place rule exactly (hand-worked)', () => {
    // hand-worked, each average rounded half-up to 4 places and carried forward as stored:
    //   3,200 / 300 = 10.66666… → 10.6667
    //   (300 × 10.6667 + 300 × 12) / 600 = (3,200.01 + 3,600) / 600 = 11.33335 → 11.3334
    //   issue 550 × 11.3334 = 6,233.37
    //   (50 × 11.3334 + 400 × 13) / 450 = (566.67 + 5,200) / 450 = 12.814822… → 12.8148
    expect(steps.map((s) => s.after.averageCost)).toEqual(['10.0000', '10.6667', '11.3334', '11.3334', '12.8148'])
    expect(steps.map((s) => s.after.onHand)).toEqual([100, 300, 600, 50, 450])
    expect(steps[3].extendedCost).toBe('6233.37')
    expect(inventoryValue(steps[4].after)).toBe('5766.66') // 450 × 12.8148 = 5,766.66
  })

  it('agrees with the book at the book’s precision (3 places, whole dollars)', () => {
    const at3 = (s: string) => new Decimal(s).toDecimalPlaces(3).toFixed(3)
    expect(at3(steps[1].after.averageCost)).toBe('10.667')
    expect(at3(steps[2].after.averageCost)).toBe('11.333')
    expect(Math.round(Number(steps[3].extendedCost))).toBe(6233) // cost of goods sold
    expect(Math.round(Number(inventoryValue(steps[3].after)))).toBe(567)
    expect(Math.round(Number(inventoryValue(steps[4].after)))).toBe(5767) // ending inventory
    // The book's 12.816 divides a dollar-rounded $5,767; ours carries cents, so only within 0.002.
    expect(Math.abs(Number(steps[4].after.averageCost) - 12.816)).toBeLessThan(0.002)
  })

  it('explains each receipt with the numbers filled in', () => {
    expect(steps[1].explanation).toBe('average = (100 × 10.0000 + 200 × 11.00) / (100 + 200) = 3200 / 300 = 10.6667')
    expect(steps[3].explanation).toContain('550 × 11.3334 = 6233.37')
  })
})

describe('moving average: rules', () => {
  it('leaves the average unchanged on issues', () => {
    const s = applyReceipt(EMPTY_COST_STATE, 40, '2.3750').after
    const after = applyIssue(s, 15)
    expect(after.after).toEqual({ onHand: 25, averageCost: '2.3750' })
    expect(after.extendedCost).toBe('35.63') // 15 × 2.375 = 35.625 → half-up 35.63
  })

  it('refuses bad quantities, negative costs and over-issue', () => {
    expect(() => applyReceipt(EMPTY_COST_STATE, 0, '1.00')).toThrow(RangeError)
    expect(() => applyReceipt(EMPTY_COST_STATE, 2.5, '1.00')).toThrow(RangeError)
    expect(() => applyReceipt(EMPTY_COST_STATE, 1, '-1.00')).toThrow(RangeError)
    expect(() => applyReceipt(EMPTY_COST_STATE, 1, '1.00001')).toThrow(RangeError)
    expect(() => applyIssue({ onHand: 3, averageCost: '1.0000' }, 4)).toThrow(RangeError)
  })

  it('takes the receipt cost when nothing is on hand', () => {
    const emptied = applyIssue(applyReceipt(EMPTY_COST_STATE, 10, '5.00').after, 10).after
    expect(applyReceipt(emptied, 4, '7.25').after).toEqual({ onHand: 4, averageCost: '7.2500' })
  })

  it('keeps each item and warehouse apart', () => {
    const states = averageCostsByItemWarehouse([
      { itemId: 1, warehouseId: 'N', move: { kind: 'receipt', qty: 10, unitCost: '4.00' } },
      { itemId: 1, warehouseId: 'S', move: { kind: 'receipt', qty: 10, unitCost: '8.00' } },
      { itemId: 1, warehouseId: 'N', move: { kind: 'receipt', qty: 30, unitCost: '6.00' } },
    ])
    expect(states.get('1|N')).toEqual({ onHand: 40, averageCost: '5.5000' }) // (10×4 + 30×6)/40 = 220/40
    expect(states.get('1|S')).toEqual({ onHand: 10, averageCost: '8.0000' })
  })

  it('stays within n × 0.00005 of the exact weighted average (property)', () => {
    // reference: the exact weighted mean Σ qty·cost / Σ qty in decimal.js; each 4-place rounding adds ≤ 0.00005
    const receipt = fc.record({ qty: fc.integer({ min: 1, max: 5000 }), cents: fc.integer({ min: 0, max: 100000 }) })
    fc.assert(fc.property(fc.array(receipt, { minLength: 1, maxLength: 30 }), (rs) => {
      const moves: CostMove[] = rs.map((r) => ({ kind: 'receipt', qty: r.qty, unitCost: (r.cents / 100).toFixed(2) }))
      const final = replayCostMoves(moves).at(-1)!.after
      const value = rs.reduce((v, r) => v.plus(new Decimal(r.cents).dividedBy(100).times(r.qty)), new Decimal(0))
      const qty = rs.reduce((q, r) => q + r.qty, 0)
      const exact = value.dividedBy(qty)
      expect(final.onHand).toBe(qty)
      expect(exact.minus(final.averageCost).abs().toNumber()).toBeLessThanOrEqual(rs.length * 0.00005 + 1e-12)
    }))
  })
})
