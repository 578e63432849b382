// The words of a bill line's explanation (rule, formula, rounding) as keyed phrases with their figures, so a
// screen can word them in the reader's language. The English below is the text the computation writes for
// logs, exports and saved bills, and the client's English messages use this same table (one wording).
// Templates use the message files' syntax: `{name}` is a value; no literal @ $ | or braces.

/** Literal text (figures, symbols, an admin's own note) or a phrase by key with its values. */
export type ExplainToken = string | { k: string; p?: Record<string, string | number> }

/** The explanation of a line as phrases: what screens word; `rule`, `formula` and `rounding` hold the English. */
export interface ExplainPhrases {
  rule: ExplainToken[]
  formula: ExplainToken[]
  rounding: ExplainToken[]
}

export const EXPLAIN_EN = {
  /** Each measure as a formula names it. */
  measure: {
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
  },
  /** The default material rules' notes, by rule (an admin's edited note is shown as typed). */
  ruleNote: {
    blocks: 'Every cell of the panel not taken by an end or corner block.',
    endBlocks: 'Every exposed edge gets a finished unit: one per course at each free end, one per block across a free top.',
    doubleEndBlocks: 'Where a free top meets a free end the unit shows two edges: a unit finished on both.',
    cornerBlocks: 'One corner unit per course at each 90° corner.',
    angleBlocks: 'One 45° angle unit per course at each 45° corner.',
    spacers: 'One spacer at each joint crossing; at the edges the same piece with its outer legs snapped off. The per-foot rate is for makers with perimeter strips.',
    arcSpacers: 'Wedge spacers wherever a head joint on the curve crosses a bed joint or meets an edge.',
    spacerBase: 'A base layer of spacer material along the curb under the first course.',
    sealantSpacer: 'A 1/4 in bead in the curb bed, on top of each section that carries another and in the seams where sections meet. Joints inside shop-built sections are sealed in the shop, as part of the section build.',
    sealantWet: 'In a wet area, a bead along each fixed jamb full height and along a fixed head, on both faces.',
    sealantMortar: 'Sealant over the expansion joints at jambs and head, both faces.',
    grout: 'Face joints filled from each face to the spacer: joint width × joint length × fill depth, both faces.',
    mortar: 'Head, bed and sill joints full depth; jambs and head are expansion joints kept free of mortar (IRC 2021 R607.7).',
    screws: '3 in stainless screws in the joints at no more than 16 in on centre along each fixed jamb and head, counted from both ends, wherever the sections fall.',
    anchors: 'Panel anchors at no more than 16 in on centre along each fixed jamb and across a fixed head, counted from both ends.',
    reinforcement: 'Joint reinforcement in bed joints at no more than 16 in on centre, lapped at least 6 in.',
    expansion: 'Expansion strip at framed jambs and head.',
    sections: 'Shop assembly of each planned section, where the supplier sells it.',
    handEntered: 'Entered by hand',
    baseFollow: 'One base made to order for the takeoff, its footprint, curb radius and arc taken from {wall} as built; drain and entry as given.',
    baseCheck: 'One base made to order for the takeoff, to the size entered, checked against {wall}; drain and entry as given.',
    baseEntered: 'One base made to order for the takeoff, to the size entered; drain and entry as given.',
  },
  /** Where each default rule comes from. */
  ruleSource: {
    blocks: 'wall layout',
    endBlocks: 'common practice',
    doubleEndBlocks: 'common practice',
    cornerBlocks: 'common practice',
    angleBlocks: 'common practice',
    spacers: 'common practice',
    arcSpacers: 'common practice',
    spacerBase: 'common practice',
    sealantSpacer: 'common practice',
    sealantWet: 'common practice (the spacer maker’s instructions)',
    sealantMortar: 'common practice',
    grout: 'common practice (the spacer maker’s fill depth)',
    mortar: 'IRC 2021 R607.7, R607.10',
    screws: 'common practice (the spacer maker’s instructions)',
    anchors: 'IRC 2021 R607.5.2.1 (from memory)',
    reinforcement: 'IRC 2021 R607.9 (from memory)',
    expansion: 'IRC 2021 R607.7 (from memory)',
    sections: 'section plan',
  },
  /** How each measure was found. */
  derive: {
    standardBlocks: '{across} across × {courses} courses = {total}, less {finished} finished and {corners} corner units',
    exposedEdges: 'exposed edges',
    freeStart: 'free start {n} courses',
    freeEnd: 'free end {n} courses',
    freeTop: 'free top {n} blocks across',
    noFreeEdges: 'no free edges',
    oneEdge: '{n} units show one edge',
    doubleEndBlocks: '{n} units show two edges, where the free top meets a free end',
    cornerBlocks: '{courses} courses × 90° corners',
    angleBlocks: '{courses} courses × 45° corners',
    interiorIntersectionsStraight: '{joints} straight head joints × {beds} inner bed joints',
    interiorIntersectionsCurved: '{joints} wedge head joints on the curve × {beds} inner bed joints',
    edgeIntersectionsStraight: '2 × {joints} head joints (curb and top) + 2 × {beds} bed joints (ends)',
    edgeIntersectionsCurved: '2 × {joints} wedge head joints (curb and top)',
    perimeterFt: '2 × ({width} + {height}) mm ÷ 304.8 mm/ft',
    sections: 'sections planned; the {metres} m of joints inside them are sealed in the shop as part of the section build',
    jambScrews: 'screws at no more than {spacing} mm on centre along fixed jambs and head: start jamb {start}, end jamb {end}, head {head}',
    panelAnchors: 'anchors at no more than {spacing} mm on centre along fixed jambs and head: start jamb {start}, end jamb {end}, head {head}',
    bottomRunMm: 'curb bed along the panel, {width} mm',
    sectionTopsMm: 'tops of sections that carry another section',
    sectionSeamsMm: 'vertical seams where sections meet, one course high each',
    jambLengthMm: '{height} mm × {jambs} fixed jambs',
    headLengthMm: 'fixed head {width} mm',
    headFree: 'head is free: none',
    reinforcedJointLengthMm: '{joints} reinforced bed joints × {width} mm',
    groutVolumeMl: 'joint face area {area} m² × grout depth {depth} mm ({perFace} mm from each of {faces} faces to the spacer)',
    mortarVolumeMl: '(joint face area + sill bed) × block depth {depth} mm',
  },
  /** The steps of formulas and rounding. */
  step: {
    pieces: '÷ ({piece} mm) = {pieces} pieces',
    piecesLapped: '÷ ({piece} mm − {lap} mm lap) = {pieces} pieces',
    beads: 'beads',
    faces: '× {n} faces',
    roundBead: 'each a {d} mm round bead (area π × {d}² ÷ 4 = {area} mm²)',
    tubes: 'volume {volume} mL ÷ {cartridge} mL per tube = {tubes} tubes',
    bags: '÷ {perBag} mL per bag = {bags} bags',
    otherWalls: '{n} other walls',
    total: 'total {n}',
    standIn: 'No {role} is in the catalog for this block: this item stands in.',
    asEntered: '{qty} {unit} as entered',
    none: 'none',
    oneBase: '1 base',
    madeToOrder: 'made to order: exactly 1, no waste allowance',
    waste: '{need} × (1 + {pct} % waste) = {withWaste}',
    roundedUp: 'rounded up to {units} {unit}',
    onePack: 'sold in packs of {size}: {packs} pack = {qty} {unit}',
    packs: 'sold in packs of {size}: {packs} packs = {qty} {unit}',
  },
} as const

