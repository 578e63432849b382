// Everything about a stock line except its usage: catalog, position, costs, vendor terms and what is pending.
// Each is one small grouped query (one row per item, line or vendor item), cheap next to the usage aggregate.
import type { EntityManager } from 'typeorm'
import type { ItemFamily } from '../../../shared/catalog.js'
import { onOrderByItemWarehouse } from '../onOrder.js'
import { lineKey } from './usageQueries.js'

export interface ItemFacts { id: number; sku: string; name: string; family: ItemFamily; cost: string }
export interface WarehouseFacts { id: number; code: string; name: string }
export interface VendorTermsRow {
  vendorId: number
  vendorCode: string
  itemId: number
  packSize: number
  minimumOrder: number
  unitCost: string
  itemLeadTimeDays: number | null
  vendorLeadTimeDays: number
  preferred: boolean
}
export interface PendingFacts { qty: number; openSuggestionId: number | null }

export interface LineFacts {
  items: Map<number, ItemFacts>
  warehouses: Map<number, WarehouseFacts>
  stock: Map<string, { onHand: number; reserved: number }>
  avgCost: Map<string, string>
  onOrder: Map<string, number>
  pending: Map<string, PendingFacts>
  /** The vendor each item is bought from: the preferred one, else the cheapest. */
  vendorOf: Map<number, VendorTermsRow>
}

async function items(em: EntityManager): Promise<Map<number, ItemFacts>> {
  const rows: ItemFacts[] = await em.query(
    `SELECT id, sku, name, family, cost FROM items WHERE active = 1 AND made_to_order = 0`,
  )
  return new Map(rows.map((r) => [r.id, r]))
}

async function warehouses(em: EntityManager): Promise<Map<number, WarehouseFacts>> {
  const rows: WarehouseFacts[] = await em.query(`SELECT id, code, name FROM warehouses WHERE active = 1 ORDER BY code`)
  return new Map(rows.map((r) => [r.id, r]))
}

async function stock(em: EntityManager): Promise<Map<string, { onHand: number; reserved: number }>> {
  const rows: { item_id: number; warehouse_id: number; on_hand: string; reserved: string }[] = await em.query(
    `SELECT item_id, warehouse_id, SUM(on_hand) AS on_hand, SUM(reserved) AS reserved
       FROM stock_balances GROUP BY item_id, warehouse_id`,
  )
  return new Map(rows.map((r) => [lineKey(r.item_id, r.warehouse_id), { onHand: Number(r.on_hand), reserved: Number(r.reserved) }]))
}

async function avgCost(em: EntityManager): Promise<Map<string, string>> {
  const rows: { item_id: number; warehouse_id: number; avg_cost: string }[] = await em.query(
    `SELECT item_id, warehouse_id, avg_cost FROM item_warehouses`,
  )
  return new Map(rows.map((r) => [lineKey(r.item_id, r.warehouse_id), r.avg_cost]))
}

/** Accepted reorder suggestions and draft PO lines: ordered in intent, not yet on order. */
async function pending(em: EntityManager): Promise<Map<string, PendingFacts>> {
  const rows: { item_id: number; warehouse_id: number; qty: string; open_id: number | null }[] = await em.query(
    `SELECT item_id, warehouse_id, SUM(qty) AS qty, MAX(open_id) AS open_id FROM (
        SELECT item_id, warehouse_id, qty, IF(source = 'reorder', id, NULL) AS open_id
          FROM purchase_suggestions WHERE status = 'accepted'
        UNION ALL
        SELECT l.item_id, o.warehouse_id, l.qty_ordered, NULL
          FROM purchase_order_lines l JOIN purchase_orders o ON o.id = l.po_id WHERE o.status = 'draft'
      ) p GROUP BY item_id, warehouse_id`,
  )
  return new Map(rows.map((r) => [lineKey(r.item_id, r.warehouse_id), { qty: Number(r.qty), openSuggestionId: r.open_id }]))
}

async function vendorTerms(em: EntityManager): Promise<Map<number, VendorTermsRow>> {
  const rows: VendorTermsRow[] = (await em.query(
    `SELECT vi.vendor_id AS vendorId, v.code AS vendorCode, vi.item_id AS itemId, vi.pack_qty AS packSize,
            vi.min_order_qty AS minimumOrder, vi.unit_cost AS unitCost, vi.lead_time_days AS itemLeadTimeDays,
            v.lead_time_days AS vendorLeadTimeDays, vi.preferred
       FROM vendor_items vi JOIN vendors v ON v.id = vi.vendor_id
      WHERE v.active = 1
      ORDER BY vi.item_id, vi.preferred DESC, vi.unit_cost, vi.vendor_id`,
  )).map((r: VendorTermsRow) => ({ ...r, preferred: Boolean(r.preferred) }))
  const chosen = new Map<number, VendorTermsRow>()
  for (const r of rows) if (!chosen.has(r.itemId)) chosen.set(r.itemId, r)
  return chosen
}

/** All facts at once: the queries run side by side on the pool. */
export async function loadLineFacts(em: EntityManager): Promise<LineFacts> {
  const [i, w, s, c, o, p, v] = await Promise.all([
    items(em), warehouses(em), stock(em), avgCost(em), onOrderByItemWarehouse(em), pending(em), vendorTerms(em),
  ])
  return { items: i, warehouses: w, stock: s, avgCost: c, onOrder: o, pending: p, vendorOf: v }
}
