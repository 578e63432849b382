// The one spreadsheet writer, read back as raw SpreadsheetML with Info-ZIP's unzip (Debian package unzip), not
// through the library that wrote it: text is a string cell however it starts, numbers and dates are numbers,
// and every sheet carries a print setup with the flag that turns fit-to-page on.
import { execFileSync } from 'node:child_process'
import { createWriteStream, mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { once } from 'node:events'
import { setFlagsFromString } from 'node:v8'
import { runInNewContext } from 'node:vm'
import { afterAll, describe, expect, it } from 'vitest'
import ExcelJS from 'exceljs'
import { buildXlsx, fieldsSheet, openSheet, sheet, streamXlsx, type SheetColumn } from '../../server/services/exports/xlsxWriter.js'

// source: OWASP "CSV Injection": the leading characters that make a spreadsheet read a cell as a formula
const HOSTILE = ['=HYPERLINK("http://example.invalid","x")', '+cmd', '-2+3 spare anchors', '@SUM(A1:A9)', '\tTab Street 4']

interface Row { text: string; qty: number; day: string; price: string }
const COLUMNS: SheetColumn<Row>[] = [
  { header: 'Text', kind: 'text', value: (r) => r.text },
  { header: 'Quantity', kind: 'integer', value: (r) => r.qty },
  { header: 'Day', kind: 'date', value: (r) => r.day },
  { header: 'Price', kind: 'money', value: (r) => r.price },
]
const ROWS: Row[] = HOSTILE.map((text, i) => ({ text, qty: 1234 + i, day: '2026-12-02', price: '19.90' }))

// A handle on V8's collector, so the memory check reads what the writer still holds rather than garbage not yet
// collected (how much of that lies around depends on the machine's load, not on the writer).
// source: Node.js documentation, v8.setFlagsFromString (flags set after start-up) and vm.runInNewContext.
setFlagsFromString('--expose-gc')
const collect = runInNewContext('gc') as () => void

const dir = mkdtempSync(path.join(tmpdir(), 'lumenyard-xlsx-'))
afterAll(() => rmSync(dir, { recursive: true, force: true }))
function part(file: string, name: string): string {
  return execFileSync('unzip', ['-p', file, name], { encoding: 'utf8', maxBuffer: 64 * 1048576 })
}
const unescape = (xml: string) => xml.replace(/&quot;/g, '"').replace(/&apos;/g, "'").replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&')

/** Every cell of sheet 1 as { type attribute, value or shared string }, by reference. */
function readCells(file: string): Map<string, { t: string | null; v: string; formula: boolean }> {
  const xml = part(file, 'xl/worksheets/sheet1.xml')
  let shared: string[] = []
  try {
    shared = [...part(file, 'xl/sharedStrings.xml').matchAll(/<si><t[^>]*>([\s\S]*?)<\/t><\/si>/g)].map((m) => unescape(m[1]))
  } catch { /* no shared strings */ }
  const cells = new Map<string, { t: string | null; v: string; formula: boolean }>()
  for (const m of xml.matchAll(/<c r="([A-Z]+\d+)"([^>]*)>([\s\S]*?)<\/c>/g)) {
    const t = /t="(\w+)"/.exec(m[2])?.[1] ?? null
    const raw = unescape(/<v>([\s\S]*?)<\/v>/.exec(m[3])?.[1] ?? '')
    cells.set(m[1], { t, v: t === 's' ? shared[Number(raw)] : raw, formula: m[3].includes('<f') })
  }
  return cells
}

async function writeBoth(): Promise<string[]> {
  const inMemory = path.join(dir, 'memory.xlsx')
  writeFileSync(inMemory, await buildXlsx(sheet({ name: 'Rows', title: 'Test & rows', columns: COLUMNS, rows: ROWS })))
  const streamed = path.join(dir, 'streamed.xlsx')
  const out = createWriteStream(streamed)
  await streamXlsx(out, sheet({ name: 'Rows', title: 'Test & rows', columns: COLUMNS, rows: ROWS }))
  if (!out.closed) await once(out, 'close')
  return [inMemory, streamed]
}

describe('spreadsheet cells', () => {
  it('writes formula-looking text as string cells, exactly as typed, with no quote in front', async () => {
    for (const file of await writeBoth()) {
      const cells = readCells(file)
      HOSTILE.forEach((text, i) => {
        const c = cells.get(`A${i + 2}`)!
        // source: ECMA-376 Part 1, cell type "s" (shared string): a string cell is never evaluated; only <f> is a formula
        expect(c, `${file} A${i + 2}`).toEqual({ t: 's', v: text, formula: false })
      })
      for (const c of cells.values()) expect(c.formula).toBe(false)
    }
  })

  it('writes numbers as numbers and days as date serials', async () => {
    for (const file of await writeBoth()) {
      const cells = readCells(file)
      expect(cells.get('B2')).toEqual({ t: null, v: '1234', formula: false })
      expect(cells.get('D2')).toEqual({ t: null, v: '19.9', formula: false })
      // source: ECMA-376 Part 1, 1900 date system — serial 45658 is 2025-01-01 (from memory); 2026-12-02 is 700 days later
      expect(cells.get('C2')).toEqual({ t: null, v: String(45658 + 700), formula: false })
    }
  })

  it('drops characters XML does not allow, so the file opens without repair', async () => {
    const file = path.join(dir, 'controls.xlsx')
    writeFileSync(file, await buildXlsx(fieldsSheet({ name: 'F', fields: [{ label: 'Note', kind: 'text', value: 'bell\u0007 and form feed\u000C kept out' }] })))
    // source: XML 1.0 §2.2 (Char excludes C0 controls other than tab, LF, CR)
    expect(readCells(file).get('B1')).toMatchObject({ t: 's', v: 'bell and form feed kept out' })
  })
})

describe('print setup', () => {
  it('turns fit-to-page on, one page wide, repeats the header row and names the document in the page header', async () => {
    for (const file of await writeBoth()) {
      const xml = part(file, 'xl/worksheets/sheet1.xml')
      // source: ECMA-376 Part 1, sheetPr/pageSetUpPr@fitToPage: without it fitToWidth and fitToHeight are ignored
      expect(xml).toContain('<pageSetUpPr fitToPage="1"/>')
      expect(xml).toMatch(/<pageSetup [^>]*fitToWidth="1"[^>]*fitToHeight="0"/)
      // source: ECMA-376 Part 1, header and footer codes: &L left section, && a literal ampersand
      expect(unescape(/<oddHeader>([\s\S]*?)<\/oddHeader>/.exec(xml)![1])).toContain('Test && rows')
      // source: ECMA-376 Part 1, defined name _xlnm.Print_Titles (rows repeated at the top of each page)
      expect(unescape(part(file, 'xl/workbook.xml'))).toContain(`<definedName name="_xlnm.Print_Titles" localSheetId="0">'Rows'!$1:$1</definedName>`)
    }
  })
})

describe('long streamed sheets', () => {
  it('keep memory bounded while compressing lags, and every row keeps its column’s number format', async () => {
    const file = path.join(dir, 'long.xlsx')
    const out = createWriteStream(file)
    const book = new ExcelJS.stream.xlsx.WorkbookWriter({ stream: out, useStyles: true, useSharedStrings: false })
    const long = openSheet<number>(book, {
      name: 'Moves',
      columns: [
        { header: 'Move', kind: 'integer', value: (n) => n },
        { header: 'SKU', kind: 'text', value: (n) => `GB-${n % 997}` },
        { header: 'Unit cost', kind: 'cost', value: (n) => `${n % 50}.2500` },
        { header: 'At', kind: 'datetime', value: (n) => new Date(Date.UTC(2026, 0, 1) + n * 30_000) },
        { header: 'Type', kind: 'text', value: (n) => (n % 2 ? 'receipt' : 'issue') },
        { header: 'Bin', kind: 'text', value: (n) => `A-${String(n % 40).padStart(2, '0')}-${n % 5}` },
        { header: 'Quantity', kind: 'integer', value: (n) => (n % 2 ? 12 : -12) },
        { header: 'Note', kind: 'text', value: (n) => (n % 7 ? null : 'Counted again after the pallet was moved') },
      ],
    })
    const ROWS_WRITTEN = 100_000
    // What the process still holds once collected: the JS heap and the buffers outside it (zip chunks, file writes).
    const live = () => {
      collect()
      const m = process.memoryUsage()
      return m.heapUsed + m.external
    }
    const before = live()
    let peak = before
    for (let n = 1; n <= ROWS_WRITTEN; n++) {
      long.add(n)
      if (n % 200 === 0) await long.room()
      if (n % 5000 === 0) {
        peak = Math.max(peak, live())
      }
      if (n % 1000 === 0) await new Promise((resolve) => setImmediate(resolve))
    }
    long.done()
    await book.commit()
    if (!out.writableFinished) await once(out, 'finish')
    // common practice: a streamed writer holds a window of the file, not the file (these rows' XML runs to tens of megabytes).
    expect((peak - before) / 1048576).toBeLessThan(6)

    // Read back with unzip: the last row's cost cell has the same style as the first row's, and that style's
    // number format is the cost format (source: ECMA-376 Part 1, c@s indexes cellXfs, xf@numFmtId numFmts).
    const xml = part(file, 'xl/worksheets/sheet1.xml')
    const styleOf = (ref: string) => new RegExp(`<c r="${ref}" s="(\\d+)"`).exec(xml)?.[1]
    expect(styleOf('C2')).toBeDefined()
    expect(styleOf(`C${ROWS_WRITTEN + 1}`)).toBe(styleOf('C2'))
    const styles = part(file, 'xl/styles.xml')
    const xfs = [.../<cellXfs[^>]*>([\s\S]*?)<\/cellXfs>/.exec(styles)![1].matchAll(/<xf [^>]*numFmtId="(\d+)"/g)].map((m) => m[1])
    const fmtId = xfs[Number(styleOf('C2'))]
    expect(new RegExp(`<numFmt numFmtId="${fmtId}" formatCode="#,##0.0000"/>`).test(styles)).toBe(true)
  }, 60_000)
})
