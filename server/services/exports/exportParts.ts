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
  /** The values allowed or the way it is written, where its kind alone does not say it (a list of codes, a day as text). */
  allowed?: string
  /** The import that reads the column back in, when one does. */
  readBy?: string
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

/** A column whose values come from a fixed list. */
export const oneOf = (column: PartColumn, values: readonly string[]): PartColumn => ({ ...column, allowed: `One of: ${values.join(', ')}.` })

/** What a column's cells hold, as the README says it: its own words, else its kind's. */
export function formatOf(c: Pick<PartColumn, 'kind' | 'places' | 'allowed'>): string {
  if (c.allowed) return c.allowed
  switch (c.kind) {
    case 'integer': return 'Whole number.'
    case 'decimal': return c.places ? `Number, ${c.places} decimal places.` : 'Number.'
    case 'money': return 'Amount with 2 decimals, no currency sign.'
    case 'cost': return 'Amount with up to 4 decimals, no currency sign.'
    case 'boolean': return 'yes or no.'
    case 'date': return 'A day, YYYY-MM-DD.'
    case 'datetime': return 'Date and time in UTC, YYYY-MM-DD hh:mm.'
    default: return 'Text.'
  }
}

export const DAY = (expr: string) => `DATE_FORMAT(${expr}, '%Y-%m-%d')`
