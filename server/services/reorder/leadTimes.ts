// Lead time per vendor item. Once purchase orders have been received, the observed times from sending (or,
// failing that, approving) an order to its first receipt of the item give the mean and σL (with any brought
// in from before Lumenyard); until then the vendor item's stated lead time, else the vendor's, with σL = 0.
import type { EntityManager } from 'typeorm'
import { statsOfValues } from '../../../shared/inventory/demand.js'
import { DEFAULT_REORDER_POLICY } from '../../../shared/inventory/reorder.js'
import type { LeadTimeFigures } from '../../../shared/schemas/reorder.js'
import type { VendorTermsRow } from './lineFacts.js'

export const DAY_SECONDS = 86_400

/**
 * Each observed lead time: an order's vendor, an item, the order's number and the seconds from sending (or
 * approving) it to its first receipt of the item; then those brought in from before Lumenyard
 * (lead_time_history). `itemFilter` narrows both halves to `m.item_id IN (…)` / `h.item_id IN (…)`; `historyFilter`
 * narrows the second half alone (its rows are `h`).
 */
export const observedLeadTimeSql = (itemFilter = '', historyFilter = '') => `SELECT o.vendor_id, m.item_id, o.number AS order_ref,
      TIMESTAMPDIFF(SECOND, COALESCE(o.sent_at, o.approved_at), MIN(m.at)) AS seconds
    FROM purchase_orders o
    JOIN stock_moves m ON m.doc_type = 'purchase_order' AND m.doc_id = o.id AND m.move_type = 'receipt'
   WHERE COALESCE(o.sent_at, o.approved_at) IS NOT NULL ${itemFilter.replaceAll('$item', 'm.item_id')}
   GROUP BY o.id, o.vendor_id, m.item_id
  HAVING seconds >= 0
  UNION ALL
  SELECT h.vendor_id, h.item_id, h.order_ref, h.seconds FROM lead_time_history h WHERE 1 = 1 ${itemFilter.replaceAll('$item', 'h.item_id')}${historyFilter}`

/** Observed order-to-receipt days per 'vendor:item', one value per purchase order. */
export async function observedLeadTimes(em: EntityManager, itemIds?: readonly number[]): Promise<Map<string, number[]>> {
  if (itemIds && itemIds.length === 0) return new Map()
  const filter = itemIds?.length ? `AND $item IN (${itemIds.map(() => '?').join(',')})` : ''
  const rows: { vendor_id: number; item_id: number; seconds: string }[] = await em.query(observedLeadTimeSql(filter), itemIds?.length ? [...itemIds, ...itemIds] : [])
  const byKey = new Map<string, number[]>()
  for (const r of rows) {
    const key = `${r.vendor_id}:${r.item_id}`
    const list = byKey.get(key) ?? []
    list.push(Number(r.seconds) / DAY_SECONDS)
    byKey.set(key, list)
  }
  // In one order whatever order the rows came in: the same values give the same sums to the last bit.
  for (const list of byKey.values()) list.sort((a, b) => a - b)
  return byKey
}

export function leadTimeFor(vendor: VendorTermsRow | undefined, observed: Map<string, number[]>): LeadTimeFigures {
  if (!vendor) {
    return { source: 'default', meanDays: DEFAULT_REORDER_POLICY.leadTimeDays, sdDays: 0, statedDays: null, observations: 0 }
  }
  const stated = vendor.itemLeadTimeDays ?? vendor.vendorLeadTimeDays
  const values = observed.get(`${vendor.vendorId}:${vendor.itemId}`) ?? []
  if (values.length > 0) {
    const s = statsOfValues(values)
    return { source: 'observed', meanDays: s.mean, sdDays: s.sdSample, statedDays: stated, observations: values.length }
  }
  return {
    source: vendor.itemLeadTimeDays !== null ? 'vendorItem' : 'vendor',
    meanDays: stated,
    sdDays: 0,
    statedDays: stated,
    observations: 0,
  }
}
