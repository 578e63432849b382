// "How much?": prices items for an account at a warehouse from the account's level, the items' price rules
// and the location's tax rate (shared/pricing/ does the arithmetic). Quotes price their lines through here.
import { In, type DataSource, type EntityManager } from 'typeorm'
import { addMoney } from '../../../shared/money.js'
import { documentTax } from '../../../shared/pricing/salesTax.js'
import { resolvePrice, type PriceOverride, type PriceRule } from '../../../shared/pricing/sellingPrice.js'
import type { PriceEstimate, PriceEstimateInput, PricedLine } from '../../../shared/schemas/pricing.js'
import { Item } from '../../entities/Item.js'
import { PriceLevel, PriceRuleRow, SalesTaxRate } from '../../entities/Pricing.js'
import { Warehouse } from '../../entities/Warehouse.js'
import { AppError, problem } from '../../errors.js'
import { customerTerms } from './priceSetup.js'

export interface LineToPrice {
  itemId: number
  qty: number
  override?: PriceOverride | null
}

/** Today as a calendar day (UTC) when the caller gives none. */
export const todayIso = () => new Date().toISOString().slice(0, 10)

export async function priceLines(
  db: DataSource | EntityManager,
  input: { customerId: number | null; warehouseId: number; onDay?: string; lines: readonly LineToPrice[] },
): Promise<PriceEstimate> {
  const onDay = input.onDay ?? todayIso()
  if (!(await db.getRepository(Warehouse).existsBy({ id: input.warehouseId }))) {
    throw AppError.badRequest('warehouse_not_found', 'That warehouse does not exist.', { fields: { warehouseId: problem('warehouse_not_found') } })
  }
  const terms = input.customerId === null ? null : await customerTerms(db, input.customerId)
  const level = terms?.priceLevelId ? await db.getRepository(PriceLevel).findOneBy({ id: terms.priceLevelId }) : null
  const itemIds = [...new Set(input.lines.map((l) => l.itemId))]
  const items = new Map((await db.getRepository(Item).findBy({ id: In(itemIds) })).map((i) => [i.id, i]))
  const missing = input.lines.findIndex((l) => !items.has(l.itemId))
  if (missing >= 0) {
    throw AppError.badRequest('item_not_found', 'An item on the list does not exist.', { fields: { [`lines.${missing}.itemId`]: problem('item_not_found') } })
  }
  const rules = await db.getRepository(PriceRuleRow).findBy({ itemId: In(itemIds) })
  const rulesOf = new Map<number, PriceRule[]>()
  for (const r of rules) {
    const list = rulesOf.get(r.itemId) ?? []
    list.push({ id: r.id, levelId: r.levelId, minQty: r.minQty, basis: r.basis, price: r.price, percentOff: r.percentOff })
    rulesOf.set(r.itemId, list)
  }
  const levelTerms = level && level.active ? { id: level.id, code: level.code, percentOff: level.percentOff } : null

  const lines: PricedLine[] = input.lines.map((l) => {
    const item = items.get(l.itemId)!
    const priced = resolvePrice({
      item: { listPrice: item.listPrice, packSize: item.caseQty ?? 1, sellByPack: item.sellByPack },
      qty: l.qty,
      level: levelTerms,
      rules: rulesOf.get(l.itemId) ?? [],
      override: l.override ?? null,
    })
    return { itemId: item.id, sku: item.sku, name: item.name, askedQty: l.qty, ...priced }
  })
  const rate = await db.getRepository(SalesTaxRate).findOneBy({ warehouseId: input.warehouseId })
  const exemption = terms?.exemptCertificate && terms.exemptUntil ? { certificate: terms.exemptCertificate, validUntil: terms.exemptUntil } : null
  const tax = documentTax(lines.map((l) => l.extension), rate?.ratePercent ?? null, exemption, onDay)
  const subtotal = tax.taxable
  return {
    customerId: input.customerId,
    warehouseId: input.warehouseId,
    onDay,
    priceLevelCode: levelTerms?.code ?? null,
    lines,
    subtotal,
    tax,
    amountDue: addMoney(subtotal, tax.tax),
  }
}

export const estimatePrices = (ds: DataSource, input: PriceEstimateInput) => priceLines(ds, input)
