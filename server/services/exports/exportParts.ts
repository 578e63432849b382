// The shape of one file of the everything-out zip, shared by the files of each area.
import type { CellInput, CellKind } from './xlsxWriter.js'

export type Raw = Record<string, unknown>

export interface PartColumn {
  header: string
  kind: CellKind
  /** What the column holds, for the README. */
  about: string
  value: (row: Raw) => CellInput
  places?: number
}

export interface ExportPart {
  /** The file's name in the zip (without .xlsx) and its sheet's tab. */
  file: string
  sheet: string
  about: string
  columns: PartColumn[]
  /** Rows in a stable order; streamed from the database. */
  sql: string
}

export const v = (key: string) => (row: Raw) => row[key] as CellInput
export const col = (header: string, kind: CellKind, key: string, about: string, places?: number): PartColumn => ({ header, kind, about, value: v(key), places })

export const DAY = (expr: string) => `DATE_FORMAT(${expr}, '%Y-%m-%d')`
