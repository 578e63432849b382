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
import { EXPLAIN_EN, explainText, figure as n, joinTokens, type ExplainToken } from './explainWords.js'
import type { MeasureName, MeasuredWall } from './wallMeasures.js'

const RULE_NOTE = EXPLAIN_EN.ruleNote
const RULE_SOURCE = EXPLAIN_EN.ruleSource

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
    note: RULE_NOTE.blocks, source: RULE_SOURCE.blocks,
  },
  {
    id: 'end-blocks', role: 'endBlock', family: 'block', method: 'count', systems: BOTH,
    terms: [{ measure: 'endBlocks', rate: 1 }],
    note: RULE_NOTE.endBlocks, source: RULE_SOURCE.endBlocks,
  },
  {
    id: 'double-end-blocks', role: 'doubleEndBlock', family: 'block', method: 'count', systems: BOTH,
    terms: [{ measure: 'doubleEndBlocks', rate: 1 }], fallbackRole: 'endBlock',
    note: RULE_NOTE.doubleEndBlocks, source: RULE_SOURCE.doubleEndBlocks,
  },
  {
    id: 'corner-blocks', role: 'cornerBlock', family: 'block', method: 'count', systems: BOTH,
    terms: [{ measure: 'cornerBlocks', rate: 1 }],
    note: RULE_NOTE.cornerBlocks, source: RULE_SOURCE.cornerBlocks,
  },
  {
    id: 'angle-blocks', role: 'angleBlock', family: 'block', method: 'count', systems: BOTH,
    terms: [{ measure: 'angleBlocks', rate: 1 }],
    note: RULE_NOTE.angleBlocks, source: RULE_SOURCE.angleBlocks,
  },
  {
    id: 'spacers', role: 'spacer', family: 'spacer', method: 'count', systems: ['spacer'],
    terms: [
      { measure: 'interiorIntersectionsStraight', rate: 1 },
      { measure: 'edgeIntersectionsStraight', rate: 1 },
      { measure: 'perimeterFt', rate: 0 },
    ],
    note: RULE_NOTE.spacers, source: RULE_SOURCE.spacers,
  },
  {
    id: 'arc-spacers', role: 'arcSpacer', family: 'spacer', method: 'count', systems: ['spacer'],
    terms: [{ measure: 'interiorIntersectionsCurved', rate: 1 }, { measure: 'edgeIntersectionsCurved', rate: 1 }],
    note: RULE_NOTE.arcSpacers, source: RULE_SOURCE.arcSpacers,
  },
  {
    id: 'spacer-base', role: 'spacerBase', family: 'spacer', method: 'length', systems: ['spacer'],
    measures: ['bottomRunMm'],
    note: RULE_NOTE.spacerBase, source: RULE_SOURCE.spacerBase,
  },
  {
    id: 'sealant-spacer', role: 'sealant', family: 'sealant', method: 'bead', systems: ['spacer'],
    measures: ['bottomRunMm', 'sectionTopsMm', 'sectionSeamsMm'], beadDiameterMm: SEALANT_BEAD_MM,
    note: RULE_NOTE.sealantSpacer, source: RULE_SOURCE.sealantSpacer,
  },
  {
    id: 'sealant-wet', role: 'sealant', family: 'sealant', method: 'bead', systems: ['spacer'], wetAreaOnly: true,
    measures: ['jambLengthMm', 'headLengthMm'], beadDiameterMm: SEALANT_BEAD_MM, beadsPerLength: 2,
    note: RULE_NOTE.sealantWet, source: RULE_SOURCE.sealantWet,
  },
  {
    id: 'sealant-mortar', role: 'sealant', family: 'sealant', method: 'bead', systems: ['mortar'],
    measures: ['jambLengthMm', 'headLengthMm'], beadDiameterMm: SEALANT_BEAD_MM, beadsPerLength: 2,
    note: RULE_NOTE.sealantMortar, source: RULE_SOURCE.sealantMortar,
  },
  {
    id: 'grout', role: 'grout', family: 'grout', method: 'volume', systems: ['spacer'],
    measure: 'groutVolumeMl', yieldField: 'groutYieldMl',
    note: RULE_NOTE.grout, source: RULE_SOURCE.grout,
  },
  {
    id: 'mortar', role: 'mortar', family: 'grout', method: 'volume', systems: ['mortar'],
    measure: 'mortarVolumeMl', yieldField: 'mortarYieldMl',
    note: RULE_NOTE.mortar, source: RULE_SOURCE.mortar,
  },
  {
    id: 'screws', role: 'screw', family: 'fastener', method: 'count', systems: ['spacer'],
    terms: [{ measure: 'jambScrews', rate: 1 }],
    note: RULE_NOTE.screws, source: RULE_SOURCE.screws,
  },
  {
    id: 'anchors', role: 'panelAnchor', family: 'anchor', method: 'count', systems: ['mortar'],
    terms: [{ measure: 'panelAnchors', rate: 1 }],
    note: RULE_NOTE.anchors, source: RULE_SOURCE.anchors,
  },
  {
    id: 'reinforcement', role: 'jointReinforcement', family: 'reinforcement', method: 'length', systems: ['mortar'],
    measures: ['reinforcedJointLengthMm'], lapMm: 6 * MM_PER_INCH,
    note: RULE_NOTE.reinforcement, source: RULE_SOURCE.reinforcement,
  },
  {
    id: 'expansion', role: 'expansionStrip', family: 'strip', method: 'length', systems: BOTH,
    measures: ['jambLengthMm', 'headLengthMm'],
    note: RULE_NOTE.expansion, source: RULE_SOURCE.expansion,
  },
  {
    id: 'sections', role: 'wallSection', family: 'wallSection', method: 'count', systems: BOTH,
    terms: [{ measure: 'sections', rate: 1 }],
    note: RULE_NOTE.sections, source: RULE_SOURCE.sections, optional: true,
  },
]

