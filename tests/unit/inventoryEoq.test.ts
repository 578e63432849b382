// Economic order quantity and order rounding (shared/inventory/reorder.ts).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import {
  DEFAULT_REORDER_POLICY, economicOrderQuantity, reorderSuggestion, roundOrderQuantity,
} from '../../shared/inventory/reorder.js'

const totalAnnualCost = (Q: number, D: number, S: number, H: number) => (D / Q) * S + (Q / 2) * H

describe('EOQ: textbook examples', () => {
  it('Heizer, Render & Munson: D = 1,000, S = $10, H = $0.50 → Q* = 200', () => {
    // source: Heizer, Render & Munson, Operations Management, inventory chapter (Sharp, Inc. example) — from memory:
    // Q* = 200 units, N = D/Q* = 5 orders a year, T = 250 working days / N = 50 days, TC = $50 + $50 = $100.
    // hand-worked: √(2 × 1000 × 10 / 0.5) = √40,000 = 200.
    const q = economicOrderQuantity({ annualDemand: 1000, costPerOrder: 10, holdingCostPerUnit: 0.5 })!
    expect(q).toBeCloseTo(200, 9)
    expect(1000 / q).toBeCloseTo(5, 9)
    expect(250 / (1000 / q)).toBeCloseTo(50, 9)
    expect(totalAnnualCost(q, 1000, 10, 0.5)).toBeCloseTo(100, 9)
  })

  it('Stevenson: 9,600 tires a year, S = $75, H = $16 → Q* = 300', () => {
    // source: Stevenson, Operations Management, inventory chapter (tire distributor example) — from memory:
    // Q* = 300 tires, 32 orders a year, cycle = 288 operating days / 32 = 9 days, TC = $2,400 + $2,400 = $4,800.
    // hand-worked: √(2 × 9600 × 75 / 16) = √90,000 = 300.
    const q = economicOrderQuantity({ annualDemand: 9600, costPerOrder: 75, holdingCostPerUnit: 16 })!
    expect(q).toBeCloseTo(300, 9)
    expect(9600 / q).toBeCloseTo(32, 9)
    expect(288 / (9600 / q)).toBeCloseTo(9, 9)
    expect(totalAnnualCost(q, 9600, 75, 16)).toBeCloseTo(4800, 6)
  })

  it('reproduces Heizer through the full suggestion, H = i × C', () => {
    // H = 0.25/yr × $2.00 = $0.50; d̄ = 1000/365 so D = d̄ × 365 = 1,000
    const r = reorderSuggestion({
      demand: { meanDaily: 1000 / 365, sdDaily: 0, daysSinceLastUse: 1 },
      stock: { onHand: 500, onOrder: 0, reserved: 0 },
      unitCost: '2.00',
      policy: { ...DEFAULT_REORDER_POLICY, costPerOrder: '10.00', holdingRatePerYear: 0.25 },
    })
    expect(r.eoq).toBeCloseTo(200, 6)
    expect(r.lotSize).toBe(200)
    expect(r.explanation.steps.join('\n')).toContain('EOQ = √(2DS/H) = √(2 × 1000 × 10.00 / 0.5000) = 200')
  })
})

describe('EOQ: properties', () => {
  it('minimises total cost, and ordering cost equals holding cost there', () => {
    // source: Harris/Wilson EOQ derivation (textbook property): at Q*, (D/Q)S = (Q/2)H and TC is minimal
    fc.assert(fc.property(
      fc.double({ min: 1, max: 1e6, noNaN: true }), fc.double({ min: 0.01, max: 1000, noNaN: true }),
      fc.double({ min: 0.001, max: 1000, noNaN: true }), fc.double({ min: 0.2, max: 5, noNaN: true }),
      (D, S, H, k) => {
        const q = economicOrderQuantity({ annualDemand: D, costPerOrder: S, holdingCostPerUnit: H })!
        expect(Math.abs((D / q) * S - (q / 2) * H)).toBeLessThanOrEqual(1e-9 * (D / q) * S)
        expect(totalAnnualCost(q, D, S, H)).toBeLessThanOrEqual(totalAnnualCost(q * k, D, S, H) * (1 + 1e-12))
      }))
  })

  it('has no optimum when holding is free', () => {
    expect(economicOrderQuantity({ annualDemand: 100, costPerOrder: 5, holdingCostPerUnit: 0 })).toBeNull()
  })
})

describe('order rounding to vendor terms', () => {
  it('rounds up to whole packs and the minimum order', () => {
    expect(roundOrderQuantity(156.6, { packSize: 40, minimumOrder: 0 })).toBe(160)
    expect(roundOrderQuantity(156.6, { packSize: 40, minimumOrder: 200 })).toBe(200)
    expect(roundOrderQuantity(156.6, { packSize: 48, minimumOrder: 200 })).toBe(240) // minimum itself to whole packs
    expect(roundOrderQuantity(0, { packSize: 40, minimumOrder: 200 })).toBe(0)
    expect(roundOrderQuantity(12.0000000001)).toBe(12) // float dust is not a unit
  })

  it('never goes below the need (property)', () => {
    fc.assert(fc.property(
      fc.double({ min: 0.001, max: 1e6, noNaN: true }), fc.integer({ min: 1, max: 500 }), fc.integer({ min: 0, max: 5000 }),
      (need, packSize, minimumOrder) => {
        const q = roundOrderQuantity(need, { packSize, minimumOrder })
        expect(q % packSize).toBe(0)
        expect(q).toBeGreaterThanOrEqual(Math.max(minimumOrder, Math.ceil(need - 1e-9)))
        expect(q - Math.max(minimumOrder, Math.ceil(need - 1e-9))).toBeLessThan(packSize)
      }))
  })
})
