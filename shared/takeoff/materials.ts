// Material rules as data: each ties a material role to the wall measures that drive it. A catalog map
// resolves roles to stock items; evaluating a rule gives the exact need in that item's stock unit.
import type {
  CatalogItem,
  MaterialFamily,
  MaterialRole,
  MaterialRule,
  WastePct,
} from '../schemas/takeoff.js'
import { flOzToMl, MM_PER_INCH } from '../units.js'
import type { MeasureName, MeasuredWall } from './wallMeasures.js'

/** A 10.1 US fl oz cartridge: 298.69 mL (NIST SP 811 factor 29.5735295625 mL per fl oz). */
export const STANDARD_CARTRIDGE_ML = flOzToMl(10.1)
/** Sealant bead: 1/4 in round (common practice). */
export const SEALANT_BEAD_MM = MM_PER_INCH / 4

/** Waste allowances by family, percent (common practice; an admin can change them). */
export const defaultWastePct: Record<MaterialFamily, number> = {
  block: 5,
  spacer: 10,
  sealant: 10,
  grout: 10,
  fastener: 10,
  anchor: 5,
  strip: 10,
  reinforcement: 10,
  showerBase: 0,
  wallSection: 0,
}

export const roleLabels: Record<MaterialRole, string> = {
  block: 'Glass block',
  endBlock: 'Block finished on one edge',
  doubleEndBlock: 'Block finished on two edges',
  cornerBlock: 'Corner block, 90°',
  angleBlock: 'Angle block, 45°',
  spacer: 'Spacer',
  arcSpacer: 'Arc (wedge) spacer',
  spacerBase: 'Spacer base strip',
  sealant: 'Silicone sealant',
  grout: 'Joint grout',
  mortar: 'Glass block mortar',
  screw: 'Stainless screw, 3 in',
  panelAnchor: 'Panel anchor',
  jointReinforcement: 'Joint reinforcement',
  expansionStrip: 'Expansion strip',
  wallSection: 'Shop-built wall section',
  showerBase: 'Shower base for tiling, made to order',
}

export const defaultUnits: Record<MaterialRole, string> = {
  block: 'each', endBlock: 'each', doubleEndBlock: 'each', cornerBlock: 'each', angleBlock: 'each', spacer: 'each', arcSpacer: 'each',
  spacerBase: 'piece', sealant: 'tube', grout: 'bag', mortar: 'bag', screw: 'each', panelAnchor: 'each',
  jointReinforcement: 'piece', expansionStrip: 'piece', wallSection: 'each', showerBase: 'each',
}

const BOTH: MaterialRule['systems'] = ['spacer', 'mortar']

