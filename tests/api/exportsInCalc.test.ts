// Every spreadsheet export opened by a spreadsheet program nobody on the project wrote: LibreOffice Calc, headless
// (Debian's libreoffice-calc-nogui), converts each workbook to PDF (as it would print it) and each sheet to CSV (as
// it reads the cells). Every file must convert (it opens without repair), print one page wide with its name in the
// page header, keep standard documents within their page counts (a 30-line purchase order on one page, a 20-line
// bill of materials within two), and read back with numbers as numbers, dates as dates and text exactly as typed.
import { spawnSync } from 'node:child_process'
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { readCsv } from '../../server/services/imports/csvText.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { createCustomerAndJob } from '../support/counterFixtures.js'
import { download } from '../support/downloads.js'
import { createPurchasingFixture } from '../support/purchasingFixtures.js'

let h: ApiHarness
const dir = mkdtempSync(path.join(tmpdir(), 'lumenyard-calc-'))
const FORMULA_LIKE = '=HYPERLINK("http://example.invalid","open")'
const NOTE = 'Deliver to the side gate on Kiln Road before 10 am; call the yard office first. ' +
  'Pallets must be shrink-wrapped, blocks boxed in their cartons, no loose blocks on the deck. '.repeat(2)

/** name → the exported file on disk */
const files: Record<string, string> = {}
/** The purchase order's lines as ordered: SKU and description. */
let poLines: { sku: string; description: string }[] = []

function soffice(args: string[]): void {
  // A profile of its own, so the conversion never waits for another LibreOffice or asks first-start questions.
  const profile = `file://${path.join(dir, 'profile')}`
  const run = spawnSync('soffice', [`-env:UserInstallation=${profile}`, '--headless', '--norestore', ...args], { cwd: dir, encoding: 'utf8', timeout: 240_000 })
  if (run.status !== 0) throw new Error(`soffice failed (${run.status}): ${run.stderr}`)
}

/** Text of each PDF page, by pdftotext (poppler-utils); pages are separated by form feeds. */
function pdfPages(file: string): string[] {
  const run = spawnSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' })
  if (run.status !== 0) throw new Error(`pdftotext failed: ${run.stderr}`)
  return run.stdout.split('\f').filter((p) => p.trim() !== '')
}

function csvOf(name: string, sheet: string): string[][] {
  const file = path.join(dir, 'csv', `${name}-${sheet}.csv`)
  expect(existsSync(file), `${name}-${sheet}.csv`).toBe(true)
  const read = readCsv(readFileSync(file, 'utf8'), { delimiter: ',', maxRecords: 50_000, maxFields: 100 })
  if (!read.ok) throw new Error(`${file}: ${read.message}`)
  return read.records
}

const column = (rows: string[][], header: string) => {
  const at = rows[0].indexOf(header)
  expect(at, `column ${header}`).toBeGreaterThanOrEqual(0)
  return rows.slice(1).map((r) => r[at]).filter((v) => v !== undefined && v !== '')
}
const escaped = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
const NUMBER = /^-?\d+(\.\d+)?$/
const DAY = /^\d{4}-\d{2}-\d{2}$/
const DAY_TIME = /^\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2}$/

