// Opening stock from the business's own sheet: SKU, warehouse, bin, lot (required where the item is
// matched by lot), quantity in the item's stock unit (packs allowed: "3 cases") and unit cost. Written
// through the stock service (stock/openingStock.ts) as 'opening' moves of the import's document.
import type { EntityManager } from 'typeorm'
import { problem, type RowProblem } from '../../../shared/errors/errorCodes.js'
import { LOT_CODE_PATTERN } from '../../../shared/schemas/counts.js'
import type { AuditActor } from '../auditService.js'
import { bringInOpeningStock, takeBackOpeningStock, type CostBefore, type OpeningLine } from '../stock/openingStock.js'
import type { CheckedRow, DataImportDefinition } from './dataImports.js'
import { insertRows } from './recordsImport.js'
import { cellText, distinctOf, headerOf, inChunks, issuesByRow, itemsBySku, marks, namedItem, namedWarehouse, parserProblems, repeatedRows, rowQuantity, warehousesByCode, type WarehouseFacts } from './importFacts.js'
import type { ImportSpec, ParsedSheet } from './importTypes.js'

export const OPENING_STOCK_SPEC: ImportSpec = {
  columns: [
    { key: 'sku', header: 'SKU', aliases: ['Item SKU'], required: true, kind: 'text' },
    { key: 'warehouse', header: 'Warehouse', aliases: ['Warehouse code'], required: true, kind: 'text' },
    { key: 'bin', header: 'Bin', aliases: ['Bin code', 'Location'], required: true, kind: 'text' },
    { key: 'lot', header: 'Lot', aliases: ['Production lot', 'Lot code'], kind: 'text' },
    { key: 'quantity', header: 'Quantity', aliases: ['Qty', 'On hand'], required: true, kind: 'text' },
    { key: 'unitCost', header: 'Unit cost', aliases: ['Cost', 'Cost per stock unit'], required: true, kind: 'decimal' },
  ],
  ignore: ['Name', 'Item', 'Stock unit', 'Value', 'Description', 'Note'],
  maxRows: 100_000,
  maxColumns: 30,
}

/** What each column takes, for the template's guide sheet. */
export const OPENING_STOCK_GUIDE: Record<string, string> = {
  sku: 'An item already in the catalog (import items first).',
  warehouse: 'A warehouse code, as set up under Warehouses.',
  bin: 'A storage, receiving or staging bin of that warehouse (not an on-the-way bin).',
  lot: 'The production lot. Required for items matched by lot (blocks: one job is picked from one run, so the tint matches).',
  quantity: 'Whole stock units, or packs: "240", "3 cases", "1 pallet 2 cases 5" (the item\'s case and pallet sizes). A 0 row is skipped.',
  unitCost: 'What one stock unit cost you, up to 4 decimals. The moving-average cost starts from it.',
}

interface BinFacts { id: number; warehouse_id: number; code: string; kind: string; active: number }
type Write = OpeningLine & { lotCode: string | null; row: number }

const col = headerOf(OPENING_STOCK_SPEC)
const text = cellText

/** (warehouse, bin) pairs looked up per statement: read through the bins' unique key, 2 values each. */
const PAIRS_PER_READ = 1000

/**
 * The bins the chunk's rows name: each in the row's own warehouse, read by (warehouse, code) through the bins'
 * unique key, so the cost follows the chunk and not the bins table; only a code its warehouse lacks is looked for
 * in every warehouse (a bin code alone has no index), to name the warehouse that has it.
 */
