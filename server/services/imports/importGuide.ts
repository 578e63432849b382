// The guide sheet of every import template ("Columns"): each column, whether it is required, the kind of
// value it takes and what is allowed, then how many rows a file may hold; in the reader's language (the column
// names stay as the import reads them).
import { readmeText, readmeWord, type ReadmeLang } from '../exports/readmeWords.js'
import { sheet } from '../exports/xlsxWriter.js'
import type { ColumnKind } from './importTypes.js'

interface GuideColumn { key: string; header: string; required?: boolean; kind: ColumnKind }
interface GuideRow { header: string; required: string; kind: string; allowed: string }

const KIND_WORD = { decimal: 'kindNumber', integer: 'kindWhole', boolean: 'kindYesNo', text: 'kindText' } as const

/** `allowed` and `rowsNote` are English; each is written in `lang` through the shared dictionary. */
export function importGuideSheet(columns: readonly GuideColumn[], allowed: (c: GuideColumn) => string, rowsNote: string, lang: ReadmeLang = 'en') {
  const w = (key: Parameters<typeof readmeWord>[1]) => readmeWord(lang, key)
  const rows: GuideRow[] = columns.map((c) => ({ header: c.header, required: c.required ? w('guideYes') : '', kind: w(KIND_WORD[c.kind]), allowed: readmeText(lang, allowed(c)) }))
  rows.push({ header: w('guideRows'), required: '', kind: '', allowed: rowsNote })
  return sheet<GuideRow>({
    name: w('guideTab'),
    columns: [
      { header: w('guideColumn'), kind: 'text', width: 18, value: (r) => r.header },
      { header: w('guideRequired'), kind: 'text', value: (r) => r.required },
      { header: w('guideKind'), kind: 'text', width: 14, value: (r) => r.kind },
      { header: w('guideAllowed'), kind: 'text', width: 80, value: (r) => r.allowed },
    ],
    rows,
  })
}
