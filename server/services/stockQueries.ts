// Reading stock: by item and warehouse, by bin, by lot, and transfers. Read-only SQL over the stock
// tables; every change goes through services/stock. Transit bins count as "in transit", never on hand.
import type { DataSource } from 'typeorm'
import type { BinKind, StockUnit } from '../../shared/catalog.js'
import {
  isLowStock,
  type BinContents, type BinContentsAnswer, type BinContentsQuery, type LevelsQuery, type LotLevel, type LotLevelsAnswer,
  type StockLevelRow, type StockLevelsAnswer, type TransferView, type TransfersQuery,
} from '../../shared/schemas/stockViews.js'
import { containsPattern } from '../db/likePattern.js'
import { SqlWhere } from '../db/sqlWhere.js'
import { AppError } from '../errors.js'

export const LEVELS_LIMIT = 5000


interface LevelSqlRow {
  item_id: number; sku: string; name: string; family: string; stock_unit: StockUnit
  warehouse_id: number; warehouse_code: string; on_hand: string; reserved: string; in_transit: string; min_qty: number | null
}

/**
 * The levels query. The item and warehouse filters go inside the aggregate, so its cost grows with the
 * rows asked for, not with the balance table (grouping all balances first took 30 ms at 22,000 rows for
 * one item). Without includeEmpty the pairs shown are those where stock was ever kept or a minimum or cost
 * is set: the balances and item_warehouses rows, gathered in one UNION ALL and grouped once.
 */
export function levelsSql(q: LevelsQuery): { sql: string; params: unknown[] } {
  const text = containsPattern(q.q ?? '')
  const itemConditions = (w: SqlWhere) => w
    .add('i.id = ?', [q.itemId], !!q.itemId)
    .add('i.family = ?', [q.family], !!q.family)
    .add('(i.sku LIKE ? OR i.name LIKE ? OR i.gtin LIKE ?)', [text, text, text], !!q.q)
  const items = itemConditions(new SqlWhere())
  const narrowed = (alias: string) => new SqlWhere()
    .add(`${alias}.item_id = ?`, [q.itemId], !!q.itemId)
    .add(`${alias}.item_id IN (SELECT i.id FROM items i ${items.sql()})`, items.params, !q.itemId && !!(q.family || q.q))
    .add(`${alias}.warehouse_id = ?`, [q.warehouseId], !!q.warehouseId)
  const inBalances = narrowed('b')
  const inSettings = narrowed('x')
  const totals = `
    SELECT item_id, warehouse_id, SUM(on_hand) AS on_hand, SUM(reserved) AS reserved, SUM(in_transit) AS in_transit
      FROM (SELECT b.item_id, b.warehouse_id, IF(bn.kind = 'transit', 0, b.on_hand) AS on_hand,
                   IF(bn.kind = 'transit', 0, b.reserved) AS reserved, IF(bn.kind = 'transit', b.on_hand, 0) AS in_transit
              FROM stock_balances b JOIN bins bn ON bn.id = b.bin_id ${inBalances.sql()}
            ${q.includeEmpty ? '' : `UNION ALL SELECT x.item_id, x.warehouse_id, 0, 0, 0 FROM item_warehouses x ${inSettings.sql()}`}) u
     GROUP BY item_id, warehouse_id`
  const where = itemConditions(new SqlWhere())
    .add('w.id = ?', [q.warehouseId], !!q.warehouseId)
    .add('iw.min_qty IS NOT NULL AND COALESCE(s.on_hand, 0) - COALESCE(s.reserved, 0) < iw.min_qty', [], q.lowOnly)
  const from = q.includeEmpty
    ? `items i CROSS JOIN warehouses w LEFT JOIN (${totals}) s ON s.item_id = i.id AND s.warehouse_id = w.id`
    : `(${totals}) s JOIN items i ON i.id = s.item_id JOIN warehouses w ON w.id = s.warehouse_id`
  if (q.includeEmpty) where.add('i.active = 1 AND i.made_to_order = 0 AND w.active = 1')
  const sql = `SELECT i.id AS item_id, i.sku, i.name, i.family, i.stock_unit, w.id AS warehouse_id, w.code AS warehouse_code,
            COALESCE(s.on_hand, 0) AS on_hand, COALESCE(s.reserved, 0) AS reserved, COALESCE(s.in_transit, 0) AS in_transit, iw.min_qty
       FROM ${from}
       LEFT JOIN item_warehouses iw ON iw.item_id = i.id AND iw.warehouse_id = w.id
      ${where.sql()}
      ORDER BY i.sku, w.code
      LIMIT ${LEVELS_LIMIT + 1}`
  return { sql, params: [...inBalances.params, ...(q.includeEmpty ? [] : inSettings.params), ...where.params] }
}

