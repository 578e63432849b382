// Feature: material rules — spacers, sealant, grout and mortar, fixings, strips — evaluated from a wall's
// measures, and rounding to whole units and packs (shared/takeoff/materials.ts, wallMeasures.ts,
// fasteners.ts, packRounding.ts).
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { materialRuleSchema, type MaterialRule, type Wall } from '../../shared/schemas/takeoff.js'
import { ANCHOR_SPACING_MM, jambScrews, panelAnchors, reinforcedBedJoints, spacedJoints } from '../../shared/takeoff/fasteners.js'
import { defaultMaterialRules, evaluateRule, STANDARD_CARTRIDGE_ML, wasteFor } from '../../shared/takeoff/materials.js'
import { roundUpToStock } from '../../shared/takeoff/packRounding.js'
import { planSections } from '../../shared/takeoff/sections.js'
import { isWallRefusal, layoutWall } from '../../shared/takeoff/wallLayout.js'
import { measureWall, type MeasuredWall, type WallMeasures } from '../../shared/takeoff/wallMeasures.js'
import { flOzToIn3 } from '../../shared/units.js'
import { IN, wallMaker } from '../support/takeoffFixtures.js'

const wall = wallMaker('Hall screen')

function measured(w: Wall) {
  const geometry = layoutWall(w, 'in')
  if (isWallRefusal(geometry)) throw new Error(geometry.reason)
  const plan = planSections({ columns: geometry.blocksAcross, courses: geometry.courses, curved: geometry.hasCurve, blockWeightKg: w.block.weightKg })
  const anchors = panelAnchors(geometry, w.freeEnds)
  const screws = geometry.joint.kind === 'spacer' ? jambScrews(geometry, plan, w.freeEnds) : []
  const reinforcedJoints = reinforcedBedJoints(geometry)
  return { geometry, plan, anchors, screws, ...measureWall({ geometry, plan, anchors, screws, reinforcedJoints, blockDepthMm: w.block.depthMm }) }
}

function synthetic(over: Partial<WallMeasures>): MeasuredWall {
  const zero = Object.fromEntries(Object.keys(measured(wall()).measures).map((k) => [k, 0])) as WallMeasures
  return { measures: { ...zero, ...over }, derivation: {} }
}

const rule = (id: string): MaterialRule => defaultMaterialRules.find((r) => r.id === id) as MaterialRule

describe('measures of the worked example (9 × 10 blocks of 8x8, 1/8 in spacer joints)', () => {
  const m = measured(wall())

  it('counts joint intersections', () => {
    // hand-worked: 8 head joints × 9 inner bed joints = 72 interior crossings;
    // edges: 8 head joints meet the curb and 8 the top (16) + 9 bed joints meet each jamb (18) = 34
    expect(m.measures.interiorIntersectionsStraight).toBe(72)
    expect(m.measures.edgeIntersectionsStraight).toBe(34)
    expect(m.measures.interiorIntersectionsCurved).toBe(0)
    // perimeter: 2 × (70.75 + 78.625) in = 298.75 in = 24.896 ft
    expect(m.measures.perimeterFt).toBeCloseTo(298.75 / 12, 9)
  })

  it('measures curb, jambs and head', () => {
    // panel 70.75 in long along the curb; jambs 2 × 78.625 in; head 70.75 in
    expect(m.measures.bottomRunMm).toBeCloseTo(70.75 * IN, 9)
    expect(m.measures.jambLengthMm).toBeCloseTo(2 * 78.625 * IN, 9)
    expect(m.measures.headLengthMm).toBeCloseTo(70.75 * IN, 9)
  })

  it('joint volume for grout: width × depth × length', () => {
    // hand-worked: head joints 8 × 3.175 mm × 1997.075 mm = 25.4 × 1997.075 = 50,725.71 mm²;
    // bed joints 9 × 3.175 × 1797.05 = 28.575 × 1797.05 = 51,350.70 mm²;
    // face area 102,076.41 mm² × 98.425 mm depth = 10,046,870 mm³ = 10,046.87 mL
    expect(m.measures.groutVolumeMl).toBeCloseTo(10_046.87, 1)
    expect(m.measures.mortarVolumeMl).toBe(0)
  })

  it('two screws at each section edge on a framed jamb', () => {
    // every band has one section against each jamb, so contacts = 2 × bands; 2 screws each (common practice)
    expect(m.measures.jambScrews).toBe(2 * 2 * m.plan.bands.length)
    expect(m.screws.every((s) => s.xMm === 0 || Math.abs(s.xMm - 70.75 * IN) < 1e-9)).toBe(true)
  })
})

