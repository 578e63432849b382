// Lays a wall's run of segments out as columns of blocks and courses: block counts, the finished panel,
// what is left in an opening or what opening to frame. Refuses a wall that cannot be built as drawn.
import type { Segment, Wall } from '../schemas/takeoff.js'
import { formatLength, m2ToFt2, type LengthUnit } from '../units.js'
import { planCurvedSegment, type CurveLayout } from './curve.js'
import {
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
  | { kind: 'corner'; index: number; blocks: 1; direction: 'left' | 'right' }

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
  endBlocks: number
  cornerBlocks: number
  standardBlocks: number
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
}

export interface WallRefusal {
  ok: false
  reason: string
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
      segment: index,
      reason: `Segment ${index + 1}: an opening of ${formatLength(opening, unit)} is too small for one block ` +
        `(one block and two joints need ${formatLength(least, unit, { rounding: 'up' })}).`,
    }
  }
  return { kind: 'straight', index, blocks: fit.blocks, openingMm: opening, leftoverMm: fit.leftoverMm }
}

function layoutSegment(segment: Segment, index: number, wall: Wall, joint: ResolvedJoint, unit: LengthUnit): SegmentResult {
  if (segment.kind === 'straight') return layoutStraight(segment, index, wall, joint, unit)
  if (segment.kind === 'corner') return { kind: 'corner', index, blocks: 1, direction: segment.direction }
  const curve = planCurvedSegment(segment, wall.block, joint, unit)
  if (!curve.ok) {
    return { ok: false, segment: index, reason: `Segment ${index + 1}: ${curve.reason}`, smallestRadiusMm: curve.smallestRadiusMm }
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
      columns.push({ index: columns.length, segment: s, kind: segment.kind, faceMm, jointAfterMm: wedge ?? jointMm, xMm: x })
      x += faceMm + (wedge ?? jointMm)
    }
  })
  const lastColumn = columns[columns.length - 1]
  if (lastColumn) lastColumn.jointAfterMm = 0
  return columns
}

/** End-finish blocks replace a standard block at each free end column (a corner column keeps its corner block). */
function countEndBlocks(wall: Wall, columns: Column[], courses: number): number {
  const ends = new Set<Column>()
  if (wall.freeEnds.start && columns[0]) ends.add(columns[0])
  if (wall.freeEnds.end && columns[columns.length - 1]) ends.add(columns[columns.length - 1])
  return [...ends].filter((c) => c.kind !== 'corner').length * courses
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
    return { ok: false, reason: `An opening height of ${formatLength(wall.heightMm ?? 0, unit)} is too small for one course.` }
  }
  const columns = buildColumns(segments, wall.block.faceWidthMm, joint.jointMm)
  const courses = courseFit.courses
  const last = columns[columns.length - 1]
  const panelWidthMm = last ? last.xMm + last.faceMm : 0
  const totalBlocks = columns.length * courses
  const cornerBlocks = columns.filter((c) => c.kind === 'corner').length * courses
  const endBlocks = countEndBlocks(wall, columns, courses)
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
    endBlocks,
    cornerBlocks,
    standardBlocks: totalBlocks - endBlocks - cornerBlocks,
    panelWidthMm,
    panelHeightMm: courseFit.panelHeightMm,
    areaM2,
    areaFt2: m2ToFt2(areaM2),
    hasCurve: segments.some((s) => s.kind === 'curved'),
    framedEnds: Number(!wall.freeEnds.start) + Number(!wall.freeEnds.end),
    headFramed,
    courseFit,
    ...openingDetails(wall, segments, joint, panelWidthMm, courseFit),
  }
}

export const isWallRefusal = (value: WallGeometry | WallRefusal): value is WallRefusal => 'ok' in value
