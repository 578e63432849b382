// The shape of one file of the everything-out zip, shared by the files of each area.
import { readmeText, readmeWord, type ReadmeLang } from './readmeWords.js'
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
  /** The codes the column holds, when they come from a fixed list (the README lists them as they are written). */
  values?: readonly string[]
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
export const oneOf = (column: PartColumn, values: readonly string[]): PartColumn => ({ ...column, values })

/** What a column's cells hold, as the README says it in `lang`: its list of codes, its own words, else its kind's. */
export function formatOf(c: Pick<PartColumn, 'kind' | 'places' | 'allowed' | 'values'>, lang: ReadmeLang = 'en'): string {
  if (c.values) return readmeWord(lang, 'oneOf', { values: c.values.join(', ') })
  if (c.allowed) return readmeText(lang, c.allowed)
  switch (c.kind) {
    case 'integer': return readmeWord(lang, 'integer')
    case 'decimal': return c.places ? readmeWord(lang, 'decimalPlaces', { places: c.places }) : readmeWord(lang, 'decimal')
    case 'money': case 'cost': case 'boolean': case 'date': case 'datetime': return readmeWord(lang, c.kind)
    default: return readmeWord(lang, 'text')
  }
}

export const DAY = (expr: string) => `DATE_FORMAT(${expr}, '%Y-%m-%d')`
