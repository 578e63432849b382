// Item import: a happy .xlsx and .csv, and hostile uploads made here in the test (a zip bomb, an
// archive that lies about its sizes, renamed binaries, 100,000 rows, wrong columns, text in number
// cells). Each gets a clear error, nothing is written, and the server keeps answering.
import { randomBytes } from 'node:crypto'
import ExcelJS from 'exceljs'
import { withCheckDigit } from '../../shared/barcode/checkDigit.js'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { parseInChild } from '../../server/services/imports/spreadsheetParser.js'
import { ITEM_IMPORT_SPEC } from '../../server/services/catalogSheet.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { buildZip } from '../support/zipBuilder.js'

let h: ApiHarness
const arrayBufferOf = (b: Buffer) => b.buffer.slice(b.byteOffset, b.byteOffset + b.byteLength) as ArrayBuffer
beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

const run = Date.now().toString(36).toUpperCase()
const sku = (n: string | number) => `T-IMP-${run}-${n}`
// A fresh GTIN-13 per run (GS1 check digit, General Specifications §7.9.1) and the same with a wrong last digit.
const GTIN13 = withCheckDigit(`96${String(Date.now()).slice(-10)}`)
const WRONG_CHECK = GTIN13.slice(0, -1) + String((Number(GTIN13.at(-1)) + 5) % 10)
const HEADERS = ['SKU', 'Name', 'Family', 'Stock unit', 'Case qty', 'Cost', 'List price', 'GTIN', 'Description']
const itemCount = async () => Number((await h.ds.query("SELECT COUNT(*) AS n FROM items WHERE sku LIKE 'T-IMP-%'"))[0].n)

async function xlsx(rows: unknown[][], headers = HEADERS): Promise<Buffer> {
  const book = new ExcelJS.Workbook()
  const sheet = book.addWorksheet('Items')
  sheet.addRow(headers)
  for (const r of rows) sheet.addRow(r)
  return Buffer.from(await book.xlsx.writeBuffer())
}

async function upload(step: 'preview' | 'commit', file: Buffer, name: string) {
  return (await h.as('admin')).post(`/api/items/import/${step}`).set(CSRF).attach('file', file, name)
}

async function expectStillServing() {
  expect((await h.agent().get('/api/health')).status).toBe(200)
}

