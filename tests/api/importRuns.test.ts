// An import's check and commit as runs the page follows, against the real MariaDB: while a check runs, the rows
// checked grow against the file's rows (counted before reading) and the percentage reaches 100 only with the
// answer; two checks of one file at once (a double click) make one run and the same answer; after a reload the
// latest run and its answer (or its problem) are still there; a run whose process went silent reads as failed.
import { createHash } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { tagOf } from '../support/fixtureRows.js'
import { createOpeningStockTarget } from '../support/stockFixtures.js'

let h: ApiHarness
const tag = tagOf()
const SKU = `RUN-BLK-${tag}`
const WH = `R${tag}`

beforeAll(async () => {
  h = await startApiHarness()
  await createOpeningStockTarget(h.ds, SKU, WH)
})
afterAll(() => h?.close())

/** An opening-stock sheet of `rows` good rows (a lot of its own per row); `salt` makes the file's checksum its own. */
const sheetOf = (rows: number, salt: string) => Buffer.from(['SKU,Warehouse,Bin,Lot,Quantity,Unit cost',
  ...Array.from({ length: rows }, (_, i) => `${SKU},${WH},A-01-1,${salt}-${String(i).padStart(6, '0')},${(i % 40) + 1},2.5000`)].join('\r\n') + '\r\n', 'utf8')

interface Run { id: string; state: string; step: string; rowsTotal: number | null; rowsChecked: number; percent: number; answer: { total: number; ready: number } | null; problem: { code: string } | null }

describe('import runs', () => {
  it('reports rows checked against the file\'s rows while a check runs, then 100 % with the answer', async () => {
    const admin = await h.as('admin')
    const file = sheetOf(8_000, `P${tag}`)
    const sent = admin.post('/api/imports/opening_stock/preview').set(CSRF).attach('file', file, 'opening.csv').then((r) => r)
    let finished = false
    void sent.then(() => { finished = true })
    const seen: Run[] = []
    while (!finished) {
      const current = await admin.get('/api/imports/runs/current')
      expect(current.status).toBe(200)
      if (current.body.run?.state === 'running') seen.push(current.body.run)
      await new Promise((resolve) => setTimeout(resolve, 100))
    }
    const answer = await sent
    expect(answer.status).toBe(200)
    expect(answer.body.total).toBe(8_000)
    // Seen while it ran: the file's 8,000 data rows known from the start (its lines less the header; common
    // practice), rows checked that only grow, and a percentage below 100: the whole percent of rows checked, held
    // at 99 once every row is checked and the answer is still being put together (100 only with the answer).
    expect(seen.length).toBeGreaterThan(0)
    for (const r of seen) {
      expect(r.rowsTotal).toBe(8_000)
      expect(r.percent).toBeLessThan(100)
      expect(r.percent).toBe(Math.min(99, Math.floor((r.rowsChecked / 8_000) * 100)))
    }
    expect(seen.map((r) => r.rowsChecked)).toEqual([...seen.map((r) => r.rowsChecked)].sort((a, b) => a - b))
    // Afterwards (a reload): the same run, done, at 100 %, with the answer the request got.
    const after = (await admin.get('/api/imports/runs/current')).body.run as Run
    expect([after.state, after.percent, after.rowsChecked]).toEqual(['done', 100, 8_000])
    expect(after.answer).toEqual(answer.body)
  }, 300_000)

  it('makes one run of two checks of the same file at once, both answered alike', async () => {
    const admin = await h.as('admin')
    const file = sheetOf(3_000, `D${tag}`)
    const checksum = createHash('sha256').update(file).digest('hex')
    const [a, b] = await Promise.all([1, 2].map(() => admin.post('/api/imports/opening_stock/preview').set(CSRF).attach('file', file, 'opening.csv')))
    expect([a.status, b.status]).toEqual([200, 200])
    expect(b.body).toEqual(a.body)
    expect(Number((await h.ds.query('SELECT COUNT(*) AS n FROM data_import_runs WHERE checksum = ?', [checksum]))[0].n)).toBe(1)
  }, 300_000)

  it('keeps a failed check\'s problem, and reads a run whose process went silent as failed', async () => {
    const admin = await h.as('admin')
    const bad = await admin.post('/api/imports/opening_stock/preview').set(CSRF).attach('file', Buffer.from('Colour,Size\r\nclear,8\r\n'), 'wrong.csv')
    expect([bad.status, bad.body.error.code]).toEqual([422, 'sheet_columns'])
    const failed = (await admin.get('/api/imports/runs/current')).body.run as Run
    expect([failed.state, failed.problem?.code]).toEqual(['failed', 'sheet_columns'])
    // A check left running by a process that died: its heartbeat stopped two minutes ago.
    const me = await h.user('t-admin', ['admin'])
    const id = '00000000-0000-4000-8000-0000000dead1'
    await h.ds.query(
      `INSERT INTO data_import_runs (id, user_id, kind, step, file_name, checksum, state, running_key, rows_total, heartbeat_at)
        VALUES (?, ?, 'opening_stock', 'preview', 'lost.csv', ?, 'running', ?, 10, CURRENT_TIMESTAMP(3) - INTERVAL 2 MINUTE)`,
      [id, me.id, '0'.repeat(64), `${me.id}:opening_stock:${'0'.repeat(64)}`],
    )
    const lost = (await admin.get('/api/imports/runs/current')).body.run as Run
    expect([lost.id, lost.state, lost.problem?.code]).toEqual([id, 'failed', 'import_run_lost'])
    // Other roles neither see nor follow runs.
    for (const role of ['counter', 'buyer', 'warehouse', 'viewer'] as const) expect((await (await h.as(role)).get('/api/imports/runs/current')).status, role).toBe(403)
  }, 300_000)
})
