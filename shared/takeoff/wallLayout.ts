// Lays a wall's run of segments out as columns of blocks and courses: block counts, the finished panel,
// what is left in an opening or what opening to frame. Refuses a wall that cannot be built as drawn.
import type { Segment, Wall } from '../schemas/takeoff.js'
import { formatLength, m2ToFt2, type LengthUnit } from '../units.js'
import { planCurvedSegment, type CurveLayout } from './curve.js'
import {
  edgeAllowanceMm,
  fitCourses,
  fitOpening,
  moduleMm,
  resolveJoint,
  roughOpeningWidth,
  type CourseFit,
  type ResolvedJoint,
} from './geometry.js'

export type ColumnKind = 'straight' | 'curved' | 'corner'

export interface Column {
  index: number
  segment: number
  kind: ColumnKind
  /** A corner column's turn: 90° (corner unit) or 45° (angle unit). */
  cornerDeg?: 90 | 45
  /** Face width along the developed (unrolled) run. */
  faceMm: number
  /** Joint to the next column along the developed run; 0 after the last column. */
  jointAfterMm: number
  /** Left edge along the developed run, from the start of the panel. */
  xMm: number
}

export type SegmentLayout =
  | { kind: 'straight'; index: number; blocks: number; openingMm?: number; leftoverMm?: number }
  | { kind: 'curved'; index: number; blocks: number; curve: CurveLayout }
  | { kind: 'corner'; index: number; blocks: 1; direction: 'left' | 'right'; angleDeg: 90 | 45 }

/**
 * Exposed edges and the finished units that cover them. A free end shows one edge per course; a free top
 * one edge per block across; the top block of a free end shows two (top and end). Corner and angle
 * columns keep their own units.
 */
export interface FinishedEdges {
  /** Courses showing at the free start and the free end (0 when framed or ending in a corner unit). */
  startCourses: number
  endCourses: number
  /** Blocks showing along a free top. */
  topBlocks: number
  /** Units finished on one edge, and on two edges (where a free top meets a free end). */
  oneEdge: number
  twoEdges: number
  /** Exposed edge modules in all: oneEdge + 2 × twoEdges, plus any a two-edge unit cannot cover. */
  edgeModules: number
  /** Edges no unit covers: a one-block-wide column free on both sides and on top shows three. */
  uncovered: number
}

/** Space left after whole blocks, beyond the allowance at the edge, where an opening was given. */
export interface LeftoverGap {
  where: 'jambs' | 'head' | 'segment'
  /** The straight segment it belongs to (jambs and segment). */
  segment?: number
  /** The extra space: at each jamb for 'jambs', at the head, or in the segment for 'segment'. */
  gapMm: number
  /** Whole blocks laid there, and the opening that would fit them, or one more, with no extra space. */
  blocks: number
  openingForBlocksMm: number
  openingForOneMoreMm: number
}

export interface WallGeometry {
  sizing: Wall['sizing']
  joint: ResolvedJoint
  moduleAcrossMm: number
  moduleUpMm: number
  segments: SegmentLayout[]
  columns: Column[]
  blocksAcross: number
  courses: number
  totalBlocks: number
  /** Units finished on one edge (free end columns, free top). */
  endBlocks: number
  /** Units finished on two edges, where a free top meets a free end. */
  doubleEndBlocks: number
  cornerBlocks: number
  angleBlocks: number
  standardBlocks: number
  finished: FinishedEdges
  panelWidthMm: number
  panelHeightMm: number
  areaM2: number
  areaFt2: number
  hasCurve: boolean
  framedEnds: number
  headFramed: boolean
  courseFit: CourseFit
  /** Opening sizing of a single straight run: space at each jamb when the panel is centred. */
  jambSpaceMm?: number
  /** Count sizing of an all-straight run: the rough opening to frame. */
  roughOpening?: { widthMm: number; heightMm: number }
  /** Opening sizing: extra space left after whole blocks, at jambs, head or in a segment. */
  gaps: LeftoverGap[]
}

export interface WallRefusal {
  ok: false
  reason: string
  /** A stable name and the figures of the refusal, for a screen to word in the user's language and unit. */
  key: string
  params: Record<string, string | number>
  segment?: number
  smallestRadiusMm?: number
}

type SegmentResult = SegmentLayout | WallRefusal

