// Reading stock: query strings the server parses (and the screens build), and the answers' shapes.
// Query values arrive as strings; an empty value means "no filter".
import { z } from 'zod'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import { BIN_KINDS, MOVE_TYPES, type BinKind, type MoveType, type StockUnit } from '../catalog.js'
import { timeZoneParam } from './exportQuery.js'

const blankToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v)
const optionalId = z.preprocess(blankToUndefined, z.coerce.number().int().positive().optional())
const requiredId = z.preprocess(blankToUndefined, z.coerce.number().int().positive())
const flag = z.preprocess(blankToUndefined, z.enum(['true', 'false']).optional()).transform((v) => v === 'true')
const searchText = z.preprocess(blankToUndefined, z.string().trim().max(80).optional())

/** A day (YYYY-MM-DD, read as UTC) or an instant with its offset (what the screens send for local days). */
const instant = z.preprocess(
  blankToUndefined,
  z.union([z.iso.date(), z.iso.datetime({ offset: true })], { error: issueCode('invalid_date') }).optional(),
)

// ---- stock by item and warehouse ----
export const levelsQuerySchema = z.object({
  itemId: optionalId,
  warehouseId: optionalId,
  q: searchText,
  family: z.preprocess(blankToUndefined, z.string().trim().max(20).optional()),
  lowOnly: flag,
  /** Every active stocked item in every active warehouse, even with nothing there. */
  includeEmpty: flag,
})
export type LevelsQuery = z.infer<typeof levelsQuerySchema>

export interface StockLevelRow {
  itemId: number
  sku: string
  name: string
  family: string
  stockUnit: StockUnit
  warehouseId: number
  warehouseCode: string
  /** In the warehouse's bins, transit bins excluded. */
  onHand: number
  reserved: number
  /** onHand − reserved: what can be promised or picked. */
  available: number
  /** Shipped to this warehouse and not yet put away: never available. */
  inTransit: number
  minQty: number | null
  low: boolean
}

export interface StockLevelsAnswer {
  rows: StockLevelRow[]
  /** More rows matched than one answer carries; narrow the filters. */
  truncated: boolean
}

// ---- bins of a warehouse and what they hold ----
export const binContentsQuerySchema = z.object({
  warehouseId: requiredId,
  itemId: optionalId,
  q: searchText,
  includeEmpty: flag,
})
export type BinContentsQuery = z.infer<typeof binContentsQuerySchema>

export interface BinContentLine {
  itemId: number
  sku: string
  name: string
  stockUnit: StockUnit
  lotId: number | null
  lotCode: string | null
  onHand: number
  reserved: number
}

export interface BinContents {
  binId: number
  code: string
  kind: BinKind
  active: boolean
  lines: BinContentLine[]
}

export interface BinContentsAnswer {
  warehouse: { id: number; code: string; name: string }
  bins: BinContents[]
}

// ---- lots of an item ----
export const lotLevelsQuerySchema = z.object({ itemId: requiredId })

export interface LotPlace {
  warehouseId: number
  warehouseCode: string
  binId: number
  binCode: string
  inTransit: boolean
  onHand: number
  reserved: number
}

export interface LotLevel {
  /** null: the item's stock kept without a lot. */
  lotId: number | null
  lotCode: string | null
  receivedAt: string | null
  tintNote: string | null
  onHand: number
  reserved: number
  places: LotPlace[]
}

export interface LotLevelsAnswer {
  item: { id: number; sku: string; name: string; stockUnit: StockUnit }
  lots: LotLevel[]
}

// ---- the ledger ----
export const LEDGER_SORTS = ['at', 'sku', 'warehouse', 'bin', 'lot', 'moveType', 'qty', 'user', 'doc'] as const
export type LedgerSort = (typeof LEDGER_SORTS)[number]

const moveTypes = z.preprocess(
  (v) => (v === undefined || v === '' ? undefined : Array.isArray(v) ? v : String(v).split(',')),
  // Checked as a whole, so the message lands on moveType rather than moveType.0.
  z
    .array(z.string())
    .max(MOVE_TYPES.length)
    .refine((xs) => xs.every((x) => (MOVE_TYPES as readonly string[]).includes(x)), issueCode('invalid_choice'))
    .transform((xs) => xs as MoveType[])
    .optional(),
)

const ledgerFilterShape = {
  itemId: optionalId,
  warehouseId: optionalId,
  binId: optionalId,
  lotId: optionalId,
  moveType: moveTypes,
  docType: z.preprocess(blankToUndefined, z.string().trim().regex(/^[a-z_]{1,20}$/, issueCode('invalid_format')).optional()),
  docId: optionalId,
  /** Inclusive start. */
  from: instant,
  /** A day: through its end. An instant: up to, not including, it. */
  to: instant,
  sort: z.preprocess(blankToUndefined, z.enum(LEDGER_SORTS).default('at')),
  dir: z.preprocess(blankToUndefined, z.enum(['asc', 'desc']).default('desc')),
}

const fromBeforeTo = (v: { from?: string; to?: string }) => !v.from || !v.to || new Date(v.from).getTime() <= new Date(v.to).getTime()

export const ledgerQuerySchema = z
  .object({
    ...ledgerFilterShape,
    page: z.preprocess(blankToUndefined, z.coerce.number().int().min(1).max(100_000).default(1)),
    pageSize: z.preprocess(blankToUndefined, z.coerce.number().int().min(1).max(500).default(50)),
  })
  .refine(fromBeforeTo, { path: ['to'], ...issueOf('ends_before_start') })
export type LedgerQuery = z.infer<typeof ledgerQuerySchema>

