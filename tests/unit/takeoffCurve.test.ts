// Feature: curved glass block runs — angle per block, outside joint, smallest radius, blocks per arc and
// refusals (shared/takeoff/curve.ts, planView.ts). Checked against an independent corner-placement method
// written here, and against the small-angle forms of arc length = radius × angle (plane geometry, any textbook).
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { curvedSegmentSchema, type BlockSpec, type CurvedSegment } from '../../shared/schemas/takeoff.js'
import {
  anglePerBlockRad,
  approxMinInsideRadiusMm,
  minInsideRadiusMm,
  outsideJointMm,
  planCurvedSegment,
  radiusForAnglePerBlock,
  type CurveLayout,
} from '../../shared/takeoff/curve.js'
import { resolveJoint } from '../../shared/takeoff/geometry.js'
import { buildPlanView } from '../../shared/takeoff/planView.js'

const IN = 25.4 // NIST SP 811: 1 in = 25.4 mm exactly
// 8x8 nominal: face 7 3/4 in (nominal − 1/4 in, common practice), depth 3 7/8 in (IRC 2021 R607.3 standard unit)
const W = 7.75 * IN
const T = 3.875 * IN
const JI = IN / 8 // 1/8 in inside joint (IRC 2021 R607.10 smallest radial joint, from memory high)
const JO_MAX = (5 * IN) / 8 // 5/8 in (IRC 2021 R607.10 widest radial joint, from memory high)
const block8: BlockSpec = { nominal: '8x8', faceWidthMm: W, faceHeightMm: W, depthMm: T, thicknessClass: 'standard', weightKg: 3 }
const mortar = resolveJoint({ kind: 'mortar', jointMm: IN / 4 })

// ---- Independent method: place two neighbouring blocks with vectors and a rotation matrix, then
// measure the joints as distances between adjacent corners. Angles come from the law of cosines
// (chord c on a circle of radius R subtends acos(1 − c²/2R²)), not from the asin formulas under test.
type V = [number, number]
const sub = (a: V, b: V): V => [a[0] - b[0], a[1] - b[1]]
const addV = (a: V, b: V): V => [a[0] + b[0], a[1] + b[1]]
const mul = (a: V, k: number): V => [a[0] * k, a[1] * k]
const len = (a: V) => Math.hypot(a[0], a[1])
const rotate = (p: V, a: number): V => [p[0] * Math.cos(a) - p[1] * Math.sin(a), p[0] * Math.sin(a) + p[1] * Math.cos(a)]
const subtended = (chord: number, R: number) => Math.acos(1 - (chord * chord) / (2 * R * R))

function placedBlock(R: number, w: number, t: number, turn: number) {
  const alpha = subtended(w, R)
  const in0: V = [R, 0]
  const in1: V = [R * Math.cos(alpha), R * Math.sin(alpha)]
  const chord = sub(in1, in0)
  let normal: V = mul([chord[1], -chord[0]], 1 / len(chord))
  if (normal[0] * (in0[0] + in1[0]) + normal[1] * (in0[1] + in1[1]) < 0) normal = mul(normal, -1)
  const corners = { in0, in1, out0: addV(in0, mul(normal, t)), out1: addV(in1, mul(normal, t)) }
  return {
    in0: rotate(corners.in0, turn), in1: rotate(corners.in1, turn),
    out0: rotate(corners.out0, turn), out1: rotate(corners.out1, turn),
  }
}

function measuredJoints(R: number, w: number, t: number, ji: number) {
  const turn = subtended(w, R) + subtended(ji, R)
  const a = placedBlock(R, w, t, 0)
  const b = placedBlock(R, w, t, turn)
  return { turn, inside: len(sub(b.in0, a.in1)), outside: len(sub(b.out0, a.out1)) }
}

/** Smallest R whose measured outside joint stays within the limit, by bisection. */
function bisectMinRadius(w: number, t: number, ji: number, joMax: number): number {
  let lo = w / 2 + 1e-9
  let hi = 1e7
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2
    if (measuredJoints(mid, w, t, ji).outside > joMax) lo = mid
    else hi = mid
  }
  return hi
}

// Typed but not schema-parsed: the math is checked beyond the form's 1 km cap on radii.
function planned(seg: CurvedSegment, joint = mortar): CurveLayout {
  const result = planCurvedSegment(seg, block8, joint, 'in')
  if (!result.ok) throw new Error(result.reason)
  return result
}

