// Purchase orders as workbooks: one printable sheet per PO (header, vendor, ship-to, lines, total),
// and for the buyer a multi-PO book (orders, all lines, then each PO's sheet). Quantities and money
// stay numbers with number formats; every text that came from a person goes through spreadsheetSafety.
import ExcelJS from 'exceljs'
import type { PoDetail } from '../../../shared/schemas/purchasingViews.js'
import { inertCell, inertText } from '../spreadsheetSafety.js'

/** The row of the line table's header on a PO sheet; the sheet is frozen below it. */
export const PO_TABLE_HEADER_ROW = 10

const HEADER_FILL: ExcelJS.Fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFE5F4F3' } }
const THIN: ExcelJS.Border = { style: 'thin', color: { argb: 'FF9FB8BC' } }
const DAY = 'yyyy-mm-dd'
const QTY = '#,##0'
const COST = '#,##0.0000'
const MONEY = '#,##0.00'

// Money reaches the sheet as a number only here: spreadsheet cells hold binary doubles, and a
// two- or four-place amount of this size converts exactly enough for display and sums.
const amount = (text: string | undefined) => (text === undefined ? null : Number(text))
const day = (iso: string | null) => (iso ? new Date(`${iso.slice(0, 10)}T00:00:00Z`) : null)

const PO_COLUMNS: { header: string; width: number; numFmt?: string }[] = [
  { header: 'Line', width: 6 },
  { header: 'Our SKU', width: 16 },
  { header: 'Vendor SKU', width: 16 },
  { header: 'Description', width: 50 },
  { header: 'Packs', width: 8, numFmt: QTY },
  { header: 'Pack size', width: 10, numFmt: QTY },
  { header: 'Quantity', width: 11, numFmt: QTY },
  { header: 'Unit', width: 8 },
  { header: 'Unit cost', width: 12, numFmt: COST },
  { header: 'Line total', width: 14, numFmt: MONEY },
]

function put(sheet: ExcelJS.Worksheet, ref: string, value: ExcelJS.CellValue, style: Partial<ExcelJS.Style> = {}) {
  if (value === null || value === undefined || value === '') return
  const cell = sheet.getCell(ref)
  cell.value = value
  Object.assign(cell, style)
}

function headerBlock(sheet: ExcelJS.Worksheet, po: PoDetail) {
  put(sheet, 'A1', `Purchase order ${po.number}`, { font: { bold: true, size: 16 } })
  const label = { font: { bold: true } }
  const facts: [string, ExcelJS.CellValue, string?][] = [
    ['Order date', day(po.createdAt), DAY],
    ['Expected', day(po.expectedDate), DAY],
    ['Status', po.status.replace('_', ' ')],
    ['Currency', po.currency],
    ['Terms', inertCell(po.vendor.terms)],
  ]
  facts.forEach(([name, value, numFmt], i) => {
    put(sheet, `A${3 + i}`, name, label)
    put(sheet, `B${3 + i}`, value, numFmt ? { numFmt, alignment: { horizontal: 'left' } } : {})
  })
  if (po.job) {
    put(sheet, 'A8', 'Job', label)
    put(sheet, 'B8', inertText(po.job.dueDate ? `${po.job.name} (due ${po.job.dueDate})` : po.job.name))
  }
  put(sheet, 'D3', 'Vendor', label)
  const v = po.vendor
  ;[v.name, v.contactName, v.email, v.phone, v.address].forEach((text, i) => put(sheet, `D${4 + i}`, inertCell(text)))
  put(sheet, 'G3', 'Ship to', label)
  put(sheet, 'G4', inertText(po.warehouse.name))
  put(sheet, 'G5', inertCell(po.warehouse.address))
}

function lineTable(sheet: ExcelJS.Worksheet, po: PoDetail): number {
  const head = sheet.getRow(PO_TABLE_HEADER_ROW)
  PO_COLUMNS.forEach((c, i) => {
    const cell = head.getCell(i + 1)
    cell.value = c.header
    cell.font = { bold: true }
    cell.fill = HEADER_FILL
    cell.border = { bottom: THIN }
    cell.alignment = { horizontal: c.numFmt ? 'right' : 'left' }
  })
  po.lines.forEach((l, i) => {
    const row = sheet.getRow(PO_TABLE_HEADER_ROW + 1 + i)
    const values: ExcelJS.CellValue[] = [
      l.lineNo, inertText(l.sku), inertCell(l.vendorSku), inertText(l.description), l.packsOrdered, l.packQty, l.qtyOrdered,
      inertText(l.stockUnit), amount(l.unitCost), amount(l.lineTotal),
    ]
    values.forEach((value, c) => {
      if (value === null) return
      const cell = row.getCell(c + 1)
      cell.value = value
      if (PO_COLUMNS[c].numFmt) cell.numFmt = PO_COLUMNS[c].numFmt!
    })
    row.getCell(4).alignment = { wrapText: true, vertical: 'top' }
  })
  return PO_TABLE_HEADER_ROW + po.lines.length
}

