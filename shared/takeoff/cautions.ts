// Safety and code cautions shown beside a takeoff. Code limits come from the glass unit masonry section of
// the International Residential Code (R607, 2021 edition); the rest is trade practice. Every list ends by
// deferring to local codes and licensed practice.
import type { BlockSpec, ShowerBase, SiteFigures, Wall } from '../schemas/takeoff.js'
import { formatLength, ft2ToM2, kgToPounds, MM_PER_FOOT, MM_PER_INCH, type LengthUnit } from '../units.js'
import { JOINT_FACTS } from './geometry.js'
import { largestGap, type Fixing } from './fasteners.js'
import type { SectionPlan } from './sections.js'
import type { ShowerBaseFit } from './showerBaseLine.js'
import type { WallGeometry } from './wallLayout.js'

export type CautionLevel = 'stop' | 'warn' | 'info'

export interface Caution {
  level: CautionLevel
  /** The code section or standard it rests on (IRC 2021 R607.4.1 …), shown beside it. */
  code?: string
  /** English text, for logs, exports and screens without a translation. */
  message: string
  wall?: string
  /**
   * A stable name and the figures in it (lengths in mm, angles in degrees), so a screen can word the
   * caution in the reader's language and unit.
   */
  key?: string
  params?: Record<string, string | number>
}

export const CLOSING_CAUTION: Caution = {
  level: 'info',
  key: 'closing_line',
  message:
    'These checks are a guide, not an approval: local building codes, the block and spacer maker’s instructions ' +
    'and licensed professionals have the final word on what is built.',
}

interface PanelLimit { areaFt2: number; widthFt: number; heightFt: number; code: string }

/** IRC 2021 R607.4: panel size limits by exposure and unit thickness class. */
export const PANEL_LIMITS: Record<'exterior' | 'interior', Record<'standard' | 'thin', PanelLimit>> = {
  exterior: {
    standard: { areaFt2: 144, widthFt: 25, heightFt: 20, code: 'IRC 2021 R607.4.1' },
    thin: { areaFt2: 85, widthFt: 15, heightFt: 10, code: 'IRC 2021 R607.4.2' },
  },
  interior: {
    standard: { areaFt2: 250, widthFt: 25, heightFt: 20, code: 'IRC 2021 R607.4.3' },
    thin: { areaFt2: 150, widthFt: 25, heightFt: 20, code: 'IRC 2021 R607.4.3' },
  },
}

/** IRC 2021 R607.3: least unit thickness, standard 3 7/8 in and thin 3 1/8 in. */
export const MIN_THICKNESS_MM = { standard: 3.875 * MM_PER_INCH, thin: 3.125 * MM_PER_INCH }
/** Metric blocks are listed to the whole millimetre; half a millimetre is not a thinner block. */
const THICKNESS_TOLERANCE_MM = 0.5
/** Exterior limits are set at this design wind pressure (IRC 2021 R607.4.1, R607.4.2). */
export const LIMIT_WIND_PSF = 20

const SEVERITY: Record<CautionLevel, number> = { stop: 0, warn: 1, info: 2 }

const caution = (level: CautionLevel, message: string, code?: string): Caution => (code ? { level, code, message } : { level, message })

/** A caution with its stable name and figures (lengths in mm), for a screen to word in the reader's language and unit. */
const keyed = (level: CautionLevel, key: string, params: Record<string, string | number>, message: string, code?: string): Caution =>
  ({ ...caution(level, message, code), key, params })

export function panelLimitCautions(wall: Wall, g: WallGeometry, unit: LengthUnit): Caution[] {
  const limit = PANEL_LIMITS[wall.exposure][wall.block.thicknessClass]
  const where = `${wall.exposure} ${wall.block.thicknessClass} units`
  const show = (mm: number) => formatLength(mm, unit, { feet: true })
  const out: Caution[] = []
  const kind = { exposure: wall.exposure, thickness: wall.block.thicknessClass }
  if (g.areaFt2 > limit.areaFt2 + 1e-9) {
    const allowed = `${limit.areaFt2} ft² (${ft2ToM2(limit.areaFt2).toFixed(1)} m²)`
    const area = `${g.areaFt2.toFixed(1)} ft² (${g.areaM2.toFixed(2)} m²)`
    const params = { ...kind, areaFt2: Number(g.areaFt2.toFixed(1)), areaM2: Number(g.areaM2.toFixed(2)), allowedFt2: limit.areaFt2, allowedM2: Number(ft2ToM2(limit.areaFt2).toFixed(1)) }
    out.push(keyed('stop', 'panel_area', params, `Panel area ${area} is over the ${allowed} allowed for ${where}; split it with structural supports.`, limit.code))
  }
  if (g.panelWidthMm > limit.widthFt * MM_PER_FOOT + 1e-6) {
    const params = { ...kind, lengthMm: g.panelWidthMm, limitMm: limit.widthFt * MM_PER_FOOT }
    out.push(keyed('stop', 'panel_length', params, `Panel length ${show(g.panelWidthMm)} is over the ${limit.widthFt} ft allowed between supports for ${where}.`, limit.code))
  }
  if (g.panelHeightMm > limit.heightFt * MM_PER_FOOT + 1e-6) {
    const params = { ...kind, heightMm: g.panelHeightMm, limitMm: limit.heightFt * MM_PER_FOOT }
    out.push(keyed('stop', 'panel_height', params, `Panel height ${show(g.panelHeightMm)} is over the ${limit.heightFt} ft allowed between supports for ${where}.`, limit.code))
  }
  return [...out, ...windCautions(wall)]
}

