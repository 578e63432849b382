// The Counter's requests and answers: contractor accounts, jobs, saved takeoffs, bills of materials,
// and the admin's material rules and role → item mapping. The forms validate with these same schemas.
import { z } from 'zod'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import { idSchema } from './stock.js'
import { seenVersionSchema } from './seenVersion.js'
import {
  jointKindSchema,
  lengthUnitSchema,
  materialFamilySchema,
  materialRoleSchema,
  materialRuleSchema,
  siteFiguresSchema,
  takeoffSchema,
  type CatalogItem,
  type JointKind,
  type MaterialFamily,
  type MaterialRole,
  type MaterialRule,
  type SiteFigures,
  type ThicknessClass,
} from './takeoff.js'
import type { BomExplanation, TakeoffTotals, WallResult } from '../takeoff/billOfMaterials.js'
import type { Caution } from '../takeoff/cautions.js'

const optionalText = (max: number) =>
  z.string().trim().max(max).optional().nullable().transform((v) => (v ? v : null))

export const customerCodeSchema = z
  .string()
  .trim()
  .min(2)
  .max(20)
  .regex(/^[A-Za-z0-9-]+$/, issueCode('customer_code_chars'))
  .transform((v) => v.toUpperCase())

export const customerCreateSchema = z.object({
  code: customerCodeSchema,
  name: z.string().trim().min(1).max(120),
  contactName: optionalText(80),
  email: z.email().max(120).optional().nullable().or(z.literal('')).transform((v) => v || null),
  phone: optionalText(40),
  address: optionalText(200),
  notes: optionalText(2000),
})
export type CustomerCreateInput = z.infer<typeof customerCreateSchema>

/** Changing an account, as the screen loaded it (`version`: a change saved meanwhile is refused). */
export const customerUpdateSchema = customerCreateSchema.partial().extend({ active: z.boolean().optional(), version: seenVersionSchema })
export type CustomerUpdateInput = z.infer<typeof customerUpdateSchema>

export const customerQuerySchema = z.object({
  q: z.string().trim().max(80).optional(),
  active: z.enum(['true', 'false', 'all']).default('true'),
})

export const JOB_STATUSES = ['open', 'ordered', 'picking', 'complete', 'cancelled'] as const
export const jobStatusSchema = z.enum(JOB_STATUSES)
export type JobStatusName = z.infer<typeof jobStatusSchema>

const dueDateSchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, issueCode('invalid_date'))
  .refine((v) => !Number.isNaN(Date.parse(v + 'T00:00:00Z')) && new Date(v + 'T00:00:00Z').toISOString().startsWith(v), issueCode('invalid_date'))
  .optional()
  .nullable()
  .or(z.literal('').transform(() => null))

export const jobCreateSchema = z.object({
  customerId: idSchema,
  name: z.string().trim().min(1).max(120),
  siteAddress: optionalText(200),
  status: jobStatusSchema.default('open'),
  dueDate: dueDateSchema.transform((v) => v ?? null),
  notes: optionalText(2000),
})
export type JobCreateInput = z.infer<typeof jobCreateSchema>

/** Changing a job, as the screen loaded it (`version`: a change saved meanwhile is refused). */
export const jobUpdateSchema = jobCreateSchema.omit({ customerId: true }).partial().extend({ version: seenVersionSchema })
export type JobUpdateInput = z.infer<typeof jobUpdateSchema>

export const jobQuerySchema = z.object({
  customerId: z.coerce.number().int().positive().optional(),
  status: jobStatusSchema.optional(),
  q: z.string().trim().max(80).optional(),
  /** Jobs whose special order is due by this day and has not all arrived (the start page's figure). */
  specialDueBy: z.preprocess((v) => (v === '' ? undefined : v), z.iso.date().optional()),
  limit: z.coerce.number().int().min(1).max(200).default(50),
})

export const takeoffSaveSchema = z.object({
  name: z.string().trim().min(1).max(120),
  input: takeoffSchema,
})
export type TakeoffSaveInput = z.infer<typeof takeoffSaveSchema>

/** Saving an existing takeoff: with the version the editor loaded. */
export const takeoffUpdateSchema = takeoffSaveSchema.extend({ version: seenVersionSchema })
export type TakeoffUpdateInput = z.infer<typeof takeoffUpdateSchema>

export const computeRequestSchema = z.object({
  takeoff: takeoffSchema,
  unit: lengthUnitSchema.optional(),
})

/** The form fields sent with a takeoff spreadsheet. */
export const takeoffImportFieldsSchema = z.object({
  name: z.string().trim().min(1).max(120).optional(),
  unit: lengthUnitSchema.optional(),
})

