// A commit writes a file a chunk at a time inside its one transaction, so when it looks a later chunk's rows up
// the records its earlier chunks wrote are already in the tables. They are the file's own: a key named again in a
// later chunk is a repeat of its first row, as the check (which writes nothing) reports it, never also a record
// "already in Lumenyard". For every kind of simple record the check and the commit of one file must report the
// same problems. Real MariaDB; chunks of two rows so the repeat stands in the chunk after its first row.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { AuditActor } from '../../server/services/auditService.js'
import { commitImport, previewImport, type DataImportDefinition, type ImportProgress } from '../../server/services/imports/dataImports.js'
import { DATA_IMPORTS } from '../../server/services/imports/dataImportKinds.js'
import type { DataImportKind, DataImportRow } from '../../shared/schemas/dataImports.js'
import { AppError } from '../../server/errors.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, insertId, tagOf } from '../support/fixtureRows.js'
import { createWarehouse } from '../support/stockFixtures.js'

let h: ApiHarness
let actor: AuditActor
const tag = tagOf()
const WH = `OW${tag}`
const WH2 = `OX${tag}`
const VENDOR = `OWV${tag}`
const BLK = `OW-BLK-${tag}`
const SEAL = `OW-SEAL-${tag}`
/** Two rows a chunk: rows 2 and 3 are the first chunk (written by a commit before row 4 is read), 4 and 5 the next. */
const SMALL = { chunkRows: 2 }

beforeAll(async () => {
  h = await startApiHarness()
  actor = { userId: (await h.user(`t-ownwrites-${tag}`, ['admin'])).id }
  await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test clear 8x8 block', 'glass_block', 'each', 0)", [BLK])
  await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test clear sealant', 'sealant', 'tube', 0)", [SEAL])
  await createWarehouse(h.ds, WH, [])
  await createWarehouse(h.ds, WH2, [])
  await h.ds.query('INSERT INTO vendors (code, name) VALUES (?, ?)', [VENDOR, `Test glassworks ${tag}`])
})
afterAll(() => h?.close())

const csv = (...lines: string[]) => ({ kind: 'csv' as const, filename: `own-${tag}-${Math.random()}.csv`, data: Buffer.from(lines.join('\r\n') + '\r\n', 'utf8') })

/** Every problem a pass found, as [row, column, code, params], through the same hook the run's problem store uses. */
function collector() {
  const found: [number, string | null, string, unknown][] = []
  const progress: ImportProgress = {
    read: () => undefined, checked: () => undefined, written: () => undefined,
    problems: { runId: 'test', add: async (rows: readonly DataImportRow[]) => { for (const r of rows) for (const e of r.errors) found.push([r.row, e.column, e.problem.code, e.problem.params ?? null]) } },
  }
  return { found, progress }
}

/**
 * Each kind's file: rows 2 and 3 good, row 4 naming row 2's record again, row 5 (where there is one) good.
 */
const CASES: { kind: DataImportKind; table: string; where: string; lines: () => string[] }[] = [
  { kind: 'warehouses', table: 'warehouses', where: `code LIKE 'OW${tag}_'`, lines: () => ['Code,Name', `${WH}A,Test yard A`, `${WH}B,Test yard B`, `${WH}A,Test yard A again`, `${WH}C,Test yard C`] },
  { kind: 'bins', table: 'bins b JOIN warehouses w ON w.id = b.warehouse_id', where: `w.code = '${WH}'`, lines: () => ['Warehouse,Bin', `${WH},A-01-1`, `${WH},A-01-2`, `${WH},A-01-1`, `${WH},A-01-3`] },
  { kind: 'price_levels', table: 'price_levels', where: `code LIKE 'OWL${tag}-_'`, lines: () => ['Code,Name', `OWL${tag}-1,Test trade one`, `OWL${tag}-2,Test trade two`, `OWL${tag}-1,Test trade one again`, `OWL${tag}-3,Test trade three`] },
  { kind: 'price_rules', table: 'price_rules r JOIN items i ON i.id = r.item_id', where: `i.sku IN ('${BLK}', '${SEAL}')`, lines: () => ['SKU,From quantity,Price', `${BLK},1,2.00`, `${BLK},10,1.80`, `${BLK},1,1.90`, `${SEAL},1,6.00`] },
  { kind: 'vendors', table: 'vendors', where: `code LIKE 'OWN${tag}-_'`, lines: () => ['Vendor code,Name', `OWN${tag}-1,Test works one`, `OWN${tag}-2,Test works two`, `OWN${tag}-1,Test works one again`, `OWN${tag}-3,Test works three`] },
  {
    kind: 'reorder_settings', table: 'reorder_policies p JOIN items i ON i.id = p.item_id', where: `i.sku IN ('${BLK}', '${SEAL}')`,
    lines: () => ['Applies to,SKU,Warehouse,Service level', `item_warehouse,${BLK},${WH},0.95`, `item_warehouse,${SEAL},${WH},0.95`, `item_warehouse,${BLK},${WH},0.9`, `item_warehouse,${BLK},${WH2},0.9`],
  },
  {
    kind: 'lead_times', table: 'lead_time_history h JOIN items i ON i.id = h.item_id', where: `i.sku IN ('${BLK}', '${SEAL}')`,
    lines: () => ['Vendor code,SKU,Order number,Lead time days', `${VENDOR},${BLK},P-1,12`, `${VENDOR},${SEAL},P-1,12`, `${VENDOR},${BLK},P-1,14`, `${VENDOR},${BLK},P-2,9`],
  },
  { kind: 'sales_tax', table: 'sales_tax_rates t JOIN warehouses w ON w.id = t.warehouse_id', where: `w.code IN ('${WH}', '${WH2}')`, lines: () => ['Warehouse,Rate percent', `${WH},8.25`, `${WH2},7.5`, `${WH},8`] },
  {
    kind: 'averages', table: 'item_warehouses iw JOIN items i ON i.id = iw.item_id', where: `i.sku IN ('${BLK}', '${SEAL}')`,
    lines: () => ['SKU,Warehouse,Average cost,Manual minimum', `${BLK},${WH},2.50,10`, `${SEAL},${WH},3.10,5`, `${BLK},${WH},2.50,10`, `${SEAL},${WH2},3.10,4`],
  },
]

describe('a record a commit wrote in an earlier chunk', () => {
  it.each(CASES)('is named again in a later chunk of a $kind file as a repeat only, as the check names it', async ({ kind, table, where, lines }) => {
    const def = DATA_IMPORTS[kind] as DataImportDefinition<unknown>
    const file = csv(...lines())
    const before = await countRows(h.ds, table, where)
    const check = collector()
    await previewImport(h.ds, def, file, check.progress, SMALL)
    const commit = collector()
    const err = await commitImport(h.ds, actor, def, file, commit.progress, SMALL).then(() => null, (e: unknown) => e)
    expect(err).toBeInstanceOf(AppError)
    expect((err as AppError).code).toBe('import_invalid')
    // Worked by hand from the file: row 4 names row 2's record again, and nothing else in it is wrong (the rest
    // are new records). The repeat is reported on the row as a whole, naming the row it repeats.
    expect(check.found).toEqual([[4, null, 'import_row_repeated', { row: 2 }]])
    expect(commit.found).toEqual(check.found)
    // The commit rolled back whole: the first chunk's records are gone again.
    expect(await countRows(h.ds, table, where)).toBe(before)
  })
})
