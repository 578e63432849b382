// The admin's selling terms: price levels, item price rules (quantity breaks, case prices), the sales tax
// rate of each warehouse location, and each account's level and tax-exemption certificate. Every change
// is audited in its own transaction.
import type { DataSource, EntityManager } from 'typeorm'
import type {
  CustomerTermsInput,
  CustomerTermsSummary,
  PriceLevelInput,
  PriceLevelSummary,
  PriceLevelUpdateInput,
  PriceRuleInput,
  PriceRuleSummary,
  TaxRateInput,
  TaxRateSummary,
} from '../../../shared/schemas/pricing.js'
import { Customer } from '../../entities/Customer.js'
import { Item } from '../../entities/Item.js'
import { CustomerTerms, PriceLevel, PriceRuleRow, SalesTaxRate } from '../../entities/Pricing.js'
import { Warehouse } from '../../entities/Warehouse.js'
import { inTransaction, isDuplicateKey } from '../../db/transaction.js'
import { SqlWhere } from '../../db/sqlWhere.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { lockAtVersion } from '../editVersion.js'

const levelNotFound = () => AppError.notFound('price_level_not_found', 'That price level was not found.')
const levelTaken = () => AppError.conflict('price_level_code_taken', 'Another price level uses that code.', { fields: { code: problem('price_level_code_taken') } })

export async function listPriceLevels(ds: DataSource): Promise<PriceLevelSummary[]> {
  const rows: Record<string, string | number | null>[] = await ds.query(
    `SELECT l.id, l.code, l.name, l.percent_off AS percentOff, l.active, l.version,
            (SELECT COUNT(*) FROM customer_terms t WHERE t.price_level_id = l.id) AS accounts,
            (SELECT COUNT(*) FROM price_rules r WHERE r.level_id = l.id) AS rules
       FROM price_levels l ORDER BY l.active DESC, l.code`,
  )
  return rows.map((r) => ({
    id: Number(r.id),
    code: String(r.code),
    name: String(r.name),
    percentOff: r.percentOff === null ? null : String(r.percentOff),
    active: Number(r.active) === 1,
    accounts: Number(r.accounts),
    rules: Number(r.rules),
    version: Number(r.version),
  }))
}

async function levelSummary(ds: DataSource, id: number): Promise<PriceLevelSummary> {
  const found = (await listPriceLevels(ds)).find((l) => l.id === id)
  if (!found) throw levelNotFound()
  return found
}

export async function createPriceLevel(ds: DataSource, actor: AuditActor, input: PriceLevelInput): Promise<PriceLevelSummary> {
  try {
    const id = await inTransaction(ds, async (em) => {
      const level = await em.save(em.create(PriceLevel, input))
      await audit(em, actor, 'price_level.create', 'price_level', level.id, input)
      return level.id
    })
    return levelSummary(ds, id)
  } catch (err) {
    if (isDuplicateKey(err)) throw levelTaken()
    throw err
  }
}

export async function updatePriceLevel(ds: DataSource, actor: AuditActor, id: number, { version, ...input }: PriceLevelUpdateInput): Promise<PriceLevelSummary> {
  try {
    await inTransaction(ds, async (em) => {
      const level = await lockAtVersion(em, PriceLevel, id, version, { notFound: levelNotFound, name: (row) => row.code })
      const before = { code: level.code, name: level.name, percentOff: level.percentOff, active: level.active }
      await em.update(PriceLevel, { id }, input)
      await audit(em, actor, 'price_level.update', 'price_level', id, { before, after: input })
    })
  } catch (err) {
    if (isDuplicateKey(err)) throw levelTaken()
    throw err
  }
  return levelSummary(ds, id)
}

/** Removes a level no account uses (its rules go with it); a level in use is refused with the count. */
export async function deletePriceLevel(ds: DataSource, actor: AuditActor, id: number): Promise<{ ok: true }> {
  await inTransaction(ds, async (em) => {
    const level = await em.findOne(PriceLevel, { where: { id }, lock: { mode: 'pessimistic_write' } })
    if (!level) throw levelNotFound()
    const accounts = await em.countBy(CustomerTerms, { priceLevelId: id })
    if (accounts > 0) {
      throw AppError.conflict('price_level_in_use', `${accounts} accounts use price level ${level.code}.`, { params: { accounts } })
    }
    await em.delete(PriceLevel, { id })
    await audit(em, actor, 'price_level.delete', 'price_level', id, { code: level.code })
  })
  return { ok: true }
}

