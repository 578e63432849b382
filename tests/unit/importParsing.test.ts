// Reading uploaded spreadsheets: CSV by the rules of RFC 4180 §2, header matching and typed cells,
// and .xlsx cells of the kinds exceljs reads.
import ExcelJS from 'exceljs'
import { describe, expect, it } from 'vitest'
import { readCsv } from '../../server/services/imports/csvText.js'
import type { ImportSpec } from '../../server/services/imports/importTypes.js'
import { parseXlsxRows, rowsFromRecords } from '../../server/services/imports/sheetRows.js'

const SPEC: ImportSpec = {
  columns: [
    { key: 'sku', header: 'SKU', kind: 'text', required: true },
    { key: 'qty', header: 'Case qty', kind: 'integer' },
    { key: 'cost', header: 'Cost', kind: 'decimal', required: true },
    { key: 'active', header: 'Active', kind: 'boolean' },
  ],
  ignore: ['On hand'],
  maxRows: 3,
  maxColumns: 10,
}

describe('CSV (RFC 4180)', () => {
  it('reads quoted fields holding delimiters, line breaks and doubled quotes', () => {
    // source: RFC 4180 §2 rules 5–7 (fields in double quotes may hold commas, CRLF, and "" for a quote)
    const csv = 'a,b,c\r\n"x, y","line\r\nbreak","say ""hi"""\r\nlast,,row'
    expect(readCsv(csv, { maxRecords: 10, maxFields: 5 })).toEqual({
      ok: true, truncated: false, records: [['a', 'b', 'c'], ['x, y', 'line\r\nbreak', 'say "hi"'], ['last', '', 'row']],
    })
  })

  it('guesses semicolons, stops at the record cap and refuses an unterminated quote', () => {
    expect(readCsv('a;b\n1;2\n', { maxRecords: 10, maxFields: 5 })).toMatchObject({ records: [['a', 'b'], ['1', '2']] })
    expect(readCsv('a\n1\n2\n3\n', { maxRecords: 2, maxFields: 5 })).toMatchObject({ ok: true, truncated: true, records: [['a'], ['1']] })
    expect(readCsv('a\n"open', { maxRecords: 10, maxFields: 5 })).toMatchObject({ ok: false })
    expect(readCsv('a,b,c\n', { maxRecords: 10, maxFields: 2 })).toMatchObject({ ok: false })
  })
})

describe('header matching and cell types', () => {
  const rec = (row: number, ...cells: (string | number | boolean | null)[]) => ({ row, cells })

  it('matches headers ignoring case and spacing, skips ignored columns and types each cell', () => {
    const out = rowsFromRecords([rec(1, 'sku', 'CASE QTY', 'cost', 'on hand', 'active'), rec(2, 'A-1', '8', 0.1 + 0.2, 99, 'yes')], SPEC)
    expect(out).toEqual({ ok: true, sheet: { rows: [{ row: 2, values: { sku: 'A-1', qty: 8, cost: '0.3', active: true } }], issues: [] } })
  })

  it('reports text in number cells per row and column', () => {
    const out = rowsFromRecords([rec(1, 'SKU', 'Case qty', 'Cost'), rec(2, 'A-1', 'a dozen', 'twelve'), rec(3, '', '2.5', '1')], SPEC)
    expect(out.ok && out.sheet.issues).toEqual([
      { row: 2, column: 'qty', problem: { code: 'cell_whole_number', params: { text: 'a dozen' } } },
      { row: 2, column: 'cost', problem: { code: 'cell_number', params: { text: 'twelve' } } },
      { row: 3, column: 'sku', problem: { code: 'required' } },
      { row: 3, column: 'qty', problem: { code: 'cell_whole_number', params: { text: '2.5' } } },
    ])
  })

  it('refuses missing, unknown and repeated columns, and too many rows', () => {
    const bad = rowsFromRecords([rec(1, 'Part', 'Cost', 'Cost')], SPEC)
    expect(bad).toMatchObject({ ok: false, code: 'sheet_columns' })
    expect(!bad.ok && bad.message).toBe('The columns do not match the template (missing SKU; not known: Part, Cost (twice)).')
    expect(!bad.ok && bad.params).toEqual({ missing: ['SKU'], unknown: ['Part', 'Cost (twice)'] })
    const many = [rec(1, 'SKU', 'Cost'), ...[2, 3, 4, 5].map((r) => rec(r, `S${r}`, '1'))]
    expect(rowsFromRecords(many, SPEC)).toMatchObject({ ok: false, code: 'sheet_too_many_rows' })
  })
})

describe('.xlsx cells', () => {
  it('reads rich text, formula results, booleans and numbers from the first sheet', async () => {
    const book = new ExcelJS.Workbook()
    const sheet = book.addWorksheet('Items')
    sheet.addRow(['SKU', 'Case qty', 'Cost', 'Active'])
    sheet.addRow([{ richText: [{ text: 'GB-' }, { text: '1', font: { bold: true } }] }, { formula: '4*2', result: 8 }, 7.8, true])
    book.addWorksheet('Other').addRow(['ignored'])
    const out = await parseXlsxRows(new Uint8Array(await book.xlsx.writeBuffer()), SPEC)
    expect(out).toEqual({ ok: true, sheet: { rows: [{ row: 2, values: { sku: 'GB-1', qty: 8, cost: '7.8', active: true } }], issues: [] } })
  })
})
