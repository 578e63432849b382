// Everything out as a short-lived job, so the administrator's screen can show a true percentage: the export
// counts the rows it will write (in its own snapshot), then streams them into a zip kept in MariaDB in parts of
// 1 MB (server/db/storedFiles.ts; never whole in memory), counting as it goes; the screen asks how far it has
// got and, once ready, downloads the file with its length known.
//
// The job's state (status, rows done of the total, file, who, when, until when it is kept) is a row of
// `business_export_jobs` and its file is in the database too, so every app process behind a proxy answers the
// same progress and serves the same file, whichever server wrote it. One job runs at a time for the whole business, across
// processes: a running job holds the one `running_slot`, so a second start (a double click, a second tab, a
// reload, another process) answers the running job instead of starting another. The process that runs a job
// beats its heartbeat while it works; a running job whose heartbeat stopped (its process died) is seen as
// failed and frees the slot. A finished file is kept for a while to be downloaded, then deleted.
import { randomUUID } from 'node:crypto'
import { finished } from 'node:stream/promises'
import type { Readable } from 'node:stream'
import type { DataSource } from 'typeorm'
import type { ExportJob } from '../../../shared/schemas/businessExport.js'
import { failSilentRows, progressRow } from '../../db/progressRow.js'
import { dropExpiredFiles, expireStoredFile, readStoredFile, storedFileBytes, storedFileWriter, type StoredFileWriter } from '../../db/storedFiles.js'
import { BusinessExportJob } from '../../entities/BusinessExportJob.js'
import { AppError } from '../../errors.js'
import type { AuditActor } from '../auditService.js'
import { businessExportName, exportBusiness } from './businessExport.js'
import type { ReadmeLang } from './readmeWords.js'

/** How long a finished file waits to be downloaded before it is deleted. */
export const EXPORT_FILE_KEEP_MS = 30 * 60_000
/** While an export is written its file is kept this long beyond the download time, in case the process dies mid-way. */
const SILENT_KEEP_MS = 24 * 60 * 60_000
/** Progress is written to the database at most this often (and once more at the end). */
const PROGRESS_WRITE_MS = 400

const percentOf = (job: BusinessExportJob) => {
  if (job.state === 'ready') return 100
  if (!job.rowsTotal) return 0
  // The zip is only whole once its last entry is written: 99 % until then.
  return Math.min(99, Math.floor((job.rowsDone / job.rowsTotal) * 100))
}

const viewOf = (job: BusinessExportJob): ExportJob => ({
  id: job.id, state: job.state, percent: percentOf(job), rowsDone: job.rowsDone, rowsTotal: job.rowsTotal, filename: job.filename,
  bytes: job.bytes === null ? null : Number(job.bytes), startedAt: new Date(job.startedAt).toISOString(),
  finishedAt: job.finishedAt ? new Date(job.finishedAt).toISOString() : null,
})

const jobs = (ds: DataSource) => ds.getRepository(BusinessExportJob)

/** A running job whose process stopped beating (it crashed or was killed) becomes failed and frees the slot. */
const failSilentJobs = (ds: DataSource) => failSilentRows(ds, 'business_export_jobs', 'running_slot = NULL')

/** Ends the keeping of the files of finished jobs other than `keep` (superseded), and deletes every file past its time. */
async function discardOldFiles(ds: DataSource, keep: string): Promise<void> {
  const old: { id: string; file_id: string | null }[] = await ds.query(
    "SELECT id, file_id FROM business_export_jobs WHERE id <> ? AND state <> 'running' AND (expires_at IS NULL OR expires_at > CURRENT_TIMESTAMP(3) - INTERVAL 1 DAY)",
    [keep],
  )
  if (old.length) {
    await ds.query('UPDATE business_export_jobs SET expires_at = LEAST(COALESCE(expires_at, CURRENT_TIMESTAMP(3)), CURRENT_TIMESTAMP(3)) WHERE id IN (?)', [old.map((j) => j.id)])
    for (const j of old) if (j.file_id) await expireStoredFile(ds, j.file_id)
  }
  await dropExpiredFiles(ds)
}

