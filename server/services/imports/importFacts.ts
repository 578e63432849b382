// What the imports of a business's own data look rows up against, read once per file in chunks:
// items by SKU, warehouses by code (codes match without regard to case).
import type { EntityManager } from 'typeorm'
import { problem, type Problem, type RowProblem } from '../../../shared/errors/errorCodes.js'
import { parsePackQuantity } from '../../../shared/inventory/packs.js'
import type { CellValue, ImportSpec, ParsedSheet, RowIssue } from './importTypes.js'

export interface ItemFacts { id: number; sku: string; match_lot: number; made_to_order: number; case_qty: number | null; pallet_qty: number | null }
export interface WarehouseFacts { id: number; code: string; active: number }

export const marks = (n: number) => Array.from({ length: n }, () => '?').join(', ')
export const cellText = (v: unknown) => (typeof v === 'string' ? v.trim() : v === null || v === undefined ? '' : String(v))

export async function inChunks<T>(values: readonly unknown[], read: (chunk: unknown[]) => Promise<T[]>): Promise<T[]> {
  const out: T[] = []
  for (let i = 0; i < values.length; i += 1000) out.push(...(await read(values.slice(i, i + 1000))))
  return out
}

/**
 * A condition leaving out the rows a commit's earlier chunks wrote (`column` is the table's import_id) and its
 * parameter: `AND (x.import_id IS NULL OR x.import_id <> ?)`. In a check (`importId` null) it leaves out nothing.
 */
export const notOwn = (column: string, importId: number | null): [string, number] => [` AND (${column} IS NULL OR ${column} <> ?)`, importId ?? 0]

/**
 * Which of `values` a table already holds in `column`, in upper case (codes match without regard to case), leaving
 * out the rows of import `importId` (a commit's own earlier chunks; null in a check).
 */
export async function heldValues(em: EntityManager, table: string, column: string, values: readonly string[], importId: number | null): Promise<Set<string>> {
  const [own, ownId] = notOwn('import_id', importId)
  const rows = await inChunks(values, (c) => em.query(`SELECT ${column} AS v FROM ${table} WHERE ${column} IN (${marks(c.length)})${own}`, [...c, ownId]) as Promise<{ v: string }[]>)
  return new Set(rows.map((r) => r.v.toUpperCase()))
}

/** The distinct non-blank values of one column. */
export const distinctOf = (sheet: ParsedSheet, key: string) => [...new Set(sheet.rows.map((r) => cellText(r.values[key])).filter(Boolean))]

export async function itemsBySku(em: EntityManager, skus: readonly string[]): Promise<Map<string, ItemFacts>> {
  const items = await inChunks(skus, (c) => em.query(`SELECT id, sku, match_lot, made_to_order, case_qty, pallet_qty FROM items WHERE sku IN (${marks(c.length)})`, c) as Promise<ItemFacts[]>)
  return new Map(items.map((i) => [i.sku, i]))
}

export async function warehousesByCode(em: EntityManager): Promise<Map<string, WarehouseFacts>> {
  const warehouses: WarehouseFacts[] = await em.query('SELECT id, code, active FROM warehouses')
  return new Map(warehouses.map((w) => [w.code.toUpperCase(), w]))
}

/** The parser's problems grouped by row, once (a filter per row would be rows × problems on a bad big file). */
/** Where a row's check notes a problem: under the column of that key. */
interface ProblemNotes { add(key: string, p: Problem): void }

/** The item a row's SKU cell names, and the SKU as written; a SKU the catalog lacks is noted under its column. */
export function namedItem<I>(cell: unknown, items: ReadonlyMap<string, I>, notes: ProblemNotes): { sku: string; item: I | undefined } {
  const sku = cellText(cell)
  const item = sku ? items.get(sku) : undefined
  if (sku && !item) notes.add('sku', problem('sku_not_in_catalog', { sku }))
  return { sku, item }
}

