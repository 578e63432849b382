// Catalog items: what the item form, the import and the API agree on. The server parses with these;
// the client validates its forms with the same schemas.
import { z } from 'zod'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import type { ErrorCode, ErrorParams, RowProblem } from '../errors/errorCodes.js'
import { isValidGtin, normalizeGtin } from '../barcode/checkDigit.js'
import { skuIssue } from '../barcode/scan.js'
import { BLOCK_SHAPES, ITEM_FAMILIES, STOCK_UNITS, THICKNESS_CLASSES } from '../catalog.js'
import { MM_PER_INCH } from '../units.js'
import { seenVersionSchema } from './seenVersion.js'

/** IRC 2021 R607.3: least thickness of standard (3 7/8 in) and thin (3 1/8 in) glass units, mm. */
export const LEAST_THICKNESS_MM = { standard: 3.875 * MM_PER_INCH, thin: 3.125 * MM_PER_INCH } as const
/** Stored lengths carry two decimals; half a hundredth of slack so 98.43 mm reads as 3 7/8 in. */
const THICKNESS_SLACK_MM = 0.005

const blankToNull = (v: unknown) => (v === '' || v === undefined ? null : v)
const trimmed = (v: unknown) => (typeof v === 'string' ? v.trim() : v)
/** A choice typed as a list shows it ("Glass block", "End finish", "Standard") reads as its value (glass_block …). */
const choiceText = (v: unknown) => (typeof v === 'string' ? v.trim().toLowerCase().replace(/[^a-z0-9]+/g, '_').replace(/^_+|_+$/g, '') : v)

/** A decimal as text (money, weights, sizes): digits, optional point, at most `places` decimals. */
function decimalText(places: number, code?: 'cost_format' | 'price_format' | 'weight_format', maxWhole = 8) {
  const pattern = new RegExp(`^\\d{1,${maxWhole}}(\\.\\d{1,${places}})?$`)
  return z.preprocess(
    (v) => (typeof v === 'number' && Number.isFinite(v) ? String(v) : trimmed(v)),
    z.string().refine((text) => pattern.test(text), code ? issueOf(code) : issueOf('decimal_places', { places })),
  )
}
const optionalDecimal = (places: number) =>
  z.preprocess(blankToNull, decimalText(places).nullable()).optional()

const packQty = z.preprocess(
  blankToNull,
  z.coerce.number().int().positive().max(100_000).nullable(),
).optional()

export const skuSchema = z.preprocess(
  trimmed,
  z.string().min(1).superRefine((sku, ctx) => {
    const issue = skuIssue(sku)
    if (issue) ctx.addIssue({ code: 'custom', ...issueOf(issue) })
  }),
)

/** A GTIN-8, -12, -13 or -14 with a valid GS1 check digit, stored as 14 digits; blank means none. */
export const gtinSchema = z.preprocess(
  (v) => blankToNull(typeof v === 'string' ? v.replace(/\s+/g, '') : typeof v === 'number' ? String(v) : v),
  z
    .string()
    .superRefine((code, ctx) => {
      const check = isValidGtin(code)
      if (!check.ok) ctx.addIssue({ code: 'custom', message: check.problem.code, params: check.problem.params })
    })
    .transform((code) => {
      const n = normalizeGtin(code)
      return n.ok ? n.gtin14 : code
    })
    .nullable(),
).optional()

const optionalText = (max: number) =>
  z.preprocess((v) => blankToNull(trimmed(v)), z.string().max(max).nullable()).optional()
const flag = z.preprocess((v) => (v === 'true' || v === 'yes' || v === '1' ? true : v === 'false' || v === 'no' || v === '0' ? false : v), z.boolean({ error: issueCode('yes_or_no') }))

/** Every field of an item; `itemSchema` adds the checks between fields. */
export const itemFields = z.object({
  sku: skuSchema,
  name: z.preprocess(trimmed, z.string().min(1).max(120)),
  family: z.preprocess(choiceText, z.enum(ITEM_FAMILIES)),
  stockUnit: z.preprocess(choiceText, z.enum(STOCK_UNITS)),
  caseQty: packQty,
  palletQty: packQty,
  sellByPack: flag.optional(),
  gtin: gtinSchema,
  weightKg: z.preprocess((v) => (v === '' || v === null ? undefined : v), decimalText(3, 'weight_format', 6).optional()),
  cost: decimalText(4, 'cost_format'),
  listPrice: decimalText(2, 'price_format'),
  active: flag.optional(),
  madeToOrder: flag.optional(),
  matchLot: flag.optional(),
  nominalSize: optionalText(16),
  faceWidthMm: optionalDecimal(2),
  faceHeightMm: optionalDecimal(2),
  depthMm: optionalDecimal(2),
  thicknessClass: z.preprocess((v) => blankToNull(choiceText(v)), z.enum(THICKNESS_CLASSES).nullable()).optional(),
  // Patterns are stored lower-case; "Clear" as the form's list shows it is clear.
  pattern: z.preprocess((v) => blankToNull(typeof v === 'string' ? v.trim().toLowerCase() : v), z.string().max(30).regex(/^[a-z0-9_ -]+$/, issueCode('pattern_chars')).nullable()).optional(),
  shape: z.preprocess((v) => blankToNull(choiceText(v)), z.enum(BLOCK_SHAPES).nullable()).optional(),
  cartridgeMl: optionalDecimal(2),
  groutYieldMl: optionalDecimal(2),
  jointMm: optionalDecimal(3),
  description: optionalText(2000),
})
export type ItemFields = z.infer<typeof itemFields>

type Issue = { path: keyof ItemFields; code: ErrorCode; params?: ErrorParams }

