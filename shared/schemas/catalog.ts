// Catalog items: what the item form, the import and the API agree on. The server parses with these;
// the client validates its forms with the same schemas.
import { z } from 'zod'
import { isValidGtin, normalizeGtin } from '../barcode/checkDigit.js'
import { skuProblem } from '../barcode/scan.js'
import { BLOCK_SHAPES, ITEM_FAMILIES, STOCK_UNITS, THICKNESS_CLASSES } from '../catalog.js'
import { MM_PER_INCH } from '../units.js'

/** IRC 2021 R607.3: least thickness of standard (3 7/8 in) and thin (3 1/8 in) glass units, mm. */
export const LEAST_THICKNESS_MM = { standard: 3.875 * MM_PER_INCH, thin: 3.125 * MM_PER_INCH } as const
/** Stored lengths carry two decimals; half a hundredth of slack so 98.43 mm reads as 3 7/8 in. */
const THICKNESS_SLACK_MM = 0.005

const blankToNull = (v: unknown) => (v === '' || v === undefined ? null : v)
const trimmed = (v: unknown) => (typeof v === 'string' ? v.trim() : v)

/** A decimal as text (money, weights, sizes): digits, optional point, at most `places` decimals. */
function decimalText(places: number, message: string, maxWhole = 8) {
  const pattern = new RegExp(`^\\d{1,${maxWhole}}(\\.\\d{1,${places}})?$`)
  return z.preprocess(
    (v) => (typeof v === 'number' && Number.isFinite(v) ? String(v) : trimmed(v)),
    z.string({ error: message }).regex(pattern, message),
  )
}
const optionalDecimal = (places: number, message: string) =>
  z.preprocess(blankToNull, decimalText(places, message).nullable()).optional()

const packQty = z.preprocess(
  blankToNull,
  z.coerce.number({ error: 'A whole number of stock units' }).int('A whole number of stock units').positive('More than zero').max(100_000, 'At most 100,000').nullable(),
).optional()

export const skuSchema = z.preprocess(
  trimmed,
  z.string({ error: 'Enter a SKU' }).min(1, 'Enter a SKU').superRefine((sku, ctx) => {
    const problem = skuProblem(sku)
    if (problem) ctx.addIssue({ code: 'custom', message: problem })
  }),
)

/** A GTIN-8, -12, -13 or -14 with a valid GS1 check digit, stored as 14 digits; blank means none. */
export const gtinSchema = z.preprocess(
  (v) => blankToNull(typeof v === 'string' ? v.replace(/\s+/g, '') : typeof v === 'number' ? String(v) : v),
  z
    .string()
    .superRefine((code, ctx) => {
      const check = isValidGtin(code)
      if (!check.ok) ctx.addIssue({ code: 'custom', message: check.reason })
    })
    .transform((code) => {
      const n = normalizeGtin(code)
      return n.ok ? n.gtin14 : code
    })
    .nullable(),
).optional()

const optionalText = (max: number) =>
  z.preprocess((v) => blankToNull(trimmed(v)), z.string().max(max, `At most ${max} characters`).nullable()).optional()
const flag = z.preprocess((v) => (v === 'true' || v === 'yes' || v === '1' ? true : v === 'false' || v === 'no' || v === '0' ? false : v), z.boolean({ error: 'Yes or no' }))

/** Every field of an item; `itemSchema` adds the checks between fields. */
export const itemFields = z.object({
  sku: skuSchema,
  name: z.preprocess(trimmed, z.string({ error: 'Enter a name' }).min(1, 'Enter a name').max(120, 'At most 120 characters')),
  family: z.enum(ITEM_FAMILIES, { error: 'Choose a family' }),
  stockUnit: z.enum(STOCK_UNITS, { error: 'Choose a stock unit' }),
  caseQty: packQty,
  palletQty: packQty,
  sellByPack: flag.optional(),
  gtin: gtinSchema,
  weightKg: z.preprocess((v) => (v === '' || v === null ? undefined : v), decimalText(3, 'A weight in kg like 2.858 (up to 3 decimals)', 6).optional()),
  cost: decimalText(4, 'A cost like 7.80 (up to 4 decimals)'),
  listPrice: decimalText(2, 'A price like 13.95 (up to 2 decimals)'),
  active: flag.optional(),
  madeToOrder: flag.optional(),
  matchLot: flag.optional(),
  nominalSize: optionalText(16),
  faceWidthMm: optionalDecimal(2, 'Millimetres, up to 2 decimals'),
  faceHeightMm: optionalDecimal(2, 'Millimetres, up to 2 decimals'),
  depthMm: optionalDecimal(2, 'Millimetres, up to 2 decimals'),
  thicknessClass: z.preprocess(blankToNull, z.enum(THICKNESS_CLASSES, { error: 'Standard or thin' }).nullable()).optional(),
  pattern: z.preprocess((v) => blankToNull(trimmed(v)), z.string().max(30, 'At most 30 characters').regex(/^[a-z0-9_ -]+$/, 'Lower-case letters, digits, space, - and _').nullable()).optional(),
  shape: z.preprocess(blankToNull, z.enum(BLOCK_SHAPES, { error: 'Choose a shape' }).nullable()).optional(),
  cartridgeMl: optionalDecimal(2, 'Millilitres, up to 2 decimals'),
  groutYieldMl: optionalDecimal(2, 'Millilitres, up to 2 decimals'),
  jointMm: optionalDecimal(3, 'Millimetres, up to 3 decimals'),
  description: optionalText(2000),
})
export type ItemFields = z.infer<typeof itemFields>

