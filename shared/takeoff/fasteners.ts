// Where fixings go: panel anchors in the joints at the jambs and head of mortar panels, screws through
// each section's jamb edge, and which bed joints carry joint reinforcement.
import { MM_PER_INCH } from '../units.js'
import type { SectionPlan } from './sections.js'
import type { WallGeometry } from './wallLayout.js'

/** Panel anchors at most 16 in on centre at jambs and head (IRC 2021 R607.5.2.1, from memory). */
export const ANCHOR_SPACING_MM = 16 * MM_PER_INCH
/** Joint reinforcement at most 16 in on centre vertically (IRC 2021 R607.9, from memory). */
export const REINFORCEMENT_SPACING_MM = 16 * MM_PER_INCH
/** Screws per section edge that meets a jamb (common practice). */
export const SCREWS_PER_JAMB_CONTACT = 2

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

/** Mortar panels: anchors at jambs that are framed and across a framed head. */
export function panelAnchors(
  geometry: WallGeometry,
  freeEnds: { start: boolean; end: boolean },
  spacingMm = ANCHOR_SPACING_MM,
): Fixing[] {
  if (geometry.joint.kind !== 'mortar') return []
  const fixings: Fixing[] = []
  const up = spacedJoints(bedJointCentres(geometry), geometry.panelHeightMm, spacingMm)
  if (!freeEnds.start) up.forEach((y) => fixings.push({ kind: 'anchor', side: 'start', xMm: 0, yMm: y }))
  if (!freeEnds.end) up.forEach((y) => fixings.push({ kind: 'anchor', side: 'end', xMm: geometry.panelWidthMm, yMm: y }))
  if (geometry.headFramed) {
    spacedJoints(headJointCentres(geometry), geometry.panelWidthMm, spacingMm).forEach((x) =>
      fixings.push({ kind: 'anchor', side: 'head', xMm: x, yMm: geometry.panelHeightMm }),
    )
  }
  return fixings
}

/** Screws through each section's edge where it meets a framed jamb, spread over that edge's height. */
export function jambScrews(
  geometry: WallGeometry,
  plan: SectionPlan,
  freeEnds: { start: boolean; end: boolean },
  perContact = SCREWS_PER_JAMB_CONTACT,
): Fixing[] {
  const lastColumn = geometry.blocksAcross - 1
  const jambs: { side: FixingSide; column: number; x: number }[] = []
  if (!freeEnds.start) jambs.push({ side: 'start', column: 0, x: 0 })
  if (!freeEnds.end) jambs.push({ side: 'end', column: lastColumn, x: geometry.panelWidthMm })
  const fixings: Fixing[] = []
  for (const section of plan.sections) {
    for (const jamb of jambs) {
      const courses = section.cells.filter((c) => c.column === jamb.column).map((c) => c.course)
      if (courses.length === 0) continue
      const bottom = Math.min(...courses) * geometry.moduleUpMm
      const height = (Math.max(...courses) + 1) * geometry.moduleUpMm - geometry.joint.jointMm - bottom
      for (let i = 0; i < perContact; i++) {
        const yMm = bottom + ((i + 0.5) * height) / perContact
        fixings.push({ kind: 'screw', side: jamb.side, xMm: jamb.x, yMm, section: section.index })
      }
    }
  }
  return fixings
}

/** Mortar panels: the bed joints that carry joint reinforcement. */
export function reinforcedBedJoints(geometry: WallGeometry, spacingMm = REINFORCEMENT_SPACING_MM): number[] {
  if (geometry.joint.kind !== 'mortar') return []
  return spacedJoints(bedJointCentres(geometry), geometry.panelHeightMm, spacingMm)
}
