// Every spreadsheet download goes through this writer (exceljs), so each one reads and prints the same way:
// - text is a string cell, inert however it starts (spreadsheetSafety.ts), with no visible quote in front;
// - numbers are numbers and days and times are dates, each with a number format;
// - a print setup that works: fit to one page wide (as many pages down as it takes), landscape when the
//   columns are wide, the header row repeated on every page, the document's name in the page header and
//   page numbers in the footer, column widths from the content.
// Whole workbooks are built in memory (buildXlsx); long ones are streamed (streamXlsx) with the same sheets.
import { once } from 'node:events'
import type { Writable } from 'node:stream'
import ExcelJS from 'exceljs'
import { visibleColumns } from '../costVisibility.js'
import { cellText } from '../spreadsheetSafety.js'

export type CellKind = 'text' | 'integer' | 'decimal' | 'money' | 'cost' | 'boolean' | 'date' | 'datetime'
export type CellInput = string | number | boolean | Date | null | undefined

export interface SheetColumn<Row> {
  header: string
  kind: CellKind
  value: (row: Row) => CellInput
  /** Widest the column grows (in characters); longer text wraps. */
  width?: number
  /** Decimal places shown for decimal columns. */
  places?: number
  /** A number format other than the kind's (e.g. negatives in red). */
  numFmt?: string
  /** What we pay (a cost, or a sum of costs): written only for callers who may see costs (services/costVisibility.ts). */
  cost?: boolean
}

export interface SheetSpec<Row> {
  /** The tab's name (at most 31 characters). */
  name: string
  /** The document's name in the printed page header; the tab's name when absent. */
  title?: string
  columns: readonly SheetColumn<Row>[]
  rows: readonly Row[]
  /** Portrait unless the columns are too wide for it. */
  orientation?: 'portrait' | 'landscape'
  /** Whether the reader may see costs: columns marked `cost` are left out unless this is true (services/costVisibility.ts). */
  costs?: boolean
}

const DAY_FORMAT = 'yyyy-mm-dd'
const TIME_FORMAT = 'yyyy-mm-dd hh:mm'
const HEADER_FILL: ExcelJS.Fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFE5F4F3' } }
export const THIN_RULE: ExcelJS.Border = { style: 'thin', color: { argb: 'FF9FB8BC' } }

export function numberFormat(kind: CellKind, places?: number): string | undefined {
  switch (kind) {
    case 'integer': return '#,##0'
    case 'money': return '#,##0.00'
    case 'cost': return '#,##0.0000'
    case 'decimal': return places ? `0.${'0'.repeat(places)}` : '0.###'
    case 'date': return DAY_FORMAT
    case 'datetime': return TIME_FORMAT
    default: return undefined
  }
}

/** A day 'YYYY-MM-DD…' (or a Date) as that calendar day; spreadsheets keep no time zone. */
function asDate(kind: 'date' | 'datetime', value: string | Date): Date | null {
  if (value instanceof Date) return Number.isNaN(value.getTime()) ? null : value
  const d = kind === 'date' ? new Date(`${value.slice(0, 10)}T00:00:00Z`) : new Date(value)
  return Number.isNaN(d.getTime()) ? null : d
}

/** The value a cell of this kind holds: a number, a Date, or a string cell (never a formula). */
export function cellValue(kind: CellKind, value: CellInput): ExcelJS.CellValue {
  if (value === null || value === undefined || value === '') return null
  switch (kind) {
    case 'text':
      return cellText(value instanceof Date ? value.toISOString() : String(value))
    case 'boolean':
      return value === true || value === 'true' || value === 1 ? 'yes' : 'no'
    case 'date':
    case 'datetime': {
      const d = typeof value === 'string' || value instanceof Date ? asDate(kind, value) : null
      return d ?? cellText(String(value))
    }
    default: {
      const n = typeof value === 'number' ? value : Number(value)
      return Number.isFinite(n) ? n : cellText(String(value))
    }
  }
}

/**
 * The wall-clock time in `zone` as a Date whose UTC fields carry it: spreadsheets keep no zone.
 * One formatter per export (building one per row cost more than writing the row).
 */
export function wallClockIn(zone: string): (at: Date) => Date {
  const format = new Intl.DateTimeFormat('en-US', {
    timeZone: zone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit',
  })
  return (at) => {
    const parts = format.formatToParts(at)
    const n = (type: string) => Number(parts.find((p) => p.type === type)!.value)
    return new Date(Date.UTC(n('year'), n('month') - 1, n('day'), n('hour'), n('minute'), n('second'), at.getUTCMilliseconds()))
  }
}