type Issue = { path: keyof ItemFields; message: string }

/** Checks that need several fields: packs, block attributes, thickness against IRC R607.3. */
export function itemCrossFieldIssues(v: Partial<ItemFields>): Issue[] {
  const issues: Issue[] = []
  if (v.caseQty && v.palletQty && v.palletQty % v.caseQty !== 0) {
    issues.push({ path: 'palletQty', message: `A pallet holds whole cases: a multiple of ${v.caseQty}` })
  }
  if (v.sellByPack && !v.caseQty) issues.push({ path: 'caseQty', message: 'Sold by the case: enter the case quantity' })
  if (v.family === 'glass_block') {
    for (const key of ['nominalSize', 'faceWidthMm', 'faceHeightMm', 'depthMm', 'thicknessClass', 'shape'] as const) {
      if (v[key] === null || v[key] === undefined) issues.push({ path: key, message: 'Required for a glass block' })
    }
    const depth = v.depthMm ? Number(v.depthMm) : NaN
    if (v.thicknessClass && depth + THICKNESS_SLACK_MM < LEAST_THICKNESS_MM[v.thicknessClass]) {
      issues.push({
        path: 'depthMm',
        message: v.thicknessClass === 'standard'
          ? 'A standard unit is at least 3 7/8 in (98.4 mm) thick (IRC R607.3); a thinner one is a thin unit'
          : 'A thin unit is at least 3 1/8 in (79.4 mm) thick (IRC R607.3)',
      })
    }
  }
  if (v.madeToOrder && v.matchLot) issues.push({ path: 'matchLot', message: 'Made-to-order items are not stocked in lots' })
  return issues
}

export const itemSchema = itemFields.superRefine((v, ctx) => {
  for (const issue of itemCrossFieldIssues(v)) ctx.addIssue({ code: 'custom', path: [issue.path], message: issue.message })
})
export type ItemInput = z.infer<typeof itemSchema>

/** A change to some fields; the server checks the merged item with itemSchema. */
export const itemPatchSchema = itemFields.partial()
export type ItemPatch = z.infer<typeof itemPatchSchema>

export const ITEM_SORTS = ['sku', 'name', 'family', 'listPrice', 'onHand'] as const

export const itemListQuerySchema = z.object({
  q: z.string().trim().max(80, 'At most 80 characters').optional(),
  family: z.enum(ITEM_FAMILIES, { error: 'Not a family' }).optional(),
  size: z.string().trim().max(16).optional(),
  pattern: z.string().trim().max(30).optional(),
  shape: z.enum(BLOCK_SHAPES, { error: 'Not a shape' }).optional(),
  thickness: z.enum(THICKNESS_CLASSES, { error: 'Standard or thin' }).optional(),
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
  tintNote: z.preprocess((v) => blankToNull(trimmed(v)), z.string().max(120, 'At most 120 characters').nullable()),
})
export type LotUpdateInput = z.infer<typeof lotUpdateSchema>

/** What an item import check (preview) or commit answers. */
export interface ImportPreviewRow {
  row: number
  sku: string | null
  name: string | null
  action: 'create' | 'update'
  errors: { column: string | null; message: string }[]
}

export interface ImportPreview {
  filename: string
  total: number
  creates: number
  updates: number
  errorRows: number
  rows: ImportPreviewRow[]
}
