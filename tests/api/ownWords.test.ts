// Lumenyard's own words: two phrases that belong to others never come back — not in the screens' messages
// (English and Spanish), not in the demo data, not in a spreadsheet export (file names, sheet names, cells).
// The exports are read as raw SpreadsheetML with Info-ZIP's unzip (Debian package unzip).
import { execFileSync } from 'node:child_process'
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'

// The screen that lists stock moves is "Stock movements"; the made-to-order base is a "shower base for tiling".
const OLD_PHRASES = [/stock[\s_-]*ledger/i, /ready[\s_-]*for[\s_-]*tile/i]
const oldPhraseIn = (text: string) => OLD_PHRASES.filter((re) => re.test(text)).map((re) => re.exec(text)![0])

let h: ApiHarness
beforeAll(async () => { h = await startApiHarness() })
afterAll(() => h?.close())

function strings(value: unknown, at: string, out: [string, string][] = []): [string, string][] {
  if (typeof value === 'string') out.push([at, value])
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) strings(v, `${at}.${k}`, out)
  return out
}

describe('the messages', () => {
  it('hold neither phrase in any language, and the screen keeps its new name', async () => {
    const root = path.resolve(import.meta.dirname, '../../src/i18n')
    const all: [string, string][] = []
    for (const lang of readdirSync(root).filter((d) => !d.includes('.'))) {
      for (const file of readdirSync(path.join(root, lang)).filter((f) => f.endsWith('.ts'))) {
        const mod = (await import(path.join(root, lang, file))) as { default: unknown }
        strings(mod.default, `${lang}/${file.replace('.ts', '')}`, all)
      }
    }
    expect(all.length).toBeGreaterThan(500)
    expect(all.filter(([, text]) => oldPhraseIn(text).length)).toEqual([])
    const find = (key: string) => all.find(([k]) => k === key)?.[1]
    expect(find('en/stock.ledger.title')).toBe('Stock movements')
    expect(find('es/stock.ledger.title')).toBe('Libro de movimientos')
    expect(find('en/counter.showerBase')).toBe('Shower base for tiling, made to order')
  })
})

describe('the demo data', () => {
  it('holds neither phrase in any text column of any table', async () => {
    const columns: { t: string; c: string }[] = await h.ds.query(
      `SELECT TABLE_NAME AS t, COLUMN_NAME AS c FROM information_schema.COLUMNS
        WHERE TABLE_SCHEMA = DATABASE() AND DATA_TYPE IN ('char', 'varchar', 'text', 'mediumtext', 'longtext', 'json')`,
    )
    expect(columns.length).toBeGreaterThan(50)
    const hits: string[] = []
    for (const { t, c } of columns) {
      const [row] = await h.ds.query(
        `SELECT COUNT(*) AS n FROM \`${t}\` WHERE \`${c}\` REGEXP ? OR \`${c}\` REGEXP ?`,
        ['(?i)stock[[:space:]_-]*ledger', '(?i)ready[[:space:]_-]*for[[:space:]_-]*tile'],
      )
      if (Number(row.n) > 0) hits.push(`${t}.${c}: ${row.n}`)
    }
    expect(hits).toEqual([])
    // the demo still sells its made-to-order bases, under the new words
    const [bases] = await h.ds.query(`SELECT COUNT(*) AS n FROM items WHERE made_to_order = 1 AND name LIKE 'Shower base for tiling, made to order%'`)
    expect(Number(bases.n)).toBeGreaterThanOrEqual(5)
  })
})

describe('the exports', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'lumenyard-words-'))
  async function fetchFile(agent: supertest.Agent, url: string): Promise<{ name: string; text: string }> {
    const res = await agent.get(url).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = []
      r.on('data', (c: Buffer) => chunks.push(c))
      r.on('end', () => done(null, Buffer.concat(chunks)))
    })
    expect(res.status, url).toBe(200)
    const name = /filename="([^"]+)"/.exec(res.headers['content-disposition'])![1]
    const file = path.join(dir, name)
    writeFileSync(file, res.body as Buffer)
    return { name, text: execFileSync('unzip', ['-p', file], { encoding: 'utf8', maxBuffer: 64 << 20 }) }
  }

  it('hold neither phrase in file names, sheet names or cells', async () => {
    const admin = await h.as('admin')
    const [bill] = await h.ds.query(
      `SELECT b.id FROM boms b JOIN bom_lines l ON l.bom_id = b.id AND l.made_to_order = 1 ORDER BY b.id LIMIT 1`,
    )
    expect(bill, 'the demo has a bill with a shower base').toBeDefined()
    const [demoWarehouse] = await h.ds.query("SELECT id FROM warehouses WHERE code = 'HRY'")
    expect(demoWarehouse, 'the demo has its main warehouse').toBeDefined()
    const files = [
      await fetchFile(admin, '/api/items/export.xlsx'),
      await fetchFile(admin, `/api/boms/${bill.id}/export`),
      // One demo warehouse's last 20 days: other test files' own warehouses (an import test writes 22,000 opening
      // moves in one) would take the whole ledger past an export's 20,000 moves.
      await fetchFile(admin, `/api/stock/ledger/export?warehouseId=${demoWarehouse.id}&from=${new Date(Date.now() - 20 * 86_400_000).toISOString().slice(0, 10)}`),
    ]
    for (const f of files) expect([f.name, ...oldPhraseIn(f.text)], f.name).toEqual([f.name])
    expect(files[2].name).toMatch(/^stock-movements-\d{4}-\d{2}-\d{2}\.xlsx$/)
    expect(files[2].text).toContain('name="Stock movements"')
    // the renamed words reach the bill: the base's line and the wet-area caution
    expect(files[1].text).toContain('shower base for tiling')
    expect(files[0].text).toContain('Shower base for tiling, made to order')
    rmSync(dir, { recursive: true, force: true })
  })
})
