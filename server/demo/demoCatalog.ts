// Demo step "catalog": the invented supplier's items, vendors and vendor items.
import { In, type EntityManager } from 'typeorm'
import { Item } from '../entities/Item.js'
import { Vendor, VendorItem } from '../entities/Vendor.js'
import { demoBlocks } from './demoBlocks.js'
import type { DemoItem } from './demoItemTypes.js'
import { demoSupplies } from './demoSupplies.js'
import { DEMO_VENDORS, demoVendorItems } from './demoVendors.js'

let cached: DemoItem[] | null = null

/** The whole demo catalog, in a fixed order (the same every load). */
export function demoItems(): DemoItem[] {
  cached ??= [...demoBlocks(), ...demoSupplies()]
  return cached
}

export async function loadDemoCatalog(em: EntityManager): Promise<void> {
  const items = demoItems()
  if (await em.existsBy(Item, { sku: items[0].row.sku })) return
  await em.insert(Item, items.map((d) => ({ active: true, madeToOrder: false, matchLot: false, sellByPack: false, ...d.row })))
  await em.insert(Vendor, DEMO_VENDORS.map((v) => ({ currency: 'USD', active: true, ...v })))
  const vendors = await em.findBy(Vendor, { code: In(DEMO_VENDORS.map((v) => v.code!)) })
  const saved = await em.findBy(Item, { sku: In(items.map((d) => d.row.sku)) })
  const vendorId = new Map(vendors.map((v) => [v.code, v.id]))
  const itemId = new Map(saved.map((i) => [i.sku, i.id]))
  await em.insert(
    VendorItem,
    demoVendorItems(items).map((vi) => ({
      vendorId: vendorId.get(vi.vendorCode)!,
      itemId: itemId.get(vi.sku)!,
      vendorSku: vi.vendorSku,
      packQty: vi.packQty,
      minOrderQty: vi.minOrderQty,
      unitCost: vi.unitCost,
      leadTimeDays: vi.leadTimeDays,
      preferred: vi.preferred,
    })),
  )
}