export const bomSaveSchema = z.object({
  takeoffId: idSchema,
  /** When given, replaces the saved takeoff's input in the same transaction as the bill. */
  input: takeoffSchema.optional(),
  /** The takeoff's version as the editor loaded it; required with `input`. */
  version: seenVersionSchema.optional(),
}).refine((b) => !b.input || b.version !== undefined, { path: ['version'], ...issueOf('required') })
export type BomSaveInput = z.infer<typeof bomSaveSchema>

// ---- admin: role → item mapping, rules, waste ----

export const roleItemInputSchema = z.object({
  role: materialRoleSchema,
  /** Joint system the mapping is for; null for either. */
  jointKind: jointKindSchema.nullable().default(null),
  /** Block item the mapping is for (end blocks of that block, say); null for any block. */
  blockItemId: idSchema.nullable().default(null),
  itemId: idSchema,
  /** Length of one stock unit for strips and reinforcement; per-foot items need none. */
  pieceLengthMm: z.number().positive().max(100_000).nullable().default(null),
  /** Grout or mortar per stock unit, when the item's own yield should not be used. */
  yieldMl: z.number().positive().max(1_000_000).nullable().default(null),
  note: optionalText(200),
})
export type RoleItemInput = z.infer<typeof roleItemInputSchema>

export const ruleOverrideSchema = z.object({
  rule: materialRuleSchema,
  enabled: z.boolean().default(true),
})
export type RuleOverrideInput = z.infer<typeof ruleOverrideSchema>

/** The admin's site figures: a number sets one, null puts it back to the default. */
export const siteFiguresUpdateSchema = z.object(
  Object.fromEntries(Object.entries(siteFiguresSchema.shape).map(([k, v]) => [k, v.nullable().optional()])) as {
    [K in keyof typeof siteFiguresSchema.shape]: z.ZodOptional<z.ZodNullable<(typeof siteFiguresSchema.shape)[K]>>
  },
)
export type SiteFiguresUpdateInput = z.infer<typeof siteFiguresUpdateSchema>

export const wasteUpdateSchema = z.partialRecord(materialFamilySchema, z.number().nonnegative().max(100).nullable())
export type WasteUpdateInput = z.infer<typeof wasteUpdateSchema>

// ---- answers ----

export interface CustomerSummary {
  id: number
  code: string
  name: string
  contactName: string | null
  email: string | null
  phone: string | null
  address: string | null
  notes: string | null
  active: boolean
  openJobs: number
  createdAt: string
  /** Goes up with every change; an edit sends the version it loaded. */
  version: number
}

export interface JobSummary {
  id: number
  customerId: number
  customerCode: string
  customerName: string
  name: string
  siteAddress: string | null
  status: JobStatusName
  dueDate: string | null
  notes: string | null
  latestRevision: number | null
  takeoffs: number
  updatedAt: string
  /** Goes up with every change; an edit sends the version it loaded. */
  version: number
}

export interface TakeoffSummary { id: number; jobId: number; name: string; walls: number; updatedAt: string }
export interface TakeoffRecord extends TakeoffSummary { version: number; input: z.infer<typeof takeoffSchema> }
export interface BomSummary { id: number; revision: number; takeoffId: number | null; lines: number; createdAt: string; createdBy: string | null }

export interface JobDetail extends JobSummary {
  customer: CustomerSummary
  takeoffList: TakeoffSummary[]
  boms: BomSummary[]
}

export interface WarehouseAvailability { warehouseId: number; code: string; name: string; available: number }

export interface LineAvailability {
  itemId: number
  /** Per active warehouse: on hand less reserved, transit bins left out. */
  warehouses: WarehouseAvailability[]
  total: number
}

export interface BlockOption {
  itemId: number
  sku: string
  name: string
  nominal: string
  faceWidthMm: number
  faceHeightMm: number
  depthMm: number
  thicknessClass: ThicknessClass
  weightKg: number
  pattern: string | null
  shape: string | null
  /** The block as the takeoff math sees it (pack size, unit). */
  item: CatalogItem
}

export interface RoleItemRecord {
  id: number
  role: MaterialRole
  jointKind: JointKind | null
  blockItemId: number | null
  blockSku: string | null
  itemId: number
  pieceLengthMm: number | null
  yieldMl: number | null
  note: string | null
  /** The item as the takeoff math sees it. */
  item: CatalogItem & { itemId: number; madeToOrder: boolean; active: boolean }
}

export interface RuleRecord {
  rule: MaterialRule
  enabled: boolean
  /** 'default' as shipped, 'changed' when an admin edited a shipped rule, 'added' for an admin's own. */
  origin: 'default' | 'changed' | 'added'
}

