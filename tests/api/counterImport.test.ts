// Feature: a contractor's takeoff uploaded in Lumenyard's own template (POST /api/jobs/:id/takeoffs/import)
// and the blank template (GET /api/takeoffs/import-template). Hostile and wrong files get a clear
// answer and nothing is saved.
import ExcelJS from 'exceljs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type supertest from 'supertest'
import { TAKEOFF_COLUMNS } from '../../shared/counter/takeoffSheetColumns.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { createCounterFixture, createCustomerAndJob, IN, type CounterFixture } from '../support/counterFixtures.js'

let h: ApiHarness
let counter: supertest.Agent
let fx: CounterFixture
let jobId: number

beforeAll(async () => {
  h = await startApiHarness()
  counter = await h.as('counter')
  fx = await createCounterFixture(h.ds)
  ;({ jobId } = await createCustomerAndJob(h.ds, fx.tag))
})
afterAll(() => h?.close())

const takeoffCount = async () => Number((await h.ds.query('SELECT COUNT(*) AS n FROM takeoffs WHERE job_id = ?', [jobId]))[0].n)
const upload = (file: Buffer, filename: string, fields: Record<string, string> = {}) => {
  const req = counter.post(`/api/jobs/${jobId}/takeoffs/import`).set(CSRF)
  for (const [k, v] of Object.entries(fields)) req.field(k, v)
  return req.attach('file', file, filename)
}
const binary = (r: supertest.Test) => r.buffer(true).parse((res, cb) => {
  const chunks: Buffer[] = []
  res.on('data', (c: Buffer) => chunks.push(c))
  res.on('end', () => cb(null, Buffer.concat(chunks)))
})

async function workbook(rows: (string | number | null)[][]): Promise<Buffer> {
  const book = new ExcelJS.Workbook()
  const sheet = book.addWorksheet('Takeoff')
  for (const r of rows) sheet.addRow(r)
  return Buffer.from(await book.xlsx.writeBuffer())
}

const HEADER = ['wall', 'block_sku', 'sizing', 'height', 'courses', 'segment', 'length', 'blocks', 'inside_radius', 'arc_angle', 'turn', 'free_end', 'wet_area', 'item_sku', 'quantity']

describe('the blank template', () => {
  it('has the documented columns on its first sheet and a help sheet', async () => {
    const res = await binary(counter.get('/api/takeoffs/import-template'))
    expect(res.status).toBe(200)
    const book = new ExcelJS.Workbook()
    await book.xlsx.load(res.body as unknown as ExcelJS.Buffer)
    const header = (book.worksheets[0].getRow(1).values as unknown[]).slice(1)
    expect(header).toEqual(TAKEOFF_COLUMNS.map((c) => c.name))
    expect(book.worksheets[0].rowCount).toBe(1)
    expect(book.getWorksheet('Help')!.rowCount).toBeGreaterThan(TAKEOFF_COLUMNS.length)
    const csv = await counter.get('/api/takeoffs/import-template?format=csv')
    expect(csv.text.trim().split(',')).toEqual(TAKEOFF_COLUMNS.map((c) => c.name))
  })
})

describe('a good upload', () => {
  it('turns segment rows into walls and item rows into loose lines, and saves the takeoff', async () => {
    const file = await workbook([
      HEADER,
      ['Shower', fx.blockSku, 'count', null, 12, 'straight', null, 3, null, null, null, 'yes', 'yes', null, null],
      ['Shower', null, null, null, null, 'curved', null, null, '72 in', 90, 'left', null, null, null, null],
      [null, null, null, null, null, null, null, null, null, null, null, null, null, fx.items.sealant.sku, 4],
      ['Window', fx.blockSku, 'opening', "7' 0\"", null, 'straight', '72', null, null, null, null, null, null, null, null],
    ])
    const before = await takeoffCount()
    const res = await upload(file, 'okafor-shower.xlsx', { unit: 'in' })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.name).toBe('okafor-shower')
    const [shower, window] = res.body.input.walls
    expect(shower).toMatchObject({ name: 'Shower', sizing: 'count', courses: 12, freeEnds: { start: false, end: true, top: false }, wetArea: true })
    expect(shower.segments).toEqual([{ kind: 'straight', blocks: 3 }, { kind: 'curved', insideRadiusMm: 72 * IN, arcAngleDeg: 90, direction: 'left' }])
    // Block sizes come from the catalog item: face 7 3/4 in (nominal − 1/4 in, common practice).
    expect(shower.block.faceWidthMm).toBeCloseTo(7.75 * IN, 2)
    // 7' 0" = 84 in and a bare 72 read in inches (NIST SP 811: 1 in = 25.4 mm, 1 ft = 304.8 mm).
    expect(window.heightMm).toBeCloseTo(84 * IN, 9)
    expect(window.segments[0].lengthMm).toBeCloseTo(72 * IN, 9)
    expect(res.body.input.looseLines).toEqual([expect.objectContaining({ sku: fx.items.sealant.sku, quantity: 4, unit: 'tube' })])
    expect(await takeoffCount()).toBe(before + 1)
  })

  it('reads the same rows from a CSV, a bare number in millimetres when the unit says so', async () => {
    const csv = `wall,block_sku,sizing,height,segment,length\r\nHall,${fx.blockSku},opening,2134,straight,1829 mm\r\n`
    const res = await upload(Buffer.from(csv), 'hall.csv', { unit: 'mm', name: 'Hall from CSV' })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.input.walls[0]).toMatchObject({ heightMm: 2134, segments: [{ kind: 'straight', lengthMm: 1829 }] })
  })
})

