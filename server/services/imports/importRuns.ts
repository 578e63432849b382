// An import's check or commit as a run the page can follow: the rows read, checked and written against the
// file's rows are written to `data_import_runs` as they go (at most every few hundred milliseconds), with the
// answer once done, so the page shows a true percentage, and after a reload (served by any app process) finds
// the run again and its answer. A second check of the same file by the same person while the first runs (a
// double click, a second tab) follows the first instead of checking again. A run whose process stopped beating
// its heartbeat is seen as failed.
import { randomUUID } from 'node:crypto'
import type { DataSource } from 'typeorm'
import type { ErrorParams, Problem } from '../../../shared/errors/errorCodes.js'
import type { DataImportKind, DataImportRun, DataImportRunStep } from '../../../shared/schemas/dataImports.js'
import { failSilentRows, progressRow } from '../../db/progressRow.js'
import { dropExpiredFiles, loadStoredFile, storeFile } from '../../db/storedFiles.js'
import { AppError } from '../../errors.js'
import type { AuditActor } from '../auditService.js'
import { checksumOf, ImportRefused, type ImportProgress } from './dataImports.js'
import { problemStore } from './importProblems.js'
import { rowsInUpload } from './spreadsheetParser.js'
import { kindOf, type GuardedUpload } from './uploadGuard.js'

const PROGRESS_WRITE_MS = 300
/** How long a finished run's answer is offered to the page that lost it (a reload). */
const KEEP_MS = 30 * 60_000
/** How long a checked file is kept in the database for its commit (from any app process). */
const UPLOAD_KEEP_MS = 2 * 60 * 60_000
/** How long a second check waits for the first one's answer. */
const FOLLOW_MS = 15 * 60_000

interface StoredProblem { status: number; code: string; message: string; params?: ErrorParams; fields?: Record<string, Problem> }

interface RunRow {
  id: string; kind: DataImportKind; step: DataImportRunStep; file_name: string; state: DataImportRun['state']; rows_total: number | null
  rows_read: number; rows_checked: number; rows_written: number; answer: string | null; problem: string | null; started_at: Date
}

/** Whole percent: the rows checked of the file's (and, for a commit, then the rows written); 100 only when done. */
function percentOf(r: RunRow): number {
  if (r.state === 'done') return 100
  if (!r.rows_total) return 0
  const work = r.step === 'commit' ? 2 * r.rows_total : r.rows_total
  const done = r.rows_checked + (r.step === 'commit' ? r.rows_written : 0)
  return Math.min(99, Math.floor((done / work) * 100))
}

const viewOf = (r: RunRow): DataImportRun => ({
  id: r.id, kind: r.kind, step: r.step, fileName: r.file_name, state: r.state, rowsTotal: r.rows_total, rowsRead: r.rows_read,
  rowsChecked: r.rows_checked, rowsWritten: r.rows_written, percent: percentOf(r), startedAt: new Date(r.started_at).toISOString(),
  answer: r.answer ? JSON.parse(r.answer) : null, problem: r.problem ? (JSON.parse(r.problem) as StoredProblem) : null,
})

const RUN_SQL = `SELECT id, kind, step, file_name, state, rows_total, rows_read, rows_checked, rows_written, answer, problem, started_at
  FROM data_import_runs`

/** A running check or commit whose process stopped beating (it crashed or was killed) reads as failed. */
const LOST: StoredProblem = { status: 500, code: 'import_run_lost', message: 'The check stopped before it finished; check the file again.' }
const failSilentRuns = (ds: DataSource) => failSilentRows(ds, 'data_import_runs', 'running_key = NULL, problem = ?', [JSON.stringify(LOST)])

const problemOf = (err: unknown): StoredProblem | null =>
  err instanceof AppError ? { status: err.status, code: err.code, message: err.message, params: err.params, fields: err.fields } : null

const errorOf = (p: StoredProblem) => new AppError(p.status, p.code as AppError['code'], p.message, { params: p.params, fields: p.fields })

/** Waits for another run's answer: its result, or its failure thrown again. */
async function followRun<T>(ds: DataSource, key: string): Promise<T> {
  const [running]: { id: string }[] = await ds.query('SELECT id FROM data_import_runs WHERE running_key = ?', [key])
  const id = running?.id
  for (const until = Date.now() + FOLLOW_MS; id && Date.now() < until;) {
    await new Promise((resolve) => setTimeout(resolve, 250))
    await failSilentRuns(ds)
    const [row]: RunRow[] = await ds.query(`${RUN_SQL} WHERE id = ?`, [id])
    if (row?.state === 'done') return JSON.parse(row.answer!) as T
    if (row?.state === 'failed') {
      const p = row.problem ? (JSON.parse(row.problem) as StoredProblem) : null
      throw p ? errorOf(p) : AppError.of(500, 'import_run_lost', 'The check stopped before it finished; check the file again.')
    }
  }
  throw AppError.of(500, 'import_run_lost', 'The check stopped before it finished; check the file again.')
}

