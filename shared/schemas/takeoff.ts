// The takeoff as the contractor describes it: walls, a shower base and loose lines. The form and the
// API validate with these same schemas; lengths are millimetres, quantities whole numbers.
import { z } from 'zod'
import { issueOf } from '../errors/zodProblems.js'
import { estimateWallBlocks, TAKEOFF_LIMITS } from '../takeoff/bounds.js'

const L = TAKEOFF_LIMITS
const mm = z.number().positive().max(1_000_000)
// Caps keep a mistyped figure from freezing the live form; real panels are far smaller (R607.4).
/** A length on site: an opening, a height, a radius. Nobody builds a glass block run over 100 ft. */
const siteMm = z.number().positive().max(L.lengthMm)
const wholeCount = z.number().int().positive().max(L.blocksAcross)
const courseCount = z.number().int().positive().max(L.courses)

export const lengthUnitSchema = z.enum(['in', 'mm'])

export const thicknessClassSchema = z.enum(['standard', 'thin'])

export const blockSpecSchema = z.object({
  /** Trade label such as `8x8` or `190x190`; the actual sizes below are what the math uses. */
  nominal: z.string().trim().min(1).max(40),
  faceWidthMm: z.number().min(L.blockFaceMinMm).max(L.blockFaceMaxMm),
  faceHeightMm: z.number().min(L.blockFaceMinMm).max(L.blockFaceMaxMm),
  depthMm: z.number().min(L.blockDepthMinMm).max(L.blockDepthMaxMm),
  thicknessClass: thicknessClassSchema,
  weightKg: z.number().positive().max(100),
  pattern: z.string().trim().max(60).optional(),
})

export const jointKindSchema = z.enum(['spacer', 'mortar'])

export const jointSystemSchema = z
  .object({
    kind: jointKindSchema,
    /** Head and bed joint width. */
    jointMm: z.number().positive().max(25),
    /** Inside (tight-side) joint on curves; defaults to the joint, or 1/8 in for mortar. */
    curveInsideJointMm: z.number().positive().max(25).optional(),
    /** Widest joint allowed on the outside of a curve; defaults to 5/8 in. */
    maxOutsideJointMm: z.number().positive().max(50).optional(),
    /** Expansion allowance at each jamb and the head; defaults to 3/8 in. */
    expansionMm: z.number().positive().max(100).optional(),
  })
  .refine((j) => j.maxOutsideJointMm === undefined || j.maxOutsideJointMm > (j.curveInsideJointMm ?? 0), {
    ...issueOf('outside_joint_too_narrow'),
    path: ['maxOutsideJointMm'],
  })

export const turnDirectionSchema = z.enum(['left', 'right'])

export const straightSegmentSchema = z.object({
  kind: z.literal('straight'),
  /** Opening sizing: the rough opening length this segment fills. */
  lengthMm: siteMm.optional(),
  /** Count sizing: blocks across in this segment. */
  blocks: wholeCount.optional(),
})

/**
 * When whole blocks do not close the arc asked for: lay out at the radius where they close it exactly,
 * use one block fewer with wider joints at the same radius, or keep the radius and build a little more arc.
 */
export const curveClosingSchema = z.enum(['radius', 'joints', 'overshoot'])

export const curvedSegmentSchema = z
  .object({
    kind: z.literal('curved'),
    /** Radius of the circle through the blocks' inside corners (the layout line on the floor). */
    insideRadiusMm: siteMm,
    arcAngleDeg: z.number().positive().max(360).optional(),
    /** Length along the inside layout circle. */
    arcLengthMm: siteMm.optional(),
    blocks: wholeCount.optional(),
    direction: turnDirectionSchema,
    /** The clerk's choice when whole blocks overshoot the arc; saved with the takeoff. */
    closing: curveClosingSchema.optional(),
  })
  .refine((s) => [s.arcAngleDeg, s.arcLengthMm, s.blocks].filter((v) => v !== undefined).length === 1, {
    ...issueOf('arc_one_measure'),
    path: ['arcAngleDeg'],
  })

/** A turn made with one corner unit per course: 90° (corner unit) or 45° (angle unit). */
export const cornerSegmentSchema = z.object({
  kind: z.literal('corner'),
  direction: turnDirectionSchema,
  angleDeg: z.union([z.literal(90), z.literal(45)]).optional(),
})

