// A business's own data brought in from its sheets: the kinds of import, what a check answers (every
// problem of every row), and the record each committed import leaves.
import type { ErrorParams, Problem, RowProblem } from '../errors/errorCodes.js'

/** In the order a new business brings them in: what later kinds refer to comes first. */
export const DATA_IMPORT_KINDS = [
  'warehouses', 'bins', 'sales_tax', 'price_levels', 'price_rules', 'vendors', 'vendor_items', 'accounts',
  'opening_stock', 'averages', 'purchase_orders', 'usage_history', 'reorder_settings', 'lead_times',
] as const
export type DataImportKind = (typeof DATA_IMPORT_KINDS)[number]

export const isDataImportKind = (k: string): k is DataImportKind => (DATA_IMPORT_KINDS as readonly string[]).includes(k)

export interface DataImportRow {
  row: number
  /** What the row is about, as the sheet says it (a SKU, an account code). */
  label: string | null
  /** Where it goes (a warehouse and bin, a vendor). */
  place: string | null
  /** The row's figure in stock units (opening stock: the quantity), when it reads. */
  qty: number | null
  /** Costs go by this name only (the server's cost rule). */
  unitCost?: string | null
  errors: RowProblem[]
}

export interface DataImportRecord {
  id: number
  kind: DataImportKind
  fileName: string
  checksum: string
  rows: number
  at: string
  byName: string | null
  reversedAt: string | null
  reversedByName: string | null
  summary: Record<string, number> | null
}

export interface DataImportPreview {
  kind: DataImportKind
  filename: string
  total: number
  /** Rows that will be written. */
  ready: number
  /** Rows read but with nothing to write (a zero quantity). */
  skipped: number
  errorRows: number
  /** The rows whose problems make the first page (see PROBLEM_PAGE), then a sample of good rows. */
  rows: DataImportRow[]
  /** Every problem found (a row may have several), each kept on the server for paging. */
  problems: number
  /** The problems by column (null: the row as a whole), for filtering the pages. */
  problemColumns: DataImportProblemColumn[]
  /** The run that checked this file: its upload is kept for a while, so the commit can name the run instead of sending the file again. */
  checkRun: string | null
  /** The run whose problems the pages read (GET /imports/runs/:id/problems); null when none were kept. */
  problemRun: string | null
  /** The same file was committed before (and not reversed): committing it again changes nothing. */
  repeatOf: DataImportRecord | null
}

export interface DataImportResult extends DataImportPreview {
  record: DataImportRecord
  /** True when this commit found the file already imported and wrote nothing. */
  repeated: boolean
}

/** Problems per page, on the server and on the page. */
export const PROBLEM_PAGE = 50

export interface DataImportProblemColumn {
  column: string | null
  count: number
}

/** One problem of one row, as the pages list them. */
export interface DataImportProblem {
  row: number
  label: string | null
  column: string | null
  problem: Problem
}

/** A page of a check's problems (all, or one column's) and how many there are in all. */
export interface DataImportProblemPage {
  total: number
  offset: number
  problems: DataImportProblem[]
}

export type DataImportRunStep = 'preview' | 'commit'

/** Why a run failed: the error's code and values, as the server answered it. */
export interface DataImportRunProblem {
  status: number
  code: string
  message: string
  params?: ErrorParams
  fields?: Record<string, Problem>
}

/** A check or commit as it runs on the server, and its answer for a while after. */
export interface DataImportRun {
  id: string
  kind: DataImportKind
  step: DataImportRunStep
  fileName: string
  state: 'running' | 'done' | 'failed'
  /** The file's data rows, when known before reading (a CSV's lines, an .xlsx sheet's dimension). */
  rowsTotal: number | null
  rowsRead: number
  rowsChecked: number
  rowsWritten: number
  /** Whole percent of the work (rows checked, then for a commit rows written); 100 only once done. */
  percent: number
  startedAt: string
  /** A done run's answer; for a commit failed for its rows (import_invalid), what it found, its problems paged under this run. */
  answer: DataImportPreview | DataImportResult | null
  problem: DataImportRunProblem | null
}

export interface CurrentDataImportRun {
  run: DataImportRun | null
}