/**
 * Runs one step of an import (`work`, given the progress to report) as a run the page can follow. A check of a
 * file this person is already checking answers that check's answer, and so does a commit of a checked run
 * (`commitOf`) this person is already committing (a double click). A check keeps the file it checked, for the
 * commit.
 */
export async function runImportStep<T>(
  ds: DataSource, actor: AuditActor, kind: DataImportKind, step: DataImportRunStep, upload: GuardedUpload, work: (progress: ImportProgress) => Promise<T>,
  commitOf?: string,
): Promise<T> {
  const userId = actor.userId
  if (userId === null) return work({ read: () => undefined, checked: () => undefined, written: () => undefined })
  await failSilentRuns(ds)
  // Old runs go with the problems they kept (ON DELETE CASCADE), whoever ran them; kept files past their time too.
  await ds.query('DELETE FROM data_import_runs WHERE state <> \'running\' AND started_at < CURRENT_TIMESTAMP(3) - INTERVAL 1 DAY')
  await dropExpiredFiles(ds)
  const checksum = checksumOf(upload.data)
  // A check is followed, and a commit of a checked run; two commits of one file sent whole meet at the import's
  // own record, which writes once.
  const key = step === 'preview' ? `${userId}:${kind}:${checksum}` : commitOf ? `${userId}:commit:${commitOf}` : null
  const id = randomUUID()
  const total = await rowsInUpload(upload)
  const inserted: { affectedRows: number } = await ds.query(
    "INSERT IGNORE INTO data_import_runs (id, user_id, kind, step, file_name, checksum, state, running_key, rows_total) VALUES (?, ?, ?, ?, ?, ?, 'running', ?, ?)",
    [id, userId, kind, step, upload.filename.slice(0, 255), checksum, key, total],
  )
  if (!inserted.affectedRows) return followRun<T>(ds, key!)

  const counts = { read: 0, checked: 0, written: 0 }
  const progress = progressRow(ds,
    "UPDATE data_import_runs SET rows_read = ?, rows_checked = ?, rows_written = ?, heartbeat_at = CURRENT_TIMESTAMP(3) WHERE id = ? AND state = 'running'",
    () => [counts.read, counts.checked, counts.written, id], PROGRESS_WRITE_MS)
  const finish = async (set: string, params: unknown[]) => {
    await progress.stop()
    await ds.query(`UPDATE data_import_runs SET ${set}, running_key = NULL, finished_at = CURRENT_TIMESTAMP(3), rows_read = ?, rows_checked = ?, rows_written = ? WHERE id = ?`,
      [...params, counts.read, counts.checked, counts.written, id])
  }
  // The checked file goes to the database beside the check, for a commit that names this run.
  const kept = step === 'preview'
    ? storeFile(ds, 'import_upload', upload.filename, upload.data, UPLOAD_KEEP_MS).then((fileId) => ds.query('UPDATE data_import_runs SET upload_id = ? WHERE id = ?', [fileId, id]))
    : Promise.resolve()
  kept.catch(() => undefined)
  try {
    const answer = await work({
      read: (n) => { counts.read += n; progress.report() },
      checked: (n) => { counts.checked += n; progress.report() },
      written: (n) => { counts.written += n; progress.report(true) },
      problems: { runId: id, ...problemStore(ds, id) },
    })
    await kept
    await finish("state = 'done', answer = ?", [JSON.stringify(answer)])
    return answer
  } catch (err) {
    const p = problemOf(err)
    // A commit refused for its rows keeps what it found beside the problem, for the page to show them paged.
    const found = err instanceof ImportRefused ? JSON.stringify(err.found) : null
    await finish("state = 'failed', problem = ?, answer = ?", [p ? JSON.stringify(p) : null, found]).catch(() => undefined)
    throw err
  }
}

/** This person's latest run of the last half hour (running, done with its answer, or failed with its problem), or null. */
export async function currentImportRun(ds: DataSource, userId: number): Promise<DataImportRun | null> {
  await failSilentRuns(ds)
  const [row]: RunRow[] = await ds.query(`${RUN_SQL} WHERE user_id = ? AND started_at > CURRENT_TIMESTAMP(3) - INTERVAL ? MICROSECOND ORDER BY started_at DESC LIMIT 1`,
    [userId, KEEP_MS * 1000])
  return row ? viewOf(row) : null
}

/** The file a finished check of this person's checked, to be committed, with its kind; refused when no longer kept. */
export async function checkedUpload(ds: DataSource, userId: number, runId: string): Promise<{ kind: DataImportKind; upload: GuardedUpload }> {
  const [run]: { kind: DataImportKind; file_name: string; upload_id: string | null }[] = await ds.query(
    "SELECT kind, file_name, upload_id FROM data_import_runs WHERE id = ? AND user_id = ? AND step = 'preview' AND state = 'done'", [runId.slice(0, 36), userId])
  const data = run?.upload_id ? await loadStoredFile(ds, run.upload_id) : null
  if (!run || !data) throw AppError.notFound('import_run_not_found', 'That check is no longer kept; check the file again.')
  return { kind: run.kind, upload: { kind: kindOf(run.file_name, ['xlsx', 'csv']), filename: run.file_name, data } }
}