async function binsNamed(em: EntityManager, sheet: ParsedSheet, warehouse: ReadonlyMap<string, WarehouseFacts>): Promise<BinFacts[]> {
  const pairs = new Map<string, [number, string]>()
  for (const r of sheet.rows) {
    const w = warehouse.get(text(r.values.warehouse).toUpperCase())
    const code = text(r.values.bin)
    if (w && code) pairs.set(`${w.id}:${code.toUpperCase()}`, [w.id, code])
  }
  const wanted = [...pairs.values()]
  const found: BinFacts[] = []
  for (let i = 0; i < wanted.length; i += PAIRS_PER_READ) {
    const part = wanted.slice(i, i + PAIRS_PER_READ)
    found.push(...((await em.query(`SELECT id, warehouse_id, code, kind, active FROM bins WHERE (warehouse_id, code) IN (${part.map(() => '(?, ?)').join(', ')})`, part.flat())) as BinFacts[]))
  }
  const held = new Set(found.map((b) => `${b.warehouse_id}:${b.code.toUpperCase()}`))
  const missing = [...new Set(wanted.filter(([id, code]) => !held.has(`${id}:${code.toUpperCase()}`)).map(([, code]) => code))]
  const elsewhere = await inChunks(missing, (c) => em.query(`SELECT id, warehouse_id, code, kind, active FROM bins WHERE code IN (${marks(c.length)})`, c) as Promise<BinFacts[]>)
  return [...new Map([...found, ...elsewhere].map((b) => [b.id, b])).values()]
}

async function loadFacts(em: EntityManager, sheet: ParsedSheet) {
  const warehouse = await warehousesByCode(em)
  const bins = await binsNamed(em, sheet, warehouse)
  const binsByCode = new Map<string, BinFacts[]>()
  for (const b of bins) binsByCode.set(b.code.toUpperCase(), [...(binsByCode.get(b.code.toUpperCase()) ?? []), b])
  return {
    item: await itemsBySku(em, distinctOf(sheet, 'sku')),
    warehouse,
    warehouseCode: new Map([...warehouse.values()].map((w) => [w.id, w.code])),
    binsByCode,
  }
}

function checkRows(sheet: ParsedSheet, facts: Awaited<ReturnType<typeof loadFacts>>, repeated: ReturnType<typeof repeatedRows>): CheckedRow<Write>[] {
  const problemsOf = parserProblems(sheet, col)
  const issuesOf = issuesByRow(sheet)
  return sheet.rows.map((r) => {
    const errors = problemsOf(r.row)
    const bad = new Set(issuesOf(r.row).map((i) => i.column))
    const add = (key: string, p: RowProblem['problem']) => { errors.push({ column: col(key), problem: p }); bad.add(key) }
    const { sku, item } = namedItem(r.values.sku, facts.item, { add })
    if (item && Number(item.made_to_order)) add('sku', problem('import_made_to_order', { sku }))
    const { warehouse } = namedWarehouse(r.values.warehouse, facts.warehouse, { add })
    if (warehouse && !Number(warehouse.active)) add('warehouse', problem('warehouse_inactive', { warehouse: warehouse.code }))
    const binCode = text(r.values.bin)
    const candidates = facts.binsByCode.get(binCode.toUpperCase()) ?? []
    const bin = warehouse ? candidates.find((b) => b.warehouse_id === warehouse.id) : undefined
    if (binCode && warehouse && !bin) {
      const elsewhere = candidates.map((b) => facts.warehouseCode.get(b.warehouse_id)!).join(', ')
      add('bin', elsewhere
        ? problem('import_bin_other_warehouse', { bin: binCode, warehouse: warehouse.code, other: elsewhere })
        : problem('import_bin_unknown', { bin: binCode, warehouse: warehouse.code }))
    }
    if (bin && (bin.kind === 'transit' || !Number(bin.active))) add('bin', problem('import_bin_not_storage', { bin: bin.code }))
    const lotCode = text(r.values.lot) || null
    if (lotCode && !LOT_CODE_PATTERN.test(lotCode)) add('lot', problem('lot_code_chars'))
    if (!lotCode && item && Number(item.match_lot)) add('lot', problem('import_lot_required', { sku }))
    const qty = rowQuantity(r.values.quantity, item, sku, 1_000_000_000, { add })
    const cost = typeof r.values.unitCost === 'string' ? r.values.unitCost : null
    if (cost !== null && !bad.has('unitCost')) {
      if (cost.startsWith('-')) add('unitCost', problem('not_negative'))
      else if ((cost.split('.')[1] ?? '').length > 4) add('unitCost', problem('decimal_places', { places: 4 }))
      else if (Number(cost) >= 100_000_000) add('unitCost', problem('less_than', { max: 100_000_000 }))
    }
    if (item && bin) {
      const again = repeated(`${item.id}:${bin.id}:${(lotCode ?? '').toUpperCase()}`, r.row)
      if (again) errors.push(again)
    }
    const place = warehouse && binCode ? `${warehouse.code} ${binCode}` : null
    const preview = { row: r.row, label: sku || null, place, qty, unitCost: cost, errors }
    if (errors.length || !item || !warehouse || !bin || qty === null || qty === 0 || cost === null) return { preview, write: null }
    return { preview, write: { itemId: item.id, warehouseId: warehouse.id, binId: bin.id, lotId: null, lotCode, qty, unitCost: cost, row: r.row, note: `row ${r.row}` } }
  })
}