describe('spacer and base rules', () => {
  it('one spacer per crossing, rates editable', () => {
    const need = evaluateRule(rule('spacers'), measured(wall()), undefined)
    // hand-worked: 72 × 1 + 34 × 1 = 106 (perimeter rate 0 by default)
    expect(need.needed).toBe(106)
    expect(need.formula).toContain('= 106')
    const perFoot = materialRuleSchema.parse({ ...rule('spacers'), terms: [{ measure: 'perimeterFt', rate: 2 }] })
    // hand-worked: 2 per ft × 24.896 ft = 49.79
    expect(evaluateRule(perFoot, measured(wall()), undefined).needed).toBeCloseTo((2 * 298.75) / 12, 9)
  })

  it('arc spacers on curved joints only', () => {
    const curved = measured(wall({ sizing: 'count', heightMm: undefined, courses: 4, segments: [{ kind: 'straight', blocks: 2 }, { kind: 'curved', insideRadiusMm: 2000, blocks: 5, direction: 'left' }] }))
    // 7 columns: joints 1|2 straight; 2|3 (into the curve) and the 4 inside it are wedges → 5 curved, 1 straight
    // interior: 5 × 3 = 15 curved, 1 × 3 = 3 straight; edges curved 2 × 5 = 10
    expect(curved.measures.interiorIntersectionsCurved).toBe(15)
    expect(curved.measures.interiorIntersectionsStraight).toBe(3)
    expect(evaluateRule(rule('arc-spacers'), curved, undefined).needed).toBe(25)
  })

  it('base strip along the curb by piece length', () => {
    const need = evaluateRule(rule('spacer-base'), measured(wall()), { sku: 'BASE-48', name: 'Base strip 48 in', packSize: 1, sellByPack: false, pieceLengthMm: 48 * IN })
    // hand-worked: 70.75 in ÷ 48 in = 1.474 pieces
    expect(need.needed).toBeCloseTo(70.75 / 48, 9)
    const missing = evaluateRule(rule('spacer-base'), measured(wall()), { sku: 'BASE', name: 'Base', packSize: 1, sellByPack: false })
    expect(missing.issue).toContain('piece length')
  })
})

describe('sealant', () => {
  it('tubes from bead cross-section × length ÷ cartridge', () => {
    // hand-worked in mm: 1/4 in bead = 6.35 mm; area π × 6.35² / 4 = 31.669 mm²; 10 ft = 3048 mm;
    // volume 31.669 × 3048 = 96,528 mm³ = 96.53 mL; ÷ 298.69 mL (10.1 US fl oz, NIST SP 811) = 0.3232 tubes
    // cross-check in inches: π × 0.25² / 4 = 0.049087 in² × 120 in = 5.8905 in³ ÷ 18.227 in³ = 0.3232
    const need = evaluateRule(rule('sealant-spacer'), synthetic({ bottomRunMm: 3048 }), undefined)
    expect(need.needed).toBeCloseTo(0.3232, 4)
    expect(need.needed).toBeCloseTo(((Math.PI * 0.25 ** 2) / 4) * 120 / flOzToIn3(10.1), 9)
    expect(STANDARD_CARTRIDGE_ML).toBeCloseTo(298.69, 2)
    expect(need.formula).toContain('π × 6.35² ÷ 4 = 31.67 mm²')
  })

  it('uses the item’s own cartridge size', () => {
    // 28 fl oz cartridge = 828.06 mL: 96.53 / 828.06 = 0.1166 tubes
    const need = evaluateRule(rule('sealant-spacer'), synthetic({ bottomRunMm: 3048 }), { sku: 'SIL-28', name: 'Silicone 28 oz', packSize: 1, sellByPack: false, cartridgeMl: 828.06 })
    expect(need.needed).toBeCloseTo(96.528 / 828.06, 4)
  })

  it('mortar panels: both faces of the jamb and head joints', () => {
    const need = evaluateRule(rule('sealant-mortar'), synthetic({ jambLengthMm: 2000, headLengthMm: 1000 }), undefined)
    // hand-worked: 3000 mm × 2 beads × 31.669 mm² = 190,014 mm³ = 190.01 mL ÷ 298.69 = 0.6362
    expect(need.needed).toBeCloseTo((3000 * 2 * ((Math.PI * 6.35 ** 2) / 4)) / 1000 / 298.6926, 4)
  })
})

describe('grout and mortar', () => {
  it('bags by declared yield, and flags an item without one', () => {
    const m = measured(wall())
    const need = evaluateRule(rule('grout'), m, { sku: 'GR-10', name: 'Grout 10 lb', packSize: 1, sellByPack: false, groutYieldMl: 3000 })
    // hand-worked: 10,046.87 mL ÷ 3000 mL per bag = 3.349 bags
    expect(need.needed).toBeCloseTo(3.349, 3)
    expect(evaluateRule(rule('grout'), m, { sku: 'GR', name: 'Grout', packSize: 1, sellByPack: false }).issue).toContain('groutYieldMl')
  })
})

