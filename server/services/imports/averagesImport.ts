// The per item and warehouse figures no stock row carries, in the columns of averages-and-minimums.xlsx: the
// moving-average cost of a warehouse that holds none of the item now (the reorder figures value its order
// quantity at it) and the minimum set by hand. Where the warehouse holds the item, its average comes from that
// stock (opening stock or receipts): the row must give the same cost, and only its minimum is written. A
// reversal puts back what each line had before, while nothing has changed it since.
import { problem } from '../../../shared/errors/errorCodes.js'
import type { ImportSpec } from './importTypes.js'
import { cellText, distinctOf, inChunks, itemsBySku, marks, namedItem, namedWarehouse, type ItemFacts, type WarehouseFacts, warehousesByCode } from './importFacts.js'
import { chunked, recordsImport } from './recordsImport.js'

export const AVERAGES_SPEC: ImportSpec = {
  columns: [
    { key: 'sku', header: 'SKU', aliases: ['Item SKU'], required: true, kind: 'text' },
    { key: 'warehouse', header: 'Warehouse', aliases: ['Warehouse code'], required: true, kind: 'text' },
    { key: 'avgCost', header: 'Average cost', aliases: ['Moving-average cost', 'Unit cost'], required: true, kind: 'decimal' },
    { key: 'minQty', header: 'Manual minimum', aliases: ['Minimum'], kind: 'integer' },
  ],
  maxRows: 100_000,
  maxColumns: 20,
}

export const AVERAGES_GUIDE: Record<string, string> = {
  sku: 'An item already in the catalog.',
  warehouse: 'A warehouse code, as set up under Warehouses. One row per item and warehouse.',
  avgCost: 'The moving-average cost of one stock unit there, 0 or more, up to 4 decimals. Where the warehouse holds the item, bring its stock in first: the cost must then be the one its stock carries.',
  minQty: 'The minimum set by hand (below it the stock screens flag the item), a whole number 0 or more; blank: none.',
}

const MAX_COST = 100_000_000

interface LineNow { avg_cost: string; min_qty: number | null; on_hand: string | null }
interface AverageWrite {
  itemId: number; warehouseId: number; sku: string; warehouse: string
  /** The cost written; null where the warehouse's stock sets it. */
  avgCost: string | null
  minQty: number | null
  before: LineNow | undefined
}
interface AverageFacts { items: Map<string, ItemFacts>; warehouses: Map<string, WarehouseFacts>; lines: Map<string, LineNow> }

const sameCost = (a: string, b: string) => Math.round(Number(a) * 10_000) === Math.round(Number(b) * 10_000)