function layoutStraight(
  segment: Extract<Segment, { kind: 'straight' }>,
  index: number,
  wall: Wall,
  joint: ResolvedJoint,
  unit: LengthUnit,
): SegmentResult {
  if (wall.sizing === 'count') return { kind: 'straight', index, blocks: segment.blocks ?? 0 }
  const opening = segment.lengthMm ?? 0
  const fit = fitOpening(opening, wall.block.faceWidthMm, joint.jointMm)
  if (fit.blocks === 0) {
    const least = wall.block.faceWidthMm + 2 * joint.jointMm
    return {
      ok: false,
      key: 'opening_too_small',
      params: { segment: index + 1, openingMm: opening, leastMm: least },
      segment: index,
      reason: `Segment ${index + 1}: an opening of ${formatLength(opening, unit)} is too small for one block ` +
        `(one block and two joints need ${formatLength(least, unit, { rounding: 'up' })}).`,
    }
  }
  return { kind: 'straight', index, blocks: fit.blocks, openingMm: opening, leftoverMm: fit.leftoverMm }
}

function layoutSegment(segment: Segment, index: number, wall: Wall, joint: ResolvedJoint, unit: LengthUnit): SegmentResult {
  if (segment.kind === 'straight') return layoutStraight(segment, index, wall, joint, unit)
  if (segment.kind === 'corner') return { kind: 'corner', index, blocks: 1, direction: segment.direction, angleDeg: segment.angleDeg ?? 90 }
  const curve = planCurvedSegment(segment, wall.block, joint, unit)
  if (!curve.ok) {
    const params = { segment: index + 1, ...curve.params }
    return { ok: false, key: curve.key, params, segment: index, reason: `Segment ${index + 1}: ${curve.reason}`, smallestRadiusMm: curve.smallestRadiusMm }
  }
  return { kind: 'curved', index, blocks: curve.blocks, curve }
}

function meanCurveJoint(layout: SegmentLayout | undefined): number | undefined {
  return layout?.kind === 'curved' ? (layout.curve.insideJointMm + layout.curve.outsideJointMm) / 2 : undefined
}

/** Columns along the developed run; a joint touching a curve takes that curve's mean wedge width. */
export function buildColumns(segments: SegmentLayout[], faceMm: number, jointMm: number): Column[] {
  const columns: Column[] = []
  let x = 0
  segments.forEach((segment, s) => {
    for (let i = 0; i < segment.blocks; i++) {
      const last = i === segment.blocks - 1
      const next = last ? segments[s + 1] : segment
      const wedge = meanCurveJoint(segment) ?? (last ? meanCurveJoint(next) : undefined)
      const column: Column = { index: columns.length, segment: s, kind: segment.kind, faceMm, jointAfterMm: wedge ?? jointMm, xMm: x }
      if (segment.kind === 'corner') column.cornerDeg = segment.angleDeg
      columns.push(column)
      x += faceMm + (wedge ?? jointMm)
    }
  })
  const lastColumn = columns[columns.length - 1]
  if (lastColumn) lastColumn.jointAfterMm = 0
  return columns
}

/**
 * Counts exposed edges cell by cell, by column: the columns below the top course show their side edges
 * at a free end; the top course adds its top edge when the top is free. One exposed edge takes a unit
 * finished on one edge, two or more a unit finished on two.
 */
export function finishedEdges(columns: Column[], courses: number, freeEnds: Wall['freeEnds']): FinishedEdges {
  const last = columns.length - 1
  const out: FinishedEdges = { startCourses: 0, endCourses: 0, topBlocks: 0, oneEdge: 0, twoEdges: 0, edgeModules: 0, uncovered: 0 }
  const count = (edges: number, cells: number) => {
    if (edges === 0 || cells === 0) return
    out.edgeModules += edges * cells
    if (edges === 1) out.oneEdge += cells
    else out.twoEdges += cells
    out.uncovered += Math.max(0, edges - 2) * cells
  }
  for (const column of columns) {
    if (column.kind === 'corner') continue
    const atStart = column.index === 0 && freeEnds.start
    const atEnd = column.index === last && freeEnds.end
    const sides = Number(atStart) + Number(atEnd)
    if (atStart) out.startCourses = courses
    if (atEnd) out.endCourses = courses
    if (freeEnds.top) out.topBlocks++
    count(sides, courses - 1)
    count(sides + Number(freeEnds.top), 1)
  }
  return out
}

