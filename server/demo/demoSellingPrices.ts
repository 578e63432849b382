// Demo step "selling prices": how Brightcourse prices at the counter. Walk-in and small accounts pay list;
// regular contractors a level off list; the volume account a deeper level with a break on the clear block it
// buys by the pallet. Each yard charges its town's sales tax, and one account buys for resale on a
// certificate. Invented rates and certificate for the demo only. Made through the pricing services, so the
// audit trail shows who set them; loaded once (the level codes are the marker).
import type { DataSource, EntityManager } from 'typeorm'
import { Customer } from '../entities/Customer.js'
import { Item } from '../entities/Item.js'
import { PriceLevel } from '../entities/Pricing.js'
import { User } from '../entities/User.js'
import { Warehouse } from '../entities/Warehouse.js'
import { createPriceLevel, createPriceRule, setCustomerTerms, setTaxRate } from '../services/pricing/priceSetup.js'

const LEVELS = [
  { code: 'CONTRACTOR', name: 'Contractor', percentOff: '10.00' },
  { code: 'VOLUME', name: 'Volume', percentOff: '15.00' },
]

/** The volume level's break: the clear 8×8 block at a fixed price from a pallet-sized order up. */
const BREAKS = [{ level: 'VOLUME', sku: 'GB-0808-CL-SQ', minQty: 200, price: '11.95' }]

const TAX = [
  { warehouse: 'HRY', ratePercent: '7.25', label: 'Port Alder sales tax' },
  { warehouse: 'MBS', ratePercent: '7.25', label: 'Port Alder sales tax' },
  { warehouse: 'EKD', ratePercent: '6.5', label: 'Easton Ridge sales tax' },
]

const TERMS: { customer: string; level: string | null; resaleCertificate?: string }[] = [
  { customer: 'COPPERLINE', level: 'CONTRACTOR' },
  { customer: 'BROOKMOOR', level: 'VOLUME' },
  { customer: 'QUILLFEATHER', level: 'CONTRACTOR', resaleCertificate: 'RS-204117' },
]

export async function loadDemoSellingPrices(em: EntityManager, ds: DataSource): Promise<void> {
  if (await em.existsBy(PriceLevel, { code: LEVELS[0].code })) return
  const admin = await em.findOneByOrFail(User, { username: 'admin' })
  const actor = { userId: admin.id }
  // Services open their own transactions: this step's own transaction writes nothing.
  const levels = new Map<string, number>()
  for (const l of LEVELS) levels.set(l.code, (await createPriceLevel(ds, actor, { ...l, active: true })).id)
  for (const b of BREAKS) {
    const item = await em.findOneBy(Item, { sku: b.sku })
    if (item) await createPriceRule(ds, actor, { levelId: levels.get(b.level)!, itemId: item.id, minQty: b.minQty, basis: 'unit', price: b.price, percentOff: null })
  }
  for (const t of TAX) {
    const warehouse = await em.findOneBy(Warehouse, { code: t.warehouse })
    if (warehouse) await setTaxRate(ds, actor, warehouse.id, { ratePercent: t.ratePercent, label: t.label })
  }
  // A resale certificate runs to the end of next year.
  const until = `${new Date().getFullYear() + 1}-12-31`
  for (const t of TERMS) {
    const customer = await em.findOneBy(Customer, { code: t.customer })
    if (!customer) continue
    await setCustomerTerms(ds, actor, customer.id, {
      priceLevelId: t.level ? levels.get(t.level)! : null,
      exemptCertificate: t.resaleCertificate ?? null,
      exemptUntil: t.resaleCertificate ? until : null,
    })
  }
}
