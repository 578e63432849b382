// Purchase orders as workbooks: one printable sheet per PO (header, vendor, ship-to, lines, total, notes),
// and for the buyer a multi-PO book (orders, all lines, then each PO's sheet). Cells, widths and the print
// setup come from the one writer (exports/xlsxWriter.ts): numbers stay numbers, dates are dates, text is
// written as string cells, and labels, addresses and notes sit in cells wide enough not to be cut.
import type ExcelJS from 'exceljs'
import type { PoDetail } from '../../../shared/schemas/purchasingViews.js'
import {
  alignmentOf, buildXlsx, columnWidths, LINE_POINTS, newWorkbook, printOptions, putCell, rowHeightFor, sheet, THIN_RULE, workbookBytes,
  wrappedHeight, wrappedLines, type Book, type CellInput, type CellKind, type SheetColumn,
} from '../exports/xlsxWriter.js'
import { visibleColumns } from '../costVisibility.js'
import { buyerLine, type PoPaper, type PoPaperLine } from './poDocument.js'

/** The row of the line table's header on a PO sheet; the sheet is frozen below it and repeats it on every page. */
export const PO_TABLE_HEADER_ROW = 12

const HEADER_FILL: ExcelJS.Fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFE5F4F3' } }

// Money reaches the sheet as a number only here: spreadsheet cells hold binary doubles, and a
// two- or four-place amount of this size converts exactly enough for display and sums.
const amount = (text: string | undefined) => (text === undefined ? null : Number(text))

const SPEC_HEADER = 'Specification'
const PO_COLUMNS: SheetColumn<PoPaperLine>[] = [
  { header: 'Line', kind: 'integer', value: (l) => l.lineNo },
  { header: 'Our SKU', kind: 'text', width: 18, value: (l) => l.sku },
  { header: 'Vendor SKU', kind: 'text', width: 18, value: (l) => l.vendorSku },
  { header: 'Description', kind: 'text', width: 44, value: (l) => l.description },
  // Made-to-order lines only, whole and wrapped: the vendor builds from it.
  { header: SPEC_HEADER, kind: 'text', width: 50, value: (l) => l.specification },
  { header: 'Packs', kind: 'integer', value: (l) => l.packsOrdered },
  { header: 'Pack size', kind: 'integer', value: (l) => l.packQty },
  { header: 'Quantity', kind: 'integer', value: (l) => l.qtyOrdered },
  { header: 'Unit', kind: 'text', value: (l) => l.stockUnit },
  { header: 'Unit cost', kind: 'cost', value: (l) => amount(l.unitCost), cost: true },
  { header: 'Line total', kind: 'money', value: (l) => amount(l.lineTotal), cost: true },
]

const colLetter = (n: number) => String.fromCharCode(64 + n)

/**
 * Writes `value` across columns from..to of `row` (merged when wider than one), wrapping, and makes the row tall
 * enough for the wrapped text: a spreadsheet does not grow a merged cell's row by itself.
 */
function block(ws: ExcelJS.Worksheet, widths: number[], row: number, from: number, to: number, kind: CellKind, value: CellInput, style: Partial<ExcelJS.Style> = {}) {
  if (value === null || value === undefined || value === '') return
  if (to > from) ws.mergeCells(row, from, row, to)
  const cell = ws.getCell(row, from)
  putCell(cell, kind, value)
  Object.assign(cell, style)
  cell.alignment = { wrapText: true, vertical: 'top', horizontal: 'left', ...(style.alignment ?? {}) }
  if (typeof cell.value !== 'string') return
  const height = rowHeightFor(wrappedLines(cell.value, widths.slice(from - 1, to).reduce((a, b) => a + b, 0)))
  const r = ws.getRow(row)
  if (height > (r.height ?? LINE_POINTS)) r.height = height
}

