// Feature: bills an installer would sign (shared/takeoff/): every exposed edge finished, fixings at most
// 16 in apart on every fixed edge, the made-to-order base matching the wall as built, grout and sealant
// from the joints, space left after whole blocks warned about, and takeoffs past the limits refused
// before anything is laid out. Hand-worked examples first, then properties over random walls.
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { computeCounterBill } from '../../shared/counter/counterBill.js'
import type { BlockOption, CounterCatalog } from '../../shared/schemas/counter.js'
import { takeoffSchema, wallSchema, type Takeoff, type Wall } from '../../shared/schemas/takeoff.js'
import { computeTakeoff, type WallResultOk } from '../../shared/takeoff/billOfMaterials.js'
import { estimateWallBlocks, TAKEOFF_LIMITS } from '../../shared/takeoff/bounds.js'
import { minInsideRadiusMm, workableRadiusMm } from '../../shared/takeoff/curve.js'
import { largestGap } from '../../shared/takeoff/fasteners.js'
import { resolveJoint } from '../../shared/takeoff/geometry.js'
import { takeoffIssues } from '../../shared/takeoff/issues.js'
import { DEFAULT_SITE_FIGURES } from '../../shared/takeoff/siteFigures.js'
import { block8, IN, wallMaker } from '../support/takeoffFixtures.js'

const wall = wallMaker('Whitlock shower')
// 6x6 nominal: face 5 3/4 in (nominal − 1/4 in, common practice), standard depth 3 7/8 in (IRC 2021 R607.3)
const block6 = { ...block8, nominal: '6x6', faceWidthMm: 5.75 * IN, faceHeightMm: 5.75 * IN, weightKg: 1.8 }

function computed(t: Takeoff) {
  return computeTakeoff(takeoffSchema.parse(t), {}, { unit: 'in' })
}
function firstWall(t: Takeoff): WallResultOk {
  const w = computed(t).walls[0]
  if (w.status !== 'ok') throw new Error(w.reason)
  return w
}
const takeoff = (walls: Wall[], extra: Partial<Takeoff> = {}): Takeoff => ({ walls, looseLines: [], ...extra })

/** The curved shower of the worked example: 3 straight blocks then a quarter circle, free end and free top. */
const shower = (over: Partial<Wall> = {}) =>
  wall({
    sizing: 'count',
    heightMm: undefined,
    courses: 13,
    block: block6,
    segments: [{ kind: 'straight', blocks: 3 }, { kind: 'curved', insideRadiusMm: 48 * IN, arcAngleDeg: 90, direction: 'left' }],
    freeEnds: { start: false, end: true, top: true },
    wetArea: true,
    ...over,
  })

