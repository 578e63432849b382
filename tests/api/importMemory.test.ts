// An import's check holds a window of the file, not the file: the parent process's live memory (after a forced
// collection, sampled while the check runs) grows no more for a file ten times longer. Against the real MariaDB,
// through the real parse child, with the opening-stock import's own checks.
import { setFlagsFromString } from 'node:v8'
import { runInNewContext } from 'node:vm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { previewImport } from '../../server/services/imports/dataImports.js'
import { openingStockImport } from '../../server/services/imports/openingStockImport.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { insertId, tagOf } from '../support/fixtureRows.js'
import { createWarehouse } from '../support/stockFixtures.js'

setFlagsFromString('--expose-gc')
const collect = runInNewContext('gc') as () => void

let h: ApiHarness
const tag = tagOf()
const SKU = `MEM-BLK-${tag}`
const WH = `M${tag}`

beforeAll(async () => {
  h = await startApiHarness()
  await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost, case_qty, match_lot) VALUES (?, 'Test clear 8x8 block', 'glass_block', 'each', 0, 8, 1)", [SKU])
  await createWarehouse(h.ds, WH, ['A-01-1'])
})
afterAll(() => h?.close())

/** An opening-stock sheet of `rows` good rows: one item and bin, a lot of its own per row. */
const sheetOf = (rows: number) => Buffer.from(['SKU,Warehouse,Bin,Lot,Quantity,Unit cost',
  ...Array.from({ length: rows }, (_, i) => `${SKU},${WH},A-01-1,RUN-${String(i).padStart(6, '0')},${(i % 40) + 1},${(i % 9) + 1}.2500`)].join('\r\n'), 'utf8')

/** What the process still holds once collected: the JS heap and the buffers outside it. */
const live = () => {
  collect()
  const m = process.memoryUsage()
  return m.heapUsed + m.external
}

/** The preview of `rows` rows, and how far the live memory rose above where it stood before, at its highest. */
async function previewGrowth(rows: number): Promise<{ ready: number; errorRows: number; growth: number }> {
  const data = sheetOf(rows)
  const before = live()
  let peak = before
  const sampler = setInterval(() => { peak = Math.max(peak, live()) }, 100)
  try {
    const preview = await previewImport(h.ds, openingStockImport, { kind: 'csv', filename: 'opening.csv', data })
    peak = Math.max(peak, live())
    return { ready: preview.ready, errorRows: preview.errorRows, growth: peak - before }
  } finally {
    clearInterval(sampler)
  }
}

describe('import memory', () => {
  it('checks a file ten times longer without holding ten times as much', async () => {
    const SMALL = 2_000
    const LARGE = 10 * SMALL
    const small = await previewGrowth(SMALL)
    const large = await previewGrowth(LARGE)
    // Every row was read and checked in both: all good, none skipped.
    expect([small.ready, small.errorRows]).toEqual([SMALL, 0])
    expect([large.ready, large.errorRows]).toEqual([LARGE, 0])
    console.log(`import memory: ${SMALL} rows +${(small.growth / 1e6).toFixed(1)} MB, ${LARGE} rows +${(large.growth / 1e6).toFixed(1)} MB`)
    // common practice: a streamed pipeline's memory follows its window, not the file. The extra rows may add what
    // a repeated-row check keeps per row (a short key, under 200 bytes) and the upload itself, no more.
    expect(large.growth - small.growth).toBeLessThan((LARGE - SMALL) * 200 + 2 * sheetOf(LARGE).length)
  }, 300_000)
})
