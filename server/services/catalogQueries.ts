// Catalog reads: the filtered, paged item list (with stock on hand across warehouses) and one item
// with its stock by warehouse, bin and lot, straight from stock_balances.
import type { DataSource, EntityManager } from 'typeorm'
import { normalizeGtin } from '../../shared/barcode/checkDigit.js'
import type {
  ItemBinStock, ItemDetail, ItemListQuery, ItemPage, ItemRow, ItemVendorSource, ItemWarehouseStock, LotRow, LotUpdateInput,
} from '../../shared/schemas/catalog.js'
import { containsPattern } from '../db/likePattern.js'
import { Lot } from '../entities/Lot.js'
import { AppError } from '../errors.js'
import { audit, type AuditActor } from './auditService.js'
import { findItem, toItemRecord } from './catalogService.js'

const SORT_COLUMNS: Record<ItemListQuery['sort'], string> = {
  sku: 'i.sku', name: 'i.name', family: 'i.family', listPrice: 'i.list_price', onHand: 'on_hand',
}


/** WHERE clause and parameters for the list filters; every search word must appear in SKU, name, GTIN or pattern. */
export function listFilter(q: Omit<ItemListQuery, 'page' | 'pageSize' | 'sort' | 'dir'>): { where: string; params: unknown[] } {
  const clauses: string[] = []
  const params: unknown[] = []
  const add = (sql: string, ...values: unknown[]) => {
    clauses.push(sql)
    params.push(...values)
  }
  if (q.active !== 'all') add('i.active = ?', q.active === 'true' ? 1 : 0)
  if (q.family) add('i.family = ?', q.family)
  if (q.size) add('i.nominal_size = ?', q.size)
  if (q.pattern) add('i.pattern = ?', q.pattern)
  if (q.shape) add('i.shape = ?', q.shape)
  if (q.thickness) add('i.thickness_class = ?', q.thickness)
  const scanned = q.q && /^\d{8,14}$/.test(q.q) ? normalizeGtin(q.q) : null
  if (scanned?.ok) add('(i.gtin = ? OR i.sku = ?)', scanned.gtin14, q.q)
  else {
    for (const word of (q.q ?? '').split(/\s+/).filter(Boolean).slice(0, 8)) {
      const like = containsPattern(word)
      add('(i.sku LIKE ? OR i.name LIKE ? OR i.gtin LIKE ? OR i.pattern LIKE ?)', like, like, like, like)
    }
  }
  return { where: clauses.length ? `WHERE ${clauses.join(' AND ')}` : '', params }
}

export const STOCK_JOIN = `LEFT JOIN (SELECT item_id, SUM(on_hand) AS on_hand, SUM(reserved) AS reserved FROM stock_balances GROUP BY item_id) s ON s.item_id = i.id`

function toRow(r: Record<string, unknown>): ItemRow {
  const onHand = Number(r.on_hand ?? 0)
  return {
    id: Number(r.id), sku: String(r.sku), name: String(r.name), family: String(r.family), stockUnit: String(r.stock_unit),
    nominalSize: (r.nominal_size as string | null) ?? null, pattern: (r.pattern as string | null) ?? null,
    shape: (r.shape as string | null) ?? null, thicknessClass: (r.thickness_class as string | null) ?? null,
    gtin: (r.gtin as string | null) ?? null, caseQty: r.case_qty === null ? null : Number(r.case_qty),
    palletQty: r.pallet_qty === null ? null : Number(r.pallet_qty), cost: String(r.cost), listPrice: String(r.list_price),
    active: Boolean(r.active), madeToOrder: Boolean(r.made_to_order), matchLot: Boolean(r.match_lot),
    onHand, available: onHand - Number(r.reserved ?? 0),
  }
}

/** The list (the cost rule leaves the standard cost out for roles that do not see costs). */
export async function listItems(ds: DataSource | EntityManager, q: ItemListQuery): Promise<ItemPage> {
  const { where, params } = listFilter(q)
  const order = `${SORT_COLUMNS[q.sort]} ${q.dir === 'desc' ? 'DESC' : 'ASC'}, i.id ASC`
  const rows = await ds.query(
    `SELECT i.*, COALESCE(s.on_hand, 0) AS on_hand, COALESCE(s.reserved, 0) AS reserved FROM items i ${STOCK_JOIN} ${where}
     ORDER BY ${order} LIMIT ? OFFSET ?`,
    [...params, q.pageSize, (q.page - 1) * q.pageSize],
  )
  const [count] = await ds.query(`SELECT COUNT(*) AS n FROM items i ${where}`, params)
  return { rows: rows.map(toRow), total: Number(count.n), page: q.page, pageSize: q.pageSize }
}

