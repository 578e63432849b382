// The shape shared by the imports of simple records a business sets up once (warehouses, bins, price levels
// and their breaks, vendors, reorder settings, lead times seen before): each row is read on its own against
// lookups made per chunk of the file (only what the chunk's rows name, never a whole table), a record already in
// Lumenyard or named twice in the file is refused on its row,
// the good rows are inserted carrying the import's id, and a reversal deletes them unless something made since
// refers to one of them.
import type { EntityManager } from 'typeorm'
import type { z } from 'zod'
import { problem, type Problem } from '../../../shared/errors/errorCodes.js'
import { zodIssueProblem } from '../../../shared/errors/zodProblems.js'
import type { DataImportKind } from '../../../shared/schemas/dataImports.js'
import { AppError } from '../../errors.js'
import type { CheckedRow, ChunkChecker, DataImportDefinition } from './dataImports.js'
import { headerOf, inChunks, marks, parserProblems, repeatedRows } from './importFacts.js'
import type { CellValue, ImportRow, ImportSpec, ParsedSheet } from './importTypes.js'

export interface RowReader {
  /** A problem in one column (by the spec's key). */
  add(key: string, p: Problem): void
  /** A schema's issues, each under its column (`fields` maps a schema field to a spec key when they differ). */
  issues(list: readonly z.core.$ZodIssue[], fields?: Record<string, string>): void
}

export interface RecordsImport<W, F> {
  kind: DataImportKind
  spec: ImportSpec
  /**
   * Lookups for one chunk of the file's rows (`part`), and which of the records those rows name are already held:
   * read by what the rows name (IN lists), so the work and memory follow the chunk, not the size of the tables.
   * `importId` is the import a commit is writing, null in a check: what its earlier chunks wrote is the file's own
   * and must read as not held (importFacts' `notOwn`), or the commit would find problems the check did not.
   */
  facts(em: EntityManager, part: ParsedSheet, importId: number | null): Promise<F & { held: Set<string> }>
  /** One row read into what to write, or null (problems go through `reader`; null with none: nothing to write). */
  read(values: Record<string, CellValue>, facts: F, reader: RowReader): W | null
  /** What makes the record one of a kind ('HRY' or 'HRY A-01-1'), compared without regard to case. */
  identity(w: W): string
  /** The column a record already held is reported under. */
  identityColumn: string
  preview(w: W | null, values: Record<string, CellValue>): { label: string | null; place: string | null; qty?: number | null }
  insert(em: EntityManager, importId: number, rows: W[]): Promise<Record<string, number>>
  /** The name of a record of the import that something made since refers to, or null: the import can be reversed. */
  inUse(em: EntityManager, importId: number): Promise<string | null>
  /** Deletes the import's records (children first). */
  remove(em: EntityManager, importId: number): Promise<void>
}

/** Rows checked against the database at a time: each chunk's lookups name at most this many values per column. */
export const CHECK_CHUNK_ROWS = 2_000

export const chunked = async <T>(rows: readonly T[], size: number, each: (chunk: T[]) => Promise<unknown>) => {
  for (let i = 0; i < rows.length; i += size) await each(rows.slice(i, i + size))
}

/**
 * `INSERT INTO table (columns…, import_id) VALUES …` in chunks of `chunk` rows (500 unless said); with 'keepFirst' a
 * row whose key is already held is left as it is (the one written first stays; any other fault still throws).
 */
export async function insertRows<W>(
  em: EntityManager, table: string, columns: readonly string[], importId: number, rows: readonly W[], values: (w: W) => unknown[], chunk = 500,
  repeats: 'refuse' | 'keepFirst' = 'refuse',
): Promise<void> {
  const row = `(${[...columns, 'import_id'].map(() => '?').join(', ')})`
  await chunked(rows, chunk, (part) => em.query(
    `INSERT INTO ${table} (${[...columns, 'import_id'].join(', ')}) VALUES ${part.map(() => row).join(', ')}${repeats === 'keepFirst' ? ' ON DUPLICATE KEY UPDATE import_id = import_id' : ''}`,
    part.flatMap((w) => [...values(w), importId]),
  ))
}

/**
 * How many of the ids a chunk is about to write in `column` the import has written none of yet: a count of distinct
 * ids (warehouses given bins, items given rules) that adds up over the chunks of a commit. Asked before the insert.
 */
export async function firstTimeIds(em: EntityManager, table: string, column: string, importId: number, ids: readonly number[]): Promise<number> {
  const distinct = [...new Set(ids)]
  const before = await inChunks(distinct, (c) => em.query(`SELECT DISTINCT ${column} AS id FROM ${table} WHERE import_id = ? AND ${column} IN (${marks(c.length)})`, [importId, ...c]) as Promise<{ id: number }[]>)
  return distinct.length - before.length
}

export function recordsImport<W, F>(def: RecordsImport<W, F>): DataImportDefinition<W> {
  const col = headerOf(def.spec)
  /** A checker for one pass over a file: each chunk's lookups, and the records seen in earlier chunks (for repeats). */
  const checker = (em: EntityManager, importId: number | null): ChunkChecker<W> => {
    const repeated = repeatedRows()
    return { check: async (sheet: ParsedSheet): Promise<CheckedRow<W>[]> => {
      const problemsOf = parserProblems(sheet, col)
      const checked: CheckedRow<W>[] = []
      await chunked(sheet.rows, CHECK_CHUNK_ROWS, async (part) => {
        const facts = await def.facts(em, { rows: part, issues: [] }, importId)
        for (const r of part) checked.push(checkRow(r, facts))
      })
      return checked

      function checkRow(r: ImportRow, facts: F & { held: Set<string> }): CheckedRow<W> {
        const errors = problemsOf(r.row)
        const reader: RowReader = {
          add: (key, p) => errors.push({ column: col(key), problem: p }),
          issues: (list, fields = {}) => {
            for (const issue of list) {
              const field = String(issue.path[0] ?? '')
              const column = field ? col(fields[field] ?? field) : null
              // A cell the parser already found wanting (blank where required, not a number) is reported once.
              if (!errors.some((e) => e.column === column)) errors.push({ column, problem: zodIssueProblem(issue) })
            }
          },
        }
        const write = def.read(r.values, facts, reader)
        if (write !== null) {
          const id = def.identity(write).toUpperCase()
          const again = repeated(id, r.row)
          if (again) errors.push(again)
          if (facts.held.has(id)) reader.add(def.identityColumn, problem('import_code_exists', { code: def.identity(write) }))
        }
        const shown = def.preview(write, r.values)
        return { preview: { row: r.row, label: shown.label, place: shown.place, qty: shown.qty ?? null, errors }, write: errors.length ? null : write }
      }
    } }
  }
  return {
    kind: def.kind,
    spec: def.spec,
    checker,
    write: (em, _actor, importId, rows) => def.insert(em, importId, rows),
    async reverse(em, _actor, importId) {
      const used = await def.inUse(em, importId)
      if (used) throw AppError.conflict('import_records_in_use', `${used} has been used since the import; it can no longer be reversed as a whole.`, { params: { code: used } })
      await def.remove(em, importId)
    },
  }
}
