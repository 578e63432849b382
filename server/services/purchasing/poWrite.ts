// Writing a purchase order and its lines, shared by every way of creating one. Lines are ordered in
// purchase packs; qty_ordered = packs × pack size in stock units (the table's CHECK holds it too).
import { In, type EntityManager } from 'typeorm'
import { MAX_LINE_QTY, MAX_ORDER_TOTAL, orderTotal, orderTotalFits } from '../../../shared/purchasing/poMoney.js'
import { Item } from '../../entities/Item.js'
import { PurchaseOrder, PurchaseOrderLine } from '../../entities/PurchaseOrder.js'
import { Vendor, VendorItem } from '../../entities/Vendor.js'
import { Warehouse } from '../../entities/Warehouse.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { lockPo } from './poLifecycle.js'
import { nextPoNumber } from './poNumbering.js'

export interface NewPoLine {
  itemId: number
  vendorSku: string | null
  description: string
  packQty: number
  packsOrdered: number
  unitCost: string
  bomLineId?: number | null
  specJson?: string | null
}

export interface NewPo {
  vendorId: number
  warehouseId: number
  jobId?: number | null
  expectedDate?: string | null
  notes?: string | null
}

export function addDays(days: number, from = new Date()): string {
  return new Date(from.getTime() + days * 86_400_000).toISOString().slice(0, 10)
}

const tooLarge = (total: string) =>
  `The order would total ${total}; an order holds at most ${MAX_ORDER_TOTAL}. Split it into smaller orders.`

export async function recomputeTotal(em: EntityManager, poId: number): Promise<string> {
  const lines = await em.findBy(PurchaseOrderLine, { poId })
  const total = orderTotal(lines)
  if (!orderTotalFits(total)) throw AppError.conflict('order_total_too_large', tooLarge(total), { params: { total, max: MAX_ORDER_TOTAL } })
  await em.update(PurchaseOrder, { id: poId }, { total })
  return total
}

export function checkLineSizes(lines: readonly { packsOrdered: number; packQty: number }[]): void {
  const tooBig = lines.findIndex((l) => l.packsOrdered * l.packQty > MAX_LINE_QTY)
  if (tooBig >= 0) throw AppError.badRequest('line_too_large', 'A line is too large.', { fields: { [`lines.${tooBig}.packsOrdered`]: problem('line_units_at_most', { max: MAX_LINE_QTY }) } })
}

/** Inserts the PO (numbered in this transaction) and its lines; returns the PO and line ids in order. */
export async function insertPo(em: EntityManager, actor: AuditActor, head: NewPo, lines: NewPoLine[], source: string) {
  checkLineSizes(lines)
  const total = orderTotal(lines.map((l) => ({ unitCost: l.unitCost, qtyOrdered: l.packsOrdered * l.packQty })))
  if (!orderTotalFits(total)) {
    throw AppError.badRequest('order_total_too_large', tooLarge(total), { params: { total, max: MAX_ORDER_TOTAL }, fields: { lines: problem('order_total_at_most', { max: MAX_ORDER_TOTAL }) } })
  }
  const vendor = await em.findOneBy(Vendor, { id: head.vendorId })
  if (!vendor) throw AppError.badRequest('vendor_not_found', 'Choose a vendor.', { fields: { vendorId: problem('vendor_not_found') } })
  if (!vendor.active) throw AppError.conflict('vendor_inactive', `${vendor.name} is not an active vendor.`, { params: { vendor: vendor.name } })
  const warehouse = await em.findOneBy(Warehouse, { id: head.warehouseId })
  if (!warehouse || !warehouse.active) throw AppError.badRequest('ship_warehouse_needed', 'Choose the warehouse to ship to.', { fields: { warehouseId: problem('ship_warehouse_needed') } })
  const po = em.create(PurchaseOrder, {
    number: await nextPoNumber(em),
    vendorId: vendor.id,
    warehouseId: head.warehouseId,
    jobId: head.jobId ?? null,
    status: 'draft',
    currency: vendor.currency,
    expectedDate: head.expectedDate ?? null,
    notes: head.notes ?? null,
    total,
    createdBy: actor.userId,
  })
  await em.save(po)
  const saved = await em.save(
    lines.map((l, i) =>
      em.create(PurchaseOrderLine, {
        ...l,
        poId: po.id,
        lineNo: i + 1,
        qtyOrdered: l.packsOrdered * l.packQty,
        qtyReceived: 0,
        qtyDamaged: 0,
        bomLineId: l.bomLineId ?? null,
        specJson: l.specJson ?? null,
      }),
    ),
  )
  await audit(em, actor, 'po.create', 'purchase_order', po.id, { number: po.number, source, lines: lines.length })
  return { po, lineIds: saved.map((l) => l.id) }
}

