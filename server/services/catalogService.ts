// Catalog items: create, change and deactivate (admin), each written with its audit entry in one
// transaction. Reads live in catalogQueries.ts.
import type { DataSource, EntityManager } from 'typeorm'
import type { BlockShape } from '../../shared/catalog.js'
import { itemSchema, type ItemInput, type ItemPatch, type ItemRecord } from '../../shared/schemas/catalog.js'
import { inTransaction, isDuplicateKey } from '../db/transaction.js'
import { Item } from '../entities/Item.js'
import { AppError, problem } from '../errors.js'
import { audit, type AuditActor } from './auditService.js'
import { lockAtVersion } from './editVersion.js'

export function toItemRecord(i: Item): ItemRecord {
  return {
    id: i.id, sku: i.sku, name: i.name, family: i.family, stockUnit: i.stockUnit, caseQty: i.caseQty, palletQty: i.palletQty,
    sellByPack: i.sellByPack, gtin: i.gtin, weightKg: i.weightKg, cost: i.cost, listPrice: i.listPrice, active: i.active,
    madeToOrder: i.madeToOrder, matchLot: i.matchLot, nominalSize: i.nominalSize, faceWidthMm: i.faceWidthMm,
    faceHeightMm: i.faceHeightMm, depthMm: i.depthMm, thicknessClass: i.thicknessClass, pattern: i.pattern, shape: i.shape as BlockShape | null,
    cartridgeMl: i.cartridgeMl, groutYieldMl: i.groutYieldMl, jointMm: i.jointMm, description: i.description,
    createdAt: i.createdAt.toISOString(), updatedAt: i.updatedAt.toISOString(), version: i.version,
  }
}

/** Column values for an insert or update, with the defaults the table would give. */
export function itemColumns(input: ItemInput): Partial<Item> {
  return {
    ...input,
    caseQty: input.caseQty ?? null,
    palletQty: input.palletQty ?? null,
    sellByPack: input.sellByPack ?? false,
    gtin: input.gtin ?? null,
    weightKg: input.weightKg ?? '0',
    active: input.active ?? true,
    madeToOrder: input.madeToOrder ?? false,
    matchLot: input.matchLot ?? false,
  }
}

/** Duplicate SKU or GTIN as a 409 naming the field. */
export function duplicateItemError(err: unknown): AppError | null {
  if (!isDuplicateKey(err)) return null
  const message = String((err as Error).message)
  if (message.includes('uq_items_gtin')) {
    return AppError.conflict('gtin_taken', 'Another item already has that GTIN.', { fields: { gtin: problem('gtin_taken') } })
  }
  return AppError.conflict('sku_taken', 'Another item already has that SKU.', { fields: { sku: problem('sku_taken') } })
}

export async function findItem(em: EntityManager, id: number): Promise<Item> {
  const item = await em.findOne(Item, { where: { id } })
  if (!item) throw AppError.notFound('item_not_found', 'That item was not found.')
  return item
}

/** Locks the item for a change and moves it to its next version; with `seenVersion`, a change saved meanwhile is refused. */
function lockItem(em: EntityManager, id: number, seenVersion?: number): Promise<Item> {
  return lockAtVersion(em, Item, id, seenVersion, {
    notFound: () => AppError.notFound('item_not_found', 'That item was not found.'),
    name: (item) => item.sku,
  })
}

export async function createItem(ds: DataSource, actor: AuditActor, input: ItemInput): Promise<ItemRecord> {
  try {
    return await inTransaction(ds, async (em) => {
      const item = await em.save(em.create(Item, itemColumns(input)))
      await audit(em, actor, 'item.create', 'item', item.id, { sku: item.sku, name: item.name })
      return toItemRecord(await findItem(em, item.id))
    })
  } catch (err) {
    throw duplicateItemError(err) ?? err
  }
}

/** Applies a change and checks the whole resulting item again, so no patch can leave it inconsistent. */
export async function updateItem(ds: DataSource, actor: AuditActor, id: number, { version, ...patch }: ItemPatch): Promise<ItemRecord> {
  try {
    return await inTransaction(ds, async (em) => {
      const item = await lockItem(em, id, version)
      const merged = itemSchema.safeParse({ ...toItemRecord(item), ...patch })
      if (!merged.success) throw AppError.fromZod(merged.error)
      const before = toItemRecord(item)
      const changed = Object.fromEntries(
        Object.entries(itemColumns(merged.data)).filter(([k, v]) => (before as Record<string, unknown>)[k] !== v),
      )
      if (Object.keys(changed).length === 0) return { ...before, version: item.version }
      await em.update(Item, { id }, changed)
      await audit(em, actor, 'item.update', 'item', id, {
        sku: item.sku,
        changes: Object.fromEntries(Object.keys(changed).map((k) => [k, { from: (before as Record<string, unknown>)[k], to: changed[k] }])),
      })
      return toItemRecord(await findItem(em, id))
    })
  } catch (err) {
    throw duplicateItemError(err) ?? err
  }
}

/** Takes an item out of use. Stock held for pick lists must be released first; stock on hand stays visible. */
export async function deactivateItem(ds: DataSource, actor: AuditActor, id: number): Promise<ItemRecord> {
  return inTransaction(ds, async (em) => {
    const item = await lockItem(em, id)
    const [stock] = await em.query(
      'SELECT COALESCE(SUM(on_hand), 0) AS onHand, COALESCE(SUM(reserved), 0) AS reserved FROM stock_balances WHERE item_id = ?',
      [id],
    )
    if (Number(stock.reserved) > 0) {
      throw AppError.conflict('item_reserved', `${Number(stock.reserved)} of ${item.sku} are held for pick lists; release them before deactivating.`, { params: { reserved: Number(stock.reserved), sku: item.sku } })
    }
    if (!item.active) return toItemRecord(item)
    await em.update(Item, { id }, { active: false })
    await audit(em, actor, 'item.deactivate', 'item', id, { sku: item.sku, onHand: Number(stock.onHand) })
    return toItemRecord(await findItem(em, id))
  })
}
