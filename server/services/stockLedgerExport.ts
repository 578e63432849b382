// The filtered ledger as a spreadsheet, streamed through the one writer (exports/xlsxWriter.ts): quantities
// and costs are numbers, times are dates in the reader's time zone, documents are named by their numbers.
import type { Writable } from 'node:stream'
import { Decimal } from 'decimal.js'
import type { DataSource } from 'typeorm'
import type { LedgerExportQuery } from '../../shared/schemas/stockViews.js'
import { AppError, problem } from '../errors.js'
import { fieldsSheet, sheet, streamXlsx, wallClockIn, type Field, type SheetColumn } from './exports/xlsxWriter.js'
import { countLedger, documentReference, LEDGER_SELECT, ledgerOrder, ledgerWhere, type LedgerSqlRow } from './stockLedgerQuery.js'

// A quarter of a busy yard's ledger; a whole year is exported a quarter at a time.
export const EXPORT_LIMIT = 20_000

const MOVE_WORDS: Record<string, string> = {
  receipt: 'Receipt', issue: 'Issue', pick: 'Pick', adjustment: 'Adjustment', count: 'Count', bin_move: 'Bin move',
  transfer_out: 'Transfer out', transfer_in: 'Transfer in', assembly: 'Assembly', return: 'Return',
}

const DOCUMENT_WORDS: Record<string, string> = {
  purchase_order: 'Purchase order', pick_list: 'Pick list', pick_transfer: 'Pick list', transfer: 'Transfer', job: 'Job', cycle_count: 'Cycle count',
}

/** The document as people name it: its number (PO-2026-00012, PL-00031), else its kind and id (Transfer 12). */
function documentCell(r: LedgerSqlRow): string | null {
  if (!r.doc_type) return null
  const ref = documentReference(r)
  if (ref) return r.doc_type === 'job' ? `Job ${ref}` : ref
  return `${DOCUMENT_WORDS[r.doc_type] ?? 'Document'} ${r.doc_id ?? ''}`.trim()
}

type MoveRow = LedgerSqlRow & { wallClock: Date; value: number | null }

const COLUMNS: SheetColumn<MoveRow>[] = [
  { header: 'When', kind: 'datetime', value: (r) => r.wallClock, numFmt: 'yyyy-mm-dd hh:mm:ss' },
  { header: 'Move', kind: 'text', value: (r) => MOVE_WORDS[r.move_type] ?? r.move_type },
  { header: 'SKU', kind: 'text', value: (r) => r.sku },
  { header: 'Item', kind: 'text', width: 30, value: (r) => r.item_name },
  { header: 'Warehouse', kind: 'text', value: (r) => r.warehouse_code },
  { header: 'Bin', kind: 'text', value: (r) => r.bin_code },
  { header: 'Lot', kind: 'text', value: (r) => r.lot_code },
  { header: 'Quantity', kind: 'integer', value: (r) => r.qty, numFmt: '#,##0;[Red]-#,##0' },
  { header: 'Unit', kind: 'text', value: (r) => r.stock_unit },
  { header: 'Unit cost', kind: 'cost', value: (r) => r.unit_cost, cost: true },
  { header: 'Value', kind: 'money', value: (r) => r.value, numFmt: '#,##0.00;[Red]-#,##0.00', cost: true },
  { header: 'Document', kind: 'text', width: 28, value: documentCell },
  { header: 'Reason', kind: 'text', value: (r) => r.reason },
  { header: 'Note', kind: 'text', width: 30, value: (r) => r.note },
  { header: 'By', kind: 'text', width: 18, value: (r) => r.user_name },
  { header: 'Move id', kind: 'integer', value: (r) => Number(r.id), numFmt: '0' },
]

function filterFields(q: LedgerExportQuery, total: number, clock: (at: Date) => Date): Field[] {
  const text = (label: string, value: string | undefined): Field => ({ label, kind: 'text', value })
  const id = (label: string, value: number | undefined): Field => ({ label, kind: 'integer', value })
  return [
    { label: 'Exported', kind: 'datetime', value: clock(new Date()) }, text('Time zone', q.tz), id('Moves', total),
    id('Item id', q.itemId), id('Warehouse id', q.warehouseId), id('Bin id', q.binId), id('Lot id', q.lotId),
    text('Move types', q.moveType?.map((m) => MOVE_WORDS[m] ?? m).join(', ')),
    text('Document', q.docType ? `${DOCUMENT_WORDS[q.docType] ?? q.docType} ${q.docId ?? ''}`.trim() : undefined),
    { label: 'From', kind: 'date', value: q.from }, { label: 'To', kind: 'date', value: q.to }, text('Sorted by', `${q.sort} ${q.dir}`),
  ]
}

export interface LedgerExport {
  filename: string
  /** Writes the workbook to `out` and ends it. */
  write(out: Writable): Promise<void>
}

/** `costs`: whether the caller may see costs (the unit cost and value columns are left out otherwise). */
export async function prepareLedgerExport(ds: DataSource, q: LedgerExportQuery, costs: boolean, limit = EXPORT_LIMIT): Promise<LedgerExport> {
  const total = await countLedger(ds, q)
  if (total > limit) {
    throw AppError.badRequest('export_too_many_moves', `These filters match ${total} moves; an export holds at most ${limit}. Narrow the dates or filters.`, {
      params: { total, max: limit },
      fields: { from: problem('export_too_many_moves', { total, max: limit }) },
    })
  }
  return {
    filename: `stock-movements-${new Date().toISOString().slice(0, 10)}.xlsx`,
    write: async (out) => {
      // One statement, capped by the count before it: it reads one consistent snapshot, no paging.
      const where = ledgerWhere(q)
      const raw: LedgerSqlRow[] = await ds.query(`${LEDGER_SELECT} ${where.sql()} ORDER BY ${ledgerOrder(q)}`, where.params)
      const clock = wallClockIn(q.tz)
      const rows: MoveRow[] = raw.map((r) => ({
        ...r, wallClock: clock(new Date(r.at)),
        value: r.unit_cost === null ? null : new Decimal(r.unit_cost).times(r.qty).toDecimalPlaces(2).toNumber(),
      }))
      const title = `Stock movements${q.from || q.to ? `, ${q.from ?? '…'} to ${q.to ?? '…'}` : ''}`
      await streamXlsx(out, sheet({ name: 'Stock movements', title, columns: COLUMNS, rows, costs }), fieldsSheet({ name: 'Filters', title, fields: filterFields(q, rows.length, clock) }))
    },
  }
}
