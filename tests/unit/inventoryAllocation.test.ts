// Allocating a requested quantity to bins and lots (shared/inventory/allocation.ts).
// No outside source fixes these rules; they are our documented rules (lot matching for tint is common practice
// for glass block), checked by hand-worked cases and by brute force over every subset of lots.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { allocateStock, type StockRow } from '../../shared/inventory/allocation.js'

const row = (binCode: string, lotCode: string, receivedAt: string, available: number, onHand = available): StockRow =>
  ({ binCode, binId: `bin:${binCode}`, lotId: `lot:${lotCode}`, lotCode, receivedAt, available, onHand })

// Demo stock (invented): three production runs of one block.
const stock: StockRow[] = [
  row('A-01-1', 'L1', '2025-01-05', 30),
  row('A-02-1', 'L1', '2025-01-05', 10),
  row('B-01-1', 'L2', '2025-02-01', 100),
  row('C-01-1', 'L3', '2025-03-01', 60, 80),
]
const short = (lines: { binCode: string; lotCode: string | null; qty: number }[]) => lines.map((l) => `${l.lotCode} ${l.binCode} ${l.qty}`)

describe('allocateStock: hand-worked', () => {
  it('uses the oldest lot that covers the whole quantity, smallest bin first', () => {
    const r = allocateStock(35, stock, { matchLot: true })
    expect(short(r.lines)).toEqual(['L1 A-02-1 10', 'L1 A-01-1 25'])
    expect(r).toMatchObject({ allocated: 35, shortage: 0, lotsUsed: 1 })
  })

  it('skips older lots that cannot cover it alone', () => {
    expect(short(allocateStock(90, stock, { matchLot: true }).lines)).toEqual(['L2 B-01-1 90'])
  })

  it('uses the fewest lots, preferring older ones, when no lot covers it', () => {
    // hand-worked: lots 40 / 100 / 60; two lots are needed (100 + 60 ≥ 150); L1 + any other ≤ 140, so L2 + L3
    const r = allocateStock(150, stock, { matchLot: true })
    expect(short(r.lines)).toEqual(['L2 B-01-1 100', 'L3 C-01-1 50'])
    expect(r.lotsUsed).toBe(2)
  })

  it('goes strictly FIFO for items without lot matching', () => {
    const r = allocateStock(150, stock, { matchLot: false })
    expect(short(r.lines)).toEqual(['L1 A-02-1 10', 'L1 A-01-1 30', 'L2 B-01-1 100', 'L3 C-01-1 10'])
    expect(r.lotsUsed).toBe(3)
  })

  it('reports a shortage and never takes reserved stock', () => {
    const r = allocateStock(250, stock, { matchLot: true })
    expect(r).toMatchObject({ allocated: 200, shortage: 50, lotsUsed: 3 })
    expect(r.lines.find((l) => l.binCode === 'C-01-1')?.qty).toBe(60) // 80 on hand, 20 reserved
    expect(r.explanation.join(' ')).toContain('short by 50')
  })

  it('breaks an age tie by the lot whose bins it empties most', () => {
    const tie = [
      row('D-01-1', 'LA', '2025-04-01', 20), row('D-02-1', 'LA', '2025-04-01', 30, 40),
      row('E-01-1', 'LB', '2025-04-01', 25), row('E-02-1', 'LB', '2025-04-01', 25),
    ]
    // LA empties 1 bin (D-02-1 keeps 10 reserved), LB empties 2
    expect(short(allocateStock(50, tie, { matchLot: true }).lines)).toEqual(['LB E-01-1 25', 'LB E-02-1 25'])
  })

  it('handles zero, empty stock, Date timestamps and bad input', () => {
    expect(allocateStock(0, stock, { matchLot: true })).toMatchObject({ lines: [], allocated: 0, shortage: 0, lotsUsed: 0 })
    expect(allocateStock(5, [], { matchLot: true })).toMatchObject({ allocated: 0, shortage: 5 })
    const dated = [{ ...stock[2], receivedAt: new Date('2024-12-01T00:00:00Z') }, stock[0]]
    expect(allocateStock(20, dated, { matchLot: false }).lines[0].lotCode).toBe('L2')
    expect(() => allocateStock(1.5, stock, { matchLot: true })).toThrow(RangeError)
    expect(() => allocateStock(1, [{ ...stock[0], receivedAt: 'soon' }], { matchLot: true })).toThrow(RangeError)
  })
})

