// A Spanish-speaking administrator's everything-out zip: its README workbook describes every column, file and
// table left out in Spanish, with no English description left, while column and file names stay as the imports
// read them; and the import templates they download say in Spanish what each column takes. Against the real
// database through the download routes.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type ExcelJS from 'exceljs'
import { EXPORT_PARTS } from '../../server/services/exports/businessExport.js'
import { LEFT_OUT } from '../../server/services/exports/recordParts.js'
import { README_SPANISH } from '../../server/services/exports/readmeWords.js'
import { DATA_IMPORT_GUIDES, DATA_IMPORTS } from '../../server/services/imports/dataImportKinds.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { download, loadWorkbook, unzipEntries } from '../support/downloads.js'

let h: ApiHarness
let readme: ExcelJS.Workbook
let agent: Awaited<ReturnType<ApiHarness['as']>>

beforeAll(async () => {
  h = await startApiHarness()
  // An administrator of their own whose language is Spanish (the shared admin stays English for other tests).
  agent = await h.as('admin', 'buyer')
  await h.ds.query("UPDATE users SET locale = 'es' WHERE username = 't-admin-buyer'")
  const res = await download(agent, '/api/business-export')
  expect(res.status).toBe(200)
  readme = await loadWorkbook((await unzipEntries(res.body as Buffer)).get('README.xlsx')!)
}, 120_000)
afterAll(() => h?.close())

/** A sheet's rows below its header, as text cells by column number. */
const rowsOf = (name: string, book = readme) => {
  const ws = book.getWorksheet(name)
  expect(ws, name).toBeDefined()
  const rows: string[][] = []
  ws!.eachRow((row, n) => {
    const cells = row.values as ExcelJS.CellValue[]
    if (n > 1) rows.push(Array.from({ length: ws!.columnCount }, (_, i) => (cells[i + 1] === null || cells[i + 1] === undefined ? '' : String(cells[i + 1]))))
  })
  return rows
}
// Words no Spanish sentence has; an English description left behind has some of them. File names (which stay
// as they are: stock-on-the-way.xlsx) are taken out first.
const ENGLISH = /\b(the|of|and|when|which|from|with|its|what|where|who|per)\b/i
const prose = (text: string) => text.replace(/[\w-]+\.xlsx/g, '')

describe("a Spanish administrator's everything-out README", () => {
  it('describes every column of every file in Spanish, names and codes unchanged', () => {
    const rows = rowsOf('Columnas')
    const english = new Set(EXPORT_PARTS.flatMap((p) => p.columns.map((c) => c.about)))
    for (const p of EXPORT_PARTS) {
      for (const c of p.columns) {
        const row = rows.find((r) => r[0] === `${p.file}.xlsx` && r[2] === c.header)
        expect(row, `${p.file}: ${c.header}`).toBeDefined()
        const [, sheet, , meaning, allowed] = row!
        expect(sheet).toBe(p.sheet)
        expect(english.has(meaning), `${p.file}: ${c.header}: ${meaning}`).toBe(false)
        expect(prose(meaning), `${p.file}: ${c.header}`).not.toMatch(ENGLISH)
        expect(meaning).toBe(README_SPANISH[c.about])
        if (c.values) expect(allowed).toBe(`Uno de: ${c.values.join(', ')}.`) // the codes as the file holds them
        else expect(prose(allowed), `${p.file}: ${c.header}: ${allowed}`).not.toMatch(ENGLISH)
      }
    }
    expect(rows.length).toBe(EXPORT_PARTS.reduce((n, p) => n + p.columns.length, 0))
  })

  it('describes every file and every table left out in Spanish', () => {
    const files = rowsOf('Archivos')
    expect(files.map((r) => r[0])).toEqual(EXPORT_PARTS.map((p) => `${p.file}.xlsx`))
    for (const [file, , holds, readBack] of files) {
      expect(prose(holds), file).not.toMatch(ENGLISH)
      expect(prose(readBack), file).not.toMatch(ENGLISH)
    }
    const leftOut = rowsOf('Excluido')
    expect(leftOut.map((r) => r[0])).toEqual(LEFT_OUT.map((l) => l.table))
    for (const [table, why] of leftOut) expect(prose(why), table).not.toMatch(ENGLISH)
  })

  it('gives every import template a guide sheet in Spanish, the column names as the import reads them', async () => {
    for (const [kind, { guide }] of Object.entries(DATA_IMPORT_GUIDES)) {
      const res = await download(agent, `/api/imports/${kind}/template.xlsx`)
      expect(res.status, kind).toBe(200)
      const rows = rowsOf('Columnas', await loadWorkbook(res.body as Buffer))
      const spec = DATA_IMPORTS[kind as keyof typeof DATA_IMPORTS].spec
      expect(rows.map((r) => r[0]), kind).toEqual([...spec.columns.map((c) => c.header), '(filas)'])
      for (const [header, , , allowed] of rows) {
        const english = guide[spec.columns.find((c) => c.header === header)?.key ?? '']
        if (english) expect(allowed, `${kind}: ${header}`).toBe(README_SPANISH[english])
        expect(prose(allowed), `${kind}: ${header}: ${allowed}`).not.toMatch(ENGLISH)
      }
    }
  })
})
