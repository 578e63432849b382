// The guide sheet of every import template ("Columns"): each column, whether it is required, the kind of
// value it takes and what is allowed, then how many rows a file may hold.
import { sheet } from '../exports/xlsxWriter.js'
import type { ColumnKind } from './importTypes.js'

interface GuideColumn { key: string; header: string; required?: boolean; kind: ColumnKind }
interface GuideRow { header: string; required: string; kind: string; allowed: string }

const kindWord = (k: ColumnKind) => (k === 'decimal' ? 'number' : k === 'integer' ? 'whole number' : k === 'boolean' ? 'yes / no' : 'text')

export function importGuideSheet(columns: readonly GuideColumn[], allowed: (c: GuideColumn) => string, rowsNote: string) {
  const rows: GuideRow[] = columns.map((c) => ({ header: c.header, required: c.required ? 'yes' : '', kind: kindWord(c.kind), allowed: allowed(c) }))
  rows.push({ header: '(rows)', required: '', kind: '', allowed: rowsNote })
  return sheet<GuideRow>({
    name: 'Columns',
    columns: [
      { header: 'Column', kind: 'text', width: 18, value: (r) => r.header },
      { header: 'Required', kind: 'text', value: (r) => r.required },
      { header: 'Kind', kind: 'text', width: 14, value: (r) => r.kind },
      { header: 'Allowed values', kind: 'text', width: 80, value: (r) => r.allowed },
    ],
    rows,
  })
}