export const ledgerExportQuerySchema = z
  .object({
    ...ledgerFilterShape,
    /** IANA time zone for the spreadsheet's dates (the screen sends the browser's). */
    tz: timeZoneParam,
  })
  .refine(fromBeforeTo, { path: ['to'], ...issueOf('ends_before_start') })
export type LedgerExportQuery = z.infer<typeof ledgerExportQuerySchema>

export interface LedgerRow {
  id: string
  at: string
  moveType: MoveType
  itemId: number
  sku: string
  itemName: string
  stockUnit: StockUnit
  warehouseId: number
  warehouseCode: string
  binId: number
  binCode: string
  lotId: number | null
  lotCode: string | null
  qty: number
  /** Absent for a caller who may not see costs (the API drops cost fields for them). */
  unitCost?: string | null
  docType: string | null
  docId: number | null
  /** The document's own number or name (PO and pick list numbers, the job's name); null when it has none. */
  docRef: string | null
  docLineId: number | null
  reason: string | null
  note: string | null
  batchId: string
  userName: string | null
}

export interface LedgerPage {
  rows: LedgerRow[]
  total: number
  page: number
  pageSize: number
}

// ---- transfers ----
export const TRANSFER_STATUSES = ['in_transit', 'received'] as const
export const transfersQuerySchema = z.object({
  status: z.preprocess(blankToUndefined, z.enum(TRANSFER_STATUSES).optional()),
  warehouseId: optionalId,
  limit: z.preprocess(blankToUndefined, z.coerce.number().int().min(1).max(500).default(100)),
})
export type TransfersQuery = z.infer<typeof transfersQuerySchema>

export interface TransferLineView {
  id: number
  itemId: number
  sku: string
  itemName: string
  lotId: number | null
  lotCode: string | null
  fromBinId: number
  fromBinCode: string
  qty: number
  receivedQty: number
}

export interface TransferView {
  id: number
  status: 'in_transit' | 'received' | 'cancelled'
  fromWarehouseId: number
  fromWarehouseCode: string
  toWarehouseId: number
  toWarehouseCode: string
  note: string | null
  shippedAt: string
  shippedBy: string | null
  receivedAt: string | null
  receivedBy: string | null
  lines: TransferLineView[]
}

// ---- manual minimum per item and warehouse ----
export const minimumsQuerySchema = z.object({ itemId: optionalId, warehouseId: optionalId })

export const minimumSchema = z.object({
  minQty: z.union([z.null(), z.number().int().min(0).max(1_000_000)], { error: issueCode('minimum_qty') }),
})
export type MinimumInput = z.infer<typeof minimumSchema>

export interface MinimumRow {
  itemId: number
  sku: string
  warehouseId: number
  warehouseCode: string
  minQty: number | null
}

// ---- what the stock forms pick from ----
export interface PlaceBin {
  id: number
  code: string
  kind: BinKind
  active: boolean
}

export interface Place {
  id: number
  code: string
  name: string
  active: boolean
  bins: PlaceBin[]
}

/** The answer of /stock/places (checked by the client in development and tests). */
export const placesSchema: z.ZodType<Place[]> = z.array(
  z.object({
    id: z.number().int(),
    code: z.string(),
    name: z.string(),
    active: z.boolean(),
    bins: z.array(z.object({ id: z.number().int(), code: z.string(), kind: z.enum(BIN_KINDS), active: z.boolean() })),
  }),
)

export const itemOptionsQuerySchema = z.object({
  q: searchText,
  /** Comma-separated ids, for a form opened with an item already chosen. */
  ids: z.preprocess(
    (v) => (v === undefined || v === '' ? undefined : String(v).split(',')),
    z.array(z.coerce.number().int().positive()).max(50).optional(),
  ),
})

export interface ItemOption {
  id: number
  sku: string
  name: string
  stockUnit: StockUnit
  gtin: string | null
  matchLot: boolean
}

export interface LotOption {
  id: number
  code: string
  itemId: number
}

/** What a scan names, once classified on the screen (shared/barcode/scan.ts classifyScan). */
export const lookupQuerySchema = z.object({
  kind: z.enum(['sku', 'gtin', 'bin']),
  code: z.string().trim().min(1).max(80),
  lotCode: searchText,
  warehouseId: optionalId,
})
export type LookupQuery = z.infer<typeof lookupQuerySchema>

export interface LookupAnswer {
  item: ItemOption | null
  lot: LotOption | null
  bin: (PlaceBin & { warehouseId: number; warehouseCode: string }) | null
}

export { isLowStock } from '../stockFlags.js'

/** Midnight starting a local day ('YYYY-MM-DD', plus some days), as an instant; the server keeps times in UTC. */
export function localDayStart(day: string, plusDays = 0): string {
  const [y, m, d] = day.split('-').map(Number)
  return new Date(y, m - 1, d + plusDays).toISOString()
}

/**
 * Days the movements export covers when no dates are chosen: a whole year of a busy yard is past the
 * export's limit (a quarter at most), so an export with no dates takes the last 90 days instead of being refused.
 */
export const DEFAULT_EXPORT_DAYS = 90

/** The dates an export sends: the chosen local days, else the last DEFAULT_EXPORT_DAYS local days up to today. */
export function exportDates(dates: readonly [string, string] | null, today: Date): { from: string; to: string; defaulted: boolean } {
  if (dates) return { from: localDayStart(dates[0]), to: localDayStart(dates[1], 1), defaulted: false }
  const start = new Date(today.getFullYear(), today.getMonth(), today.getDate() - (DEFAULT_EXPORT_DAYS - 1))
  const end = new Date(today.getFullYear(), today.getMonth(), today.getDate() + 1)
  return { from: start.toISOString(), to: end.toISOString(), defaulted: true }
}
