// Curved runs: rectangular blocks (face w, depth t) set with their inside corners on a circle of radius R,
// inside joint ji between neighbours. Corner geometry gives everything exactly:
//   angle per block  θ = 2·asin(w / 2R) + 2·asin(ji / 2R)
//   outside joint    jo = ji + 2·t·sin(θ / 2)          (the small-angle form is jo ≈ ji + t·θ)
//   radius from θ    d = (ji + w·cos(θ/2)) / (2·sin(θ/2)),  R = √(d² + (w/2)²)
// where d is the distance from the centre to a block's inside face.
import type { BlockSpec, CurveClosing, CurvedSegment, TurnDirection } from '../schemas/takeoff.js'
import { formatLength, MM_PER_INCH, type LengthUnit } from '../units.js'
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

/**
 * A starting radius a block can turn, for a new curved segment: 60 in, or the block's smallest inside
 * radius rounded up to the next whole inch when that is larger (an 8x8 unit with 1/8 in inside and 5/8 in
 * outside joints needs 61 1/16 in, so it starts at 62 in).
 */
export function workableRadiusMm(faceWidthMm: number, depthMm: number, joint: ResolvedJoint): number {
  const smallest = minInsideRadiusMm(faceWidthMm, depthMm, joint.curveInsideJointMm, joint.maxOutsideJointMm)
  return Math.max(60, Math.ceil(smallest / MM_PER_INCH - 1e-9)) * MM_PER_INCH
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

/** One way to close the arc asked for when whole blocks do not close it at the radius given. */
export interface CurveClosingOption {
  closing: CurveClosing
  blocks: number
  insideRadiusMm: number
  insideJointMm: number
  outsideJointMm: number
  builtAngleDeg: number
  /** False when the joints would pass their limits (one block fewer can open them too far). */
  withinLimits: boolean
}

export interface CurveLayout {
  ok: true
  direction: TurnDirection
  /** The radius the blocks are laid to: the one entered, or the one that closes the arc exactly. */
  insideRadiusMm: number
  enteredRadiusMm: number
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
  /** The ways to close the asked arc, when whole blocks at the entered radius overshoot it. */
  closings?: CurveClosingOption[]
  /** The way applied: the clerk's choice, or 'overshoot' until one is made. */
  closing?: CurveClosing
  /** Whether the clerk chose the way (false: the overshoot is applied until they do). */
  closingChosen: boolean
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
  /** A stable name for the refusal and its figures, so a screen can word it in the user's language. */
  key: 'radius_too_tight' | 'closing_joints_over_limit'
  params: Record<string, string | number>
  smallestRadiusMm: number
}

/** A radius named by rounding up to 1/16 in or 0.1 mm may sit a hair under the exact smallest; accept it. */
export const RADIUS_TOLERANCE_MM = 1e-6

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
    key: 'radius_too_tight',
    params: {
      radiusMm: R,
      smallestRadiusMm: smallest,
      nominal: block.nominal,
      insideJointMm: joint.curveInsideJointMm,
      maxOutsideJointMm: joint.maxOutsideJointMm,
      ...(Number.isFinite(jo) ? { outsideJointMm: jo } : {}),
    },
    smallestRadiusMm: smallest,
    reason:
      `An inside radius of ${show(R)} is tighter than ${block.nominal} blocks with a ${show(joint.curveInsideJointMm)} ` +
      `inside joint can turn: ${why}. The smallest inside radius that works is ${named}.`,
  }
}

/**
 * The three ways to close an arc that n whole blocks overshoot at radius R:
 * - radius: n blocks each turning arc/n, laid to R' = radiusForAnglePerBlock(w, ji, arc/n) (R' > R);
 * - joints: n − 1 blocks at R, each turning arc/(n − 1): the inside joint opens to ji' = 2R·sin((θ' − α)/2),
 *   α = 2·asin(w/2R) the block's own angle, and the outside joint to ji' + 2t·sin(θ'/2);
 * - overshoot: n blocks at R, the built arc n·θ a little past the one asked for.
 */