describe('worked example: a curved shower with a free top and a free end', () => {
  // Hand-worked curve (corner geometry as in the curve tests): w = 5.75 in, ji = 1/8 in, R = 48 in:
  // θ = 2·asin(5.75/96) + 2·asin(0.125/96) = 0.119866 + 0.002604 = 0.122470 rad = 7.0170°; 90 / 7.0170 = 12.83
  // → 13 blocks; 3 straight + 13 curved = 16 across × 13 courses = 208 blocks.
  const w = firstWall(takeoff([shower()]))

  it('finishes every exposed edge: one unit per course at the free end, one per block along the free top', () => {
    // Exposed edges (common practice: every exposed edge takes a finished face): free end 13 courses,
    // free top 16 blocks = 29 edge modules. The top block of the end column shows two edges, so
    // 12 + 15 = 27 units finished on one edge and 1 finished on two: 27 + 2 × 1 = 29.
    expect(w.geometry.blocksAcross).toBe(16)
    expect(w.geometry.finished).toMatchObject({ endCourses: 13, topBlocks: 16, oneEdge: 27, twoEdges: 1, edgeModules: 29, uncovered: 0 })
    expect(w.measures.endBlocks).toBe(27)
    expect(w.measures.doubleEndBlocks).toBe(1)
    expect(w.measures.standardBlocks).toBe(208 - 27 - 1)
  })

  it('fixes the start jamb at most 16 in apart; the free end and free top take none', () => {
    // source: 16 in o.c., IRC 2021 R607.5.2.1 for anchors (from memory), the spacer maker's default (common practice).
    // Bed joints every 5 7/8 in (5.75 + 0.125), centres at 5.875k − 1/16: 5.8125, 11.6875, 17.5625 …
    // Farthest within 16 in each time: 11.6875, 23.4375, 35.1875, 46.9375, 58.6875, 70.4375; the panel is
    // 13 × 5.875 − 0.125 = 76.25 in high, 76.25 − 70.4375 = 5.8125 in to the top: 6 screws.
    const start = w.fixings.filter((f) => f.side === 'start')
    expect(start.map((f) => f.yMm / IN)).toEqual([11.6875, 23.4375, 35.1875, 46.9375, 58.6875, 70.4375].map((v) => expect.closeTo(v, 9)))
    expect(w.fixings.every((f) => f.side === 'start' && f.kind === 'screw')).toBe(true)
    expect(largestGap(start.map((f) => f.yMm), w.geometry.panelHeightMm) / IN).toBeLessThanOrEqual(16)
  })

  it('lists each sealant bead with its length: curb bed, section tops, seams, and both faces of the fixed jamb', () => {
    const r = computed(takeoff([shower()]))
    const sealant = r.lines.find((l) => l.role === 'sealant')!
    // wet area: the fixed start jamb, full panel height 76.25 in = 1936.75 mm, on 2 faces (common practice)
    expect(sealant.explanation.formula).toContain('fixed jambs 1936.8 mm + fixed head 0 mm = 1936.8 mm × 2 faces')
    expect(sealant.explanation.formula).toMatch(/curb bed [\d.]+ mm \+ section tops [\d.]+ mm \+ seams between sections [\d.]+ mm/)
    expect(sealant.explanation.rule).toContain('sealed in the shop')
  })
})

describe('corner units', () => {
  it('a 90° corner takes corner units and a 45° corner angle units, one per course', () => {
    const corners = firstWall(takeoff([wall({
      sizing: 'count', heightMm: undefined, courses: 6,
      segments: [{ kind: 'straight', blocks: 3 }, { kind: 'corner', direction: 'left' }, { kind: 'straight', blocks: 2 }, { kind: 'corner', direction: 'right', angleDeg: 45 }, { kind: 'straight', blocks: 2 }],
    })]))
    // 3 + 1 + 2 + 1 + 2 = 9 columns × 6 courses = 54; 6 corner units, 6 angle units, 42 plain
    expect(corners.measures).toMatchObject({ cornerBlocks: 6, angleBlocks: 6, standardBlocks: 42, endBlocks: 0 })
  })
})

