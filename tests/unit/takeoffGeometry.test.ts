// Feature: takeoff geometry — modules, whole blocks in an opening, panel and rough opening from a count,
// and laying a wall's run out as columns (shared/takeoff/geometry.ts, wallLayout.ts).
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  actualFaceFromNominalInches,
  fitCourses,
  fitOpening,
  JOINT_FACTS,
  moduleMm,
  panelFromCount,
  resolveJoint,
  roughOpeningHeight,
  roughOpeningWidth,
} from '../../shared/takeoff/geometry.js'
import { isWallRefusal, layoutWall } from '../../shared/takeoff/wallLayout.js'
import { block8 as demoBlock8, IN, laid, wallMaker } from '../support/takeoffFixtures.js'

// 8x8 nominal block: actual face 7 3/4 in (nominal − 1/4 in, common practice), standard depth 3 7/8 in (IRC 2021 R607.3).
const block8 = { ...demoBlock8, weightKg: 3 }
const wall = wallMaker('Test wall', block8)

describe('block module', () => {
  it('inch blocks are 1/4 in under nominal', () => {
    // source: common practice (nominal includes a 1/4 in mortar joint); 8 − 0.25 = 7.75 in = 196.85 mm
    expect(actualFaceFromNominalInches(8)).toBeCloseTo(196.85, 9)
    // 6 − 0.25 = 5.75 in = 146.05 mm; 12 − 0.25 = 11.75 in = 298.45 mm
    expect(actualFaceFromNominalInches(6)).toBeCloseTo(146.05, 9)
    expect(actualFaceFromNominalInches(12)).toBeCloseTo(298.45, 9)
  })

  it('with a 1/4 in mortar joint the module is the nominal size', () => {
    // source: IRC 2021 R607.10 joints 1/4 in; 7.75 + 0.25 = 8 in = 203.2 mm
    expect(moduleMm(actualFaceFromNominalInches(8), JOINT_FACTS.mortarJointMm)).toBeCloseTo(203.2, 9)
    // spacer system 1/8 in joint (common practice): 7.75 + 0.125 = 7.875 in = 200.025 mm
    expect(moduleMm(196.85, JOINT_FACTS.spacerJointMm)).toBeCloseTo(200.025, 9)
  })

  it('fills the joint system defaults from the code', () => {
    const mortar = resolveJoint({ kind: 'mortar', jointMm: 6.35 })
    // source: IRC 2021 R607.10 radial joints 1/8 in to 5/8 in (from memory, high)
    expect(mortar.curveInsideJointMm).toBeCloseTo(3.175, 9)
    expect(mortar.maxOutsideJointMm).toBeCloseTo(15.875, 9)
    // source: IRC 2021 R607.7 expansion joints at least 3/8 in (from memory, high)
    expect(mortar.expansionMm).toBeCloseTo(9.525, 9)
    const spacer = resolveJoint({ kind: 'spacer', jointMm: 3.175, maxOutsideJointMm: 12 })
    expect(spacer.curveInsideJointMm).toBe(3.175)
    expect(spacer.maxOutsideJointMm).toBe(12)
    expect(spacer.sources.maxOutsideJoint).toBe('entered on the wall')
  })
})

