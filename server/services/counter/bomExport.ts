// A saved bill as a workbook: the lines (quantities stay numbers), each line's explanation, and the
// cautions. Every text that came from a person or the catalog goes through spreadsheetSafety first.
import ExcelJS from 'exceljs'
import type { BomRecord } from '../../../shared/schemas/counter.js'
import { inertCell, inertText } from '../spreadsheetSafety.js'

const HEADER_FILL: ExcelJS.Fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFE5F4F3' } }

function heading(sheet: ExcelJS.Worksheet, columns: { header: string; key: string; width: number }[]) {
  sheet.columns = columns
  const row = sheet.getRow(1)
  row.font = { bold: true }
  row.fill = HEADER_FILL
  sheet.views = [{ state: 'frozen', ySplit: 1 }]
}

function linesSheet(book: ExcelJS.Workbook, bom: BomRecord) {
  const sheet = book.addWorksheet('Bill of materials')
  heading(sheet, [
    { header: 'Line', key: 'line', width: 6 },
    { header: 'SKU', key: 'sku', width: 18 },
    { header: 'Description', key: 'description', width: 48 },
    { header: 'Quantity', key: 'qty', width: 10 },
    { header: 'Unit', key: 'unit', width: 8 },
    { header: 'Made to order', key: 'mto', width: 14 },
    { header: 'Exact need', key: 'needed', width: 12 },
    { header: 'Walls', key: 'walls', width: 28 },
  ])
  for (const l of bom.lines) {
    sheet.addRow({
      line: l.lineNo,
      sku: inertCell(l.sku),
      description: inertText(l.description),
      qty: l.qty,
      unit: inertText(l.unit),
      mto: l.madeToOrder ? 'yes' : 'no',
      needed: l.explanation ? Number(l.explanation.needed.toFixed(3)) : null,
      walls: inertText((l.explanation?.walls ?? []).join(', ')),
    })
  }
  sheet.getColumn('needed').numFmt = '0.###'
}

function jobSheet(book: ExcelJS.Workbook, bom: BomRecord) {
  const sheet = book.addWorksheet('Job')
  heading(sheet, [{ header: 'Field', key: 'field', width: 18 }, { header: 'Value', key: 'value', width: 60 }])
  const rows: [string, string | number | null][] = [
    ['Customer', `${bom.job.customerCode} ${bom.job.customerName}`],
    ['Job', bom.job.name],
    ['Site', bom.job.siteAddress],
    ['Takeoff', bom.takeoffName],
    ['Revision', bom.revision],
    ['Saved', bom.createdAt.slice(0, 16).replace('T', ' ')],
    ['Saved by', bom.createdBy],
  ]
  for (const [field, value] of rows) sheet.addRow({ field, value: typeof value === 'number' ? value : inertCell(value) })
}

function explanationSheet(book: ExcelJS.Workbook, bom: BomRecord) {
  const sheet = book.addWorksheet('Explanations')
  heading(sheet, [
    { header: 'Line', key: 'line', width: 6 },
    { header: 'Rule', key: 'rule', width: 60 },
    { header: 'Inputs', key: 'inputs', width: 50 },
    { header: 'Formula', key: 'formula', width: 70 },
    { header: 'Rounding', key: 'rounding', width: 60 },
  ])
  for (const l of bom.lines) {
    const e = l.explanation
    if (!e) continue
    const inputs = Object.entries(e.inputs).map(([k, v]) => `${k} = ${v}`).join('; ')
    sheet.addRow({ line: l.lineNo, rule: inertText(e.rule), inputs: inertText(inputs), formula: inertText(e.formula), rounding: inertText(e.rounding) })
  }
}

function cautionSheet(book: ExcelJS.Workbook, bom: BomRecord) {
  const sheet = book.addWorksheet('Cautions')
  heading(sheet, [
    { header: 'Level', key: 'level', width: 8 },
    { header: 'Code section', key: 'code', width: 20 },
    { header: 'Wall', key: 'wall', width: 20 },
    { header: 'Caution', key: 'message', width: 110 },
  ])
  for (const c of bom.cautions) {
    sheet.addRow({ level: c.level, code: inertCell(c.code), wall: inertCell(c.wall), message: inertText(c.message) })
  }
}

export async function bomWorkbook(bom: BomRecord): Promise<Buffer> {
  const book = new ExcelJS.Workbook()
  book.creator = 'Lumenyard'
  book.created = new Date(bom.createdAt)
  linesSheet(book, bom)
  explanationSheet(book, bom)
  cautionSheet(book, bom)
  jobSheet(book, bom)
  return Buffer.from(await book.xlsx.writeBuffer())
}

export function bomFileName(bom: BomRecord): string {
  const safe = `${bom.job.customerCode}-${bom.job.name}`.replace(/[^A-Za-z0-9-]+/g, '-').replace(/-+/g, '-').slice(0, 60)
  return `bill-${safe}-rev${bom.revision}.xlsx`
}
