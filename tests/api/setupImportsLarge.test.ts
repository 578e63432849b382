// A large file of one of the simple-record imports (bins) goes through preview and commit as a small one does,
// against the real database: it is read in the parse child (past the in-process CSV size), checked in chunks of
// CHECK_CHUNK_ROWS rows and written in chunks in one transaction. The problems that span chunks are still found
// on their rows: a bin named twice far apart in the file, and a bin already held named in a later chunk.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { IN_PROCESS_CSV_BYTES } from '../../server/services/imports/spreadsheetParser.js'
import { CHECK_CHUNK_ROWS } from '../../server/services/imports/recordsImport.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, tagOf } from '../support/fixtureRows.js'

let h: ApiHarness
const tag = tagOf()
const WH = `LB${tag}`
const HEAD = 'Warehouse,Bin,Kind,Active'
const ROWS = 5_000

beforeAll(async () => {
  h = await startApiHarness()
  const res = await post('warehouses', 'commit', ['Code,Name', `${WH},Brightcourse overflow yard ${tag}`])
  expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200)
})
afterAll(() => h?.close())

const post = async (kind: string, step: 'preview' | 'commit', lines: string[]) =>
  (await h.as('admin')).post(`/api/imports/${kind}/${step}`).set(CSRF).attach('file', Buffer.from(lines.join('\n') + '\n', 'utf8'), `${kind}-${lines.length}.csv`)
const binsOf = () => countRows(h.ds, 'bins b JOIN warehouses w ON w.id = b.warehouse_id', 'w.code = ?', [WH])

/** Storage bins in the default pattern (aisle letters, bay digits, level digits): A-1-1, A-1-2, … */
const binLines = (n: number, aisle = 'A') => Array.from({ length: n }, (_, k) => `${WH},${aisle}-${Math.floor(k / 20) + 1}-${(k % 20) + 1},storage,yes`)

/** What an import's answer says, leaving out what differs with the file's size. */
const shapeOf = (body: { total: number; ready: number; skipped: number; errorRows: number; repeatOf: unknown }, rows: number) =>
  ({ all: body.total === rows, ready: body.ready === rows, skipped: body.skipped, errorRows: body.errorRows, repeatOf: body.repeatOf })

describe('a large bins file', () => {
  it('is big enough to be parsed apart and checked in several chunks', () => {
    expect(Buffer.byteLength([HEAD, ...binLines(ROWS)].join('\n'))).toBeGreaterThan(IN_PROCESS_CSV_BYTES)
    expect(ROWS).toBeGreaterThan(2 * CHECK_CHUNK_ROWS)
  })

  it('finds a repeat and a bin already held across chunks, each on its row, and writes nothing', async () => {
    // common practice: a bin code is one place in its warehouse, so it may be named only once
    const small = await post('bins', 'commit', [HEAD, `${WH},Z-1-1,storage,yes`, `${WH},Z-1-2,storage,yes`])
    expect(small.status, JSON.stringify(small.body).slice(0, 300)).toBe(200)
    const lines = binLines(ROWS)
    // Spreadsheet rows: the header is row 1, so lines[i] is row i + 2.
    lines[3000 - 2] = `${WH},Z-1-2,storage,yes` // held since the small file, in the second chunk
    lines[4502 - 2] = lines[12 - 2] // the bin of row 12 again, in the third chunk
    const preview = await post('bins', 'preview', [HEAD, ...lines])
    expect(preview.status, JSON.stringify(preview.body).slice(0, 300)).toBe(200)
    expect(preview.body).toMatchObject({ total: ROWS, errorRows: 2, ready: ROWS - 2 })
    const found = (preview.body.rows as { row: number; errors: { column: string | null; problem: { code: string; params?: { row?: number } } }[] }[])
      .flatMap((r) => r.errors.map((e) => `${r.row} ${e.column ?? '-'} ${e.problem.code}${e.problem.params?.row ? ` ${e.problem.params.row}` : ''}`))
    expect(found).toEqual(['3000 Bin import_code_exists', '4502 - import_row_repeated 12'])
    const refused = await post('bins', 'commit', [HEAD, ...lines])
    expect(refused.status).toBe(422)
    expect(refused.body.error.code).toBe('import_invalid')
    expect(await binsOf()).toBe(2)
    expect((await (await h.as('admin')).post(`/api/imports/${small.body.record.id}/reverse`).set(CSRF)).status).toBe(200)
  })

  it('goes through preview, commit, a second commit and a reversal as a small file does', async () => {
    const outcome = async (lines: string[]) => {
      const preview = await post('bins', 'preview', [HEAD, ...lines])
      const first = await post('bins', 'commit', [HEAD, ...lines])
      const written = await binsOf()
      const again = await post('bins', 'commit', [HEAD, ...lines])
      const reversed = await (await h.as('admin')).post(`/api/imports/${first.body.record.id}/reverse`).set(CSRF)
      return {
        statuses: [preview.status, first.status, again.status, reversed.status],
        preview: shapeOf(preview.body, lines.length),
        commit: { ...shapeOf(first.body, lines.length), summary: first.body.record.summary, rows: first.body.record.rows === lines.length },
        written: written === lines.length,
        repeated: [first.body.repeated, again.body.repeated, again.body.record.id === first.body.record.id],
        left: await binsOf(),
      }
    }
    const small = await outcome(binLines(3, 'S'))
    const large = await outcome(binLines(ROWS, 'L'))
    expect(small).toEqual({
      statuses: [200, 200, 200, 200],
      preview: { all: true, ready: true, skipped: 0, errorRows: 0, repeatOf: null },
      commit: { all: true, ready: true, skipped: 0, errorRows: 0, repeatOf: null, summary: { bins: 3, warehouses: 1 }, rows: true },
      written: true,
      repeated: [false, true, true],
      left: 0,
    })
    expect(large).toEqual({ ...small, commit: { ...small.commit, summary: { bins: ROWS, warehouses: 1 } } })
  })
})
