// The quantities material rules multiply: joint intersections, lengths along the curb, jambs and head,
// section tops, fixing counts and joint volumes. Each measure says how it was found.
import type { CountMeasure, LengthMeasure, VolumeMeasure } from '../schemas/takeoff.js'
import { MM_PER_FOOT } from '../units.js'
import type { Fixing } from './fasteners.js'
import type { SectionPlan } from './sections.js'
import type { Column, WallGeometry } from './wallLayout.js'

export type MeasureName = CountMeasure | LengthMeasure | VolumeMeasure
export type WallMeasures = Record<MeasureName, number>

export interface MeasureInput {
  geometry: WallGeometry
  plan: SectionPlan
  anchors: Fixing[]
  screws: Fixing[]
  reinforcedJoints: number[]
  blockDepthMm: number
  /** Grout fill depth; the full block depth unless set (an upper bound). */
  groutDepthMm?: number
}

export interface MeasuredWall {
  measures: WallMeasures
  /** How each measure was found, for the explanation. */
  derivation: Partial<Record<MeasureName, string>>
}

const fmt = (n: number, places = 1) => Number(n.toFixed(places)).toString()

/** A joint between two columns is curved (wedge) when either neighbour lies on a curve. */
function jointKinds(columns: Column[]): { straight: number; curved: number } {
  let curved = 0
  for (let i = 0; i + 1 < columns.length; i++) {
    if (columns[i].kind === 'curved' || columns[i + 1].kind === 'curved') curved++
  }
  return { straight: Math.max(0, columns.length - 1) - curved, curved }
}

/** Length of section tops that another section sits on (where a bead of sealant goes). */
export function sectionTopsMm(plan: SectionPlan, columns: Column[]): number {
  const owner = new Map<string, number>()
  plan.sections.forEach((s) => s.cells.forEach((c) => owner.set(`${c.course},${c.column}`, s.index)))
  let length = 0
  for (const s of plan.sections) {
    for (const c of s.cells) {
      const above = owner.get(`${c.course + 1},${c.column}`)
      if (above !== undefined && above !== s.index) length += columns[c.column].faceMm + columns[c.column].jointAfterMm
    }
  }
  return length
}

function jointVolumesMl(input: MeasureInput): { grout: number; mortar: number; faceArea: number } {
  const g = input.geometry
  const verticalArea = g.columns.reduce((sum, c) => sum + c.jointAfterMm, 0) * g.panelHeightMm
  const bedArea = Math.max(0, g.courses - 1) * g.panelWidthMm * g.joint.jointMm
  const sillArea = g.panelWidthMm * g.joint.jointMm
  const faceArea = verticalArea + bedArea
  const groutDepth = input.groutDepthMm ?? input.blockDepthMm
  return {
    faceArea,
    grout: g.joint.kind === 'spacer' ? (faceArea * groutDepth) / 1000 : 0,
    mortar: g.joint.kind === 'mortar' ? ((faceArea + sillArea) * input.blockDepthMm) / 1000 : 0,
  }
}

/** All measures of one laid-out wall. */
export function measureWall(input: MeasureInput): MeasuredWall {
  const g = input.geometry
  const joints = jointKinds(g.columns)
  const innerBeds = Math.max(0, g.courses - 1)
  const volumes = jointVolumesMl(input)
  const perimeterMm = 2 * (g.panelWidthMm + g.panelHeightMm)
  const measures: WallMeasures = {
    standardBlocks: g.standardBlocks,
    endBlocks: g.endBlocks,
    cornerBlocks: g.cornerBlocks,
    interiorIntersectionsStraight: joints.straight * innerBeds,
    interiorIntersectionsCurved: joints.curved * innerBeds,
    edgeIntersectionsStraight: 2 * joints.straight + 2 * innerBeds,
    edgeIntersectionsCurved: 2 * joints.curved,
    perimeterFt: perimeterMm / MM_PER_FOOT,
    sections: input.plan.sections.length,
    jambScrews: input.screws.length,
    panelAnchors: input.anchors.length,
    bottomRunMm: g.panelWidthMm,
    sectionTopsMm: sectionTopsMm(input.plan, g.columns),
    jambLengthMm: g.panelHeightMm * g.framedEnds,
    headLengthMm: g.headFramed ? g.panelWidthMm : 0,
    reinforcedJointLengthMm: input.reinforcedJoints.length * g.panelWidthMm,
    groutVolumeMl: volumes.grout,
    mortarVolumeMl: volumes.mortar,
  }
  return { measures, derivation: derive(g, joints, innerBeds, input, volumes.faceArea) }
}

function derive(
  g: WallGeometry,
  joints: { straight: number; curved: number },
  innerBeds: number,
  input: MeasureInput,
  faceArea: number,
): Partial<Record<MeasureName, string>> {
  const W = fmt(g.panelWidthMm)
  const H = fmt(g.panelHeightMm)
  return {
    standardBlocks: `${g.blocksAcross} across × ${g.courses} courses = ${g.totalBlocks}, less ${g.endBlocks} end and ${g.cornerBlocks} corner blocks`,
    endBlocks: `${g.courses} courses × free ends that end in a standard column`,
    cornerBlocks: `${g.courses} courses × corner columns`,
    interiorIntersectionsStraight: `${joints.straight} straight head joints × ${innerBeds} inner bed joints`,
    interiorIntersectionsCurved: `${joints.curved} wedge head joints on the curve × ${innerBeds} inner bed joints`,
    edgeIntersectionsStraight: `2 × ${joints.straight} head joints (curb and top) + 2 × ${innerBeds} bed joints (ends)`,
    edgeIntersectionsCurved: `2 × ${joints.curved} wedge head joints (curb and top)`,
    perimeterFt: `2 × (${W} + ${H}) mm ÷ 304.8 mm/ft`,
    sections: `sections planned`,
    jambScrews: `${input.screws.length} screws at section edges on framed jambs`,
    panelAnchors: `${input.anchors.length} anchors at ≤ 16 in on centre at framed jambs and head`,
    bottomRunMm: `panel length along the curb ${W} mm`,
    sectionTopsMm: `tops of sections that carry another section`,
    jambLengthMm: `${H} mm × ${g.framedEnds} framed jambs`,
    headLengthMm: g.headFramed ? `framed head ${W} mm` : 'head is free: none',
    reinforcedJointLengthMm: `${input.reinforcedJoints.length} reinforced bed joints × ${W} mm`,
    groutVolumeMl: `joint face area ${fmt(faceArea / 1e6, 4)} m² × depth ${fmt(input.groutDepthMm ?? input.blockDepthMm)} mm`,
    mortarVolumeMl: `(joint face area + sill bed) × block depth ${fmt(input.blockDepthMm)} mm`,
  }
}
