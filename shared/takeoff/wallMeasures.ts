// The quantities material rules multiply: finished units, joint intersections, lengths along the curb,
// jambs and head, section tops and seams, fixing counts and joint volumes. Each measure says how it was
// found, in the trade's words.
import type { CountMeasure, LengthMeasure, VolumeMeasure } from '../schemas/takeoff.js'
import { MM_PER_FOOT } from '../units.js'
import type { ExplainToken } from './explainWords.js'
import type { Fixing } from './fasteners.js'
import { sectionOwners, type SectionPlan } from './sections.js'
import type { Column, WallGeometry } from './wallLayout.js'

export type MeasureName = CountMeasure | LengthMeasure | VolumeMeasure
export type WallMeasures = Record<MeasureName, number>

export interface MeasureInput {
  geometry: WallGeometry
  plan: SectionPlan
  fixings: Fixing[]
  reinforcedJoints: number[]
  blockDepthMm: number
  /** Grout filled into each face joint, from the face to the spacer; both faces are grouted. */
  groutDepthMm: number
  fixingSpacingMm: number
}

/** Faces of a spacer wall that are grouted (common practice: both). */
export const GROUTED_FACES = 2

export interface MeasuredWall {
  measures: WallMeasures
  /** How each measure was found, for the explanation (phrases a screen words in its language). */
  derivation: Partial<Record<MeasureName, ExplainToken[]>>
  /** Joints inside the sections: sealed in the shop when sections are shop-built, not on the site bill. */
  shopJointsMm: number
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

/**
 * Seams between sections: tops that another section sits on (horizontal, length along the run) and the
 * vertical seams where neighbouring sections meet (one course module high each), and the joints inside
 * sections (sealed in the shop when sections are shop-built).
 */
export function sectionJoints(plan: SectionPlan, columns: Column[], courses: number, moduleUpMm: number) {
  const owner = sectionOwners(plan, columns.length, courses)
  const width = columns.length
  let tops = 0
  let seams = 0
  let inside = 0
  for (let course = 0; course < courses; course++) {
    for (let x = 0; x < width; x++) {
      const here = owner[course * width + x]
      if (x + 1 < width) {
        if (owner[course * width + x + 1] !== here) seams += moduleUpMm
        else inside += moduleUpMm
      }
      if (course + 1 < courses) {
        const along = columns[x].faceMm + columns[x].jointAfterMm
        if (owner[(course + 1) * width + x] !== here) tops += along
        else inside += along
      }
    }
  }
  return { topsMm: tops, seamsMm: seams, insideMm: inside }
}

/**
 * Joint volumes. Face area of the joints: head joints (each joint's width × panel height) plus inner bed
 * joints (courses − 1 × panel length × joint). Spacer walls: grouted from each face to the spacer, depth
 * per face × 2 faces, never more than the block's depth. Mortar walls: head, bed and sill joints full depth.
 */
function jointVolumesMl(input: MeasureInput): { grout: number; mortar: number; faceArea: number; groutDepth: number } {
  const g = input.geometry
  const verticalArea = g.columns.reduce((sum, c) => sum + c.jointAfterMm, 0) * g.panelHeightMm
  const bedArea = Math.max(0, g.courses - 1) * g.panelWidthMm * g.joint.jointMm
  const sillArea = g.panelWidthMm * g.joint.jointMm
  const faceArea = verticalArea + bedArea
  const groutDepth = Math.min(input.groutDepthMm * GROUTED_FACES, input.blockDepthMm)
  return {
    faceArea,
    groutDepth,
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
  const sections = sectionJoints(input.plan, g.columns, g.courses, g.moduleUpMm)
  const perimeterMm = 2 * (g.panelWidthMm + g.panelHeightMm)
  const measures: WallMeasures = {
    standardBlocks: g.standardBlocks,
    endBlocks: g.endBlocks,
    doubleEndBlocks: g.doubleEndBlocks,
    cornerBlocks: g.cornerBlocks,
    angleBlocks: g.angleBlocks,
    interiorIntersectionsStraight: joints.straight * innerBeds,
    interiorIntersectionsCurved: joints.curved * innerBeds,
    edgeIntersectionsStraight: 2 * joints.straight + 2 * innerBeds,
    edgeIntersectionsCurved: 2 * joints.curved,
    perimeterFt: perimeterMm / MM_PER_FOOT,
    sections: input.plan.sections.length,
    jambScrews: input.fixings.filter((f) => f.kind === 'screw').length,
    panelAnchors: input.fixings.filter((f) => f.kind === 'anchor').length,
    bottomRunMm: g.panelWidthMm,
    sectionTopsMm: sections.topsMm,
    sectionSeamsMm: sections.seamsMm,
    jambLengthMm: g.panelHeightMm * g.framedEnds,
    headLengthMm: g.headFramed ? g.panelWidthMm : 0,
    reinforcedJointLengthMm: input.reinforcedJoints.length * g.panelWidthMm,
    groutVolumeMl: volumes.grout,
    mortarVolumeMl: volumes.mortar,
  }
  let derivation: Partial<Record<MeasureName, ExplainToken[]>> | undefined
  return {
    measures,
    // Written when an explanation reads it.
    get derivation() {
      return (derivation ??= derive(g, joints, innerBeds, input, volumes, sections.insideMm))
    },
    shopJointsMm: sections.insideMm,
  }
}

const say = (k: string, p?: Record<string, string | number>): ExplainToken[] => [{ k: `derive.${k}`, ...(p ? { p } : {}) }]

function edgeTokens(f: WallGeometry['finished']): ExplainToken[] {
  const parts: ExplainToken[] = []
  const add = (k: string, n: number) => { if (n) parts.push(...(parts.length ? [', '] : []), ...say(k, { n })) }
  add('freeStart', f.startCourses)
  add('freeEnd', f.endCourses)
  add('freeTop', f.topBlocks)
  return parts.length ? parts : say('noFreeEdges')
}

function derive(
  g: WallGeometry,
  joints: { straight: number; curved: number },
  innerBeds: number,
  input: MeasureInput,
  volumes: { faceArea: number; groutDepth: number },
  shopJointsMm: number,
): Partial<Record<MeasureName, ExplainToken[]>> {
  const width = fmt(g.panelWidthMm)
  const height = fmt(g.panelHeightMm)
  const f = g.finished
  const corners = g.cornerBlocks + g.angleBlocks
  const fixings = (side: string) => input.fixings.filter((x) => x.side === side).length
  const fixing = { spacing: fmt(input.fixingSpacingMm), start: fixings('start'), end: fixings('end'), head: fixings('head') }
  return {
    standardBlocks: say('standardBlocks', { across: g.blocksAcross, courses: g.courses, total: g.totalBlocks, finished: f.oneEdge + f.twoEdges, corners }),
    endBlocks: [...say('exposedEdges'), ': ', ...edgeTokens(f), '; ', ...say('oneEdge', { n: f.oneEdge })],
    doubleEndBlocks: say('doubleEndBlocks', { n: f.twoEdges }),
    cornerBlocks: say('cornerBlocks', { courses: g.courses }),
    angleBlocks: say('angleBlocks', { courses: g.courses }),
    interiorIntersectionsStraight: say('interiorIntersectionsStraight', { joints: joints.straight, beds: innerBeds }),
    interiorIntersectionsCurved: say('interiorIntersectionsCurved', { joints: joints.curved, beds: innerBeds }),
    edgeIntersectionsStraight: say('edgeIntersectionsStraight', { joints: joints.straight, beds: innerBeds }),
    edgeIntersectionsCurved: say('edgeIntersectionsCurved', { joints: joints.curved }),
    perimeterFt: say('perimeterFt', { width, height }),
    sections: say('sections', { metres: fmt(shopJointsMm / 1000, 2) }),
    jambScrews: say('jambScrews', fixing),
    panelAnchors: say('panelAnchors', fixing),
    bottomRunMm: say('bottomRunMm', { width }),
    sectionTopsMm: say('sectionTopsMm'),
    sectionSeamsMm: say('sectionSeamsMm'),
    jambLengthMm: say('jambLengthMm', { height, jambs: g.framedEnds }),
    headLengthMm: g.headFramed ? say('headLengthMm', { width }) : say('headFree'),
    reinforcedJointLengthMm: say('reinforcedJointLengthMm', { joints: input.reinforcedJoints.length, width }),
    groutVolumeMl: say('groutVolumeMl', { area: fmt(volumes.faceArea / 1e6, 4), depth: fmt(volumes.groutDepth), perFace: fmt(input.groutDepthMm), faces: GROUTED_FACES }),
    mortarVolumeMl: say('mortarVolumeMl', { depth: fmt(input.blockDepthMm) }),
  }
}
