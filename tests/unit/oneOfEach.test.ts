// One of each: the client makes Idempotency-Key values in one place, the server reads the header in one place
// (the stock-request runner, which hands it to the idempotency service), and every spreadsheet export opens its workbook through
// the one writer (server/services/exports/xlsxWriter.ts). A second maker or a hand-built workbook fails here.
// source: common practice (one rule, one place; a copied key maker once fell back to Math.random)
import { readdirSync, readFileSync } from 'node:fs'
import { join, relative } from 'node:path'
import { describe, expect, it } from 'vitest'

const ROOT = join(import.meta.dirname, '../..')
const sources = (dir: string) =>
  readdirSync(join(ROOT, dir), { withFileTypes: true, recursive: true })
    .filter((e) => e.isFile() && /\.(ts|vue)$/.test(e.name))
    .map((e) => join(e.parentPath, e.name))
    .map((path) => ({ path: relative(ROOT, path), text: readFileSync(path, 'utf8').replace(/\/\*[\s\S]*?\*\//g, '').replace(/^\s*\/\/.*$/gm, '') }))

const using = (files: { path: string; text: string }[], re: RegExp) => files.filter((f) => re.test(f.text)).map((f) => f.path).sort()

describe('one of each', () => {
  it('one Idempotency-Key maker on the client', () => {
    const KEY_MAKING = /\brandomUUID\b|\bgetRandomValues\b/
    expect(KEY_MAKING.test('const k = crypto.randomUUID()')).toBe(true)
    expect(using(sources('src'), KEY_MAKING)).toEqual(['src/api/idempotencyKey.ts'])
  })

  it("the server reads the Idempotency-Key header in one place", () => {
    const READS_KEY = /\.get\(\s*'idempotency-key'\s*\)/i
    expect(READS_KEY.test("req.get('idempotency-key')")).toBe(true)
    expect(using([...sources('server/routes'), ...sources('server/services'), ...sources('server/http')], READS_KEY)).toEqual(['server/http/stockRequest.ts'])
  })

  it('every workbook is opened by the one spreadsheet writer', () => {
    const OPENS_BOOK = /new ExcelJS\.(Workbook|stream\.xlsx\.WorkbookWriter)\(/
    expect(OPENS_BOOK.test('new ExcelJS.stream.xlsx.WorkbookWriter({ stream })')).toBe(true)
    expect(using(sources('server'), OPENS_BOOK)).toEqual(['server/services/exports/xlsxWriter.ts'])
  })

  it('every number a person types goes through the one number field, never the component library\'s clamping box', () => {
    // source: common practice (a field that silently turns 0 into 1 or 1e9 into its maximum sends a number no one typed)
    const LIBRARY_NUMBER_BOX = /<el-input-number\b|\bElInputNumber\b/
    expect(LIBRARY_NUMBER_BOX.test('<el-input-number v-model="qty" :min="1" />')).toBe(true)
    expect(using(sources('src'), LIBRARY_NUMBER_BOX)).toEqual([])
  })
})