// Random stock: up to 7 lots with distinct ages, up to 3 bins each, some rows partly reserved or empty.
const stockArb = fc.array(
  fc.record({ lot: fc.integer({ min: 0, max: 6 }), available: fc.integer({ min: -2, max: 60 }), reserved: fc.integer({ min: 0, max: 10 }) }),
  { maxLength: 18 },
).map((rs) => rs.map((r, i): StockRow => ({
  binCode: `A-${String(i + 1).padStart(2, '0')}-1`, binId: i, lotId: r.lot, lotCode: `L${r.lot}`,
  receivedAt: `2025-01-${String(10 + r.lot).padStart(2, '0')}`, available: r.available, onHand: Math.max(0, r.available) + r.reserved,
})))

const lotTotals = (rows: StockRow[]) => {
  const totals = new Map<number, number>()
  for (const r of rows) totals.set(r.lotId as number, (totals.get(r.lotId as number) ?? 0) + Math.max(0, r.available))
  return [...totals].filter(([, t]) => t > 0)
}

/** Brute force: smallest number of lots whose totals reach qty. */
const fewestLots = (totals: number[], qty: number) => {
  let best = Infinity
  for (let mask = 1; mask < 1 << totals.length; mask++) {
    let sum = 0
    let count = 0
    totals.forEach((t, i) => { if (mask & (1 << i)) { sum += t; count++ } })
    if (sum >= qty) best = Math.min(best, count)
  }
  return best
}

describe('allocateStock: properties', () => {
  const cases = fc.tuple(stockArb, fc.integer({ min: 0, max: 300 }), fc.boolean())

  it('never over-allocates a row, and allocated + shortage = requested', () => {
    fc.assert(fc.property(cases, ([rows, qty, matchLot]) => {
      const r = allocateStock(qty, rows, { matchLot })
      const byRow = new Map<number, number>()
      for (const l of r.lines) {
        expect(l.qty).toBeGreaterThan(0)
        byRow.set(l.binId as number, (byRow.get(l.binId as number) ?? 0) + l.qty)
      }
      for (const [binId, qtyTaken] of byRow) expect(qtyTaken).toBeLessThanOrEqual(rows[binId].available)
      expect(r.allocated + r.shortage).toBe(qty)
      const available = rows.reduce((a, x) => a + Math.max(0, x.available), 0)
      expect(r.allocated).toBe(Math.min(qty, available))
    }))
  })

  it('uses one lot whenever one lot can cover it, and the oldest such lot', () => {
    fc.assert(fc.property(cases, ([rows, qty]) => {
      const r = allocateStock(qty, rows, { matchLot: true })
      const covering = lotTotals(rows).filter(([, t]) => t >= qty).map(([lot]) => lot)
      if (qty === 0 || covering.length === 0) return
      expect(r.lotsUsed).toBe(1)
      expect(r.lines[0].lotId).toBe(Math.min(...covering)) // lot number = age order in this generator
    }))
  })

  it('otherwise uses the fewest lots possible', () => {
    fc.assert(fc.property(cases, ([rows, qty]) => {
      const totals = lotTotals(rows).map(([, t]) => t)
      const r = allocateStock(qty, rows, { matchLot: true })
      if (qty === 0 || totals.reduce((a, b) => a + b, 0) < qty) return
      expect(r.lotsUsed).toBe(fewestLots(totals, qty))
    }))
  })

  it('without lot matching, never touches a lot while an older one has stock left', () => {
    fc.assert(fc.property(cases, ([rows, qty]) => {
      const r = allocateStock(qty, rows, { matchLot: false })
      const taken = new Map<number, number>()
      for (const l of r.lines) taken.set(l.lotId as number, (taken.get(l.lotId as number) ?? 0) + l.qty)
      const used = [...taken.keys()]
      for (const [lot, total] of lotTotals(rows)) {
        if (used.some((u) => u > lot)) expect(taken.get(lot)).toBe(total)
      }
    }))
  })
})