function headerBlock(ws: ExcelJS.Worksheet, widths: number[], paper: PoPaper) {
  const { po, company } = paper
  const bold = { font: { bold: true } }
  const last = widths.length
  block(ws, widths, 1, 1, last, 'text', `Purchase order ${po.number}`, { font: { bold: true, size: 16 } })
  // Who orders, on the first line under the title.
  block(ws, widths, 2, 1, last, 'text', [company.legalName, company.phone, company.email].filter(Boolean).join(' · '), bold)
  // Facts: the label across Line and Our SKU, the value under Vendor SKU. No internal status: the vendor reads an order.
  const facts: [string, CellKind, CellInput][] = [
    ['Order date', 'date', po.createdAt],
    ['Wanted by', 'date', po.expectedDate],
    ['Currency', 'text', po.currency],
    ['Terms', 'text', po.vendor.terms],
    ['Buyer', 'text', buyerLine(paper)],
    ['Reply to', 'text', paper.replyTo],
    ['Tax number', 'text', company.taxNumber],
  ]
  facts.filter(([, , value]) => value).forEach(([label, kind, value], i) => {
    block(ws, widths, 3 + i, 1, 2, 'text', label, bold)
    block(ws, widths, 3 + i, 3, 3, kind, value)
  })
  // Vendor across Description to Pack size (or Packs); bill-to, ship-to and job across the rest.
  const split = Math.min(6, last - 3)
  block(ws, widths, 3, 4, split, 'text', 'Vendor', bold)
  const v = po.vendor
  ;[v.name, v.contactName, v.email, v.phone, v.address].forEach((text, i) => block(ws, widths, 4 + i, 4, split, 'text', text))
  block(ws, widths, 3, split + 1, last, 'text', 'Bill to', bold)
  block(ws, widths, 4, split + 1, last, 'text', paper.billTo)
  block(ws, widths, 6, split + 1, last, 'text', 'Ship to', bold)
  block(ws, widths, 7, split + 1, last, 'text', paper.shipTo)
  if (po.job) {
    block(ws, widths, 9, split + 1, last, 'text', 'Job', bold)
    block(ws, widths, 10, split + 1, last, 'text', po.job.dueDate ? `${po.job.name} (due ${po.job.dueDate})` : po.job.name)
  }
}

function lineTable(ws: ExcelJS.Worksheet, columns: SheetColumn<PoPaperLine>[], widths: { width: number; wrap: boolean }[], lines: PoPaperLine[]): number {
  const alignments = columns.map((c, i) => alignmentOf(c.kind, widths[i].wrap))
  const head = ws.getRow(PO_TABLE_HEADER_ROW)
  columns.forEach((c, i) => {
    const cell = head.getCell(i + 1)
    cell.value = c.header
    cell.font = { bold: true }
    cell.fill = HEADER_FILL
    cell.border = { bottom: THIN_RULE }
    cell.alignment = { ...alignments[i], vertical: 'bottom', wrapText: false }
  })
  lines.forEach((l, i) => {
    const row = ws.getRow(PO_TABLE_HEADER_ROW + 1 + i)
    columns.forEach((c, col) => {
      const cell = row.getCell(col + 1)
      putCell(cell, c.kind, c.value(l))
      cell.alignment = alignments[col]
    })
    // A wrapped description makes its row taller, or it would run over the next line when printed.
    const height = wrappedHeight(columns.map((_, col) => row.getCell(col + 1).value), widths)
    if (height) row.height = height
  })
  return PO_TABLE_HEADER_ROW + lines.length
}

/** The line columns a PO's sheet shows: prices only for callers who may see costs, the specification only when a line has one. */
function poColumns(lines: PoPaperLine[], costs: boolean): SheetColumn<PoPaperLine>[] {
  const specs = lines.some((l) => l.specification)
  return visibleColumns(PO_COLUMNS, costs).filter((c) => specs || c.header !== SPEC_HEADER)
}