export async function listPriceRules(ds: DataSource, query: { levelId?: number | 'all'; itemId?: number }): Promise<PriceRuleSummary[]> {
  const where = new SqlWhere()
  if (query.levelId === 'all') where.add('r.level_id IS NULL')
  else if (query.levelId !== undefined) where.add('r.level_id = ?', [query.levelId])
  if (query.itemId !== undefined) where.add('r.item_id = ?', [query.itemId])
  const rows: Record<string, string | number | null>[] = await ds.query(
    `SELECT r.id, r.level_id AS levelId, l.code AS levelCode, r.item_id AS itemId, i.sku, i.name AS itemName,
            i.list_price AS listPrice, COALESCE(i.case_qty, 1) AS packSize, i.sell_by_pack AS sellByPack,
            r.min_qty AS minQty, r.basis, r.price, r.percent_off AS percentOff
       FROM price_rules r JOIN items i ON i.id = r.item_id LEFT JOIN price_levels l ON l.id = r.level_id
      ${where.sql()}
      ORDER BY i.sku, l.code, r.basis, r.min_qty
      LIMIT 2000`,
    where.params,
  )
  return rows.map((r) => ({
    id: Number(r.id),
    levelId: r.levelId === null ? null : Number(r.levelId),
    levelCode: r.levelCode === null ? null : String(r.levelCode),
    itemId: Number(r.itemId),
    sku: String(r.sku),
    itemName: String(r.itemName),
    listPrice: String(r.listPrice),
    packSize: Number(r.packSize),
    sellByPack: Number(r.sellByPack) === 1,
    minQty: Number(r.minQty),
    basis: r.basis === 'pack' ? 'pack' : 'unit',
    price: r.price === null ? null : String(r.price),
    percentOff: r.percentOff === null ? null : String(r.percentOff),
  }))
}

export async function createPriceRule(ds: DataSource, actor: AuditActor & { userId: number }, input: PriceRuleInput): Promise<PriceRuleSummary> {
  let id: number
  try {
    id = await inTransaction(ds, async (em) => {
      const item = await em.findOneBy(Item, { id: input.itemId })
      if (!item) throw AppError.badRequest('item_not_found', 'That item does not exist.', { fields: { itemId: problem('item_not_found') } })
      if (input.levelId !== null && !(await em.existsBy(PriceLevel, { id: input.levelId }))) {
        throw AppError.badRequest('price_level_not_found', 'That price level does not exist.', { fields: { levelId: problem('price_level_not_found') } })
      }
      if (input.basis === 'pack' && !(item.sellByPack && (item.caseQty ?? 1) > 1)) {
        throw AppError.badRequest('pack_rule_needs_case', `${item.sku} is not sold by the case only.`, { fields: { basis: problem('pack_rule_needs_case') } })
      }
      const rule = await em.save(em.create(PriceRuleRow, { ...input, createdBy: actor.userId }))
      await audit(em, actor, 'price_rule.create', 'price_rule', rule.id, { ...input, sku: item.sku })
      return rule.id
    })
  } catch (err) {
    if (isDuplicateKey(err)) throw AppError.conflict('price_rule_taken', 'That item already has a price for this level, quantity and basis.', { fields: { minQty: problem('price_rule_taken') } })
    throw err
  }
  const [rule] = (await listPriceRules(ds, {})).filter((r) => r.id === id)
  return rule
}

export async function deletePriceRule(ds: DataSource, actor: AuditActor, id: number): Promise<{ ok: true }> {
  await inTransaction(ds, async (em) => {
    const rule = await em.findOne(PriceRuleRow, { where: { id }, lock: { mode: 'pessimistic_write' } })
    if (!rule) throw AppError.notFound('price_rule_not_found', 'That price rule is no longer there (removed meanwhile); nothing was removed.')
    await em.delete(PriceRuleRow, { id })
    await audit(em, actor, 'price_rule.delete', 'price_rule', id, { levelId: rule.levelId, itemId: rule.itemId, minQty: rule.minQty, basis: rule.basis, price: rule.price, percentOff: rule.percentOff })
  })
  return { ok: true }
}