/** Writes one typed value into a cell with its number format. */
export function putCell(cell: ExcelJS.Cell, kind: CellKind, value: CellInput, places?: number): void {
  const v = cellValue(kind, value)
  if (v === null) return
  cell.value = v
  const fmt = numberFormat(kind, places)
  if (fmt && typeof v !== 'string') cell.numFmt = fmt
}

// --- widths and printing -------------------------------------------------------------------------------

/** Characters a value takes when shown; rough, for column widths. */
function shownLength(kind: CellKind, v: ExcelJS.CellValue): number {
  if (v === null || v === undefined) return 0
  if (v instanceof Date) return kind === 'datetime' ? 16 : 10
  if (typeof v === 'number') return Math.ceil(Math.abs(v)).toString().length + (kind === 'money' ? 5 : kind === 'cost' ? 7 : kind === 'decimal' ? 4 : 2)
  return Math.max(...String(v).split('\n').map((l) => l.length))
}

const MIN_WIDTH = 6
const DEFAULT_MAX_WIDTH = 50
/** Width units (about one digit each) that fit across a portrait Letter or A4 page within the margins. */
const PORTRAIT_WIDTH = 100
const WIDTH_SAMPLE = 500

/** Each column as wide as its header and widest value (of the first rows), within its limit. */
export function columnWidths<Row>(columns: readonly SheetColumn<Row>[], rows: readonly Row[]): { width: number; wrap: boolean }[] {
  const sample = rows.slice(0, WIDTH_SAMPLE)
  return columns.map((c) => {
    const widest = sample.reduce((w, r) => Math.max(w, shownLength(c.kind, cellValue(c.kind, c.value(r)))), 0)
    const max = c.width ?? DEFAULT_MAX_WIDTH
    const want = Math.max(MIN_WIDTH, c.header.length + 2, widest + 2)
    return { width: Math.min(want, Math.max(max, c.header.length + 2)), wrap: want > max }
  })
}

/** Header and footer codes treat & as a command: a literal one is doubled. */
const headerText = (text: string) => cellText(text).replace(/&/g, '&&').slice(0, 200)

export interface PrintSetup {
  /** The document's name, printed at the top of every page. */
  title: string
  orientation: 'portrait' | 'landscape'
  /** Rows repeated at the top of every printed page, e.g. '1:1'. */
  titleRows?: string
  printArea?: string
}

/** The sheet options that make it print: pass them when adding the sheet (streamed sheets write them first). */
export function printOptions(p: PrintSetup): Partial<ExcelJS.AddWorksheetOptions> {
  return {
    pageSetup: {
      orientation: p.orientation,
      fitToPage: true,
      fitToWidth: 1,
      fitToHeight: 0,
      margins: { left: 0.4, right: 0.4, top: 0.75, bottom: 0.6, header: 0.3, footer: 0.3 },
      ...(p.titleRows ? { printTitlesRow: p.titleRows } : {}),
      ...(p.printArea ? { printArea: p.printArea } : {}),
    },
    headerFooter: {
      oddHeader: `&L&"-,Bold"${headerText(p.title)}&RLumenyard`,
      oddFooter: '&LPrinted &D&RPage &P of &N',
    } as ExcelJS.HeaderFooter,
  }
}

export const orientationFor = (widths: readonly number[]): 'portrait' | 'landscape' =>
  widths.reduce((a, b) => a + b, 0) > PORTRAIT_WIDTH ? 'landscape' : 'portrait'

// --- sheets -----------------------------------------------------------------------------------------------

/** Workbook or streaming workbook: both add sheets the same way. */
export type Book = Pick<ExcelJS.Workbook, 'addWorksheet'> | Pick<ExcelJS.stream.xlsx.WorkbookWriter, 'addWorksheet'>
/** One sheet, ready to add to a workbook. */
export type Sheet = (book: Book) => void

function headerRow(row: ExcelJS.Row, count: number) {
  row.font = { bold: true }
  for (let c = 1; c <= count; c++) {
    row.getCell(c).fill = HEADER_FILL
    row.getCell(c).border = { bottom: THIN_RULE }
  }
}

/** Text starts one step in from the cell's left edge, so it never touches a number right-aligned beside it. */
export function alignmentOf(kind: CellKind, wrap: boolean): Partial<ExcelJS.Alignment> {
  const text = kind === 'text' || kind === 'boolean'
  return { horizontal: text ? 'left' : 'right', ...(text ? { indent: 1 } : {}), vertical: 'top', ...(wrap ? { wrapText: true } : {}) }
}

