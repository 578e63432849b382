// A drawing model of each wall, free of any UI toolkit: the developed elevation (every block as a
// rectangle in mm, tagged with its section, plus anchors and screws) and a plan view when the run turns.
import type { Wall } from '../schemas/takeoff.js'
import type { LengthUnit } from '../units.js'
import type { Fixing } from './fasteners.js'
import { buildPlanView, type WallPlanView } from './planView.js'
import { sectionOwners, type SectionPlan } from './sections.js'
import type { WallGeometry } from './wallLayout.js'

export type { WallPlanView } from './planView.js'
export { toSvg } from './drawingSvg.js'

export interface ElevationBlock {
  /** Along the developed run from the panel's start, mm. */
  xMm: number
  /** Up from the bottom of the panel, mm. */
  yMm: number
  widthMm: number
  heightMm: number
  course: number
  column: number
  segment: number
  section: number
  /** end: finished on one edge; double: on two; corner and angle: 90° and 45° corner units. */
  kind: 'standard' | 'end' | 'double' | 'corner' | 'angle'
  curved: boolean
}

export interface SectionSummary {
  index: number
  blocks: number
  weightKg: number
  overweight: boolean
}

export interface WallElevation {
  widthMm: number
  heightMm: number
  blocks: ElevationBlock[]
  fixings: Fixing[]
  freeEnds: Wall['freeEnds']
  sections: SectionSummary[]
}

export interface WallDrawing {
  wallName: string
  unit: LengthUnit
  elevation: WallElevation
  /** Present when the run curves or turns a corner. */
  plan?: WallPlanView
}

export interface DrawingInput {
  wall: Wall
  geometry: WallGeometry
  plan: SectionPlan
  fixings: Fixing[]
  unit: LengthUnit
}

/** The same rule as finishedEdges: exposed edges of the cell decide its unit. */
function blockKind(column: number, course: number, g: WallGeometry, wall: Wall): ElevationBlock['kind'] {
  const col = g.columns[column]
  if (col.kind === 'corner') return col.cornerDeg === 45 ? 'angle' : 'corner'
  const edges = Number(column === 0 && wall.freeEnds.start) + Number(column === g.columns.length - 1 && wall.freeEnds.end) +
    Number(course === g.courses - 1 && wall.freeEnds.top)
  return edges === 0 ? 'standard' : edges === 1 ? 'end' : 'double'
}

function elevationBlocks(wall: Wall, g: WallGeometry, plan: SectionPlan): ElevationBlock[] {
  const owner = sectionOwners(plan, g.columns.length, g.courses)
  const blocks: ElevationBlock[] = []
  for (let course = 0; course < g.courses; course++) {
    for (const col of g.columns) {
      blocks.push({
        xMm: col.xMm,
        yMm: course * g.moduleUpMm,
        widthMm: col.faceMm,
        heightMm: wall.block.faceHeightMm,
        course,
        column: col.index,
        segment: col.segment,
        section: owner[course * g.columns.length + col.index],
        kind: blockKind(col.index, course, g, wall),
        curved: col.kind === 'curved',
      })
    }
  }
  return blocks
}

/** The drawing model of one laid-out wall. */
export function buildWallDrawing({ wall, geometry, plan, fixings, unit }: DrawingInput): WallDrawing {
  const turns = geometry.segments.some((s) => s.kind !== 'straight')
  return {
    wallName: wall.name,
    unit,
    elevation: {
      widthMm: geometry.panelWidthMm,
      heightMm: geometry.panelHeightMm,
      blocks: elevationBlocks(wall, geometry, plan),
      fixings,
      freeEnds: wall.freeEnds,
      sections: plan.sections.map((s) => ({ index: s.index, blocks: s.blocks, weightKg: s.weightKg, overweight: s.overweight })),
    },
    plan: turns ? buildPlanView(geometry.segments, wall.block, geometry.joint.jointMm, unit) : undefined,
  }
}