export const segmentSchema = z.discriminatedUnion('kind', [
  straightSegmentSchema,
  curvedSegmentSchema,
  cornerSegmentSchema,
])

export const materialRoleSchema = z.enum([
  'block',
  'endBlock',
  'doubleEndBlock',
  'cornerBlock',
  'angleBlock',
  'spacer',
  'arcSpacer',
  'spacerBase',
  'sealant',
  'grout',
  'mortar',
  'screw',
  'panelAnchor',
  'jointReinforcement',
  'expansionStrip',
  'wallSection',
  'showerBase',
])

export const catalogItemSchema = z.object({
  sku: z.string().trim().min(1).max(64),
  name: z.string().trim().min(1).max(160),
  /** Stock unit the quantity is counted in: each, tube, bag, piece, roll. */
  unit: z.string().trim().min(1).max(20).optional(),
  packSize: z.number().int().positive().max(100_000),
  sellByPack: z.boolean(),
  cartridgeMl: z.number().positive().optional(),
  groutYieldMl: z.number().positive().optional(),
  mortarYieldMl: z.number().positive().optional(),
  /** Length of one stock unit for strips, base material and reinforcement. */
  pieceLengthMm: mm.optional(),
})

/** Which stock item fills each material role. */
export const catalogMapSchema = z.partialRecord(materialRoleSchema, catalogItemSchema)

export const wallSchema = z
  .object({
    name: z.string().trim().min(1).max(80),
    sizing: z.enum(['opening', 'count']),
    /** Opening sizing: rough opening height. */
    heightMm: siteMm.optional(),
    /** Count sizing: courses high. */
    courses: courseCount.optional(),
    block: blockSpecSchema,
    /** Rectangular units set on end: the short side runs along the wall (tighter curves). */
    blockOnEnd: z.boolean().optional(),
    joint: jointSystemSchema,
    segments: z.array(segmentSchema).min(1).max(L.segments),
    /** Exposed ends take end-finish blocks; a free top has no head to fix to. */
    freeEnds: z.object({ start: z.boolean(), end: z.boolean(), top: z.boolean() }),
    exposure: z.enum(['interior', 'exterior']),
    wetArea: z.boolean(),
    designWindPressurePsf: z.number().nonnegative().max(200).optional(),
    /** Per-wall catalog overrides, e.g. a second block in the same takeoff. */
    catalog: catalogMapSchema.optional(),
  })
  .superRefine((wall, ctx) => {
    const opening = wall.sizing === 'opening'
    if (opening && wall.heightMm === undefined) {
      ctx.addIssue({ code: 'custom', ...issueOf('opening_height_needed'), path: ['heightMm'] })
    }
    if (!opening && wall.courses === undefined) {
      ctx.addIssue({ code: 'custom', ...issueOf('courses_needed'), path: ['courses'] })
    }
    const size = estimateWallBlocks(wall)
    if (size.blocks > L.blocksPerWall) {
      const message = `About ${size.blocks} blocks (${size.across} across × ${size.courses} courses); a wall takes at most ${L.blocksPerWall}. Split it into panels.`
      ctx.addIssue({ code: 'custom', message, path: ['segments'], params: { key: 'wall_too_large', ...size, limit: L.blocksPerWall } })
    }
    wall.segments.forEach((segment, index) => {
      if (segment.kind !== 'straight') return
      if (opening && segment.lengthMm === undefined) {
        ctx.addIssue({ code: 'custom', ...issueOf('opening_length_needed'), path: ['segments', index, 'lengthMm'] })
      }
      if (!opening && segment.blocks === undefined) {
        ctx.addIssue({ code: 'custom', ...issueOf('blocks_across_needed'), path: ['segments', index, 'blocks'] })
      }
    })
  })

