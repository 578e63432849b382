// Vendors: how often an order's first delivery came by its expected date, and the lead time observed from
// placing the order (sent, else approved) to that first delivery: the same receipts the reorder service
// reads its lead times from (stock receipt moves of the order). Orders whose first delivery fell in the period.
import type { DataSource } from 'typeorm'
import { dayEnd, dayStart } from '../../../shared/reports/zonedDays.js'
import type { PeriodQuery, VendorReport, VendorRow } from '../../../shared/schemas/reports.js'

export async function vendorPerformance(ds: DataSource, q: PeriodQuery): Promise<VendorReport> {
  const rows: { vendor_id: number; code: string; name: string; lead: number; expected: string | null; first_at: Date; placed_at: Date | null }[] = await ds.query(
    `SELECT o.vendor_id, v.code, v.name, v.lead_time_days AS lead, DATE_FORMAT(o.expected_date, '%Y-%m-%d') AS expected,
            MIN(m.at) AS first_at, COALESCE(o.sent_at, o.approved_at) AS placed_at
       FROM purchase_orders o
       JOIN vendors v ON v.id = o.vendor_id
       JOIN stock_moves m ON m.doc_type = 'purchase_order' AND m.doc_id = o.id AND m.move_type = 'receipt'
      ${q.warehouseId ? 'WHERE o.warehouse_id = ?' : ''}
      GROUP BY o.id, o.vendor_id, v.code, v.name, v.lead_time_days, o.expected_date, o.sent_at, o.approved_at
     HAVING first_at >= ? AND first_at < ?`,
    [...(q.warehouseId ? [q.warehouseId] : []), dayStart(q.from, q.tz), dayEnd(q.to, q.tz)],
  )
  const byVendor = new Map<number, VendorRow & { leads: number[] }>()
  for (const r of rows) {
    const v = byVendor.get(r.vendor_id) ?? {
      vendorId: Number(r.vendor_id), code: r.code, name: r.name, orders: 0, withDate: 0, onTime: 0, onTimeRate: null,
      leadDaysMean: null, leadDaysMin: null, leadDaysMax: null, statedLeadDays: Number(r.lead), leads: [],
    }
    v.orders++
    const first = new Date(r.first_at)
    if (r.expected) {
      v.withDate++
      // On time: the first delivery arrived by the end of the expected day, in the reader's time zone.
      if (first.getTime() < dayEnd(r.expected, q.tz).getTime()) v.onTime++
    }
    if (r.placed_at) {
      const days = (first.getTime() - new Date(r.placed_at).getTime()) / 86_400_000
      if (days >= 0) v.leads.push(days)
    }
    byVendor.set(r.vendor_id, v)
  }
  const vendors = [...byVendor.values()].map(({ leads, ...v }): VendorRow => ({
    ...v,
    onTimeRate: v.withDate ? v.onTime / v.withDate : null,
    leadDaysMean: leads.length ? leads.reduce((a, b) => a + b, 0) / leads.length : null,
    leadDaysMin: leads.length ? Math.min(...leads) : null,
    leadDaysMax: leads.length ? Math.max(...leads) : null,
  })).sort((a, b) => a.code.localeCompare(b.code))
  return { from: q.from, to: q.to, vendors }
}
