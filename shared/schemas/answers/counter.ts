// The answers' schemas for the interfaces in shared/schemas/counter.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { TakeoffSummary, TakeoffRecord, BomSummary, JobDetail, WarehouseAvailability, LineAvailability, RuleRecord, StoredExplanation, BomLineRecord, BomRecord } from '../counter.js'
import type { ComputeAnswer } from '../../counter/counterBill.js'
import type { BomExplanation, TakeoffTotals, WallResult } from '../../takeoff/billOfMaterials.js'
import { customerSummarySchema, jobSummarySchema } from '../counter.js'
import { materialRoleSchema, takeoffSchema } from '../takeoff.js'
import { materialRuleShape } from './terms.js'
import { cautionShape } from './cautions.js'

const explainTokensShape = z.array(z.union([z.string(), z.object({ k: z.string(), p: z.record(z.string(), z.union([z.string(), z.number()])).optional() })]))

/** What a bill's explanation says, in English and as phrases for the reader's language. */
const bomExplanationShape = z.object({
  inputs: z.record(z.string(), z.union([z.string(), z.number()])),
  rule: z.string(),
  formula: z.string(),
  rounding: z.string(),
  words: z.object({ rule: explainTokensShape, formula: explainTokensShape, rounding: explainTokensShape }).optional(),
}) satisfies z.ZodType<BomExplanation>

const takeoffTotalsShape = z.object({
  blocksNeeded: z.number(),
  blocksOrdered: z.number(),
  sections: z.number(),
  panelAreaM2: z.number(),
  panelAreaFt2: z.number(),
  blockWeightKg: z.number(),
  lines: z.number(),
  stops: z.number(),
}) satisfies z.ZodType<TakeoffTotals>

/**
 * A wall as laid out, or refused. The layout's own figures (geometry, sections, measures, fixings) are the takeoff
 * code's, unit-tested in shared/takeoff; here they are held to be present, with the cautions and a refusal in full.
 */
const wallResultShape = z.discriminatedUnion('status', [
  z.object({
    status: z.literal('ok'),
    name: z.string(),
    block: z.record(z.string(), z.unknown()),
    geometry: z.record(z.string(), z.unknown()),
    curve: z.array(z.record(z.string(), z.unknown())).optional(),
    sections: z.record(z.string(), z.unknown()),
    drawing: z.record(z.string(), z.unknown()).optional(),
    measures: z.record(z.string(), z.unknown()),
    fixings: z.array(z.record(z.string(), z.unknown())),
    cautions: z.array(cautionShape),
  }),
  z.object({
    status: z.literal('refused'),
    name: z.string(),
    reason: z.string(),
    key: z.string(),
    params: z.record(z.string(), z.union([z.string(), z.number()])),
    smallestRadiusMm: z.number().optional(),
    cautions: z.array(cautionShape),
  }),
]) as unknown as z.ZodType<WallResult>

const takeoffSummaryShape = z.object({
  id: z.number(),
  jobId: z.number(),
  name: z.string(),
  walls: z.number(),
  updatedAt: z.string()
}) satisfies z.ZodType<TakeoffSummary>

export const takeoffRecordShape = takeoffSummaryShape.extend({
  version: z.number(),
  input: takeoffSchema
}) satisfies z.ZodType<TakeoffRecord>

const bomSummaryShape = z.object({
  id: z.number(),
  revision: z.number(),
  takeoffId: z.number().nullable(),
  lines: z.number(),
  createdAt: z.string(),
  createdBy: z.string().nullable()
}) satisfies z.ZodType<BomSummary>

export const jobDetailShape = jobSummarySchema.and(z.object({
  customer: customerSummarySchema,
  takeoffList: z.array(takeoffSummaryShape),
  boms: z.array(bomSummaryShape)
})) satisfies z.ZodType<JobDetail>

const warehouseAvailabilityShape = z.object({
  warehouseId: z.number(),
  code: z.string(),
  name: z.string(),
  available: z.number()
}) satisfies z.ZodType<WarehouseAvailability>