describe('mortar panel fixings', () => {
  // 6 across × 10 courses of 8x8 on 1/4 in mortar joints: module 8 in, panel 47.75 × 79.75 in
  const mortarWall = wall({ sizing: 'count', heightMm: undefined, courses: 10, joint: { kind: 'mortar', jointMm: IN / 4 }, segments: [{ kind: 'straight', blocks: 6 }] })
  const m = measured(mortarWall)

  it('anchors at no more than 16 in on centre at both jambs and the head', () => {
    // source: IRC 2021 R607.5.2.1 (from memory, high): ≤ 16 in o.c.
    // hand-worked: bed joint centres at 8k − 1/8 in: 7.875, 15.875, …, 71.875. Farthest within 16 in of the
    // last pick: 15.875, 31.875, 47.875, 63.875; then 79.75 − 63.875 = 15.875 ≤ 16 → 4 per jamb.
    // head joints at 7.875 … 39.875 along 47.75 in: 15.875, 31.875 (47.75 − 31.875 = 15.875) → 2. Total 10.
    expect(m.anchors.filter((a) => a.side === 'start').map((a) => a.yMm / IN)).toEqual([15.875, 31.875, 47.875, 63.875].map((v) => expect.closeTo(v, 9)))
    expect(m.anchors.filter((a) => a.side === 'head')).toHaveLength(2)
    expect(m.measures.panelAnchors).toBe(10)
    expect(m.measures.jambScrews).toBe(0)
  })

  it('joint reinforcement in bed joints at 16 in, lapped 6 in', () => {
    // source: IRC 2021 R607.9 (from memory, high). Same 4 bed joints × 47.75 in = 191 in;
    // 10 ft pieces less 6 in lap = 114 in each → 191 / 114 = 1.675 pieces
    expect(m.measures.reinforcedJointLengthMm).toBeCloseTo(4 * 47.75 * IN, 9)
    const need = evaluateRule(rule('reinforcement'), m, { sku: 'JR-10', name: 'Ladder wire 10 ft', packSize: 1, sellByPack: false, pieceLengthMm: 120 * IN })
    expect(need.needed).toBeCloseTo(191 / 114, 9)
  })

  it('mortar volume includes the sill bed, not the expansion joints', () => {
    // hand-worked: head joints 5 × 6.35 × 2025.65 = 64,314.4 mm²; bed 9 × 6.35 × 1212.85 = 69,314.4 mm²;
    // sill 6.35 × 1212.85 = 7,701.6 mm²; total 141,330.4 mm² × 98.425 mm = 13,910.4 mL
    expect(m.measures.mortarVolumeMl).toBeCloseTo(13_910.4, 0)
    expect(m.measures.groutVolumeMl).toBe(0)
  })

  it('spacing never exceeds the limit (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 40 }), fc.double({ min: 100, max: 600, noNaN: true }), fc.double({ min: 150, max: 500, noNaN: true }), (count, module, spacing) => {
        const centres = Array.from({ length: count }, (_, k) => (k + 1) * module)
        const length = (count + 1) * module
        const chosen = spacedJoints(centres, length, spacing)
        const stops = [0, ...chosen, length]
        if (module <= spacing) stops.slice(1).forEach((s, i) => expect(s - stops[i]).toBeLessThanOrEqual(spacing + 1e-9))
        expect(chosen.length).toBeGreaterThanOrEqual(1)
      }),
    )
    expect(ANCHOR_SPACING_MM).toBeCloseTo(406.4, 9)
  })
})

describe('rounding to stock', () => {
  it('adds waste in exact decimals, then rounds up', () => {
    // 100 × 1.10 is 110.00000000000001 in binary floats; decimal arithmetic keeps it 110
    expect(roundUpToStock(100, 10, 1, false, 'each').quantity).toBe(110)
    // hand-worked: 106 spacers × 1.10 = 116.6 → 117; packs of 100 → 2 packs = 200
    const packs = roundUpToStock(106, 10, 100, true, 'each')
    expect(packs).toMatchObject({ units: 117, packs: 2, quantity: 200 })
    expect(packs.text).toContain('2 packs = 200 each')
    // 0.3232 tubes × 1.10 = 0.3555 → 1 tube
    expect(roundUpToStock(0.3232, 10, 12, false, 'tube').quantity).toBe(1)
  })

  it('never orders less than needed (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1e5, noNaN: true }),
        fc.integer({ min: 0, max: 30 }),
        fc.integer({ min: 1, max: 500 }),
        fc.boolean(),
        (needed, waste, packSize, sellByPack) => {
          const r = roundUpToStock(needed, waste, packSize, sellByPack, 'each')
          expect(Number.isInteger(r.quantity) && r.quantity >= 0).toBe(true)
          expect(r.units).toBeGreaterThanOrEqual(needed * (1 + waste / 100) - 1e-6)
          expect(r.quantity).toBeGreaterThanOrEqual(r.units)
          if (sellByPack && packSize > 1) {
            expect(r.quantity % packSize).toBe(0)
            expect(r.quantity - r.units).toBeLessThan(packSize)
          }
        },
      ),
    )
  })
})

describe('rules are data', () => {
  it('every default rule passes the rule schema an admin edits with', () => {
    for (const r of defaultMaterialRules) expect(materialRuleSchema.safeParse(r).success).toBe(true)
    expect(new Set(defaultMaterialRules.map((r) => r.id)).size).toBe(defaultMaterialRules.length)
  })

  it('waste by family, overridable', () => {
    // defaults chosen as common practice: blocks 5 %, spacers 10 %
    expect(wasteFor('block')).toBe(5)
    expect(wasteFor('spacer')).toBe(10)
    expect(wasteFor('block', { block: 2 })).toBe(2)
  })
})