/** Extra space after whole blocks, beyond the edge allowance, where the wall was sized from an opening. */
function leftoverGaps(wall: Wall, segments: SegmentLayout[], joint: ResolvedJoint, fit: CourseFit): LeftoverGap[] {
  if (wall.sizing !== 'opening') return []
  const gaps: LeftoverGap[] = []
  const allowance = edgeAllowanceMm(joint.expansionMm, joint.jointMm)
  const across = moduleMm(wall.block.faceWidthMm, joint.jointMm)
  const single = segments.length === 1
  for (const s of segments) {
    if (s.kind !== 'straight' || s.openingMm === undefined) continue
    // Alone, the run meets a jamb at each end: n × module − joint + 2 × allowance fits n blocks exactly.
    // Between curves or corners, the opening rule's own n × module + joint.
    const openingFor = single ? (n: number) => n * across - joint.jointMm + 2 * allowance : (n: number) => n * across + joint.jointMm
    const extra = s.openingMm - openingFor(s.blocks)
    gaps.push({
      where: single ? 'jambs' : 'segment',
      segment: s.index,
      gapMm: single ? extra / 2 : extra,
      blocks: s.blocks,
      openingForBlocksMm: openingFor(s.blocks),
      openingForOneMoreMm: openingFor(s.blocks + 1),
    })
  }
  if (!wall.freeEnds.top && fit.openingHeightMm !== undefined) {
    const up = moduleMm(wall.block.faceHeightMm, joint.jointMm)
    // Height for n courses: a bed joint at the sill, n × module − joint, the allowance at the head.
    const heightFor = (n: number) => n * up + allowance
    gaps.push({
      where: 'head',
      gapMm: fit.openingHeightMm - heightFor(fit.courses),
      blocks: fit.courses,
      openingForBlocksMm: heightFor(fit.courses),
      openingForOneMoreMm: heightFor(fit.courses + 1),
    })
  }
  return gaps
}

function openingDetails(wall: Wall, segments: SegmentLayout[], joint: ResolvedJoint, panelWidthMm: number, fit: CourseFit) {
  const allStraight = segments.every((s) => s.kind === 'straight')
  const single = segments.length === 1 ? segments[0] : undefined
  const jambSpaceMm =
    single?.kind === 'straight' && single.leftoverMm !== undefined ? joint.jointMm + single.leftoverMm / 2 : undefined
  const roughOpening =
    wall.sizing === 'count' && allStraight && fit.roughOpeningHeightMm !== undefined
      ? { widthMm: roughOpeningWidth(panelWidthMm, joint.expansionMm, joint.jointMm), heightMm: fit.roughOpeningHeightMm }
      : undefined
  return { jambSpaceMm, roughOpening }
}

/** The whole wall: segments to columns, courses, block counts, panel and opening sizes. */
export function layoutWall(wall: Wall, unit: LengthUnit): WallGeometry | WallRefusal {
  const joint = resolveJoint(wall.joint)
  const segments: SegmentLayout[] = []
  for (const [index, segment] of wall.segments.entries()) {
    const result = layoutSegment(segment, index, wall, joint, unit)
    if ('ok' in result) return result
    segments.push(result)
  }
  const headFramed = !wall.freeEnds.top
  const courseFit = fitCourses(wall, wall.block.faceHeightMm, joint, headFramed)
  if (courseFit.courses === 0) {
    return {
      ok: false,
      key: 'height_too_small',
      params: { heightMm: wall.heightMm ?? 0 },
      reason: `An opening height of ${formatLength(wall.heightMm ?? 0, unit)} is too small for one course.`,
    }
  }
  const columns = buildColumns(segments, wall.block.faceWidthMm, joint.jointMm)
  const courses = courseFit.courses
  const last = columns[columns.length - 1]
  const panelWidthMm = last ? last.xMm + last.faceMm : 0
  const totalBlocks = columns.length * courses
  const cornerBlocks = columns.filter((c) => c.kind === 'corner' && c.cornerDeg !== 45).length * courses
  const angleBlocks = columns.filter((c) => c.kind === 'corner' && c.cornerDeg === 45).length * courses
  const finished = finishedEdges(columns, courses, wall.freeEnds)
  const areaM2 = (panelWidthMm * courseFit.panelHeightMm) / 1e6
  return {
    sizing: wall.sizing,
    joint,
    moduleAcrossMm: moduleMm(wall.block.faceWidthMm, joint.jointMm),
    moduleUpMm: moduleMm(wall.block.faceHeightMm, joint.jointMm),
    segments,
    columns,
    blocksAcross: columns.length,
    courses,
    totalBlocks,
    endBlocks: finished.oneEdge,
    doubleEndBlocks: finished.twoEdges,
    cornerBlocks,
    angleBlocks,
    standardBlocks: totalBlocks - finished.oneEdge - finished.twoEdges - cornerBlocks - angleBlocks,
    finished,
    panelWidthMm,
    panelHeightMm: courseFit.panelHeightMm,
    areaM2,
    areaFt2: m2ToFt2(areaM2),
    hasCurve: segments.some((s) => s.kind === 'curved'),
    framedEnds: Number(!wall.freeEnds.start) + Number(!wall.freeEnds.end),
    headFramed,
    courseFit,
    ...openingDetails(wall, segments, joint, panelWidthMm, courseFit),
    gaps: leftoverGaps(wall, segments, joint, courseFit),
  }
}

export const isWallRefusal = (value: WallGeometry | WallRefusal): value is WallRefusal => 'ok' in value