/** A rule's note and source keys in the explanation's phrases: the rule's id in camel case. */
export const ruleWordKey = (id: string) => id.replace(/-(\w)/g, (_, c: string) => c.toUpperCase())

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
  /** The working, in English (written when read). */
  formula: string
  /** The same working as phrases a screen words in its language. */
  formulaTokens: ExplainToken[]
  issue?: string
}

const round = (value: number, places: number) => Number(value.toFixed(places))
const phrase = (k: string, p?: Record<string, string | number>): ExplainToken => ({ k, ...(p ? { p } : {}) })
type Working = () => ExplainToken[]

function countNeed(rule: Extract<MaterialRule, { method: 'count' }>, wall: MeasuredWall) {
  const parts = rule.terms.filter((t) => t.rate > 0)
  const needed = parts.reduce((sum, t) => sum + t.rate * wall.measures[t.measure], 0)
  const inputs = Object.fromEntries(parts.map((t) => [t.measure, round(wall.measures[t.measure], 3)]))
  const term = (t: (typeof parts)[number]): ExplainToken[] => {
    const how = wall.derivation[t.measure]
    return [
      `${n(wall.measures[t.measure], 3)} `, phrase(`measure.${t.measure}`),
      ...(how ? [' (', ...how, ')'] : []),
      ...(t.rate === 1 ? [] : [` × ${t.rate}`]),
    ]
  }
  const formula: Working = () => [...joinTokens(parts.map(term), ' + '), ` = ${n(needed, 3)}`]
  return { needed, demand: needed, inputs, formula }
}

function lengthOf(measures: MeasureName[], wall: MeasuredWall) {
  const total = measures.reduce((sum, m) => sum + wall.measures[m], 0)
  const inputs = Object.fromEntries(measures.map((m) => [m, round(wall.measures[m], 1)]))
  const sum = (): ExplainToken[] => [
    ...joinTokens(measures.map((m) => [phrase(`measure.${m}`), ` ${n(wall.measures[m], 1)} mm`]), ' + '),
    ` = ${n(total, 1)} mm`,
  ]
  return { total, inputs, sum }
}