describe('exact corner geometry', () => {
  it('angle and outside joint agree with corners placed by rotation', () => {
    for (const R of [1550.2, 1600, 2500, 10_000]) {
      const m = measuredJoints(R, W, T, JI)
      const theta = anglePerBlockRad(W, JI, R)
      expect(theta).toBeCloseTo(m.turn, 12)
      expect(m.inside).toBeCloseTo(JI, 9)
      expect(outsideJointMm(JI, T, theta)).toBeCloseTo(m.outside, 9)
    }
  })

  it('the smallest radius matches a bisection on measured corners', () => {
    // independent: bisection on the rotated-corner method above, to 1e-6 mm
    const exact = minInsideRadiusMm(W, T, JI, JO_MAX)
    expect(exact).toBeCloseTo(bisectMinRadius(W, T, JI, JO_MAX), 6)
    // hand-worked: sin(θ/2) = (5/8 − 1/8) / (2 × 3 7/8) = 0.5 / 7.75 = 0.064516; θ = 0.129122 rad;
    // d = (0.125 + 7.75 cos(θ/2)) / (2 sin(θ/2)) = 60.906 in; R = √(d² + 3.875²) = 61.029 in = 1550.14 mm
    expect(exact).toBeCloseTo(1550.14, 1)
    expect(radiusForAnglePerBlock(W, JI, anglePerBlockRad(W, JI, 2000))).toBeCloseTo(2000, 6)
  })

  it('stays close to the small-angle forms (arc length = radius × angle)', () => {
    // source: arc length s = R·θ (plane geometry): a module (face + inside joint) spans θ ≈ (w + ji)/R at the inside
    // and the outside joint opens by t·θ, so jo − ji = t·(w + ji)/R and R_min ≈ (w + ji)·t / (jo − ji)
    // hand-worked: (7.875 × 3.875) / (5/8 − 1/8) = 30.515625 / 0.5 = 61.03125 in = 1550.19 mm
    const approx = approxMinInsideRadiusMm(W, T, JI, JO_MAX)
    expect(approx).toBeCloseTo(61.03125 * IN, 6)
    expect(Math.abs(minInsideRadiusMm(W, T, JI, JO_MAX) - approx) / approx).toBeLessThan(0.001)
    // source: the same s = R·θ across the block's depth: angle per block ≈ (outside joint − inside joint) / depth (radians)
    const R = 1600
    const theta = anglePerBlockRad(W, JI, R)
    const jo = outsideJointMm(JI, T, theta)
    expect(Math.abs((jo - JI) / T - theta) / theta).toBeLessThan(0.001)
  })

  it('agrees across block sizes and joints (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(146.05, 190, 196.85, 240, 298.45),
        fc.constantFrom(79.375, 80, 98.425),
        fc.constantFrom(3.175, 6.35),
        fc.double({ min: 1.05, max: 50, noNaN: true }),
        (w, t, ji, k) => {
          const R = minInsideRadiusMm(w, t, ji, 15.875) * k
          const m = measuredJoints(R, w, t, ji)
          // acos near 1 loses digits at large R, so the measured side is good to about 1e-7 mm
          expect(anglePerBlockRad(w, ji, R)).toBeCloseTo(m.turn, 9)
          expect(outsideJointMm(ji, t, anglePerBlockRad(w, ji, R))).toBeCloseTo(m.outside, 6)
        },
      ),
    )
  })
})

