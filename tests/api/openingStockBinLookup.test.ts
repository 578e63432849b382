// The opening-stock check looks up the bins a chunk of rows names through the bins' unique key (warehouse, code),
// so its cost follows the chunk, not the number of bins the business has: every statement the check sends about
// bins is read with EXPLAIN against the real MariaDB, over a warehouse of 3,000 bins. A code missing from its
// row's warehouse is still found in the warehouse that has it, for the row's message.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openingStockImport } from '../../server/services/imports/openingStockImport.js'
import type { ImportRow } from '../../server/services/imports/importTypes.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { tagOf } from '../support/fixtureRows.js'
import { createOpeningStockTarget, createWarehouse } from '../support/stockFixtures.js'

let h: ApiHarness
const tag = tagOf()
const SKU = `BL-BLK-${tag}`
const BIG = `BL${tag}`
const SMALL = `BS${tag}`
const BINS = 3_000
/** A bin code no other test's warehouse has. */
const OWN_BIN = `S-${tag}`

beforeAll(async () => {
  h = await startApiHarness()
  await createOpeningStockTarget(h.ds, SKU, SMALL) // the item, and warehouse SMALL with its one bin A-01-1
  await h.ds.query("INSERT INTO bins (warehouse_id, code, kind) SELECT id, ?, 'storage' FROM warehouses WHERE code = ?", [OWN_BIN, SMALL])
  const big = await createWarehouse(h.ds, BIG, [])
  // A yard of many bins: a lookup by code alone would read them all (seq_1_to_n is MariaDB's sequence engine).
  await h.ds.query(`INSERT INTO bins (warehouse_id, code, kind) SELECT ?, CONCAT('R-', LPAD(seq, 5, '0')), 'storage' FROM seq_1_to_${BINS}`, [big.id])
  await h.ds.query('ANALYZE TABLE bins')
})
afterAll(() => h?.close())

const row = (n: number, warehouse: string, bin: string): ImportRow => ({
  row: n, values: { sku: SKU, warehouse, bin, lot: `L-${n}`, quantity: '8', unitCost: '2.5000' },
})

/** Runs the check of these rows, keeping every statement it sends (and its values). */
async function checkRows(rows: ImportRow[]) {
  const sent: { sql: string; params: unknown[] }[] = []
  const em = new Proxy(h.ds.manager, {
    get(target, key, receiver) {
      if (key !== 'query') return Reflect.get(target, key, receiver)
      return (sql: string, params: unknown[] = []) => {
        sent.push({ sql, params })
        return target.query(sql, params)
      }
    },
  })
  const checked = await openingStockImport.checker(em, null).check({ rows, issues: [] })
  return { checked, binReads: sent.filter((s) => /^\s*SELECT\b[\s\S]*\bFROM bins\b/i.test(s.sql)) }
}

describe('opening-stock check: bin lookups', () => {
  it('reads the bins a chunk names by warehouse and code, never the whole bins table', async () => {
    const rows = [row(2, BIG, 'R-00001'), row(3, BIG, 'R-02999'), row(4, SMALL, 'A-01-1'), row(5, BIG, 'R-01500')]
    const { checked, binReads } = await checkRows(rows)
    expect(checked.map((c) => c.preview.errors)).toEqual([[], [], [], []])
    expect(binReads.length).toBeGreaterThan(0)
    for (const read of binReads) {
      // source: MariaDB's EXPLAIN documentation (mariadb.com/kb, "EXPLAIN"): access type ALL is a full table scan,
      // every row of the table read; range and ref read only the index entries that match.
      const plan: { table: string; type: string; key: string | null; rows: number }[] = await h.ds.query(`EXPLAIN ${read.sql}`, read.params)
      const bins = plan.filter((p) => p.table === 'bins')
      expect(bins.map((p) => p.type), read.sql).not.toContain('ALL')
      expect(bins.map((p) => p.key), read.sql).toEqual(['uq_bins_code'])
    }
  })

  it('still names the warehouse that holds a bin the row\'s own warehouse lacks', async () => {
    const { checked } = await checkRows([row(2, SMALL, 'R-00007'), row(3, BIG, 'Z-99-9'), row(4, BIG, OWN_BIN.toLowerCase())])
    expect(checked.map((c) => c.preview.errors.map((e) => [e.column, e.problem.code, e.problem.params]))).toEqual([
      [['Bin', 'import_bin_other_warehouse', { bin: 'R-00007', warehouse: SMALL, other: BIG }]],
      [['Bin', 'import_bin_unknown', { bin: 'Z-99-9', warehouse: BIG }]],
      // Codes match without regard to case, as the rest of the check does.
      [['Bin', 'import_bin_other_warehouse', { bin: OWN_BIN.toLowerCase(), warehouse: BIG, other: SMALL }]],
    ])
  })
})
