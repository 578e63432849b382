// Pick lines in walking order (shared/inventory/walkOrder.ts).
// The serpentine (S-shape) route is the common-practice picker route: every aisle walked end to end, alternating
// direction; the expected orders below are worked out by hand from that rule.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { parseBinCode, walkOrder, type WalkConfig } from '../../shared/inventory/walkOrder.js'

const codes = (lines: { binCode: string }[]) => lines.map((l) => l.binCode)
const lines = (...binCodes: string[]) => binCodes.map((binCode, i) => ({ binCode, line: i + 1 }))

describe('parseBinCode', () => {
  it('reads aisle-bay-level', () => {
    expect(parseBinCode('A-03-2')).toEqual({ aisle: 'A', bay: 3, level: '2' })
    expect(parseBinCode(' b-12-1 ')).toEqual({ aisle: 'B', bay: 12, level: '1' })
    expect(parseBinCode('DOCK')).toBeNull()
    expect(parseBinCode('A-3')).toBeNull()
  })

  it('takes a configured pattern, with or without named groups', () => {
    expect(parseBinCode('R2.B07.L3', { binPattern: String.raw`^R(?<aisle>\d+)\.B(?<bay>\d+)\.L(?<level>\d+)$` }))
      .toEqual({ aisle: '2', bay: 7, level: '3' })
    expect(parseBinCode('C0402', { binPattern: /^([A-Z])(\d\d)(\d\d)$/g })).toEqual({ aisle: 'C', bay: 4, level: '02' })
  })
})

describe('walkOrder', () => {
  const pick = lines('B-01-1', 'A-05-1', 'C-02-1', 'A-01-2', 'B-07-1', 'A-01-1', 'C-09-3', 'B-03-1')

  it('snakes: 1st and 3rd aisles ascending, 2nd descending', () => {
    const config: WalkConfig = { aisleOrder: ['A', 'B', 'C'], direction: 'serpentine' }
    expect(codes(walkOrder(pick, config))).toEqual(
      ['A-01-1', 'A-01-2', 'A-05-1', 'B-07-1', 'B-03-1', 'B-01-1', 'C-02-1', 'C-09-3'])
  })

  it('follows the configured aisle order, not the alphabet', () => {
    const config: WalkConfig = { aisleOrder: ['C', 'A', 'B'], direction: 'serpentine' }
    expect(codes(walkOrder(pick, config))).toEqual(
      ['C-02-1', 'C-09-3', 'A-05-1', 'A-01-1', 'A-01-2', 'B-01-1', 'B-03-1', 'B-07-1'])
  })

  it('walks every aisle ascending one way', () => {
    expect(codes(walkOrder(pick, { aisleOrder: ['A', 'B', 'C'], direction: 'oneWay' }))).toEqual(
      ['A-01-1', 'A-01-2', 'A-05-1', 'B-01-1', 'B-03-1', 'B-07-1', 'C-02-1', 'C-09-3'])
  })

  it('puts unreadable bins and aisles outside the walk last, in their original order', () => {
    const mixed = lines('STAGING', 'B-02-1', 'Z-01-1', 'A-04-1', 'dock 2')
    expect(codes(walkOrder(mixed, { aisleOrder: ['A', 'B'], direction: 'serpentine' }))).toEqual(
      ['A-04-1', 'B-02-1', 'STAGING', 'Z-01-1', 'dock 2'])
  })

  it('uses natural aisle order when none is configured, and descending levels on request', () => {
    const r = walkOrder(lines('A10-01-1', 'A9-01-1', 'A9-01-3'), {
      direction: 'oneWay', levelOrder: 'descending', binPattern: /^(?<aisle>A\d+)-(?<bay>\d+)-(?<level>\d+)$/,
    })
    expect(codes(r)).toEqual(['A9-01-3', 'A9-01-1', 'A10-01-1'])
  })

  it('is stable for lines in the same bin and leaves the input alone', () => {
    const same = lines('A-02-1', 'A-01-1', 'A-02-1', 'A-02-1')
    const before = JSON.stringify(same)
    expect(walkOrder(same, { direction: 'oneWay' }).map((l) => l.line)).toEqual([2, 1, 3, 4])
    expect(JSON.stringify(same)).toBe(before)
  })

  it('is a permutation whose known part never walks an aisle backwards (property)', () => {
    const binArb = fc.oneof(
      fc.record({ aisle: fc.constantFrom('A', 'B', 'C', 'D'), bay: fc.integer({ min: 1, max: 30 }), level: fc.integer({ min: 1, max: 4 }) })
        .map((b) => `${b.aisle}-${String(b.bay).padStart(2, '0')}-${b.level}`),
      fc.constantFrom('FLOOR', 'X9'),
    )
    fc.assert(fc.property(fc.array(binArb, { maxLength: 40 }), (bins) => {
      const config: WalkConfig = { aisleOrder: ['A', 'B', 'C', 'D'], direction: 'serpentine' }
      const out = walkOrder(lines(...bins), config)
      expect(out.map((l) => l.line).sort((a, b) => a - b)).toEqual(bins.map((_, i) => i + 1))
      const parsed = out.map((l) => parseBinCode(l.binCode)).filter((p) => p !== null)
      for (let i = 1; i < parsed.length; i++) {
        const [a, b] = [parsed[i - 1], parsed[i]]
        const ai = 'ABCD'.indexOf(a.aisle)
        const bi = 'ABCD'.indexOf(b.aisle)
        expect(bi).toBeGreaterThanOrEqual(ai)
        if (ai === bi) expect(ai % 2 === 0 ? b.bay >= a.bay : b.bay <= a.bay).toBe(true)
      }
      const firstUnknown = out.findIndex((l) => parseBinCode(l.binCode) === null)
      if (firstUnknown >= 0) expect(out.slice(firstUnknown).every((l) => parseBinCode(l.binCode) === null)).toBe(true)
    }))
  })
})