/** Points per line of 11 pt text (common practice: spreadsheet programs' default row height). */
export const LINE_POINTS = 15

/**
 * Lines `text` takes when wrapped in `widthChars` width units: a unit is one digit wide and mixed-case text runs
 * about 1.2 characters to it (common practice, checked against LibreOffice's printout), less one unit for the
 * indent and padding.
 */
export function wrappedLines(text: string, widthChars: number): number {
  const room = Math.max(1, (widthChars - 1) * 1.2)
  return text.split('\n').reduce((n, part) => n + Math.max(1, Math.ceil(part.length / room)), 0)
}

/** Row height in points for `lines` lines of text (a spreadsheet's tallest row is 409 points). */
export const rowHeightFor = (lines: number) => Math.min(409, lines * LINE_POINTS)

/**
 * The height a row needs for its wrapped text, or 0 when one line does: spreadsheet programs keep the stored
 * height when they open a file, so a row that wraps must say how tall it is.
 */
export function wrappedHeight(values: readonly ExcelJS.CellValue[], widths: readonly { width: number; wrap: boolean }[]): number {
  let lines = 1
  values.forEach((v, i) => {
    if (widths[i].wrap && typeof v === 'string') lines = Math.max(lines, wrappedLines(v, widths[i].width))
  })
  return lines > 1 ? rowHeightFor(lines) : 0
}

/** A sheet whose rows are added one at a time; in a streamed workbook each row leaves memory as it is added. */
export interface OpenSheet<Row> {
  add(row: Row): void
  /** Resolves when the rows added so far have been taken on towards the file (a streamed workbook), at once otherwise. */
  room(): Promise<void>
  done(): void
}

/** exceljs's zip takes a sheet through a stream of the readable-stream package, older than Node's own: no writableNeedDrain. */
type ZipInput = Writable & { _writableState?: { length: number; highWaterMark: number; needDrain?: boolean } }
interface SheetOutput { pipes?: ZipInput[]; buffers?: unknown[] }

const isFull = (p: ZipInput) => (p._writableState ? p._writableState.length >= p._writableState.highWaterMark : p.writableNeedDrain)

/**
 * exceljs's streamed sheet hands its XML to the workbook's zip without waiting, so a long sheet would pile up in
 * memory whenever compressing is slower than writing rows (a million-row ledger: half a gigabyte). This waits
 * while the compressor holds more than its buffer, or while the zip has not started on the sheet yet.
 */
async function sheetRoom(ws: unknown): Promise<void> {
  const out = (ws as { _stream?: SheetOutput })._stream
  for (;;) {
    const full = out?.pipes?.find(isFull)
    if (full) await once(full, 'drain')
    else if (out && !out.pipes?.length && (out.buffers?.length ?? 0) > 1) await new Promise((resolve) => setTimeout(resolve, 2))
    else return
  }
}

/**
 * Opens a table sheet: the header row, print setup and column styles. Widths come from `sample` (the first rows,
 * when they are at hand) or else from each column's header and `width`.
 */