export const defaultMaterialRules: MaterialRule[] = [
  {
    id: 'blocks', role: 'block', family: 'block', method: 'count', systems: BOTH,
    terms: [{ measure: 'standardBlocks', rate: 1 }],
    note: 'Every cell of the panel not taken by an end or corner block.', source: 'wall layout',
  },
  {
    id: 'end-blocks', role: 'endBlock', family: 'block', method: 'count', systems: BOTH,
    terms: [{ measure: 'endBlocks', rate: 1 }],
    note: 'Every exposed edge gets a finished unit: one per course at each free end, one per block across a free top.',
    source: 'common practice',
  },
  {
    id: 'double-end-blocks', role: 'doubleEndBlock', family: 'block', method: 'count', systems: BOTH,
    terms: [{ measure: 'doubleEndBlocks', rate: 1 }], fallbackRole: 'endBlock',
    note: 'Where a free top meets a free end the unit shows two edges: a unit finished on both.',
    source: 'common practice',
  },
  {
    id: 'corner-blocks', role: 'cornerBlock', family: 'block', method: 'count', systems: BOTH,
    terms: [{ measure: 'cornerBlocks', rate: 1 }],
    note: 'One corner unit per course at each 90° corner.', source: 'common practice',
  },
  {
    id: 'angle-blocks', role: 'angleBlock', family: 'block', method: 'count', systems: BOTH,
    terms: [{ measure: 'angleBlocks', rate: 1 }],
    note: 'One 45° angle unit per course at each 45° corner.', source: 'common practice',
  },
  {
    id: 'spacers', role: 'spacer', family: 'spacer', method: 'count', systems: ['spacer'],
    terms: [
      { measure: 'interiorIntersectionsStraight', rate: 1 },
      { measure: 'edgeIntersectionsStraight', rate: 1 },
      { measure: 'perimeterFt', rate: 0 },
    ],
    note: 'One spacer at each joint crossing; at the edges the same piece with its outer legs snapped off. ' +
      'The per-foot rate is for makers with perimeter strips.',
    source: 'common practice',
  },
  {
    id: 'arc-spacers', role: 'arcSpacer', family: 'spacer', method: 'count', systems: ['spacer'],
    terms: [{ measure: 'interiorIntersectionsCurved', rate: 1 }, { measure: 'edgeIntersectionsCurved', rate: 1 }],
    note: 'Wedge spacers wherever a head joint on the curve crosses a bed joint or meets an edge.', source: 'common practice',
  },
  {
    id: 'spacer-base', role: 'spacerBase', family: 'spacer', method: 'length', systems: ['spacer'],
    measures: ['bottomRunMm'],
    note: 'A base layer of spacer material along the curb under the first course.', source: 'common practice',
  },
  {
    id: 'sealant-spacer', role: 'sealant', family: 'sealant', method: 'bead', systems: ['spacer'],
    measures: ['bottomRunMm', 'sectionTopsMm', 'sectionSeamsMm'], beadDiameterMm: SEALANT_BEAD_MM,
    note: 'A 1/4 in bead in the curb bed, on top of each section that carries another and in the seams where ' +
      'sections meet. Joints inside shop-built sections are sealed in the shop, as part of the section build.',
    source: 'common practice',
  },
  {
    id: 'sealant-wet', role: 'sealant', family: 'sealant', method: 'bead', systems: ['spacer'], wetAreaOnly: true,
    measures: ['jambLengthMm', 'headLengthMm'], beadDiameterMm: SEALANT_BEAD_MM, beadsPerLength: 2,
    note: 'In a wet area, a bead along each fixed jamb full height and along a fixed head, on both faces.',
    source: 'common practice (the spacer maker’s instructions)',
  },
  {
    id: 'sealant-mortar', role: 'sealant', family: 'sealant', method: 'bead', systems: ['mortar'],
    measures: ['jambLengthMm', 'headLengthMm'], beadDiameterMm: SEALANT_BEAD_MM, beadsPerLength: 2,
    note: 'Sealant over the expansion joints at jambs and head, both faces.', source: 'common practice',
  },
  {
    id: 'grout', role: 'grout', family: 'grout', method: 'volume', systems: ['spacer'],
    measure: 'groutVolumeMl', yieldField: 'groutYieldMl',
    note: 'Face joints filled from each face to the spacer: joint width × joint length × fill depth, both faces.',
    source: 'common practice (the spacer maker’s fill depth)',
  },
  {
    id: 'mortar', role: 'mortar', family: 'grout', method: 'volume', systems: ['mortar'],
    measure: 'mortarVolumeMl', yieldField: 'mortarYieldMl',
    note: 'Head, bed and sill joints full depth; jambs and head are expansion joints kept free of mortar (IRC 2021 R607.7).',
    source: 'IRC 2021 R607.7, R607.10',
  },
  {
    id: 'screws', role: 'screw', family: 'fastener', method: 'count', systems: ['spacer'],
    terms: [{ measure: 'jambScrews', rate: 1 }],
    note: '3 in stainless screws in the joints at no more than 16 in on centre along each fixed jamb and head, ' +
      'counted from both ends, wherever the sections fall.',
    source: 'common practice (the spacer maker’s instructions)',
  },
  {
    id: 'anchors', role: 'panelAnchor', family: 'anchor', method: 'count', systems: ['mortar'],
    terms: [{ measure: 'panelAnchors', rate: 1 }],
    note: 'Panel anchors at no more than 16 in on centre along each fixed jamb and across a fixed head, counted from both ends.',
    source: 'IRC 2021 R607.5.2.1 (from memory)',
  },
  {
    id: 'reinforcement', role: 'jointReinforcement', family: 'reinforcement', method: 'length', systems: ['mortar'],
    measures: ['reinforcedJointLengthMm'], lapMm: 6 * MM_PER_INCH,
    note: 'Joint reinforcement in bed joints at no more than 16 in on centre, lapped at least 6 in.',
    source: 'IRC 2021 R607.9 (from memory)',
  },
  {
    id: 'expansion', role: 'expansionStrip', family: 'strip', method: 'length', systems: BOTH,
    measures: ['jambLengthMm', 'headLengthMm'],
    note: 'Expansion strip at framed jambs and head.', source: 'IRC 2021 R607.7 (from memory)',
  },
  {
    id: 'sections', role: 'wallSection', family: 'wallSection', method: 'count', systems: BOTH,
    terms: [{ measure: 'sections', rate: 1 }],
    note: 'Shop assembly of each planned section, where the supplier sells it.', source: 'section plan', optional: true,
  },
]

