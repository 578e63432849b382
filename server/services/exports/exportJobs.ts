// Everything out as a short-lived job, so the administrator's screen can show a true percentage: the export
// counts the rows it will write (in its own snapshot), then streams them to a temporary zip on the server's
// disk (never into memory), counting as it goes; the screen asks how far it has got and, once ready, downloads
// the file with its length known. One job runs at a time for the whole business: a second start while one
// runs (a double click, a second tab, a reload) answers the running job instead of starting another. A
// finished file is kept for a while to be downloaded, then deleted.
import { randomUUID } from 'node:crypto'
import { createWriteStream } from 'node:fs'
import { mkdtemp, rm, stat } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { finished } from 'node:stream/promises'
import type { DataSource } from 'typeorm'
import type { ExportJob } from '../../../shared/schemas/businessExport.js'
import { AppError } from '../../errors.js'
import type { AuditActor } from '../auditService.js'
import { businessExportName, exportBusiness } from './businessExport.js'
import type { ReadmeLang } from './readmeWords.js'

/** How long a finished file waits to be downloaded before it is deleted. */
export const EXPORT_FILE_KEEP_MS = 30 * 60_000

interface Job {
  id: string
  state: ExportJob['state']
  rowsTotal: number | null
  rowsDone: number
  filename: string
  file: string
  bytes: number | null
  startedAt: Date
  finishedAt: Date | null
  expiry?: NodeJS.Timeout
}

// One registry per database: the app's own, and a test harness's second app beside it.
const registries = new WeakMap<DataSource, { latest: Job | null }>()
const registryOf = (ds: DataSource) => {
  let r = registries.get(ds)
  if (!r) registries.set(ds, (r = { latest: null }))
  return r
}

const percentOf = (job: Job) => {
  if (job.state === 'ready') return 100
  if (!job.rowsTotal) return 0
  // The zip is only whole once its last entry is written: 99 % until then.
  return Math.min(99, Math.floor((job.rowsDone / job.rowsTotal) * 100))
}

const viewOf = (job: Job): ExportJob => ({
  id: job.id, state: job.state, percent: percentOf(job), rowsDone: job.rowsDone, rowsTotal: job.rowsTotal, filename: job.filename, bytes: job.bytes,
  startedAt: job.startedAt.toISOString(), finishedAt: job.finishedAt?.toISOString() ?? null,
})

async function discard(job: Job): Promise<void> {
  clearTimeout(job.expiry)
  await rm(path.dirname(job.file), { recursive: true, force: true })
}

async function run(ds: DataSource, actor: AuditActor, lang: ReadmeLang, job: Job, log: (err: unknown) => void): Promise<void> {
  const out = createWriteStream(job.file)
  try {
    await exportBusiness(ds, actor, out, lang, { total: (n) => (job.rowsTotal = n), advance: (n) => (job.rowsDone += n) })
    await finished(out)
    job.bytes = (await stat(job.file)).size
    job.state = 'ready'
    job.expiry = setTimeout(() => {
      const registry = registryOf(ds)
      if (registry.latest === job) registry.latest = null
      void discard(job)
    }, EXPORT_FILE_KEEP_MS)
    job.expiry.unref()
  } catch (err) {
    job.state = 'failed'
    out.destroy()
    log(err)
    await discard(job)
  } finally {
    job.finishedAt = new Date()
  }
}

/** Starts the export (its README in `lang`), or answers the one already running. */
export async function startExportJob(ds: DataSource, actor: AuditActor, lang: ReadmeLang, log: (err: unknown) => void): Promise<ExportJob> {
  const registry = registryOf(ds)
  if (registry.latest?.state === 'running') return viewOf(registry.latest)
  const before = registry.latest
  const at = new Date()
  const dir = await mkdtemp(path.join(tmpdir(), 'lumenyard-export-'))
  // Checked again after the await: a second start that arrived meanwhile answers this one's job.
  const meanwhile = registryOf(ds).latest as Job | null
  if (meanwhile !== before && meanwhile?.state === 'running') {
    await rm(dir, { recursive: true, force: true })
    return viewOf(meanwhile)
  }
  const job: Job = {
    id: randomUUID(), state: 'running', rowsTotal: null, rowsDone: 0, filename: businessExportName(at), file: path.join(dir, 'export.zip'),
    bytes: null, startedAt: at, finishedAt: null,
  }
  registry.latest = job
  if (before && before.state === 'ready') await discard(before)
  void run(ds, actor, lang, job, log)
  return viewOf(job)
}

/** The latest export (running, ready or failed), or null: what the screen shows after a reload. */
export function currentExportJob(ds: DataSource): ExportJob | null {
  const job = registryOf(ds).latest
  return job ? viewOf(job) : null
}

/** The finished file of a job, for the download. */
export function exportJobFile(ds: DataSource, id: string): { file: string; filename: string; bytes: number } {
  const job = registryOf(ds).latest
  if (!job || job.id !== id) throw AppError.notFound('export_job_not_found', 'That download is no longer kept; start it again.')
  if (job.state !== 'ready' || job.bytes === null) throw AppError.conflict('export_job_not_ready', 'That download is not ready yet.')
  return { file: job.file, filename: job.filename, bytes: job.bytes }
}