describe('blocks on an arc', () => {
  it('rounds a quarter circle up to whole blocks and says how', () => {
    // hand-worked at R = 1600 mm: w/2R = 196.85/3200 = 0.0615156, asin = 0.0615545;
    // ji/2R = 0.00099219, asin ≈ 0.00099219; θ = 2 × (0.0615545 + 0.0009922) = 0.125093 rad = 7.1673°
    // 90 / 7.1673 = 12.557 → 13 blocks (round up so the arc closes); 13 × 7.1673 = 93.175°
    // outside joint = 3.175 + 2 × 98.425 × sin(0.0625467) = 3.175 + 12.304 = 15.479 mm (under 5/8 in = 15.875)
    const c = planned({ kind: 'curved', insideRadiusMm: 1600, arcAngleDeg: 90, direction: 'left' })
    expect(c.anglePerBlockDeg).toBeCloseTo(7.1673, 3)
    expect(c.blocks).toBe(13)
    expect(c.builtAngleDeg).toBeCloseTo(93.175, 2)
    expect(c.outsideJointMm).toBeCloseTo(15.479, 2)
    expect(c.explanation.join(' ')).toContain('needs 13 whole blocks, which build 93.1')
    // Until the clerk chooses, the radius is kept and the extra arc built.
    expect(c.closing).toBe('overshoot')
    expect(c.closingChosen).toBe(false)
    const [radius, joints, overshoot] = c.closings ?? []
    // the radius that closes 90° exactly with 13 blocks turns each block 90/13°, joints as before
    expect(radius.closing).toBe('radius')
    expect((anglePerBlockRad(W, JI, radius.insideRadiusMm) * 13 * 180) / Math.PI).toBeCloseTo(90, 9)
    expect(radius.insideRadiusMm).toBeGreaterThan(1600)
    expect(radius.insideJointMm).toBe(JI)
    // one block fewer at R = 1600: each turns 90/12 = 7.5° = 0.1308997 rad; the block itself turns
    // α = 2·asin(196.85/3200) = 0.123109 rad, so the inside joint opens to 2 × 1600 × sin((0.1308997 − 0.123109)/2)
    // = 3200 × 0.0038953 = 12.465 mm and the outside to 12.465 + 2 × 98.425 × sin(0.0654498) = 12.465 + 12.875
    // = 25.34 mm: past the 5/8 in (15.875 mm) limit (IRC 2021 R607.10, from memory)
    expect(joints).toMatchObject({ closing: 'joints', blocks: 12, withinLimits: false })
    expect(joints.insideJointMm).toBeCloseTo(12.465, 2)
    expect(joints.outsideJointMm).toBeCloseTo(25.34, 1)
    expect(overshoot).toMatchObject({ closing: 'overshoot', blocks: 13 })
    expect(overshoot.builtAngleDeg).toBeCloseTo(93.175, 2)
  })

  it('closes the arc the way the clerk chose', () => {
    const exact = planned({ kind: 'curved', insideRadiusMm: 1600, arcAngleDeg: 90, direction: 'left', closing: 'radius' })
    expect(exact).toMatchObject({ closing: 'radius', closingChosen: true, blocks: 13, enteredRadiusMm: 1600 })
    expect(exact.builtAngleDeg).toBeCloseTo(90, 9)
    expect(exact.insideRadiusMm).toBeCloseTo(exact.closings?.[0].insideRadiusMm as number, 9)
    // a wider radius turns each block less: the outside joint narrows
    expect(exact.outsideJointMm).toBeLessThan(15.479)
    const kept = planned({ kind: 'curved', insideRadiusMm: 1600, arcAngleDeg: 90, direction: 'left', closing: 'overshoot' })
    expect(kept).toMatchObject({ closingChosen: true, insideRadiusMm: 1600, blocks: 13 })
    // one block fewer opens the joints past the limit: refused, saying why
    const fewer = planCurvedSegment(curvedSegmentSchema.parse({ kind: 'curved', insideRadiusMm: 1600, arcAngleDeg: 90, direction: 'left', closing: 'joints' }), block8, mortar, 'mm')
    expect(fewer.ok).toBe(false)
    if (!fewer.ok) expect(fewer.key).toBe('closing_joints_over_limit')
    // at a large radius the joints stay within limits: 90° at 3000 mm
    const wide = planned({ kind: 'curved', insideRadiusMm: 3000, arcAngleDeg: 90, direction: 'left', closing: 'joints' })
    expect(wide.builtAngleDeg).toBeCloseTo(90, 9)
    expect(wide.outsideJointMm).toBeLessThanOrEqual(JO_MAX + 1e-9)
    expect(wide.blocks).toBe((wide.closings?.[2].blocks as number) - 1)
  })

  it('takes the arc as an inside length or as a block count', () => {
    // inside length of a quarter circle at R = 1600: π/2 × 1600 = 2513.27 mm → the same 13 blocks
    expect(planned({ kind: 'curved', insideRadiusMm: 1600, arcLengthMm: (Math.PI / 2) * 1600, direction: 'right' }).blocks).toBe(13)
    const byCount = planned({ kind: 'curved', insideRadiusMm: 1600, blocks: 10, direction: 'left' })
    expect(byCount.blocks).toBe(10)
    expect(byCount.builtAngleDeg).toBeCloseTo(71.673, 2)
    expect(byCount.closings).toBeUndefined()
  })
})

