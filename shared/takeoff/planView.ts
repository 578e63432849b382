// Plan (top) view of a wall's run: block footprints traced segment by segment. The pose follows the
// wall's left face; on a curve the blocks' inside corners sit on the layout circle, as in curve.ts.
import type { BlockSpec } from '../schemas/takeoff.js'
import { formatLength, type LengthUnit } from '../units.js'
import type { CurveLayout } from './curve.js'
import type { SegmentLayout } from './wallLayout.js'

export interface Point { x: number; y: number }

export interface PlanFootprint {
  corners: [Point, Point, Point, Point]
  segment: number
  kind: 'straight' | 'curved' | 'corner'
}

export interface PlanArc { centre: Point; radiusMm: number; startDeg: number; endDeg: number }
/** A label; a radius label keeps its length so a reader's unit can be applied when drawn. */
export interface PlanLabel { at: Point; text: string; radiusMm?: number }

export interface WallPlanView {
  footprints: PlanFootprint[]
  arcs: PlanArc[]
  labels: PlanLabel[]
  bounds: { minX: number; minY: number; maxX: number; maxY: number }
}

interface Pose { p: Point; heading: number }

const add = (a: Point, b: Point): Point => ({ x: a.x + b.x, y: a.y + b.y })
const scale = (a: Point, k: number): Point => ({ x: a.x * k, y: a.y * k })
const dir = (angle: number): Point => ({ x: Math.cos(angle), y: Math.sin(angle) })
/** Unit vector to the right of a heading (the wall's depth runs this way from the left face). */
const rightOf = (heading: number): Point => dir(heading - Math.PI / 2)

function rectangle(p: Point, heading: number, length: number, depth: number): [Point, Point, Point, Point] {
  const along = scale(dir(heading), length)
  const across = scale(rightOf(heading), depth)
  return [p, add(p, along), add(add(p, along), across), add(p, across)]
}

function traceStraight(pose: Pose, blocks: number, block: BlockSpec, joint: number, segment: number, out: PlanFootprint[]): Pose {
  let p = pose.p
  for (let i = 0; i < blocks; i++) {
    out.push({ corners: rectangle(p, pose.heading, block.faceWidthMm, block.depthMm), segment, kind: 'straight' })
    p = add(p, scale(dir(pose.heading), block.faceWidthMm + joint))
  }
  return { p, heading: pose.heading }
}

/** A corner unit (90°) or angle unit (45°): drawn as a t × t square, the run turning by its angle after it. */
function traceCorner(pose: Pose, turn: 'left' | 'right', angleDeg: number, block: BlockSpec, joint: number, segment: number, out: PlanFootprint[]): Pose {
  const t = block.depthMm
  const a = (angleDeg * Math.PI) / 180
  out.push({ corners: rectangle(pose.p, pose.heading, t, t), segment, kind: 'corner' })
  if (turn === 'left') {
    const heading = pose.heading + a
    const start = angleDeg === 90 ? pose.p : add(pose.p, scale(dir(pose.heading), t))
    return { p: add(start, scale(dir(heading), joint)), heading }
  }
  const heading = pose.heading - a
  const outer = add(add(pose.p, scale(dir(pose.heading), t)), scale(rightOf(pose.heading), angleDeg === 90 ? t : 0))
  return { p: add(outer, scale(dir(heading), joint)), heading }
}

interface CurveTrace { pose: Pose; arc: PlanArc; labels: PlanLabel[] }

function traceCurve(pose: Pose, curve: CurveLayout, block: BlockSpec, segment: number, unit: LengthUnit, out: PlanFootprint[]): CurveTrace {
  const s = curve.direction === 'left' ? 1 : -1
  const R = curve.insideRadiusMm
  const t = block.depthMm
  const alpha = (curve.blockAngleDeg * Math.PI) / 180
  const theta = (curve.anglePerBlockDeg * Math.PI) / 180
  // Inside face: the left face on a left turn, the right face on a right turn.
  const inside = s > 0 ? pose.p : add(pose.p, scale(rightOf(pose.heading), t))
  const centre = add(inside, scale(dir(pose.heading + s * (Math.PI / 2)), R))
  const start = pose.heading - s * (Math.PI / 2)
  const onCircle = (angle: number) => add(centre, scale(dir(angle), R))
  for (let k = 0; k < curve.blocks; k++) {
    const a = onCircle(start + s * k * theta)
    const b = onCircle(start + s * (k * theta + alpha))
    const outward = dir(start + s * (k * theta + alpha / 2))
    const corners: [Point, Point, Point, Point] = [a, b, add(b, scale(outward, t)), add(a, scale(outward, t))]
    out.push({ corners, segment, kind: 'curved' })
  }
  const end = start + s * curve.blocks * theta
  const heading = pose.heading + s * curve.blocks * theta
  const endInside = onCircle(end)
  const p = s > 0 ? endInside : add(endInside, scale(rightOf(heading), -t))
  const mid = start + (s * curve.blocks * theta) / 2
  const toDeg = (r: number) => (r * 180) / Math.PI
  return {
    pose: { p, heading },
    arc: { centre, radiusMm: R, startDeg: toDeg(Math.min(start, end)), endDeg: toDeg(Math.max(start, end)) },
    labels: [
      { at: add(centre, scale(dir(mid), R * 0.5)), text: `R ${formatLength(R, unit)}`, radiusMm: R },
      { at: centre, text: `${curve.builtAngleDeg.toFixed(1)}° · ${curve.blocks} blocks` },
    ],
  }
}

function boundsOf(points: Point[]): WallPlanView['bounds'] {
  const xs = points.map((p) => p.x)
  const ys = points.map((p) => p.y)
  return { minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) }
}

/** Footprints of every block in one course, the inside layout arcs and their labels. */
export function buildPlanView(segments: SegmentLayout[], block: BlockSpec, jointMm: number, unit: LengthUnit): WallPlanView {
  const footprints: PlanFootprint[] = []
  const arcs: PlanArc[] = []
  const labels: PlanLabel[] = []
  let pose: Pose = { p: { x: 0, y: 0 }, heading: 0 }
  for (const segment of segments) {
    if (segment.kind === 'straight') pose = traceStraight(pose, segment.blocks, block, jointMm, segment.index, footprints)
    else if (segment.kind === 'corner') pose = traceCorner(pose, segment.direction, segment.angleDeg, block, jointMm, segment.index, footprints)
    else {
      const traced = traceCurve(pose, segment.curve, block, segment.index, unit, footprints)
      pose = traced.pose
      arcs.push(traced.arc)
      labels.push(...traced.labels)
    }
  }
  const points = [...footprints.flatMap((f) => f.corners), ...labels.map((l) => l.at)]
  return { footprints, arcs, labels, bounds: boundsOf(points) }
}