describe('curves that close the arc asked for, and the base that follows them', () => {
  it('the base following the wall takes its built arc and layout radius, and its name carries the size', () => {
    const r = computed(takeoff([shower()], {
      showerBase: { widthMm: 36 * IN, depthMm: 36 * IN, drain: { fromLeftMm: 18 * IN, fromBackMm: 18 * IN }, entry: 'right', curbless: false, wall: 'Whitlock shower', fit: 'follow' },
    }))
    const w = r.walls[0] as WallResultOk
    const curve = w.curve![0]
    // 13 blocks × 7.0170° = 91.22° built (the radius kept until the clerk chooses)
    expect(curve.builtAngleDeg).toBeCloseTo(13 * 7.0170, 2)
    expect(r.showerBase?.base.curb?.arcDeg).toBe(curve.builtAngleDeg)
    expect(r.showerBase?.base.curb?.radiusMm).toBe(curve.insideRadiusMm)
    const line = r.lines.find((l) => l.role === 'showerBase')!
    expect(line.name).toContain('curved curb R 48 in, 91.2°')
    expect(line.name).not.toContain('36 × 36')
    expect(r.cautions.some((c) => c.key === 'base_mismatch')).toBe(false)
  })

  it('closing the arc at the exact radius gives a 90° base; an entered base that differs is a stop', () => {
    const exact = shower({ segments: [{ kind: 'straight', blocks: 3 }, { kind: 'curved', insideRadiusMm: 48 * IN, arcAngleDeg: 90, direction: 'left', closing: 'radius' }] })
    const base = { widthMm: 42 * IN, depthMm: 48 * IN, curb: { radiusMm: 48 * IN, arcDeg: 90 }, drain: { fromLeftMm: 21 * IN, fromBackMm: 24 * IN }, entry: 'right' as const, curbless: false, wall: 'Whitlock shower' }
    const follow = computed(takeoff([exact], { showerBase: { ...base, fit: 'follow' } }))
    expect(follow.showerBase?.base.curb?.arcDeg).toBeCloseTo(90, 9)
    // 13 blocks close 90° exactly at R' = radiusForAnglePerBlock(5.75 in, 1/8 in, 90°/13), a little over 48 in
    expect(follow.showerBase!.base.curb!.radiusMm / IN).toBeGreaterThan(48)
    // entered 42 × 48 in against the wall's own plan: a mismatch beyond 1/4 in stops saving for ordering
    const checked = computed(takeoff([exact], { showerBase: { ...base, fit: 'check' } }))
    const stop = checked.cautions.find((c) => c.key === 'base_mismatch')
    expect(stop?.level).toBe('stop')
    expect(stop?.params?.fields).toContain('footprint')
    expect(checked.totals.stops).toBeGreaterThan(0)
  })

  it('the default curved segment works with the default 8x8 block', () => {
    // smallest radius with 1/8 in inside and 5/8 in outside joints: 61.03 in (curve tests) → 62 in
    const joint = resolveJoint({ kind: 'spacer', jointMm: IN / 8 })
    const radius = workableRadiusMm(block8.faceWidthMm, block8.depthMm, joint)
    expect(radius / IN).toBe(62)
    const w = computed(takeoff([wall({ sizing: 'count', heightMm: undefined, courses: 8, segments: [{ kind: 'curved', insideRadiusMm: radius, arcAngleDeg: 90, direction: 'left' }] })])).walls[0]
    expect(w.status).toBe('ok')
    // a 6x6 block turns tighter: 60 in stays
    expect(workableRadiusMm(block6.faceWidthMm, block6.depthMm, joint) / IN).toBe(60)
  })

  it('the radius named as the smallest is accepted when typed back', () => {
    const joint = resolveJoint({ kind: 'spacer', jointMm: IN / 8 })
    const smallest = minInsideRadiusMm(block8.faceWidthMm, block8.depthMm, joint.curveInsideJointMm, joint.maxOutsideJointMm)
    // the refusal names it rounded up to 1/16 in and to 0.1 mm; both build
    for (const typed of [Math.ceil((smallest / IN) * 16) / 16 * IN, Math.ceil(smallest * 10) / 10]) {
      const w = computed(takeoff([wall({ sizing: 'count', heightMm: undefined, courses: 4, segments: [{ kind: 'curved', insideRadiusMm: typed, arcAngleDeg: 45, direction: 'left' }] })])).walls[0]
      expect(w.status).toBe('ok')
    }
  })
})