async function run(ds: DataSource, actor: AuditActor, lang: ReadmeLang, id: string, filename: string, log: (err: unknown) => void): Promise<void> {
  const fail = () => ds.query("UPDATE business_export_jobs SET state = 'failed', running_slot = NULL, finished_at = CURRENT_TIMESTAMP(3) WHERE id = ? AND state = 'running'", [id]).catch(log)
  let file: StoredFileWriter
  try {
    file = await storedFileWriter(ds, 'business_export', filename, EXPORT_FILE_KEEP_MS + SILENT_KEEP_MS)
  } catch (err) {
    log(err)
    return void (await fail())
  }
  const out = file.stream
  let rowsTotal: number | null = null
  let rowsDone = 0
  const progress = progressRow(ds, "UPDATE business_export_jobs SET rows_total = ?, rows_done = ?, heartbeat_at = CURRENT_TIMESTAMP(3) WHERE id = ? AND state = 'running'",
    () => [rowsTotal, rowsDone, id], PROGRESS_WRITE_MS, log)
  try {
    await exportBusiness(ds, actor, out, lang, {
      total: (n) => { rowsTotal = n; progress.report(true) },
      advance: (n) => { rowsDone += n; progress.report() },
    })
    await finished(out)
    const bytes = await storedFileBytes(ds, file.id)
    await progress.stop()
    const done: { affectedRows: number } = await ds.query(
      `UPDATE business_export_jobs SET state = 'ready', running_slot = NULL, rows_total = ?, rows_done = ?, bytes = ?, file_id = ?, finished_at = CURRENT_TIMESTAMP(3),
        expires_at = CURRENT_TIMESTAMP(3) + INTERVAL ? MICROSECOND WHERE id = ? AND state = 'running'`,
      [rowsTotal, rowsDone, bytes, file.id, EXPORT_FILE_KEEP_MS * 1000, id],
    )
    // Declared failed meanwhile (this process was silent too long): the file is not offered, so it goes.
    if (!done.affectedRows) await expireStoredFile(ds, file.id)
    else await ds.query('UPDATE stored_files SET expires_at = CURRENT_TIMESTAMP(3) + INTERVAL ? MICROSECOND WHERE id = ?', [EXPORT_FILE_KEEP_MS * 1000, file.id])
  } catch (err) {
    out.destroy()
    log(err)
    await progress.stop()
    await fail()
    await expireStoredFile(ds, file.id).catch(log)
  }
}

/** Starts the export (its README in `lang`), or answers the one already running in any process. */
export async function startExportJob(ds: DataSource, actor: AuditActor, lang: ReadmeLang, log: (err: unknown) => void): Promise<ExportJob> {
  await failSilentJobs(ds)
  const running = await jobs(ds).findOneBy({ runningSlot: 1 })
  if (running) return viewOf(running)
  const filename = businessExportName(new Date())
  const id = randomUUID()
  // The unique slot decides between two starts at once (in this process or another): the loser answers the winner's job.
  const inserted: { affectedRows: number } = await ds.query(
    "INSERT IGNORE INTO business_export_jobs (id, state, running_slot, filename, user_id) VALUES (?, 'running', 1, ?, ?)",
    [id, filename, actor.userId],
  )
  if (!inserted.affectedRows) {
    const winner = await jobs(ds).findOneBy({ runningSlot: 1 })
    if (winner) return viewOf(winner)
    // The other start finished between the two reads: its job is the latest.
    const latest = await currentExportJob(ds)
    if (latest) return latest
    throw AppError.conflict('export_job_not_ready', 'Another export was starting; try again.')
  }
  await discardOldFiles(ds, id)
  void run(ds, actor, lang, id, filename, log)
  return viewOf(await jobs(ds).findOneByOrFail({ id }))
}

/** The latest export (running, ready and still kept, or failed), or null: what the screen shows after a reload. */
export async function currentExportJob(ds: DataSource): Promise<ExportJob | null> {
  await failSilentJobs(ds)
  const [job] = await jobs(ds).find({ order: { startedAt: 'DESC' }, take: 1 })
  if (!job) return null
  const kept: { kept: number }[] = await ds.query('SELECT expires_at IS NULL OR expires_at > CURRENT_TIMESTAMP(3) AS kept FROM business_export_jobs WHERE id = ?', [job.id])
  if (job.state === 'ready' && !Number(kept[0]?.kept)) return null
  return viewOf(job)
}

/** The finished file of a job, for the download, streamed from the database whichever process wrote it. */
export async function exportJobFile(ds: DataSource, id: string): Promise<{ stream: Readable; filename: string; bytes: number }> {
  const [job]: { state: string; file_id: string | null; filename: string; bytes: string | number | null; kept: number }[] = await ds.query(
    'SELECT state, file_id, filename, bytes, expires_at > CURRENT_TIMESTAMP(3) AS kept FROM business_export_jobs WHERE id = ?',
    [id.slice(0, 36)],
  )
  if (!job || (job.state === 'ready' && !Number(job.kept)) || job.state === 'failed') {
    throw AppError.notFound('export_job_not_found', 'That download is no longer kept; start it again.')
  }
  if (job.state !== 'ready' || job.bytes === null) throw AppError.conflict('export_job_not_ready', 'That download is not ready yet.')
  const bytes = Number(job.bytes)
  // Its file was cleared meanwhile (past its time): no longer kept.
  const kept = job.file_id ? await storedFileBytes(ds, job.file_id) : null
  if (kept !== bytes) throw AppError.notFound('export_job_not_found', 'That download is no longer kept; start it again.')
  return { stream: readStoredFile(ds, job.file_id!), filename: job.filename, bytes }
}