/**
 * New lines for a vendor and ship-to (and job) join the draft already open for them instead of starting a
 * second order: a stock line for an item already on the draft adds its packs to that line; special-order
 * lines always come as lines of their own. The vendor row is locked first, so two requests wanting a
 * draft for the same vendor take turns and the second joins the first's. Null when no draft is open.
 */
export async function addToOpenDraft(em: EntityManager, actor: AuditActor, head: NewPo, lines: NewPoLine[], source: string) {
  await em.query('SELECT id FROM vendors WHERE id = ? FOR UPDATE', [head.vendorId])
  // A locking read: it sees the draft another transaction committed while this one waited for the vendor
  // row, which a plain read under REPEATABLE READ (snapshot taken at this transaction's first read) would not.
  const [open]: { id: number }[] = await em.query(
    `SELECT id FROM purchase_orders WHERE status = 'draft' AND vendor_id = ? AND warehouse_id = ? AND job_id <=> ? ORDER BY id LIMIT 1 FOR UPDATE`,
    [head.vendorId, head.warehouseId, head.jobId ?? null],
  )
  if (!open) return null
  const po = await lockPo(em, open.id)
  const current = await em.findBy(PurchaseOrderLine, { poId: po.id })
  let lineNo = Math.max(0, ...current.map((l) => l.lineNo))
  const lineIds: number[] = []
  for (const l of lines) {
    const same = l.bomLineId ? undefined : current.find((c) => c.itemId === l.itemId && c.bomLineId === null && c.packQty === l.packQty)
    if (same) {
      same.packsOrdered += l.packsOrdered
      same.qtyOrdered = same.packsOrdered * same.packQty
      checkLineSizes([same])
      await em.update(PurchaseOrderLine, { id: same.id }, { packsOrdered: same.packsOrdered, qtyOrdered: same.qtyOrdered })
      lineIds.push(same.id)
    } else {
      const saved = await em.save(em.create(PurchaseOrderLine, {
        ...l, poId: po.id, lineNo: ++lineNo, qtyOrdered: l.packsOrdered * l.packQty, qtyReceived: 0, qtyDamaged: 0,
        bomLineId: l.bomLineId ?? null, specJson: l.specJson ?? null,
      }))
      current.push(saved)
      lineIds.push(saved.id)
    }
  }
  await recomputeTotal(em, po.id)
  await audit(em, actor, 'po.lines_joined', 'purchase_order', po.id, { number: po.number, source, lines: lines.length })
  return { po, lineIds }
}

export async function loadItems(em: EntityManager, ids: number[]): Promise<Map<number, Item>> {
  const items = ids.length ? await em.findBy(Item, { id: In([...new Set(ids)]) }) : []
  return new Map(items.map((i) => [i.id, i]))
}

export async function vendorItemsFor(em: EntityManager, vendorId: number, itemIds: number[]): Promise<Map<number, VendorItem>> {
  const rows = itemIds.length ? await em.findBy(VendorItem, { vendorId, itemId: In([...new Set(itemIds)]) }) : []
  return new Map(rows.map((r) => [r.itemId, r]))
}

/** Each item's preferred vendor (or its only one). */
export async function preferredVendors(em: EntityManager, itemIds: number[]): Promise<Map<number, VendorItem>> {
  const rows = itemIds.length
    ? await em.find(VendorItem, { where: { itemId: In([...new Set(itemIds)]) }, order: { preferred: 'DESC', unitCost: 'ASC', id: 'ASC' } })
    : []
  const map = new Map<number, VendorItem>()
  for (const r of rows) if (!map.has(r.itemId)) map.set(r.itemId, r)
  return map
}

/** Lead time for a set of vendor items: the longest, falling back to the vendor's default. */
export function leadDays(vendor: Vendor, vendorItems: (VendorItem | undefined)[]): number {
  return Math.max(0, ...vendorItems.map((vi) => vi?.leadTimeDays ?? vendor.leadTimeDays), vendorItems.length ? 0 : vendor.leadTimeDays)
}
