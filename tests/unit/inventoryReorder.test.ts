// Safety stock, reorder point, order-up-to level and line status (shared/inventory/reorder.ts, reorderStatus.ts).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import {
  DEFAULT_REORDER_POLICY, inventoryPosition, reorderPointRaw, reorderSuggestion, safetyStock, zForServiceLevel,
  type ReorderInput, type ReorderPolicy,
} from '../../shared/inventory/reorder.js'

const rop = (p: number, d: number, sd: number, L: number, sL = 0) =>
  reorderPointRaw(d, L, safetyStock({ z: zForServiceLevel(p), meanDaily: d, sdDaily: sd, leadTimeDays: L, leadTimeSdDays: sL }))

// Textbooks round z to two or three places; ours is exact, so each check allows |Δz| × σ plus the book's rounding.
describe('reorder point: textbook examples (from memory)', () => {
  it('Heizer, Render & Munson: lead-time demand 350 ± 10 kits, 95 % → ROP 366.5 ≈ 367', () => {
    // source: Heizer, Render & Munson, Operations Management, inventory chapter (Memphis Regional Hospital) — from memory.
    // hand-worked: SS = 1.65 × 10 = 16.5; ROP = 350 + 16.5 = 366.5. One period of demand: d̄ = 350, σd = 10, L = 1.
    const r = rop(0.95, 350, 10, 1)
    expect(Math.abs(r - 366.5)).toBeLessThan(0.006 * 10 + 0.01)
    expect(Math.ceil(r)).toBe(367)
  })

  it('Heizer, Render & Munson: variable demand 15 ± 5 a day, L = 2 days, 90 % → ROP ≈ 39.05', () => {
    // source: same chapter (Circuit Town iPods) — from memory.
    // hand-worked: σdLT = 5 × √2 = 7.07; ROP = 15 × 2 + 1.28 × 7.07 = 30 + 9.05 = 39.05.
    const r = rop(0.9, 15, 5, 2)
    expect(Math.abs(r - 39.05)).toBeLessThan(0.0016 * 7.07 + 0.01)
  })

  it('Heizer, Render & Munson: constant demand 10 a day, lead time 6 ± 3 days, 98 % → ROP ≈ 121.65', () => {
    // source: same chapter (Circuit Town cameras) — from memory.
    // hand-worked: σ = d × σL = 10 × 3 = 30; ROP = 10 × 6 + 2.055 × 30 = 60 + 61.65 = 121.65.
    const r = rop(0.98, 10, 0, 6, 3)
    expect(Math.abs(r - 121.65)).toBeLessThan(0.0014 * 30 + 0.01)
    expect(Math.ceil(r)).toBe(122)
  })

  it('Heizer, Render & Munson: demand 150 ± 16 a day, lead time 5 ± 1 days, 95 % → ROP ≈ 1,004', () => {
    // source: same chapter (Circuit Town 9-volt batteries) — from memory.
    // hand-worked: σ = √(5 × 16² + 150² × 1²) = √(1,280 + 22,500) = √23,780 = 154.2; ROP = 750 + 1.65 × 154.2 = 1,004.4.
    const r = rop(0.95, 150, 16, 5, 1)
    expect(Math.abs(r - 1004.4)).toBeLessThan(0.006 * 154.2 + 0.1)
    expect(Math.ceil(r)).toBe(1004)
  })

  it('Stevenson: 50 ± 3 jars a week, L = 2 weeks, 10 % stock-out risk → ROP ≈ 105.43', () => {
    // source: Stevenson, Operations Management, inventory chapter (restaurant sauce example) — from memory.
    // hand-worked: ROP = 50 × 2 + 1.28 × 3 × √2 = 100 + 5.43 = 105.43 (any time unit works if d̄, σd and L share it).
    const r = rop(0.9, 50, 3, 2)
    expect(Math.abs(r - 105.43)).toBeLessThan(0.0016 * 4.24 + 0.01)
  })

  it('Stevenson: lead-time demand 50 ± 5 tons of sand, 95 % → ROP ≈ 58.25', () => {
    // source: same chapter (construction supply house) — from memory. hand-worked: 50 + 1.65 × 5 = 58.25.
    expect(Math.abs(rop(0.95, 50, 5, 1) - 58.25)).toBeLessThan(0.006 * 5 + 0.01)
  })

  it('reduces to z·σd·√L when the lead time is fixed (property)', () => {
    // source: algebra of the combined formula with σL = 0 (textbook identity)
    fc.assert(fc.property(fc.double({ min: 0, max: 1000, noNaN: true }), fc.double({ min: 0, max: 100, noNaN: true }),
      fc.double({ min: 0, max: 120, noNaN: true }), (d, sd, L) => {
        const z = 1.6449
        expect(safetyStock({ z, meanDaily: d, sdDaily: sd, leadTimeDays: L, leadTimeSdDays: 0 }))
          .toBeCloseTo(z * sd * Math.sqrt(L), 8)
      }))
  })
})