const lineAvailabilityShape = z.object({
  itemId: z.number(),
  warehouses: z.array(warehouseAvailabilityShape),
  total: z.number()
}) satisfies z.ZodType<LineAvailability>

export const ruleRecordShape = z.object({
  rule: materialRuleShape,
  enabled: z.boolean(),
  origin: z.union([z.literal('default'), z.literal('changed'), z.literal('added')])
}) satisfies z.ZodType<RuleRecord>

const storedExplanationShape = bomExplanationShape.extend({
  needed: z.number(),
  packs: z.number().optional(),
  packSize: z.number().optional(),
  walls: z.array(z.string())
}) satisfies z.ZodType<StoredExplanation>

const bomLineRecordShape = z.object({
  id: z.number(),
  lineNo: z.number(),
  itemId: z.number().nullable(),
  role: z.string().nullable(),
  sku: z.string().nullable(),
  description: z.string(),
  qty: z.number(),
  unit: z.string(),
  madeToOrder: z.boolean(),
  spec: z.record(z.string(), z.unknown()).nullable(),
  explanation: storedExplanationShape.nullable(),
  pickedQty: z.number(),
  orderedQty: z.number()
}) satisfies z.ZodType<BomLineRecord>

export const bomRecordShape = z.object({
  id: z.number(),
  jobId: z.number(),
  revision: z.number(),
  takeoffId: z.number().nullable(),
  takeoffName: z.string().nullable(),
  createdAt: z.string(),
  createdBy: z.string().nullable(),
  job: jobSummarySchema,
  unit: z.union([z.literal('in'), z.literal('mm')]),
  lines: z.array(bomLineRecordShape),
  cautions: z.array(cautionShape),
  totals: takeoffTotalsShape.nullable(),
  walls: z.array(wallResultShape),
  availability: z.array(lineAvailabilityShape),
  salesOrder: z.object({ id: z.number(), number: z.string() }).nullable()
}) satisfies z.ZodType<BomRecord>


const blockSwapShape = z.object({
  sku: z.string(),
  name: z.string(),
  nominal: z.string(),
  onEnd: z.boolean(),
  smallestRadiusMm: z.number().optional(),
  gapMm: z.number().optional(),
})

const counterBillLineShape = z.object({
  role: z.union([materialRoleSchema, z.literal('loose')]),
  sku: z.string().nullable(),
  name: z.string(),
  quantity: z.number(),
  unit: z.string(),
  packs: z.number().optional(),
  packSize: z.number().optional(),
  needed: z.number(),
  walls: z.array(z.string()),
  explanation: bomExplanationShape,
  issue: z.string().optional(),
  itemId: z.number().nullable(),
  madeToOrder: z.boolean(),
})

/** The takeoff computed at the counter: the bill, each wall in brief, cautions, totals and availability. */
export const computeAnswerShape = z.object({
  lines: z.array(counterBillLineShape),
  cautions: z.array(cautionShape),
  totals: takeoffTotalsShape,
  unit: z.enum(['in', 'mm']),
  advice: z.array(z.object({ wall: z.number(), reason: z.enum(['radius', 'leftover']), swaps: z.array(blockSwapShape) })),
  walls: z.array(z.object({
    name: z.string(),
    status: z.enum(['ok', 'refused']),
    reason: z.string().optional(),
    key: z.string().optional(),
    params: z.record(z.string(), z.union([z.string(), z.number()])).optional(),
    blocksAcross: z.number().optional(),
    courses: z.number().optional(),
    totalBlocks: z.number().optional(),
    sections: z.number().optional(),
    curves: z.array(z.object({
      insideRadiusMm: z.number(),
      blocks: z.number(),
      anglePerBlockDeg: z.number(),
      builtAngleDeg: z.number(),
      insideJointMm: z.number(),
      outsideJointMm: z.number(),
    })).optional(),
  })),
  showerBase: z.object({
    label: z.string(),
    fit: z.enum(['follow', 'check', 'none']),
    wall: z.string().optional(),
    mismatches: z.array(z.object({ field: z.string() })),
  }).optional(),
  availability: z.array(lineAvailabilityShape),
  blockers: z.array(z.string()),
}) satisfies z.ZodType<ComputeAnswer>