export const showerBaseSchema = z
  .object({
    widthMm: siteMm,
    depthMm: siteMm,
    /** Curved curb; omit for a straight curb. */
    curb: z.object({ radiusMm: siteMm, arcDeg: z.number().positive().max(360) }).optional(),
    /** The wall the base carries (by name): its size is taken from that wall, or checked against it. */
    wall: z.string().trim().min(1).max(80).optional(),
    /** 'follow': footprint, curb radius and arc come from the wall as built; 'check': as entered, checked. */
    fit: z.enum(['follow', 'check']).optional(),
    /** Drain centre measured from the back-left corner of the footprint. */
    drain: z.object({ fromLeftMm: z.number().nonnegative(), fromBackMm: z.number().nonnegative() }),
    entry: z.enum(['left', 'right', 'center']),
    curbless: z.boolean(),
    note: z.string().trim().max(500).optional(),
  })
  .refine((b) => b.drain.fromLeftMm <= b.widthMm && b.drain.fromBackMm <= b.depthMm, {
    ...issueOf('drain_outside_footprint'),
    path: ['drain'],
  })

export const looseLineSchema = z.object({
  sku: z.string().trim().min(1).max(64),
  name: z.string().trim().min(1).max(160),
  quantity: z.number().int().positive().max(1_000_000),
  unit: z.string().trim().min(1).max(20),
  note: z.string().trim().max(300).optional(),
})

export const takeoffSchema = z
  .object({
    name: z.string().trim().max(120).optional(),
    /** The unit this takeoff is read and printed in; the user's profile unit when absent. */
    unit: lengthUnitSchema.optional(),
    walls: z.array(wallSchema).max(L.walls),
    looseLines: z.array(looseLineSchema).max(500),
    showerBase: showerBaseSchema.optional(),
  })
  .superRefine((takeoff, ctx) => {
    // Bounds before any layout is built: counted from the typed figures in a few steps per segment.
    const blocks = takeoff.walls.reduce((sum, wall) => sum + estimateWallBlocks(wall).blocks, 0)
    if (blocks > L.blocksPerTakeoff) {
      const message = `About ${blocks} blocks in all; a takeoff takes at most ${L.blocksPerTakeoff}. Split the job into several takeoffs.`
      ctx.addIssue({ code: 'custom', message, path: ['walls'], params: { key: 'takeoff_too_large', blocks, limit: L.blocksPerTakeoff } })
    }
  })

// Material rules are data so an admin can edit them later; measures are what a wall's layout yields.
export const materialFamilySchema = z.enum([
  'block',
  'spacer',
  'sealant',
  'grout',
  'fastener',
  'anchor',
  'strip',
  'reinforcement',
  'showerBase',
  'wallSection',
])

export const countMeasureSchema = z.enum([
  'standardBlocks',
  'endBlocks',
  'doubleEndBlocks',
  'cornerBlocks',
  'angleBlocks',
  'interiorIntersectionsStraight',
  'interiorIntersectionsCurved',
  'edgeIntersectionsStraight',
  'edgeIntersectionsCurved',
  'perimeterFt',
  'sections',
  'jambScrews',
  'panelAnchors',
])

export const lengthMeasureSchema = z.enum([
  'bottomRunMm',
  'sectionTopsMm',
  'sectionSeamsMm',
  'jambLengthMm',
  'headLengthMm',
  'reinforcedJointLengthMm',
])

export const volumeMeasureSchema = z.enum(['groutVolumeMl', 'mortarVolumeMl'])

const ruleBase = {
  id: z.string().trim().min(1).max(60),
  role: materialRoleSchema,
  family: materialFamilySchema,
  /** Joint systems the rule applies to. */
  systems: z.array(jointKindSchema).min(1),
  /** Why the rule is what it is, shown in the explanation. */
  note: z.string().max(400),
  source: z.string().max(200),
  /** Skip the line when no catalog item fills the role (e.g. a service not every supplier sells). */
  optional: z.boolean().optional(),
  /** Applies to walls marked as a wet area only (showers). */
  wetAreaOnly: z.boolean().optional(),
  /** When no item fills the role, the item of this role stands in (its line says so). */
  fallbackRole: materialRoleSchema.optional(),
}

