// One way for every import of a business's own data (opening stock, and the kinds that follow): the
// shared parser reads the upload (imports/spreadsheetParser.ts), the kind checks every row and reports
// every problem in one pass, and a commit writes everything in one transaction or nothing. Each commit
// leaves a record (who, when, file, rows, checksum); the same file committed again while its record
// stands changes nothing; a kind that can, reverses an import as a whole.
import { createHash } from 'node:crypto'
import type { DataSource, EntityManager } from 'typeorm'
import { PROBLEM_PAGE, type DataImportKind, type DataImportPreview, type DataImportRecord, type DataImportResult, type DataImportRow } from '../../../shared/schemas/dataImports.js'
import type { Problem } from '../../../shared/errors/errorCodes.js'
import { inTransaction } from '../../db/transaction.js'
import { AppError } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import type { ProblemStore } from './importProblems.js'
import type { ImportSpec, ParsedSheet } from './importTypes.js'
import { readSpreadsheetInChunks, type ParseLimits } from './spreadsheetParser.js'
import type { GuardedUpload } from './uploadGuard.js'

export interface CheckedRow<W> {
  preview: DataImportRow
  /** What to write; null for a row with problems or nothing to write. */
  write: W | null
}

/**
 * One pass's checker: takes the file's rows a chunk at a time, in file order, carrying from chunk to chunk only
 * what spans them (the rows' keys, for repeats; an order's header, for its lines). A row whose verdict waits on
 * rows further on may be held back and answered with a later chunk, or by `finish` at the end of the file.
 */
export interface ChunkChecker<W> {
  check(part: ParsedSheet): Promise<CheckedRow<W>[]>
  finish?(): CheckedRow<W>[]
}

export interface DataImportDefinition<W> {
  kind: DataImportKind
  spec: ImportSpec
  /**
   * A fresh checker for one pass over a file; it writes nothing. `importId` is the import a commit is writing (its
   * rows of earlier chunks are already in the tables: they are the file's own, not records held before), null in a
   * preview.
   */
  checker(em: EntityManager, importId: number | null): ChunkChecker<W>
  /**
   * Writes good rows inside the commit's transaction, called once per chunk while no row so far has a problem;
   * answers counts for the record, which add up over the chunks.
   */
  write(em: EntityManager, actor: AuditActor, importId: number, rows: W[]): Promise<Record<string, number>>
  /** Takes a committed import back whole, or refuses when something else has touched what it wrote. */
  reverse(em: EntityManager, actor: AuditActor, importId: number): Promise<void>
}

/** How far a pass over a file has got: rows read from the file, checked, and (in a commit) written. */
export interface ImportProgress {
  read(rows: number): void
  checked(rows: number): void
  written(rows: number): void
  /** Where every problem found is kept, for the pages of the run `runId`; without it only the first page is. */
  problems?: ProblemStore & { runId: string }
}

/**
 * A commit refused for the problems it found (rows made wrong since the check, or a file never checked): the
 * error, and what the commit found as a check would answer it, its problems kept under the commit's run for the pages.
 */
export class ImportRefused extends AppError {
  constructor(readonly found: DataImportPreview, fields: Record<string, Problem>) {
    super(422, 'import_invalid', `${found.errorRows} of ${found.total} rows need attention; nothing was imported.`, { params: { rows: found.errorRows, total: found.total }, fields })
  }
}

export const checksumOf = (data: Uint8Array) => createHash('sha256').update(data).digest('hex')

interface RecordRow {
  id: number; kind: DataImportKind; file_name: string; checksum: string; row_count: number; created_at: Date
  by_name: string | null; reversed_at: Date | null; reversed_by_name: string | null; summary: string | null
}

const RECORD_SQL = `SELECT d.id, d.kind, d.file_name, d.checksum, d.row_count, d.created_at, u.display_name AS by_name, d.reversed_at,
  r.display_name AS reversed_by_name, d.summary FROM data_imports d LEFT JOIN users u ON u.id = d.user_id LEFT JOIN users r ON r.id = d.reversed_by`

const toRecord = (r: RecordRow): DataImportRecord => ({
  id: r.id, kind: r.kind, fileName: r.file_name, checksum: r.checksum, rows: r.row_count, at: new Date(r.created_at).toISOString(),
  byName: r.by_name, reversedAt: r.reversed_at ? new Date(r.reversed_at).toISOString() : null, reversedByName: r.reversed_by_name,
  summary: r.summary ? (JSON.parse(r.summary) as Record<string, number>) : null,
})

