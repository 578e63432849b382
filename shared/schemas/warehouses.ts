// Warehouses and bins: the admin forms, the bulk bin range and the API share these.
import { z } from 'zod'
import { seenVersionSchema } from './seenVersion.js'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import { BIN_CODE_PATTERN } from '../barcode/scan.js'
import { problem, type Problem } from '../errors/errorCodes.js'

export const DEFAULT_BIN_PATTERN = '^(?<aisle>[A-Z]+)-(?<bay>\\d+)-(?<level>\\d+)$'
/** Bins a person may create; transit bins are made by transfers themselves. */
export const EDITABLE_BIN_KINDS = ['storage', 'receiving', 'staging'] as const
/** Most bins one range request may create. */
export const MAX_BIN_RANGE = 2000

const trimmed = (v: unknown) => (typeof v === 'string' ? v.trim() : v)
const blankToNull = (v: unknown) => (v === '' || v === undefined ? null : v)

/** Why a bin pattern is unusable, or null: it must compile and name aisle, bay and level. */
export function binPatternProblem(pattern: string): Problem | null {
  let re: RegExp
  try {
    re = new RegExp(pattern)
  } catch {
    return problem('bin_pattern_invalid')
  }
  if (!pattern.startsWith('^') || !pattern.endsWith('$')) return problem('bin_pattern_anchors')
  const names = ['aisle', 'bay', 'level'].filter((g) => !pattern.includes(`(?<${g}>`))
  if (names.length) return problem('bin_pattern_groups', { missing: names })
  return re.test('') ? problem('bin_pattern_empty_match') : null
}

/** Whether a bin code fits the warehouse's pattern (storage bins only; receiving and staging bins are named freely). */
export function binCodeFitsPattern(code: string, pattern: string): boolean {
  try {
    return new RegExp(pattern).test(code)
  } catch {
    return false
  }
}

export const warehouseSchema = z.object({
  code: z.preprocess(trimmed, z.string().regex(/^[A-Z0-9]{2,12}$/, '2 to 12 capital letters or digits')),
  name: z.preprocess(trimmed, z.string().min(1).max(80)),
  address: z.preprocess((v) => blankToNull(trimmed(v)), z.string().max(200).nullable()).optional(),
  binPattern: z
    .preprocess(trimmed, z.string().max(120))
    .superRefine((p, ctx) => {
      const found = binPatternProblem(p)
      if (found) ctx.addIssue({ code: 'custom', message: found.code, params: found.params })
    })
    .default(DEFAULT_BIN_PATTERN),
  aisleOrder: z.preprocess(trimmed, z.string().max(200).regex(/^([A-Z0-9]+(,[A-Z0-9]+)*)?$/, issueCode('aisle_order_format'))).default(''),
  walkDirection: z.enum(['serpentine', 'oneWay']).default('serpentine'),
  active: z.boolean().optional(),
})
export type WarehouseInput = z.infer<typeof warehouseSchema>
/** Changing a warehouse, as the screen loaded it (`version`: a change saved meanwhile is refused). */
export const warehousePatchSchema = warehouseSchema.partial().extend({ version: seenVersionSchema })
export type WarehousePatch = z.infer<typeof warehousePatchSchema>

export const binCodeSchema = z.preprocess(
  (v) => (typeof v === 'string' ? v.trim().toUpperCase() : v),
  z.string().regex(BIN_CODE_PATTERN, issueCode('bin_code_chars')),
)

export const binSchema = z.object({
  code: binCodeSchema,
  kind: z.enum(EDITABLE_BIN_KINDS).default('storage'),
  active: z.boolean().optional(),
})
export type BinInput = z.infer<typeof binSchema>
export const binPatchSchema = binSchema.partial()
export type BinPatch = z.infer<typeof binPatchSchema>

const aisleLetter = z.preprocess((v) => (typeof v === 'string' ? v.trim().toUpperCase() : v), z.string().regex(/^[A-Z]$/, issueCode('aisle_letter')))
const rangeNumber = (max: number) => z.coerce.number().int().min(1).max(max)