/** Lots named by the rows, found or made (in (item, code) order), their ids set on the rows. */
async function settleLots(em: EntityManager, rows: Write[]): Promise<number> {
  const wanted = [...new Map(rows.filter((r) => r.lotCode).map((r) => [`${r.itemId}:${r.lotCode}`, { itemId: r.itemId, code: r.lotCode! }])).values()]
    .sort((a, b) => a.itemId - b.itemId || a.code.localeCompare(b.code))
  if (!wanted.length) return 0
  const today = new Date().toISOString().slice(0, 10)
  let created = 0
  for (let i = 0; i < wanted.length; i += 1000) {
    const chunk = wanted.slice(i, i + 1000)
    const res: { affectedRows: number } = await em.query(
      `INSERT IGNORE INTO lots (item_id, code, received_at) VALUES ${chunk.map(() => '(?, ?, ?)').join(', ')}`,
      chunk.flatMap((l) => [l.itemId, l.code, today]),
    )
    created += res.affectedRows
  }
  const ids = new Map<string, number>()
  const itemIds = [...new Set(wanted.map((l) => l.itemId))]
  for (let i = 0; i < itemIds.length; i += 1000) {
    const chunk = itemIds.slice(i, i + 1000)
    // A locking read: a lot another request made after this transaction's snapshot was skipped by INSERT IGNORE.
    const found: { id: number; item_id: number; code: string }[] = await em.query(`SELECT id, item_id, code FROM lots WHERE item_id IN (${marks(chunk.length)}) LOCK IN SHARE MODE`, chunk)
    for (const l of found) ids.set(`${l.item_id}:${l.code.toUpperCase()}`, l.id)
  }
  for (const r of rows) if (r.lotCode) r.lotId = ids.get(`${r.itemId}:${r.lotCode.toUpperCase()}`) ?? null
  return created
}

export const openingStockImport: DataImportDefinition<Write> = {
  kind: 'opening_stock',
  spec: OPENING_STOCK_SPEC,
  // Each chunk is looked up on its own; the (item, bin, lot) keys seen so far carry over, for repeats.
  checker(em) {
    const repeated = repeatedRows()
    return { check: async (part) => checkRows(part, await loadFacts(em, part), repeated) }
  },
  // A chunk at a time: each chunk's moves blend into the averages the chunks before left (the same steps, in the
  // same order, as the whole file at once). The cost from before an item × warehouse was first touched is the one
  // a reversal puts back: a later chunk's (already blended) is not kept.
  async write(em, actor: AuditActor, importId, rows) {
    const lotsCreated = await settleLots(em, rows)
    const { costsBefore } = await bringInOpeningStock(em, actor, rows, { docType: 'data_import', docId: importId })
    await insertRows(em, 'data_import_costs', ['item_id', 'warehouse_id', 'avg_before', 'on_hand_before'], importId, costsBefore,
      (c) => [c.itemId, c.warehouseId, c.avgBefore, c.onHandBefore], 1000, 'keepFirst')
    return { lines: rows.length, units: rows.reduce((n, r) => n + r.qty, 0), lotsCreated }
  },
  async reverse(em, actor, importId) {
    const costs: { item_id: number; warehouse_id: number; avg_before: string; on_hand_before: number }[] = await em.query(
      'SELECT item_id, warehouse_id, avg_before, on_hand_before FROM data_import_costs WHERE import_id = ?', [importId])
    const before: CostBefore[] = costs.map((c) => ({ itemId: c.item_id, warehouseId: c.warehouse_id, avgBefore: c.avg_before, onHandBefore: c.on_hand_before }))
    await takeBackOpeningStock(em, actor, { docType: 'data_import', docId: importId }, before)
  },
}