function windCautions(wall: Wall): Caution[] {
  if (wall.exposure !== 'exterior') return []
  const psf = wall.designWindPressurePsf
  const thin = wall.block.thicknessClass === 'thin'
  if (psf === undefined) {
    const message = `Exterior limits assume a design wind pressure of ${LIMIT_WIND_PSF} psf; enter the site’s pressure to check it.`
    return [keyed('info', 'wind_assumed', { psf: LIMIT_WIND_PSF }, message, thin ? 'IRC 2021 R607.4.2' : 'IRC 2021 R607.4.1')]
  }
  if (psf <= LIMIT_WIND_PSF) return []
  if (thin) {
    const message = `Thin units may not be used outside where the design wind pressure (${psf} psf) exceeds ${LIMIT_WIND_PSF} psf.`
    return [keyed('stop', 'wind_thin', { psf, limitPsf: LIMIT_WIND_PSF }, message, 'IRC 2021 R607.4.2')]
  }
  const message = `At ${psf} psf the allowed panel area is smaller than 144 ft²; read it from the code’s wind pressure chart.`
  return [keyed('warn', 'wind_chart', { psf }, message, 'IRC 2021 R607.4.1')]
}

export function thicknessCautions(block: BlockSpec, unit: LengthUnit): Caution[] {
  const depth = block.depthMm + THICKNESS_TOLERANCE_MM
  const unitDepth = `A ${formatLength(block.depthMm, unit)} deep unit`
  if (depth < MIN_THICKNESS_MM.thin) {
    return [keyed('stop', 'too_thin', { depthMm: block.depthMm }, `${unitDepth} is thinner than the 3 1/8 in least thickness for glass unit masonry.`, 'IRC 2021 R607.3')]
  }
  if (block.thicknessClass === 'standard' && depth < MIN_THICKNESS_MM.standard) {
    const message = `${unitDepth} is thinner than the 3 7/8 in a standard unit needs; treat it as a thin unit (smaller panel limits).`
    return [keyed('stop', 'thinner_than_standard', { depthMm: block.depthMm }, message, 'IRC 2021 R607.3')]
  }
  return []
}

function mortarJointCautions(g: WallGeometry, unit: LengthUnit): Caution[] {
  const out: Caution[] = []
  const j = g.joint
  if (Math.abs(j.jointMm - JOINT_FACTS.mortarJointMm) > 0.5) {
    out.push(keyed('warn', 'mortar_joint', { jointMm: j.jointMm }, `Mortar head and bed joints are set at 1/4 in; this wall uses ${formatLength(j.jointMm, unit)}.`, 'IRC 2021 R607.10'))
  }
  const radialOutside = j.curveInsideJointMm < JOINT_FACTS.radialMinMm - 0.05 || j.maxOutsideJointMm > JOINT_FACTS.radialMaxMm + 0.05
  if (g.hasCurve && radialOutside) {
    const message = 'Radial joints of curved mortar panels must stay between 1/8 in and 5/8 in; this wall’s joint limits go outside that range.'
    out.push(keyed('warn', 'radial_joints', {}, message, 'IRC 2021 R607.10'))
  }
  if (g.jambSpaceMm !== undefined && g.jambSpaceMm < JOINT_FACTS.expansionMinMm - 1e-6) {
    const message = `Only ${formatLength(g.jambSpaceMm, unit)} is left at each jamb; expansion joints need at least 3/8 in. ` +
      'Widen the opening or drop a block.'
    out.push(keyed('warn', 'jamb_space', { spaceMm: g.jambSpaceMm }, message, 'IRC 2021 R607.7'))
  }
  if (j.expansionMm < JOINT_FACTS.expansionMinMm - 1e-6) {
    out.push(keyed('warn', 'expansion_small', { expansionMm: j.expansionMm }, `Expansion allowance ${formatLength(j.expansionMm, unit)} is under the 3/8 in at jambs and head.`, 'IRC 2021 R607.7'))
  }
  return out
}

