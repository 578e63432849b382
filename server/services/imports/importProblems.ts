// Every problem of every row a check finds, kept beside its run in MariaDB rather than in the app's memory:
// written a chunk at a time as the check goes (a few multi-row INSERTs per chunk), read back a page at a time
// (all problems, or one column's) by the page that shows them. They go with their run.
import type { DataSource } from 'typeorm'
import type { ErrorParams } from '../../../shared/errors/errorCodes.js'
import { PROBLEM_PAGE, type DataImportProblemPage, type DataImportRow } from '../../../shared/schemas/dataImports.js'
import { AppError } from '../../errors.js'

/** Rows per INSERT: 7 values each keeps a statement far below max_allowed_packet and the placeholder limit. */
const ROWS_PER_INSERT = 500

export interface ProblemStore {
  /** Keeps every problem of these rows (the rows with none are passed over). */
  add(rows: readonly DataImportRow[]): Promise<void>
}

/** The problems of run `runId`, numbered in the order they are found. */
export function problemStore(ds: DataSource, runId: string): ProblemStore {
  let seq = 0
  return {
    async add(rows) {
      const values: unknown[][] = []
      for (const r of rows) {
        for (const e of r.errors) values.push([runId, seq++, r.row, r.label?.slice(0, 255) ?? null, e.column?.slice(0, 80) ?? null, e.problem.code, e.problem.params ? JSON.stringify(e.problem.params) : null])
      }
      for (let i = 0; i < values.length; i += ROWS_PER_INSERT) {
        const part = values.slice(i, i + ROWS_PER_INSERT)
        await ds.query(`INSERT INTO data_import_problems (run_id, seq, row_no, label, col, code, params) VALUES ${part.map(() => '(?, ?, ?, ?, ?, ?, ?)').join(', ')}`, part.flat())
      }
    },
  }
}

interface ProblemRow { row_no: number; label: string | null; col: string | null; code: string; params: string | null }

/**
 * A page of the problems a run of this person's found, from `offset`, all of them or those of one `column`
 * (`''` for the problems of a row as a whole).
 */
export async function problemPage(ds: DataSource, userId: number, runId: string, offset: number, column?: string): Promise<DataImportProblemPage> {
  const [run]: { id: string }[] = await ds.query('SELECT id FROM data_import_runs WHERE id = ? AND user_id = ?', [runId.slice(0, 36), userId])
  if (!run) throw AppError.notFound('import_run_not_found', 'That check is no longer kept; check the file again.')
  const where = column === undefined ? '' : ' AND col <=> ?'
  const params = column === undefined ? [run.id] : [run.id, column === '' ? null : column]
  const [{ n }]: { n: number | string }[] = await ds.query(`SELECT COUNT(*) AS n FROM data_import_problems WHERE run_id = ?${where}`, params)
  const rows: ProblemRow[] = await ds.query(`SELECT row_no, label, col, code, params FROM data_import_problems WHERE run_id = ?${where} ORDER BY seq LIMIT ? OFFSET ?`,
    [...params, PROBLEM_PAGE, offset])
  return {
    total: Number(n),
    offset,
    problems: rows.map((r) => ({
      row: r.row_no, label: r.label, column: r.col,
      problem: { code: r.code as DataImportProblemPage['problems'][number]['problem']['code'], ...(r.params ? { params: JSON.parse(r.params) as ErrorParams } : {}) },
    })),
  }
}
