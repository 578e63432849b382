// Everything out as a job the admin's screen follows, against the real MariaDB: two starts at once (a double
// click) and a start while it runs (a second tab, a reload) answer the one job; the percentage only grows and
// reaches 100 once the zip is whole; the rows counted before writing are the rows written; the finished file
// comes with its length and holds the README first; other roles are refused. Two app processes on one database
// (behind one proxy) answer the same job, start no second one, and either serves the file, which is kept in the
// database in parts and deleted past its time; a job whose process
// died is seen as failed and frees the way for the next.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { download, unzipEntries } from '../support/downloads.js'

let h: ApiHarness
// A second app on the same database: another process behind the same proxy.
let other: ApiHarness

beforeAll(async () => {
  h = await startApiHarness()
  other = await startApiHarness()
})
afterAll(async () => {
  await other?.close()
  await h?.close()
})

interface Job { id: string; state: string; percent: number; rowsDone: number; rowsTotal: number | null; bytes: number | null }

describe('everything out as a job', () => {
  it('runs one export at a time, with a percentage that only grows to 100, then the file with its length', async () => {
    const admin = await h.as('admin')
    const audits = async () => Number((await h.ds.query("SELECT COUNT(*) AS n FROM audit_entries WHERE action = 'business.export'"))[0].n)
    const auditsBefore = await audits()
    // A double click: two starts at once answer one job (common practice: a repeated request does not repeat the work).
    const [a, b] = await Promise.all([admin.post('/api/business-export/jobs').set(CSRF), admin.post('/api/business-export/jobs').set(CSRF)])
    expect([a.status, b.status]).toEqual([202, 202])
    expect(b.body.id).toBe(a.body.id)
    let job = a.body as Job
    const seen: number[] = [job.percent]
    for (let i = 0; job.state === 'running' && i < 2400; i++) {
      await new Promise((resolve) => setTimeout(resolve, 250))
      // A start while it runs (a second tab, a reload) follows the same job.
      if (i === 2) expect((await admin.post('/api/business-export/jobs').set(CSRF)).body.id).toBe(job.id)
      const current = await admin.get('/api/business-export/jobs/current')
      expect(current.status).toBe(200)
      job = current.body.job
      seen.push(job.percent)
    }
    expect(job.state).toBe('ready')
    expect(seen.at(-1)).toBe(100)
    expect(seen.slice(0, -1).every((p) => p < 100), 'below 100 until the zip is whole').toBe(true)
    expect(seen).toEqual([...seen].sort((x, y) => x - y))
    // The rows counted before writing are the rows written, file by file as the audit entry records them.
    const [entry] = await h.ds.query("SELECT detail FROM audit_entries WHERE action = 'business.export' ORDER BY id DESC LIMIT 1")
    const written = Object.values(JSON.parse(entry.detail).rows as Record<string, number>).reduce((sum, n) => sum + n, 0)
    expect(written).toBeGreaterThan(0)
    expect(job.rowsTotal).toBe(written)
    expect(job.rowsDone).toBe(written)
    expect(await audits()).toBe(auditsBefore + 1)
    // The finished file comes with its length; it is a whole zip, the README first.
    const file = await download(admin, `/api/business-export/jobs/${job.id}/file`)
    expect(file.status).toBe(200)
    expect(Number(file.headers['content-length'])).toBe(job.bytes)
    expect((file.body as Buffer).length).toBe(job.bytes)
    const entries = await unzipEntries(file.body as Buffer)
    expect([...entries.keys()][0]).toBe('README.xlsx')
    expect(entries.has('moves.xlsx')).toBe(true)
    const gone = await admin.get('/api/business-export/jobs/no-such-job/file')
    expect([gone.status, gone.body.error.code]).toEqual([404, 'export_job_not_found'])
    // Other roles: neither the job nor its file (it holds every cost, account and person).
    for (const role of ['counter', 'buyer', 'warehouse', 'viewer'] as const) {
      const other = await h.as(role)
      expect((await other.post('/api/business-export/jobs').set(CSRF)).status, role).toBe(403)
      expect((await other.get('/api/business-export/jobs/current')).status, role).toBe(403)
      expect((await other.get(`/api/business-export/jobs/${job.id}/file`)).status, role).toBe(403)
    }
  }, 600_000)

  it('keeps the job in the database: a second app process follows the same job, starts none of its own and serves the file', async () => {
    const adminA = await h.as('admin')
    // Each process signs in on its own (the session store is the database too, but supertest keeps one app per agent).
    const adminB = await other.as('admin')
    const audits = async () => Number((await h.ds.query("SELECT COUNT(*) AS n FROM audit_entries WHERE action = 'business.export'"))[0].n)
    const auditsBefore = await audits()
    // Two starts at once, one on each process (a double click that the proxy sent to both): one job.
    const [a, b] = await Promise.all([adminA.post('/api/business-export/jobs').set(CSRF), adminB.post('/api/business-export/jobs').set(CSRF)])
    expect([a.status, b.status]).toEqual([202, 202])
    expect(b.body.id).toBe(a.body.id)
    let job = a.body as Job
    for (let i = 0; job.state === 'running' && i < 2400; i++) {
      await new Promise((resolve) => setTimeout(resolve, 250))
      // The process that did not start it reports its progress.
      const seen = await adminB.get('/api/business-export/jobs/current')
      expect(seen.body.job.id).toBe(a.body.id)
      job = seen.body.job
    }
    expect(job.state).toBe('ready')
    expect(job.percent).toBe(100)
    expect(await audits()).toBe(auditsBefore + 1)
    // The zip is in the database, not on the disk of the process that wrote it: its parts, in order, are the file
    // either process serves, each part at most 1 MB (far below MariaDB's max_allowed_packet; from memory).
    const [{ file_id: fileId }] = await h.ds.query('SELECT file_id FROM business_export_jobs WHERE id = ?', [job.id])
    const parts: { data: Buffer }[] = await h.ds.query('SELECT data FROM stored_file_parts WHERE file_id = ? ORDER BY seq', [fileId])
    const stored = Buffer.concat(parts.map((p) => p.data))
    expect(stored.length).toBe(job.bytes)
    for (const p of parts) expect(p.data.length).toBeLessThanOrEqual(1024 * 1024)
    for (const agent of [adminA, adminB]) {
      const file = await download(agent, `/api/business-export/jobs/${job.id}/file`)
      expect(file.status).toBe(200)
      expect((file.body as Buffer).equals(stored)).toBe(true)
    }
    // Past its time the file is no longer offered, and the next start deletes it, parts and all.
    await h.ds.query('UPDATE stored_files SET expires_at = CURRENT_TIMESTAMP(3) - INTERVAL 1 SECOND WHERE id = ?', [fileId])
    expect((await adminB.get(`/api/business-export/jobs/${job.id}/file`)).status).toBe(404)
    const next = await adminA.post('/api/business-export/jobs').set(CSRF)
    expect(next.status).toBe(202)
    expect(Number((await h.ds.query('SELECT COUNT(*) AS n FROM stored_file_parts WHERE file_id = ?', [fileId]))[0].n)).toBe(0)
    for (let i = 0; (await adminA.get('/api/business-export/jobs/current')).body.job.state === 'running' && i < 2400; i++) await new Promise((resolve) => setTimeout(resolve, 250))
  }, 600_000)

  it('sees a running job whose process went silent as failed, and lets the next export start', async () => {
    const admin = await other.as('admin')
    // The latest job, left running by a process that died: it holds the slot, and its heartbeat stopped two minutes ago.
    await h.ds.query("DELETE FROM business_export_jobs WHERE state = 'running'")
    const dead = '00000000-0000-4000-8000-00000000dead'
    await h.ds.query(
      `INSERT INTO business_export_jobs (id, state, running_slot, filename, started_at, heartbeat_at)
        VALUES (?, 'running', 1, 'lumenyard-everything-dead.zip', CURRENT_TIMESTAMP(3), CURRENT_TIMESTAMP(3) - INTERVAL 2 MINUTE)`,
      [dead],
    )
    const current = await admin.get('/api/business-export/jobs/current')
    expect([current.body.job.id, current.body.job.state]).toEqual([dead, 'failed'])
    expect((await admin.get(`/api/business-export/jobs/${dead}/file`)).status).toBe(404)
    // The slot is free again: a start begins a new job rather than answering the dead one.
    const started = await admin.post('/api/business-export/jobs').set(CSRF)
    expect(started.status).toBe(202)
    expect(started.body.id).not.toBe(dead)
    let job = started.body as Job
    for (let i = 0; job.state === 'running' && i < 2400; i++) {
      await new Promise((resolve) => setTimeout(resolve, 250))
      job = (await admin.get('/api/business-export/jobs/current')).body.job
    }
    expect(job.state).toBe('ready')
  }, 600_000)
})