/** Each measure in the trade's words, for formulas and the Explain panel (screens translate the same keys). */
export const MEASURE_WORDS: Record<MeasureName, string> = {
  standardBlocks: 'plain blocks',
  endBlocks: 'units finished on one edge',
  doubleEndBlocks: 'units finished on two edges',
  cornerBlocks: '90° corner units',
  angleBlocks: '45° angle units',
  interiorIntersectionsStraight: 'joint crossings inside the panel',
  interiorIntersectionsCurved: 'joint crossings on the curve',
  edgeIntersectionsStraight: 'joint ends at the edges',
  edgeIntersectionsCurved: 'joint ends at the edges of the curve',
  perimeterFt: 'panel perimeter (ft)',
  sections: 'sections',
  jambScrews: 'screws at fixing points',
  panelAnchors: 'anchors at fixing points',
  bottomRunMm: 'curb bed',
  sectionTopsMm: 'section tops',
  sectionSeamsMm: 'seams between sections',
  jambLengthMm: 'fixed jambs',
  headLengthMm: 'fixed head',
  reinforcedJointLengthMm: 'reinforced bed joints',
  groutVolumeMl: 'grout volume (mL)',
  mortarVolumeMl: 'mortar volume (mL)',
}

export interface RuleNeed {
  ruleId: string
  role: MaterialRole
  family: MaterialFamily
  /** Exact need in the item's stock unit, before waste. */
  needed: number
  /** The raw amount the rule works from (count, mm or mL); 0 means nothing is needed. */
  demand: number
  unit: string
  inputs: Record<string, string | number>
  formula: string
  issue?: string
}

const round = (value: number, places: number) => Number(value.toFixed(places))
const n = (value: number, places = 2) => round(value, places).toString()

function countNeed(rule: Extract<MaterialRule, { method: 'count' }>, wall: MeasuredWall) {
  const parts = rule.terms.filter((t) => t.rate > 0)
  const needed = parts.reduce((sum, t) => sum + t.rate * wall.measures[t.measure], 0)
  const inputs = Object.fromEntries(parts.map((t) => [t.measure, round(wall.measures[t.measure], 3)]))
  const term = (t: (typeof parts)[number]) => {
    const how = wall.derivation[t.measure]
    return `${n(wall.measures[t.measure], 3)} ${MEASURE_WORDS[t.measure]}${how ? ` (${how})` : ''}${t.rate === 1 ? '' : ` × ${t.rate}`}`
  }
  const formula = () => parts.map(term).join(' + ') + ` = ${n(needed, 3)}`
  return { needed, demand: needed, inputs, formula }
}

function lengthOf(measures: MeasureName[], wall: MeasuredWall) {
  const total = measures.reduce((sum, m) => sum + wall.measures[m], 0)
  const inputs = Object.fromEntries(measures.map((m) => [m, round(wall.measures[m], 1)]))
  const sum = () => `${measures.map((m) => `${MEASURE_WORDS[m]} ${n(wall.measures[m], 1)} mm`).join(' + ')} = ${n(total, 1)} mm`
  return { total, inputs, sum }
}

