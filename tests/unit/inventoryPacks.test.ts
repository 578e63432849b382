// Pack conversions (shared/inventory/packs.ts).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { fromPacks, palletHoldsWholeCases, parsePackQuantity, roundUpToPack, toPacks } from '../../shared/inventory/packs.js'

// Pack sizes here are demo values (cases of 8 blocks, pallets of 32 cases), not a maker's data.
const blocks = { case: 8, pallet: 256 }

describe('toPacks', () => {
  it('breaks a quantity into pallets, cases and each', () => {
    // hand-worked: 284 = 1 × 256 + 3 × 8 + 4
    expect(toPacks(284, blocks)).toEqual({ pallets: 1, cases: 3, each: 4 })
    expect(toPacks(255, blocks)).toEqual({ pallets: 0, cases: 31, each: 7 })
    expect(toPacks(0, blocks)).toEqual({ pallets: 0, cases: 0, each: 0 })
    expect(toPacks(17, {})).toEqual({ pallets: 0, cases: 0, each: 17 })
    expect(toPacks(25, { case: 12 })).toEqual({ pallets: 0, cases: 2, each: 1 })
    expect(toPacks(25, { case: 1, pallet: 10 })).toEqual({ pallets: 2, cases: 0, each: 5 })
  })

  it('rejects fractions, negatives and bad pack sizes', () => {
    expect(() => toPacks(1.5, blocks)).toThrow(RangeError)
    expect(() => toPacks(-1, blocks)).toThrow(RangeError)
    expect(() => toPacks(10, { case: 0 })).toThrow(RangeError)
    expect(() => toPacks(10, { case: 2.5 })).toThrow(RangeError)
  })

  it('round-trips and keeps each below a case (property)', () => {
    const packsArb = fc.record({ case: fc.integer({ min: 2, max: 50 }), palletCases: fc.integer({ min: 2, max: 60 }) })
    fc.assert(fc.property(fc.integer({ min: 0, max: 10_000_000 }), packsArb, (qty, p) => {
      const packs = { case: p.case, pallet: p.case * p.palletCases }
      const b = toPacks(qty, packs)
      expect(fromPacks(b, packs)).toBe(qty)
      expect(b.each).toBeLessThan(p.case)
      expect(b.cases).toBeLessThan(p.palletCases)
    }))
  })
})

describe('roundUpToPack', () => {
  it('rounds up to whole packs', () => {
    expect(roundUpToPack(0, 8)).toBe(0)
    expect(roundUpToPack(1, 8)).toBe(8)
    expect(roundUpToPack(8, 8)).toBe(8)
    expect(roundUpToPack(9, 8)).toBe(16)
    expect(roundUpToPack(9, 1)).toBe(9)
  })

  it('is the smallest multiple ≥ qty (property)', () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: 1e9 }), fc.integer({ min: 1, max: 5000 }), (q, p) => {
      const r = roundUpToPack(q, p)
      expect(r % p).toBe(0)
      expect(r).toBeGreaterThanOrEqual(q)
      expect(r - q).toBeLessThan(p)
    }))
  })
})

describe('pack checks', () => {
  it('knows when a pallet holds whole cases', () => {
    expect(palletHoldsWholeCases(blocks)).toBe(true)
    expect(palletHoldsWholeCases({ case: 6, pallet: 100 })).toBe(false)
    expect(palletHoldsWholeCases({ pallet: 100 })).toBe(true)
    expect(() => fromPacks({ pallets: 1, cases: 0, each: 0 }, { case: 8 })).toThrow(RangeError)
  })
})

describe('parsePackQuantity (a stock sheet\'s quantity cell)', () => {
  it('reads plain units and packs, in English and Spanish', () => {
    // hand-worked with the demo sizes above: 3 cases = 3 × 8 = 24; 1 pallet 2 cases 5 = 256 + 16 + 5 = 277
    expect(parsePackQuantity('240', blocks)).toEqual({ ok: true, qty: 240 })
    expect(parsePackQuantity('3 cases', blocks)).toEqual({ ok: true, qty: 24 })
    expect(parsePackQuantity(' 1 pallet 2 Cases 5 ', blocks)).toEqual({ ok: true, qty: 277 })
    expect(parsePackQuantity('1 palé + 2 cajas', blocks)).toEqual({ ok: true, qty: 272 })
    expect(parsePackQuantity('0', blocks)).toEqual({ ok: true, qty: 0 })
    // And agrees with fromPacks for any breakdown.
    fc.assert(fc.property(fc.nat(50), fc.nat(50), fc.nat(500), (p, c, e) =>
      parsePackQuantity(`${p} pallets ${c} cases ${e}`, blocks).ok && (parsePackQuantity(`${p} pallets ${c} cases ${e}`, blocks) as { qty: number }).qty === fromPacks({ pallets: p, cases: c, each: e }, blocks)))
  })

  it('refuses fractions, negatives, unknown words and packs the item has no size for', () => {
    // common practice: stock is counted in whole stock units
    expect(parsePackQuantity('2.5', blocks)).toMatchObject({ ok: false, problem: 'whole_number' })
    expect(parsePackQuantity('1,5', blocks)).toMatchObject({ ok: false, problem: 'whole_number' })
    expect(parsePackQuantity('-4', blocks)).toMatchObject({ ok: false, problem: 'not_negative' })
    expect(parsePackQuantity('3 crates', blocks)).toEqual({ ok: false, problem: 'unknown_pack', word: 'crates' })
    expect(parsePackQuantity('3 cases', { pallet: 100 })).toMatchObject({ ok: false, problem: 'no_case_size' })
    expect(parsePackQuantity('1 pallet', { case: 12 })).toMatchObject({ ok: false, problem: 'no_pallet_size' })
    expect(parsePackQuantity('a dozen', blocks)).toMatchObject({ ok: false, problem: 'invalid_format' })
    expect(parsePackQuantity('', blocks)).toMatchObject({ ok: false, problem: 'invalid_format' })
  })
})
