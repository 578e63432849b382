// Lead time per vendor item. Once purchase orders have been received, the observed times from sending (or,
// failing that, approving) an order to its first receipt of the item give the mean and σL; until then the
// vendor item's stated lead time, else the vendor's, with σL = 0.
import type { EntityManager } from 'typeorm'
import { statsOfValues } from '../../../shared/inventory/demand.js'
import { DEFAULT_REORDER_POLICY } from '../../../shared/inventory/reorder.js'
import type { LeadTimeFigures } from '../../../shared/schemas/reorder.js'
import type { VendorTermsRow } from './lineFacts.js'

const DAY_SECONDS = 86_400

/** Observed order-to-receipt days per 'vendor:item', one value per purchase order. */
export async function observedLeadTimes(em: EntityManager, itemIds?: readonly number[]): Promise<Map<string, number[]>> {
  if (itemIds && itemIds.length === 0) return new Map()
  const filter = itemIds?.length ? `AND m.item_id IN (${itemIds.map(() => '?').join(',')})` : ''
  const rows: { vendor_id: number; item_id: number; seconds: string }[] = await em.query(
    `SELECT o.vendor_id, m.item_id, TIMESTAMPDIFF(SECOND, COALESCE(o.sent_at, o.approved_at), MIN(m.at)) AS seconds
       FROM purchase_orders o
       JOIN stock_moves m ON m.doc_type = 'purchase_order' AND m.doc_id = o.id AND m.move_type = 'receipt'
      WHERE COALESCE(o.sent_at, o.approved_at) IS NOT NULL ${filter}
      GROUP BY o.id, o.vendor_id, m.item_id
     HAVING seconds >= 0`,
    itemIds ?? [],
  )
  const byKey = new Map<string, number[]>()
  for (const r of rows) {
    const key = `${r.vendor_id}:${r.item_id}`
    const list = byKey.get(key) ?? []
    list.push(Number(r.seconds) / DAY_SECONDS)
    byKey.set(key, list)
  }
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