export async function stockLevels(ds: DataSource, q: LevelsQuery): Promise<StockLevelsAnswer> {
  const { sql, params } = levelsSql(q)
  const rows: LevelSqlRow[] = await ds.query(sql, params)
  return { rows: rows.slice(0, LEVELS_LIMIT).map(toLevelRow), truncated: rows.length > LEVELS_LIMIT }
}

function toLevelRow(r: LevelSqlRow): StockLevelRow {
  const onHand = Number(r.on_hand)
  const reserved = Number(r.reserved)
  const available = onHand - reserved
  return {
    itemId: r.item_id, sku: r.sku, name: r.name, family: r.family, stockUnit: r.stock_unit,
    warehouseId: r.warehouse_id, warehouseCode: r.warehouse_code,
    onHand, reserved, available, inTransit: Number(r.in_transit), minQty: r.min_qty, low: isLowStock(available, r.min_qty),
  }
}

interface BinSqlRow {
  bin_id: number; code: string; kind: BinKind; active: number
  item_id: number | null; sku: string | null; name: string | null; stock_unit: StockUnit | null
  lot_id: number | null; lot_code: string | null; on_hand: number | null; reserved: number | null
}

/** Bins in a natural order (A-2-1 before A-10-1), transit bins last. */
const binOrder = (a: BinContents, b: BinContents) =>
  Number(a.kind === 'transit') - Number(b.kind === 'transit') || a.code.localeCompare(b.code, 'en', { numeric: true })

export async function binContents(ds: DataSource, q: BinContentsQuery): Promise<BinContentsAnswer> {
  const [warehouse] = await ds.query('SELECT id, code, name FROM warehouses WHERE id = ?', [q.warehouseId])
  if (!warehouse) throw AppError.notFound('warehouse_not_found', 'That warehouse was not found.')
  const text = containsPattern(q.q ?? '')
  const where = new SqlWhere()
    .add('bn.warehouse_id = ?', [q.warehouseId])
    .add('b.item_id = ?', [q.itemId], !!q.itemId)
    .add('(i.sku LIKE ? OR i.name LIKE ? OR bn.code LIKE ?)', [text, text, text], !!q.q)
  const narrowed = !!(q.itemId || q.q)
  const rows: BinSqlRow[] = await ds.query(
    `SELECT bn.id AS bin_id, bn.code, bn.kind, bn.active, b.item_id, i.sku, i.name, i.stock_unit,
            b.lot_id, l.code AS lot_code, b.on_hand, b.reserved
       FROM bins bn
       ${q.includeEmpty && !narrowed ? 'LEFT' : ''} JOIN stock_balances b ON b.bin_id = bn.id AND (b.on_hand > 0 OR b.reserved > 0)
       LEFT JOIN items i ON i.id = b.item_id
       LEFT JOIN lots l ON l.id = b.lot_id
      ${where.sql()}
      ORDER BY bn.id, i.sku, l.code`,
    where.params,
  )
  const bins = new Map<number, BinContents>()
  for (const r of rows) {
    let bin = bins.get(r.bin_id)
    if (!bin) bins.set(r.bin_id, (bin = { binId: r.bin_id, code: r.code, kind: r.kind, active: Boolean(r.active), lines: [] }))
    if (r.item_id === null) continue
    bin.lines.push({
      itemId: r.item_id, sku: r.sku!, name: r.name!, stockUnit: r.stock_unit!, lotId: r.lot_id, lotCode: r.lot_code,
      onHand: r.on_hand ?? 0, reserved: r.reserved ?? 0,
    })
  }
  return { warehouse, bins: [...bins.values()].sort(binOrder) }
}

interface LotSqlRow {
  lot_id: number | null; lot_code: string | null; received_at: string | null; tint_note: string | null
  warehouse_id: number | null; warehouse_code: string | null; bin_id: number | null; bin_code: string | null; bin_kind: BinKind | null
  on_hand: number | null; reserved: number | null
}