describe('bad and hostile files: a clear answer, nothing saved', () => {
  it('per-row errors: text in a number cell, an unknown block, a length it cannot read, a missing opening length', async () => {
    const file = await workbook([
      HEADER,
      ['North', fx.blockSku, 'count', null, 'ten', 'straight', null, 4, null, null, null, null, null, null, null],
      ['South', 'NO-SUCH-BLOCK', 'opening', '7 feet-ish', null, 'straight', null, null, null, null, null, null, null, null, null],
      ['East', fx.blockSku, 'opening', '84 in', null, 'straight', null, null, null, null, null, null, null, null, null],
    ])
    const before = await takeoffCount()
    const res = await upload(file, 'bad-rows.xlsx')
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('sheet_rows')
    const fields = res.body.error.fields
    expect(fields['2:courses']).toEqual({ code: 'cell_whole_number', params: { text: 'ten' } })
    expect(fields['3:block_sku']).toEqual({ code: 'block_not_in_catalog', params: { sku: 'NO-SUCH-BLOCK' } })
    expect(fields['3:height']).toEqual({ code: 'length_unreadable', params: { input: '7 feet-ish' } })
    expect(await takeoffCount()).toBe(before)
  })

  it('a schema message lands on its row: the opening length of row 2', async () => {
    const file = await workbook([HEADER, ['East', fx.blockSku, 'opening', '84 in', null, 'straight', null, null, null, null, null, null, null, null, null]])
    const res = await upload(file, 'no-length.xlsx')
    expect(res.status).toBe(400)
    expect(res.body.error.fields['2:length']).toEqual({ code: 'opening_length_needed' })
  })

  it('wrong columns: 422 naming them', async () => {
    const before = await takeoffCount()
    const res = await upload(Buffer.from('wall,colour,segment\r\nA,blue,straight\r\n'), 'other-template.csv')
    expect(res.status).toBe(422)
    expect(res.body.error.message).toMatch(/colour/)
    expect(await takeoffCount()).toBe(before)
  })

  it('50,000 rows: refused as too many rows', async () => {
    const line = `W,${fx.blockSku},count,,10,straight,,4\r\n`
    const csv = 'wall,block_sku,sizing,height,courses,segment,length,blocks\r\n' + line.repeat(50_000)
    const before = await takeoffCount()
    const res = await upload(Buffer.from(csv), 'huge.csv')
    expect(res.status).toBe(413)
    expect(res.body.error.message).toMatch(/more than 2,000 rows/)
    expect(await takeoffCount()).toBe(before)
  })

  it('a non-spreadsheet renamed .xlsx: 415', async () => {
    const png = Buffer.from('89504e470d0a1a0a0000000d49484452', 'hex')
    const before = await takeoffCount()
    const res = await upload(png, 'photo.xlsx')
    expect(res.status).toBe(415)
    expect(res.body.error.message).toMatch(/not an \.xlsx workbook/)
    const text = await upload(Buffer.from('just some notes'), 'notes.txt')
    expect(text.status).toBe(415)
    expect(await takeoffCount()).toBe(before)
  })

  it('no file at all: 400 naming the file field', async () => {
    const res = await counter.post(`/api/jobs/${jobId}/takeoffs/import`).set(CSRF).field('unit', 'in')
    expect(res.status).toBe(400)
    expect(res.body.error.fields.file).toBeTruthy()
  })
})