export function closingOptions(
  w: number,
  t: number,
  joint: ResolvedJoint,
  R: number,
  requested: number,
  n: number,
): CurveClosingOption[] {
  const ji = joint.curveInsideJointMm
  const theta = anglePerBlockRad(w, ji, R)
  const exact = requested / n
  const options: CurveClosingOption[] = [{
    closing: 'radius',
    blocks: n,
    insideRadiusMm: radiusForAnglePerBlock(w, ji, exact),
    insideJointMm: ji,
    outsideJointMm: outsideJointMm(ji, t, exact),
    builtAngleDeg: requested * DEG,
    withinLimits: true,
  }]
  if (n > 1) {
    const wider = requested / (n - 1)
    const insideJoint = 2 * R * Math.sin((wider - blockAngleRad(w, R)) / 2)
    const outside = outsideJointMm(insideJoint, t, wider)
    options.push({
      closing: 'joints',
      blocks: n - 1,
      insideRadiusMm: R,
      insideJointMm: insideJoint,
      outsideJointMm: outside,
      builtAngleDeg: requested * DEG,
      withinLimits: outside <= joint.maxOutsideJointMm + 1e-9 && insideJoint <= joint.maxOutsideJointMm + 1e-9,
    })
  }
  options.push({
    closing: 'overshoot',
    blocks: n,
    insideRadiusMm: R,
    insideJointMm: ji,
    outsideJointMm: outsideJointMm(ji, t, theta),
    builtAngleDeg: n * theta * DEG,
    withinLimits: true,
  })
  return options
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
  const R0 = segment.insideRadiusMm
  const smallest = minInsideRadiusMm(w, t, joint.curveInsideJointMm, joint.maxOutsideJointMm)
  if (R0 < smallest - RADIUS_TOLERANCE_MM) return refusal(segment, block, joint, smallest, unit)
  const theta0 = anglePerBlockRad(w, joint.curveInsideJointMm, R0)
  const requested = requestedAngleRad(segment, theta0)
  const n = segment.blocks ?? Math.max(1, Math.ceil(requested / theta0 - FIT_TOLERANCE))
  const closings = segment.blocks === undefined && n * theta0 - requested > 1e-9 ? closingOptions(w, t, joint, R0, requested, n) : undefined
  const closing = closings ? (segment.closing ?? 'overshoot') : undefined
  const applied = closings?.find((o) => o.closing === closing)
  if (applied && !applied.withinLimits) {
    const show = (mm: number) => formatLength(mm, unit)
    return {
      ok: false,
      key: 'closing_joints_over_limit',
      params: { blocks: applied.blocks, outsideJointMm: applied.outsideJointMm, insideJointMm: applied.insideJointMm, maxOutsideJointMm: joint.maxOutsideJointMm },
      smallestRadiusMm: smallest,
      reason:
        `Closing the arc with ${applied.blocks} blocks at this radius opens the joints to ${show(applied.insideJointMm)} inside and ` +
        `${show(applied.outsideJointMm)} outside, past the ${show(joint.maxOutsideJointMm)} allowed. Choose another way to close the arc.`,
    }
  }
  const R = applied?.insideRadiusMm ?? R0
  const ji = applied?.insideJointMm ?? joint.curveInsideJointMm
  const blocks = applied?.blocks ?? n
  const theta = closing === 'radius' || closing === 'joints' ? requested / blocks : theta0
  const built = blocks * theta
  const jo = outsideJointMm(ji, t, theta)
  const layout: CurveLayout = {
    ok: true,
    direction: segment.direction,
    insideRadiusMm: R,
    enteredRadiusMm: R0,
    outsideRadiusMm: outsideCornerRadiusMm(w, t, R),
    insideJointMm: ji,
    outsideJointMm: jo,
    maxOutsideJointMm: joint.maxOutsideJointMm,
    blockAngleDeg: blockAngleRad(w, R) * DEG,
    jointAngleDeg: (theta - blockAngleRad(w, R)) * DEG,
    anglePerBlockDeg: theta * DEG,
    requestedAngleDeg: requested * DEG,
    blocks,
    builtAngleDeg: built * DEG,
    overshootDeg: (built - requested) * DEG,
    closings,
    closing,
    closingChosen: closings !== undefined && segment.closing !== undefined,
    insideArcMm: R * built,
    developedLengthMm: blocks * (w + (ji + jo) / 2),
    minInsideRadiusMm: smallest,
    approx: {
      anglePerBlockDeg: ((w + ji) / R) * DEG,
      outsideJointMm: ji + (t * (w + ji)) / R,
      minInsideRadiusMm: approxMinInsideRadiusMm(w, t, joint.curveInsideJointMm, joint.maxOutsideJointMm),
    },
    explanation: [],
  }
  layout.explanation = explainCurve(layout, segment, block, unit)
  return layout
}

const CLOSING_WORDS: Record<CurveClosing, string> = {
  radius: 'laid to the radius at which the blocks close the arc exactly',
  joints: 'one block fewer, the joints opened to close the arc at the radius entered',
  overshoot: 'the radius entered, the built arc a little past the one asked for',
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
  } else if (c.closings && c.closing) {
    const atEntered = c.closings.find((o) => o.closing === 'overshoot') as CurveClosingOption
    lines.push(
      `At ${show(c.enteredRadiusMm)}, ${deg(c.requestedAngleDeg)} needs ${atEntered.blocks} whole blocks, which build ` +
        `${deg(atEntered.builtAngleDeg)}. Closed as chosen: ${CLOSING_WORDS[c.closing]}${c.closingChosen ? '' : ' (until a way is chosen)'}.`,
    )
  } else {
    lines.push(`${deg(c.requestedAngleDeg)} ÷ ${deg(c.anglePerBlockDeg)} = ${c.blocks} whole blocks; the arc closes exactly.`)
  }
  lines.push(`The tightest inside radius for these limits is ${formatLength(c.minInsideRadiusMm, unit, { rounding: 'up' })}.`)
  return lines
}