/** Adds one PO's printable sheet to a workbook. */
export function addPoSheet(book: ExcelJS.Workbook, po: PoDetail, name = po.number): ExcelJS.Worksheet {
  const sheet = book.addWorksheet(name, { properties: { defaultRowHeight: 16 } })
  PO_COLUMNS.forEach((c, i) => (sheet.getColumn(i + 1).width = c.width))
  headerBlock(sheet, po)
  const lastLine = lineTable(sheet, po)
  const totalRow = lastLine + 2
  if (po.total !== undefined) {
    put(sheet, `I${totalRow}`, 'Total', { font: { bold: true } })
    put(sheet, `J${totalRow}`, amount(po.total), { numFmt: MONEY, font: { bold: true }, border: { top: THIN } })
  }
  if (po.notes) {
    put(sheet, `A${totalRow + 2}`, 'Notes', { font: { bold: true } })
    put(sheet, `B${totalRow + 2}`, inertText(po.notes), { alignment: { wrapText: true, vertical: 'top' } })
  }
  const lastRow = po.notes ? totalRow + 2 : totalRow
  sheet.views = [{ state: 'frozen', ySplit: PO_TABLE_HEADER_ROW, topLeftCell: `A${PO_TABLE_HEADER_ROW + 1}` }]
  sheet.pageSetup = {
    orientation: 'landscape', fitToPage: true, fitToWidth: 1, fitToHeight: 0, horizontalCentered: true,
    margins: { left: 0.5, right: 0.5, top: 0.6, bottom: 0.6, header: 0.3, footer: 0.3 },
    printArea: `A1:J${lastRow}`, printTitlesRow: `${PO_TABLE_HEADER_ROW}:${PO_TABLE_HEADER_ROW}`,
  }
  sheet.headerFooter = { oddFooter: `&L${po.number}&RPage &P of &N` }
  return sheet
}

function newBook(): ExcelJS.Workbook {
  const book = new ExcelJS.Workbook()
  book.creator = 'Lumenyard'
  book.created = new Date()
  return book
}

async function toBuffer(book: ExcelJS.Workbook): Promise<Buffer> {
  return Buffer.from(await book.xlsx.writeBuffer())
}

export async function poWorkbook(po: PoDetail): Promise<Buffer> {
  const book = newBook()
  addPoSheet(book, po)
  return toBuffer(book)
}

function listSheet(book: ExcelJS.Workbook, name: string, columns: { header: string; width: number; numFmt?: string }[], rows: ExcelJS.CellValue[][]) {
  const sheet = book.addWorksheet(name)
  sheet.columns = columns.map((c) => ({ header: c.header, width: c.width, style: c.numFmt ? { numFmt: c.numFmt } : {} }))
  const head = sheet.getRow(1)
  head.font = { bold: true }
  head.fill = HEADER_FILL
  for (const r of rows) sheet.addRow(r)
  sheet.views = [{ state: 'frozen', ySplit: 1 }]
  sheet.autoFilter = { from: { row: 1, column: 1 }, to: { row: 1, column: columns.length } }
  sheet.pageSetup = { orientation: 'landscape', fitToPage: true, fitToWidth: 1, fitToHeight: 0, printTitlesRow: '1:1' }
}

/** The buyer's book: one row per order, every line, then each order's printable sheet. */
export async function multiPoWorkbook(pos: PoDetail[]): Promise<Buffer> {
  const book = newBook()
  listSheet(book, 'Orders', [
    { header: 'Number', width: 16 }, { header: 'Status', width: 16 }, { header: 'Vendor', width: 32 }, { header: 'Ship to', width: 24 },
    { header: 'Job', width: 28 }, { header: 'Order date', width: 12, numFmt: DAY }, { header: 'Expected', width: 12, numFmt: DAY },
    { header: 'Currency', width: 9 }, { header: 'Lines', width: 7, numFmt: QTY }, { header: 'Total', width: 14, numFmt: MONEY },
  ], pos.map((po) => [
    po.number, po.status.replace('_', ' '), inertText(po.vendor.name), inertText(po.warehouse.name), inertCell(po.job?.name),
    day(po.createdAt), day(po.expectedDate), po.currency, po.lines.length, amount(po.total),
  ]))
  listSheet(book, 'Lines', [
    { header: 'Number', width: 16 }, { header: 'Vendor', width: 28 }, { header: 'Line', width: 6 }, { header: 'Our SKU', width: 16 },
    { header: 'Vendor SKU', width: 16 }, { header: 'Description', width: 44 }, { header: 'Packs', width: 8, numFmt: QTY },
    { header: 'Pack size', width: 10, numFmt: QTY }, { header: 'Quantity', width: 10, numFmt: QTY }, { header: 'Received', width: 10, numFmt: QTY },
    { header: 'Unit', width: 8 }, { header: 'Unit cost', width: 12, numFmt: COST }, { header: 'Line total', width: 14, numFmt: MONEY },
  ], pos.flatMap((po) => po.lines.map((l) => [
    po.number, inertText(po.vendor.name), l.lineNo, inertText(l.sku), inertCell(l.vendorSku), inertText(l.description), l.packsOrdered,
    l.packQty, l.qtyOrdered, l.qtyReceived, inertText(l.stockUnit), amount(l.unitCost), amount(l.lineTotal),
  ])))
  for (const po of pos) addPoSheet(book, po)
  return toBuffer(book)
}
