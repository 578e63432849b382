// The item spreadsheet layout, one definition for the export, the blank import template and the
// import itself, so an exported file can be edited and imported again.
import { BLOCK_PATTERNS, BLOCK_SHAPES, ITEM_FAMILIES, STOCK_UNITS, THICKNESS_CLASSES } from '../../shared/catalog.js'
import type { ItemFields, ItemRow } from '../../shared/schemas/catalog.js'
import type { ImportColumn, ImportSpec } from './imports/importTypes.js'
import type { CellKind, SheetColumn } from './exports/xlsxWriter.js'

interface ItemColumn {
  key: keyof ItemFields
  header: string
  kind: ImportColumn['kind']
  required?: boolean
  width?: number
  places?: number
}

export const ITEM_COLUMNS: readonly ItemColumn[] = [
  { key: 'sku', header: 'SKU', kind: 'text', required: true, width: 22 },
  { key: 'name', header: 'Name', kind: 'text', required: true, width: 48 },
  { key: 'family', header: 'Family', kind: 'text', required: true, width: 14 },
  { key: 'stockUnit', header: 'Stock unit', kind: 'text', required: true },
  { key: 'caseQty', header: 'Case qty', kind: 'integer' },
  { key: 'palletQty', header: 'Pallet qty', kind: 'integer' },
  { key: 'sellByPack', header: 'Sell by pack', kind: 'boolean' },
  { key: 'gtin', header: 'GTIN', kind: 'text', width: 16 },
  { key: 'weightKg', header: 'Weight kg', kind: 'decimal', places: 3 },
  { key: 'cost', header: 'Cost', kind: 'decimal', required: true, places: 4 },
  { key: 'listPrice', header: 'List price', kind: 'decimal', required: true, places: 2 },
  { key: 'active', header: 'Active', kind: 'boolean' },
  { key: 'madeToOrder', header: 'Made to order', kind: 'boolean' },
  { key: 'matchLot', header: 'Match lot', kind: 'boolean' },
  { key: 'nominalSize', header: 'Nominal size', kind: 'text' },
  { key: 'faceWidthMm', header: 'Face width mm', kind: 'decimal', places: 2 },
  { key: 'faceHeightMm', header: 'Face height mm', kind: 'decimal', places: 2 },
  { key: 'depthMm', header: 'Depth mm', kind: 'decimal', places: 2 },
  { key: 'thicknessClass', header: 'Thickness class', kind: 'text' },
  { key: 'pattern', header: 'Pattern', kind: 'text' },
  { key: 'shape', header: 'Shape', kind: 'text' },
  { key: 'cartridgeMl', header: 'Cartridge mL', kind: 'decimal', places: 2 },
  { key: 'groutYieldMl', header: 'Grout yield mL', kind: 'decimal', places: 2 },
  { key: 'jointMm', header: 'Joint mm', kind: 'decimal', places: 3 },
  { key: 'description', header: 'Description', kind: 'text', width: 40 },
]

const ALLOWED: Partial<Record<string, string>> = {
  family: ITEM_FAMILIES.join(', '),
  stockUnit: STOCK_UNITS.join(', '),
  thicknessClass: `${THICKNESS_CLASSES.join(', ')} (standard ≥ 3 7/8 in, thin ≥ 3 1/8 in thick, IRC R607.3)`,
  shape: BLOCK_SHAPES.join(', '),
  pattern: `${BLOCK_PATTERNS.join(', ')}, or a pattern of your own (letters, digits, space, - and _)`,
  gtin: '8, 12, 13 or 14 digits with a valid GS1 check digit; format the column as text to keep leading zeros',
  cost: 'Up to 4 decimals, no currency sign',
  listPrice: 'Up to 2 decimals, no currency sign',
}

/** What a column of the item import takes, as its template's guide sheet and the everything-out README say it. */
export const itemColumnAllowed = (c: { key: string; kind: ImportColumn['kind'] }): string =>
  ALLOWED[c.key] ?? (c.kind === 'boolean' ? 'yes or no; blank keeps the item’s value (a new item: no)' : '')

/** Read-only columns the export adds; the import skips them. */
const STOCK_HEADERS = ['On hand', 'Available']

export const MAX_IMPORT_ROWS = 20_000

export const ITEM_IMPORT_SPEC: ImportSpec = {
  columns: ITEM_COLUMNS.map((c) => ({ key: c.key, header: c.header, kind: c.kind, required: c.required })),
  ignore: STOCK_HEADERS,
  maxRows: MAX_IMPORT_ROWS,
  maxColumns: 60,
}

const cellKind = (c: ItemColumn): CellKind =>
  c.kind === 'decimal' ? (c.key === 'listPrice' ? 'money' : 'decimal') : c.kind

/** The table column of a field: caseQty → case_qty. */
export const columnOf = (key: string) => key.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`)

/** Columns for writing full item records (the export). */
export function itemSheetColumns<Row extends Partial<Record<keyof ItemFields, unknown>>>(): SheetColumn<Row>[] {
  return ITEM_COLUMNS.map((c) => ({
    header: c.header,
    width: c.width,
    kind: cellKind(c),
    places: c.places,
    cost: c.key === 'cost',
    value: (row: Row) => row[c.key] as string | number | boolean | null | undefined,
  }))
}

export const STOCK_SHEET_COLUMNS: SheetColumn<Pick<ItemRow, 'onHand' | 'available'>>[] = [
  { header: STOCK_HEADERS[0], kind: 'integer', value: (r) => r.onHand },
  { header: STOCK_HEADERS[1], kind: 'integer', value: (r) => r.available },
]