function pieceNeed(rule: Extract<MaterialRule, { method: 'length' }>, wall: MeasuredWall, item?: CatalogItem) {
  const { total, inputs, sum } = lengthOf(rule.measures, wall)
  if (!item?.pieceLengthMm) return { needed: 0, demand: total, inputs, formula: sum, issue: 'the catalog item needs a piece length' }
  const pieceLengthMm = item.pieceLengthMm
  const lap = rule.lapMm ?? 0
  const perPiece = item.pieceLengthMm - lap
  const lapText = lap > 0 ? ` − ${n(lap, 1)} mm lap` : ''
  return {
    needed: total / perPiece,
    demand: total,
    inputs: { ...inputs, pieceLengthMm, lapMm: round(lap, 1) },
    formula: () => `${sum()}; ÷ (${n(pieceLengthMm, 1)} mm${lapText}) = ${n(total / perPiece, 3)} pieces`,
  }
}

function beadNeed(rule: Extract<MaterialRule, { method: 'bead' }>, wall: MeasuredWall, item?: CatalogItem) {
  const { total, inputs, sum } = lengthOf(rule.measures, wall)
  const beads = rule.beadsPerLength ?? 1
  const cartridge = item?.cartridgeMl ?? STANDARD_CARTRIDGE_ML
  const area = (Math.PI * rule.beadDiameterMm ** 2) / 4
  const volumeMl = (area * total * beads) / 1000
  return {
    needed: volumeMl / cartridge,
    demand: total,
    inputs: { ...inputs, beadDiameterMm: round(rule.beadDiameterMm, 3), beadsPerLength: beads, cartridgeMl: round(cartridge, 2) },
    formula: () =>
      `beads: ${sum()}${beads > 1 ? ` × ${beads} faces` : ''}, each a ${n(rule.beadDiameterMm, 3)} mm round bead ` +
      `(area π × ${n(rule.beadDiameterMm, 3)}² ÷ 4 = ${n(area, 2)} mm²); ` +
      `volume ${n(volumeMl, 1)} mL ÷ ${n(cartridge, 2)} mL per tube = ${n(volumeMl / cartridge, 3)} tubes`,
  }
}

function volumeNeed(rule: Extract<MaterialRule, { method: 'volume' }>, wall: MeasuredWall, item?: CatalogItem) {
  const volumeMl = wall.measures[rule.measure]
  const inputs: Record<string, string | number> = { [rule.measure]: round(volumeMl, 1) }
  const perBag = item?.[rule.yieldField]
  const derivation = () => wall.derivation[rule.measure] ?? ''
  if (!perBag) return { needed: 0, demand: volumeMl, inputs, formula: derivation, issue: `the catalog item needs ${rule.yieldField}` }
  return {
    needed: volumeMl / perBag,
    demand: volumeMl,
    inputs: { ...inputs, [rule.yieldField]: perBag },
    formula: () => `${derivation()} = ${n(volumeMl, 1)} mL; ÷ ${n(perBag, 1)} mL per bag = ${n(volumeMl / perBag, 3)} bags`,
  }
}

/**
 * The exact need one rule gives for one wall, in the resolved item's stock unit. The formula's text is
 * written when read: a job of many walls only shows a few walls' working in a line's explanation.
 */
export function evaluateRule(rule: MaterialRule, wall: MeasuredWall, item: CatalogItem | undefined): RuleNeed {
  const result: { needed: number; demand: number; inputs: Record<string, string | number>; formula: () => string; issue?: string } =
    rule.method === 'count' ? countNeed(rule, wall)
      : rule.method === 'length' ? pieceNeed(rule, wall, item)
        : rule.method === 'bead' ? beadNeed(rule, wall, item)
          : volumeNeed(rule, wall, item)
  let text: string | undefined
  return {
    ruleId: rule.id,
    role: rule.role,
    family: rule.family,
    unit: item?.unit ?? defaultUnits[rule.role],
    needed: result.needed,
    demand: result.demand,
    inputs: result.inputs,
    ...(result.issue ? { issue: result.issue } : {}),
    get formula() {
      return (text ??= result.formula())
    },
  }
}

/** A family's waste percent: the option if given, else the default. */
export function wasteFor(family: MaterialFamily, overrides: WastePct = {}): number {
  return overrides[family] ?? defaultWastePct[family]
}