export interface LooseItemOption { itemId: number; sku: string; name: string; unit: string; family: string; madeToOrder: boolean }

/** Everything the takeoff editor needs to compute in the browser exactly as the server does. */
export interface CounterCatalog {
  blocks: BlockOption[]
  roleItems: RoleItemRecord[]
  rules: MaterialRule[]
  wastePct: Partial<Record<MaterialFamily, number>>
  /** Site figures in force (grout depth, fixing spacing, leftover gap, base tolerance). */
  figures: SiteFigures
  looseItems: LooseItemOption[]
}

/** explanation_json of a bom line: the takeoff math's explanation plus the exact need and the walls it serves. */
export interface StoredExplanation extends BomExplanation {
  needed: number
  packs?: number
  packSize?: number
  walls: string[]
}

export interface BomLineRecord {
  id: number
  lineNo: number
  itemId: number | null
  role: string | null
  sku: string | null
  description: string
  qty: number
  unit: string
  madeToOrder: boolean
  /** Made-to-order spec (the shower base) as entered. */
  spec: unknown
  explanation: StoredExplanation | null
  pickedQty: number
  orderedQty: number
}

export interface BomRecord {
  id: number
  jobId: number
  revision: number
  takeoffId: number | null
  takeoffName: string | null
  createdAt: string
  createdBy: string | null
  job: JobSummary
  unit: 'in' | 'mm'
  lines: BomLineRecord[]
  cautions: Caution[]
  totals: TakeoffTotals | null
  /** Each wall's layout, sections and drawing model as computed when the bill was saved. */
  walls: WallResult[]
  availability: LineAvailability[]
  /** The (not cancelled) sales order this bill's quote became: its goods are picked through that order. */
  salesOrder: { id: number; number: string } | null
}

// ---- answers (checked by the client in development and tests) ----
const catalogItemAnswer = z.object({
  sku: z.string(),
  name: z.string(),
  unit: z.string().optional(),
  packSize: z.number(),
  sellByPack: z.boolean(),
  cartridgeMl: z.number().optional(),
  groutYieldMl: z.number().optional(),
  mortarYieldMl: z.number().optional(),
  pieceLengthMm: z.number().optional(),
})
const id = z.number().int()
export const roleItemRecordSchema: z.ZodType<RoleItemRecord> = z.object({
  id,
  role: materialRoleSchema,
  jointKind: jointKindSchema.nullable(),
  blockItemId: id.nullable(),
  blockSku: z.string().nullable(),
  itemId: id,
  pieceLengthMm: z.number().nullable(),
  yieldMl: z.number().nullable(),
  note: z.string().nullable(),
  item: catalogItemAnswer.extend({ itemId: id, madeToOrder: z.boolean(), active: z.boolean() }),
})
export const counterCatalogSchema: z.ZodType<CounterCatalog> = z.object({
  blocks: z.array(
    z.object({
      itemId: id,
      sku: z.string(),
      name: z.string(),
      nominal: z.string(),
      faceWidthMm: z.number(),
      faceHeightMm: z.number(),
      depthMm: z.number(),
      thicknessClass: z.enum(['standard', 'thin']),
      weightKg: z.number(),
      pattern: z.string().nullable(),
      shape: z.string().nullable(),
      item: catalogItemAnswer,
    }),
  ),
  roleItems: z.array(roleItemRecordSchema),
  rules: z.array(materialRuleSchema),
  wastePct: z.partialRecord(materialFamilySchema, z.number()),
  figures: siteFiguresSchema,
  looseItems: z.array(
    z.object({ itemId: id, sku: z.string(), name: z.string(), unit: z.string(), family: z.string(), madeToOrder: z.boolean() }),
  ),
})
export const customerSummarySchema: z.ZodType<CustomerSummary> = z.object({
  id,
  code: z.string(),
  name: z.string(),
  contactName: z.string().nullable(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  address: z.string().nullable(),
  notes: z.string().nullable(),
  active: z.boolean(),
  openJobs: z.number().int(),
  createdAt: z.string(),
  version: z.number().int(),
})
export const jobSummarySchema: z.ZodType<JobSummary> = z.object({
  id,
  customerId: id,
  customerCode: z.string(),
  customerName: z.string(),
  name: z.string(),
  siteAddress: z.string().nullable(),
  status: jobStatusSchema,
  dueDate: z.string().nullable(),
  notes: z.string().nullable(),
  latestRevision: z.number().int().nullable(),
  takeoffs: z.number().int(),
  updatedAt: z.string(),
  version: z.number().int(),
})