// Demo scenario (invented): 8 in standard blocks, 4.2 a day ± 2.5, 12-day lead time, packs of 48.
const policy: ReorderPolicy = {
  ...DEFAULT_REORDER_POLICY,
  serviceLevel: 0.95, leadTimeDays: 12, leadTimeSdDays: 0, costPerOrder: '40.00', holdingRatePerYear: 0.25,
  soonDays: 7, overstockMarginDays: 30, deadStockDays: 180, method: 'eoq',
}
const line = (onHand: number, onOrder = 0, reserved = 0, over: Partial<ReorderInput> = {}): ReorderInput => ({
  demand: { meanDaily: 4.2, sdDaily: 2.5, daysSinceLastUse: 2 },
  stock: { onHand, onOrder, reserved }, unitCost: '3.20', policy, vendor: { packSize: 48, minimumOrder: 0 }, ...over,
})

describe('reorder suggestion: hand-worked scenario', () => {
  // hand-worked: z = 1.6448536; SS = 1.6448536 × 2.5 × √12 = 1.6448536 × 8.660254 = 14.2449 → ROP = 50.4 + 14.2449 = 64.64 → 65.
  // D = 4.2 × 365 = 1,533; H = 0.25 × 3.20 = 0.80; EOQ = √(2 × 1533 × 40 / 0.8) = √153,300 = 391.5 → 392 → 9 packs = 432.
  // order soon up to 65 + 4.2 × 7 = 94.4; overstocked above 65 + 432 + ⌈4.2 × 30⌉ = 497 + 126 = 623.
  it('shows the working with the numbers filled in', () => {
    const r = reorderSuggestion(line(50, 20, 10))
    const text = r.explanation.steps.join('\n')
    expect(text).toContain('position = on hand + on order − reserved = 50 + 20 − 10 = 60')
    expect(text).toContain('SS = z·σd·√L = 1.6449 × 2.50 × √12 = 14.24')
    expect(text).toContain('ROP = d̄·L + SS = 4.20 × 12 + 14.24 = 64.64 → 65')
    expect(text).toContain('EOQ = √(2DS/H) = √(2 × 1533 × 40.00 / 0.8000) = 391.54')
    expect(r.explanation.inputs.leadTimeDays).toBe(12)
  })

  it('orders now at or below the reorder point', () => {
    const r = reorderSuggestion(line(50, 20, 10))
    expect(r).toMatchObject({ status: 'orderNow', reorderPoint: 65, lotSize: 432, position: 60, suggestedOrder: 432 })
    expect(reorderSuggestion(line(65)).status).toBe('orderNow')
  })

  it('orders soon, is ok, or overstocked at the documented limits', () => {
    expect(reorderSuggestion(line(66)).status).toBe('orderSoon')
    expect(reorderSuggestion(line(94)).status).toBe('orderSoon')
    expect(reorderSuggestion(line(95)).status).toBe('ok')
    expect(reorderSuggestion(line(95)).suggestedOrder).toBe(0)
    expect(reorderSuggestion(line(623)).status).toBe('ok')
    expect(reorderSuggestion(line(600, 24)).status).toBe('overstocked')
  })

  it('flags dead stock before anything else, but not stock that is all reserved', () => {
    const idle = { demand: { meanDaily: 4.2, sdDaily: 2.5, daysSinceLastUse: 200 } }
    expect(reorderSuggestion(line(10, 0, 0, idle)).status).toBe('deadStock')
    expect(reorderSuggestion(line(10, 0, 10, idle)).status).toBe('orderNow')
    expect(reorderSuggestion(line(10, 0, 0, { demand: { meanDaily: 0, sdDaily: 0, daysSinceLastUse: null } })).status).toBe('deadStock')
  })

  it('orders for backorders even without demand, in whole packs', () => {
    const r = reorderSuggestion(line(0, 0, 5, { demand: { meanDaily: 0, sdDaily: 0, daysSinceLastUse: 3 } }))
    expect(r).toMatchObject({ status: 'orderNow', reorderPoint: 0, position: -5, suggestedOrder: 48 }) // need 6 → 1 pack
    // once the pack is on order the position is 43: within one pack of the ROP, so not overstocked by our own order
    expect(reorderSuggestion(line(0, 48, 5, { demand: { meanDaily: 0, sdDaily: 0, daysSinceLastUse: 3 } })).status).toBe('ok')
    expect(reorderSuggestion(line(0, 0, 0, { demand: { meanDaily: 0, sdDaily: 0, daysSinceLastUse: 3 } })).status).toBe('ok')
  })

  it('takes overrides, with their reasons in the working', () => {
    const withOverride = { ...policy, overrides: { reorderPoint: { value: 100, reason: 'held for the Marlow Street atrium job' } } }
    const r = reorderSuggestion(line(90, 0, 0, { policy: withOverride }))
    expect(r.reorderPoint).toBe(100)
    expect(r.status).toBe('orderNow')
    expect(r.explanation.steps.join('\n')).toContain('ROP = 100 (override: held for the Marlow Street atrium job)')
    expect(() => reorderSuggestion(line(90, 0, 0, { policy: { ...policy, overrides: { safetyStock: { value: 5, reason: ' ' } } } })))
      .toThrow(RangeError)
  })

  it('orders up to T under periodic review', () => {
    // hand-worked: R + L = 19; z·σd·√19 = 1.6448536 × 2.5 × 4.358899 = 17.924; T = 4.2 × 19 + 17.924 = 97.72 → 98.
    const periodic = { ...policy, method: 'orderUpTo' as const, reviewPeriodDays: 7 }
    const r = reorderSuggestion(line(60, 0, 0, { policy: periodic, vendor: undefined }))
    expect(r.orderUpToLevel).toBe(98)
    expect(r.suggestedOrder).toBe(38) // 98 − 60
    expect(reorderSuggestion(line(60, 0, 0, { policy: periodic })).suggestedOrder).toBe(48) // 38 → one pack of 48
    expect(() => reorderSuggestion(line(60, 0, 0, { policy: { ...periodic, reviewPeriodDays: 0 } }))).toThrow(RangeError)
  })

  it('shows the combined formula when the lead time varies', () => {
    // hand-worked (Heizer's battery numbers): √23,780 = 154.2076; × 1.6448536 = 253.65
    const r = reorderSuggestion(line(0, 0, 0, {
      demand: { meanDaily: 150, sdDaily: 16, daysSinceLastUse: 1 },
      policy: { ...policy, leadTimeDays: 5, leadTimeSdDays: 1 },
    }))
    expect(r.explanation.steps.join('\n')).toContain('SS = z·√(L·σd² + d̄²·σL²) = 1.6449 × √(5 × 16² + 150² × 1²) = 253.65')
    expect(r.reorderPoint).toBe(1004)
  })

  it('computes the inventory position', () => {
    expect(inventoryPosition({ onHand: 120, onOrder: 48, reserved: 30 })).toBe(138)
    // Quantities already committed to come (accepted, drafted) count like on order, so they are not
    // ordered twice: source: Silver, Pyke & Peterson, Inventory Management and Production Planning and
    // Scheduling, 3rd ed., ch. 7 (inventory position includes every outstanding order) (from memory)
    expect(inventoryPosition({ onHand: 120, onOrder: 48, reserved: 30, pending: 100 })).toBe(238)
  })
})