/** The live (not reversed) record of this kind and checksum; a locking read inside a commit sees the latest. */
async function liveRecord(em: EntityManager, kind: DataImportKind, checksum: string, locking = false): Promise<DataImportRecord | null> {
  const rows: RecordRow[] = await em.query(`${RECORD_SQL} WHERE d.kind = ? AND d.live_checksum = ?${locking ? ' LOCK IN SHARE MODE' : ''}`, [kind, checksum])
  return rows[0] ? toRecord(rows[0]) : null
}

export async function findImport(em: EntityManager | DataSource, id: number): Promise<DataImportRecord> {
  const rows: RecordRow[] = await em.query(`${RECORD_SQL} WHERE d.id = ?`, [id])
  if (!rows[0]) throw AppError.notFound('import_not_found', `Import ${id} was not found.`)
  return toRecord(rows[0])
}

export async function listImports(ds: DataSource): Promise<DataImportRecord[]> {
  const rows: RecordRow[] = await ds.query(`${RECORD_SQL} ORDER BY d.id DESC LIMIT 200`)
  return rows.map(toRecord)
}

/** Good rows the answer shows as a sample (the counts cover every row). */
const SHOWN_GOOD = 20

/**
 * The counts of a pass over a file, its problems by column, and the few rows the answer shows (those of the
 * first page of problems, then a sample of good rows). Every problem goes to `keep`, a chunk at a time, for the
 * later pages; nothing else of a row is kept.
 */
function tally(keep?: ImportProgress['problems']) {
  const bad: DataImportRow[] = []
  let shownProblems = 0
  const good: DataImportRow[] = []
  const counts = { total: 0, ready: 0, skipped: 0, errorRows: 0 }
  let problems = 0
  const columns = new Map<string | null, number>()
  return {
    counts,
    async add<W>(checked: readonly CheckedRow<W>[]) {
      const found: DataImportRow[] = []
      for (const c of checked) {
        counts.total++
        if (c.preview.errors.length) {
          counts.errorRows++
          problems += c.preview.errors.length
          for (const e of c.preview.errors) columns.set(e.column, (columns.get(e.column) ?? 0) + 1)
          if (shownProblems < PROBLEM_PAGE) {
            bad.push(c.preview)
            shownProblems += c.preview.errors.length
          }
          found.push(c.preview)
          continue
        }
        if (c.write === null) counts.skipped++
        else counts.ready++
        if (good.length < SHOWN_GOOD) good.push(c.preview)
      }
      if (keep && found.length) await keep.add(found)
    },
    preview: (kind: DataImportKind, filename: string, repeatOf: DataImportRecord | null): DataImportPreview => ({
      kind, filename, ...counts, rows: [...bad, ...good], problems, checkRun: keep?.runId ?? null,
      problemColumns: [...columns].map(([column, count]) => ({ column, count })), problemRun: keep && problems ? keep.runId : null, repeatOf,
    }),
  }
}

/** How a pass reads the file: rows per chunk and the parse child's limits (the parser's own unless said; tests change them). */
export interface PassOptions {
  chunkRows?: number
  limits?: ParseLimits
}

/**
 * One pass over the upload: its rows cross from the parse worker a chunk at a time and are checked as they come;
 * `seen` takes each chunk's checked rows (and, at the end, any the checker held back) before the next is read.
 */
async function checkUpload<W>(
  em: EntityManager, def: DataImportDefinition<W>, upload: GuardedUpload, seen: (checked: CheckedRow<W>[]) => Promise<void>,
  importId: number | null, progress?: ImportProgress, options: PassOptions = {},
): Promise<void> {
  const checker = def.checker(em, importId)
  const take = async (checked: CheckedRow<W>[]) => {
    progress?.checked(checked.length)
    await seen(checked)
  }
  await readSpreadsheetInChunks(upload, def.spec, async (part) => {
    progress?.read(part.rows.length)
    await take(await checker.check(part))
  }, options.limits, options.chunkRows)
  const held = checker.finish?.() ?? []
  if (held.length) await take(held)
}