export async function listTaxRates(ds: DataSource): Promise<TaxRateSummary[]> {
  const rows: Record<string, string | number | null>[] = await ds.query(
    `SELECT w.id AS warehouseId, w.code AS warehouseCode, w.name AS warehouseName, t.rate_percent AS ratePercent, t.label
       FROM warehouses w LEFT JOIN sales_tax_rates t ON t.warehouse_id = w.id
      WHERE w.active = 1 ORDER BY w.code`,
  )
  return rows.map((r) => ({
    warehouseId: Number(r.warehouseId),
    warehouseCode: String(r.warehouseCode),
    warehouseName: String(r.warehouseName),
    ratePercent: r.ratePercent === null ? null : String(r.ratePercent),
    label: r.label === null ? null : String(r.label),
  }))
}

export async function setTaxRate(ds: DataSource, actor: AuditActor & { userId: number }, warehouseId: number, input: TaxRateInput): Promise<TaxRateSummary[]> {
  await inTransaction(ds, async (em) => {
    if (!(await em.existsBy(Warehouse, { id: warehouseId }))) throw AppError.notFound('warehouse_not_found', 'That warehouse does not exist.')
    const before = await em.findOne(SalesTaxRate, { where: { warehouseId }, lock: { mode: 'pessimistic_write' } })
    await em.upsert(SalesTaxRate, { warehouseId, ratePercent: input.ratePercent, label: input.label, updatedBy: actor.userId }, ['warehouseId'])
    await audit(em, actor, 'sales_tax.set', 'warehouse', warehouseId, { before: before?.ratePercent ?? null, after: input.ratePercent, label: input.label })
  })
  return listTaxRates(ds)
}

const termsSql = `SELECT c.id AS customerId, c.code, c.name, t.price_level_id AS priceLevelId, l.code AS priceLevelCode,
       t.exempt_certificate AS exemptCertificate, DATE_FORMAT(t.exempt_until, '%Y-%m-%d') AS exemptUntil
  FROM customers c LEFT JOIN customer_terms t ON t.customer_id = c.id LEFT JOIN price_levels l ON l.id = t.price_level_id`

function toTerms(r: Record<string, string | number | null>): CustomerTermsSummary {
  return {
    customerId: Number(r.customerId),
    code: String(r.code),
    name: String(r.name),
    priceLevelId: r.priceLevelId === null ? null : Number(r.priceLevelId),
    priceLevelCode: r.priceLevelCode === null ? null : String(r.priceLevelCode),
    exemptCertificate: r.exemptCertificate === null ? null : String(r.exemptCertificate),
    exemptUntil: r.exemptUntil === null ? null : String(r.exemptUntil),
  }
}

/** Accounts with a level or an exemption (the admin's list); every active account when `all`. */
export async function listCustomerTerms(ds: DataSource, all: boolean): Promise<CustomerTermsSummary[]> {
  const where = new SqlWhere().add(all ? 'c.active = 1' : '(t.price_level_id IS NOT NULL OR t.exempt_certificate IS NOT NULL)')
  return (await ds.query(`${termsSql} ${where.sql()} ORDER BY c.name LIMIT 2000`, where.params)).map(toTerms)
}

export async function customerTerms(db: DataSource | EntityManager, customerId: number): Promise<CustomerTermsSummary> {
  const [row] = await db.query(`${termsSql} WHERE c.id = ?`, [customerId])
  if (!row) throw AppError.notFound('customer_not_found', 'That account was not found.')
  return toTerms(row)
}

export async function setCustomerTerms(ds: DataSource, actor: AuditActor & { userId: number }, customerId: number, input: CustomerTermsInput): Promise<CustomerTermsSummary> {
  await inTransaction(ds, async (em) => {
    const customer = await em.findOne(Customer, { where: { id: customerId }, lock: { mode: 'pessimistic_write' } })
    if (!customer) throw AppError.notFound('customer_not_found', 'That account was not found.')
    if (input.priceLevelId !== null && !(await em.existsBy(PriceLevel, { id: input.priceLevelId }))) {
      throw AppError.badRequest('price_level_not_found', 'That price level does not exist.', { fields: { priceLevelId: problem('price_level_not_found') } })
    }
    const before = await customerTerms(em, customerId)
    await em.upsert(CustomerTerms, { customerId, ...input, updatedBy: actor.userId }, ['customerId'])
    await audit(em, actor, 'customer.terms', 'customer', customerId, {
      before: { priceLevelId: before.priceLevelId, exemptCertificate: before.exemptCertificate, exemptUntil: before.exemptUntil },
      after: input,
    })
  })
  return customerTerms(ds, customerId)
}
