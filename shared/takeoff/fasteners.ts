// Where fixings go: anchors (mortar panels) or screws (spacer systems) in the joints along every fixed
// jamb and head at no more than a set spacing, whatever the sections; and which bed joints carry joint
// reinforcement.
import { MM_PER_INCH } from '../units.js'
import type { WallGeometry } from './wallLayout.js'

/**
 * Fixings at most 16 in on centre along jambs and head: panel anchors in mortar panels (IRC 2021
 * R607.5.2.1, from memory), and the same default for spacer systems, whose makers set their own
 * (common practice).
 */
export const FIXING_SPACING_MM = 16 * MM_PER_INCH
/** Joint reinforcement at most 16 in on centre vertically (IRC 2021 R607.9, from memory). */
export const REINFORCEMENT_SPACING_MM = 16 * MM_PER_INCH

export type FixingSide = 'start' | 'end' | 'head'

export interface Fixing {
  kind: 'anchor' | 'screw'
  side: FixingSide
  /** Along the developed run from the panel's start, mm. */
  xMm: number
  /** Up from the bottom of the panel, mm. */
  yMm: number
  section?: number
}

/**
 * Picks joints (centres given in order) so no gap, counting from 0 and to `lengthMm`, exceeds
 * `maxSpacingMm`; takes the farthest joint that still keeps the gap, and at least one joint when any exists.
 */
export function spacedJoints(jointCentres: number[], lengthMm: number, maxSpacingMm: number): number[] {
  const chosen: number[] = []
  let last = 0
  let i = 0
  while (lengthMm - last > maxSpacingMm + 1e-9 && i < jointCentres.length) {
    let next = i
    while (next + 1 < jointCentres.length && jointCentres[next + 1] <= last + maxSpacingMm + 1e-9) next++
    chosen.push(jointCentres[next])
    last = jointCentres[next]
    i = next + 1
  }
  if (chosen.length === 0 && jointCentres.length > 0) chosen.push(jointCentres[Math.floor((jointCentres.length - 1) / 2)])
  return chosen
}

/** Centres of the bed joints between courses, measured up from the panel bottom. */
export function bedJointCentres(geometry: WallGeometry): number[] {
  return Array.from(
    { length: Math.max(0, geometry.courses - 1) },
    (_, k) => (k + 1) * geometry.moduleUpMm - geometry.joint.jointMm / 2,
  )
}

/** Centres of the head joints between columns along the developed run. */
export function headJointCentres(geometry: WallGeometry): number[] {
  return geometry.columns.slice(0, -1).map((c) => c.xMm + c.faceMm + c.jointAfterMm / 2)
}

/**
 * Fixings along each fixed edge: both jambs when framed, and the head when framed, in the joints, so that
 * no gap, from either end of the edge or between neighbours, passes the spacing. Anchors in a mortar
 * panel, screws in a spacer system; the sections do not move them.
 */
export function edgeFixings(
  geometry: WallGeometry,
  freeEnds: { start: boolean; end: boolean },
  spacingMm = FIXING_SPACING_MM,
): Fixing[] {
  const kind: Fixing['kind'] = geometry.joint.kind === 'mortar' ? 'anchor' : 'screw'
  const fixings: Fixing[] = []
  const up = spacedJoints(bedJointCentres(geometry), geometry.panelHeightMm, spacingMm)
  if (!freeEnds.start) up.forEach((y) => fixings.push({ kind, side: 'start', xMm: 0, yMm: y }))
  if (!freeEnds.end) up.forEach((y) => fixings.push({ kind, side: 'end', xMm: geometry.panelWidthMm, yMm: y }))
  if (geometry.headFramed) {
    spacedJoints(headJointCentres(geometry), geometry.panelWidthMm, spacingMm).forEach((x) =>
      fixings.push({ kind, side: 'head', xMm: x, yMm: geometry.panelHeightMm }),
    )
  }
  return fixings
}

/** The largest gap along one edge: from its start to the first fixing, between neighbours, to its end. */
export function largestGap(positions: number[], lengthMm: number): number {
  const sorted = [...positions].sort((a, b) => a - b)
  let last = 0
  let largest = 0
  for (const p of [...sorted, lengthMm]) {
    largest = Math.max(largest, p - last)
    last = p
  }
  return largest
}

/** Mortar panels: the bed joints that carry joint reinforcement. */
export function reinforcedBedJoints(geometry: WallGeometry, spacingMm = REINFORCEMENT_SPACING_MM): number[] {
  if (geometry.joint.kind !== 'mortar') return []
  return spacedJoints(bedJointCentres(geometry), geometry.panelHeightMm, spacingMm)
}
