// ABC classes by annual usage value (shared/inventory/abc.ts).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { annualUsageValue, classifyAbc, HEIZER_RENDER_CUTOFFS, paretoSeries, type AbcItemInput } from '../../shared/inventory/abc.js'

// source: Heizer, Render & Munson, Operations Management, inventory chapter, ABC example (Silicon Chips, Inc.) —
// from memory: item, annual volume, unit cost, class as printed.
const heizer: Array<[string, number, string, 'A' | 'B' | 'C']> = [
  ['#10286', 1000, '90.00', 'A'], ['#11526', 500, '154.00', 'A'],
  ['#12760', 1550, '17.00', 'B'], ['#10867', 350, '42.86', 'B'], ['#10500', 1000, '12.50', 'B'],
  ['#12572', 600, '14.17', 'C'], ['#14075', 2000, '0.60', 'C'], ['#01036', 100, '8.50', 'C'],
  ['#01307', 1200, '0.42', 'C'], ['#10572', 250, '0.60', 'C'],
]
const heizerItems: AbcItemInput[] = heizer.map(([id, qty, cost]) => ({ id, annualValue: annualUsageValue(qty, cost) }))

describe('ABC: Heizer & Render example', () => {
  it('computes the annual dollar volumes and total', () => {
    // hand-worked: 90,000 + 77,000 + 26,350 + 15,001 + 12,500 + 8,502 + 1,200 + 850 + 504 + 150 = 232,057
    expect(heizerItems.map((i) => i.annualValue)).toEqual(
      ['90000.00', '77000.00', '26350.00', '15001.00', '12500.00', '8502.00', '1200.00', '850.00', '504.00', '150.00'])
    expect(classifyAbc(heizerItems).total).toBe('232057.00')
  })

  it('matches the book’s classes once B reaches 96 %', () => {
    // hand-worked cumulative shares: 38.8 %, 72.0 %, 83.3 %, 89.8 %, 95.17 %, 98.8 %, …
    // The book puts #10500 (cumulative 95.17 %) in B and calls the classes ≈ 72 % / 23 % / 5 % of value: a judgment
    // call just past a 95 % line, so its classes come out with cut-offs A ≤ 80 %, B ≤ 96 %.
    const r = classifyAbc(heizerItems, { a: 0.8, b: 0.96 })
    expect(r.items.map((i) => [i.id, i.abcClass])).toEqual(heizer.map(([id, , , c]) => [id, c]))
    expect(r.summary.A.shareOfItems).toBeCloseTo(0.2, 12)
    expect(r.summary.A.shareOfValue).toBeCloseTo(167000 / 232057, 12) // 72 %
    expect(r.summary.B.shareOfValue).toBeCloseTo(53851 / 232057, 12) // 23 %
    expect(r.summary.C.count).toBe(5)
  })

  it('with the default 80 / 95 % cut-offs puts #10500 in C', () => {
    const r = classifyAbc(heizerItems, HEIZER_RENDER_CUTOFFS)
    expect(r.items.map((i) => i.abcClass).join('')).toBe('AABBCCCCCC')
    expect(r.items[4]).toMatchObject({ id: '#10500', abcClass: 'C' })
    expect(r.items[4].cumulativeShare).toBeCloseTo(220851 / 232057, 12)
  })
})

describe('ABC: hand-worked edge cases', () => {
  const items = (values: Record<string, string>) => Object.entries(values).map(([id, annualValue]) => ({ id, annualValue }))

  it('makes a dominant top item A', () => {
    // x alone holds 90 % (past the A line) yet is the clearest A; y reaches 95 % → B; z ties y → B
    const r = classifyAbc(items({ x: '900', y: '50', z: '50' }))
    expect(r.items.map((i) => i.abcClass)).toEqual(['A', 'B', 'B'])
  })

  it('keeps ties together and zero values in C', () => {
    // cumulative 75 % A; 85 % → B; tie at 95 % → B; 100 % → C
    expect(classifyAbc(items({ a: '75', b: '10', c: '10', d: '5' })).items.map((i) => i.abcClass)).toEqual(['A', 'B', 'B', 'C'])
    // b and c tie at 25: c takes b's class though its own cumulative share is 100 %
    expect(classifyAbc(items({ a: '50', b: '25', c: '25' })).items.map((i) => i.abcClass)).toEqual(['A', 'A', 'A'])
    expect(classifyAbc(items({ a: '100', b: '0', c: '0' })).items.map((i) => i.abcClass)).toEqual(['A', 'C', 'C'])
    const zero = classifyAbc(items({ a: '0', b: '0' }))
    expect(zero.items.map((i) => [i.abcClass, i.share])).toEqual([['C', 0], ['C', 0]])
    expect(classifyAbc([]).summary.A.count).toBe(0)
  })

  it('rejects negative values and bad cut-offs', () => {
    expect(() => classifyAbc(items({ a: '-1' }))).toThrow(RangeError)
    expect(() => classifyAbc(items({ a: '1' }), { a: 0.9, b: 0.8 })).toThrow(RangeError)
  })

  it('gives a Pareto series ending at 100 %', () => {
    const p = paretoSeries(classifyAbc(items({ b: '30', a: '50', c: '20' })))
    expect(p.labels).toEqual(['a', 'b', 'c'])
    expect(p.values).toEqual([50, 30, 20])
    expect(p.cumulativePercent).toEqual([50, 80, 100]) // 80 % is on the A line, inclusive
    expect(p.classes).toEqual(['A', 'A', 'C'])
  })
})

describe('ABC: properties', () => {
  const arb = fc.uniqueArray(fc.record({ id: fc.string({ minLength: 1, maxLength: 6 }), cents: fc.integer({ min: 0, max: 1e7 }) }),
    { selector: (r) => r.id, maxLength: 40 })
  it('never ranks a higher value in a lower class, and input order does not matter', () => {
    fc.assert(fc.property(arb, fc.nat(), (rows, seed) => {
      const inputs = rows.map((r) => ({ id: r.id, annualValue: (r.cents / 100).toFixed(2) }))
      const r = classifyAbc(inputs)
      const order = { A: 0, B: 1, C: 2 }
      for (let i = 1; i < r.items.length; i++) expect(order[r.items[i].abcClass]).toBeGreaterThanOrEqual(order[r.items[i - 1].abcClass])
      const shuffled = [...inputs].sort((a, b) => ((a.id.charCodeAt(0) * (seed + 1)) % 7) - ((b.id.charCodeAt(0) * (seed + 1)) % 7))
      const again = new Map(classifyAbc(shuffled).items.map((i) => [i.id, i.abcClass]))
      for (const i of r.items) expect(again.get(i.id)).toBe(i.abcClass)
      const counted = r.summary.A.count + r.summary.B.count + r.summary.C.count
      expect(counted).toBe(inputs.length)
    }))
  })
})
