// Straight-wall geometry: a block's module (actual face + one joint), fitting whole blocks into a rough
// opening, and the panel and rough opening that a given block count makes.
import type { JointSystem } from '../schemas/takeoff.js'
import { MM_PER_INCH } from '../units.js'

/** Float noise allowance when counting whole blocks: 1e-9 of a block is nothing physical. */
export const FIT_TOLERANCE = 1e-9

/** Joint widths the checks rely on, in mm. */
export const JOINT_FACTS = {
  /** Spacer systems: 1/8 in joint (common practice). */
  spacerJointMm: MM_PER_INCH / 8,
  /** Mortar head and bed joints: 1/4 in (IRC 2021 R607.10). */
  mortarJointMm: MM_PER_INCH / 4,
  /** Metric blocks: 10 mm joints (common practice). */
  metricJointMm: 10,
  /** Curved mortar panels: radial joints 1/8 in to 5/8 in (IRC 2021 R607.10, from memory). */
  radialMinMm: MM_PER_INCH / 8,
  radialMaxMm: (MM_PER_INCH * 5) / 8,
  /** Expansion joints at jambs and head: at least 3/8 in (IRC 2021 R607.7, from memory). */
  expansionMinMm: (MM_PER_INCH * 3) / 8,
} as const

export interface ResolvedJoint {
  kind: JointSystem['kind']
  jointMm: number
  curveInsideJointMm: number
  maxOutsideJointMm: number
  expansionMm: number
  /** Where each defaulted value came from, for explanations. */
  sources: { curveInsideJoint: string; maxOutsideJoint: string; expansion: string }
}

/** Fills the joint system's optional values with code or common-practice defaults, saying which. */
export function resolveJoint(joint: JointSystem): ResolvedJoint {
  const mortar = joint.kind === 'mortar'
  const given = 'entered on the wall'
  return {
    kind: joint.kind,
    jointMm: joint.jointMm,
    curveInsideJointMm: joint.curveInsideJointMm ?? (mortar ? JOINT_FACTS.radialMinMm : joint.jointMm),
    maxOutsideJointMm: joint.maxOutsideJointMm ?? JOINT_FACTS.radialMaxMm,
    expansionMm: joint.expansionMm ?? JOINT_FACTS.expansionMinMm,
    sources: {
      curveInsideJoint:
        joint.curveInsideJointMm !== undefined
          ? given
          : mortar
            ? 'IRC 2021 R607.10 smallest radial joint, 1/8 in'
            : 'the system joint',
      maxOutsideJoint:
        joint.maxOutsideJointMm !== undefined
          ? given
          : mortar
            ? 'IRC 2021 R607.10 widest radial joint, 5/8 in'
            : 'assumed 5/8 in; set it from the spacer maker',
      expansion: joint.expansionMm !== undefined ? given : 'IRC 2021 R607.7, at least 3/8 in',
    },
  }
}

/** Inch blocks are sold by nominal size; the actual face is 1/4 in less (common practice). */
export function actualFaceFromNominalInches(nominalInches: number): number {
  return (nominalInches - 0.25) * MM_PER_INCH
}

/** The repeat distance of blocks laid in a line: one actual face plus one joint. */
export function moduleMm(faceMm: number, jointMm: number): number {
  return faceMm + jointMm
}

export interface OpeningFit {
  blocks: number
  /** Blocks and joints, one joint more than blocks: n × module + joint. */
  usedMm: number
  /** What the expansion strip or channel takes up. */
  leftoverMm: number
}

/** Whole blocks that fit an opening with a joint at each side: n = floor((opening − joint) / module). */
export function fitOpening(openingMm: number, faceMm: number, jointMm: number): OpeningFit {
  const module = moduleMm(faceMm, jointMm)
  const blocks = Math.max(0, Math.floor((openingMm - jointMm) / module + FIT_TOLERANCE))
  const usedMm = blocks * module + jointMm
  return { blocks, usedMm, leftoverMm: openingMm - usedMm }
}

/** Finished panel size of n blocks: n × module − one joint (no joint beyond the last block). */
export function panelFromCount(blocks: number, faceMm: number, jointMm: number): number {
  return blocks * moduleMm(faceMm, jointMm) - jointMm
}

/**
 * Space left at a jamb or framed head: the expansion allowance (R607.7), but never less than one joint,
 * so the opening rule (n × module + joint) takes back the same count (10 mm metric joints exceed 3/8 in).
 */
export function edgeAllowanceMm(expansionMm: number, jointMm: number): number {
  return Math.max(expansionMm, jointMm)
}

/** Rough opening width to frame: the panel plus the edge allowance at each jamb. */
export function roughOpeningWidth(panelWidthMm: number, expansionMm: number, jointMm = 0): number {
  return panelWidthMm + 2 * edgeAllowanceMm(expansionMm, jointMm)
}

/** Rough opening height: the panel, one bed joint at the sill, and the edge allowance at a framed head. */
export function roughOpeningHeight(
  panelHeightMm: number,
  jointMm: number,
  expansionMm: number,
  headFramed: boolean,
): number {
  return panelHeightMm + jointMm + (headFramed ? edgeAllowanceMm(expansionMm, jointMm) : 0)
}

export interface CourseFit {
  courses: number
  panelHeightMm: number
  /** Opening sizing: height the head channel or expansion strip takes up. */
  leftoverMm?: number
  openingHeightMm?: number
  /** Count sizing: the rough opening height to frame. */
  roughOpeningHeightMm?: number
}

/** Courses from an opening height, or the panel height from a course count. */
export function fitCourses(
  input: { heightMm?: number; courses?: number },
  faceHeightMm: number,
  joint: ResolvedJoint,
  headFramed: boolean,
): CourseFit {
  if (input.heightMm !== undefined) {
    const fit = fitOpening(input.heightMm, faceHeightMm, joint.jointMm)
    return {
      courses: fit.blocks,
      panelHeightMm: fit.blocks > 0 ? panelFromCount(fit.blocks, faceHeightMm, joint.jointMm) : 0,
      leftoverMm: fit.leftoverMm,
      openingHeightMm: input.heightMm,
    }
  }
  const courses = input.courses ?? 0
  const panelHeightMm = panelFromCount(courses, faceHeightMm, joint.jointMm)
  return {
    courses,
    panelHeightMm,
    roughOpeningHeightMm: roughOpeningHeight(panelHeightMm, joint.jointMm, joint.expansionMm, headFramed),
  }
}
