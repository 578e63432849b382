// Feature: shop-built sections — each wall cut into panels of 10–15 blocks that two people can carry,
// stepped on curved walls so neighbours interlock (shared/takeoff/sections.ts).
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { chunkSizes, planSections, rangeFeasible, type SectionPlan } from '../../shared/takeoff/sections.js'
import { poundsToKg } from '../../shared/units.js'

// 8x8 glass block about 3 kg (demo value; check the maker's sheet)
const KG = 3

function covered(plan: SectionPlan, columns: number, courses: number): boolean {
  const seen = new Set<string>()
  for (const s of plan.sections) {
    for (const c of s.cells) {
      const key = `${c.course},${c.column}`
      if (seen.has(key) || c.course < 0 || c.course >= courses || c.column < 0 || c.column >= columns) return false
      seen.add(key)
    }
  }
  return seen.size === columns * courses
}

function connected(cells: { course: number; column: number }[]): boolean {
  const key = (c: { course: number; column: number }) => `${c.course},${c.column}`
  const all = new Set(cells.map(key))
  const seen = new Set([key(cells[0])])
  const stack = [cells[0]]
  while (stack.length) {
    const c = stack.pop() as { course: number; column: number }
    for (const [dc, dk] of [[1, 0], [-1, 0], [0, 1], [0, -1]]) {
      const n = { course: c.course + dc, column: c.column + dk }
      if (all.has(key(n)) && !seen.has(key(n))) {
        seen.add(key(n))
        stack.push(n)
      }
    }
  }
  return seen.size === cells.length
}

/** Column boundaries where a seam runs on straight through a band boundary. */
function alignedSeams(plan: SectionPlan, columns: number): number {
  const owner = new Map<string, number>()
  plan.sections.forEach((s) => s.cells.forEach((c) => owner.set(`${c.course},${c.column}`, s.index)))
  const seams = (row: number) =>
    new Set(Array.from({ length: columns - 1 }, (_, i) => i + 1).filter((x) => owner.get(`${row},${x}`) !== owner.get(`${row},${x - 1}`)))
  return plan.bands.slice(1).reduce((sum, b) => {
    const below = seams(b.startCourse - 1)
    return sum + [...seams(b.startCourse)].filter((x) => below.has(x)).length
  }, 0)
}

describe('arithmetic of section sizes', () => {
  it('knows which totals split into 10–15 block sections', () => {
    // hand-worked: k sections hold 10k..15k blocks: k=1 → 10–15, k=2 → 20–30, k=3 → 30–45;
    // so 16–19 cannot be split, 20 and up always can
    expect([10, 15, 20, 30, 31, 45, 46].every((t) => rangeFeasible(t, 10, 15))).toBe(true)
    expect([9, 16, 17, 18, 19].some((t) => rangeFeasible(t, 10, 15))).toBe(false)
    // hand-worked: 27 → 2 sections (27/2 = 13.5 nearest 12): 14 + 13
    expect(chunkSizes(27, 10, 15, 12)).toEqual([14, 13])
    // 36 → 3 × 12
    expect(chunkSizes(36, 10, 15, 12)).toEqual([12, 12, 12])
  })
})

describe('worked example: 9 × 10 blocks, straight', () => {
  const plan = planSections({ columns: 9, courses: 10, curved: false, blockWeightKg: KG })

  it('covers every block once with sections of 10–15 blocks, none too heavy', () => {
    expect(covered(plan, 9, 10)).toBe(true)
    expect(plan.withinRange).toBe(true)
    expect(plan.sections.every((s) => s.blocks >= 10 && s.blocks <= 15)).toBe(true)
    expect(plan.bands.reduce((sum, b) => sum + b.courses, 0)).toBe(10)
    // source: 50 lb per person, common practice; 2 × 50 lb × 0.45359237 kg/lb (NIST SP 811) = 45.359 kg
    expect(plan.liftLimitKg).toBeCloseTo(45.359, 3)
    // hand-worked: 15 blocks × 3 kg + 1 kg = 46 kg would be heavy, 14 → 43 kg is not; the planner avoids 15s
    expect(plan.sections.some((s) => s.overweight)).toBe(false)
  })

  it('lighter blocks on a straight wall give plain rectangles', () => {
    const light = planSections({ columns: 9, courses: 10, curved: false, blockWeightKg: 2.5 })
    expect(light.withinRange).toBe(true)
    expect(light.sections.every((s) => s.rectangular)).toBe(true)
  })

  it('weighs each section and flags more than a two-person lift', () => {
    // 5 kg blocks: even 10 blocks weigh 10 × 5 + 1 = 51 kg > 45.36 kg, so every section is flagged
    const heavy = planSections({ columns: 9, courses: 10, curved: false, blockWeightKg: 5 })
    for (const s of heavy.sections) {
      // blocks × 5 kg + 1 kg allowance for spacers and sealant (assumed default)
      expect(s.weightKg).toBeCloseTo(s.blocks * 5 + 1, 9)
      expect(s.overweight).toBe(true)
    }
    expect(heavy.notes.map((n) => n.message).join(' ')).toContain('more than a 2-person lift')
  })
})