describe('a radius too tight names the blocks that do turn it', () => {
  const option = (sku: string, nominal: string, widthIn: number, heightIn: number, depthIn: number, pattern = 'clear'): BlockOption => ({
    itemId: sku.length, sku, name: sku, nominal, faceWidthMm: widthIn * IN, faceHeightMm: heightIn * IN, depthMm: depthIn * IN,
    thicknessClass: depthIn < 3.8 ? 'thin' : 'standard', weightKg: 2, pattern, shape: 'square',
    item: { sku, name: sku, unit: 'each', packSize: 1, sellByPack: false },
  })
  const catalog: CounterCatalog = {
    blocks: [option('B8', '8x8', 7.75, 7.75, 3.875), option('B48', '4x8', 7.75, 3.75, 3.875), option('B8T', '8x8', 7.75, 7.75, 3.125), option('B12', '12x12', 11.75, 11.75, 3.875)],
    roleItems: [], rules: [], wastePct: {}, figures: DEFAULT_SITE_FIGURES, looseItems: [],
  }
  const tight = (radiusIn: number): Takeoff => takeoff([wall({
    sizing: 'count', heightMm: undefined, courses: 6,
    segments: [{ kind: 'curved', insideRadiusMm: radiusIn * IN, arcAngleDeg: 90, direction: 'left' }],
    catalog: { block: { sku: 'B8', name: 'B8', packSize: 1, sellByPack: false } },
  })])

  it('at 40 in: the 4x8 set on end turns it, the 8x8 and 12x12 do not', () => {
    // Small-angle estimate R ≈ (w + ji)·t / (jo − ji) (arc length = radius × angle):
    // 8x8 (7.75 + 0.125) × 3.875 / 0.5 = 61.0 in; 8x8 thin × 3.125 = 49.2 in; 4x8 on end (3.75 + 0.125) × 3.875
    // / 0.5 = 30.0 in; 12x12 (11.875 × 3.875 / 0.5) = 92.0 in. Only the 4x8 on end is under 40 in.
    const bill = computeCounterBill(tight(40), catalog, 'in')
    expect(bill.walls[0].status).toBe('refused')
    const advice = bill.advice.find((a) => a.wall === 0)!
    expect(advice.reason).toBe('radius')
    expect(advice.swaps.map((s) => [s.sku, s.onEnd])).toEqual([['B48', true]])
    expect(advice.swaps[0].smallestRadiusMm! / IN).toBeCloseTo(30.0, 0)
  })

  it('at 55 in the thin 8x8 also turns it; the one-click swap then builds', () => {
    const bill = computeCounterBill(tight(55), catalog, 'in')
    const swaps = bill.advice.find((a) => a.wall === 0)!.swaps.map((s) => s.sku)
    expect(swaps).toEqual(expect.arrayContaining(['B8T', 'B48']))
    expect(swaps).not.toContain('B12')
    const swapped = tight(55)
    swapped.walls[0] = { ...swapped.walls[0], catalog: { block: { sku: 'B48', name: 'B48', packSize: 1, sellByPack: false } }, blockOnEnd: true }
    expect(computeCounterBill(swapped, catalog, 'in').walls[0].status).toBe('ok')
  })
})

describe('space left after whole blocks', () => {
  it('78 in of opening takes 9 blocks and leaves 3 1/4 in at each jamb: warned, with the openings that fit', () => {
    // n = floor((78 − 1/8) / 7 7/8) = floor(9.889) = 9 blocks; 9 blocks with the 3/8 in expansion allowance
    // (IRC 2021 R607.7) at each jamb need 9 × 7.875 − 0.125 + 2 × 0.375 = 71.5 in; (78 − 71.5) / 2 = 3.25 in per
    // jamb, more than the 1 in default (common practice). One more block needs 79.375 in.
    const w = firstWall(takeoff([wall({ segments: [{ kind: 'straight', lengthMm: 78 * IN }] })]))
    const warn = w.cautions.find((c) => c.key === 'leftover_space' && c.params?.where === 'jambs')!
    expect(warn.level).toBe('warn')
    expect(Number(warn.params!.gapMm) / IN).toBeCloseTo(3.25, 9)
    expect(Number(warn.params!.openingMm) / IN).toBeCloseTo(71.5, 9)
    expect(Number(warn.params!.openingOneMoreMm) / IN).toBeCloseTo(79.375, 9)
  })

  it('72 in leaves 1/4 in a jamb: no warning', () => {
    // 9 blocks need 71.5 in; (72 − 71.5) / 2 = 0.25 in ≤ 1 in
    const w = firstWall(takeoff([wall()]))
    expect(w.cautions.some((c) => c.key === 'leftover_space' && c.params?.where === 'jambs')).toBe(false)
  })
})