export function jointCautions(g: WallGeometry, unit: LengthUnit): Caution[] {
  if (g.joint.kind === 'mortar') return mortarJointCautions(g, unit)
  const message = 'The code’s glass unit masonry text assumes mortar. A spacer (mortarless) system relies on its maker’s ' +
    'installation instructions and the local building official’s approval.'
  return [keyed('warn', 'spacer_system', {}, message, 'IRC 2021 R607')]
}

function inflectionCount(wall: Wall): number {
  const turns = wall.segments.filter((s) => s.kind === 'curved').map((s) => s.direction)
  return turns.slice(1).filter((d, i) => d !== turns[i]).length
}

export function curveCautions(wall: Wall, g: WallGeometry, unit: LengthUnit): Caution[] {
  if (!g.hasCurve) return []
  const inflections = inflectionCount(wall)
  const where = inflections > 0 ? ` and at each of the ${inflections} point(s) where the curve reverses.` : ' and at any point where the curve reverses.'
  const support = `Curved panels keep the same size limits and need support where the curve meets a straight run${where}`
  const out = [keyed('warn', 'curve_support', { variant: inflections > 0 ? 'reverses' : 'any', inflections }, support, 'IRC 2021 R607.4.4')]
  for (const s of g.segments) {
    if (s.kind !== 'curved' || !s.curve.closings) continue
    const c = s.curve
    const over = c.closings?.find((o) => o.closing === 'overshoot')
    const params = {
      segment: s.index + 1,
      requestedDeg: Number(c.requestedAngleDeg.toFixed(1)),
      blocks: over?.blocks ?? c.blocks,
      builtDeg: Number((over?.builtAngleDeg ?? c.builtAngleDeg).toFixed(1)),
      radiusMm: c.insideRadiusMm,
      closing: c.closing ?? 'overshoot',
    }
    if (!c.closingChosen) {
      const message = `Segment ${s.index + 1}: ${params.blocks} whole blocks build ${params.builtDeg}° against the ${params.requestedDeg}° asked. ` +
        'Choose how to close the arc: another radius, one block fewer with wider joints, or keep the radius and the extra arc.'
      out.push({ ...caution('warn', message), key: 'curve_closing_choose', params })
    } else {
      const message = `Segment ${s.index + 1}: ${c.blocks} blocks at an inside radius of ${formatLength(c.insideRadiusMm, unit)} build ${c.builtAngleDeg.toFixed(1)}°, as chosen.`
      out.push({ ...caution('info', message), key: 'curve_closing_chosen', params: { ...params, blocks: c.blocks, builtDeg: Number(c.builtAngleDeg.toFixed(1)) } })
    }
  }
  return out
}

/** More space than the set gap left at a jamb or head (or in a segment) after whole blocks. */
export function leftoverCautions(g: WallGeometry, figures: SiteFigures, unit: LengthUnit): Caution[] {
  return g.gaps
    .filter((gap) => gap.gapMm > figures.leftoverWarnMm + 1e-9)
    .map((gap) => {
      const where = gap.where === 'jambs' ? 'at each jamb' : gap.where === 'head' ? 'at the head' : `in segment ${(gap.segment ?? 0) + 1}`
      const message = `${formatLength(gap.gapMm, unit)} is left ${where} after whole blocks, more than ${formatLength(figures.leftoverWarnMm, unit)}. ` +
        `Use the next block size, fill it with a filler or framing, or change the opening to ${formatLength(gap.openingForBlocksMm, unit)} ` +
        `(${gap.blocks}) or ${formatLength(gap.openingForOneMoreMm, unit)} (${gap.blocks + 1}).`
      const params = {
        where: gap.where,
        segment: (gap.segment ?? 0) + 1,
        gapMm: gap.gapMm,
        limitMm: figures.leftoverWarnMm,
        blocks: gap.blocks,
        blocksMore: gap.blocks + 1,
        openingMm: gap.openingForBlocksMm,
        openingOneMoreMm: gap.openingForOneMoreMm,
      }
      return { ...caution('warn', message), key: 'leftover_space', params }
    })
}

