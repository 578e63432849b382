// What a takeoff may ask for, and a quick count of the blocks a wall would take, read from the typed
// figures in a few steps per segment. The schema refuses anything past these limits before a single
// block is laid out, so no request (or keystroke in the editor) can set off an enormous computation.
import type { Wall } from '../schemas/takeoff.js'
import { MM_PER_FOOT, MM_PER_INCH } from '../units.js'
import { anglePerBlockRad } from './curve.js'
import { resolveJoint } from './geometry.js'

export const TAKEOFF_LIMITS = {
  /** Openings, heights, radii and arc lengths: nobody builds a glass block run over 100 ft. */
  lengthMm: 100 * MM_PER_FOOT,
  /** Block faces: the smallest units sold are about 4 in (115 mm); under 50 mm is a typing slip. */
  blockFaceMinMm: 50,
  blockFaceMaxMm: 24 * MM_PER_INCH,
  blockDepthMinMm: 50,
  blockDepthMaxMm: 300,
  walls: 200,
  segments: 24,
  /** Blocks given as a count in one segment, and courses given as a count. */
  blocksAcross: 2000,
  courses: 500,
  /**
   * Blocks in one wall: the largest panel the code allows (250 ft², IRC 2021 R607.4.3) holds about
   * 8,300 of the smallest units sold; a bigger wall is several panels.
   */
  blocksPerWall: 10_000,
  blocksPerTakeoff: 60_000,
} as const

export interface WallSizeEstimate {
  across: number
  courses: number
  blocks: number
}

/** Upper bound of the blocks across one segment, from the typed figures alone. */
function segmentBlocks(wall: Wall, index: number, faceMm: number, jointMm: number, insideJointMm: number): number {
  const segment = wall.segments[index]
  if (segment.kind === 'corner') return 1
  if (segment.blocks !== undefined) return segment.blocks
  if (segment.kind === 'straight') return Math.ceil((segment.lengthMm ?? 0) / (faceMm + jointMm))
  const R = segment.insideRadiusMm
  // A circle smaller than one block is refused by the layout; it holds no blocks.
  if (R <= faceMm / 2 || R <= insideJointMm / 2) return 1
  const requested = segment.arcAngleDeg !== undefined ? (segment.arcAngleDeg * Math.PI) / 180 : (segment.arcLengthMm ?? 0) / R
  return Math.ceil(requested / anglePerBlockRad(faceMm, insideJointMm, R)) + 1
}

/** Blocks across × courses a wall would take, at most; never lays anything out. */
export function estimateWallBlocks(wall: Wall): WallSizeEstimate {
  const joint = resolveJoint(wall.joint)
  const [faceMm, faceUpMm] = wall.blockOnEnd
    ? [wall.block.faceHeightMm, wall.block.faceWidthMm]
    : [wall.block.faceWidthMm, wall.block.faceHeightMm]
  let across = 0
  for (let i = 0; i < wall.segments.length; i++) across += segmentBlocks(wall, i, faceMm, joint.jointMm, joint.curveInsideJointMm)
  const courses = wall.courses ?? Math.ceil((wall.heightMm ?? 0) / (faceUpMm + joint.jointMm))
  return { across, courses, blocks: across * courses }
}