describe('bounds before any layout', () => {
  it('counts a wall’s blocks from the typed figures', () => {
    // 72 in ÷ 7.875 = 9.14 → at most 10 across; 84 in ÷ 7.875 = 10.67 → at most 11 courses: 110
    expect(estimateWallBlocks(wall())).toEqual({ across: 10, courses: 11, blocks: 110 })
  })

  it('refuses an opening of 20,000 in and says the limit in the clerk’s unit', () => {
    const parsed = takeoffSchema.safeParse(takeoff([wall({ segments: [{ kind: 'straight', lengthMm: 1 }] })].map((w) => ({ ...w, segments: [{ kind: 'straight' as const, lengthMm: 20_000 * IN }] }))))
    expect(parsed.success).toBe(false)
    if (parsed.success) return
    const [issue] = takeoffIssues(parsed.error, 'in')
    // 100 ft = 30,480 mm (NIST SP 811: 1 ft = 0.3048 m)
    expect(issue).toMatchObject({ path: 'walls.0.segments.0.lengthMm', key: 'at_most_length', params: { maxMm: 30_480 } })
    expect(issue.message).toBe('At most 100 ft')
    expect(takeoffIssues(parsed.error, 'mm')[0].message).toBe('At most 30480 mm')
  })

  it('refuses block faces under 50 mm and a wall past 10,000 blocks, naming its size', () => {
    expect(wallSchema.safeParse({ ...wall(), block: { ...block8, faceWidthMm: 20 } }).success).toBe(false)
    // 99 ft × 99 ft of 8x8: 1188 in ÷ 7.875 = 150.9 → 151 across and 151 courses = 22,801 blocks
    const big = wallSchema.safeParse({ ...wall(), heightMm: 1188 * IN, segments: [{ kind: 'straight', lengthMm: 1188 * IN }] })
    expect(big.success).toBe(false)
    if (!big.success) expect(takeoffIssues(big.error, 'in')[0]).toMatchObject({ key: 'wall_too_large', params: { across: 151, courses: 151, blocks: 22_801 } })
  })

  it('refuses more blocks in all than a takeoff takes', () => {
    // 7 walls of 90 × 100 = 9,000 blocks (each under the wall limit) = 63,000 > 60,000
    const wide = wall({ sizing: 'count', heightMm: undefined, courses: 100, segments: [{ kind: 'straight', blocks: 90 }] })
    const parsed = takeoffSchema.safeParse(takeoff(Array.from({ length: 7 }, (_, i) => ({ ...wide, name: `W${i}` }))))
    expect(parsed.success).toBe(false)
    if (!parsed.success) expect(takeoffIssues(parsed.error, 'in').map((i) => i.key)).toContain('takeoff_too_large')
    expect(TAKEOFF_LIMITS.blocksPerTakeoff).toBe(60_000)
  })
})