/** Every fixed edge's fixings no more than the spacing apart; blocks larger than the spacing cannot keep it. */
export function fixingCautions(g: WallGeometry, fixings: Fixing[], figures: SiteFigures, unit: LengthUnit): Caution[] {
  const edges: { side: Fixing['side']; length: number; along: (f: Fixing) => number; fixed: boolean }[] = [
    { side: 'start', length: g.panelHeightMm, along: (f) => f.yMm, fixed: true },
    { side: 'end', length: g.panelHeightMm, along: (f) => f.yMm, fixed: true },
    { side: 'head', length: g.panelWidthMm, along: (f) => f.xMm, fixed: g.headFramed },
  ]
  const out: Caution[] = []
  for (const edge of edges) {
    const on = fixings.filter((f) => f.side === edge.side)
    if (on.length === 0 || !edge.fixed) continue
    const gap = largestGap(on.map(edge.along), edge.length)
    if (gap > figures.fixingSpacingMm + 1e-6) {
      const message = `Fixings along the ${edge.side === 'head' ? 'head' : `${edge.side} jamb`} can only sit in the joints, ` +
        `${formatLength(gap, unit)} apart, more than the ${formatLength(figures.fixingSpacingMm, unit)} asked: ask the maker for this block size.`
      out.push({ ...caution('warn', message), key: 'fixing_gap', params: { side: edge.side, gapMm: gap, limitMm: figures.fixingSpacingMm } })
    }
  }
  return out
}

const ROLE_WORDS: Record<string, string> = { doubleEndBlock: 'unit finished on two edges', endBlock: 'unit finished on one edge' }

/** Exposed edges no unit covers, and units standing in for ones the catalog lacks (roles by name). */
export function finishCautions(g: WallGeometry, standIns: string[]): Caution[] {
  const out: Caution[] = []
  if (g.finished.uncovered > 0) {
    const message = `${g.finished.uncovered} exposed edge(s) stay unfinished: a one-block-wide column free on both sides and on top shows three edges.`
    out.push({ ...caution('warn', message), key: 'edges_unfinished', params: { edges: g.finished.uncovered } })
  }
  for (const role of standIns) {
    const message = `No ${ROLE_WORDS[role] ?? role} is in the catalog for this block; units finished on one edge stand in, so one edge of each stays unfinished.`
    out.push({ ...caution('warn', message), key: 'finished_stand_in', params: { role } })
  }
  return out
}

export function endCautions(wall: Wall): Caution[] {
  const free = [wall.freeEnds.start && 'start', wall.freeEnds.end && 'end'].filter(Boolean)
  if (free.length === 0) return []
  const message = `Free ${free.join(' and ')} of the wall: nothing to anchor to there. ` +
    'Follow the maker’s free-end detail and make sure the panel is braced.'
  return [keyed('warn', 'free_ends', { variant: free.length === 2 ? 'both' : String(free[0]) }, message)]
}

export function wetAreaCautions(wall: Wall): Caution[] {
  if (!wall.wetArea) return []
  const message = 'Wet area: waterproof the floor and curb under the wall, set it on a shower base for tiling, ' +
    'slope the floor to the drain and use a sealant rated for wet areas.'
  return [keyed('info', 'wet_area', {}, message)]
}

const MISMATCH_WORDS = { footprint: 'footprint', curbRadius: 'curb radius', curbArc: 'curb arc', curbShape: 'curb' } as const

function baseFitCautions(fit: ShowerBaseFit, unit: LengthUnit): Caution[] {
  const out: Caution[] = []
  if (fit.wallProblem === 'missing') {
    const message = `The shower base is set to carry “${fit.wall}”, which is not in this takeoff: choose the wall it carries.`
    out.push({ ...caution('stop', message), key: 'base_wall_missing', params: { wall: fit.wall ?? '' } })
  }
  if (fit.mismatches.length > 0 && fit.fromWall) {
    const show = (m: (typeof fit.mismatches)[number]) => {
      const value = (v: number | string) =>
        typeof v === 'number' && m.field === 'curbRadius' ? formatLength(v, unit) : typeof v === 'number' && m.field === 'curbArc' ? `${v}°` : String(v)
      return `${MISMATCH_WORDS[m.field]} ${value(m.entered)} entered, ${value(m.wall)} for the wall`
    }
    const message = `The shower base does not fit ${fit.wall} as built (${fit.mismatches.map(show).join('; ')}). ` +
      'Let the base follow the wall, or change the wall or the base, before the bill is saved for ordering.'
    out.push({ ...caution('stop', message), wall: fit.wall, key: 'base_mismatch', params: { wall: fit.wall ?? '', fields: fit.mismatches.map((m) => m.field).join(',') } })
  }
  if (fit.drainOutside) {
    const message = 'The drain falls outside the footprint the base is made to: move the drain before the bill is saved for ordering.'
    out.push({ ...caution('stop', message), key: 'base_drain_outside', params: { widthMm: fit.base.widthMm, depthMm: fit.base.depthMm } })
  }
  if (fit.fit === 'none') {
    const message = 'Choose the wall the shower base carries, so its curb and footprint are taken from the wall, or checked against it.'
    out.push({ ...caution('warn', message), key: 'base_no_wall', params: {} })
  }
  return out
}