/** Every lot of the item (with none on hand too), and a "no lot" group when stock is kept without one. */
export async function lotLevels(ds: DataSource, itemId: number): Promise<LotLevelsAnswer> {
  const [item] = await ds.query('SELECT id, sku, name, stock_unit AS stockUnit FROM items WHERE id = ?', [itemId])
  if (!item) throw AppError.notFound('item_not_found', 'That item was not found.')
  const place = `b.on_hand, b.reserved, w.id AS warehouse_id, w.code AS warehouse_code, bn.id AS bin_id, bn.code AS bin_code, bn.kind AS bin_kind`
  const rows: LotSqlRow[] = await ds.query(
    `SELECT l.id AS lot_id, l.code AS lot_code, DATE_FORMAT(l.received_at, '%Y-%m-%d') AS received_at, l.tint_note, ${place}
       FROM lots l
       LEFT JOIN stock_balances b ON b.lot_id = l.id AND b.on_hand > 0
       LEFT JOIN bins bn ON bn.id = b.bin_id
       LEFT JOIN warehouses w ON w.id = b.warehouse_id
      WHERE l.item_id = ?
     UNION ALL
     SELECT NULL, NULL, NULL, NULL, ${place}
       FROM stock_balances b JOIN bins bn ON bn.id = b.bin_id JOIN warehouses w ON w.id = b.warehouse_id
      WHERE b.item_id = ? AND b.lot_id IS NULL AND b.on_hand > 0
      ORDER BY received_at IS NULL, received_at, lot_code, warehouse_code, bin_code`,
    [itemId, itemId],
  )
  const lots = new Map<string, LotLevel>()
  for (const r of rows) {
    const key = String(r.lot_id ?? 'none')
    let lot = lots.get(key)
    if (!lot) {
      lot = { lotId: r.lot_id, lotCode: r.lot_code, receivedAt: r.received_at, tintNote: r.tint_note, onHand: 0, reserved: 0, places: [] }
      lots.set(key, lot)
    }
    if (r.bin_id === null) continue
    lot.onHand += r.on_hand ?? 0
    lot.reserved += r.reserved ?? 0
    lot.places.push({
      warehouseId: r.warehouse_id!, warehouseCode: r.warehouse_code!, binId: r.bin_id, binCode: r.bin_code!,
      inTransit: r.bin_kind === 'transit', onHand: r.on_hand ?? 0, reserved: r.reserved ?? 0,
    })
  }
  return { item, lots: [...lots.values()] }
}

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null)

interface TransferSqlRow {
  id: number; status: TransferView['status']; note: string | null; shipped_at: Date; received_at: Date | null
  from_warehouse_id: number; from_code: string; to_warehouse_id: number; to_code: string; shipped_by: string | null; received_by: string | null
}
interface TransferLineSqlRow {
  id: number; transfer_id: number; item_id: number; sku: string; name: string; lot_id: number | null; lot_code: string | null
  from_bin_id: number; bin_code: string; qty: number; received_qty: number
}

function toTransferView(t: TransferSqlRow, lines: TransferLineSqlRow[]): TransferView {
  return {
    id: t.id, status: t.status, fromWarehouseId: t.from_warehouse_id, fromWarehouseCode: t.from_code,
    toWarehouseId: t.to_warehouse_id, toWarehouseCode: t.to_code, note: t.note,
    shippedAt: iso(t.shipped_at)!, shippedBy: t.shipped_by, receivedAt: iso(t.received_at), receivedBy: t.received_by,
    lines: lines.filter((l) => l.transfer_id === t.id).map((l) => ({
      id: l.id, itemId: l.item_id, sku: l.sku, itemName: l.name, lotId: l.lot_id, lotCode: l.lot_code,
      fromBinId: l.from_bin_id, fromBinCode: l.bin_code, qty: l.qty, receivedQty: l.received_qty,
    })),
  }
}

export async function listTransfers(ds: DataSource, q: TransfersQuery): Promise<TransferView[]> {
  const where = new SqlWhere()
    .add('t.status = ?', [q.status], !!q.status)
    .add('(t.from_warehouse_id = ? OR t.to_warehouse_id = ?)', [q.warehouseId, q.warehouseId], !!q.warehouseId)
  const heads: TransferSqlRow[] = await ds.query(
    `SELECT t.id, t.status, t.note, t.shipped_at, t.received_at, t.from_warehouse_id, fw.code AS from_code,
            t.to_warehouse_id, tw.code AS to_code, su.display_name AS shipped_by, ru.display_name AS received_by
       FROM transfers t
       JOIN warehouses fw ON fw.id = t.from_warehouse_id
       JOIN warehouses tw ON tw.id = t.to_warehouse_id
       LEFT JOIN users su ON su.id = t.shipped_by
       LEFT JOIN users ru ON ru.id = t.received_by
      ${where.sql()}
      ORDER BY t.id DESC LIMIT ${q.limit}`,
    where.params,
  )
  if (!heads.length) return []
  const lines: TransferLineSqlRow[] = await ds.query(
    `SELECT tl.id, tl.transfer_id, tl.item_id, i.sku, i.name, tl.lot_id, l.code AS lot_code, tl.from_bin_id, bn.code AS bin_code, tl.qty, tl.received_qty
       FROM transfer_lines tl JOIN items i ON i.id = tl.item_id JOIN bins bn ON bn.id = tl.from_bin_id LEFT JOIN lots l ON l.id = tl.lot_id
      WHERE tl.transfer_id IN (?) ORDER BY tl.id`,
    [heads.map((t) => t.id)],
  )
  return heads.map((t) => toTransferView(t, lines))
}
