// The filtered ledger as a spreadsheet (xlsx, streamed with exceljs). Quantities and costs are numbers,
// times are dates in the reader's time zone, and text typed by people is written inert: a leading
// = + - @ tab CR LF gets a single quote in front (spreadsheetSafety.ts: OWASP "CSV Injection").
import type { Writable } from 'node:stream'
import ExcelJS from 'exceljs'
import { Decimal } from 'decimal.js'
import type { DataSource } from 'typeorm'
import type { LedgerExportQuery } from '../../shared/schemas/stockViews.js'
import { AppError } from '../errors.js'
import { inertCell } from './spreadsheetSafety.js'
import { countLedger, LEDGER_SELECT, ledgerOrder, ledgerWhere, type LedgerSqlRow } from './stockLedgerQuery.js'

// A quarter of a busy yard's ledger; a whole year is exported a quarter at a time.
export const EXPORT_LIMIT = 20_000

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

const MOVE_WORDS: Record<string, string> = {
  receipt: 'Receipt', issue: 'Issue', pick: 'Pick', adjustment: 'Adjustment', count: 'Count', bin_move: 'Bin move',
  transfer_out: 'Transfer out', transfer_in: 'Transfer in', assembly: 'Assembly', return: 'Return',
}

const COLUMNS: Partial<ExcelJS.Column>[] = [
  { header: 'When', key: 'at', width: 19, style: { numFmt: 'yyyy-mm-dd hh:mm:ss' } },
  { header: 'Move', key: 'move', width: 13 },
  { header: 'SKU', key: 'sku', width: 16 },
  { header: 'Item', key: 'item', width: 34 },
  { header: 'Warehouse', key: 'warehouse', width: 11 },
  { header: 'Bin', key: 'bin', width: 12 },
  { header: 'Lot', key: 'lot', width: 12 },
  { header: 'Quantity', key: 'qty', width: 10, style: { numFmt: '#,##0;[Red]-#,##0' } },
  { header: 'Unit', key: 'unit', width: 7 },
  { header: 'Unit cost', key: 'unitCost', width: 11, style: { numFmt: '#,##0.0000' } },
  { header: 'Value', key: 'value', width: 12, style: { numFmt: '#,##0.00;[Red]-#,##0.00' } },
  { header: 'Document', key: 'doc', width: 16 },
  { header: 'Reason', key: 'reason', width: 12 },
  { header: 'Note', key: 'note', width: 40 },
  { header: 'By', key: 'by', width: 18 },
  { header: 'Move id', key: 'id', width: 10 },
]

function cells(r: LedgerSqlRow, clock: (at: Date) => Date) {
  const value = r.unit_cost === null ? null : new Decimal(r.unit_cost).times(r.qty).toDecimalPlaces(2).toNumber()
  return {
    at: clock(new Date(r.at)), move: MOVE_WORDS[r.move_type] ?? r.move_type, sku: inertCell(r.sku), item: inertCell(r.item_name),
    warehouse: inertCell(r.warehouse_code), bin: inertCell(r.bin_code), lot: inertCell(r.lot_code), qty: r.qty, unit: r.stock_unit,
    unitCost: r.unit_cost === null ? null : Number(r.unit_cost), value,
    doc: r.doc_type ? inertCell(`${r.doc_type} ${r.doc_id ?? ''}`.trim()) : null,
    reason: inertCell(r.reason), note: inertCell(r.note), by: inertCell(r.user_name), id: Number(r.id),
  }
}

function filterSheet(wb: ExcelJS.stream.xlsx.WorkbookWriter, q: LedgerExportQuery, total: number) {
  const sheet = wb.addWorksheet('Filters')
  sheet.columns = [{ header: 'Filter', key: 'k', width: 16 }, { header: 'Value', key: 'v', width: 40 }]
  const shown: [string, unknown][] = [
    ['Exported', new Date().toISOString()], ['Time zone', q.tz], ['Moves', total], ['Item id', q.itemId], ['Warehouse id', q.warehouseId],
    ['Bin id', q.binId], ['Lot id', q.lotId], ['Move types', q.moveType?.join(', ')], ['Document', q.docType ? `${q.docType} ${q.docId ?? ''}` : undefined],
    ['From', q.from], ['To', q.to], ['Sorted by', `${q.sort} ${q.dir}`],
  ]
  for (const [k, v] of shown) if (v !== undefined) sheet.addRow({ k, v: typeof v === 'string' ? inertCell(v) : v }).commit()
  sheet.commit()
}

/** One query, capped by the count before it: a single statement reads one consistent snapshot, no paging. */
async function writeMoves(ds: DataSource, wb: ExcelJS.stream.xlsx.WorkbookWriter, q: LedgerExportQuery): Promise<number> {
  const sheet = wb.addWorksheet('Ledger', { views: [{ state: 'frozen', ySplit: 1 }] })
  sheet.columns = COLUMNS
  sheet.getRow(1).font = { bold: true }
  sheet.getRow(1).commit()
  const where = ledgerWhere(q)
  const rows: LedgerSqlRow[] = await ds.query(`${LEDGER_SELECT} ${where.sql()} ORDER BY ${ledgerOrder(q)}`, where.params)
  const clock = wallClockIn(q.tz)
  for (const r of rows) sheet.addRow(cells(r, clock)).commit()
  sheet.commit()
  return rows.length
}

export interface LedgerExport {
  filename: string
  /** Writes the workbook to `out` and ends it. */
  write(out: Writable): Promise<void>
}

export async function prepareLedgerExport(ds: DataSource, q: LedgerExportQuery, limit = EXPORT_LIMIT): Promise<LedgerExport> {
  const total = await countLedger(ds, q)
  if (total > limit) {
    throw AppError.badRequest(`These filters match ${total} moves; an export holds at most ${limit}. Narrow the dates or filters.`, {
      from: 'Narrow the dates',
    })
  }
  return {
    filename: `stock-ledger-${new Date().toISOString().slice(0, 10)}.xlsx`,
    write: async (out) => {
      const wb = new ExcelJS.stream.xlsx.WorkbookWriter({ stream: out, useStyles: true, useSharedStrings: false })
      filterSheet(wb, q, await writeMoves(ds, wb, q))
      await wb.commit()
    },
  }
}
