// The PO spreadsheets read back with exceljs, every cell checked: numbers stay numbers with number
// formats, dates are dates, and text from users that starts like a formula is a string cell, as typed.
// source: OWASP "CSV Injection" (leading = + - @ tab CR LF must never become a formula)
import ExcelJS from 'exceljs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PoDetail } from '../../shared/schemas/purchasingViews.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { createPurchasingFixture, insertId, TEST_COMPANY, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: ApiHarness
let f: PurchasingFixture
let po: PoDetail
let plain: PoDetail
const EVIL_NAME = '=HYPERLINK("http://attacker.example/x","Open")'
const EVIL_NOTE = '+SUM(1,2) deliver to the back gate'

beforeAll(async () => {
  h = await startApiHarness()
  f = await createPurchasingFixture(h.ds)
  const vendorId = await insertId(h.ds, 'INSERT INTO vendors (code, name, contact_name, email, phone, address, terms) VALUES (?, ?, ?, ?, ?, ?, ?)', [
    `EV${f.tag}`, EVIL_NAME, '@Mallory', 'evil@vendor.example', '-555 0199', '\tTab Street 4', '=1+1',
  ])
  await insertId(h.ds, 'INSERT INTO vendor_items (vendor_id, item_id, vendor_sku, pack_qty, min_order_qty, unit_cost) VALUES (?, ?, ?, 24, 24, ?)', [
    vendorId, f.block.id, '-EV8', '2.1250',
  ])
  const buyer = await h.as('buyer')
  const res = await buyer.post('/api/purchase-orders').set(CSRF).send({
    vendorId, warehouseId: f.warehouse.id, expectedDate: '2031-04-30', notes: EVIL_NOTE,
    lines: [
      { itemId: f.block.id, packsOrdered: 5 },
      { itemId: f.sealant.id, packsOrdered: 3, packQty: 12, unitCost: '6.3333', description: '-Sealant, clear' },
    ],
  })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  po = res.body
  const other = await buyer.post('/api/purchase-orders').set(CSRF).send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.sealant.id, packsOrdered: 2 }] })
  plain = other.body
})
afterAll(() => h?.close())

async function download(path: string): Promise<ExcelJS.Workbook> {
  const res = await (await h.as('buyer')).get(path).buffer(true).parse((r, done) => {
    const chunks: Buffer[] = []
    r.on('data', (c: Buffer) => chunks.push(c))
    r.on('end', () => done(null, Buffer.concat(chunks)))
  })
  expect(res.status).toBe(200)
  expect(res.headers['content-type']).toContain('spreadsheetml')
  const book = new ExcelJS.Workbook()
  await book.xlsx.load(res.body as unknown as ArrayBuffer)
  return book
}

/** Each filled cell by address; a merged range counts once, at its top-left cell. */
function cells(sheet: ExcelJS.Worksheet): Map<string, ExcelJS.CellValue> {
  const out = new Map<string, ExcelJS.CellValue>()
  sheet.eachRow({ includeEmpty: false }, (row) => row.eachCell({ includeEmpty: false }, (cell) => {
    if (cell.isMerged && cell.master.address !== cell.address) return
    out.set(cell.address, cell.value)
  }))
  return out
}

const day = (iso: string) => new Date(`${iso.slice(0, 10)}T00:00:00Z`)

/** The buyer line the sheet prints: the person who drafted the order (test users are made by the harness). */
async function buyerOf(p: PoDetail): Promise<string> {
  const [u] = await h.ds.query('SELECT u.display_name, u.email FROM purchase_orders o JOIN users u ON u.id = o.created_by WHERE o.id = ?', [p.id])
  return [u.display_name, u.email].filter(Boolean).join(', ')
}

/** What the PO sheet must hold, cell by cell (layout: server/services/purchasing/poSpreadsheet.ts). */
async function expectedPoSheet(p: PoDetail, terms: string | null): Promise<Map<string, ExcelJS.CellValue>> {
  const m = new Map<string, ExcelJS.CellValue>([
    ['A1', `Purchase order ${p.number}`],
    // Who orders (the company profile), never the internal status.
    ['A2', [TEST_COMPANY.legalName, TEST_COMPANY.phone, TEST_COMPANY.email].join(' · ')],
    ['D3', 'Vendor'],
    ['G3', 'Bill to'], ['G4', `${TEST_COMPANY.legalName}\n${TEST_COMPANY.billTo}`],
    ['G6', 'Ship to'], ['G7', `${TEST_COMPANY.legalName}, Yard ${f.warehouse.code}\n12 Kiln Road, Brightwater`],
  ])
  const facts: [string, ExcelJS.CellValue][] = [
    ['Order date', day(p.createdAt)], ['Wanted by', p.expectedDate ? day(p.expectedDate) : null], ['Currency', 'USD'], ['Terms', terms],
    ['Buyer', await buyerOf(p)], ['Reply to', TEST_COMPANY.replyTo],
  ]
  facts.filter(([, v]) => v !== null).forEach(([label, v], i) => {
    m.set(`A${3 + i}`, label)
    m.set(`C${3 + i}`, v)
  })
  ;['Line', 'Our SKU', 'Vendor SKU', 'Description', 'Packs', 'Pack size', 'Quantity', 'Unit', 'Unit cost', 'Line total'].forEach((t, i) =>
    m.set(`${String.fromCharCode(65 + i)}12`, t))
  return m
}

