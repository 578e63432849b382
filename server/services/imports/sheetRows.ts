// Reads the first sheet of an .xlsx (streaming, so a row cap stops it early) or a CSV, matches the
// header row to a column spec, and types each cell. Runs inside the parse worker (parseWorker.ts);
// pure otherwise, so tests can call it directly.
import { problem, type Problem } from '../../../shared/errors/errorCodes.js'
import { Readable } from 'node:stream'
import ExcelJS from 'exceljs'
import { readCsv } from './csvText.js'
import type { CellValue, ImportColumn, ImportRow, ImportSpec, ParsedSheet, ParseOutcome, RowIssue } from './importTypes.js'

type RawCell = string | number | boolean | null

const normalise = (header: string) => header.toLowerCase().replace(/[^a-z0-9]/g, '')

/** exceljs cell values (rich text, formulas, hyperlinks, dates, errors) as plain text, number or boolean. */
function plainCell(value: unknown): RawCell {
  if (value === null || value === undefined) return null
  if (typeof value === 'string' || typeof value === 'number' || typeof value === 'boolean') return value
  if (value instanceof Date) return value.toISOString().slice(0, 10)
  const v = value as { richText?: { text: string }[]; result?: unknown; text?: unknown; error?: string }
  if (v.richText) return v.richText.map((r) => r.text).join('')
  if ('result' in v) return plainCell(v.result)
  if (v.error) return `#ERROR ${v.error}`
  if (typeof v.text === 'string') return v.text
  return String(value)
}

/** Binary floating point noise removed (0.30000000000000004 → "0.3"), as the spreadsheet shows it. */
const numberText = (n: number) => String(Number(n.toPrecision(15)))

const BOOLEAN_WORDS: Record<string, boolean> = { true: true, false: false, yes: true, no: false, y: true, n: false, '1': true, '0': false, x: true }

function typedCell(column: ImportColumn, raw: RawCell): { value: CellValue } | { issue: Problem } {
  const text = raw === null ? '' : typeof raw === 'number' ? numberText(raw) : String(raw).trim()
  if (text === '') return column.required ? { issue: problem('required') } : { value: null }
  switch (column.kind) {
    case 'text':
      return { value: text }
    case 'integer':
      return /^-?\d+$/.test(text) ? { value: Number(text) } : { issue: problem('cell_whole_number', { text: text.slice(0, 40) }) }
    case 'decimal':
      return /^-?\d+(\.\d+)?$/.test(text) ? { value: text } : { issue: problem('cell_number', { text: text.slice(0, 40) }) }
    case 'boolean': {
      const word = BOOLEAN_WORDS[text.toLowerCase()]
      return word === undefined ? { issue: problem('cell_yes_no', { text: text.slice(0, 40) }) } : { value: word }
    }
  }
}

/** Which spec column each sheet column is (null: ignored), or why the header row does not fit. */
function mapHeader(header: RawCell[], spec: ImportSpec): { ok: true; map: (ImportColumn | null)[] } | { ok: false; missing: string[]; unknown: string[]; message: string } {
  const byName = new Map<string, ImportColumn>()
  for (const c of spec.columns) for (const name of [c.key, c.header, ...(c.aliases ?? [])]) byName.set(normalise(name), c)
  const ignored = new Set((spec.ignore ?? []).map(normalise))
  const seen = new Set<string>()
  const unknown: string[] = []
  const map = header.map((cell) => {
    const name = cell === null ? '' : String(cell).trim()
    if (name === '') return null
    const column = byName.get(normalise(name))
    if (!column) {
      if (!ignored.has(normalise(name))) unknown.push(name.slice(0, 40))
      return null
    }
    if (seen.has(column.key)) unknown.push(`${name} (twice)`)
    seen.add(column.key)
    return column
  })
  const missing = spec.columns.filter((c) => c.required && !seen.has(c.key)).map((c) => c.header)
  if (missing.length || unknown.length) {
    const parts = [missing.length ? `missing ${missing.join(', ')}` : '', unknown.length ? `not known: ${unknown.join(', ')}` : '']
    return { ok: false, missing, unknown, message: `The columns do not match the template (${parts.filter(Boolean).join('; ')}).` }
  }
  return { ok: true, map }
}

type SheetRecord = { row: number; cells: RawCell[] }
type Refusal = Extract<ParseOutcome, { ok: false }>

/**
 * Types records one at a time as they are read, in sheet order: the header is the first non-empty record, then
 * each later non-empty record becomes a typed row with its issues. The raw cells of a record are not kept, so a
 * streamed sheet is held once (typed), not twice. `add` answers a refusal that stops the reading (more rows than
 * the spec allows), else null; `done` answers the outcome (a header that does not fit is answered there, after
 * the reading's own refusals, as when the whole sheet was read first).
 */
