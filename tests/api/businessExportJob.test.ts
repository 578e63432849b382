// Everything out as a job the admin's screen follows, against the real MariaDB: two starts at once (a double
// click) and a start while it runs (a second tab, a reload) answer the one job; the percentage only grows and
// reaches 100 once the zip is whole; the rows counted before writing are the rows written; the finished file
// comes with its length and holds the README first; other roles are refused.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { download, unzipEntries } from '../support/downloads.js'

let h: ApiHarness

beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

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
})