export function showerBaseCautions(base: ShowerBase | undefined, fit: ShowerBaseFit | undefined, unit: LengthUnit): Caution[] {
  if (!base) return []
  const out = [
    ...(fit ? baseFitCautions(fit, unit) : []),
    keyed('info', 'base_made_to_order', {}, 'The shower base is made to order: confirm the footprint, curb, drain position and entry side on site ' +
      'before ordering; it cannot be returned to stock.'),
    keyed('info', 'base_floor', {}, 'The floor must slope to the drain and be waterproofed under the base and up the walls.'),
  ]
  if (base.curbless) {
    out.push(keyed('warn', 'base_curbless', {}, 'A curbless entry needs the floor recessed and the waterproofing carried past the entry; plan it with the builder.'))
  }
  return out
}

/** The section planner's notes but the weight (said above with its figures), each with its stable name and figures. */
function sectionNotes(plan: SectionPlan): Caution[] {
  return plan.notes.filter((n) => n.variant !== 'heavy').map((n) => keyed('info', 'sections_note', { variant: n.variant, ...n.params }, n.message))
}

export function workCautions(g: WallGeometry, plan: SectionPlan, fixings: number): Caution[] {
  const out: Caution[] = []
  const heavy = plan.sections.filter((s) => s.overweight).map((s) => s.index + 1)
  if (heavy.length > 0) {
    const limit = `${plan.liftLimitKg.toFixed(1)} kg (${kgToPounds(plan.liftLimitKg).toFixed(0)} lb)`
    const message = `Section(s) ${heavy.join(', ')} weigh more than a two-person lift of ${limit}: ` +
      'add hands or a lifting aid, or build them smaller.'
    const params = { sections: heavy.join(', '), limitKg: Number(plan.liftLimitKg.toFixed(1)), limitLb: Number(kgToPounds(plan.liftLimitKg).toFixed(0)) }
    out.push(keyed('warn', 'heavy_sections', params, message))
  }
  sectionNotes(plan).forEach((c) => out.push(c))
  if (fixings > 0) {
    out.push(keyed('info', 'drilling', {}, 'Drilling masonry, concrete or tile: wear eye protection and keep the dust down (water or extraction, and a mask).'))
  }
  if (g.joint.kind === 'spacer') {
    out.push(keyed('info', 'silicone_cure', {}, 'Let the silicone cure before grouting: a few hours at least, overnight is safer for a first wall.'))
  }
  if (plan.sections.length > 0) out.push(keyed('info', 'level_plumb', {}, 'Check each section for level and plumb as it is set, before the next goes on.'))
  return out
}

/** Stops first, then warnings, then notes; the closing line always last. */
export function withClosingLine(cautions: Caution[]): Caution[] {
  const sorted = cautions
    .map((c, i) => ({ c, i }))
    .sort((a, b) => SEVERITY[a.c.level] - SEVERITY[b.c.level] || a.i - b.i)
    .map(({ c }) => c)
  return [...sorted, CLOSING_CAUTION]
}

export interface WallCautionInput {
  wall: Wall
  geometry: WallGeometry
  plan: SectionPlan
  fixings: Fixing[]
  unit: LengthUnit
  figures: SiteFigures
  /** Roles whose units are missing from the catalog, with a stand-in used. */
  standIns?: string[]
}

/** All cautions for one wall, closing line included. */
export function wallCautions({ wall, geometry, plan, fixings, unit, figures, standIns = [] }: WallCautionInput): Caution[] {
  const list = [
    ...thicknessCautions(wall.block, unit),
    ...panelLimitCautions(wall, geometry, unit),
    ...jointCautions(geometry, unit),
    ...curveCautions(wall, geometry, unit),
    ...leftoverCautions(geometry, figures, unit),
    ...fixingCautions(geometry, fixings, figures, unit),
    ...finishCautions(geometry, standIns),
    ...endCautions(wall),
    ...wetAreaCautions(wall),
    ...workCautions(geometry, plan, fixings.length),
  ]
  return withClosingLine(list.map((c) => ({ ...c, wall: wall.name })))
}
