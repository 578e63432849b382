// Vendors and what each sells us (vendor items): contact, terms, currency, lead time; vendor SKU,
// purchase pack, minimum order, cost and which vendor is preferred for an item.
import type { DataSource, EntityManager } from 'typeorm'
import type { VendorCreateInput, VendorItemInput, VendorItemUpdateInput, VendorUpdateInput } from '../../../shared/schemas/purchasing.js'
import type { ItemChoice, VendorItemView, VendorView, WarehouseChoice } from '../../../shared/schemas/purchasingViews.js'
import { Item } from '../../entities/Item.js'
import { Vendor, VendorItem } from '../../entities/Vendor.js'
import { inTransaction, isDuplicateKey } from '../../db/transaction.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { lockAtVersion } from '../editVersion.js'
import { containsPattern } from '../../db/likePattern.js'

function vendorView(v: Vendor, itemCount: number): VendorView {
  return {
    id: v.id, code: v.code, name: v.name, contactName: v.contactName, email: v.email, phone: v.phone, address: v.address,
    terms: v.terms, currency: v.currency, leadTimeDays: v.leadTimeDays, active: v.active, itemCount, version: v.version,
  }
}

export async function listVendors(ds: DataSource): Promise<VendorView[]> {
  const vendors = await ds.getRepository(Vendor).find({ order: { name: 'ASC' } })
  const counts: { vendor_id: number; n: string }[] = await ds.query('SELECT vendor_id, COUNT(*) AS n FROM vendor_items GROUP BY vendor_id')
  const byVendor = new Map(counts.map((c) => [c.vendor_id, Number(c.n)]))
  return vendors.map((v) => vendorView(v, byVendor.get(v.id) ?? 0))
}

export async function findVendor(em: EntityManager | DataSource, id: number): Promise<Vendor> {
  const vendor = await em.getRepository(Vendor).findOneBy({ id })
  if (!vendor) throw AppError.notFound('vendor_not_found', 'That vendor was not found.')
  return vendor
}

export async function getVendor(ds: DataSource, id: number): Promise<VendorView> {
  const vendor = await findVendor(ds, id)
  return vendorView(vendor, await ds.getRepository(VendorItem).countBy({ vendorId: id }))
}

const duplicateCode = () => AppError.conflict('vendor_code_taken', 'Another vendor has that code.', { fields: { code: problem('vendor_code_taken') } })

export async function createVendor(ds: DataSource, actor: AuditActor, input: VendorCreateInput): Promise<VendorView> {
  try {
    return await inTransaction(ds, async (em) => {
      const vendor = em.create(Vendor, { ...input })
      await em.save(vendor)
      await audit(em, actor, 'vendor.create', 'vendor', vendor.id, input)
      return vendorView(vendor, 0)
    })
  } catch (err) {
    if (isDuplicateKey(err)) throw duplicateCode()
    throw err
  }
}

export async function updateVendor(ds: DataSource, actor: AuditActor, id: number, { version, ...input }: VendorUpdateInput): Promise<VendorView> {
  try {
    await inTransaction(ds, async (em) => {
      const vendor = await lockAtVersion(em, Vendor, id, version, {
        notFound: () => AppError.notFound('vendor_not_found', 'That vendor was not found.'),
        name: (v) => v.name,
      })
      Object.assign(vendor, input)
      await em.save(vendor)
      await audit(em, actor, 'vendor.update', 'vendor', id, input)
    })
  } catch (err) {
    if (isDuplicateKey(err)) throw duplicateCode()
    throw err
  }
  return getVendor(ds, id)
}

// ---- vendor items ----

interface VendorItemRaw {
  id: number; vendor_id: number; item_id: number; sku: string; item_name: string; stock_unit: string
  vendor_sku: string; pack_qty: number; min_order_qty: number; unit_cost: string; lead_time_days: number | null; preferred: number | boolean
  version: number
}

const VENDOR_ITEM_SQL = 'SELECT vi.*, i.sku, i.name AS item_name, i.stock_unit FROM vendor_items vi JOIN items i ON i.id = vi.item_id'

function vendorItemView(r: VendorItemRaw): VendorItemView {
  return {
    id: r.id, vendorId: r.vendor_id, itemId: r.item_id, sku: r.sku, itemName: r.item_name, stockUnit: r.stock_unit,
    vendorSku: r.vendor_sku, packQty: r.pack_qty, minOrderQty: r.min_order_qty, unitCost: r.unit_cost,
    leadTimeDays: r.lead_time_days, preferred: Boolean(Number(r.preferred)), version: Number(r.version),
  }
}