describe('importing items', () => {
  it('offers a blank template whose columns the import reads', async () => {
    const res = await (await h.as('admin')).get('/api/items/import/template.xlsx').buffer(true).parse((r, done) => {
      const chunks: Buffer[] = []
      r.on('data', (c: Buffer) => chunks.push(c))
      r.on('end', () => done(null, Buffer.concat(chunks)))
    })
    expect(res.status).toBe(200)
    const book = new ExcelJS.Workbook()
    await book.xlsx.load(arrayBufferOf(res.body as Buffer))
    const headers = (book.worksheets[0].getRow(1).values as unknown[]).slice(1)
    expect(headers).toEqual(ITEM_IMPORT_SPEC.columns.map((c) => c.header))
    expect(book.getWorksheet('Columns')!.rowCount).toBeGreaterThan(headers.length)
    expect((await (await h.as('buyer')).get('/api/items/import/template.xlsx')).status).toBe(403)
  })

  it('previews without writing, then commits creates and updates in one go', async () => {
    const existing = (await (await h.as('admin')).post('/api/items').set(CSRF).send({
      sku: sku('U'), name: 'Test sealant to update', family: 'sealant', stockUnit: 'tube', caseQty: 12, cost: '6.10', listPrice: '11.95', cartridgeMl: '298.70',
    })).body
    const file = await xlsx([
      [sku('A'), 'Test sealant A', 'sealant', 'tube', 12, 6.1, '11.95', null, 'Imported'],
      [sku('B'), 'Test anchor B', 'anchor', 'each', 25, '2.15', 4.25, GTIN13, null],
      [sku('U'), 'Test sealant, updated', 'sealant', 'tube', 12, '6.1000', '12.45', null, null],
    ])
    const before = await itemCount()
    const preview = await upload('preview', file, 'items.xlsx')
    expect(preview.status, JSON.stringify(preview.body)).toBe(200)
    expect(preview.body).toMatchObject({ total: 3, creates: 2, updates: 1, errorRows: 0 })
    expect(await itemCount()).toBe(before)
    const commit = await upload('commit', file, 'items.xlsx')
    expect(commit.status, JSON.stringify(commit.body)).toBe(200)
    expect(await itemCount()).toBe(before + 2)
    const [b] = await h.ds.query('SELECT gtin, case_qty, cost FROM items WHERE sku = ?', [sku('B')])
    expect(b).toEqual({ gtin: `0${GTIN13}`, case_qty: 25, cost: '2.1500' })
    const [updated] = await h.ds.query('SELECT name, list_price, cartridge_ml, version FROM items WHERE id = ?', [existing.id])
    expect(updated.name).toBe('Test sealant, updated')
    // The import moved the item to its next version: an edit screen opened before it is refused, not written over it.
    expect(Number(updated.version)).toBe(existing.version + 1)
    const stale = await (await h.as('admin')).patch(`/api/items/${existing.id}`).set(CSRF).send({ version: existing.version, name: 'Typed before the import' })
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('changed_meanwhile')
    expect(updated.list_price).toBe('12.45')
    expect(updated.cartridge_ml).toBe('298.70') // a column absent from the file keeps its value
    const [entry] = await h.ds.query("SELECT detail FROM audit_entries WHERE action = 'item.import' ORDER BY id DESC LIMIT 1")
    expect(JSON.parse(entry.detail)).toMatchObject({ created: 2, updated: 1 })
  })

  it('imports a UTF-8 CSV with quoted fields', async () => {
    const csv = `\uFEFFSKU,Name,Family,Stock unit,Cost,List price\r\n${sku('C1')},"Joint tool, ""narrow""",accessory,each,4.20,8.95\r\n`
    const res = await upload('commit', Buffer.from(csv, 'utf8'), 'items.csv')
    expect(res.status).toBe(200)
    const [row] = await h.ds.query('SELECT name FROM items WHERE sku = ?', [sku('C1')])
    expect(row.name).toBe('Joint tool, "narrow"')
  })

  it('reports text in number cells per row, and commits nothing of such a file', async () => {
    const file = await xlsx([
      [sku('OK'), 'A fine row', 'accessory', 'each', 1, '1.00', '2.00', null, null],
      [sku('BAD1'), 'Bad cost', 'accessory', 'each', 'a dozen', 'twelve', '2.00', null, null],
      [sku('BAD2'), 'Bad GTIN', 'accessory', 'each', null, '1.00', '2.00', WRONG_CHECK, null],
    ])
    const before = await itemCount()
    const preview = await upload('preview', file, 'items.xlsx')
    expect(preview.status).toBe(200)
    expect(preview.body.errorRows).toBe(2)
    const bad1 = preview.body.rows.find((r: { row: number }) => r.row === 3)
    expect(bad1.errors.map((e: { column: string }) => e.column).sort()).toEqual(['Case qty', 'Cost'])
    expect(bad1.errors.find((e: { column: string }) => e.column === 'Cost').problem).toEqual({ code: 'cell_number', params: { text: 'twelve' } })
    const bad2 = preview.body.rows.find((r: { row: number }) => r.row === 4)
    expect(bad2.errors[0].problem).toEqual({ code: 'check_digit_wrong', params: { label: 'GTIN-13', expected: Number(GTIN13.at(-1)), actual: Number(WRONG_CHECK.at(-1)) } })
    const commit = await upload('commit', file, 'items.xlsx')
    expect(commit.status).toBe(422)
    expect(commit.body.error.message).toMatch(/2 of 3 rows need attention; nothing was imported/)
    expect(await itemCount()).toBe(before)
  })

  it('reads back its own export and, imported, changes nothing: formula-like text stays as typed, with no visible quote', async () => {
    // source: OWASP "CSV Injection": = + - @ at the start of a cell must stay inert text, written as a string cell
    const evil = sku('EVIL')
    // A standard 6x6 unit: at least 3 7/8 in = 98.425 mm thick (IRC R607.3), so the import's own checks pass.
    await h.ds.query(
      `INSERT INTO items (sku, name, family, stock_unit, cost, list_price, description, pattern, nominal_size, face_width_mm, face_height_mm,
                          depth_mm, thickness_class, shape)
       VALUES (?, '=SUM(1,2) Clear 6x6', 'glass_block', 'each', '6.5000', '11.95', '@cmd -1+1 "quoted"', 'clear', '6x6', 146, 146, 98.43, 'standard', 'square')`,
      [evil],
    )
    const rowsOf = async () => ((await h.ds.query(
      "SELECT * FROM items WHERE family = 'glass_block' AND nominal_size = '6x6' AND active = 1 ORDER BY sku")) as Record<string, unknown>[])
      .map(({ updated_at: _u, ...r }) => r)
    const exported = (await (await h.as('admin')).get('/api/items/export.xlsx?family=glass_block&size=6x6').buffer(true).parse((r, done) => {
      const chunks: Buffer[] = []
      r.on('data', (c: Buffer) => chunks.push(c))
      r.on('end', () => done(null, Buffer.concat(chunks)))
    })).body as Buffer
    const book = new ExcelJS.Workbook()
    await book.xlsx.load(arrayBufferOf(exported))
    const names: unknown[] = []
    book.worksheets[0].getColumn(2).eachCell((c) => names.push(c.value))
    expect(names).toContain('=SUM(1,2) Clear 6x6')
    const before = await rowsOf()
    const commit = await upload('commit', exported, 'export.xlsx')
    expect(commit.status, JSON.stringify(commit.body)).toBe(200)
    expect(commit.body).toMatchObject({ total: before.length, creates: 0, updates: before.length, errorRows: 0 })
    expect(await rowsOf()).toEqual(before)
  })

  it('reads blank yes/no cells as not given and list labels as their values, and reports every problem of every row at once', async () => {
    const headers = ['SKU', 'Name', 'Family', 'Stock unit', 'Case qty', 'Pallet qty', 'Sell by pack', 'Cost', 'List price', 'Pattern', 'Made to order', 'Match lot']
    const file = await xlsx([
      // "Accessory" and "Clear" as the form's lists show them; the yes/no cells left blank.
      [sku('LBL'), 'Block cleaning pads', 'Accessory', 'Each', null, null, null, '3.90', '7.95', 'Clear', null, null],
      // A missing name and a bad cost (field problems) beside a pallet of 10 for cases of 6 and a
      // made-to-order item in lots (problems between fields): all four at once.
      [sku('WAVE'), null, 'accessory', 'each', 6, 10, 'no', 'x', '2.00', null, 'yes', 'yes'],
      // The same SKU again, with its own bad price: both reported.
      [sku('WAVE'), 'Again', 'accessory', 'each', null, null, null, '1.00', 'abc', null, null, null],
    ], headers)
    const preview = await upload('preview', file, 'items.xlsx')
    expect(preview.status).toBe(200)
    const columnsOf = (row: number) => preview.body.rows.find((r: { row: number }) => r.row === row).errors.map((e: { column: string }) => e.column).sort()
    expect(columnsOf(2)).toEqual([])
    expect(columnsOf(3)).toEqual(['Cost', 'Match lot', 'Name', 'Pallet qty'])
    expect(columnsOf(4)).toEqual(['List price', 'SKU'])
    const good = await xlsx([[sku('LBL'), 'Block cleaning pads', 'Accessory', 'Each', null, null, null, '3.90', '7.95', 'Clear', null, null]], headers)
    expect((await upload('commit', good, 'items.xlsx')).status).toBe(200)
    const [row] = await h.ds.query('SELECT family, stock_unit, pattern, sell_by_pack, made_to_order, match_lot FROM items WHERE sku = ?', [sku('LBL')])
    expect(row).toEqual({ family: 'accessory', stock_unit: 'each', pattern: 'clear', sell_by_pack: 0, made_to_order: 0, match_lot: 0 })
  })

  it('refuses wrong columns, naming what is missing and what is unknown', async () => {
    const res = await upload('preview', await xlsx([['X-1', 'Thing']], ['Part number', 'Title']), 'items.xlsx')
    expect(res.status).toBe(422)
    expect(res.body.error.code).toBe('sheet_columns')
    expect(res.body.error.message).toMatch(/missing SKU, Name, Family, Stock unit, Cost, List price; not known: Part number, Title/)
  })
})