describe('opening sizing', () => {
  it('worked example: 8x8 spacer blocks in a 6 ft × 7 ft opening', () => {
    // hand-worked (common practice rule n = floor((opening − joint) / module)):
    //   across: (72 − 1/8) / 7 7/8 = 71.875 / 7.875 = 9.127 → 9 blocks;
    //           9 × 7.875 + 0.125 = 71 in used → 1 in (25.4 mm) left for the channel take-up
    //   up:     (84 − 1/8) / 7.875 = 83.875 / 7.875 = 10.651 → 10 courses;
    //           10 × 7.875 + 0.125 = 78.875 in used → 5 1/8 in (130.175 mm) left at the head
    const across = fitOpening(72 * IN, 196.85, 3.175)
    expect(across.blocks).toBe(9)
    expect(across.usedMm).toBeCloseTo(71 * IN, 9)
    expect(across.leftoverMm).toBeCloseTo(25.4, 9)
    const up = fitOpening(84 * IN, 196.85, 3.175)
    expect(up.blocks).toBe(10)
    expect(up.leftoverMm).toBeCloseTo(5.125 * IN, 9)
    const g = laid(wall())
    expect(g.totalBlocks).toBe(90)
    // panel: 9 × 7.875 − 0.125 = 70.75 in; 10 × 7.875 − 0.125 = 78.625 in
    expect(g.panelWidthMm).toBeCloseTo(70.75 * IN, 9)
    expect(g.panelHeightMm).toBeCloseTo(78.625 * IN, 9)
    // area: 70.75 × 78.625 / 144 = 38.630 ft²
    expect(g.areaFt2).toBeCloseTo(38.63, 2)
    // centred panel: 1/8 in joint + half of 1 in = 5/8 in at each jamb
    expect(g.jambSpaceMm).toBeCloseTo(0.625 * IN, 9)
  })

  it('metric practice: opening = n × (block + joint) + one joint', () => {
    // source: common practice for 190 × 190 × 80 mm blocks on 10 mm joints:
    //   10 blocks need 10 × 200 + 10 = 2010 mm; an opening 1 mm short takes 9 (9 × 200 + 10 = 1810)
    expect(fitOpening(2010, 190, 10)).toEqual({ blocks: 10, usedMm: 2010, leftoverMm: 0 })
    const short = fitOpening(2009, 190, 10)
    expect(short.blocks).toBe(9)
    expect(short.leftoverMm).toBe(199)
  })

  it('an exact fit is not lost to float noise', () => {
    // hand-worked: 71 in is exactly 9 modules of 7.875 in plus one 1/8 in joint
    expect(fitOpening(71 * IN, 196.85, 3.175).blocks).toBe(9)
  })

  it('refuses an opening too small for one block, naming the size needed', () => {
    const result = layoutWall(wall({ segments: [{ kind: 'straight', lengthMm: 6 * IN }] }), 'in')
    expect(isWallRefusal(result)).toBe(true)
    // hand-worked: one block and two joints: 7.75 + 2 × 0.125 = 8 in
    if (isWallRefusal(result)) expect(result.reason).toContain('need 8″')
  })
})

describe('count sizing', () => {
  it('gives the finished panel and the rough opening to frame', () => {
    // hand-worked: 9 across × 10 courses, 1/8 in joints: panel 70.75 × 78.625 in (as above);
    // rough opening width = panel + 2 × 3/8 in expansion (IRC 2021 R607.7) = 71.5 in;
    // height = panel + 1/8 in sill joint + 3/8 in at a framed head = 79.125 in
    const g = laid(wall({ sizing: 'count', heightMm: undefined, courses: 10, segments: [{ kind: 'straight', blocks: 9 }] }))
    expect(g.panelWidthMm).toBeCloseTo(70.75 * IN, 9)
    expect(g.roughOpening?.widthMm).toBeCloseTo(71.5 * IN, 9)
    expect(g.roughOpening?.heightMm).toBeCloseTo(79.125 * IN, 9)
    expect(panelFromCount(9, 196.85, 3.175)).toBeCloseTo(70.75 * IN, 9)
    expect(roughOpeningWidth(100, 9.525, 3.175)).toBeCloseTo(119.05, 9)
    // a 10 mm metric joint is wider than 3/8 in (9.525 mm): the jamb keeps a full joint, 100 + 2 × 10
    expect(roughOpeningWidth(100, 9.525, 10)).toBeCloseTo(120, 9)
    // a free top has no head to leave room at
    expect(roughOpeningHeight(100, 3.175, 9.525, false)).toBeCloseTo(103.175, 9)
  })

  it('the rough opening for n blocks takes back exactly n blocks (also with 10 mm joints)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 60 }), fc.constantFrom(3.175, 6.35, 10), fc.constantFrom(146.05, 190, 196.85, 298.45), (n, j, face) => {
        const panel = panelFromCount(n, face, j)
        const ro = roughOpeningWidth(panel, JOINT_FACTS.expansionMinMm, j)
        expect(fitOpening(ro, face, j).blocks).toBe(n)
      }),
    )
  })

  it('count sizing with a course count and no height', () => {
    const fit = fitCourses({ courses: 4 }, 196.85, resolveJoint({ kind: 'mortar', jointMm: 6.35 }), true)
    // hand-worked: 4 × 8 − 0.25 = 31.75 in panel; + 0.25 in sill bed + 0.375 in head = 32.375 in
    expect(fit.panelHeightMm).toBeCloseTo(31.75 * IN, 9)
    expect(fit.roughOpeningHeightMm).toBeCloseTo(32.375 * IN, 9)
  })
})