export function openSheet<Row>(book: Book, table: Omit<SheetSpec<Row>, 'rows'>, sample: readonly Row[] = [], filter = true): OpenSheet<Row> {
  const spec = { ...table, columns: visibleColumns(table.columns, table.costs === true) }
  const widths = sample.length
    ? columnWidths(spec.columns, sample)
    : spec.columns.map((c) => ({ width: Math.max(MIN_WIDTH, c.header.length + 2, Math.min(c.width ?? 14, DEFAULT_MAX_WIDTH)), wrap: false }))
  const ws = (book.addWorksheet as ExcelJS.Workbook['addWorksheet'])(spec.name.slice(0, 31), {
    views: [{ state: 'frozen', ySplit: 1 }],
    ...printOptions({ title: spec.title ?? spec.name, orientation: spec.orientation ?? orientationFor(widths.map((w) => w.width)), titleRows: '1:1' }),
  })
  const alignments = spec.columns.map((c, i) => alignmentOf(c.kind, widths[i].wrap))
  ws.columns = spec.columns.map((c, i) => {
    const numFmt = c.numFmt ?? numberFormat(c.kind, c.places)
    return { header: c.header, width: widths[i].width, style: { ...(numFmt ? { numFmt } : {}), alignment: alignments[i] } }
  })
  if (filter) ws.autoFilter = { from: { row: 1, column: 1 }, to: { row: 1, column: spec.columns.length } }
  const head = ws.getRow(1)
  headerRow(head, spec.columns.length)
  spec.columns.forEach((c, i) => (head.getCell(i + 1).alignment = { ...alignments[i], wrapText: false, vertical: 'bottom' }))
  head.commit()
  // exceljs gives every new row and cell a fresh copy of its style and looks a style up by the object, so it
  // would work each row's and cell's style out again (most of a long export's time): a data row takes one
  // style object and each cell its column's one, the same from the first row to the last.
  const rowStyle: Partial<ExcelJS.Style> = {}
  const columnStyles: Partial<ExcelJS.Style>[] = []
  return {
    add(row) {
      const values = spec.columns.map((c) => cellValue(c.kind, c.value(row)))
      const added = ws.addRow(values)
      ;(added as unknown as { style: Partial<ExcelJS.Style> }).style = rowStyle
      added.eachCell({ includeEmpty: true }, (cell, n) => (cell.style = columnStyles[n - 1] ??= cell.style))
      const height = wrappedHeight(values, widths)
      if (height) added.height = height
      added.commit()
    },
    room: () => sheetRoom(ws),
    done: () => (ws as { commit?: () => void }).commit?.(),
  }
}

/** A table: one header row, then one row per record. */
export function sheet<Row>(table: SheetSpec<Row>): Sheet {
  return (book) => {
    const open = openSheet(book, table, table.rows, table.rows.length > 0)
    for (const row of table.rows) open.add(row)
    open.done()
  }
}

export interface Field {
  label: string
  kind: CellKind
  value: CellInput
  places?: number
}

/** Label and value pairs (a document's facts, an export's filters), one per row. */
export function fieldsSheet(spec: { name: string; title?: string; fields: readonly Field[] }): Sheet {
  return (book) => {
    const shown = spec.fields.filter((f) => cellValue(f.kind, f.value) !== null)
    const labelWidth = Math.max(12, ...shown.map((f) => f.label.length + 2))
    const valueWidth = Math.min(70, Math.max(16, ...shown.map((f) => shownLength(f.kind, cellValue(f.kind, f.value)) + 2)))
    const ws = (book.addWorksheet as ExcelJS.Workbook['addWorksheet'])(spec.name.slice(0, 31), printOptions({ title: spec.title ?? spec.name, orientation: 'portrait' }))
    ws.columns = [{ width: labelWidth }, { width: valueWidth, style: { alignment: { horizontal: 'left', vertical: 'top', wrapText: true } } }]
    for (const f of shown) {
      const row = ws.addRow([])
      row.getCell(1).value = f.label
      row.getCell(1).font = { bold: true }
      putCell(row.getCell(2), f.kind, f.value, f.places)
      row.commit()
    }
    ;(ws as { commit?: () => void }).commit?.()
  }
}

function newBook<B extends ExcelJS.Workbook | ExcelJS.stream.xlsx.WorkbookWriter>(book: B): B {
  book.creator = 'Lumenyard'
  book.created = new Date()
  return book
}

export async function buildXlsx(...sheets: Sheet[]): Promise<Buffer> {
  const book = newBook(new ExcelJS.Workbook())
  for (const add of sheets) add(book)
  return Buffer.from(await book.xlsx.writeBuffer())
}

/** The same sheets written row by row to a stream (rows leave memory as they are written). */
export async function streamXlsx(out: Writable, ...sheets: Sheet[]): Promise<void> {
  const book = newStreamingBook(out, { sharedStrings: true })
  for (const add of sheets) add(book)
  await book.commit()
}

/**
 * A workbook written to a stream as its rows arrive, for a writer that reads rows at its own pace (the whole-business
 * export); strings written inline (the default) keep memory flat however many rows there are.
 */
export const newStreamingBook = (out: Writable, opts: { sharedStrings?: boolean } = {}) =>
  newBook(new ExcelJS.stream.xlsx.WorkbookWriter({ stream: out, useStyles: true, useSharedStrings: opts.sharedStrings ?? false }))

/** An empty workbook to lay out by hand (the purchase order's sheet); pair it with printOptions and putCell. */
export const newWorkbook = () => newBook(new ExcelJS.Workbook())

export async function workbookBytes(book: ExcelJS.Workbook): Promise<Buffer> {
  return Buffer.from(await book.xlsx.writeBuffer())
}

export const XLSX_TYPE = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet'
