// Curved runs: rectangular blocks (face w, depth t) set with their inside corners on a circle of radius R,
// inside joint ji between neighbours. Corner geometry gives everything exactly:
//   angle per block  θ = 2·asin(w / 2R) + 2·asin(ji / 2R)
//   outside joint    jo = ji + 2·t·sin(θ / 2)          (the small-angle form is jo ≈ ji + t·θ)
//   radius from θ    d = (ji + w·cos(θ/2)) / (2·sin(θ/2)),  R = √(d² + (w/2)²)
// where d is the distance from the centre to a block's inside face.
import type { BlockSpec, CurvedSegment, TurnDirection } from '../schemas/takeoff.js'
import { formatLength, type LengthUnit } from '../units.js'
import { FIT_TOLERANCE, type ResolvedJoint } from './geometry.js'

const DEG = 180 / Math.PI

export function blockAngleRad(faceWidthMm: number, insideRadiusMm: number): number {
  return 2 * Math.asin(faceWidthMm / (2 * insideRadiusMm))
}

export function jointAngleRad(jointMm: number, insideRadiusMm: number): number {
  return 2 * Math.asin(jointMm / (2 * insideRadiusMm))
}

/** Angle one block and one joint turn, with inside corners on the layout circle. */
export function anglePerBlockRad(faceWidthMm: number, insideJointMm: number, insideRadiusMm: number): number {
  return blockAngleRad(faceWidthMm, insideRadiusMm) + jointAngleRad(insideJointMm, insideRadiusMm)
}

/** Gap between neighbours' outside corners when the blocks turn θ each. */
export function outsideJointMm(insideJointMm: number, depthMm: number, anglePerBlock: number): number {
  return insideJointMm + 2 * depthMm * Math.sin(anglePerBlock / 2)
}

/** Distance from the centre to a block's outside corners. */
export function outsideCornerRadiusMm(faceWidthMm: number, depthMm: number, insideRadiusMm: number): number {
  const insideFace = Math.sqrt(insideRadiusMm ** 2 - (faceWidthMm / 2) ** 2)
  return Math.hypot(insideFace + depthMm, faceWidthMm / 2)
}

/** The inside radius at which blocks turn exactly θ each (inverse of anglePerBlockRad). */
export function radiusForAnglePerBlock(faceWidthMm: number, insideJointMm: number, anglePerBlock: number): number {
  const half = anglePerBlock / 2
  const insideFace = (insideJointMm + faceWidthMm * Math.cos(half)) / (2 * Math.sin(half))
  return Math.hypot(insideFace, faceWidthMm / 2)
}

/** Largest turn per block before the outside joint passes its limit: sin(θ/2) = (jo − ji) / 2t. */
export function maxAnglePerBlockRad(depthMm: number, insideJointMm: number, maxOutsideJointMm: number): number {
  const s = (maxOutsideJointMm - insideJointMm) / (2 * depthMm)
  return s >= 1 ? Math.PI : 2 * Math.asin(s)
}

/** Tightest inside radius the block and joint limits allow, exact from corner geometry. */
export function minInsideRadiusMm(
  faceWidthMm: number,
  depthMm: number,
  insideJointMm: number,
  maxOutsideJointMm: number,
): number {
  const theta = maxAnglePerBlockRad(depthMm, insideJointMm, maxOutsideJointMm)
  return radiusForAnglePerBlock(faceWidthMm, insideJointMm, theta)
}

/** Small-angle estimate from arc lengths: R ≈ (w + ji)·t / (jo − ji). */
export function approxMinInsideRadiusMm(
  faceWidthMm: number,
  depthMm: number,
  insideJointMm: number,
  maxOutsideJointMm: number,
): number {
  return ((faceWidthMm + insideJointMm) * depthMm) / (maxOutsideJointMm - insideJointMm)
}

export interface CurveLayout {
  ok: true
  direction: TurnDirection
  insideRadiusMm: number
  outsideRadiusMm: number
  insideJointMm: number
  outsideJointMm: number
  maxOutsideJointMm: number
  blockAngleDeg: number
  jointAngleDeg: number
  anglePerBlockDeg: number
  /** The arc as asked (from angle, inside length or blocks). */
  requestedAngleDeg: number
  blocks: number
  builtAngleDeg: number
  /** How far the whole-block arc runs past the one asked for. */
  overshootDeg: number
  /** Radius at which the same blocks close the asked arc exactly (only when rounding added some). */
  radiusForExactArcMm?: number
  insideArcMm: number
  /** Length along the run for the developed elevation: faces plus mean joints. */
  developedLengthMm: number
  minInsideRadiusMm: number
  approx: { anglePerBlockDeg: number; outsideJointMm: number; minInsideRadiusMm: number }
  explanation: string[]
}

export interface CurveRefusal {
  ok: false
  reason: string
  smallestRadiusMm: number
}

function requestedAngleRad(segment: CurvedSegment, anglePerBlock: number): number {
  if (segment.arcAngleDeg !== undefined) return segment.arcAngleDeg / DEG
  if (segment.arcLengthMm !== undefined) return segment.arcLengthMm / segment.insideRadiusMm
  return (segment.blocks ?? 0) * anglePerBlock
}

