// z for a service level: the standard normal quantile (shared/inventory/reorder.ts, zForServiceLevel).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { errorFunction, probit } from 'simple-statistics'
import { zForServiceLevel } from '../../shared/inventory/reorder.js'

// source: NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.1 (cumulative distribution function of the
// standard normal distribution), quantiles to 4 places — from memory; the handbook's critical-value list shows
// 1.282, 1.645, 1.960, 2.326, 3.090 (3 places) and agrees with these to its precision.
const table: Array<[number, number]> = [
  [0.9, 1.2816],
  [0.95, 1.6449],
  [0.975, 1.96],
  [0.98, 2.0537],
  [0.99, 2.3263],
  [0.999, 3.0902],
]

describe('zForServiceLevel', () => {
  it.each(table)('p = %f gives the table value %f to 4 places', (p, z) => {
    expect(Math.abs(zForServiceLevel(p) - z)).toBeLessThanOrEqual(0.00005)
  })

  it.each(table)('p = %f agrees with simple-statistics probit within its approximation error', (p) => {
    // source: simple-statistics probit (Winitzki's closed-form inverse error function, ≈ 0.35 % worst relative
    // error in these tails — measured here at p = 0.999: 3.0801 vs 3.0902), so compared at 0.5 %
    expect(Math.abs(zForServiceLevel(p) - probit(p)) / probit(p)).toBeLessThan(0.005)
  })

  it('inverts simple-statistics’ Φ (property)', () => {
    // source: simple-statistics errorFunction (Numerical Recipes erfc, error < 1.2e-7): Φ(z) = (1 + erf(z/√2)) / 2
    fc.assert(fc.property(fc.double({ min: 0.5, max: 0.9999, noNaN: true }), (p) => {
      const z = zForServiceLevel(p)
      expect(Math.abs((1 + errorFunction(z / Math.SQRT2)) / 2 - p)).toBeLessThan(5e-7)
    }))
  })

  it('matches the rounded z values textbooks print', () => {
    // source: Heizer, Render & Munson and Stevenson, Operations Management, normal-table z values used in their
    // reorder-point examples (from memory): 90 % → 1.28, 95 % → 1.65, 97 % → 1.88, 98 % → 2.055
    expect(zForServiceLevel(0.9).toFixed(2)).toBe('1.28')
    expect(Math.abs(zForServiceLevel(0.95) - 1.65)).toBeLessThan(0.006) // tables round 1.6449 up to 1.65
    expect(zForServiceLevel(0.97).toFixed(2)).toBe('1.88')
    expect(Math.abs(zForServiceLevel(0.98) - 2.055)).toBeLessThan(0.0015)
  })

  it('is 0 at 50 % and rejects impossible levels', () => {
    expect(Math.abs(zForServiceLevel(0.5))).toBeLessThan(1e-12)
    for (const bad of [0, 1, -0.1, 1.5, Number.NaN]) expect(() => zForServiceLevel(bad)).toThrow(RangeError)
  })
})