export const materialRuleSchema = z.discriminatedUnion('method', [
  z.object({
    ...ruleBase,
    method: z.literal('count'),
    terms: z.array(z.object({ measure: countMeasureSchema, rate: z.number().nonnegative() })).min(1),
  }),
  z.object({
    ...ruleBase,
    method: z.literal('length'),
    measures: z.array(lengthMeasureSchema).min(1),
    lapMm: z.number().nonnegative().optional(),
  }),
  z.object({
    ...ruleBase,
    method: z.literal('bead'),
    measures: z.array(lengthMeasureSchema).min(1),
    beadDiameterMm: z.number().positive().max(50),
    /** Beads along each length, e.g. 2 for both faces. */
    beadsPerLength: z.number().int().positive().max(4).optional(),
  }),
  z.object({
    ...ruleBase,
    method: z.literal('volume'),
    measure: volumeMeasureSchema,
    yieldField: z.enum(['groutYieldMl', 'mortarYieldMl']),
  }),
])

export const wastePctSchema = z.partialRecord(materialFamilySchema, z.number().nonnegative().max(100))

export const sectionOptionsSchema = z
  .object({
    minBlocks: z.number().int().positive().max(200),
    maxBlocks: z.number().int().positive().max(200),
    targetBlocks: z.number().int().positive().max(200),
    liftPerPersonKg: z.number().positive().max(200),
    people: z.number().int().positive().max(8),
    allowanceKg: z.number().nonnegative().max(50),
  })
  .refine((o) => o.minBlocks <= o.maxBlocks, { path: ['minBlocks'], ...issueOf('section_sizes_order') })

/**
 * Site figures a maker's instructions may set differently; an admin edits them under takeoff settings.
 * Each has a default with its source (shared/takeoff/siteFigures.ts).
 */
export const siteFiguresSchema = z.object({
  /** Grout filled into each face joint, from the face to the spacer. */
  groutDepthMm: z.number().positive().max(50),
  /** Anchors or screws along fixed jambs and heads at most this far apart, centre to centre. */
  fixingSpacingMm: z.number().min(100).max(1000),
  /** Space left at a jamb or head after whole blocks that earns a warning. */
  leftoverWarnMm: z.number().positive().max(300),
  /** How far a shower base may differ from the wall it carries before saving for ordering is stopped. */
  baseToleranceMm: z.number().positive().max(100),
  baseToleranceDeg: z.number().positive().max(20),
})

export const takeoffOptionsSchema = z.object({
  unit: lengthUnitSchema,
  rules: z.array(materialRuleSchema).optional(),
  wastePct: wastePctSchema.optional(),
  sections: sectionOptionsSchema.optional(),
  figures: siteFiguresSchema.partial().optional(),
  reinforcementSpacingMm: mm.optional(),
})

export type LengthUnitName = z.infer<typeof lengthUnitSchema>
export type ThicknessClass = z.infer<typeof thicknessClassSchema>
export type BlockSpec = z.infer<typeof blockSpecSchema>
export type JointKind = z.infer<typeof jointKindSchema>
export type JointSystem = z.infer<typeof jointSystemSchema>
export type TurnDirection = z.infer<typeof turnDirectionSchema>
export type CurvedSegment = z.infer<typeof curvedSegmentSchema>
export type CurveClosing = z.infer<typeof curveClosingSchema>
export type SiteFigures = z.infer<typeof siteFiguresSchema>
export type Segment = z.infer<typeof segmentSchema>
export type MaterialRole = z.infer<typeof materialRoleSchema>
export type CatalogItem = z.infer<typeof catalogItemSchema>
export type CatalogMap = z.infer<typeof catalogMapSchema>
export type Wall = z.infer<typeof wallSchema>
export type ShowerBase = z.infer<typeof showerBaseSchema>
export type LooseLine = z.infer<typeof looseLineSchema>
export type Takeoff = z.infer<typeof takeoffSchema>
export type MaterialFamily = z.infer<typeof materialFamilySchema>
export type CountMeasure = z.infer<typeof countMeasureSchema>
export type LengthMeasure = z.infer<typeof lengthMeasureSchema>
export type VolumeMeasure = z.infer<typeof volumeMeasureSchema>
export type MaterialRule = z.infer<typeof materialRuleSchema>
export type WastePct = z.infer<typeof wastePctSchema>
export type SectionOptions = z.infer<typeof sectionOptionsSchema>
export type TakeoffOptions = z.infer<typeof takeoffOptionsSchema>