function refusal(
  segment: CurvedSegment,
  block: BlockSpec,
  joint: ResolvedJoint,
  smallest: number,
  unit: LengthUnit,
): CurveRefusal {
  const R = segment.insideRadiusMm
  const show = (mm: number) => formatLength(mm, unit)
  const theta = R > block.faceWidthMm / 2 ? anglePerBlockRad(block.faceWidthMm, joint.curveInsideJointMm, R) : NaN
  const jo = outsideJointMm(joint.curveInsideJointMm, block.depthMm, theta)
  const why = Number.isFinite(jo)
    ? `the outside joint would open to ${show(jo)}, past the ${show(joint.maxOutsideJointMm)} allowed (${joint.sources.maxOutsideJoint})`
    : 'the circle is smaller than one block'
  // Round the named radius up so the size we suggest really works.
  const named = formatLength(smallest, unit, { rounding: 'up' })
  return {
    ok: false,
    smallestRadiusMm: smallest,
    reason:
      `An inside radius of ${show(R)} is tighter than ${block.nominal} blocks with a ${show(joint.curveInsideJointMm)} ` +
      `inside joint can turn: ${why}. The smallest inside radius that works is ${named}.`,
  }
}

/** Whole blocks for a curved segment, the joints that result, or a refusal naming the radius that works. */
export function planCurvedSegment(
  segment: CurvedSegment,
  block: BlockSpec,
  joint: ResolvedJoint,
  unit: LengthUnit,
): CurveLayout | CurveRefusal {
  const w = block.faceWidthMm
  const t = block.depthMm
  const ji = joint.curveInsideJointMm
  const R = segment.insideRadiusMm
  const smallest = minInsideRadiusMm(w, t, ji, joint.maxOutsideJointMm)
  if (R < smallest * (1 - 1e-12)) return refusal(segment, block, joint, smallest, unit)
  const theta = anglePerBlockRad(w, ji, R)
  const requested = requestedAngleRad(segment, theta)
  const blocks = segment.blocks ?? Math.max(1, Math.ceil(requested / theta - FIT_TOLERANCE))
  const built = blocks * theta
  const jo = outsideJointMm(ji, t, theta)
  const rounded = built - requested > 1e-9
  const layout: CurveLayout = {
    ok: true,
    direction: segment.direction,
    insideRadiusMm: R,
    outsideRadiusMm: outsideCornerRadiusMm(w, t, R),
    insideJointMm: ji,
    outsideJointMm: jo,
    maxOutsideJointMm: joint.maxOutsideJointMm,
    blockAngleDeg: blockAngleRad(w, R) * DEG,
    jointAngleDeg: jointAngleRad(ji, R) * DEG,
    anglePerBlockDeg: theta * DEG,
    requestedAngleDeg: requested * DEG,
    blocks,
    builtAngleDeg: built * DEG,
    overshootDeg: (built - requested) * DEG,
    radiusForExactArcMm: rounded ? radiusForAnglePerBlock(w, ji, requested / blocks) : undefined,
    insideArcMm: R * built,
    developedLengthMm: blocks * (w + (ji + jo) / 2),
    minInsideRadiusMm: smallest,
    approx: {
      anglePerBlockDeg: ((w + ji) / R) * DEG,
      outsideJointMm: ji + (t * (w + ji)) / R,
      minInsideRadiusMm: approxMinInsideRadiusMm(w, t, ji, joint.maxOutsideJointMm),
    },
    explanation: [],
  }
  layout.explanation = explainCurve(layout, segment, block, unit)
  return layout
}

function explainCurve(c: CurveLayout, segment: CurvedSegment, block: BlockSpec, unit: LengthUnit): string[] {
  const show = (mm: number) => formatLength(mm, unit)
  const deg = (d: number) => `${d.toFixed(2)}°`
  const lines = [
    `Each block turns ${deg(c.anglePerBlockDeg)}: 2·asin(w/2R) + 2·asin(ji/2R) with w = ${show(block.faceWidthMm)}, ` +
      `ji = ${show(c.insideJointMm)}, R = ${show(c.insideRadiusMm)}.`,
    `Outside joint ji + 2·t·sin(θ/2) = ${show(c.outsideJointMm)} (t = ${show(block.depthMm)}; ` +
      `limit ${show(c.maxOutsideJointMm)}).`,
  ]
  if (segment.blocks !== undefined) {
    lines.push(`${c.blocks} blocks turn ${deg(c.builtAngleDeg)}.`)
  } else {
    const ratio = c.requestedAngleDeg / c.anglePerBlockDeg
    lines.push(
      `${deg(c.requestedAngleDeg)} ÷ ${deg(c.anglePerBlockDeg)} = ${ratio.toFixed(2)} → ${c.blocks} blocks ` +
        `(rounded up to whole blocks; the built arc is ${deg(c.builtAngleDeg)}).`,
    )
  }
  if (c.radiusForExactArcMm !== undefined) {
    lines.push(`To close exactly ${deg(c.requestedAngleDeg)} with ${c.blocks} blocks, lay out R = ${show(c.radiusForExactArcMm)}.`)
  }
  lines.push(`The tightest inside radius for these limits is ${formatLength(c.minInsideRadiusMm, unit, { rounding: 'up' })}.`)
  return lines
}