async function warehouseStock(em: EntityManager, itemId: number): Promise<ItemWarehouseStock[]> {
  const rows = await em.query(
    `SELECT w.id, w.code, w.name, COALESCE(SUM(b.on_hand), 0) AS on_hand, COALESCE(SUM(b.reserved), 0) AS reserved, iw.avg_cost, iw.min_qty
     FROM warehouses w
     LEFT JOIN stock_balances b ON b.warehouse_id = w.id AND b.item_id = ?
     LEFT JOIN item_warehouses iw ON iw.warehouse_id = w.id AND iw.item_id = ?
     WHERE w.active = 1 OR b.id IS NOT NULL
     GROUP BY w.id, w.code, w.name, iw.avg_cost, iw.min_qty ORDER BY w.code`,
    [itemId, itemId],
  )
  return rows.map((r: Record<string, unknown>) => ({
    warehouseId: Number(r.id), warehouseCode: String(r.code), warehouseName: String(r.name),
    onHand: Number(r.on_hand), reserved: Number(r.reserved),
    avgCost: r.avg_cost === null ? null : String(r.avg_cost), minQty: r.min_qty === null ? null : Number(r.min_qty),
  }))
}

const dateOnly = (v: unknown) => (v instanceof Date ? v.toISOString().slice(0, 10) : v === null ? null : String(v))

async function binStock(em: EntityManager, itemId: number): Promise<ItemBinStock[]> {
  const rows = await em.query(
    `SELECT sb.warehouse_id, w.code AS warehouse_code, sb.bin_id, bn.code AS bin_code, bn.kind AS bin_kind,
            sb.lot_id, l.code AS lot_code, l.received_at, l.tint_note, sb.on_hand, sb.reserved
     FROM stock_balances sb
     JOIN bins bn ON bn.id = sb.bin_id
     JOIN warehouses w ON w.id = sb.warehouse_id
     LEFT JOIN lots l ON l.id = sb.lot_id
     WHERE sb.item_id = ? AND (sb.on_hand > 0 OR sb.reserved > 0)
     ORDER BY w.code, bn.code, l.received_at, sb.lot_id`,
    [itemId],
  )
  return rows.map((r: Record<string, unknown>) => ({
    warehouseId: Number(r.warehouse_id), warehouseCode: String(r.warehouse_code), binId: Number(r.bin_id),
    binCode: String(r.bin_code), binKind: String(r.bin_kind), lotId: r.lot_id === null ? null : Number(r.lot_id),
    lotCode: (r.lot_code as string | null) ?? null, lotReceivedAt: dateOnly(r.received_at), tintNote: (r.tint_note as string | null) ?? null,
    onHand: Number(r.on_hand), reserved: Number(r.reserved),
  }))
}

async function vendorSources(em: EntityManager, itemId: number): Promise<ItemVendorSource[]> {
  const rows = await em.query(
    `SELECT v.id, v.code, v.name, vi.vendor_sku, vi.pack_qty, vi.min_order_qty, vi.unit_cost, COALESCE(vi.lead_time_days, v.lead_time_days) AS lead, vi.preferred
     FROM vendor_items vi JOIN vendors v ON v.id = vi.vendor_id WHERE vi.item_id = ? ORDER BY vi.preferred DESC, v.name`,
    [itemId],
  )
  return rows.map((r: Record<string, unknown>) => ({
    vendorId: Number(r.id), vendorCode: String(r.code), vendorName: String(r.name), vendorSku: String(r.vendor_sku),
    packQty: Number(r.pack_qty), minOrderQty: Number(r.min_order_qty), unitCost: String(r.unit_cost),
    leadTimeDays: r.lead === null ? null : Number(r.lead), preferred: Boolean(r.preferred),
  }))
}

export async function itemDetail(ds: DataSource, id: number): Promise<ItemDetail> {
  const em = ds.manager
  const item = await findItem(em, id)
  const [warehouses, bins, vendors] = await Promise.all([warehouseStock(em, id), binStock(em, id), vendorSources(em, id)])
  return { item: toItemRecord(item), warehouses, bins, vendors }
}

export async function listLots(ds: DataSource, itemId: number): Promise<LotRow[]> {
  await findItem(ds.manager, itemId)
  const rows = await ds.query(
    `SELECT l.id, l.item_id, l.code, l.received_at, l.vendor_id, l.tint_note, COALESCE(SUM(sb.on_hand), 0) AS on_hand
     FROM lots l LEFT JOIN stock_balances sb ON sb.lot_id = l.id
     WHERE l.item_id = ? GROUP BY l.id ORDER BY l.received_at DESC, l.id DESC`,
    [itemId],
  )
  return rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id), itemId: Number(r.item_id), code: String(r.code), receivedAt: dateOnly(r.received_at) ?? '',
    vendorId: r.vendor_id === null ? null : Number(r.vendor_id), tintNote: (r.tint_note as string | null) ?? null, onHand: Number(r.on_hand),
  }))
}

export async function updateLot(ds: DataSource, actor: AuditActor, itemId: number, lotId: number, input: LotUpdateInput): Promise<LotRow> {
  await ds.transaction(async (em) => {
    const lot = await em.findOne(Lot, { where: { id: lotId, itemId }, lock: { mode: 'pessimistic_write' } })
    if (!lot) throw AppError.notFound('lot_not_found', 'That lot was not found.')
    await em.update(Lot, { id: lotId }, { tintNote: input.tintNote })
    await audit(em, actor, 'lot.update', 'lot', lotId, { code: lot.code, tintNote: { from: lot.tintNote, to: input.tintNote } })
  })
  return (await listLots(ds, itemId)).find((l) => l.id === lotId)!
}