describe('properties over random walls', () => {
  const walls = fc.record({
    straight: fc.integer({ min: 1, max: 14 }),
    curve: fc.option(fc.record({ radiusIn: fc.integer({ min: 62, max: 240 }), deg: fc.integer({ min: 10, max: 180 }), closing: fc.constantFrom('radius', 'overshoot', undefined) }), { nil: undefined }),
    courses: fc.integer({ min: 1, max: 24 }),
    freeStart: fc.boolean(),
    freeEnd: fc.boolean(),
    freeTop: fc.boolean(),
    mortar: fc.boolean(),
    wet: fc.boolean(),
  })
  const toWall = (p: { straight: number; curve?: { radiusIn: number; deg: number; closing?: string }; courses: number; freeStart: boolean; freeEnd: boolean; freeTop: boolean; mortar: boolean; wet: boolean }) =>
    wall({
      sizing: 'count', heightMm: undefined, courses: p.courses,
      joint: p.mortar ? { kind: 'mortar', jointMm: IN / 4 } : { kind: 'spacer', jointMm: IN / 8 },
      segments: [
        { kind: 'straight', blocks: p.straight },
        ...(p.curve ? [{ kind: 'curved' as const, insideRadiusMm: p.curve.radiusIn * IN, arcAngleDeg: p.curve.deg, direction: 'left' as const, ...(p.curve.closing ? { closing: p.curve.closing as 'radius' } : {}) }] : []),
      ],
      freeEnds: { start: p.freeStart, end: p.freeEnd, top: p.freeTop },
      wetArea: p.wet,
    })

  it('finished units cover exactly the exposed edge modules', () => {
    fc.assert(fc.property(walls, (p) => {
      const w = firstWall(takeoff([toWall(p)]))
      const g = w.geometry
      const K = g.courses
      const C = g.blocksAcross
      // independent count: each free end shows one edge per course, a free top one per column
      const sides = (p.freeStart ? 1 : 0) + (p.freeEnd ? 1 : 0)
      const expected = sides * K + (p.freeTop ? C : 0)
      expect(g.finished.edgeModules).toBe(expected)
      expect(g.endBlocks + 2 * g.doubleEndBlocks).toBe(g.finished.edgeModules - g.finished.uncovered)
      expect(g.standardBlocks + g.endBlocks + g.doubleEndBlocks + g.cornerBlocks + g.angleBlocks).toBe(g.totalBlocks)
    }), { numRuns: 80 })
  })

  it('every fixed jamb and head has fixings no more than 16 in apart, from both ends', () => {
    fc.assert(fc.property(walls, (p) => {
      const w = firstWall(takeoff([toWall(p)]))
      const g = w.geometry
      const limit = 16 * IN
      const edges = [
        { side: 'start', fixed: !p.freeStart, length: g.panelHeightMm, along: 'yMm' as const },
        { side: 'end', fixed: !p.freeEnd, length: g.panelHeightMm, along: 'yMm' as const },
        { side: 'head', fixed: !p.freeTop, length: g.panelWidthMm, along: 'xMm' as const },
      ]
      for (const e of edges) {
        const on = w.fixings.filter((f) => f.side === e.side).map((f) => f[e.along])
        if (!e.fixed) expect(on).toHaveLength(0)
        // an edge shorter than the spacing needs no fixing in between; any longer one never gaps past 16 in
        else expect(largestGap(on, e.length)).toBeLessThanOrEqual(limit + 1e-6)
      }
    }), { numRuns: 80 })
  })

  it('the base following a curved wall has its built arc and radius', () => {
    fc.assert(fc.property(walls.filter((p) => p.curve !== undefined), (p) => {
      const r = computed(takeoff([toWall(p)], {
        showerBase: { widthMm: 1000, depthMm: 1000, drain: { fromLeftMm: 0, fromBackMm: 0 }, entry: 'left', curbless: false, wall: 'Whitlock shower', fit: 'follow' },
      }))
      const w = r.walls[0] as WallResultOk
      expect(r.showerBase?.base.curb?.arcDeg).toBe(w.curve![0].builtAngleDeg)
      expect(r.showerBase?.base.curb?.radiusMm).toBe(w.curve![0].insideRadiusMm)
      if (p.curve?.closing === 'radius') expect(w.curve![0].builtAngleDeg).toBeCloseTo(p.curve.deg, 9)
      expect(r.cautions.some((c) => c.key === 'base_mismatch')).toBe(false)
    }), { numRuns: 40 })
  })

  it('grout and sealant follow the joints', () => {
    fc.assert(fc.property(walls.filter((p) => !p.mortar), (p) => {
      const w = firstWall(takeoff([toWall(p)]))
      const g = w.geometry
      // grout: (Σ head joint widths × panel height + inner bed joints × length × joint) × 3/8 in × 2 faces
      const face = g.columns.reduce((s, c) => s + c.jointAfterMm, 0) * g.panelHeightMm + (g.courses - 1) * g.panelWidthMm * (IN / 8)
      expect(w.measures.groutVolumeMl).toBeCloseTo((face * (2 * (3 / 8) * IN)) / 1000, 6)
      // sealant beads: the curb bed runs the panel length; a fixed jamb's bead its full height
      expect(w.measures.bottomRunMm).toBeCloseTo(g.panelWidthMm, 9)
      expect(w.measures.jambLengthMm).toBeCloseTo(g.panelHeightMm * ((p.freeStart ? 0 : 1) + (p.freeEnd ? 0 : 1)), 9)
      // section tops and seams: zero for one section, never more than every joint of the panel
      const joints = (g.courses - 1) * g.panelWidthMm + (g.blocksAcross - 1) * g.courses * g.moduleUpMm
      expect(w.measures.sectionTopsMm + w.measures.sectionSeamsMm).toBeLessThanOrEqual(joints + 1e-6)
      if (w.sections.sections.length === 1) expect(w.measures.sectionTopsMm + w.measures.sectionSeamsMm).toBe(0)
    }), { numRuns: 60 })
  })
})