describe('refusing radii that cannot be built', () => {
  it('names the smallest radius that works, in the user’s unit, rounded up', () => {
    const segment = curvedSegmentSchema.parse({ kind: 'curved', insideRadiusMm: 40 * IN, arcAngleDeg: 90, direction: 'left' })
    const inches = planCurvedSegment(segment, block8, mortar, 'in')
    expect(inches.ok).toBe(false)
    // hand-worked above: 61.029 in → rounded up to the sixteenth = 61 1/16 in
    if (!inches.ok) {
      expect(inches.reason).toContain('The smallest inside radius that works is 61 1/16″')
      expect(inches.reason).toContain('40″')
      expect(inches.smallestRadiusMm).toBeCloseTo(1550.14, 1)
    }
    const metric = planCurvedSegment(segment, block8, mortar, 'mm')
    // 1550.14 mm → rounded up to the tenth = 1550.2 mm
    if (!metric.ok) expect(metric.reason).toContain('1550.2 mm')
    expect(metric.ok).toBe(false)
  })

  it('a spacer system uses its own outside-joint limit', () => {
    const tight = resolveJoint({ kind: 'spacer', jointMm: 3.175, maxOutsideJointMm: 9.525 })
    // hand-worked small-angle: (7.875 × 3.875) / (3/8 − 1/8) = 122.06 in; exact is within 0.1 %
    const limit = minInsideRadiusMm(W, T, 3.175, 9.525)
    expect(Math.abs(limit / IN - 122.0625) / 122.0625).toBeLessThan(0.001)
    const at100 = planCurvedSegment(curvedSegmentSchema.parse({ kind: 'curved', insideRadiusMm: 100 * IN, arcAngleDeg: 45, direction: 'left' }), block8, tight, 'in')
    expect(at100.ok).toBe(false)
  })

  it('accepts the smallest radius itself', () => {
    const R = minInsideRadiusMm(W, T, JI, JO_MAX)
    const c = planned({ kind: 'curved', insideRadiusMm: R, arcAngleDeg: 30, direction: 'left' })
    expect(c.outsideJointMm).toBeCloseTo(JO_MAX, 9)
  })
})

describe('as the radius grows a curve becomes straight', () => {
  const module = W + JI

  it('outside joint and run per block fall toward the straight values (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1600, max: 1e6, noNaN: true }), fc.double({ min: 1.01, max: 100, noNaN: true }), (R1, k) => {
        const R2 = R1 * k
        const t1 = anglePerBlockRad(W, JI, R1)
        const t2 = anglePerBlockRad(W, JI, R2)
        expect(outsideJointMm(JI, T, t2)).toBeLessThanOrEqual(outsideJointMm(JI, T, t1) + 1e-12)
        // run along the inside circle per block, R·θ, is never under the straight module and shrinks to it
        expect(R2 * t2).toBeGreaterThanOrEqual(module - 1e-9)
        expect(R2 * t2).toBeLessThanOrEqual(R1 * t1 + 1e-9)
        // small-angle bound: jo − ji ≈ t·(w + ji)/R
        expect(outsideJointMm(JI, T, t2) - JI).toBeLessThanOrEqual((T * module) / R2 * 1.01)
      }),
    )
  })

  it('blocks for an inside length reach the straight count (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 500, max: 10_000, noNaN: true }), (L) => {
        const ratio = L / module
        fc.pre(ratio - Math.floor(ratio) > 0.01 && ratio - Math.floor(ratio) < 0.99)
        const c = planned({ kind: 'curved', insideRadiusMm: 1e7, arcLengthMm: L, direction: 'left' })
        expect(c.blocks).toBe(Math.ceil(ratio))
      }),
    )
  })

  it('plan footprints close in on the straight layout (property)', () => {
    const deviation = (R: number, n: number) => {
      const c = planned({ kind: 'curved', insideRadiusMm: R, blocks: n, direction: 'left' }, resolveJoint({ kind: 'spacer', jointMm: JI }))
      const curved = buildPlanView([{ kind: 'curved', index: 0, blocks: n, curve: c }], block8, JI, 'mm').footprints
      const straight = buildPlanView([{ kind: 'straight', index: 0, blocks: n }], block8, JI, 'mm').footprints
      let worst = 0
      curved.forEach((f, i) => f.corners.forEach((p, j) => {
        const q = straight[i].corners[j]
        worst = Math.max(worst, Math.hypot(p.x - q.x, p.y - q.y))
      }))
      return worst
    }
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 12 }), fc.double({ min: 2000, max: 1e5, noNaN: true }), (n, R) => {
        expect(deviation(R * 10, n)).toBeLessThanOrEqual(deviation(R, n) + 1e-9)
      }),
      { numRuns: 50 },
    )
    // sagitta-style bound at R = 10 km for 12 blocks (≈ 2.4 m of wall): (2400)² / (2 × 1e7) ≈ 0.3 mm
    expect(deviation(1e7, 12)).toBeLessThan(1)
  })
})