/** Adds one PO's printable sheet to a workbook. */
export function addPoSheet(book: ExcelJS.Workbook, paper: PoPaper, name = paper.po.number): ExcelJS.Worksheet {
  const { po } = paper
  const columns = poColumns(paper.lines, paper.costs)
  const widths = columnWidths(columns, paper.lines)
  const lastLine = PO_TABLE_HEADER_ROW + po.lines.length
  const totalRow = lastLine + 2
  const lastRow = po.notes ? totalRow + 2 : totalRow
  const ws = book.addWorksheet(name, {
    properties: { defaultRowHeight: LINE_POINTS },
    views: [{ state: 'frozen', ySplit: PO_TABLE_HEADER_ROW, topLeftCell: `A${PO_TABLE_HEADER_ROW + 1}` }],
    // Portrait, like any order form: a 30-line order fits one page at the width the writer scales to.
    ...printOptions({
      title: `Purchase order ${po.number}`, orientation: 'portrait',
      titleRows: `${PO_TABLE_HEADER_ROW}:${PO_TABLE_HEADER_ROW}`, printArea: `A1:${colLetter(columns.length)}${lastRow}`,
    }),
  })
  widths.forEach((w, i) => (ws.getColumn(i + 1).width = w.width))
  const w = widths.map((x) => x.width)
  headerBlock(ws, w, paper)
  lineTable(ws, columns, widths, paper.lines)
  if (paper.costs && po.orderTotal !== undefined) {
    const at = columns.length
    block(ws, w, totalRow, at - 1, at - 1, 'text', 'Total', { font: { bold: true }, alignment: { horizontal: 'right' } })
    putCell(ws.getCell(totalRow, at), 'money', amount(po.orderTotal))
    Object.assign(ws.getCell(totalRow, at), { font: { bold: true }, border: { top: THIN_RULE } })
  }
  if (po.notes) {
    block(ws, w, totalRow + 2, 1, 2, 'text', 'Notes', { font: { bold: true } })
    block(ws, w, totalRow + 2, 3, columns.length, 'text', po.notes)
  }
  return ws
}

export async function poWorkbook(paper: PoPaper): Promise<Buffer> {
  const book = newWorkbook()
  addPoSheet(book, paper)
  return workbookBytes(book)
}

type LineOfPo = PoPaperLine & { po: PoDetail }

/** The buyer's book: one row per order, every line, then each order's printable sheet. */
export async function multiPoWorkbook(papers: PoPaper[]): Promise<Buffer> {
  const costs = papers.every((p) => p.costs)
  const pos = papers.map((p) => p.po)
  const title = `Purchase orders ${pos.map((p) => p.number).join(', ')}`.slice(0, 120)
  const orderSheet = sheet<PoDetail>({
    name: 'Orders', title, rows: pos, costs,
    columns: [
      { header: 'Number', kind: 'text', value: (p) => p.number },
      { header: 'Status', kind: 'text', value: (p) => p.status.replace('_', ' ') },
      { header: 'Vendor', kind: 'text', width: 32, value: (p) => p.vendor.name },
      { header: 'Ship to', kind: 'text', width: 24, value: (p) => p.warehouse.name },
      { header: 'Job', kind: 'text', width: 28, value: (p) => p.job?.name },
      { header: 'Order date', kind: 'date', value: (p) => p.createdAt },
      { header: 'Expected', kind: 'date', value: (p) => p.expectedDate },
      { header: 'Currency', kind: 'text', value: (p) => p.currency },
      { header: 'Lines', kind: 'integer', value: (p) => p.lines.length },
      { header: 'Total', kind: 'money', value: (p) => amount(p.orderTotal), cost: true },
    ],
  })
  const rows = papers.flatMap((p) => p.lines.map((l) => ({ ...l, po: p.po })))
  const lineColumns = poColumns(rows, costs)
  const afterQty = lineColumns.findIndex((c) => c.header === 'Quantity') + 1
  const lineSheet = sheet<LineOfPo>({
    name: 'Lines', title, rows, costs,
    columns: [
      { header: 'Number', kind: 'text', value: (l) => l.po.number },
      { header: 'Vendor', kind: 'text', width: 28, value: (l) => l.po.vendor.name },
      ...lineColumns.slice(0, afterQty),
      { header: 'Received', kind: 'integer', value: (l) => l.qtyReceived },
      ...lineColumns.slice(afterQty),
    ],
  })
  return buildXlsx(orderSheet, lineSheet, (book: Book) => {
    for (const p of papers) addPoSheet(book as ExcelJS.Workbook, p)
  })
}
