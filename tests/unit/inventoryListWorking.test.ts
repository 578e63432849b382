// The list path's lighter forms give the same figures as the full ones (shared/inventory/reorder.ts, abc.ts).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { Decimal } from 'decimal.js'
import { annualUsageValue } from '../../shared/inventory/abc.js'
import { DEFAULT_REORDER_POLICY, reorderSuggestion, type ReorderInput } from '../../shared/inventory/reorder.js'

const line = (onHand: number, meanDaily: number, sdDaily: number, serviceLevel: number): ReorderInput => ({
  demand: { meanDaily, sdDaily, daysSinceLastUse: 2 },
  stock: { onHand, onOrder: 0, reserved: 0 },
  unitCost: '4.35',
  policy: { ...DEFAULT_REORDER_POLICY, serviceLevel },
  vendor: { packSize: 12, minimumOrder: 24 },
})

describe('reorderSuggestion without the written working', () => {
  it('has the same figures, and writes the same working when it is read', () => {
    fc.assert(fc.property(
      fc.integer({ min: 0, max: 500 }), fc.double({ min: 0, max: 40, noNaN: true }), fc.double({ min: 0, max: 15, noNaN: true }),
      fc.constantFrom(0.9, 0.95, 0.975, 0.99),
      (onHand, d, sd, p) => {
        const full = reorderSuggestion(line(onHand, d, sd, p))
        const light = reorderSuggestion(line(onHand, d, sd, p), { explain: false })
        const { explanation, ...figures } = full
        expect({ ...light, explanation: undefined }).toEqual({ ...figures, explanation: undefined })
        expect(light.explanation).toEqual(explanation)
        expect(explanation.steps.length).toBeGreaterThan(3)
      },
    ))
  })
})

describe('annualUsageValue in integer cents', () => {
  it('matches decimal.js: exact product of the quantity as written and the cost, half-up to cents', () => {
    // source: decimal.js (registry reference library), the product rounded with ROUND_HALF_UP to 2 places.
    const reference = (q: number, cost: string) => new Decimal(cost).times(q).toDecimalPlaces(2, Decimal.ROUND_HALF_UP).toFixed(2)
    fc.assert(fc.property(
      fc.integer({ min: 0, max: 100_000 }), fc.constantFrom(1, 7, 30, 90, 180, 181, 365),
      fc.integer({ min: 0, max: 99_999_999 }), fc.integer({ min: 0, max: 4 }),
      (qty, days, costUnits, places) => {
        const q = qty / days * 365
        const cost = (costUnits / 10 ** places).toFixed(places)
        expect(annualUsageValue(q, cost)).toBe(reference(q, cost))
      },
    ))
    // Half a cent rounds up, as written, not as the float would: 0.125 × 1 → 0.13, 2.675 × 1 → 2.68.
    expect(annualUsageValue(0.125, '1')).toBe('0.13')
    expect(annualUsageValue(2.675, '1.00')).toBe('2.68')
    expect(annualUsageValue(1e-7, '3.00')).toBe('0.00')
  })
})