describe('reorder suggestion: properties', () => {
  const arb = fc.record({
    meanDaily: fc.double({ min: 0.05, max: 200, noNaN: true }),
    sdDaily: fc.double({ min: 0, max: 100, noNaN: true }),
    leadTimeDays: fc.integer({ min: 1, max: 60 }),
    leadTimeSdDays: fc.double({ min: 0, max: 10, noNaN: true }),
    onHand: fc.integer({ min: 0, max: 5000 }), onOrder: fc.integer({ min: 0, max: 2000 }), reserved: fc.integer({ min: 0, max: 3000 }),
    packSize: fc.integer({ min: 1, max: 200 }), minimumOrder: fc.integer({ min: 0, max: 1000 }),
    method: fc.constantFrom('eoq' as const, 'orderUpTo' as const),
    cents: fc.integer({ min: 1, max: 100000 }),
  })
  it('orders whole packs, lifts the position above the ROP, and never overstocks by its own suggestion', () => {
    let ordered = 0
    fc.assert(fc.property(arb, (a) => {
      const p: ReorderPolicy = { ...policy, method: a.method, leadTimeDays: a.leadTimeDays, leadTimeSdDays: a.leadTimeSdDays, overstockMarginDays: 0 }
      const input: ReorderInput = {
        demand: { meanDaily: a.meanDaily, sdDaily: a.sdDaily, daysSinceLastUse: 1 },
        stock: { onHand: a.onHand, onOrder: a.onOrder, reserved: a.reserved },
        unitCost: (a.cents / 100).toFixed(2), policy: p, vendor: { packSize: a.packSize, minimumOrder: a.minimumOrder },
      }
      const r = reorderSuggestion(input)
      expect(r.suggestedOrder % a.packSize).toBe(0)
      if (r.status !== 'orderNow') return
      ordered += 1
      expect(r.suggestedOrder).toBeGreaterThanOrEqual(a.minimumOrder)
      const after = reorderSuggestion({ ...input, stock: { ...input.stock, onOrder: a.onOrder + r.suggestedOrder } })
      expect(after.position).toBeGreaterThan(r.reorderPoint)
      expect(after.status).not.toBe('orderNow')
      expect(after.status).not.toBe('overstocked')
    }), { numRuns: 500 })
    expect(ordered).toBeGreaterThan(50) // the property must really exercise orders
  })
})