/** The warehouse a row's warehouse cell names (codes match without regard to case); an unknown code is noted under its column. */
export function namedWarehouse<W>(cell: unknown, warehouses: ReadonlyMap<string, W>, notes: ProblemNotes): { whCode: string; warehouse: W | undefined } {
  const whCode = cellText(cell)
  const warehouse = whCode ? warehouses.get(whCode.toUpperCase()) : undefined
  if (whCode && !warehouse) notes.add('warehouse', problem('import_warehouse_unknown', { warehouse: whCode }))
  return { whCode, warehouse }
}

export function issuesByRow(sheet: ParsedSheet): (row: number) => RowIssue[] {
  const byRow = new Map<number, RowIssue[]>()
  for (const i of sheet.issues) byRow.set(i.row, [...(byRow.get(i.row) ?? []), i])
  return (row) => byRow.get(row) ?? []
}

/** A column's header by its spec key, as a row's problem names it (the key itself when the spec has none). */
export function headerOf(spec: ImportSpec): (key: string) => string {
  const header = new Map(spec.columns.map((c) => [c.key, c.header]))
  return (key) => header.get(key) ?? key
}

/** A row's problems as the parser found them, each under its column's header: where a row's check starts. */
export function parserProblems(sheet: ParsedSheet, col: (key: string) => string): (row: number) => RowProblem[] {
  const issuesOf = issuesByRow(sheet)
  return (row) => issuesOf(row).map((i) => ({ column: i.column ? col(i.column) : null, problem: i.problem }))
}

/**
 * Remembers the first row of each key of one file: a later row with the same key answers the problem naming
 * that first row, any other null.
 */
export function repeatedRows(): (key: string, row: number) => RowProblem | null {
  const seen = new Map<string, number>()
  return (key, row) => {
    const first = seen.get(key)
    if (first === undefined) seen.set(key, row)
    return first === undefined ? null : { column: null, problem: problem('import_row_repeated', { row: first }) }
  }
}

/** The row's cells that hold something, for a schema whose fields take their defaults when absent. */
export const filledCells = (values: Record<string, CellValue>) => Object.fromEntries(Object.entries(values).filter(([, v]) => v !== null))

/** A real calendar day written YYYY-MM-DD. */
export const validDay = (t: string) => /^\d{4}-\d{2}-\d{2}$/.test(t) && !Number.isNaN(Date.parse(`${t}T00:00:00Z`)) && new Date(`${t}T00:00:00Z`).toISOString().startsWith(t)

/**
 * A row's quantity cell (key 'quantity') for its item, when both are there: the quantity read, or null with the
 * problem noted under the column.
 */
export function rowQuantity(cell: unknown, item: ItemFacts | undefined, sku: string, max: number, notes: ProblemNotes): number | null {
  const qtyText = cellText(cell)
  if (!qtyText || !item) return null
  const read = readImportQuantity(qtyText, item, sku, max)
  if (read.problem) notes.add('quantity', read.problem)
  return read.qty
}

/**
 * A quantity cell in the item's stock unit, packs allowed ("3 cases", "1 pallet 2 cases"): the quantity read
 * (null when it can't be) and the problem to report on the row, if any.
 */
function readImportQuantity(qtyText: string, item: ItemFacts, sku: string, max: number): { qty: number | null; problem: Problem | null } {
  const read = parsePackQuantity(qtyText, { case: item.case_qty ?? undefined, pallet: item.pallet_qty ?? undefined })
  if (read.ok) return { qty: read.qty, problem: read.qty > max ? problem('at_most', { max }) : null }
  const text = qtyText.slice(0, 40)
  const why = read.problem === 'whole_number' ? problem('import_qty_whole', { text })
    : read.problem === 'not_negative' ? problem('import_qty_negative', { text })
      : read.problem === 'unknown_pack' ? problem('import_qty_pack_word', { word: (read.word ?? '').slice(0, 20) })
        : read.problem === 'no_case_size' ? problem('import_qty_no_case', { sku })
          : read.problem === 'no_pallet_size' ? problem('import_qty_no_pallet', { sku })
            : problem('import_qty_unreadable', { text })
  return { qty: null, problem: why }
}