interface RangeBounds {
  aisleFrom: string
  aisleTo: string
  bayFrom: number
  bayTo: number
  levelFrom: number
  levelTo: number
}

/** A block of bins: aisles A–C × bays 1–10 × levels 1–3 gives A-01-1 … C-10-3. */
export const binRangeSchema = z
  .object({
    aisleFrom: aisleLetter,
    aisleTo: aisleLetter,
    bayFrom: rangeNumber(999),
    bayTo: rangeNumber(999),
    levelFrom: rangeNumber(99),
    levelTo: rangeNumber(99),
    bayDigits: z.coerce.number().int().min(1).max(3).default(2),
  })
  .refine((r) => r.aisleFrom <= r.aisleTo, { path: ['aisleTo'], ...issueOf('range_backwards') })
  .refine((r) => r.bayFrom <= r.bayTo, { path: ['bayTo'], ...issueOf('range_backwards') })
  .refine((r) => r.levelFrom <= r.levelTo, { path: ['levelTo'], ...issueOf('range_backwards') })
  .refine((r) => binRangeCount(r) <= MAX_BIN_RANGE, { path: ['bayTo'], ...issueOf('bin_range_too_big', { max: MAX_BIN_RANGE }) })
export type BinRangeInput = z.infer<typeof binRangeSchema>


/** How many bins a range stands for. */
export function binRangeCount(r: RangeBounds): number {
  return Math.max(0, r.aisleTo.charCodeAt(0) - r.aisleFrom.charCodeAt(0) + 1) * Math.max(0, r.bayTo - r.bayFrom + 1) * Math.max(0, r.levelTo - r.levelFrom + 1)
}

/** The codes a range stands for, aisle by aisle, bay by bay, level by level. */
export function binRangeCodes(r: RangeBounds & { bayDigits?: number }): string[] {
  const codes: string[] = []
  for (let a = r.aisleFrom.charCodeAt(0); a <= r.aisleTo.charCodeAt(0); a++) {
    for (let bay = r.bayFrom; bay <= r.bayTo; bay++) {
      for (let level = r.levelFrom; level <= r.levelTo; level++) {
        codes.push(`${String.fromCharCode(a)}-${String(bay).padStart(r.bayDigits ?? 2, '0')}-${level}`)
      }
    }
  }
  return codes
}

export interface BinRow {
  id: number
  warehouseId: number
  code: string
  kind: string
  active: boolean
  /** Distinct items with stock in the bin. */
  items: number
  onHand: number
}

export interface WarehouseRow {
  id: number
  code: string
  name: string
  address: string | null
  binPattern: string
  aisleOrder: string
  walkDirection: 'serpentine' | 'oneWay'
  active: boolean
  bins: number
  /** Goes up with every change; an edit sends the version it loaded. */
  version: number
}

export interface WarehouseDetail {
  warehouse: WarehouseRow
  bins: BinRow[]
}

export interface BinRangeResult {
  created: number
  skipped: string[]
}

// ---- answers (checked by the client in development and tests) ----
export const binRowSchema: z.ZodType<BinRow> = z.object({
  id: z.number().int(),
  warehouseId: z.number().int(),
  code: z.string(),
  kind: z.string(),
  active: z.boolean(),
  items: z.number(),
  onHand: z.number(),
})
export const warehouseRowSchema: z.ZodType<WarehouseRow> = z.object({
  id: z.number().int(),
  code: z.string(),
  name: z.string(),
  address: z.string().nullable(),
  binPattern: z.string(),
  aisleOrder: z.string(),
  walkDirection: z.enum(['serpentine', 'oneWay']),
  active: z.boolean(),
  bins: z.number().int(),
  version: z.number().int(),
})
export const warehouseDetailSchema: z.ZodType<WarehouseDetail> = z.object({ warehouse: warehouseRowSchema, bins: z.array(binRowSchema) })
export const binRangeResultSchema: z.ZodType<BinRangeResult> = z.object({ created: z.number().int(), skipped: z.array(z.string()) })