describe('one PO as a printable sheet', () => {
  it('holds exactly the header, vendor, ship-to, lines and total, with injection attempts as plain string cells', async () => {
    const book = await download(`/api/purchase-orders/${po.id}/export`)
    expect(book.worksheets.map((s) => s.name)).toEqual([po.number])
    const sheet = book.worksheets[0]
    const want = await expectedPoSheet(po, '=1+1')
    want.set('D4', EVIL_NAME)
    want.set('D5', '@Mallory')
    want.set('D6', 'evil@vendor.example')
    want.set('D7', '-555 0199')
    want.set('D8', '\tTab Street 4')
    // 5 packs × 24 = 120 × 2.1250 = 255.00; 3 × 12 = 36 × 6.3333 = 227.9988 → 228.00; total 483.00 (hand computed)
    const rows: ExcelJS.CellValue[][] = [
      [1, f.block.sku, '-EV8', `Item ${f.block.sku}`, 5, 24, 120, 'each', 2.125, 255],
      [2, f.sealant.sku, null, '-Sealant, clear', 3, 12, 36, 'tube', 6.3333, 228],
    ]
    rows.forEach((r, i) => r.forEach((v, c) => { if (v !== null) want.set(`${String.fromCharCode(65 + c)}${13 + i}`, v) }))
    want.set('I16', 'Total')
    want.set('J16', 483)
    want.set('A18', 'Notes')
    want.set('C18', EVIL_NOTE)
    expect(Object.fromEntries(cells(sheet))).toEqual(Object.fromEntries(want))

    // numbers are numbers with number formats, not text
    for (const ref of ['E13', 'F13', 'G13', 'I13', 'J13', 'J16']) expect(typeof sheet.getCell(ref).value, ref).toBe('number')
    expect(sheet.getCell('I13').numFmt).toBe('#,##0.0000')
    expect(sheet.getCell('J13').numFmt).toBe('#,##0.00')
    expect(sheet.getCell('G13').numFmt).toBe('#,##0')
    expect(sheet.getCell('C3').numFmt).toBe('yyyy-mm-dd')
    // text that starts like a formula is a string cell, never a formula, and never carries a visible quote
    sheet.eachRow((row) => row.eachCell((cell) => {
      expect(cell.type, cell.address).not.toBe(ExcelJS.ValueType.Formula)
      if (typeof cell.value === 'string') expect(cell.value.startsWith("'"), `${cell.address}: ${cell.value}`).toBe(false)
    }))
    // the vendor's phone '-555 0199' is text as typed: no visible apostrophe, no number, no formula
    expect(sheet.getCell('D7').value).toBe('-555 0199')
    for (const ref of ['D4', 'D5', 'D7', 'C6', 'C18', 'C13', 'D14']) expect(sheet.getCell(ref).type, ref).toBe(ExcelJS.ValueType.String)
  })

  it('is set up for printing: frozen below the table header, columns as wide as their text, one page wide', async () => {
    const sheet = (await download(`/api/purchase-orders/${plain.id}/export`)).worksheets[0]
    expect(sheet.views[0]).toMatchObject({ state: 'frozen', ySplit: 12 })
    // every header and value fits its column (labels and values in the header block span merged cells)
    for (let c = 1; c <= 10; c++) {
      const header = String(sheet.getCell(12, c).value)
      expect(sheet.getColumn(c).width!, header).toBeGreaterThanOrEqual(header.length)
      expect(sheet.getColumn(c).width!, header).toBeGreaterThanOrEqual(String(sheet.getCell(13, c).value ?? '').length)
    }
    const merges = (sheet.model as unknown as { merges: string[] }).merges
    const span = (ref: string) => {
      const range = merges.find((m) => m.startsWith(`${ref}:`)) ?? `${ref}:${ref}`
      const [from, to] = range.split(':').map((a) => Number(sheet.getCell(a).col))
      let width = 0
      for (let c = from; c <= to; c++) width += sheet.getColumn(c).width!
      return width
    }
    for (const ref of ['A3', 'A4', 'A5', 'A6', 'A7', 'A8', 'D3', 'D4', 'D6', 'D8', 'G3', 'G6']) {
      expect(span(ref), `${ref} ${sheet.getCell(ref).value}`).toBeGreaterThanOrEqual(String(sheet.getCell(ref).value).length)
    }
    expect(sheet.pageSetup).toMatchObject({ orientation: 'portrait', fitToPage: true, fitToWidth: 1, fitToHeight: 0, printTitlesRow: '12:12' })
    expect(sheet.headerFooter.oddHeader).toContain(`Purchase order ${plain.number}`)
    expect(sheet.headerFooter.oddFooter).toContain('Page &P of &N')
    const want = await expectedPoSheet(plain, 'Net 30')
    ;['Vendor VA' + f.tag, 'Mara Quill', `orders-va${f.tag.toLowerCase()}@vendor.example`].forEach((v, i) => want.set(`D${4 + i}`, v))
    want.set('D8', '3 Annealing Way, Corvale')
    // 2 packs × 12 = 24 tubes × 6.2500 = 150.00
    ;[1, f.sealant.sku, `LK-${f.tag}-S`, `Item ${f.sealant.sku}`, 2, 12, 24, 'tube', 6.25, 150].forEach((v, c) => want.set(`${String.fromCharCode(65 + c)}13`, v))
    want.set('I15', 'Total')
    want.set('J15', 150)
    expect(Object.fromEntries(cells(sheet))).toEqual(Object.fromEntries(want))
  })
})