describe('limits and options', () => {
  it('a wall under 10 blocks is one section', () => {
    const plan = planSections({ columns: 3, courses: 2, curved: false, blockWeightKg: KG })
    expect(plan.sections).toHaveLength(1)
    expect(plan.sections[0].blocks).toBe(6)
    expect(plan.notes[0]).toMatchObject({ variant: 'one', message: expect.stringContaining('fewer than one') })
  })

  it('16–19 blocks: never over the largest section, and says why', () => {
    const plan = planSections({ columns: 4, courses: 4, curved: false, blockWeightKg: KG })
    expect(plan.arithmeticallyPossible).toBe(false)
    expect(plan.sections.every((s) => s.blocks <= 15)).toBe(true)
    expect(covered(plan, 4, 4)).toBe(true)
    expect(plan.notes.map((n) => n.message).join(' ')).toContain('cannot be split')
  })

  it('follows a configured range and lift', () => {
    const plan = planSections(
      { columns: 8, courses: 6, curved: false, blockWeightKg: KG },
      { minBlocks: 6, maxBlocks: 8, liftPerPersonKg: poundsToKg(25), people: 2 },
    )
    expect(plan.sections.every((s) => s.blocks >= 6 && s.blocks <= 8)).toBe(true)
    // 2 × 25 lb = 22.68 kg; 8 blocks × 3 + 1 = 25 kg is heavy
    expect(plan.sections.filter((s) => s.blocks === 8).every((s) => s.overweight)).toBe(true)
  })
})

describe('curved walls', () => {
  it.each([
    [18, 10],
    [9, 10],
    [10, 6],
  ])('%i × %i: stepped sections, no seam running on through a band', (columns, courses) => {
    const plan = planSections({ columns, courses, curved: true, blockWeightKg: KG })
    expect(covered(plan, columns, courses)).toBe(true)
    expect(plan.withinRange).toBe(true)
    expect(plan.sections.some((s) => !s.rectangular)).toBe(true)
    expect(alignedSeams(plan, columns)).toBe(0)
  })

  it('the same wall built straight lets seams line up (the curve is what changes it)', () => {
    const straight = planSections({ columns: 18, courses: 10, curved: false, blockWeightKg: KG })
    expect(alignedSeams(straight, 18)).toBeGreaterThan(0)
  })
})

describe('properties', () => {
  const wall = fc.record({
    columns: fc.integer({ min: 1, max: 40 }),
    courses: fc.integer({ min: 1, max: 30 }),
    curved: fc.boolean(),
  })

  it('sections hold 10–15 blocks whenever the wall has ≥ 10 blocks and such a split exists', () => {
    fc.assert(
      fc.property(wall, ({ columns, courses, curved }) => {
        const total = columns * courses
        fc.pre(total >= 10 && rangeFeasible(total, 10, 15))
        const plan = planSections({ columns, courses, curved, blockWeightKg: KG })
        expect(plan.sections.every((s) => s.blocks >= 10 && s.blocks <= 15)).toBe(true)
      }),
      { numRuns: 150 },
    )
  })

  it('every block sits in exactly one connected section, never over the maximum', () => {
    fc.assert(
      fc.property(wall, ({ columns, courses, curved }) => {
        const plan = planSections({ columns, courses, curved, blockWeightKg: KG })
        expect(covered(plan, columns, courses)).toBe(true)
        for (const s of plan.sections) {
          expect(connected(s.cells)).toBe(true)
          expect(Number.isInteger(s.blocks) && s.blocks > 0 && s.blocks <= 15).toBe(true)
        }
      }),
      { numRuns: 150 },
    )
  })
})
