// Starting values for the takeoff editor and the switch between its two sizing modes. The defaults are
// the trade's usual joints: spacer 1/8 in, mortar 1/4 in (IRC 2021 R607.10).
import { wallBlockFields } from '@shared/counter/counterBill'
import type { BlockOption } from '@shared/schemas/counter'
import type { JointKind, Segment, Takeoff, Wall } from '@shared/schemas/takeoff'
import type { WallResult } from '@shared/takeoff/billOfMaterials'
import { workableRadiusMm } from '@shared/takeoff/curve'
import { JOINT_FACTS, resolveJoint } from '@shared/takeoff/geometry'
import { MM_PER_INCH } from '@shared/units'

export const defaultJointMm = (kind: JointKind) => (kind === 'mortar' ? JOINT_FACTS.mortarJointMm : JOINT_FACTS.spacerJointMm)

export const blockFields = wallBlockFields

export function newWall(index: number, block: BlockOption | undefined): Wall {
  return {
    name: `Wall ${index + 1}`,
    sizing: 'opening',
    // 10 courses of 8x8 on 1/8 in joints with 3/8 in at the head: 10 × 7 7/8 + 3/8 = 79 1/8 in
    heightMm: 79.125 * MM_PER_INCH,
    block: { nominal: '8x8', faceWidthMm: 7.75 * MM_PER_INCH, faceHeightMm: 7.75 * MM_PER_INCH, depthMm: 3.875 * MM_PER_INCH, thicknessClass: 'standard', weightKg: 2.9 },
    ...(block ? blockFields(block) : {}),
    joint: { kind: 'spacer', jointMm: defaultJointMm('spacer') },
    segments: [{ kind: 'straight', lengthMm: 48 * MM_PER_INCH }],
    freeEnds: { start: false, end: false, top: false },
    exposure: 'interior',
    wetArea: false,
  }
}

export function newSegment(kind: Segment['kind'], wall: Pick<Wall, 'sizing' | 'block' | 'joint' | 'blockOnEnd'>): Segment {
  if (kind === 'corner') return { kind: 'corner', direction: 'left' }
  if (kind === 'curved') {
    const face = wall.blockOnEnd ? wall.block.faceHeightMm : wall.block.faceWidthMm
    return { kind: 'curved', insideRadiusMm: workableRadiusMm(face, wall.block.depthMm, resolveJoint(wall.joint)), arcAngleDeg: 90, direction: 'left' }
  }
  return wall.sizing === 'opening' ? { kind: 'straight', lengthMm: 48 * MM_PER_INCH } : { kind: 'straight', blocks: 6 }
}

export function emptyTakeoff(name = ''): Takeoff {
  return { name, walls: [], looseLines: [] }
}

/**
 * Switching opening ↔ count keeps the wall the same size: the block counts the layout found, or the
 * rough opening those blocks need (n × module + one joint, common practice).
 */
export function switchSizing(wall: Wall, result: WallResult | undefined): Wall {
  const laid = result?.status === 'ok' ? result.geometry : undefined
  const joint = wall.joint.jointMm
  if (wall.sizing === 'opening') {
    const segments = wall.segments.map((s, i): Segment => {
      if (s.kind !== 'straight') return s
      const blocks = laid?.segments[i]?.blocks ?? 6
      return { kind: 'straight', blocks }
    })
    return { ...wall, sizing: 'count', heightMm: undefined, courses: laid?.courses ?? 10, segments }
  }
  const module = wall.block.faceWidthMm + joint
  const segments = wall.segments.map((s): Segment =>
    s.kind === 'straight' ? { kind: 'straight', lengthMm: (s.blocks ?? 6) * module + joint } : s)
  const courses = wall.courses ?? 10
  return { ...wall, sizing: 'opening', courses: undefined, heightMm: courses * (wall.block.faceHeightMm + joint) + joint, segments }
}