beforeAll(async () => {
  h = await startApiHarness()
  const admin = await h.as('admin')
  const buyer = await h.as('buyer')
  const save = async (name: string, url: string, agent = admin) => {
    const res = await download(agent, url)
    expect(res.status, `${url}: ${res.status}`).toBe(200)
    files[name] = path.join(dir, `${name}.xlsx`)
    writeFileSync(files[name], res.body as Buffer)
  }

  // A purchase order of 30 lines of the demo catalog, with a long note and a formula-looking vendor name.
  const f = await createPurchasingFixture(h.ds)
  await h.ds.query('UPDATE vendors SET name = ? WHERE id = ?', [FORMULA_LIKE, f.vendorA])
  const stocked: { id: number }[] = await h.ds.query(`SELECT id FROM items WHERE sku LIKE 'GB-%' AND made_to_order = 0 ORDER BY sku LIMIT 30`)
  expect(stocked).toHaveLength(30)
  const po = await buyer.post('/api/purchase-orders').set(CSRF).send({
    vendorId: f.vendorA, warehouseId: f.warehouse.id, expectedDate: '2031-05-15', notes: NOTE,
    lines: stocked.map((s, i) => ({ itemId: s.id, packsOrdered: 1 + (i % 4), packQty: 8, unitCost: '3.1250' })),
  })
  expect(po.status, JSON.stringify(po.body)).toBe(201)
  poLines = po.body.lines
  await save('po', `/api/purchase-orders/${po.body.id}/export`, buyer)
  await save('pos', `/api/purchase-orders/export?ids=${po.body.id}`, buyer)

  // A bill of materials of 20 lines: loose lines of demo supplies.
  const job = await createCustomerAndJob(h.ds, `X${f.tag}`)
  const supplies: { sku: string; name: string; stock_unit: string }[] = await h.ds.query(
    `SELECT sku, name, stock_unit FROM items WHERE made_to_order = 0 AND sku NOT LIKE 'GB-%' AND active = 1 ORDER BY sku LIMIT 20`)
  expect(supplies).toHaveLength(20)
  const takeoff = await admin.post(`/api/jobs/${job.jobId}/takeoffs`).set(CSRF).send({
    name: 'Twenty supplies', input: { walls: [], looseLines: supplies.map((s, i) => ({ sku: s.sku, name: s.name, quantity: 2 + i, unit: s.stock_unit })) },
  })
  expect(takeoff.status, JSON.stringify(takeoff.body)).toBe(201)
  const bill = await admin.post(`/api/jobs/${job.jobId}/boms`).set(CSRF).send({ takeoffId: takeoff.body.id })
  expect(bill.status, JSON.stringify(bill.body)).toBe(201)
  expect(bill.body.lines).toHaveLength(20)
  await save('bill', `/api/boms/${bill.body.id}/export?tz=America/Chicago`)

  // The catalog, a week of stock movements and the blank templates.
  await save('items', '/api/items/export.xlsx')
  const weekAgo = new Date(Date.now() - 7 * 86_400_000).toISOString().slice(0, 10)
  await save('moves', `/api/stock/ledger/export?from=${weekAgo}&tz=America/Chicago`)
  await save('item-template', '/api/items/import/template.xlsx')
  await save('takeoff-template', '/api/takeoffs/import-template')
  await save('price-template', '/api/vendors/price-list/template', buyer)

  // One call per format: every workbook to PDF, then every sheet of every workbook to CSV (raw values, UTF-8).
  // source: LibreOffice help, "CSV Filter Options" (tokens: separator 44, quote 34, charset 76 = UTF-8, first line 1,
  // cell formats, language, quoted as text, detect numbers, save as shown = false, formulas, trim, sheet -1 = all)
  const all = Object.values(files).map((f) => path.basename(f))
  soffice(['--convert-to', 'pdf', '--outdir', path.join(dir, 'pdf'), ...all])
  soffice(['--convert-to', 'csv:Text - txt - csv (StarCalc):44,34,76,1,,0,false,true,false,false,false,-1', '--outdir', path.join(dir, 'csv'), ...all])
}, 600_000)
afterAll(async () => {
  if (!process.env.KEEP_CALC) rmSync(dir, { recursive: true, force: true })
  await h?.close()
})