export function rowTyper(spec: ImportSpec): {
  add(record: SheetRecord): Refusal | null
  /** Typed rows waiting to be taken. */
  readonly pending: number
  /** Hands over the rows typed so far (and their issues) and forgets them: the next chunk starts empty. */
  take(): ParsedSheet
  done(): ParseOutcome
} {
  let header: ReturnType<typeof mapHeader> | null = null
  let rows: ImportRow[] = []
  let issues: RowIssue[] = []
  let typed = 0
  return {
    get pending() {
      return rows.length
    },
    take() {
      const part = { rows, issues }
      rows = []
      issues = []
      return part
    },
    add(record) {
      if (!record.cells.some((c) => c !== null && String(c).trim() !== '')) return null
      if (!header) {
        header = mapHeader(record.cells, spec)
        return null
      }
      if (!header.ok) return null
      if (typed >= spec.maxRows) return tooManyRows(spec)
      typed++
      const values: Record<string, CellValue> = {}
      header.map.forEach((column, i) => {
        if (!column) return
        const typed = typedCell(column, record.cells[i] ?? null)
        if ('issue' in typed) issues.push({ row: record.row, column: column.key, problem: typed.issue })
        // A blank yes/no cell says nothing: the record keeps its value (a new one takes the default).
        else if (!(column.kind === 'boolean' && typed.value === null)) values[column.key] = typed.value
      })
      rows.push({ row: record.row, values })
      return null
    },
    done() {
      if (!header) return { ok: false, code: 'sheet_empty', message: 'The file holds no rows.' }
      if (!header.ok) return { ok: false, code: 'sheet_columns', params: { missing: header.missing, unknown: header.unknown }, message: header.message }
      return { ok: true, sheet: { rows, issues } }
    },
  }
}

/** Header in the first non-empty record, then typed rows with their spreadsheet row numbers. */
export function rowsFromRecords(records: readonly SheetRecord[], spec: ImportSpec): ParseOutcome {
  const typer = rowTyper(spec)
  for (const record of records) {
    const refused = typer.add(record)
    if (refused) return refused
  }
  return typer.done()
}

const tooManyRows = (spec: ImportSpec): Refusal => ({
  ok: false, code: 'sheet_too_many_rows', params: { max: spec.maxRows }, message: `The file has more than ${spec.maxRows.toLocaleString('en-US')} rows; split it into smaller files.`,
})

/**
 * Where typed rows go while a sheet is read: every `rows` rows are handed to `each` (which may wait: the reading
 * waits with it), so the reader never holds more than a chunk. Without it the whole sheet is answered at the end.
 */
export interface RowChunks {
  rows: number
  each(part: ParsedSheet): Promise<void>
}

const handOver = async (typer: ReturnType<typeof rowTyper>, chunks?: RowChunks) => {
  if (chunks && typer.pending >= chunks.rows) await chunks.each(typer.take())
}

function csvRecords(data: Uint8Array, spec: ImportSpec): { ok: true; records: SheetRecord[] } | Refusal {
  const text = new TextDecoder('utf-8').decode(data).replace(/^\uFEFF/, '')
  const csv = readCsv(text, { maxRecords: spec.maxRows + 2, maxFields: spec.maxColumns })
  if (!csv.ok) return { ok: false, code: csv.code, params: csv.params, message: csv.message }
  if (csv.records.length > spec.maxRows + 1) return tooManyRows(spec)
  return { ok: true, records: csv.records.map((cells, i) => ({ row: i + 1, cells })) }
}

export function parseCsvRows(data: Uint8Array, spec: ImportSpec): ParseOutcome {
  const read = csvRecords(data, spec)
  return read.ok ? rowsFromRecords(read.records, spec) : read
}

/** A CSV's rows handed over a chunk at a time (the text itself is read in one linear pass first). */
export async function streamCsvRows(data: Uint8Array, spec: ImportSpec, chunks: RowChunks): Promise<ParseOutcome> {
  const read = csvRecords(data, spec)
  if (!read.ok) return read
  const typer = rowTyper(spec)
  for (let i = 0; i < read.records.length; i++) {
    const refused = typer.add(read.records[i])
    // The record is typed: its text is no longer needed.
    read.records[i] = { row: 0, cells: [] }
    if (refused) return refused
    await handOver(typer, chunks)
  }
  return typer.done()
}

export async function parseXlsxRows(data: Uint8Array, spec: ImportSpec, chunks?: RowChunks): Promise<ParseOutcome> {
  const reader = new ExcelJS.stream.xlsx.WorkbookReader(Readable.from([Buffer.from(data)]), {
    sharedStrings: 'cache', hyperlinks: 'ignore', styles: 'ignore', worksheets: 'emit', entries: 'ignore',
  })
  // Each row is typed as the streaming reader hands it over; only the typed rows are kept.
  const typer = rowTyper(spec)
  let read = 0
  for await (const sheet of reader) {
    for await (const row of sheet) {
      const values = row.values as unknown[]
      if (values.length - 1 > spec.maxColumns) return { ok: false, code: 'sheet_too_many_columns', params: { row: row.number, max: spec.maxColumns }, message: `Row ${row.number} has more than ${spec.maxColumns} columns.` }
      if (++read > spec.maxRows + 1) return tooManyRows(spec)
      const refused = typer.add({ row: row.number, cells: values.slice(1).map(plainCell) })
      if (refused) return refused
      await handOver(typer, chunks)
    }
    break // the first sheet only
  }
  return typer.done()
}