describe('many POs for the buyer', () => {
  it('lists the orders and every line, then each order on its own sheet', async () => {
    const book = await download(`/api/purchase-orders/export?ids=${po.id},${plain.id}`)
    expect(book.worksheets.map((s) => s.name)).toEqual(['Orders', 'Lines', po.number, plain.number])
    const orders = book.getWorksheet('Orders')!
    expect(orders.views[0]).toMatchObject({ state: 'frozen', ySplit: 1 })
    const header = ['Number', 'Status', 'Vendor', 'Ship to', 'Job', 'Order date', 'Expected', 'Currency', 'Lines', 'Total']
    const want = new Map<string, ExcelJS.CellValue>()
    const put = (row: number, values: ExcelJS.CellValue[]) => values.forEach((v, c) => { if (v !== null) want.set(`${String.fromCharCode(65 + c)}${row}`, v) })
    put(1, header)
    put(2, [po.number, 'draft', EVIL_NAME, `Yard ${f.warehouse.code}`, null, day(po.createdAt), day('2031-04-30'), 'USD', 2, 483])
    put(3, [plain.number, 'draft', `Vendor VA${f.tag}`, `Yard ${f.warehouse.code}`, null, day(plain.createdAt), day(plain.expectedDate!), 'USD', 1, 150])
    expect(Object.fromEntries(cells(orders))).toEqual(Object.fromEntries(want))
    expect(typeof orders.getCell('J2').value).toBe('number')

    const lines = book.getWorksheet('Lines')!
    const lw = new Map<string, ExcelJS.CellValue>()
    const putL = (row: number, values: ExcelJS.CellValue[]) => values.forEach((v, c) => { if (v !== null) lw.set(`${String.fromCharCode(65 + c)}${row}`, v) })
    putL(1, ['Number', 'Vendor', 'Line', 'Our SKU', 'Vendor SKU', 'Description', 'Packs', 'Pack size', 'Quantity', 'Received', 'Unit', 'Unit cost', 'Line total'])
    putL(2, [po.number, EVIL_NAME, 1, f.block.sku, '-EV8', `Item ${f.block.sku}`, 5, 24, 120, 0, 'each', 2.125, 255])
    putL(3, [po.number, EVIL_NAME, 2, f.sealant.sku, null, '-Sealant, clear', 3, 12, 36, 0, 'tube', 6.3333, 228])
    putL(4, [plain.number, `Vendor VA${f.tag}`, 1, f.sealant.sku, `LK-${f.tag}-S`, `Item ${f.sealant.sku}`, 2, 12, 24, 0, 'tube', 6.25, 150])
    expect(Object.fromEntries(cells(lines))).toEqual(Object.fromEntries(lw))
  })

  it('answers 400 for a bad id list and 404 for an unknown order', async () => {
    const buyer = await h.as('buyer')
    expect((await buyer.get('/api/purchase-orders/export?ids=abc')).status).toBe(400)
    expect((await buyer.get('/api/purchase-orders/export')).status).toBe(400)
    expect((await buyer.get('/api/purchase-orders/export?ids=999999999')).status).toBe(404)
  })
})