describe('every export in a spreadsheet program', () => {
  it('opens and converts: a PDF for each workbook, a CSV for each sheet', () => {
    for (const name of Object.keys(files)) expect(existsSync(path.join(dir, 'pdf', `${name}.pdf`)), `${name}.pdf`).toBe(true)
    const csvs = readdirSync(path.join(dir, 'csv'))
    for (const name of Object.keys(files)) expect(csvs.some((c) => c.startsWith(`${name}-`)), `${name} CSV`).toBe(true)
  })

  it('prints one page wide, with the document named in the page header', () => {
    const firstAndLast: Record<string, [string, string, string]> = {
      items: ['Items', 'SKU', 'Available'],
      moves: ['Stock movements', 'When', 'Move id'],
      po: ['Purchase order', 'Line', 'Line total'],
      bill: ['Bill of materials', 'SKU', 'Walls'],
    }
    for (const [name, [title, first, last]] of Object.entries(firstAndLast)) {
      const [page1] = pdfPages(path.join(dir, 'pdf', `${name}.pdf`))
      expect(page1.split('\n').slice(0, 3).join(' '), `${name} page header`).toContain(title)
      expect(page1, `${name}: first column`).toContain(first)
      expect(page1, `${name}: last column on the same page`).toContain(last)
    }
  })

  it('keeps a 30-line purchase order on one page and a 20-line bill of materials within two', () => {
    expect(pdfPages(path.join(dir, 'pdf', 'po.pdf'))).toHaveLength(1)
    const billPages = pdfPages(path.join(dir, 'pdf', 'bill.pdf')).filter((p) => p.split('\n').slice(0, 3).join(' ').includes('Bill of materials:'))
    expect(billPages.length).toBeGreaterThanOrEqual(1)
    expect(billPages.length).toBeLessThanOrEqual(2)
    // the PO's labels and note print whole
    const po = pdfPages(path.join(dir, 'pdf', 'po.pdf'))[0].replace(/\s+/g, ' ')
    for (const label of ['Order date', 'Wanted by', 'Currency', 'Terms', 'Ship to']) expect(po).toContain(label)
    expect(po).toContain('no loose blocks on the deck.')
    // Each line's description starts on its own row, beside its SKU: a wrapped description in a row that did not
    // grow would spill over the next row and push its text aside.
    const rows = pdfPages(path.join(dir, 'pdf', 'po.pdf'))[0].split('\n')
    expect(poLines).toHaveLength(30)
    for (const l of poLines) {
      const row = rows.find((r) => r.includes(` ${l.sku} `))
      expect(row, l.sku).toMatch(new RegExp(`${escaped(l.sku)}\\s+${escaped(l.description.slice(0, 16))}`))
    }
  })

  it('reads numbers as numbers, dates as dates and text as typed, never behind a visible apostrophe', () => {
    const items = csvOf('items', 'Items')
    for (const header of ['Case qty', 'Cost', 'List price', 'On hand', 'Available']) {
      for (const v of column(items, header)) expect(v, header).toMatch(NUMBER)
    }
    const moves = csvOf('moves', 'Stock movements')
    expect(moves.length).toBeGreaterThan(1)
    for (const v of column(moves, 'When')) expect(v).toMatch(DAY_TIME)
    for (const v of column(moves, 'Quantity')) expect(v).toMatch(NUMBER)
    // documents by their numbers, never by a table name and id
    for (const v of column(moves, 'Document')) expect(v).not.toMatch(/^[a-z]+_[a-z_]+ \d+$/)
    const filters = csvOf('moves', 'Filters')
    expect(filters.find((r) => r[0] === 'Exported')?.[1]).toMatch(DAY_TIME)
    const bill = csvOf('bill', 'Bill of materials')
    for (const v of column(bill, 'Quantity')) expect(v).toMatch(NUMBER)
    expect(csvOf('bill', 'Job').find((r) => r[0] === 'Saved')?.[1]).toMatch(DAY_TIME)
    const po = csvOf('po', readdirSync(path.join(dir, 'csv')).find((c) => c.startsWith('po-'))!.slice(3, -4))
    const orderDate = po.find((r) => r[0] === 'Order date')!
    expect(orderDate.find((v, i) => i > 0 && v !== '')).toMatch(DAY)
    // the formula-looking vendor name is text, exactly as typed (a formula would have been computed)
    expect(po.flat()).toContain(FORMULA_LIKE)
    expect(csvOf('pos', 'Orders').flat()).toContain(FORMULA_LIKE)
    for (const csv of readdirSync(path.join(dir, 'csv'))) {
      const text = readFileSync(path.join(dir, 'csv', csv), 'utf8')
      const records = readCsv(text, { delimiter: ',', maxRecords: 50_000, maxFields: 100 })
      if (!records.ok) throw new Error(csv)
      for (const cell of records.records.flat()) expect(cell.startsWith("'"), `${csv}: ${cell}`).toBe(false)
    }
  })
})
