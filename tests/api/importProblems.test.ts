// Every problem of every row of a check, against the real MariaDB: a file with more than a thousand bad rows
// answers a small first page with the check and every other problem through the pages (all, or one column's),
// each with its row, column and code; another person cannot read them; the problems go with their run.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { dataImportPreviewShape, dataImportProblemPageShape } from '../../shared/schemas/answers/dataImports.js'
import { PROBLEM_PAGE, type DataImportProblem } from '../../shared/schemas/dataImports.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { tagOf } from '../support/fixtureRows.js'
import { createOpeningStockTarget } from '../support/stockFixtures.js'

let h: ApiHarness
const tag = tagOf()
const SKU = `PRB-BLK-${tag}`
const WH = `PB${tag}`
const ROWS = 3_000

beforeAll(async () => {
  h = await startApiHarness()
  await createOpeningStockTarget(h.ds, SKU, WH)
})
afterAll(() => h?.close())

// Data row i sits on sheet row i + 2 (the header is row 1; common practice). A third of the rows name a SKU that
// does not exist, a third a negative quantity, a third are good: 2,000 bad rows, one problem each.
const badSku = (i: number) => i % 3 === 0
const badQty = (i: number) => i % 3 === 1
const file = Buffer.from(['SKU,Warehouse,Bin,Lot,Quantity,Unit cost',
  ...Array.from({ length: ROWS }, (_, i) => `${badSku(i) ? `NOPE-${tag}-${i}` : SKU},${WH},A-01-1,L-${i},${badQty(i) ? -4 : 5},3.1000`)].join('\r\n') + '\r\n', 'utf8')
const badRows = Array.from({ length: ROWS }, (_, i) => i).filter((i) => badSku(i) || badQty(i)).map((i) => i + 2)

describe('import problems', () => {
  it('answers every problem of more than a thousand bad rows through the pages, and one column\'s alone', async () => {
    const admin = await h.as('admin')
    const res = await admin.post('/api/imports/opening_stock/preview').set(CSRF).attach('file', file, 'many-bad.csv')
    expect(res.status).toBe(200)
    const preview = dataImportPreviewShape.parse(res.body)
    expect([preview.total, preview.errorRows, preview.problems]).toEqual([ROWS, badRows.length, badRows.length])
    // The answer stays small: the rows of the first page of problems and a sample of good ones, not 2,000 rows.
    const shownBad = preview.rows.filter((r) => r.errors.length)
    expect(shownBad.map((r) => r.row)).toEqual(badRows.slice(0, PROBLEM_PAGE))
    expect(preview.rows.length).toBeLessThanOrEqual(PROBLEM_PAGE + 20)
    expect(JSON.stringify(res.body).length).toBeLessThan(40_000)
    expect(preview.problemRun).toMatch(/^[0-9a-f-]{36}$/)

    const all: DataImportProblem[] = []
    for (let offset = 0; ; offset += PROBLEM_PAGE) {
      const page = await admin.get(`/api/imports/runs/${preview.problemRun}/problems?offset=${offset}`)
      expect(page.status).toBe(200)
      const got = dataImportProblemPageShape.parse(page.body)
      expect(got.total).toBe(badRows.length)
      all.push(...got.problems)
      if (got.problems.length < PROBLEM_PAGE) break
    }
    // Every bad row, in sheet order, once each; its column is where the sheet went wrong.
    expect(all.map((p) => p.row)).toEqual(badRows)
    const skuColumn = all.find((p) => p.row === 2)!.column
    const qtyColumn = all.find((p) => p.row === 3)!.column
    expect(skuColumn).not.toBe(qtyColumn)
    for (const p of all) {
      expect(p.column).toBe(badSku(p.row - 2) ? skuColumn : qtyColumn)
      expect(p.problem.code).toMatch(/^[a-z_]+$/)
    }
    // The columns the answer counts match the pages.
    expect(preview.problemColumns.find((c) => c.column === qtyColumn)?.count).toBe(ROWS / 3)

    // One column's problems alone, paged the same way: the last page of the negative quantities.
    const last = await admin.get(`/api/imports/runs/${preview.problemRun}/problems`).query({ offset: 950, column: qtyColumn ?? '' })
    const lastPage = dataImportProblemPageShape.parse(last.body)
    expect(lastPage.total).toBe(ROWS / 3)
    expect(lastPage.problems.map((p) => p.row)).toEqual(badRows.filter((r) => badQty(r - 2)).slice(950))
  }, 120_000)

  it('keeps one person\'s problems from another, refuses a bad page, and lets them go with their run', async () => {
    const admin = await h.as('admin')
    const small = Buffer.from(`SKU,Warehouse,Bin,Lot,Quantity,Unit cost\r\nNOPE-${tag},${WH},A-01-1,L-1,5,3.1000\r\n`, 'utf8')
    const res = await admin.post('/api/imports/opening_stock/preview').set(CSRF).attach('file', small, 'one-bad.csv')
    const runId = dataImportPreviewShape.parse(res.body).problemRun
    expect(runId).not.toBeNull()
    expect((await admin.get(`/api/imports/runs/${runId}/problems`)).body.total).toBe(1)
    // Only the person who ran the check reads its problems.
    const [mine] = await h.ds.query('SELECT user_id FROM data_import_runs WHERE id = ?', [runId])
    const [other] = await h.ds.query('SELECT id FROM users WHERE id <> ? LIMIT 1', [mine.user_id])
    await h.ds.query('UPDATE data_import_runs SET user_id = ? WHERE id = ?', [other.id, runId])
    expect((await admin.get(`/api/imports/runs/${runId}/problems`)).status).toBe(404)
    await h.ds.query('UPDATE data_import_runs SET user_id = ? WHERE id = ?', [mine.user_id, runId])
    expect((await admin.get(`/api/imports/runs/${runId}/problems?offset=-1`)).status).toBe(400)
    expect((await admin.get('/api/imports/runs/not-a-run/problems')).body.error.code).toBe('import_run_not_found')
    // A run a day old is cleared at the next check, its problems with it.
    await h.ds.query('UPDATE data_import_runs SET started_at = CURRENT_TIMESTAMP(3) - INTERVAL 2 DAY WHERE id = ?', [runId])
    await admin.post('/api/imports/opening_stock/preview').set(CSRF).attach('file', Buffer.from(small.toString('utf8') + `NOPE2-${tag},${WH},A-01-1,L-2,5,3.1000\r\n`), 'two-bad.csv')
    expect(Number((await h.ds.query('SELECT COUNT(*) AS n FROM data_import_problems WHERE run_id = ?', [runId]))[0].n)).toBe(0)
    expect((await admin.get(`/api/imports/runs/${runId}/problems`)).status).toBe(404)
  }, 60_000)
})