describe('hostile uploads', () => {
  it('refuses a zip bomb before unpacking it', async () => {
    const bomb = buildZip([
      { name: '[Content_Types].xml', data: Buffer.from('<Types/>') },
      { name: 'xl/worksheets/sheet1.xml', data: Buffer.alloc(40 * 1024 * 1024, 0x20) },
    ])
    expect(bomb.length).toBeLessThan(200 * 1024)
    const before = await itemCount()
    const res = await upload('commit', bomb, 'items.xlsx')
    expect(res.status).toBe(422)
    expect(res.body.error.code).toBe('archive_packed_too_tight')
    expect(res.body.error.params.ratio).toBeGreaterThan(200) // the limit in DEFAULT_ARCHIVE_LIMITS
    expect(res.body.error.message).toMatch(/packed \d+ to 1/)
    expect(await itemCount()).toBe(before)
    await expectStillServing()
  })

  it('refuses an archive whose entries unpack to more than they declare', async () => {
    const liar = buildZip([
      { name: '[Content_Types].xml', data: Buffer.from('<Types/>') },
      { name: 'xl/worksheets/sheet1.xml', data: Buffer.alloc(8 * 1024 * 1024, 0x20), declaredSize: 1000 },
    ])
    const res = await upload('preview', liar, 'items.xlsx')
    expect(res.status).toBe(415)
    expect(res.body.error.message).toMatch(/does not unpack to its stated size/)
    await expectStillServing()
  })

  it('refuses files whose content is not what the extension says', async () => {
    const binary = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0]), randomBytes(2000)])
    const asCsv = await upload('preview', binary, 'items.csv')
    expect(asCsv.status).toBe(415)
    expect(asCsv.body.error.message).toMatch(/binary data/)
    const asXlsx = await upload('preview', binary, 'items.xlsx')
    expect(asXlsx.status).toBe(415)
    expect(asXlsx.body.error.message).toMatch(/not a zip archive/)
    const plainZip = await upload('preview', buildZip([{ name: 'notes.txt', data: Buffer.from('hello') }]), 'items.xlsx')
    expect(plainZip.status).toBe(415)
    expect(plainZip.body.error.message).toMatch(/Content_Types/)
    const latin1 = await upload('preview', Buffer.from('SKU,Name\nX-1,Caf\xe9\n', 'latin1'), 'items.csv')
    expect(latin1.status).toBe(415)
    expect(latin1.body.error.message).toMatch(/UTF-8/)
    const exe = await upload('preview', Buffer.from('MZ....'), 'items.exe')
    expect(exe.status).toBe(415)
    await expectStillServing()
  })

  it('refuses 100,000 rows without writing any', async () => {
    const lines = ['SKU,Name,Family,Stock unit,Cost,List price']
    for (let i = 0; i < 100_000; i++) lines.push(`${sku(i)},Row ${i},accessory,each,1,2`)
    const file = Buffer.from(lines.join('\n'))
    expect(file.length).toBeLessThan(h.config.uploadMaxBytes)
    const before = await itemCount()
    const res = await upload('commit', file, 'items.csv')
    expect(res.status).toBe(413)
    expect(res.body.error.message).toMatch(/more than 20,000 rows/)
    expect(await itemCount()).toBe(before)
    await expectStillServing()
  })

  it('refuses a file over the upload limit', async () => {
    const res = await upload('preview', Buffer.alloc(h.config.uploadMaxBytes + 10, 0x41), 'items.csv')
    expect(res.status).toBe(413)
    await expectStillServing()
  })

  it('asks for a file when none is sent, and only admins may import', async () => {
    const none = await (await h.as('admin')).post('/api/items/import/preview').set(CSRF).send({})
    expect(none.status).toBe(400)
    expect(none.body.error.fields.file).toBeDefined()
    const counter = await (await h.as('counter')).post('/api/items/import/commit').set(CSRF).attach('file', Buffer.from('SKU\n'), 'items.csv')
    expect(counter.status).toBe(403)
  })

  it('stops a parse that runs past its time limit, in the child process', async () => {
    const file = await xlsx(Array.from({ length: 2000 }, (_, i) => [sku(`T${i}`), 'Row', 'accessory', 'each', 1, '1', '2', null, null]))
    const outcome = await parseInChild({ kind: 'xlsx', data: file, spec: ITEM_IMPORT_SPEC }, { timeoutMs: 5, heapMb: 128 })
    expect(outcome).toMatchObject({ ok: false, code: 'sheet_timeout' })
    const normal = await parseInChild({ kind: 'xlsx', data: file, spec: ITEM_IMPORT_SPEC })
    expect(normal.ok && normal.sheet.rows.length).toBe(2000)
  })
})