/** Checks that need several fields: packs, block attributes, thickness against IRC R607.3. */
export function itemCrossFieldIssues(v: Partial<ItemFields>): Issue[] {
  const issues: Issue[] = []
  if (v.caseQty && v.palletQty && v.palletQty % v.caseQty !== 0) {
    issues.push({ path: 'palletQty', code: 'pallet_whole_cases', params: { caseQty: v.caseQty } })
  }
  if (v.sellByPack && !v.caseQty) issues.push({ path: 'caseQty', code: 'case_qty_needed' })
  if (v.family === 'glass_block') {
    for (const key of ['nominalSize', 'faceWidthMm', 'faceHeightMm', 'depthMm', 'thicknessClass', 'shape'] as const) {
      if (v[key] === null || v[key] === undefined) issues.push({ path: key, code: 'block_field_required' })
    }
    const depth = v.depthMm ? Number(v.depthMm) : NaN
    if (v.thicknessClass && depth + THICKNESS_SLACK_MM < LEAST_THICKNESS_MM[v.thicknessClass]) {
      const code = v.thicknessClass === 'standard' ? 'standard_block_too_thin' : 'thin_block_too_thin'
      issues.push({ path: 'depthMm', code, params: { min: LEAST_THICKNESS_MM[v.thicknessClass], unit: 'mm' } })
    }
  }
  if (v.madeToOrder && v.matchLot) issues.push({ path: 'matchLot', code: 'made_to_order_no_lots' })
  return issues
}

export const itemSchema = itemFields.superRefine((v, ctx) => {
  for (const issue of itemCrossFieldIssues(v)) ctx.addIssue({ code: 'custom', path: [issue.path], message: issue.code, params: issue.params })
})
export type ItemInput = z.infer<typeof itemSchema>

/**
 * A change to some fields, made on the item as the screen loaded it (`version`: a change saved meanwhile is
 * refused); the server checks the merged item with itemSchema.
 */
export const itemPatchSchema = itemFields.partial().extend({ version: seenVersionSchema })
export type ItemPatch = z.infer<typeof itemPatchSchema>

export const ITEM_SORTS = ['sku', 'name', 'family', 'listPrice', 'onHand'] as const

export const itemListQuerySchema = z.object({
  q: z.string().trim().max(80).optional(),
  family: z.enum(ITEM_FAMILIES).optional(),
  size: z.string().trim().max(16).optional(),
  pattern: z.string().trim().max(30).optional(),
  shape: z.enum(BLOCK_SHAPES).optional(),
  thickness: z.enum(THICKNESS_CLASSES).optional(),
  active: z.enum(['true', 'false', 'all']).default('true'),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(5000).default(100),
  sort: z.enum(ITEM_SORTS).default('sku'),
  dir: z.enum(['asc', 'desc']).default('asc'),
})
export type ItemListQuery = z.infer<typeof itemListQuerySchema>

export interface ItemRow {
  id: number
  sku: string
  name: string
  family: string
  stockUnit: string
  nominalSize: string | null
  pattern: string | null
  shape: string | null
  thicknessClass: string | null
  gtin: string | null
  caseQty: number | null
  palletQty: number | null
  /** Absent for roles that do not see costs (server/services/costVisibility.ts). */
  cost?: string
  listPrice: string
  active: boolean
  madeToOrder: boolean
  matchLot: boolean
  onHand: number
  available: number
}

export interface ItemPage {
  rows: ItemRow[]
  total: number
  page: number
  pageSize: number
}

export type ItemRecord = Required<{ [K in keyof ItemFields]: Exclude<ItemFields[K], undefined> }> & {
  id: number
  createdAt: string
  updatedAt: string
  /** Goes up with every change; an edit sends the version it loaded. */
  version: number
}

/** An item as a reader sees it: the standard cost is absent for roles that do not see costs. */
export type ItemRecordView = Omit<ItemRecord, 'cost'> & { cost?: string }

export interface ItemWarehouseStock {
  warehouseId: number
  warehouseCode: string
  warehouseName: string
  onHand: number
  reserved: number
  /** Null before the first receipt; absent for roles that do not see costs. */
  avgCost?: string | null
  minQty: number | null
}

export interface ItemBinStock {
  warehouseId: number
  warehouseCode: string
  binId: number
  binCode: string
  binKind: string
  lotId: number | null
  lotCode: string | null
  lotReceivedAt: string | null
  tintNote: string | null
  onHand: number
  reserved: number
}

export interface ItemVendorSource {
  vendorId: number
  vendorCode: string
  vendorName: string
  vendorSku: string
  packQty: number
  minOrderQty: number
  unitCost?: string
  leadTimeDays: number | null
  preferred: boolean
}

export interface ItemDetail {
  item: ItemRecordView
  warehouses: ItemWarehouseStock[]
  bins: ItemBinStock[]
  vendors: ItemVendorSource[]
}

export interface LotRow {
  id: number
  itemId: number
  code: string
  receivedAt: string
  vendorId: number | null
  tintNote: string | null
  onHand: number
}

export const lotUpdateSchema = z.object({
  tintNote: z.preprocess((v) => blankToNull(trimmed(v)), z.string().max(120).nullable()),
})
export type LotUpdateInput = z.infer<typeof lotUpdateSchema>

/** What an item import check (preview) or commit answers. */
export interface ImportPreviewRow {
  row: number
  sku: string | null
  name: string | null
  action: 'create' | 'update'
  errors: RowProblem[]
}

export interface ImportPreview {
  filename: string
  total: number
  creates: number
  updates: number
  errorRows: number
  rows: ImportPreviewRow[]
}