function pieceNeed(rule: Extract<MaterialRule, { method: 'length' }>, wall: MeasuredWall, item?: CatalogItem) {
  const { total, inputs, sum } = lengthOf(rule.measures, wall)
  if (!item?.pieceLengthMm) return { needed: 0, demand: total, inputs, formula: sum, issue: 'the catalog item needs a piece length' }
  const pieceLengthMm = item.pieceLengthMm
  const lap = rule.lapMm ?? 0
  const perPiece = item.pieceLengthMm - lap
  const pieces = n(total / perPiece, 3)
  return {
    needed: total / perPiece,
    demand: total,
    inputs: { ...inputs, pieceLengthMm, lapMm: round(lap, 1) },
    formula: (): ExplainToken[] => [
      ...sum(), '; ',
      lap > 0 ? phrase('step.piecesLapped', { piece: n(pieceLengthMm, 1), lap: n(lap, 1), pieces }) : phrase('step.pieces', { piece: n(pieceLengthMm, 1), pieces }),
    ],
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
    formula: (): ExplainToken[] => [
      phrase('step.beads'), ': ', ...sum(),
      ...(beads > 1 ? [' ', phrase('step.faces', { n: beads })] : []), ', ',
      phrase('step.roundBead', { d: n(rule.beadDiameterMm, 3), area: n(area, 2) }), '; ',
      phrase('step.tubes', { volume: n(volumeMl, 1), cartridge: n(cartridge, 2), tubes: n(volumeMl / cartridge, 3) }),
    ],
  }
}

function volumeNeed(rule: Extract<MaterialRule, { method: 'volume' }>, wall: MeasuredWall, item?: CatalogItem) {
  const volumeMl = wall.measures[rule.measure]
  const inputs: Record<string, string | number> = { [rule.measure]: round(volumeMl, 1) }
  const perBag = item?.[rule.yieldField]
  const derivation = () => wall.derivation[rule.measure] ?? []
  if (!perBag) return { needed: 0, demand: volumeMl, inputs, formula: derivation, issue: `the catalog item needs ${rule.yieldField}` }
  return {
    needed: volumeMl / perBag,
    demand: volumeMl,
    inputs: { ...inputs, [rule.yieldField]: perBag },
    formula: (): ExplainToken[] => [
      ...derivation(), ` = ${n(volumeMl, 1)} mL; `,
      phrase('step.bags', { perBag: n(perBag, 1), bags: n(volumeMl / perBag, 3) }),
    ],
  }
}

/**
 * The exact need one rule gives for one wall, in the resolved item's stock unit. The formula is worked
 * out when read: a job of many walls only shows a few walls' working in a line's explanation.
 */
export function evaluateRule(rule: MaterialRule, wall: MeasuredWall, item: CatalogItem | undefined): RuleNeed {
  const result: { needed: number; demand: number; inputs: Record<string, string | number>; formula: Working; issue?: string } =
    rule.method === 'count' ? countNeed(rule, wall)
      : rule.method === 'length' ? pieceNeed(rule, wall, item)
        : rule.method === 'bead' ? beadNeed(rule, wall, item)
          : volumeNeed(rule, wall, item)
  let tokens: ExplainToken[] | undefined
  return {
    ruleId: rule.id,
    role: rule.role,
    family: rule.family,
    unit: item?.unit ?? defaultUnits[rule.role],
    needed: result.needed,
    demand: result.demand,
    inputs: result.inputs,
    ...(result.issue ? { issue: result.issue } : {}),
    get formulaTokens() {
      return (tokens ??= result.formula())
    },
    get formula() {
      return explainText(this.formulaTokens)
    },
  }
}

/** A family's waste percent: the option if given, else the default. */
export function wasteFor(family: MaterialFamily, overrides: WastePct = {}): number {
  return overrides[family] ?? defaultWastePct[family]
}