export async function previewImport<W>(
  ds: DataSource, def: DataImportDefinition<W>, upload: GuardedUpload, progress?: ImportProgress, options?: PassOptions,
): Promise<DataImportPreview> {
  const seen = tally(progress?.problems)
  await checkUpload(ds.manager, def, upload, (checked) => seen.add(checked), null, progress, options)
  const repeatOf = await liveRecord(ds.manager, def.kind, checksumOf(upload.data))
  return seen.preview(def.kind, upload.filename, repeatOf)
}

/**
 * Checks and writes in one transaction, a chunk at a time: while no row so far has a problem, each chunk's good
 * rows are written as soon as they are checked (so the commit holds a chunk, not the file); once a problem is
 * found nothing more is written, the rest is still checked (every problem counted) and the whole rolls back.
 */
export async function commitImport<W>(
  ds: DataSource, actor: AuditActor, def: DataImportDefinition<W>, upload: GuardedUpload, progress?: ImportProgress, options?: PassOptions,
): Promise<DataImportResult> {
  const checksum = checksumOf(upload.data)
  return inTransaction(ds, async (em) => {
    // The record first: a second commit of the same file waits on its unique key, then finds it taken.
    const inserted: { insertId: number; affectedRows: number } = await em.query(
      'INSERT IGNORE INTO data_imports (kind, file_name, checksum, live_checksum, row_count, user_id) VALUES (?, ?, ?, ?, 0, ?)',
      [def.kind, upload.filename.slice(0, 255), checksum, checksum, actor.userId],
    )
    if (!inserted.affectedRows) {
      const record = await liveRecord(em, def.kind, checksum, true)
      if (!record) throw new Error('data import record neither written nor found')
      return { ...tally().preview(def.kind, upload.filename, record), total: record.rows, record, repeated: true }
    }
    const importId = inserted.insertId
    // Of each checked row only the counts and the rows the answer shows are kept; its write goes out with its chunk.
    const seen = tally(progress?.problems)
    const counts: Record<string, number> = {}
    await checkUpload(em, def, upload, async (checked) => {
      await seen.add(checked)
      if (seen.counts.errorRows) return
      const writes: W[] = []
      for (const c of checked) if (c.write !== null && !c.preview.errors.length) writes.push(c.write)
      if (writes.length) for (const [k, n] of Object.entries(await def.write(em, actor, importId, writes))) counts[k] = (counts[k] ?? 0) + n
      progress?.written(checked.length)
    }, importId, progress, options)
    const summary = seen.preview(def.kind, upload.filename, null)
    if (summary.errorRows) {
      const first = summary.rows.filter((r) => r.errors.length).slice(0, 5).map((r) => [String(r.row), r.errors[0].problem]) // keyed by row number
      throw new ImportRefused({ ...summary, checkRun: null }, Object.fromEntries(first))
    }
    if (!summary.ready) throw AppError.unprocessable('import_nothing_to_write', 'The file holds no rows to import; nothing was imported.')
    await em.query('UPDATE data_imports SET summary = ?, row_count = ? WHERE id = ?', [JSON.stringify(counts), summary.total, importId])
    await audit(em, actor, 'data_import.commit', 'data_import', importId, { kind: def.kind, file: upload.filename, checksum, rows: summary.total, ...counts })
    return { ...summary, record: await findImport(em, importId), repeated: false }
  })
}

export async function reverseImport(ds: DataSource, actor: AuditActor, defs: Record<DataImportKind, DataImportDefinition<unknown>>, id: number): Promise<DataImportRecord> {
  return inTransaction(ds, async (em) => {
    const [row]: { kind: DataImportKind; reversed_at: Date | null }[] = await em.query('SELECT kind, reversed_at FROM data_imports WHERE id = ? FOR UPDATE', [id])
    if (!row) throw AppError.notFound('import_not_found', `Import ${id} was not found.`)
    if (row.reversed_at) throw AppError.conflict('import_already_reversed', `Import ${id} was already reversed.`)
    await defs[row.kind].reverse(em, actor, id)
    await em.query('UPDATE data_imports SET reversed_at = CURRENT_TIMESTAMP(3), reversed_by = ?, live_checksum = NULL WHERE id = ?', [actor.userId, id])
    await audit(em, actor, 'data_import.reverse', 'data_import', id, { kind: row.kind })
    return findImport(em, id)
  })
}
