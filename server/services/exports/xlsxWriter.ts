// Spreadsheet downloads (.xlsx with exceljs): numbers stay numbers, and text a person typed that a
// spreadsheet could take for a formula is written as inert text (spreadsheetSafety.ts, OWASP "CSV
// Injection"). Reusable for any export.
import ExcelJS from 'exceljs'
import type { Response } from 'express'
import { sendDownload } from '../../http/fileResponse.js'
import { inertText } from '../spreadsheetSafety.js'

export type CellKind = 'text' | 'integer' | 'decimal' | 'money' | 'boolean'

export interface SheetColumn<Row> {
  header: string
  width?: number
  kind: CellKind
  value: (row: Row) => string | number | boolean | null | undefined
  /** Decimal places shown for decimal columns (money shows 2). */
  places?: number
}

export interface SheetSpec<Row> {
  name: string
  columns: readonly SheetColumn<Row>[]
  rows: readonly Row[]
}

function cellValue(kind: CellKind, value: string | number | boolean | null | undefined): ExcelJS.CellValue {
  if (value === null || value === undefined || value === '') return null
  if (kind === 'text') return inertText(String(value))
  if (kind === 'boolean') return value === true || value === 'true' ? 'yes' : 'no'
  const n = typeof value === 'number' ? value : Number(value)
  return Number.isFinite(n) ? n : inertText(String(value))
}

function numberFormat<Row>(c: SheetColumn<Row>): string | undefined {
  if (c.kind === 'money') return '#,##0.00'
  if (c.kind === 'integer') return '0'
  if (c.kind === 'decimal') return c.places ? `0.${'0'.repeat(c.places)}` : '0.###'
  return undefined
}

/** One sheet, ready to add to a workbook (rows of any shape, typed per sheet). */
export type Sheet = (book: ExcelJS.Workbook) => void

export function sheet<Row>(spec: SheetSpec<Row>): Sheet {
  return (book) => {
    const ws = book.addWorksheet(spec.name.slice(0, 31))
    ws.columns = spec.columns.map((c) => {
      const numFmt = numberFormat(c)
      return { header: c.header, width: c.width ?? Math.max(10, c.header.length + 2), ...(numFmt ? { style: { numFmt } } : {}) }
    })
    ws.getRow(1).font = { bold: true }
    ws.views = [{ state: 'frozen', ySplit: 1 }]
    for (const row of spec.rows) ws.addRow(spec.columns.map((c) => cellValue(c.kind, c.value(row))))
  }
}

export async function buildXlsx(...sheets: Sheet[]): Promise<Buffer> {
  const book = new ExcelJS.Workbook()
  book.creator = 'Lumenyard'
  for (const add of sheets) add(book)
  return Buffer.from(await book.xlsx.writeBuffer())
}

export const XLSX_TYPE = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet'

/** Sends a workbook as a download; the file name is ours, never the user's text. */
export function sendXlsx(res: Response, filename: string, body: Buffer): void {
  sendDownload(res, { name: filename, type: XLSX_TYPE, bytes: body })
}