export const averagesImport = recordsImport<AverageWrite, AverageFacts>({
  kind: 'averages',
  spec: AVERAGES_SPEC,
  async facts(em, sheet, importId) {
    const items = await itemsBySku(em, distinctOf(sheet, 'sku'))
    const itemIds = [...items.values()].map((i) => i.id)
    const now = await inChunks(itemIds, (c) => em.query(
      `SELECT iw.item_id, iw.warehouse_id, iw.avg_cost, iw.min_qty,
              (SELECT SUM(s.on_hand) FROM stock_balances s WHERE s.item_id = iw.item_id AND s.warehouse_id = iw.warehouse_id) AS on_hand
         FROM item_warehouses iw WHERE iw.item_id IN (${marks(c.length)})`, c) as Promise<(LineNow & { item_id: number; warehouse_id: number })[]>)
    // A line a commit's earlier chunks wrote reads as it was before the commit (kept for the reversal): the file's
    // own write is not a line held before.
    const mine = importId === null ? [] : await inChunks(itemIds, (c) => em.query(
      `SELECT item_id, warehouse_id, existed, avg_before, min_before FROM data_import_averages WHERE import_id = ? AND item_id IN (${marks(c.length)})`,
      [importId, ...c]) as Promise<{ item_id: number; warehouse_id: number; existed: number; avg_before: string | null; min_before: number | null }[]>)
    const before = new Map(mine.map((m) => [`${m.item_id}:${m.warehouse_id}`, m]))
    const rows = now.flatMap((r) => {
      const was = before.get(`${r.item_id}:${r.warehouse_id}`)
      if (!was) return [r]
      return Number(was.existed) ? [{ ...r, avg_cost: was.avg_before ?? r.avg_cost, min_qty: was.min_before }] : []
    })
    const lines = new Map(rows.map((r) => [`${r.item_id}:${r.warehouse_id}`, r]))
    const warehouses = await warehousesByCode(em)
    const skuOf = new Map([...items.values()].map((i) => [i.id, i.sku]))
    const codeOf = new Map([...warehouses.values()].map((w) => [w.id, w.code]))
    // Held: a line with a minimum already, or an average of its own with nothing on hand (set by earlier stock).
    const held = rows.filter((r) => r.min_qty !== null || (Number(r.avg_cost) > 0 && !Number(r.on_hand)))
      .map((r) => `${skuOf.get(r.item_id)} ${codeOf.get(r.warehouse_id)}`.toUpperCase())
    return { items, warehouses, lines, held: new Set(held) }
  },
  read(values, facts, reader) {
    const { item } = namedItem(values.sku, facts.items, reader)
    const { warehouse } = namedWarehouse(values.warehouse, facts.warehouses, reader)
    const cost = typeof values.avgCost === 'string' ? values.avgCost : null
    let costOk = cost !== null
    if (cost !== null) {
      const fault = cost.startsWith('-') ? problem('not_negative')
        : (cost.split('.')[1] ?? '').length > 4 ? problem('decimal_places', { places: 4 })
          : Number(cost) >= MAX_COST ? problem('less_than', { max: MAX_COST }) : null
      if (fault) reader.add('avgCost', fault)
      costOk = !fault
    }
    const min = typeof values.minQty === 'number' ? values.minQty : null
    if (min !== null && min < 0) reader.add('minQty', problem('at_least', { min: 0 }))
    if (min !== null && min > 1_000_000_000) reader.add('minQty', problem('at_most', { max: 1_000_000_000 }))
    if (!item || !warehouse || !costOk || (min !== null && (min < 0 || min > 1_000_000_000))) return null
    const before = facts.lines.get(`${item.id}:${warehouse.id}`)
    const stocked = Boolean(before && Number(before.on_hand))
    if (stocked && !sameCost(before!.avg_cost, cost!)) {
      reader.add('avgCost', problem('import_average_from_stock', { sku: item.sku, warehouse: warehouse.code, cost: before!.avg_cost }))
      return null
    }
    // Nothing to write: no cost of its own to keep and no minimum.
    if (min === null && (stocked || Number(cost) === 0)) return null
    return { itemId: item.id, warehouseId: warehouse.id, sku: item.sku, warehouse: warehouse.code, avgCost: stocked ? null : cost, minQty: min, before }
  },
  identity: (a) => `${a.sku} ${a.warehouse}`,
  identityColumn: 'warehouse',
  preview: (a, values) => ({ label: a?.sku ?? (cellText(values.sku) || null), place: a?.warehouse ?? (cellText(values.warehouse) || null) }),
  async insert(em, importId, rows) {
    await chunked(rows, 500, async (chunk) => {
      // What each line had before (none: the line is new), then the line as the row gives it.
      await em.query(
        `INSERT INTO data_import_averages (import_id, item_id, warehouse_id, existed, avg_before, min_before, avg_after, min_after) VALUES ${chunk.map(() => '(?, ?, ?, ?, ?, ?, ?, ?)').join(', ')}`,
        chunk.flatMap((a) => [importId, a.itemId, a.warehouseId, a.before ? 1 : 0, a.before?.avg_cost ?? null, a.before?.min_qty ?? null,
          a.avgCost ?? a.before!.avg_cost, a.minQty]),
      )
      await em.query(
        `INSERT INTO item_warehouses (item_id, warehouse_id, avg_cost, min_qty) VALUES ${chunk.map(() => '(?, ?, ?, ?)').join(', ')}
         ON DUPLICATE KEY UPDATE avg_cost = VALUES(avg_cost), min_qty = VALUES(min_qty)`,
        chunk.flatMap((a) => [a.itemId, a.warehouseId, a.avgCost ?? a.before!.avg_cost, a.minQty]),
      )
    })
    return { lines: rows.length, averages: rows.filter((a) => a.avgCost !== null).length, minimums: rows.filter((a) => a.minQty !== null).length }
  },
  async inUse(em, importId) {
    // A line whose cost or minimum changed since, or that holds stock it did not hold then, belongs to that change now.
    const [changed]: { sku: string; code: string }[] = await em.query(
      `SELECT i.sku, w.code FROM data_import_averages a JOIN items i ON i.id = a.item_id JOIN warehouses w ON w.id = a.warehouse_id
         LEFT JOIN item_warehouses iw ON iw.item_id = a.item_id AND iw.warehouse_id = a.warehouse_id
        WHERE a.import_id = ? AND (iw.item_id IS NULL OR iw.avg_cost <> a.avg_after OR NOT (iw.min_qty <=> a.min_after)
          OR (NOT (a.existed AND a.avg_before = a.avg_after)
              AND EXISTS (SELECT 1 FROM stock_balances s WHERE s.item_id = a.item_id AND s.warehouse_id = a.warehouse_id AND s.on_hand <> 0)))
        LIMIT 1 FOR UPDATE`, [importId])
    return changed ? `${changed.sku} ${changed.code}` : null
  },
  async remove(em, importId) {
    await em.query(
      `UPDATE item_warehouses iw JOIN data_import_averages a ON a.item_id = iw.item_id AND a.warehouse_id = iw.warehouse_id
          SET iw.avg_cost = a.avg_before, iw.min_qty = a.min_before WHERE a.import_id = ? AND a.existed = 1`, [importId])
    await em.query(
      `DELETE iw FROM item_warehouses iw JOIN data_import_averages a ON a.item_id = iw.item_id AND a.warehouse_id = iw.warehouse_id
        WHERE a.import_id = ? AND a.existed = 0`, [importId])
  },
})