describe('runs of segments', () => {
  it('counts finished units at free edges and corner blocks at corners', () => {
    // 3 + corner + 4 blocks across, 5 courses, free end at the finish and a free top: 8 columns × 5 = 40
    // blocks, 5 corner blocks. Exposed edges (common practice: each takes a finished face): the free end
    // shows 5 (one per course), the free top 7 (one per non-corner column) = 12 edge modules. The top of the
    // end column shows two, so: 4 + 6 = 10 units finished on one edge, 1 on two (10 + 2 × 1 = 12); 24 plain.
    const g = laid(
      wall({
        sizing: 'count',
        heightMm: undefined,
        courses: 5,
        segments: [{ kind: 'straight', blocks: 3 }, { kind: 'corner', direction: 'left' }, { kind: 'straight', blocks: 4 }],
        freeEnds: { start: false, end: true, top: true },
      }),
    )
    expect(g.blocksAcross).toBe(8)
    expect(g.totalBlocks).toBe(40)
    expect(g.cornerBlocks).toBe(5)
    expect(g.endBlocks).toBe(10)
    expect(g.doubleEndBlocks).toBe(1)
    expect(g.finished).toMatchObject({ endCourses: 5, topBlocks: 7, edgeModules: 12, uncovered: 0 })
    expect(g.standardBlocks).toBe(24)
    expect(g.framedEnds).toBe(1)
    expect(g.headFramed).toBe(false)
  })

  it('columns run continuously along the developed run', () => {
    const g = laid(wall())
    g.columns.forEach((c, i) => {
      if (i > 0) {
        const prev = g.columns[i - 1]
        expect(c.xMm).toBeCloseTo(prev.xMm + prev.faceMm + prev.jointAfterMm, 9)
      }
    })
    expect(g.columns[g.columns.length - 1].jointAfterMm).toBe(0)
  })
})

describe('properties', () => {
  const opening = fc.record({
    widthMm: fc.double({ min: 250, max: 8000, noNaN: true }),
    heightMm: fc.double({ min: 250, max: 6000, noNaN: true }),
    extraW: fc.double({ min: 0, max: 3000, noNaN: true }),
    extraH: fc.double({ min: 0, max: 3000, noNaN: true }),
    joint: fc.constantFrom(3.175, 6.35, 10),
  })

  it('a longer or taller opening never takes fewer blocks; counts are whole and ≥ 0', () => {
    fc.assert(
      fc.property(opening, ({ widthMm, heightMm, extraW, extraH, joint }) => {
        const small = laid(wall({ heightMm, joint: { kind: 'spacer', jointMm: joint }, segments: [{ kind: 'straight', lengthMm: widthMm }] }))
        const big = laid(wall({ heightMm: heightMm + extraH, joint: { kind: 'spacer', jointMm: joint }, segments: [{ kind: 'straight', lengthMm: widthMm + extraW }] }))
        expect(big.totalBlocks).toBeGreaterThanOrEqual(small.totalBlocks)
        for (const g of [small, big]) {
          expect(Number.isInteger(g.totalBlocks) && g.totalBlocks >= 0).toBe(true)
          expect(Number.isInteger(g.courses) && g.courses >= 1).toBe(true)
          expect(g.courseFit.leftoverMm ?? 0).toBeGreaterThanOrEqual(-1e-9)
        }
      }),
    )
  })

  it('the leftover is always less than one module', () => {
    fc.assert(
      fc.property(fc.double({ min: 210, max: 10_000, noNaN: true }), (o) => {
        const fit = fitOpening(o, 196.85, 3.175)
        expect(fit.leftoverMm).toBeGreaterThanOrEqual(-1e-6)
        expect(fit.leftoverMm).toBeLessThan(200.025 + 1e-6)
      }),
    )
  })
})
