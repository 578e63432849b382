// Demo step "purchasing": a few purchase orders of the invented supplier in different states (a
// draft, an approved one and one sent to the vendor), so the buyer and the warehouse have something
// to open. Skipped when there are orders already or the catalog's vendors are missing.
import type { EntityManager } from 'typeorm'
import { PurchaseOrder } from '../entities/PurchaseOrder.js'
import { User } from '../entities/User.js'
import { Vendor, VendorItem } from '../entities/Vendor.js'
import { Warehouse } from '../entities/Warehouse.js'
import { packsFor } from '../../shared/purchasing/poMoney.js'
import { addDays, insertPo, loadItems } from '../services/purchasing/poWrite.js'

const PLAN: { vendor: string; warehouse: string; status: 'draft' | 'approved' | 'sent'; daysAgo: number; lines: number; wanted: number }[] = [
  { vendor: 'LARK', warehouse: 'HRY', status: 'sent', daysAgo: 9, lines: 3, wanted: 400 },
  { vendor: 'NGMS', warehouse: 'HRY', status: 'approved', daysAgo: 2, lines: 2, wanted: 60 },
  { vendor: 'PELL', warehouse: 'MBS', status: 'draft', daysAgo: 0, lines: 2, wanted: 30 },
]

/** The invented supplier's own profile, printed on its purchase orders (kept if an admin already filled it in). */
async function demoCompanyProfile(em: EntityManager): Promise<void> {
  await em.query(
    `INSERT IGNORE INTO company_profile (id, legal_name, bill_to_address, ship_to_address, phone, email, reply_to, document_unit)
     VALUES (1, 'Brightcourse Glass Supply', 'Accounts payable\n2140 Harbor Road\nPort Alder', NULL, '555-0142', 'office@brightcourse.example',
             'buying@brightcourse.example', 'in')`,
  )
}

export async function loadDemoPurchasing(em: EntityManager): Promise<void> {
  await demoCompanyProfile(em)
  if ((await em.count(PurchaseOrder)) > 0) return
  const buyer = await em.findOneBy(User, { username: 'buyer' })
  const actor = { userId: buyer?.id ?? null }
  for (const p of PLAN) {
    const vendor = await em.findOneBy(Vendor, { code: p.vendor })
    const warehouse = await em.findOneBy(Warehouse, { code: p.warehouse })
    if (!vendor || !warehouse) continue
    const sold = await em.find(VendorItem, { where: { vendorId: vendor.id }, order: { id: 'ASC' }, take: p.lines })
    if (!sold.length) continue
    const items = await loadItems(em, sold.map((s) => s.itemId))
    const lines = sold.map((vi) => ({
      itemId: vi.itemId, vendorSku: vi.vendorSku, description: items.get(vi.itemId)?.name ?? vi.vendorSku, packQty: vi.packQty,
      packsOrdered: packsFor(p.wanted, vi.packQty, vi.minOrderQty), unitCost: vi.unitCost,
    }))
    const placed = new Date(Date.now() - p.daysAgo * 86_400_000)
    const head = { vendorId: vendor.id, warehouseId: warehouse.id, expectedDate: addDays(vendor.leadTimeDays, placed), notes: null }
    const { po } = await insertPo(em, actor, head, lines, 'demo')
    const stamps: Partial<PurchaseOrder> = { status: p.status, createdAt: placed }
    if (p.status !== 'draft') Object.assign(stamps, { approvedBy: actor.userId, approvedAt: placed })
    if (p.status === 'sent') Object.assign(stamps, { sentBy: actor.userId, sentAt: placed })
    await em.update(PurchaseOrder, { id: po.id }, stamps)
  }
}
