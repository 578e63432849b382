// An import's check and its commit hold a window of the file, not the file: the parent process's live memory (after
// a forced collection, sampled while it runs) grows no more for a file ten times longer. Against the real MariaDB,
// through the real parse child, with the imports' own checks and writes: opening stock checked and committed, usage
// history and contractor accounts committed.
import { setFlagsFromString } from 'node:v8'
import { runInNewContext } from 'node:vm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { accountsImport } from '../../server/services/imports/accountsImport.js'
import { commitImport, previewImport } from '../../server/services/imports/dataImports.js'
import { openingStockImport } from '../../server/services/imports/openingStockImport.js'
import { DEFAULT_PARSE_LIMITS } from '../../server/services/imports/spreadsheetParser.js'
import { usageHistoryImport } from '../../server/services/imports/usageHistoryImport.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { insertId, tagOf } from '../support/fixtureRows.js'
import { createWarehouse } from '../support/stockFixtures.js'

setFlagsFromString('--expose-gc')
const collect = runInNewContext('gc') as () => void

let h: ApiHarness
const tag = tagOf()
const SKU = `MEM-BLK-${tag}`
const WH = `M${tag}`
const SMALL = 2_000
const LARGE = 10 * SMALL
/** Items a usage file names: ten per file, each with a day of use per row (so every row is its own key). */
const usageSku = (file: string, i: number) => `MEM-U${file}${i}-${tag}`
let userId = 0

beforeAll(async () => {
  h = await startApiHarness()
  userId = (await h.user(`t-memory-${tag}`, ['admin'])).id
  await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost, case_qty, match_lot) VALUES (?, 'Test clear 8x8 block', 'glass_block', 'each', 0, 8, 1)", [SKU])
  for (const file of ['S', 'L']) {
    for (let i = 0; i < 10; i++) await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test grout', 'grout', 'bag', 0)", [usageSku(file, i)])
  }
  await createWarehouse(h.ds, WH, ['A-01-1'])
})
afterAll(() => h?.close())

/** An opening-stock sheet of `rows` good rows: one item and bin, a lot of its own per row (`run` tells files apart). */
const sheetOf = (rows: number, run = 'RUN') => Buffer.from(['SKU,Warehouse,Bin,Lot,Quantity,Unit cost',
  ...Array.from({ length: rows }, (_, i) => `${SKU},${WH},A-01-1,${run}-${String(i).padStart(6, '0')},${(i % 40) + 1},${(i % 9) + 1}.2500`)].join('\r\n'), 'utf8')

/** A usage-history sheet of `rows` good rows: ten items of the file's own, a past day of use per row each. */
const usageOf = (rows: number, file: string) => Buffer.from(['SKU,Warehouse,Day,Month,Quantity used',
  ...Array.from({ length: rows }, (_, i) => {
    const day = new Date(Date.UTC(2019, 0, 1) + Math.floor(i / 10) * 86_400_000).toISOString().slice(0, 10)
    return `${usageSku(file, i % 10)},${WH},${day},,${(i % 7) + 1}`
  })].join('\r\n'), 'utf8')

/** A contractor accounts sheet of `rows` new accounts with a contact each. */
const accountsOf = (rows: number, file: string) => Buffer.from(['Account code,Name,Contact,E-mail,Phone',
  ...Array.from({ length: rows }, (_, i) => `M${file}${tag}-${i},Test mason ${i},Contact ${i},mason${i}@example.test,555-01${String(i % 100).padStart(2, '0')}`)].join('\r\n'), 'utf8')

/** What the process still holds once collected: the JS heap and the buffers outside it. */
const live = () => {
  collect()
  const m = process.memoryUsage()
  return m.heapUsed + m.external
}

/** How far the live memory rose above where it stood before, at its highest, while `work` ran; and its answer. */
async function growthOf<T>(work: () => Promise<T>): Promise<{ answer: T; growth: number }> {
  const before = live()
  let peak = before
  const sampler = setInterval(() => { peak = Math.max(peak, live()) }, 250)
  try {
    const answer = await work()
    peak = Math.max(peak, live())
    return { answer, growth: peak - before }
  } finally {
    clearInterval(sampler)
  }
}

/** The parse child's own time limit is for an upload on a quiet server; here it reads while the test collects often. */
const PATIENT = { limits: { ...DEFAULT_PARSE_LIMITS, timeoutMs: 300_000 } }
const preview = (data: Buffer) => growthOf(() => previewImport(h.ds, openingStockImport, { kind: 'csv', filename: 'opening.csv', data }, undefined, PATIENT))
const commit = <W>(def: Parameters<typeof commitImport<W>>[2], data: Buffer, filename: string) =>
  growthOf(() => commitImport(h.ds, { userId }, def, { kind: 'csv', filename, data }, undefined, PATIENT))

/**
 * common practice: a streamed pipeline's memory follows its window, not the file. The extra rows of the larger file
 * may add what a repeated-row check keeps per row and the upload itself, no more. Per row that is a short key in a
 * Set: the string, its hash-table entry and the table's growth slack, up to about 300 bytes in V8 (from memory).
 * The code that held every write of the file grew 11.6 MB more for the larger file, against 7.4 MB allowed here;
 * the streamed commit grows 5.4–5.9 MB more.
 */
function expectBounded(label: string, small: number, large: number, upload: Buffer) {
  console.log(`import memory, ${label}: ${SMALL} rows +${(small / 1e6).toFixed(1)} MB, ${LARGE} rows +${(large / 1e6).toFixed(1)} MB`)
  expect(large - small, label).toBeLessThan((LARGE - SMALL) * 300 + 2 * upload.length)
}

/**
 * One kind committed at both sizes, from files told apart by `small` and `large`: each wrote every row (`written`
 * reads the count from its summary) and the larger held no more than its window allows.
 */
async function commitsBounded<W>(label: string, def: Parameters<typeof commitImport<W>>[2], fileOf: (rows: number, file: string) => Buffer,
  [small, large]: [string, string], written: (summary: Record<string, number> | null | undefined) => number | undefined) {
  const a = await commit(def, fileOf(SMALL, small), `${label}-small.csv`)
  const b = await commit(def, fileOf(LARGE, large), `${label}-large.csv`)
  expect([written(a.answer.record.summary), written(b.answer.record.summary)]).toEqual([SMALL, LARGE])
  expectBounded(`${label} commit`, a.growth, b.growth, fileOf(LARGE, large))
}

describe('import memory', () => {
  it('checks a file ten times longer without holding ten times as much', async () => {
    const small = await preview(sheetOf(SMALL))
    const large = await preview(sheetOf(LARGE))
    // Every row was read and checked in both: all good, none skipped.
    expect([small.answer.ready, small.answer.errorRows]).toEqual([SMALL, 0])
    expect([large.answer.ready, large.answer.errorRows]).toEqual([LARGE, 0])
    expectBounded('opening stock check', small.growth, large.growth, sheetOf(LARGE))
  }, 300_000)

  it('commits opening stock ten times longer without holding its writes', async () => {
    // Every row was written in both: one line per row.
    await commitsBounded('opening stock', openingStockImport, sheetOf, ['CS', 'CL'], (s) => s?.lines)
  }, 600_000)

  it('commits usage history and accounts ten times longer without holding their rows', async () => {
    await commitsBounded('usage history', usageHistoryImport, usageOf, ['S', 'L'], (s) => s?.lines)
    await commitsBounded('accounts', accountsImport, accountsOf, ['S', 'L'], (s) => s?.accounts)
  }, 600_000)
})