type Tree = { readonly [k: string]: string | Tree }

function template(key: string): string | undefined {
  let node: string | Tree | undefined = EXPLAIN_EN
  for (const part of key.split('.')) node = typeof node === 'object' ? node[part] : undefined
  return typeof node === 'string' ? node : undefined
}

/** One phrase in English. */
export function englishPhrase(key: string, params: Record<string, string | number> = {}): string {
  const text = template(key) ?? key
  return text.replace(/\{(\w+)\}/g, (_, name: string) => String(params[name] ?? ''))
}

/** Tokens as text, each phrase worded by `word` (English by default). */
export function explainText(tokens: readonly ExplainToken[], word: (key: string, params?: Record<string, string | number>) => string = englishPhrase): string {
  let out = ''
  for (const t of tokens) out += typeof t === 'string' ? t : word(t.k, t.p)
  return out
}

/** Tokens joined by a separator. */
export function joinTokens(groups: readonly (readonly ExplainToken[])[], separator: string): ExplainToken[] {
  const out: ExplainToken[] = []
  groups.forEach((g, i) => {
    if (i > 0) out.push(separator)
    out.push(...g)
  })
  return out
}

/** A number as the formulas write it: at most `places` decimals, no trailing zeros. */
export const figure = (value: number, places = 2) => Number(value.toFixed(places)).toString()