export async function listVendorItems(em: EntityManager | DataSource, vendorId: number): Promise<VendorItemView[]> {
  await findVendor(em, vendorId)
  const rows: VendorItemRaw[] = await em.query(`${VENDOR_ITEM_SQL} WHERE vi.vendor_id = ? ORDER BY i.sku`, [vendorId])
  return rows.map(vendorItemView)
}

async function vendorItemById(em: EntityManager, vendorId: number, id: number): Promise<VendorItemView> {
  const [row]: VendorItemRaw[] = await em.query(`${VENDOR_ITEM_SQL} WHERE vi.id = ? AND vi.vendor_id = ?`, [id, vendorId])
  if (!row) throw AppError.notFound('vendor_item_not_found', 'That vendor item was not found.')
  return vendorItemView(row)
}

/** One preferred vendor per item: marking one preferred clears the others (each cleared line moves to its next version). */
async function keepOnePreferred(em: EntityManager, itemId: number, vendorItemId: number): Promise<void> {
  await em.query('UPDATE vendor_items SET preferred = 0, version = version + 1 WHERE item_id = ? AND id <> ? AND preferred = 1', [itemId, vendorItemId])
}

export async function addVendorItem(ds: DataSource, actor: AuditActor, vendorId: number, input: VendorItemInput): Promise<VendorItemView> {
  try {
    return await inTransaction(ds, async (em) => {
      await findVendor(em, vendorId)
      if (!(await em.findOneBy(Item, { id: input.itemId }))) throw AppError.badRequest('item_not_in_catalog', 'Choose an item from the catalog.', { fields: { itemId: problem('item_not_in_catalog') } })
      const vi = em.create(VendorItem, { ...input, vendorId })
      await em.save(vi)
      if (vi.preferred) await keepOnePreferred(em, vi.itemId, vi.id)
      await audit(em, actor, 'vendor_item.create', 'vendor', vendorId, input)
      return vendorItemById(em, vendorId, vi.id)
    })
  } catch (err) {
    if (isDuplicateKey(err)) throw AppError.conflict('vendor_item_exists', 'This vendor already sells that item: edit its line instead.', { fields: { itemId: problem('vendor_item_exists') } })
    throw err
  }
}

export async function updateVendorItem(ds: DataSource, actor: AuditActor, vendorId: number, id: number, { version, ...input }: VendorItemUpdateInput): Promise<VendorItemView> {
  return inTransaction(ds, async (em) => {
    const notFound = () => AppError.notFound('vendor_item_not_found', 'That vendor item was not found.')
    if (!(await em.existsBy(VendorItem, { id, vendorId }))) throw notFound()
    const vi = await lockAtVersion(em, VendorItem, id, version, { notFound, name: (row) => row.vendorSku })
    Object.assign(vi, input)
    await em.save(vi)
    if (vi.preferred) await keepOnePreferred(em, vi.itemId, vi.id)
    await audit(em, actor, 'vendor_item.update', 'vendor', vendorId, { id, ...input })
    return vendorItemById(em, vendorId, id)
  })
}

export async function removeVendorItem(ds: DataSource, actor: AuditActor, vendorId: number, id: number): Promise<void> {
  await inTransaction(ds, async (em) => {
    const res = await em.delete(VendorItem, { id, vendorId })
    if (!res.affected) throw AppError.notFound('vendor_item_not_found', 'That vendor item was not found.')
    await audit(em, actor, 'vendor_item.delete', 'vendor', vendorId, { id })
  })
}

// ---- choices for the purchasing forms ----

export async function itemChoices(ds: DataSource, q: string | undefined): Promise<ItemChoice[]> {
  const like = containsPattern(q ?? '')
  const rows: { id: number; sku: string; name: string; stock_unit: string; made_to_order: number; gtin: string | null }[] = await ds.query(
    'SELECT id, sku, name, stock_unit, made_to_order, gtin FROM items WHERE active = 1 AND (sku LIKE ? OR name LIKE ? OR gtin LIKE ?) ORDER BY sku LIMIT 30',
    [like, like, like],
  )
  return rows.map((r) => ({ id: r.id, sku: r.sku, name: r.name, stockUnit: r.stock_unit, madeToOrder: !!Number(r.made_to_order), gtin: r.gtin }))
}

export async function warehouseChoices(ds: DataSource): Promise<WarehouseChoice[]> {
  return ds.query('SELECT id, code, name FROM warehouses WHERE active = 1 ORDER BY code')
}
