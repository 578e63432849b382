// Accepted reorder suggestions waiting for a purchase order, with the vendor and pack they would be
// ordered in (the suggestion's vendor, else the item's preferred one).
import type { DataSource } from 'typeorm'
import type { SuggestionView } from '../../../shared/schemas/purchasingViews.js'
import { packsFor } from '../../../shared/purchasing/poMoney.js'
import { isoInstant } from './sqlValues.js'

interface Row {
  id: number; item_id: number; sku: string; item_name: string; stock_unit: string; warehouse_id: number; w_code: string; w_name: string
  vendor_id: number | null; v_code: string | null; v_name: string | null; qty: number; source: string; accepted_at: Date
  pack_qty: number | null; min_order_qty: number | null; unit_cost: string | null
}

export async function acceptedSuggestions(ds: DataSource): Promise<SuggestionView[]> {
  const rows: Row[] = await ds.query(
    `SELECT s.id, s.item_id, i.sku, i.name AS item_name, i.stock_unit, s.warehouse_id, w.code AS w_code, w.name AS w_name,
            v.id AS vendor_id, v.code AS v_code, v.name AS v_name, s.qty, s.source, s.accepted_at,
            vi.pack_qty, vi.min_order_qty, vi.unit_cost
       FROM purchase_suggestions s
       JOIN items i ON i.id = s.item_id
       JOIN warehouses w ON w.id = s.warehouse_id
       LEFT JOIN vendors v ON v.id = COALESCE(s.vendor_id,
         (SELECT p.vendor_id FROM vendor_items p WHERE p.item_id = s.item_id ORDER BY p.preferred DESC, p.unit_cost, p.id LIMIT 1))
       LEFT JOIN vendor_items vi ON vi.vendor_id = v.id AND vi.item_id = s.item_id
      WHERE s.status = 'accepted'
      ORDER BY v.name, w.code, i.sku`,
  )
  return rows.map((r) => ({
    id: r.id,
    itemId: r.item_id,
    sku: r.sku,
    itemName: r.item_name,
    stockUnit: r.stock_unit,
    warehouse: { id: r.warehouse_id, code: r.w_code, name: r.w_name },
    vendor: r.vendor_id ? { id: r.vendor_id, code: r.v_code!, name: r.v_name! } : null,
    qty: r.qty,
    source: r.source,
    acceptedAt: isoInstant(r.accepted_at)!,
    packQty: r.pack_qty,
    packs: r.pack_qty ? packsFor(r.qty, r.pack_qty, r.min_order_qty ?? 1) : null,
    unitCost: r.unit_cost,
  }))
}
