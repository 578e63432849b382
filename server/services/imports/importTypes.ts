// The generic import contract: a column spec in, typed rows and per-row issues out. Items use it for
// the catalog import; other imports (vendor price lists) pass their own spec.
import type { ErrorParams, Problem } from '../../../shared/errors/errorCodes.js'

export type ColumnKind = 'text' | 'integer' | 'decimal' | 'boolean'

export interface ImportColumn {
  /** The field name the row values are keyed by. */
  key: string
  /** The header as the template writes it; matching ignores case, spaces and punctuation. */
  header: string
  aliases?: string[]
  required?: boolean
  kind: ColumnKind
}

export interface ImportSpec {
  columns: readonly ImportColumn[]
  /** Headers that may be present and are skipped (e.g. read-only columns of an export). */
  ignore?: readonly string[]
  maxRows: number
  maxColumns: number
}

/** Text stays text; decimals stay exact decimal text ('7.80'); integers are numbers. */
export type CellValue = string | number | boolean | null

export interface ImportRow {
  /** Row number as the spreadsheet shows it (the header is usually row 1). */
  row: number
  values: Record<string, CellValue>
}

export interface RowIssue {
  row: number
  /** The column key, or null for the whole row. */
  column: string | null
  problem: Problem
}

export interface ParsedSheet {
  rows: ImportRow[]
  issues: RowIssue[]
}

export type RefusalCode = 'sheet_empty' | 'sheet_columns' | 'sheet_too_many_rows' | 'sheet_too_many_columns' | 'csv_open_quote' | 'sheet_unreadable' | 'sheet_timeout' | 'sheet_too_big'

/** A refusal of the whole file: its code and values for the screen, the English message for the log. */
export type ParseOutcome = { ok: true; sheet: ParsedSheet } | { ok: false; code: RefusalCode; params?: ErrorParams; message: string }
